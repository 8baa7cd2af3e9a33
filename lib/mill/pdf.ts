/**
 * jsPDF set-up shared by the swatch sheet and the mill pack: the paper, the embedded fonts (TTF
 * from `fonts/`), page chrome (header, "print at 100 %" footer, page numbers) and the two scale
 * bars. All lengths in mm, y downwards from the top of the page.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { jsPDF, GState } from 'jspdf';
import type { PdfPathTarget } from '@/lib/knit/render-pdf';
import { paperSizes, type PaperSize } from './pack-data';

export const MM_PER_INCH = 25.4;

const fontFiles = [
  { file: 'inter-regular.ttf', family: 'Inter', style: 'normal' },
  { file: 'inter-semibold.ttf', family: 'Inter', style: 'bold' },
  { file: 'jetbrains-mono-regular.ttf', family: 'Mono', style: 'normal' },
] as const;

let fontCache: { file: string; base64: string }[] | null = null;

function fontData(): { file: string; base64: string }[] {
  if (!fontCache) {
    const dir = path.join(process.cwd(), 'fonts');
    fontCache = fontFiles.map((f) => ({ file: f.file, base64: readFileSync(path.join(dir, f.file)).toString('base64') }));
  }
  return fontCache;
}

export const ink = {
  text: '#1f2428',
  soft: '#5b636a',
  faint: '#8a9197',
  rule: '#c9cdd1',
  accent: '#2f6f62',
  warn: '#9a6a12',
} as const;

/** Printed on every page of every export that carries a true-size drawing. */
export const actualSizeNotice = 'Print at 100 % / actual size. Do not scale to fit: the 5 cm bar must measure 50 mm.';

export interface PdfPage {
  doc: jsPDF;
  paper: PaperSize;
  widthMm: number;
  heightMm: number;
  marginMm: number;
}

/** A new PDF on A4 or US Letter (portrait), with the fonts embedded, compressed streams. */
export function createPdf(paper: PaperSize, meta: { title: string; subject?: string }): PdfPage {
  const size = paperSizes[paper];
  const doc = new jsPDF({ unit: 'mm', format: [size.widthMm, size.heightMm], orientation: 'portrait', compress: true, putOnlyUsedFonts: true });
  for (const [i, f] of fontData().entries()) {
    const spec = fontFiles[i]!;
    doc.addFileToVFS(f.file, f.base64);
    doc.addFont(f.file, spec.family, spec.style, undefined, 'Identity-H');
  }
  doc.setFont('Inter', 'normal');
  doc.setProperties({ title: meta.title, subject: meta.subject ?? '', creator: 'Needlemap' });
  doc.setLineHeightFactor(1.25);
  return { doc, paper, widthMm: size.widthMm, heightMm: size.heightMm, marginMm: 14 };
}

export function font(doc: jsPDF, kind: 'regular' | 'bold' | 'mono', sizePt: number, colour: string = ink.text): void {
  if (kind === 'mono') doc.setFont('Mono', 'normal');
  else doc.setFont('Inter', kind === 'bold' ? 'bold' : 'normal');
  doc.setFontSize(sizePt);
  doc.setTextColor(colour);
}

/** Header line (style, revision) and the actual-size footer; page numbers are written at the end. */
export function pageChrome(p: PdfPage, header: { left: string; right: string; title: string }, trueSize: boolean): void {
  const { doc, widthMm: w, heightMm: h, marginMm: m } = p;
  font(doc, 'bold', 8.5, ink.text);
  doc.text(header.left, m, m - 4);
  font(doc, 'regular', 8.5, ink.soft);
  doc.text(header.right, w - m, m - 4, { align: 'right' });
  doc.setDrawColor(ink.rule);
  doc.setLineWidth(0.2);
  doc.line(m, m - 2.2, w - m, m - 2.2);
  font(doc, 'bold', 14, ink.text);
  doc.text(header.title, m, m + 5);
  doc.line(m, h - m + 2, w - m, h - m + 2);
  font(doc, 'regular', 7.5, trueSize ? ink.text : ink.soft);
  doc.text(trueSize ? actualSizeNotice : 'Print at 100 % / actual size.', m, h - m + 6);
}

/** Writes "Page n of N" on every page (after all pages exist). */
export function pageNumbers(p: PdfPage): number {
  const n = p.doc.getNumberOfPages();
  for (let i = 1; i <= n; i++) {
    p.doc.setPage(i);
    font(p.doc, 'regular', 7.5, ink.soft);
    p.doc.text(`Page ${i} of ${n}`, p.widthMm - p.marginMm, p.heightMm - p.marginMm + 6, { align: 'right' });
  }
  return n;
}

/**
 * A 5 cm bar (ticks every cm, mm ticks on the first cm) and a 2 in bar (ticks every ½ in, ⅛ in on the
 * first inch), each a filled rectangle of exactly that length, labelled. Returns the height used.
 */
export function scaleBars(doc: jsPDF, x: number, y: number): number {
  const barH = 1.6;
  const draw = (y0: number, lengthMm: number, major: number, minor: number, minorUntil: number, label: string, unitLabel: (i: number) => string) => {
    doc.setFillColor(ink.text);
    doc.rect(x, y0, lengthMm, barH, 'F');
    doc.setDrawColor(ink.text);
    doc.setLineWidth(0.15);
    for (let t = 0; t <= lengthMm + 1e-9; t += minor) {
      const isMajor = Math.abs(t / major - Math.round(t / major)) < 1e-6;
      if (!isMajor && t > minorUntil + 1e-9) continue;
      doc.line(x + t, y0 + barH, x + t, y0 + barH + (isMajor ? 1.8 : 0.9));
    }
    font(doc, 'regular', 6.5, ink.soft);
    for (let i = 0; i * major <= lengthMm + 1e-9; i++) {
      const t = unitLabel(i);
      if (t) doc.text(t, x + i * major, y0 + barH + 4.4, { align: 'center' });
    }
    font(doc, 'bold', 7.5, ink.text);
    doc.text(label, x + lengthMm + 3, y0 + barH + 0.2);
  };
  draw(y, 50, 10, 1, 10, '5 cm (50 mm)', (i) => `${i}`);
  draw(y + 8.5, 2 * MM_PER_INCH, MM_PER_INCH / 2, MM_PER_INCH / 8, MM_PER_INCH, '2 in (50.8 mm)', (i) => (i % 2 === 0 ? `${i / 2}` : ''));
  return 16;
}

/** A `PdfPathTarget` over jsPDF's path API, with opacity through cached graphics states. */
export function pdfPathTarget(doc: jsPDF): PdfPathTarget {
  const states = new Map<number, GState>();
  return {
    moveTo: (x, y) => doc.moveTo(x, y),
    lineTo: (x, y) => doc.lineTo(x, y),
    curveTo: (a, b, c, d, e, f) => doc.curveTo(a, b, c, d, e, f),
    close: () => doc.close(),
    stroke: () => doc.stroke(),
    fill: () => doc.fill(),
    setDrawColor: (hex) => doc.setDrawColor(hex),
    setFillColor: (hex) => doc.setFillColor(hex),
    setLineWidth: (w) => doc.setLineWidth(w),
    setLineCap: (s) => doc.setLineCap(s),
    setLineJoin: (s) => doc.setLineJoin(s),
    setOpacity: (a) => {
      const key = Math.round(a * 1000) / 1000;
      let g = states.get(key);
      if (!g) {
        g = new GState({ opacity: key, 'stroke-opacity': key });
        states.set(key, g);
      }
      doc.setGState(g);
    },
  };
}

/** Text wrapped to a width; returns the height used (mm). */
export function wrappedText(doc: jsPDF, text: string, x: number, y: number, widthMm: number, lineMm: number): number {
  const lines = doc.splitTextToSize(text, widthMm) as string[];
  lines.forEach((l, i) => doc.text(l, x, y + i * lineMm));
  return lines.length * lineMm;
}

/** Number with fixed decimals, trailing zeros kept (figures line up in tables). */
export function fx(n: number, digits = 1): string {
  return Number.isFinite(n) ? n.toFixed(digits) : '—';
}

/** The PDF as bytes. */
export function pdfBytes(p: PdfPage): Uint8Array {
  return new Uint8Array(p.doc.output('arraybuffer'));
}
