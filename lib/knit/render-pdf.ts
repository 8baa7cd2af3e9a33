/**
 * Draws a texture drawing list (`renderTile`) as PDF paths, through the part of jsPDF's path API
 * listed in `PdfPathTarget` (so this module needs no PDF library of its own).
 *
 * Units: the caller sets up the target so that one unit is one tile px (jsPDF's advanced API inside
 * a form object does this: the form's matrix maps tile px to the page), so the paths are written in
 * tile px exactly as the drawing list gives them; the true physical size comes from the placement
 * matrix (mm per tile px = 10 ÷ pxPerCm).
 */
import type { DrawItem, Path, TileDrawing } from './render';

/** The part of jsPDF the adapter uses (jsPDF instances fit structurally). */
export interface PdfPathTarget {
  moveTo(x: number, y: number): unknown;
  lineTo(x: number, y: number): unknown;
  curveTo(x1: number, y1: number, x2: number, y2: number, x3: number, y3: number): unknown;
  close(): unknown;
  stroke(): unknown;
  fill(): unknown;
  setDrawColor(hex: string): unknown;
  setFillColor(hex: string): unknown;
  setLineWidth(width: number): unknown;
  setLineCap(style: 'round'): unknown;
  setLineJoin(style: 'round'): unknown;
  /** Sets fill and stroke opacity, 0–1 (an ExtGState in the PDF). */
  setOpacity(alpha: number): unknown;
}

function trace(t: PdfPathTarget, path: Path, ox: number, oy: number): void {
  for (const c of path) {
    switch (c.op) {
      case 'moveTo':
        t.moveTo(c.x + ox, c.y + oy);
        break;
      case 'lineTo':
        t.lineTo(c.x + ox, c.y + oy);
        break;
      case 'bezierCurveTo':
        t.curveTo(c.cp1x + ox, c.cp1y + oy, c.cp2x + ox, c.cp2y + oy, c.x + ox, c.y + oy);
        break;
      case 'closePath':
        t.close();
        break;
    }
  }
}

/**
 * Writes every item's paint passes in order, strokes with round caps and joins, as `drawTile` does
 * on a canvas. Colour, width and opacity are written only when they change. The caller clips to the
 * tile (a form object's bounding box does), since the edge stitches of the next repeats are drawn
 * beyond it. Returns the number of paint passes written.
 */
export function drawTileToPdf(target: PdfPathTarget, drawing: TileDrawing): number {
  target.setLineCap('round');
  target.setLineJoin('round');
  target.setOpacity(1);
  let stroke: string | undefined;
  let fill: string | undefined;
  let width = -1;
  let alpha = 1;
  let passes = 0;
  const paint = (item: DrawItem) => {
    for (const p of item.paints) {
      const a = p.alpha ?? 1;
      if (a !== alpha) target.setOpacity((alpha = a));
      const ox = item.x + (p.dx ?? 0);
      const oy = item.y + (p.dy ?? 0);
      if (p.fill !== undefined) {
        if (p.fill !== fill) target.setFillColor((fill = p.fill));
        trace(target, item.path, ox, oy);
        target.fill();
        passes++;
      }
      if (p.stroke !== undefined) {
        if (p.stroke !== stroke) target.setDrawColor((stroke = p.stroke));
        const w = p.width ?? 1;
        if (w !== width) target.setLineWidth((width = w));
        trace(target, item.path, ox, oy);
        target.stroke();
        passes++;
      }
    }
  };
  for (const item of drawing.items) paint(item);
  if (alpha !== 1) target.setOpacity(1);
  return passes;
}
