/** Select tool, pressed on a zone: a click settles the selection, a drag starts moving. */
import type { StitchPolygon } from '@/lib/knit/panel';
import { findZone } from '../../document';
import { pastDragThreshold, zoneSelection, type StateHandlers, type ToolStateOf } from '../tool';
import { selectTranslating } from './translating';

type PointingZone = ToolStateOf<'select', 'pointing-zone'>;

/** Handlers of the select tool while pressed on a zone, before it is a drag. */
export const selectPointingZone: StateHandlers<PointingZone> = {
  pointerMove(host, s, e) {
    if (!pastDragThreshold(s.downAt, e.screen)) return;
    const state = host.state;
    if (s.toggledOff || state.readOnly) return;
    const start: Record<string, StitchPolygon> = {};
    for (const id of state.selection.zoneIds) {
      const ref = findZone(state.doc, id);
      if (ref) start[id] = ref.zone.polygon;
    }
    host.beginGesture('Move zone');
    const translating = { tool: 'select', state: 'translating', downAt: s.downAt, start, anchorZoneId: s.zoneId } as const;
    host.setTool(translating);
    selectTranslating.pointerMove?.(host, translating, e);
  },

  pointerUp(host, s) {
    const sel = host.state.selection;
    // A plain click on a zone of a multiple selection narrows the selection to it.
    if (!s.shift && sel.zoneIds.length > 1 && sel.zoneIds.includes(s.zoneId)) {
      host.setSelection(zoneSelection([s.zoneId]));
    }
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },

  keyDown(host, _s, e) {
    if (e.key !== 'Escape') return false;
    host.setTool({ tool: 'select', state: 'idle', hover: null });
    return true;
  },
};
