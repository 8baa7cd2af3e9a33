/**
 * A texture drawing list (`renderTile`) as an SVG document: for the PDF swatch sheet, previews and
 * tests. Shared paths are written once in `<defs>` and placed with `<use>`.
 */
import type { Path, TileDrawing } from './render';

function n(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toFixed(3).replace(/0+$/, '').replace(/\.$/, '');
}

/** SVG path data (`d`) of a drawing-list path. */
export function svgPathData(path: Path): string {
  let s = '';
  for (const c of path) {
    switch (c.op) {
      case 'moveTo':
        s += `M${n(c.x)} ${n(c.y)}`;
        break;
      case 'lineTo':
        s += `L${n(c.x)} ${n(c.y)}`;
        break;
      case 'bezierCurveTo':
        s += `C${n(c.cp1x)} ${n(c.cp1y)} ${n(c.cp2x)} ${n(c.cp2y)} ${n(c.x)} ${n(c.y)}`;
        break;
      case 'closePath':
        s += 'Z';
        break;
    }
  }
  return s;
}

export interface TileSvgOptions {
  /** Output width and height attributes, e.g. `'24mm'` for true size; default the tile px. */
  width?: string;
  height?: string;
}

/**
 * The tile as a standalone SVG document (viewBox in tile px, clipped to the tile). Pass `width` and
 * `height` in mm (`drawing.widthCm × 10`) to print it at true size.
 */
export function drawingToSvg(drawing: TileDrawing, options: TileSvgOptions = {}): string {
  const ids = new Map<Path, string>();
  const defs: string[] = [];
  const body: string[] = [];
  for (const item of drawing.items) {
    let id = ids.get(item.path);
    if (!id) {
      id = `p${ids.size}`;
      ids.set(item.path, id);
      defs.push(`<path id="${id}" d="${svgPathData(item.path)}"/>`);
    }
    for (const p of item.paints) {
      const x = item.x + (p.dx ?? 0);
      const y = item.y + (p.dy ?? 0);
      const attrs = [
        `href="#${id}"`,
        x !== 0 ? `x="${n(x)}"` : '',
        y !== 0 ? `y="${n(y)}"` : '',
        `fill="${p.fill ?? 'none'}"`,
        p.stroke !== undefined ? `stroke="${p.stroke}" stroke-width="${n(p.width ?? 1)}"` : '',
        p.alpha !== undefined && p.alpha !== 1 ? `opacity="${n(p.alpha)}"` : '',
      ].filter(Boolean);
      body.push(`<use ${attrs.join(' ')}/>`);
    }
  }
  const w = n(drawing.widthPx);
  const h = n(drawing.heightPx);
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${options.width ?? w}" height="${options.height ?? h}" ` +
    `viewBox="0 0 ${w} ${h}">` +
    `<defs>${defs.join('')}<clipPath id="tile"><rect width="${w}" height="${h}"/></clipPath></defs>` +
    `<g clip-path="url(#tile)" stroke-linecap="round" stroke-linejoin="round">${body.join('')}</g></svg>`
  );
}
