/**
 * The swatch sheet: every texture of a style drawn at true physical size — whole repeats of the
 * renderer's tile (`renderTile`, drawn as PDF paths by `drawTileToPdf`) placed side by side, so a
 * swatch of Rx × Ry repeats is Rx × needles ÷ wales/cm wide and Ry × courses ÷ courses/cm tall —
 * with ruler ticks at every repeat, the repeat in needles × courses and mm, the stitch chart with
 * its legend, the feeders and their yarns, density and estimated g/m². Two textures a page, the
 * 5 cm and 2 in scale bars and the actual-size notice on every page.
 */
import { TilingPattern, type jsPDF } from 'jspdf';
import { drawTileToPdf } from '@/lib/knit/render-pdf';
import { renderTile, repeatsForMinSize, yarnLookNotes } from '@/lib/knit/render';
import type { StitchAction } from '@/lib/knit/texture';
import { packYarnColours, paperSizes, textureFacts, type PackData, type PaperSize, type TextureFacts } from './pack-data';
import { createPdf, font, fx, ink, MM_PER_INCH, pageChrome, pageNumbers, pdfBytes, pdfPathTarget, scaleBars, type PdfPage } from './pdf';

/** Tile px per cm used for the drawing list inside the PDF (1 px = 0.1 mm); the placement scales it. */
const PDF_PX_PER_CM = 100;

/** Where one texture's swatch went: page (1-based) and its rectangle in mm from the page's top left. */
export interface SwatchPlacement {
  textureId: string;
  textureName: string;
  page: number;
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
  repeatsX: number;
  repeatsY: number;
  needles: number;
  courses: number;
  /** True when one repeat is larger than the space and only part of it is shown. */
  partial: boolean;
}

export function headerFor(data: PackData): { left: string; right: string } {
  const rev = data.release ? `Revision ${data.release.revision} (released ${data.release.releasedAt.slice(0, 10)})` : `Revision ${data.style.revision} (working copy, not released)`;
  return { left: `${data.style.code} · ${data.style.name}`, right: rev };
}

/** The whole repeats that fit a box, and the swatch size they make, mm. */
export function swatchRepeats(repeatMm: { widthMm: number; heightMm: number }, maxWidthMm: number, maxHeightMm: number) {
  const repeatsX = Math.max(1, Math.floor((maxWidthMm + 1e-9) / repeatMm.widthMm));
  const repeatsY = Math.max(1, Math.floor((maxHeightMm + 1e-9) / repeatMm.heightMm));
  return {
    repeatsX,
    repeatsY,
    widthMm: repeatsX * repeatMm.widthMm,
    heightMm: repeatsY * repeatMm.heightMm,
  };
}

const actionFill: Record<StitchAction, string> = { knit: '#ffffff', tuck: '#ffffff', miss: '#eef0f1' };

/** One chart cell's symbol: knit an empty cell, tuck a filled dot, miss a bar (the float). */
function chartSymbol(doc: jsPDF, action: StitchAction, x: number, y: number, s: number): void {
  doc.setFillColor(actionFill[action]);
  doc.setDrawColor(ink.rule);
  doc.setLineWidth(0.1);
  doc.rect(x, y, s, s, 'FD');
  if (action === 'tuck') {
    doc.setFillColor(ink.text);
    doc.circle(x + s / 2, y + s / 2, s * 0.24, 'F');
  } else if (action === 'miss') {
    doc.setFillColor(ink.text);
    doc.rect(x + s * 0.12, y + s * 0.42, s * 0.76, s * 0.16, 'F');
  }
}

/** Draws the stitch chart (course 1 at the bottom, knitted first) with feeder letters; returns height. */
function stitchChart(doc: jsPDF, f: TextureFacts, x: number, y: number, maxW: number, maxH: number): number {
  const t = f.texture;
  const W = t.repeat.needles;
  const H = t.repeat.courses;
  const s = Math.max(0.6, Math.min(3.2, (maxW - 10) / W, (maxH - 12) / H));
  const letterOf = new Map<number, string>();
  for (const line of f.feeders) for (const c of line.courses) letterOf.set(c, line.letter);
  for (let c = 0; c < H; c++) {
    const row = t.repeat.cells[c] ?? [];
    const cy = y + (H - 1 - c) * s;
    for (let n = 0; n < W; n++) chartSymbol(doc, row[n] ?? 'knit', x + 6 + n * s, cy, s);
    if (s >= 1.6 || c === 0 || c === H - 1 || (c + 1) % 5 === 0) {
      font(doc, 'mono', Math.min(6.5, Math.max(4, s * 2.4)), ink.soft);
      doc.text(String(c + 1), x + 5, cy + s * 0.75, { align: 'right' });
      doc.text(letterOf.get(c) ?? '', x + 6 + W * s + 1.2, cy + s * 0.75);
    }
  }
  font(doc, 'mono', Math.min(6.5, Math.max(4, s * 2.4)), ink.soft);
  for (let n = 0; n < W; n++) {
    if (s >= 2.2 || n === 0 || n === W - 1 || (n + 1) % 5 === 0) doc.text(String(n + 1), x + 6 + n * s + s / 2, y + H * s + 3, { align: 'center' });
  }
  // Legend of the chart's own symbols.
  const ly = y + H * s + 5.5;
  const ls = 2.6;
  font(doc, 'regular', 6.5, ink.soft);
  let lx = x + 6;
  for (const [a, label] of [['knit', 'knit'], ['tuck', 'tuck'], ['miss', 'miss (float behind)']] as const) {
    chartSymbol(doc, a, lx, ly, ls);
    doc.text(label, lx + ls + 1.2, ly + ls * 0.8);
    lx += ls + 2.5 + doc.getTextWidth(label) + 4;
  }
  doc.text('Course 1 at the bottom, knitted first; letters = feeder set', x + 6, ly + ls + 3.2);
  return H * s + 5.5 + ls + 4;
}

/** Ticks at every repeat along the top and left edges of a swatch; longer every 5, counts every 10. */
function repeatTicks(doc: jsPDF, pl: SwatchPlacement, repW: number, repH: number): void {
  doc.setDrawColor(ink.text);
  doc.setLineWidth(0.12);
  font(doc, 'mono', 5.5, ink.soft);
  for (let i = 0; i <= pl.repeatsX; i++) {
    const x = pl.xMm + i * repW;
    if (x > pl.xMm + pl.widthMm + 1e-6) break;
    const len = i % 5 === 0 ? 2.2 : 1.2;
    doc.line(x, pl.yMm - 0.4, x, pl.yMm - 0.4 - len);
    if (i % 10 === 0 && (i === 0 || repW * 10 >= 6)) doc.text(String(i), x, pl.yMm - 3.2, { align: 'center' });
  }
  for (let j = 0; j <= pl.repeatsY; j++) {
    const y = pl.yMm + j * repH;
    if (y > pl.yMm + pl.heightMm + 1e-6) break;
    const len = j % 5 === 0 ? 2.2 : 1.2;
    doc.line(pl.xMm - 0.4, y, pl.xMm - 0.4 - len, y);
    if (j % 10 === 0 && (j === 0 || repH * 10 >= 4)) doc.text(String(j), pl.xMm - 3.4, y + 0.8, { align: 'right' });
  }
}

/**
 * Draws the tile at true size into the swatch rectangle: the tile (whole repeats) becomes a PDF
 * tiling pattern whose cell is exactly one tile, mapped from tile px to the page at 10 ÷ pxPerCm mm
 * per px, and the swatch rectangle is filled with it — the repeat itself, repeated, as the mill
 * will knit it. The pattern is anchored at the swatch's bottom-left corner (course 0 knits first).
 */
function trueSizeTiles(p: PdfPage, f: TextureFacts, colours: Record<string, string>, pl: SwatchPlacement, key: string): void {
  const { doc } = p;
  const t = f.texture;
  const fit = repeatsForMinSize(t, PDF_PX_PER_CM, 60);
  const repeatsX = Math.min(fit.repeatsX, pl.repeatsX);
  const repeatsY = Math.min(fit.repeatsY, pl.repeatsY);
  const drawing = renderTile(t, colours, { repeatsX, repeatsY, pxPerCm: PDF_PX_PER_CM });
  const mmPerPx = 10 / PDF_PX_PER_CM;
  const tileH = drawing.heightPx * mmPerPx;
  // Pattern space (tile px, y down) to the page's default space (pt, y up from the bottom).
  const k = 72 / MM_PER_INCH;
  const originX = pl.xMm;
  const originTop = pl.yMm + pl.heightMm - tileH;
  doc.advancedAPI((d) => {
    const matrix = d.Matrix(mmPerPx * k, 0, 0, -mmPerPx * k, originX * k, (p.heightMm - originTop) * k);
    const pattern = new TilingPattern([0, 0, drawing.widthPx, drawing.heightPx], drawing.widthPx, drawing.heightPx, undefined, matrix);
    d.beginTilingPattern(pattern);
    drawTileToPdf(pdfPathTarget(d), drawing);
    d.endTilingPattern(key, pattern);
    d.rect(pl.xMm, pl.yMm, pl.widthMm, pl.heightMm, null);
    d.fill({ key } as unknown as Parameters<typeof d.fill>[0]);
  });
  doc.setDrawColor(ink.text);
  doc.setLineWidth(0.2);
  doc.rect(pl.xMm, pl.yMm, pl.widthMm, pl.heightMm, 'S');
}

function swatchBlock(
  p: PdfPage, f: TextureFacts, colours: Record<string, string>, gauge: number, top: number, height: number, pageNo: number, key: string,
): SwatchPlacement {
  const { doc, marginMm: m, widthMm: w } = p;
  const t = f.texture;
  font(doc, 'bold', 10.5, ink.text);
  doc.text(t.name, m, top + 4);
  font(doc, 'regular', 8, ink.soft);
  doc.text(`${t.family}${t.function ? ` · ${t.function}` : ''} · developed on E${t.gauge}`, m + doc.getTextWidth(t.name) * (10.5 / 8) + 4, top + 4);

  const swatchX = m + 8;
  const swatchTop = top + 12;
  const maxW = Math.min(84, w - 2 * m - 90);
  const maxH = height - 26;
  const rep = f.repeatMm;
  const fit = swatchRepeats(rep, maxW, maxH);
  const widthMm = Math.min(fit.widthMm, w - 2 * m - 8);
  const heightMm = Math.min(fit.heightMm, maxH);
  const pl: SwatchPlacement = {
    textureId: t.id,
    textureName: t.name,
    page: pageNo,
    xMm: swatchX,
    yMm: swatchTop,
    widthMm,
    heightMm,
    repeatsX: fit.repeatsX,
    repeatsY: fit.repeatsY,
    needles: fit.repeatsX * t.repeat.needles,
    courses: fit.repeatsY * t.repeat.courses,
    partial: widthMm < fit.widthMm - 1e-6 || heightMm < fit.heightMm - 1e-6,
  };
  trueSizeTiles(p, f, colours, pl, key);
  repeatTicks(doc, pl, rep.widthMm, rep.heightMm);
  font(doc, 'regular', 7, ink.soft);
  const caption = `${pl.repeatsX} × ${pl.repeatsY} repeats = ${pl.needles} needles × ${pl.courses} courses = ${fx(fit.widthMm)} × ${fx(fit.heightMm)} mm relaxed${pl.partial ? ' (part shown)' : ''}`;
  const captionLines = doc.splitTextToSize(`${caption}. Ticks: one per repeat.`, Math.max(widthMm, 70)) as string[];
  captionLines.forEach((l, i) => doc.text(l, swatchX, swatchTop + heightMm + 4.2 + i * 3.2));

  // The facts column.
  const cx = m + 8 + Math.max(maxW, Math.min(widthMm, w - 2 * m - 90)) + 8;
  const cw = w - m - cx;
  let y = top + 12;
  const row = (label: string, value: string) => {
    font(doc, 'regular', 7, ink.soft);
    doc.text(label, cx, y);
    font(doc, 'regular', 8, ink.text);
    const lines = doc.splitTextToSize(value, cw - 24) as string[];
    lines.forEach((l, i) => doc.text(l, cx + 24, y + i * 3.6));
    y += Math.max(1, lines.length) * 3.6 + 1.2;
  };
  row('Repeat', `${t.repeat.needles} needles × ${t.repeat.courses} courses = ${fx(rep.widthMm, 2)} × ${fx(rep.heightMm, 2)} mm`);
  row('Density', `${fx(t.density.walesPerCm)} wales/cm × ${fx(t.density.coursesPerCm)} courses/cm (${fx(f.stitchesPerCm2, 0)} stitches/cm²), relaxed`);
  row('Weight', f.gsm === null ? 'not computed' : `${fx(f.gsm, 0)} g/m² (estimated, on the style's E${gauge})`);
  row('Loop length', `knit ${fx(t.loopMm.knit, 2)} mm · tuck ${fx(t.loopMm.tuck, 2)} mm`);
  font(doc, 'regular', 7, ink.soft);
  doc.text('Feeders', cx, y);
  for (const line of f.feeders) {
    const courses = line.courses.length === t.repeat.courses ? 'all courses' : `courses ${line.courses.map((c) => c + 1).join(', ')}`;
    doc.setFillColor(line.ground.hex);
    doc.setDrawColor(ink.rule);
    doc.rect(cx + 24, y - 2.4, 2.8, 2.8, 'FD');
    font(doc, 'bold', 7.5, ink.text);
    doc.text(line.letter, cx + 28.2, y);
    font(doc, 'regular', 7.5, ink.text);
    const ground = `${line.ground.name} (${line.ground.count}, ${line.ground.hex})`;
    const plated = line.plated ? `plated ${line.plated.name} (${line.plated.count}) at draft ${fx(line.plated.draft, 2)}` : '';
    const text = `${courses}: ${ground}${plated ? `; ${plated}` : ''}`;
    const lines = doc.splitTextToSize(text, cw - 30) as string[];
    lines.forEach((l, i) => doc.text(l, cx + 31.5, y + i * 3.4));
    y += lines.length * 3.4 + 1;
  }
  // Yarns whose colour here is not their target or their own, marked as the colourway preview marks them.
  const marks = new Map<string, string>();
  for (const line of f.feeders) {
    for (const yl of [line.ground, line.plated]) {
      const note = yl?.source ? yarnLookNotes[yl.source] : undefined;
      if (yl && note) marks.set(yl.id, `${yl.name}: ${note}`);
    }
  }
  for (const text of marks.values()) {
    font(doc, 'regular', 6.5, ink.warn);
    const lines = doc.splitTextToSize(text, cw - 24) as string[];
    lines.forEach((l, i) => doc.text(l, cx + 24, y + 0.4 + i * 3));
    y += lines.length * 3 + 0.6;
  }
  y += 1.5;
  font(doc, 'regular', 7, ink.soft);
  doc.text('Stitch chart', cx, y);
  y += 2;
  const chartMaxH = top + height - y - 2;
  stitchChart(doc, f, cx, y, cw, chartMaxH);
  for (const problem of f.problems) {
    font(doc, 'regular', 7, ink.warn);
    doc.text(problem, cx, top + height - 2, { maxWidth: cw });
  }
  return pl;
}

/**
 * Adds the swatch pages (two textures a page) to a PDF and returns where each swatch went. Each
 * page gets the header, the scale bars and the actual-size notice.
 */
export function addSwatchPages(p: PdfPage, data: PackData, opts: { firstPageIsCurrent?: boolean; title?: string } = {}): SwatchPlacement[] {
  const facts = textureFacts(data);
  const colours = packYarnColours(data);
  const header = headerFor(data);
  const placements: SwatchPlacement[] = [];
  const perPage = 2;
  const pages = Math.max(1, Math.ceil(facts.length / perPage));
  for (let pg = 0; pg < pages; pg++) {
    if (pg > 0 || !opts.firstPageIsCurrent) p.doc.addPage();
    const pageNo = p.doc.getNumberOfPages();
    pageChrome(p, { ...header, title: opts.title ?? 'Swatch sheet' }, true);
    const barsY = p.marginMm + 10;
    scaleBars(p.doc, p.marginMm + 8, barsY);
    font(p.doc, 'regular', 7, ink.soft);
    p.doc.text(`${paperSizes[p.paper].label} · swatches at relaxed density, true size`, p.widthMm - p.marginMm, barsY + 1.6, { align: 'right' });
    const areaTop = barsY + 20;
    const areaBottom = p.heightMm - p.marginMm - 2;
    const blockH = (areaBottom - areaTop - 4) / perPage;
    if (facts.length === 0) {
      font(p.doc, 'regular', 9, ink.soft);
      p.doc.text('This style has no textures yet.', p.marginMm, areaTop + 6);
    }
    for (let k = 0; k < perPage; k++) {
      const f = facts[pg * perPage + k];
      if (!f) break;
      const top = areaTop + k * (blockH + 4);
      if (k > 0) {
        p.doc.setDrawColor(ink.rule);
        p.doc.setLineWidth(0.2);
        p.doc.line(p.marginMm, top - 2, p.widthMm - p.marginMm, top - 2);
      }
      placements.push(swatchBlock(p, f, colours, data.style.machine.gauge, top, blockH, pageNo, `tile-${f.texture.id}`));
    }
  }
  return placements;
}

/** The swatch sheet as a PDF of its own. */
export function swatchSheetPdf(data: PackData, paper: PaperSize): { bytes: Uint8Array; placements: SwatchPlacement[]; pages: number } {
  const p = createPdf(paper, { title: `${data.style.code} swatch sheet`, subject: 'True-size swatches' });
  const placements = addSwatchPages(p, data, { firstPageIsCurrent: true });
  const pages = pageNumbers(p);
  return { bytes: pdfBytes(p), placements, pages };
}
