/**
 * Panel layout and the camera: how stitch space maps to screen pixels.
 *
 * Panels are laid side by side, top edges aligned, in centimetres of relaxed fabric with a gap
 * between them. A panel's needle is 1 / walesPerCm cm wide and its course 1 / coursesPerCm cm
 * tall (stitches are not square), so each panel has its own x and y scale on screen:
 *   screen.x = origin.x + needles × pxPerCm / walesPerCm
 *   screen.y = origin.y + courses × pxPerCm / coursesPerCm
 */
import type { Panel, ScreenPoint, StitchPoint } from '@/lib/knit/panel';
import type { Camera, EditorState, StitchDensity, TextureLookup, Viewport } from './types';
import type { StitchBounds } from './geometry';

/** Density used when a panel's base texture is not in the lookup (a fine-gauge plain jersey). */
export const fallbackDensity: StitchDensity = { walesPerCm: 16, coursesPerCm: 22 };

/** The zoom range, in screen pixels per cm of fabric. */
export const zoomLimits = { minPxPerCm: 0.5, maxPxPerCm: 2000 } as const;

/** Where one panel lands on screen under the current camera. */
export interface PanelLayout {
  panelId: string;
  /** Screen position of the panel's stitch origin (needle 0, course 0: its top-left corner). */
  origin: ScreenPoint;
  /** Width of one needle (wale) on screen. */
  pxPerNeedle: number;
  /** Height of one course on screen. */
  pxPerCourse: number;
  widthPx: number;
  heightPx: number;
  density: StitchDensity;
  /** The panel's left edge in cm from the layout origin. */
  leftCm: number;
  widthCm: number;
  heightCm: number;
}

/** A panel's stitch density: its base texture's relaxed density, or the fallback. */
export function panelDensity(panel: Panel, textures: TextureLookup): StitchDensity {
  const t = textures[panel.baseTextureId];
  if (t && t.walesPerCm > 0 && t.coursesPerCm > 0) return { walesPerCm: t.walesPerCm, coursesPerCm: t.coursesPerCm };
  return fallbackDensity;
}

/**
 * Each panel's screen origin and scale: panels side by side from the layout origin, `gapCm`
 * apart, at `camera.pxPerCm`, shifted by `camera.pan`.
 */
export function layoutPanels(
  panels: readonly Panel[],
  camera: Camera,
  textures: TextureLookup,
  gapCm: number,
): PanelLayout[] {
  const out: PanelLayout[] = [];
  let leftCm = 0;
  for (const panel of panels) {
    const density = panelDensity(panel, textures);
    const widthCm = panel.widthNeedles / density.walesPerCm;
    const heightCm = panel.heightCourses / density.coursesPerCm;
    const pxPerNeedle = camera.pxPerCm / density.walesPerCm;
    const pxPerCourse = camera.pxPerCm / density.coursesPerCm;
    out.push({
      panelId: panel.id,
      origin: { x: camera.pan.x + leftCm * camera.pxPerCm, y: camera.pan.y },
      pxPerNeedle,
      pxPerCourse,
      widthPx: panel.widthNeedles * pxPerNeedle,
      heightPx: panel.heightCourses * pxPerCourse,
      density,
      leftCm,
      widthCm,
      heightCm,
    });
    leftCm += widthCm + gapCm;
  }
  return out;
}

const layoutCache = new WeakMap<EditorState, PanelLayout[]>();

/** The layout of an editor state's panels (cached per state). */
export function layoutOf(state: EditorState): PanelLayout[] {
  let layout = layoutCache.get(state);
  if (!layout) {
    layout = layoutPanels(state.doc.panels, state.camera, state.textures, state.panelGapCm);
    layoutCache.set(state, layout);
  }
  return layout;
}

/** One panel's layout by id, or null. */
export function panelLayout(state: EditorState, panelId: string): PanelLayout | null {
  return layoutOf(state).find((l) => l.panelId === panelId) ?? null;
}

/** A stitch-space point of a panel in screen pixels. */
export function stitchToScreen(layout: PanelLayout, p: StitchPoint): ScreenPoint {
  return { x: layout.origin.x + p.x * layout.pxPerNeedle, y: layout.origin.y + p.y * layout.pxPerCourse };
}

/** A screen point in a panel's stitch space (may fall outside the panel). */
export function screenToStitch(layout: PanelLayout, s: ScreenPoint): StitchPoint {
  return { x: (s.x - layout.origin.x) / layout.pxPerNeedle, y: (s.y - layout.origin.y) / layout.pxPerCourse };
}

/** The panel whose rectangle contains the screen point, or null over the gaps and margins. */
export function panelAtScreen(layouts: readonly PanelLayout[], s: ScreenPoint): PanelLayout | null {
  for (const l of layouts) {
    if (s.x >= l.origin.x && s.x <= l.origin.x + l.widthPx && s.y >= l.origin.y && s.y <= l.origin.y + l.heightPx) {
      return l;
    }
  }
  return null;
}

/** A zoom level held inside the limits. */
export function clampZoom(pxPerCm: number): number {
  return Math.min(Math.max(pxPerCm, zoomLimits.minPxPerCm), zoomLimits.maxPxPerCm);
}

/**
 * The camera zoomed by `factor` about a screen point, which keeps the fabric under that point
 * where it is: with world point w = (s − pan) / z, the new pan is s − w × z′.
 */
export function zoomCameraAt(camera: Camera, screen: ScreenPoint, factor: number): Camera {
  const pxPerCm = clampZoom(camera.pxPerCm * factor);
  if (pxPerCm === camera.pxPerCm) return camera;
  const k = pxPerCm / camera.pxPerCm;
  return {
    pxPerCm,
    pan: { x: screen.x - (screen.x - camera.pan.x) * k, y: screen.y - (screen.y - camera.pan.y) * k },
  };
}

/** The camera moved by a screen-pixel offset. */
export function panCamera(camera: Camera, dxPx: number, dyPx: number): Camera {
  if (dxPx === 0 && dyPx === 0) return camera;
  return { ...camera, pan: { x: camera.pan.x + dxPx, y: camera.pan.y + dyPx } };
}

/** The zoom factor for a wheel movement: a 300 px scroll halves or doubles the scale. */
export function wheelZoomFactor(deltaY: number): number {
  return Math.pow(2, -deltaY / 300);
}

/** Room kept free around the panels, in pixels, on each side. */
export type Margins = { top: number; right: number; bottom: number; left: number };

/**
 * The body map's room around the panels when fitting: each panel's name and needle ruler sit above
 * it, its course ruler to its left, so more is kept free there than below and to the right.
 */
export const panelChromeMargins: Margins = { top: 52, right: 24, bottom: 24, left: 56 };

/**
 * The camera that shows every panel whole and centred in the viewport less its margins
 * (pixels: one number for every side, or one per side).
 */
export function fitCamera(
  panels: readonly Panel[],
  textures: TextureLookup,
  gapCm: number,
  viewport: Viewport,
  margin: number | Margins = panelChromeMargins,
): Camera {
  const m: Margins = typeof margin === 'number' ? { top: margin, right: margin, bottom: margin, left: margin } : margin;
  const unit = layoutPanels(panels, { pxPerCm: 1, pan: { x: 0, y: 0 } }, textures, gapCm);
  const last = unit[unit.length - 1];
  if (!last) return { pxPerCm: 10, pan: { x: m.left, y: m.top } };
  const widthCm = last.leftCm + last.widthCm;
  const heightCm = Math.max(...unit.map((l) => l.heightCm));
  const availW = Math.max(1, viewport.widthPx - m.left - m.right);
  const availH = Math.max(1, viewport.heightPx - m.top - m.bottom);
  const pxPerCm = clampZoom(Math.min(availW / widthCm, availH / heightCm));
  return {
    pxPerCm,
    pan: { x: m.left + (availW - widthCm * pxPerCm) / 2, y: m.top + (availH - heightCm * pxPerCm) / 2 },
  };
}

/**
 * The camera that brings a place on a panel into view: a stitch point, or a box of stitches
 * (`StitchBounds`), centred in the viewport. The zoom is kept unless the box would not fit inside
 * the viewport less `marginPx` on every side; then it zooms out just enough (never in). The same
 * camera when the panel is unknown.
 */
export function centreOn(
  state: Pick<EditorState, 'doc' | 'camera' | 'textures' | 'panelGapCm' | 'viewport'>,
  panelId: string,
  place: StitchPoint | StitchBounds,
  marginPx = 32,
): Camera {
  const unit = layoutPanels(state.doc.panels, { pxPerCm: 1, pan: { x: 0, y: 0 } }, state.textures, state.panelGapCm);
  const l = unit.find((u) => u.panelId === panelId);
  if (!l) return state.camera;
  const b: StitchBounds = 'minX' in place ? place : { minX: place.x, minY: place.y, maxX: place.x, maxY: place.y };
  // In cm from the layout origin (the unit layout is 1 px per cm).
  const x0 = l.leftCm + b.minX / l.density.walesPerCm;
  const x1 = l.leftCm + b.maxX / l.density.walesPerCm;
  const y0 = b.minY / l.density.coursesPerCm;
  const y1 = b.maxY / l.density.coursesPerCm;
  const availW = Math.max(1, state.viewport.widthPx - 2 * marginPx);
  const availH = Math.max(1, state.viewport.heightPx - 2 * marginPx);
  let pxPerCm = state.camera.pxPerCm;
  if (x1 - x0 > 0) pxPerCm = Math.min(pxPerCm, availW / (x1 - x0));
  if (y1 - y0 > 0) pxPerCm = Math.min(pxPerCm, availH / (y1 - y0));
  pxPerCm = clampZoom(pxPerCm);
  const cx = (x0 + x1) / 2;
  const cy = (y0 + y1) / 2;
  return { pxPerCm, pan: { x: state.viewport.widthPx / 2 - cx * pxPerCm, y: state.viewport.heightPx / 2 - cy * pxPerCm } };
}
