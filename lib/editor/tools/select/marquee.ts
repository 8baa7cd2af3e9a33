/** Select tool, pressed on empty space: a drag draws a rectangle that selects the zones inside it. */
import { zonesInScreenRect } from '../../hit-test';
import { pastDragThreshold, zoneSelection, type StateHandlers, type ToolStateOf } from '../tool';

type Marquee = ToolStateOf<'select', 'marquee'>;

/** Handlers of the select tool while a marquee is drawn. */
export const selectMarquee: StateHandlers<Marquee> = {
  pointerMove(host, s, e) {
    const active = s.active || pastDragThreshold(s.downAt, e.screen);
    host.setTool({ ...s, current: e.screen, active });
    if (!active) return;
    const inside = zonesInScreenRect(host.state, s.downAt, e.screen);
    const ids = s.additive ? [...s.before, ...inside.filter((id) => !s.before.includes(id))] : inside;
    host.setSelection(zoneSelection(ids));
  },

  pointerUp(host) {
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },

  keyDown(host, s, e) {
    if (e.key !== 'Escape') return false;
    selectMarquee.cancel?.(host, s);
    return true;
  },

  cancel(host, s) {
    host.setSelection(zoneSelection(s.before));
    host.setTool({ tool: 'select', state: 'idle', hover: null });
  },
};
