/**
 * What lies under a screen point. Handles are tested in screen pixels (so they stay easy to
 * grab at any zoom); zone interiors in stitch space.
 */
import type { ScreenPoint } from '@/lib/knit/panel';
import { layoutOf, panelAtScreen, screenToStitch, stitchToScreen, type PanelLayout } from './camera';
import { findZone, zonesInDrawOrder } from './document';
import { closestPointOnSegment, pointInPolygon } from './geometry';
import type { EditorState, HitTarget } from './types';

/** Radius within which a vertex handle is grabbed, in screen pixels. */
export const handleRadiusPx = 6;
/** Distance within which an edge of a selected zone is hit, in screen pixels. */
export const edgeTolerancePx = 4;

function distancePx(a: ScreenPoint, b: ScreenPoint): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

/** The nearest vertex of a polygon within `radius` px of the screen point, or -1. */
function nearestVertex(layout: PanelLayout, polygon: readonly { x: number; y: number }[], s: ScreenPoint, radius: number): number {
  let best = -1;
  let bestD = radius;
  polygon.forEach((p, i) => {
    const d = distancePx(stitchToScreen(layout, p), s);
    if (d <= bestD) {
      best = i;
      bestD = d;
    }
  });
  return best;
}

/**
 * The topmost thing under a screen point: a vertex handle of a selected zone, a cut-outline
 * point (while outline editing is on), an edge of a selected zone, a zone, a panel, or null.
 */
export function hitTest(state: EditorState, s: ScreenPoint): HitTarget | null {
  const layouts = layoutOf(state);
  const layoutById = new Map(layouts.map((l) => [l.panelId, l]));

  for (const zoneId of state.selection.zoneIds) {
    const ref = findZone(state.doc, zoneId);
    const layout = ref && layoutById.get(ref.panel.id);
    if (!ref || !layout) continue;
    const index = nearestVertex(layout, ref.zone.polygon, s, handleRadiusPx);
    if (index >= 0) return { kind: 'vertex', panelId: ref.panel.id, zoneId, index };
  }

  if (state.editOutline) {
    for (const panel of state.doc.panels) {
      const layout = layoutById.get(panel.id);
      if (!layout) continue;
      const index = nearestVertex(layout, panel.cutOutline, s, handleRadiusPx);
      if (index >= 0) return { kind: 'outline-vertex', panelId: panel.id, index };
    }
  }

  for (const zoneId of state.selection.zoneIds) {
    const ref = findZone(state.doc, zoneId);
    const layout = ref && layoutById.get(ref.panel.id);
    if (!ref || !layout) continue;
    const poly = ref.zone.polygon;
    for (let i = 0; i < poly.length; i++) {
      const a = stitchToScreen(layout, poly[i]!);
      const b = stitchToScreen(layout, poly[(i + 1) % poly.length]!);
      const c = closestPointOnSegment(s, a, b);
      if (distancePx(c, s) <= edgeTolerancePx) {
        return { kind: 'edge', panelId: ref.panel.id, zoneId, index: i, point: screenToStitch(layout, c) };
      }
    }
  }

  const layout = panelAtScreen(layouts, s);
  if (!layout) return null;
  const panel = state.doc.panels.find((p) => p.id === layout.panelId);
  if (!panel) return null;
  const point = screenToStitch(layout, s);
  const zones = zonesInDrawOrder(panel);
  for (let i = zones.length - 1; i >= 0; i--) {
    const zone = zones[i]!;
    if (pointInPolygon(point, zone.polygon)) return { kind: 'zone', panelId: panel.id, zoneId: zone.id };
  }
  return { kind: 'panel', panelId: panel.id, point };
}

/** Ids of the zones whose bounding boxes lie wholly inside a screen rectangle. */
export function zonesInScreenRect(state: EditorState, a: ScreenPoint, b: ScreenPoint): string[] {
  const minX = Math.min(a.x, b.x);
  const maxX = Math.max(a.x, b.x);
  const minY = Math.min(a.y, b.y);
  const maxY = Math.max(a.y, b.y);
  const out: string[] = [];
  const layouts = layoutOf(state);
  state.doc.panels.forEach((panel, i) => {
    const layout = layouts[i];
    if (!layout) return;
    for (const zone of panel.zones) {
      const inside = zone.polygon.every((p) => {
        const q = stitchToScreen(layout, p);
        return q.x >= minX && q.x <= maxX && q.y >= minY && q.y <= maxY;
      });
      if (inside && zone.polygon.length > 0) out.push(zone.id);
    }
  });
  return out;
}
