/** Select tool, dragging the selected zones: one history entry for the whole drag. */
import type { StitchPolygon } from '@/lib/knit/panel';
import { panelLayout } from '../../camera';
import { setZonePolygons, translateWithinPanel } from '../../commands';
import { findZone } from '../../document';
import { repeatOf, snapDelta } from '../../snapping';
import type { StateHandlers, ToolStateOf } from '../tool';

type Translating = ToolStateOf<'select', 'translating'>;

/** Handlers of the select tool while zones are dragged. */
export const selectTranslating: StateHandlers<Translating> = {
  pointerMove(host, s, e) {
    const state = host.state;
    const anchor = findZone(state.doc, s.anchorZoneId);
    const layout = anchor && panelLayout(state, anchor.panel.id);
    if (!anchor || !layout) return;
    const raw = { dx: (e.screen.x - s.downAt.x) / layout.pxPerNeedle, dy: (e.screen.y - s.downAt.y) / layout.pxPerCourse };
    const d = snapDelta(raw.dx, raw.dy, state.snapping, repeatOf(state.textures, anchor.zone.textureId));
    const polygons: Record<string, StitchPolygon> = {};
    for (const [id, startPolygon] of Object.entries(s.start)) {
      const ref = findZone(state.doc, id);
      if (ref) polygons[id] = translateWithinPanel(startPolygon, d.dx, d.dy, ref.panel);
    }
    host.change('Move zone', (doc) => setZonePolygons(doc, polygons));
  },

  pointerUp(host) {
    host.endGesture();
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },

  keyDown(host, s, e) {
    if (e.key !== 'Escape') return false;
    selectTranslating.cancel?.(host, s);
    return true;
  },

  cancel(host) {
    host.cancelGesture();
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },
};
