/**
 * Plane geometry on stitch-space polygons, as the editor needs it. Area, simplicity, mirroring
 * and copying between panels come from the stitch raster module; the hit-testing and drawing
 * helpers the editor alone uses are here.
 */
import type { StitchPoint, StitchPolygon } from '@/lib/knit/panel';

export { copyZoneToPanel, isSimplePolygon, mirrorZone, polygonArea, signedPolygonArea } from '@/lib/knit/raster';
export type { ZoneCopyMode } from '@/lib/knit/raster';

export interface StitchBounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Sign of the turn a → b → c: 1 left, -1 right, 0 collinear (y-down axes flip the meaning). */
function orientation(a: StitchPoint, b: StitchPoint, c: StitchPoint): number {
  const v = (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
  const eps = 1e-9;
  return v > eps ? 1 : v < -eps ? -1 : 0;
}

function withinBox(a: StitchPoint, b: StitchPoint, p: StitchPoint): boolean {
  return (
    p.x <= Math.max(a.x, b.x) + 1e-9 &&
    p.x >= Math.min(a.x, b.x) - 1e-9 &&
    p.y <= Math.max(a.y, b.y) + 1e-9 &&
    p.y >= Math.min(a.y, b.y) - 1e-9
  );
}

/** Whether segments ab and cd share any point (touching and collinear overlap count). */
export function segmentsIntersect(a: StitchPoint, b: StitchPoint, c: StitchPoint, d: StitchPoint): boolean {
  const o1 = orientation(a, b, c);
  const o2 = orientation(a, b, d);
  const o3 = orientation(c, d, a);
  const o4 = orientation(c, d, b);
  if (o1 !== o2 && o3 !== o4) return true;
  if (o1 === 0 && withinBox(a, b, c)) return true;
  if (o2 === 0 && withinBox(a, b, d)) return true;
  if (o3 === 0 && withinBox(c, d, a)) return true;
  if (o4 === 0 && withinBox(c, d, b)) return true;
  return false;
}

/** Adjacent edges ab, bc fold back onto each other (collinear and reversing). */
function foldsBack(a: StitchPoint, b: StitchPoint, c: StitchPoint): boolean {
  if (orientation(a, b, c) !== 0) return false;
  return (b.x - a.x) * (c.x - b.x) + (b.y - a.y) * (c.y - b.y) < 0;
}

function samePoint(a: StitchPoint, b: StitchPoint): boolean {
  return Math.abs(a.x - b.x) < 1e-9 && Math.abs(a.y - b.y) < 1e-9;
}

/**
 * Whether an open chain of points (a polygon being drawn) crosses itself: any two non-adjacent
 * segments touching, or an adjacent pair folding back.
 */
export function chainCrossesItself(points: readonly StitchPoint[]): boolean {
  const m = points.length - 1; // segments
  for (let i = 0; i < m; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    if (samePoint(a, b)) return true;
    if (i + 2 <= m && foldsBack(a, b, points[i + 2]!)) return true;
    for (let j = i + 2; j < m; j++) {
      if (segmentsIntersect(a, b, points[j]!, points[j + 1]!)) return true;
    }
  }
  return false;
}

/** Even-odd point-in-polygon test by ray casting. Points on an edge may land either way. */
export function pointInPolygon(p: StitchPoint, polygon: readonly StitchPoint[]): boolean {
  let inside = false;
  const n = polygon.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const a = polygon[i]!;
    const b = polygon[j]!;
    if (a.y > p.y !== b.y > p.y && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) {
      inside = !inside;
    }
  }
  return inside;
}

/** The axis-aligned bounding box of a polygon, in needles and courses. */
export function polygonBounds(polygon: readonly StitchPoint[]): StitchBounds {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of polygon) {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  }
  return { minX, minY, maxX, maxY };
}

/** A polygon moved by (dx needles, dy courses). */
export function translatePolygon(polygon: readonly StitchPoint[], dx: number, dy: number): StitchPolygon {
  return polygon.map((p) => ({ x: p.x + dx, y: p.y + dy }));
}

/** The point of segment ab nearest to p, with its parameter t in [0, 1]. */
export function closestPointOnSegment(
  p: { x: number; y: number },
  a: { x: number; y: number },
  b: { x: number; y: number },
): { x: number; y: number; t: number } {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  return { x: a.x + t * dx, y: a.y + t * dy, t };
}
