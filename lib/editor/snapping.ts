/**
 * Snapping and clamping in stitch space. The needle grid puts points on whole needles and
 * courses; repeat snapping puts them on the lattice of the zone's texture repeat, counted from
 * the panel's top-left corner (where the raster starts tiling), so a zone drawn with it covers
 * whole repeats.
 */
import type { Panel, StitchPoint, StitchPolygon } from '@/lib/knit/panel';
import type { StitchBounds } from './geometry';
import type { Snapping, TextureLookup } from './types';

/** A texture's repeat in needles × courses. */
export interface RepeatSize {
  needles: number;
  courses: number;
}

/** Needle-grid snapping on, repeat snapping off. */
export const defaultSnapping: Snapping = { needleGrid: true, wholeRepeats: false };

/** The repeat of a texture from the lookup, or null when unknown or degenerate. */
export function repeatOf(textures: TextureLookup, textureId: string | null | undefined): RepeatSize | null {
  if (!textureId) return null;
  const t = textures[textureId];
  if (!t || !(t.repeatNeedles >= 1) || !(t.repeatCourses >= 1)) return null;
  return { needles: t.repeatNeedles, courses: t.repeatCourses };
}

/**
 * A point snapped as the settings ask: to the repeat lattice when repeat snapping is on and
 * the repeat is known, else to whole needles/courses when the needle grid is on, else as is.
 */
export function snapPoint(p: StitchPoint, snapping: Snapping, repeat: RepeatSize | null): StitchPoint {
  if (snapping.wholeRepeats && repeat) {
    return { x: Math.round(p.x / repeat.needles) * repeat.needles, y: Math.round(p.y / repeat.courses) * repeat.courses };
  }
  if (snapping.needleGrid) return { x: Math.round(p.x), y: Math.round(p.y) };
  return { x: p.x, y: p.y };
}

/** A move (needles, courses) snapped: whole repeats, whole stitches, or free, as for `snapPoint`. */
export function snapDelta(dx: number, dy: number, snapping: Snapping, repeat: RepeatSize | null): { dx: number; dy: number } {
  const p = snapPoint({ x: dx, y: dy }, snapping, repeat);
  return { dx: p.x, dy: p.y };
}

/** A point held inside the panel's bounds [0, width] × [0, height]. */
export function clampPointToPanel(p: StitchPoint, panel: Panel): StitchPoint {
  return {
    x: Math.min(Math.max(p.x, 0), panel.widthNeedles),
    y: Math.min(Math.max(p.y, 0), panel.heightCourses),
  };
}

/** A polygon with every vertex held inside the panel's bounds. */
export function clampPolygonToPanel(polygon: readonly StitchPoint[], panel: Panel): StitchPolygon {
  return polygon.map((p) => clampPointToPanel(p, panel));
}

/** A move cut short so that a shape with these bounds stays inside the panel. */
export function clampDeltaToPanel(bounds: StitchBounds, dx: number, dy: number, panel: Panel): { dx: number; dy: number } {
  const lowX = -bounds.minX;
  const highX = panel.widthNeedles - bounds.maxX;
  const lowY = -bounds.minY;
  const highY = panel.heightCourses - bounds.maxY;
  return {
    dx: lowX > highX ? lowX : Math.min(Math.max(dx, lowX), highX),
    dy: lowY > highY ? lowY : Math.min(Math.max(dy, lowY), highY),
  };
}
