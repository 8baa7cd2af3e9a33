/**
 * The mill pack: everything a mill needs to knit the style, in one PDF — cover (style, revision,
 * dates, approvals), contents, each panel drawn with its zones, labels and cut lines, the swatch
 * sheets, the yarn list and consumption per size, the fibre-content label texts, the colour
 * standards and dye plan, the size spec with needle counts, and the trims; page numbers throughout.
 *
 * Built step by step with a progress callback, yielding between steps so a server answering
 * progress polls stays responsive.
 */
import type { jsPDF } from 'jspdf';
import { rasterizePanel } from '@/lib/knit/raster';
import { parseHexColour } from '@/lib/knit/render-bitmap';
import { zoneFunctionLabels, type Panel, type StitchPolygon } from '@/lib/knit/panel';
import { labelCaution } from '@/lib/knit/content';
import { yarnLookNotes, type YarnLook } from '@/lib/knit/render';
import {
  consumptionPerSize, machineNeedles, packSummary, packTextureColours, packYarnLooks, panelLengthCm, panelWidthCm, paperSizes, standardHex,
  textureFacts, yarnColourStandards, yarnColourText, yarnCountText, yarnFibreText, type PackApproval, type PackData, type PaperSize,
} from './pack-data';
import { encodeRgbPng } from './png';
import { createPdf, font, fx, ink, pageChrome, pageNumbers, pdfBytes, type PdfPage } from './pdf';
import { addSwatchPages, headerFor, type SwatchPlacement } from './swatch-sheet';

export type ProgressFn = (percent: number, step: string) => void | Promise<void>;

export interface MillPackResult {
  bytes: Uint8Array;
  pages: number;
  sections: { title: string; page: number }[];
  placements: SwatchPlacement[];
}

const yieldToLoop = () => new Promise<void>((r) => setImmediate(r));

/** A simple table: column widths in mm, header row bold; returns the y after it. Adds pages as needed. */
function table(
  p: PdfPage,
  header: { left: string; right: string; title: string },
  y: number,
  cols: { title: string; width: number; align?: 'left' | 'right' }[],
  rows: string[][],
): number {
  const { doc, marginMm: m, heightMm: h } = p;
  const lineH = 3.6;
  const drawHeader = () => {
    font(doc, 'bold', 7.5, ink.soft);
    let x = m;
    for (const c of cols) {
      doc.text(c.title, c.align === 'right' ? x + c.width - 1 : x, y, c.align === 'right' ? { align: 'right' } : undefined);
      x += c.width;
    }
    doc.setDrawColor(ink.rule);
    doc.setLineWidth(0.2);
    doc.line(m, y + 1.4, m + cols.reduce((s, c) => s + c.width, 0), y + 1.4);
    y += 5;
  };
  drawHeader();
  for (const r of rows) {
    const wrapped = cols.map((c, i) => doc.splitTextToSize(r[i] ?? '', c.width - 2) as string[]);
    const rowH = Math.max(...wrapped.map((w) => w.length)) * lineH + 1;
    if (y + rowH > h - m - 4) {
      doc.addPage();
      pageChrome(p, { ...header, title: `${header.title} (continued)` }, false);
      y = m + 14;
      drawHeader();
    }
    let x = m;
    font(doc, 'regular', 8, ink.text);
    cols.forEach((c, i) => {
      wrapped[i]!.forEach((l, k) => doc.text(l, c.align === 'right' ? x + c.width - 1 : x, y + k * lineH, c.align === 'right' ? { align: 'right' } : undefined));
      x += c.width;
    });
    y += rowH;
  }
  return y + 2;
}

/**
 * How a yarn shows in the pack's colourway, in words: the preview's legend line where it has one
 * (undyeable, bath colour, undyed without a target), else what the colour is.
 */
function lookText(data: PackData, yarnId: string, look: YarnLook): string {
  const note = yarnLookNotes[look.source];
  if (note) return note;
  switch (look.source) {
    case 'own': {
      const state = data.yarns.find((y) => y.id === yarnId)?.colour.state;
      return `comes ${state === 'yarn-dyed' ? 'yarn-dyed' : 'dope-dyed'}: its own colour`;
    }
    case 'target': {
      const st = data.colour?.standards.find((x) => x.source === 'colourway' && x.yarnIds.includes(yarnId));
      return st ? `target ${st.name}` : 'its target';
    }
    case 'pale':
      return 'takes little dye: stays pale whatever the bath';
    case 'undyed':
      return 'undyed: no colourway';
    default:
      return '';
  }
}

function heading(doc: jsPDF, text: string, x: number, y: number): number {
  font(doc, 'bold', 10, ink.text);
  doc.text(text, x, y);
  return y + 5.5;
}

function polygonPath(doc: jsPDF, poly: StitchPolygon, toX: (x: number) => number, toY: (y: number) => number): void {
  poly.forEach((pt, i) => (i === 0 ? doc.moveTo(toX(pt.x), toY(pt.y)) : doc.lineTo(toX(pt.x), toY(pt.y))));
  doc.close();
}

/** One panel on a page: the stitch raster as an image at the panel's relaxed proportions, outlines and labels over it. */
function panelPage(p: PdfPage, data: PackData, panel: Panel, colours: Record<string, string>): void {
  const { doc, marginMm: m, widthMm: w, heightMm: h } = p;
  const base = data.textures.find((t) => t.id === panel.baseTextureId);
  const wales = base?.density.walesPerCm ?? 20;
  const courses = base?.density.coursesPerCm ?? 28;
  const widthCm = panel.widthNeedles / wales;
  const heightCm = panel.heightCourses / courses;
  const boxX = m;
  const boxY = m + 16;
  const boxW = w - 2 * m - 62;
  const boxH = h - 2 * m - 26;
  const mmPerCm = Math.min(boxW / widthCm, boxH / heightCm);
  const sx = mmPerCm / wales;
  const sy = mmPerCm / courses;
  const toX = (x: number) => boxX + x * sx;
  const toY = (y: number) => boxY + y * sy;

  const raster = rasterizePanel(panel, { counts: true });
  // The image samples every k-th stitch so it stays near print resolution (about 1200 px a side).
  const k = Math.max(1, Math.ceil(Math.max(raster.width, raster.height) / 1200));
  const iw = Math.ceil(raster.width / k);
  const ih = Math.ceil(raster.height / k);
  const rgb = Buffer.alloc(iw * ih * 3);
  const rgbOf = raster.legend.map((id, n) => (n === 0 ? [255, 255, 255] : parseHexColour(colours[id] ?? '#999999')));
  for (let j = 0; j < ih; j++) {
    for (let i = 0; i < iw; i++) {
      const c = rgbOf[raster.cells[j * k * raster.width + i * k]!]!;
      const o = (j * iw + i) * 3;
      rgb[o] = c[0]!;
      rgb[o + 1] = c[1]!;
      rgb[o + 2] = c[2]!;
    }
  }
  doc.addImage(new Uint8Array(encodeRgbPng(rgb, iw, ih)), 'PNG', boxX, boxY, panel.widthNeedles * sx, panel.heightCourses * sy, `panel-${panel.id}`, 'FAST');

  doc.setDrawColor(ink.text);
  doc.setLineWidth(0.25);
  polygonPath(doc, panel.knittedArea, toX, toY);
  doc.stroke();
  doc.setDrawColor('#ffffff');
  doc.setLineWidth(0.15);
  for (const z of panel.zones) {
    polygonPath(doc, z.polygon, toX, toY);
    doc.stroke();
  }
  // Cut lines: dashed, over everything.
  doc.setDrawColor(ink.text);
  doc.setLineWidth(0.45);
  doc.setLineDashPattern([2.2, 1.2], 0);
  polygonPath(doc, panel.cutOutline, toX, toY);
  doc.stroke();
  doc.setLineDashPattern([], 0);

  // Trims on this panel.
  const trims = data.trims.filter((t) => t.panelKind === panel.kind);
  doc.setDrawColor(ink.warn);
  doc.setLineWidth(0.35);
  for (const t of trims) {
    doc.rect(toX(t.box.x), toY(t.box.y), t.box.width * sx, t.box.height * sy, 'S');
    font(doc, 'regular', 6.5, ink.warn);
    doc.text(t.name || t.kind, toX(t.box.x), toY(t.box.y) - 1);
  }

  // Zone labels at the centre of their vertices.
  const texName = new Map(data.textures.map((t) => [t.id, t.name]));
  for (const z of panel.zones) {
    const cx = z.polygon.reduce((s, pt) => s + pt.x, 0) / z.polygon.length;
    const cy = z.polygon.reduce((s, pt) => s + pt.y, 0) / z.polygon.length;
    font(doc, 'bold', 6.5, ink.text);
    const label = z.name || zoneFunctionLabels[z.fn];
    const tw = Math.max(doc.getTextWidth(label), doc.getTextWidth(texName.get(z.textureId) ?? '') * (6 / 6.5)) + 2;
    // Keep the label on the drawing when the zone sits at an edge.
    const lx = Math.min(Math.max(toX(cx), boxX + tw / 2), boxX + panel.widthNeedles * sx - tw / 2);
    doc.setFillColor('#ffffff');
    doc.rect(lx - tw / 2, toY(cy) - 3.2, tw, 6.4, 'F');
    doc.text(label, lx, toY(cy) - 0.6, { align: 'center' });
    font(doc, 'regular', 6, ink.soft);
    doc.text(texName.get(z.textureId) ?? z.textureId, lx, toY(cy) + 2.2, { align: 'center' });
  }

  // Side column: dimensions, legend, zone list.
  const cx = w - m - 58;
  let y = boxY + 2;
  font(doc, 'bold', 9, ink.text);
  doc.text(panel.name, cx, y);
  y += 5;
  font(doc, 'regular', 7.5, ink.text);
  const lines = [
    `${panel.widthNeedles} needles × ${panel.heightCourses} courses`,
    `${fx(widthCm)} × ${fx(heightCm)} cm relaxed at the base texture`,
    `Knitted ${raster.knitted.toLocaleString('en-GB')} stitches, ${raster.inside.toLocaleString('en-GB')} inside the cut`,
    `Drawn at 1 : ${fx(10 / mmPerCm, 1)} (not to scale for measuring)`,
  ];
  for (const l of lines) {
    const wrapped = doc.splitTextToSize(l, 58) as string[];
    wrapped.forEach((t, i) => doc.text(t, cx, y + i * 3.4));
    y += wrapped.length * 3.4 + 0.6;
  }
  y += 2;
  font(doc, 'regular', 7, ink.soft);
  doc.text('Solid: knitted area · dashed: cut line', cx, y);
  y += 5;
  const used = new Set(raster.legend.filter(Boolean));
  for (const t of data.textures.filter((x) => used.has(x.id))) {
    doc.setFillColor(colours[t.id] ?? '#999999');
    doc.rect(cx, y - 2.6, 3.2, 3.2, 'F');
    font(doc, 'regular', 7.5, ink.text);
    const count = raster.stitches[t.id];
    const wrapped = doc.splitTextToSize(`${t.name}${t.id === panel.baseTextureId ? ' (base)' : ''}`, 52) as string[];
    wrapped.forEach((s, i) => doc.text(s, cx + 5, y + i * 3.4));
    font(doc, 'regular', 6.5, ink.soft);
    doc.text(`${(count?.inside ?? 0).toLocaleString('en-GB')} stitches kept`, cx + 5, y + wrapped.length * 3.4);
    y += wrapped.length * 3.4 + 4;
  }
  if (panel.zones.length) {
    y += 2;
    font(doc, 'bold', 7.5, ink.text);
    doc.text('Zones (top of the stack first)', cx, y);
    y += 4;
    for (const z of [...panel.zones].sort((a, b) => b.order - a.order)) {
      font(doc, 'regular', 7, ink.text);
      const wrapped = doc.splitTextToSize(`${z.name || '—'} · ${zoneFunctionLabels[z.fn]} · ${texName.get(z.textureId) ?? z.textureId}`, 58) as string[];
      if (y + wrapped.length * 3.2 > h - m - 4) break;
      wrapped.forEach((s, i) => doc.text(s, cx, y + i * 3.2));
      y += wrapped.length * 3.2 + 1;
    }
  }
}

/**
 * Builds the mill pack. `approvals` are read at print time (client reviews, test-knit decisions).
 */
export async function millPackPdf(
  data: PackData,
  opts: { paper: PaperSize; approvals: PackApproval[]; generatedAt?: string },
  onProgress: ProgressFn = () => {},
): Promise<MillPackResult> {
  const p = createPdf(opts.paper, { title: `${data.style.code} mill pack`, subject: 'Mill pack' });
  const { doc, marginMm: m, widthMm: w } = p;
  const head = headerFor(data);
  const sections: { title: string; page: number }[] = [];
  const begin = (title: string, trueSize = false) => {
    doc.addPage();
    sections.push({ title, page: doc.getNumberOfPages() });
    pageChrome(p, { ...head, title }, trueSize);
    return m + 14;
  };
  const step = async (pct: number, what: string) => {
    await onProgress(pct, what);
    await yieldToLoop();
  };

  // Cover.
  await step(2, 'Cover');
  const s = data.style;
  const rev = data.release?.revision ?? s.revision;
  pageChrome(p, { ...head, title: 'Mill pack' }, false);
  font(doc, 'bold', 26, ink.text);
  doc.text(s.code, m, m + 30);
  font(doc, 'regular', 15, ink.text);
  doc.text(s.name, m, m + 39);
  font(doc, 'regular', 10, ink.soft);
  doc.text(`Revision ${rev}${data.release ? '' : ' · working copy, not released'}`, m, m + 47);
  const machine = s.machine.kind === 'circular'
    ? `Circular, ${s.machine.diameterIn ?? '?'} in, E${s.machine.gauge}, ${machineNeedles(s.machine) ?? '?'} needles, ${s.machine.feeders ?? '?'} feeders`
    : `Flat (V-bed), E${s.machine.gauge}, ${s.machine.bedNeedles ?? '?'} needles`;
  const facts: [string, string][] = [
    ['Season', s.season || '—'],
    ['Client', s.clientName ?? '—'],
    ['Garment', `${s.garmentType} · ${s.construction}`],
    ['Machine', machine],
    ['Sizes', `${s.sizes.labels.join(', ')} (base ${s.sizes.base})`],
    ['Released', data.release ? `${data.release.releasedAt.slice(0, 16).replace('T', ' ')} UTC by ${data.release.releasedBy}` : 'not released'],
    ['Released to', data.release?.mills.map((x) => x.name).join(', ') || '—'],
    ['Printed', (opts.generatedAt ?? new Date().toISOString()).slice(0, 16).replace('T', ' ') + ' UTC'],
  ];
  if (data.release?.note) facts.push(['Note', data.release.note]);
  let y = m + 60;
  for (const [k, v] of facts) {
    font(doc, 'regular', 8, ink.soft);
    doc.text(k, m, y);
    font(doc, 'regular', 9.5, ink.text);
    const wrapped = doc.splitTextToSize(v, w - 2 * m - 36) as string[];
    wrapped.forEach((l, i) => doc.text(l, m + 36, y + i * 4.4));
    y += wrapped.length * 4.4 + 2;
  }
  y = heading(doc, 'Approvals', m, y + 6);
  if (!opts.approvals.length) {
    font(doc, 'regular', 8.5, ink.soft);
    doc.text('No approvals recorded yet.', m, y);
    y += 5;
  } else {
    y = table(p, { ...head, title: 'Mill pack' }, y, [
      { title: 'What', width: 52 }, { title: 'Decision', width: 32 }, { title: 'By', width: 34 }, { title: 'When', width: 28 }, { title: 'Comment', width: w - 2 * m - 146 },
    ], opts.approvals.map((a) => [a.what, a.decision, a.by, a.at.slice(0, 10), a.comment]));
  }
  const contentsPage = (() => {
    doc.addPage();
    pageChrome(p, { ...head, title: 'Contents' }, false);
    return doc.getNumberOfPages();
  })();

  // Panels.
  await step(10, 'Panels');
  const colours = packTextureColours(data);
  for (const [i, panel] of data.panels.entries()) {
    begin(i === 0 ? 'Panels' : `Panels: ${panel.name}`);
    if (i > 0) sections.pop();
    panelPage(p, data, panel, colours);
    await step(10 + Math.round((20 * (i + 1)) / Math.max(1, data.panels.length)), `Panel ${panel.name}`);
  }
  if (!data.panels.length) {
    y = begin('Panels');
    font(doc, 'regular', 9, ink.soft);
    doc.text('No body map saved for this style.', m, y);
  }

  // Swatch sheets.
  await step(32, 'Swatch sheets');
  const before = doc.getNumberOfPages();
  const placements = addSwatchPages(p, data, { title: 'Swatch sheet' });
  sections.push({ title: 'Swatch sheets (true size)', page: before + 1 });
  await step(65, 'Yarn list and consumption');

  // Yarns and consumption per size.
  const summary = packSummary(data);
  y = begin('Yarn list and consumption per size');
  const tf = textureFacts(data);
  y = table(p, { ...head, title: 'Yarn list' }, y, [
    { title: 'Yarn', width: 44 }, { title: 'Ref.', width: 30 }, { title: 'Count', width: 22 }, { title: 'Fibres', width: 28 },
    { title: 'Colour', width: 28 }, { title: 'Feeds', width: w - 2 * m - 152 },
  ], data.yarns.map((yn) => [
    yn.name, yn.supplierRef, yarnCountText(yn), yarnFibreText(yn.fibres), yarnColourText(yn.colour),
    tf.filter((f) => f.feeders.some((l) => l.ground.id === yn.id || l.plated?.id === yn.id)).map((f) => f.texture.name).join(', '),
  ]));
  const sizes = consumptionPerSize(data, summary);
  y = heading(doc, 'Consumption per garment (g): knitted incl. cut-away / with waste allowance', m, y + 4);
  const sizeW = Math.min(26, (w - 2 * m - 56) / Math.max(1, sizes.length));
  y = table(p, { ...head, title: 'Consumption' }, y, [
    { title: 'Yarn', width: 56 },
    ...sizes.map((z) => ({ title: z.size + (z.size === s.sizes.base ? ' (base)' : ''), width: sizeW, align: 'right' as const })),
  ], data.yarns.map((yn) => [
    yn.name,
    ...sizes.map((z) => {
      const c = z.yarns[yn.id];
      return c ? `${fx(c.knittedGrams)} / ${fx(c.grossGrams)}` : z.factor === null ? 'not graded' : '—';
    }),
  ]));
  font(doc, 'regular', 7.5, ink.soft);
  const waste = summary.consumption?.wasteAllowance ?? 0.05;
  const note = data.fit
    ? `Sizes scaled from the base size by the fit plan's stitch-count factor. Waste allowance ${fx(waste * 100, 0)} %.`
    : `Only the base size is drawn on the body map; other sizes are graded once the size spec is recorded. Waste allowance ${fx(waste * 100, 0)} %.`;
  doc.text(doc.splitTextToSize(note, w - 2 * m) as string[], m, y);
  y += 8;
  for (const problem of summary.problems) {
    font(doc, 'regular', 7.5, ink.warn);
    doc.text(problem, m, y, { maxWidth: w - 2 * m });
    y += 4;
  }

  // Content label.
  await step(72, 'Fibre content label');
  y = begin('Fibre content label');
  if (summary.labels) {
    for (const [region, label] of [['EU (Regulation (EU) No 1007/2011)', summary.labels.eu], ['US (16 CFR Part 303)', summary.labels.us]] as const) {
      y = heading(doc, region, m, y);
      font(doc, 'bold', 12, ink.text);
      doc.text(label.text, m, y + 1);
      y += 8;
      font(doc, 'regular', 8, ink.soft);
      for (const n of label.notes) {
        const wrapped = doc.splitTextToSize(n, w - 2 * m) as string[];
        doc.text(wrapped, m, y);
        y += wrapped.length * 3.6 + 1;
      }
      y += 4;
    }
    font(doc, 'regular', 7.5, ink.warn);
    doc.text(doc.splitTextToSize(labelCaution, w - 2 * m) as string[], m, y);
  } else {
    font(doc, 'regular', 9, ink.soft);
    doc.text('Not computed: the body map or a yarn is missing.', m, y);
  }

  // Colour.
  await step(78, 'Colour standards and dye plan');
  y = begin('Colour standards and dye plan');
  const yarnName = new Map(data.yarns.map((yn) => [yn.id, yn.name]));
  const standards = [...(data.colour?.standards ?? []), ...yarnColourStandards(data)];
  if (data.colour) {
    font(doc, 'regular', 9, ink.text);
    doc.text(`Colourway ${data.colour.colourwayName} · route ${data.colour.route}`, m, y);
    y += 6;
  } else {
    font(doc, 'regular', 8.5, ink.soft);
    doc.text(doc.splitTextToSize('No colourway recorded for this revision: dyeable yarns are shown undyed. Yarns that come coloured are their own standards.', w - 2 * m) as string[], m, y);
    y += 9;
  }
  for (const st of standards) {
    doc.setFillColor(standardHex(st));
    doc.setDrawColor(ink.rule);
    doc.rect(m, y - 3.4, 9, 5, 'FD');
    font(doc, 'bold', 8.5, ink.text);
    doc.text(st.name, m + 12, y);
    font(doc, 'mono', 7.5, ink.soft);
    doc.text(`L* ${fx(st.lab.L, 2)}  a* ${fx(st.lab.a, 2)}  b* ${fx(st.lab.b, 2)}  (D65/10°) · ${st.source} · ${st.yarnIds.map((id) => yarnName.get(id) ?? id).join(', ')}`, m + 12, y + 3.6, { maxWidth: w - 2 * m - 12 });
    y += 10;
  }
  // The yarns as they come out of the dye plan: the colours the panels' tiles and swatches show.
  const looks = packYarnLooks(data);
  y = heading(doc, 'Yarns as dyed (the colours the swatches show)', m, y + 2);
  if (data.colour && !data.colour.plan) {
    font(doc, 'regular', 8, ink.soft);
    const wrapped = doc.splitTextToSize('This revision was released before its dye plan was kept with it: dyeable yarns are shown in their target colours.', w - 2 * m) as string[];
    doc.text(wrapped, m, y);
    y += wrapped.length * 3.6 + 2;
  }
  for (const yn of data.yarns) {
    const look = looks[yn.id];
    if (!look) continue;
    if (y > p.heightMm - m - 10) {
      doc.addPage();
      pageChrome(p, { ...head, title: 'Colour standards and dye plan (continued)' }, false);
      y = m + 14;
    }
    doc.setFillColor(look.hex);
    doc.setDrawColor(ink.rule);
    doc.rect(m, y - 3, 6, 4, 'FD');
    font(doc, 'bold', 8, ink.text);
    doc.text(yn.name, m + 9, y);
    const nameW = doc.getTextWidth(yn.name);
    font(doc, 'regular', 7.5, yarnLookNotes[look.source] ? ink.warn : ink.soft);
    const wrapped = doc.splitTextToSize(`${look.hex} · ${lookText(data, yn.id, look)}`, w - 2 * m - 12 - nameW) as string[];
    wrapped.forEach((l, i) => doc.text(l, m + 9 + nameW + 3, y + i * 3.4));
    y += Math.max(6, wrapped.length * 3.4 + 2.6);
  }
  if (data.colour?.baths.length) {
    y = heading(doc, 'Dye baths, in order', m, y + 2);
    y = table(p, { ...head, title: 'Dye plan' }, y, [
      { title: '#', width: 8 }, { title: 'Dye class', width: 30 }, { title: '°C', width: 14, align: 'right' }, { title: 'Yarns', width: w - 2 * m - 52 },
    ], data.colour.baths.map((b, i) => [String(i + 1), b.dyeClass, String(b.temperatureC), b.yarnIds.map((id) => yarnName.get(id) ?? id).join(', ')]));
  }
  for (const f of data.colour?.findings ?? []) {
    font(doc, 'regular', 8, ink.warn);
    const wrapped = doc.splitTextToSize(`• ${f}`, w - 2 * m) as string[];
    doc.text(wrapped, m, y);
    y += wrapped.length * 3.6 + 1;
  }

  // Size spec and needles.
  await step(84, 'Size spec and needle counts');
  y = begin('Size spec and needle counts');
  const needles = machineNeedles(s.machine);
  font(doc, 'regular', 9, ink.text);
  doc.text(s.machine.kind === 'circular' ? `Cylinder: ${s.machine.diameterIn} in × E${s.machine.gauge} = ${needles} needles (π × diameter × gauge, to the multiple of ${s.machine.needleMultiple ?? 1})` : `Bed: ${needles ?? '?'} needles at E${s.machine.gauge}`, m, y, { maxWidth: w - 2 * m });
  y += 7;
  y = table(p, { ...head, title: 'Needle counts' }, y, [
    { title: 'Panel', width: 44 }, { title: 'Needles', width: 22, align: 'right' }, { title: 'Courses', width: 22, align: 'right' },
    { title: 'Width cm', width: 24, align: 'right' }, { title: 'Length cm', width: 24, align: 'right' }, { title: 'Base texture', width: w - 2 * m - 136 },
  ], data.panels.map((pn) => {
    const wc = panelWidthCm(pn, data.textures);
    const lc = panelLengthCm(pn, data.textures);
    return [pn.name, String(pn.widthNeedles), String(pn.heightCourses), wc === null ? '—' : fx(wc), lc === null ? '—' : fx(lc), data.textures.find((t) => t.id === pn.baseTextureId)?.name ?? '—'];
  }));
  if (data.fit && data.fit.sizes.length) {
    const pointNames = [...new Set(data.fit.sizes.flatMap((z) => z.points.map((pt) => pt.name)))];
    const colW = Math.min(24, (w - 2 * m - 50) / Math.max(1, data.fit.sizes.length));
    y = heading(doc, 'Points of measure (cm)', m, y + 4);
    y = table(p, { ...head, title: 'Size spec' }, y, [
      { title: 'Point', width: 50 }, ...data.fit.sizes.map((z) => ({ title: z.label, width: colW, align: 'right' as const })),
    ], [
      ...pointNames.map((name) => [name, ...data.fit!.sizes.map((z) => {
        const pt = z.points.find((q) => q.name === name);
        return pt ? `${fx(pt.cm)}${pt.toleranceCm !== undefined ? ` ±${fx(pt.toleranceCm)}` : ''}` : '—';
      })]),
      ['Needles', ...data.fit.sizes.map((z) => (z.needles ? String(z.needles) : '—'))],
    ]);
    for (const n of data.fit.notes) {
      font(doc, 'regular', 7.5, ink.soft);
      doc.text(n, m, y, { maxWidth: w - 2 * m });
      y += 4;
    }
  } else {
    font(doc, 'regular', 8.5, ink.soft);
    doc.text('No size spec recorded for this revision.', m, y + 3);
  }

  // Trims.
  await step(90, 'Trims');
  y = begin('Trims');
  if (data.trims.length) {
    table(p, { ...head, title: 'Trims' }, y, [
      { title: 'Trim', width: 40 }, { title: 'Kind', width: 30 }, { title: 'Method', width: 28 }, { title: '°C', width: 14, align: 'right' },
      { title: 'Panel', width: 22 }, { title: 'Place (needles × courses)', width: w - 2 * m - 134 },
    ], data.trims.map((t) => [
      t.name || '—', t.kind, t.method, t.tempC === null ? '—' : String(t.tempC), t.panelKind,
      `x ${t.box.x}, y ${t.box.y}; ${t.box.width} × ${t.box.height}`,
    ]));
  } else {
    font(doc, 'regular', 9, ink.soft);
    doc.text('No trims on this style.', m, y);
  }

  // Contents, now that every page is known.
  await step(95, 'Contents and page numbers');
  doc.setPage(contentsPage);
  y = m + 16;
  for (const sec of sections) {
    font(doc, 'regular', 10, ink.text);
    doc.text(sec.title, m, y);
    doc.text(String(sec.page), w - m, y, { align: 'right' });
    doc.setDrawColor(ink.rule);
    doc.setLineDashPattern([0.4, 1], 0);
    doc.line(m + doc.getTextWidth(sec.title) + 2, y - 0.8, w - m - doc.getTextWidth(String(sec.page)) - 2, y - 0.8);
    doc.setLineDashPattern([], 0);
    y += 7;
  }
  font(doc, 'regular', 8, ink.soft);
  doc.text(`${paperSizes[opts.paper].label}. Swatch pages are true size: print at 100 %.`, m, y + 4);
  const pages = pageNumbers(p);
  await step(99, 'Writing the file');
  const bytes = pdfBytes(p);
  return { bytes, pages, sections: [{ title: 'Cover', page: 1 }, { title: 'Contents', page: contentsPage }, ...sections], placements };
}
