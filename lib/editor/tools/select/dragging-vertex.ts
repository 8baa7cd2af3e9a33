/** Select tool, dragging one vertex of a zone: snapped, held in the panel, never crossing edges. */
import { panelLayout, screenToStitch } from '../../camera';
import { setZonePolygons } from '../../commands';
import { findZone } from '../../document';
import { clampPointToPanel, repeatOf, snapPoint } from '../../snapping';
import type { StateHandlers, ToolStateOf } from '../tool';

type DraggingVertex = ToolStateOf<'select', 'dragging-vertex'>;

/** Handlers of the select tool while a vertex is dragged. */
export const selectDraggingVertex: StateHandlers<DraggingVertex> = {
  pointerMove(host, s, e) {
    const state = host.state;
    const ref = findZone(state.doc, s.zoneId);
    const layout = ref && panelLayout(state, ref.panel.id);
    if (!ref || !layout) return;
    const p = clampPointToPanel(
      snapPoint(screenToStitch(layout, e.screen), state.snapping, repeatOf(state.textures, ref.zone.textureId)),
      ref.panel,
    );
    const polygon = s.startPolygon.slice();
    polygon[s.index] = p;
    const current = ref.zone.polygon[s.index];
    if (current && current.x === p.x && current.y === p.y) return;
    // The zone keeps its last valid shape when this position would make edges cross.
    const changed = host.change('Move vertex', (doc) => setZonePolygons(doc, { [s.zoneId]: polygon }));
    host.notice(changed ? null : 'Edges would cross');
  },

  pointerUp(host) {
    host.endGesture();
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },

  keyDown(host, s, e) {
    if (e.key !== 'Escape') return false;
    selectDraggingVertex.cancel?.(host, s);
    return true;
  },

  cancel(host) {
    host.cancelGesture();
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },
};
