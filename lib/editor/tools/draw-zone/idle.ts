/** Draw zone tool, idle: shows the snapped point under the cursor; a press starts a polygon. */
import { layoutOf, panelAtScreen, screenToStitch } from '../../camera';
import { findPanel } from '../../document';
import { clampPointToPanel, repeatOf, snapPoint } from '../../snapping';
import type { EditorState } from '../../types';
import type { ScreenPoint, StitchPoint } from '@/lib/knit/panel';
import type { StateHandlers, ToolStateOf } from '../tool';

type DrawIdle = ToolStateOf<'draw-zone', 'idle'>;

/** The texture a zone being drawn on this panel will get (it sets the repeat snapping). */
export function drawTextureId(state: EditorState, panelId: string): string | null {
  return state.drawDefaults.textureId ?? findPanel(state.doc, panelId)?.baseTextureId ?? null;
}

/** The snapped, clamped stitch point of a panel under a screen point (outside points are pulled in). */
export function drawPointOn(state: EditorState, panelId: string, screen: ScreenPoint): StitchPoint | null {
  const layout = layoutOf(state).find((l) => l.panelId === panelId);
  const panel = findPanel(state.doc, panelId);
  if (!layout || !panel) return null;
  const repeat = repeatOf(state.textures, drawTextureId(state, panelId));
  return clampPointToPanel(snapPoint(screenToStitch(layout, screen), state.snapping, repeat), panel);
}

/** Handlers of the draw zone tool before the first point. */
export const drawIdle: StateHandlers<DrawIdle> = {
  pointerMove(host, s, e) {
    const layout = panelAtScreen(layoutOf(host.state), e.screen);
    const hover = layout ? drawPointOn(host.state, layout.panelId, e.screen) : null;
    const hoverPanelId = layout?.panelId ?? null;
    if (hoverPanelId === s.hoverPanelId && hover?.x === s.hover?.x && hover?.y === s.hover?.y) return;
    host.setTool({ ...s, hover, hoverPanelId });
  },

  pointerDown(host, _s, e) {
    if ((e.button ?? 0) !== 0 || host.state.readOnly) return;
    const layout = panelAtScreen(layoutOf(host.state), e.screen);
    if (!layout) return;
    const p = drawPointOn(host.state, layout.panelId, e.screen);
    if (!p) return;
    host.notice(null);
    host.setTool({ tool: 'draw-zone', state: 'drawing', panelId: layout.panelId, points: [p], hover: p, overFirst: false, problem: null });
  },
};
