/** Select tool, dragging a point of a panel's cut outline (while cut-line editing is on). */
import { panelLayout, screenToStitch } from '../../camera';
import { setCutOutline } from '../../commands';
import { findPanel } from '../../document';
import { clampPointToPanel, snapPoint } from '../../snapping';
import type { StateHandlers, ToolStateOf } from '../tool';

type DraggingOutline = ToolStateOf<'select', 'dragging-outline'>;

/** Handlers of the select tool while a cut-outline point is dragged. */
export const selectDraggingOutline: StateHandlers<DraggingOutline> = {
  pointerMove(host, s, e) {
    const state = host.state;
    const panel = findPanel(state.doc, s.panelId);
    const layout = panelLayout(state, s.panelId);
    if (!panel || !layout) return;
    const p = clampPointToPanel(snapPoint(screenToStitch(layout, e.screen), state.snapping, null), panel);
    const current = panel.cutOutline[s.index];
    if (current && current.x === p.x && current.y === p.y) return;
    const outline = s.startOutline.slice();
    outline[s.index] = p;
    const changed = host.change('Move cut-line point', (doc) => setCutOutline(doc, s.panelId, outline));
    host.notice(changed ? null : 'Cut lines would cross');
  },

  pointerUp(host) {
    host.endGesture();
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },

  keyDown(host, s, e) {
    if (e.key !== 'Escape') return false;
    selectDraggingOutline.cancel?.(host, s);
    return true;
  },

  cancel(host) {
    host.cancelGesture();
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },
};
