/** Pan tool, idle: a press with the primary button starts panning. */
import type { StateHandlers, ToolStateOf } from '../tool';

type PanIdle = ToolStateOf<'pan', 'idle'>;

/** Handlers of the pan tool at rest. */
export const panIdle: StateHandlers<PanIdle> = {
  pointerDown(host, _s, e) {
    if ((e.button ?? 0) !== 0) return;
    host.setTool({ tool: 'pan', state: 'panning', last: e.screen });
  },
};
