/**
 * Panel outlines from an uploaded SVG drawing. Only path geometry is kept: the first closed shape
 * (a <path>, <polygon> or <polyline>; the largest when there are several) becomes a polygon in
 * stitch space, scaled so its bounding box fills the panel. Nothing else of the file is read or
 * stored — no scripts, styles, links or embedded images survive, because none are ever kept.
 */
import type { StitchPoint, StitchPolygon } from './panel';
import { isSimplePolygon, polygonArea } from './raster';

export class OutlineError extends Error {}

export const svgOutlineLimits = { maxBytes: 1_000_000, maxVertices: 400, curveSegments: 12 } as const;

type Pt = { x: number; y: number };

function numbers(text: string): number[] {
  const out: number[] = [];
  for (const m of text.matchAll(/[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/g)) out.push(Number(m[0]));
  return out;
}

function cubic(p0: Pt, p1: Pt, p2: Pt, p3: Pt, n: number): Pt[] {
  const pts: Pt[] = [];
  for (let i = 1; i <= n; i++) {
    const t = i / n;
    const u = 1 - t;
    pts.push({
      x: u * u * u * p0.x + 3 * u * u * t * p1.x + 3 * u * t * t * p2.x + t * t * t * p3.x,
      y: u * u * u * p0.y + 3 * u * u * t * p1.y + 3 * u * t * t * p2.y + t * t * t * p3.y,
    });
  }
  return pts;
}

function quad(p0: Pt, p1: Pt, p2: Pt, n: number): Pt[] {
  const pts: Pt[] = [];
  for (let i = 1; i <= n; i++) {
    const t = i / n;
    const u = 1 - t;
    pts.push({ x: u * u * p0.x + 2 * u * t * p1.x + t * t * p2.x, y: u * u * p0.y + 2 * u * t * p1.y + t * t * p2.y });
  }
  return pts;
}

/** The first subpath of an SVG path's `d` as a polyline (curves sampled; arcs taken as straight lines). */
export function flattenPathData(d: string, segments: number = svgOutlineLimits.curveSegments): Pt[] {
  const tokens = [...d.matchAll(/([MmLlHhVvCcSsQqTtAaZz])([^MmLlHhVvCcSsQqTtAaZz]*)/g)];
  if (tokens.length === 0) throw new OutlineError('The path has no drawing commands.');
  const pts: Pt[] = [];
  let cur: Pt = { x: 0, y: 0 };
  let lastCtrl: Pt | null = null;
  let started = false;
  for (const [, cmd, args] of tokens) {
    const c = cmd!;
    const rel = c === c.toLowerCase();
    const n = numbers(args ?? '');
    const abs = (x: number, y: number): Pt => (rel ? { x: cur.x + x, y: cur.y + y } : { x, y });
    const C = c.toUpperCase();
    if (C === 'M') {
      if (started) break; // first subpath only
      for (let i = 0; i + 1 < n.length; i += 2) {
        cur = abs(n[i]!, n[i + 1]!);
        pts.push(cur);
      }
      started = true;
      lastCtrl = null;
      continue;
    }
    if (!started) throw new OutlineError('The path must start with a move (M).');
    if (C === 'Z') break;
    if (C === 'L' || C === 'T') {
      for (let i = 0; i + 1 < n.length; i += 2) { cur = abs(n[i]!, n[i + 1]!); pts.push(cur); }
      lastCtrl = null;
    } else if (C === 'H') {
      for (const v of n) { cur = { x: rel ? cur.x + v : v, y: cur.y }; pts.push(cur); }
      lastCtrl = null;
    } else if (C === 'V') {
      for (const v of n) { cur = { x: cur.x, y: rel ? cur.y + v : v }; pts.push(cur); }
      lastCtrl = null;
    } else if (C === 'C') {
      for (let i = 0; i + 5 < n.length; i += 6) {
        const p1 = abs(n[i]!, n[i + 1]!);
        const p2 = abs(n[i + 2]!, n[i + 3]!);
        const p3 = abs(n[i + 4]!, n[i + 5]!);
        pts.push(...cubic(cur, p1, p2, p3, segments));
        lastCtrl = p2;
        cur = p3;
      }
    } else if (C === 'S') {
      for (let i = 0; i + 3 < n.length; i += 4) {
        const p1 = lastCtrl ? { x: 2 * cur.x - lastCtrl.x, y: 2 * cur.y - lastCtrl.y } : cur;
        const p2 = abs(n[i]!, n[i + 1]!);
        const p3 = abs(n[i + 2]!, n[i + 3]!);
        pts.push(...cubic(cur, p1, p2, p3, segments));
        lastCtrl = p2;
        cur = p3;
      }
    } else if (C === 'Q') {
      for (let i = 0; i + 3 < n.length; i += 4) {
        const p1 = abs(n[i]!, n[i + 1]!);
        const p2 = abs(n[i + 2]!, n[i + 3]!);
        pts.push(...quad(cur, p1, p2, segments));
        cur = p2;
      }
      lastCtrl = null;
    } else if (C === 'A') {
      for (let i = 0; i + 6 < n.length; i += 7) { cur = abs(n[i + 5]!, n[i + 6]!); pts.push(cur); }
      lastCtrl = null;
    }
  }
  return pts;
}

function attr(tag: string, name: string): string | null {
  const m = tag.match(new RegExp(`\\s${name}\\s*=\\s*("([^"]*)"|'([^']*)')`, 'i'));
  return m ? (m[2] ?? m[3] ?? '') : null;
}

/** Every shape of the drawing as a polyline, in document units. */
export function shapesOfSvg(svg: string): Pt[][] {
  const shapes: Pt[][] = [];
  for (const m of svg.matchAll(/<(path|polygon|polyline)\b[^>]*>/gi)) {
    const tag = m[0];
    const kind = m[1]!.toLowerCase();
    if (kind === 'path') {
      const d = attr(tag, 'd');
      if (d) shapes.push(flattenPathData(d));
    } else {
      const n = numbers(attr(tag, 'points') ?? '');
      const pts: Pt[] = [];
      for (let i = 0; i + 1 < n.length; i += 2) pts.push({ x: n[i]!, y: n[i + 1]! });
      shapes.push(pts);
    }
  }
  return shapes;
}

/** Keeps every k-th point so that at most `max` remain (the first point always stays). */
function decimate(pts: StitchPoint[], max: number): StitchPoint[] {
  if (pts.length <= max) return pts;
  const step = pts.length / max;
  const out: StitchPoint[] = [];
  for (let i = 0; i < max; i++) out.push(pts[Math.floor(i * step)]!);
  return out;
}

/**
 * The outline of an SVG drawing scaled to a panel of `widthNeedles` × `heightCourses`: the shape's
 * bounding box maps onto the whole panel, vertices on whole stitches. Throws `OutlineError` with a
 * sentence a designer can act on.
 */
export function outlineFromSvg(svg: string, panel: { widthNeedles: number; heightCourses: number }): StitchPolygon {
  if (svg.length > svgOutlineLimits.maxBytes) throw new OutlineError('The drawing is larger than 1 MB.');
  const head = svg.trimStart().slice(0, 2000);
  if (!/^(<\?xml[^>]*>\s*)?(<!--[\s\S]*?-->\s*)*<svg[\s>]/i.test(head)) {
    throw new OutlineError('This is not an SVG drawing (it must start with <svg>).');
  }
  if (/<!DOCTYPE|<!ENTITY/i.test(svg)) throw new OutlineError('SVG files with a DOCTYPE or entities are refused.');
  const shapes = shapesOfSvg(svg).filter((s) => s.length >= 3);
  if (shapes.length === 0) throw new OutlineError('The drawing has no path, polygon or polyline with at least 3 points.');
  const best = shapes.reduce((a, b) => (polygonArea(b) > polygonArea(a) ? b : a));
  if (!best.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y))) throw new OutlineError('The outline has coordinates that are not numbers.');
  const minX = Math.min(...best.map((p) => p.x));
  const maxX = Math.max(...best.map((p) => p.x));
  const minY = Math.min(...best.map((p) => p.y));
  const maxY = Math.max(...best.map((p) => p.y));
  if (!(maxX > minX && maxY > minY)) throw new OutlineError('The outline has no area.');
  const sx = panel.widthNeedles / (maxX - minX);
  const sy = panel.heightCourses / (maxY - minY);
  const scaled: StitchPoint[] = [];
  for (const p of best) {
    const q = { x: Math.round((p.x - minX) * sx), y: Math.round((p.y - minY) * sy) };
    const last = scaled[scaled.length - 1];
    if (!last || last.x !== q.x || last.y !== q.y) scaled.push(q);
  }
  const first = scaled[0];
  const last = scaled[scaled.length - 1];
  if (first && last && scaled.length > 1 && first.x === last.x && first.y === last.y) scaled.pop();
  const polygon = decimate(scaled, svgOutlineLimits.maxVertices);
  if (polygon.length < 3) throw new OutlineError('The outline collapses to fewer than 3 stitches at this panel size.');
  if (!isSimplePolygon(polygon)) throw new OutlineError('The outline crosses itself; draw it as one closed shape without loops.');
  return polygon;
}
