/** Pan tool, dragging: the camera follows the pointer. Camera moves are not recorded in history. */
import { panCamera } from '../../camera';
import type { StateHandlers, ToolStateOf } from '../tool';

type Panning = ToolStateOf<'pan', 'panning'>;

/** Handlers of the pan tool while dragging. */
export const panPanning: StateHandlers<Panning> = {
  pointerMove(host, s, e) {
    host.setCamera(panCamera(host.state.camera, e.screen.x - s.last.x, e.screen.y - s.last.y));
    host.setTool({ ...s, last: e.screen });
  },

  pointerUp(host) {
    host.setTool({ tool: 'pan', state: 'idle' });
  },

  cancel(host) {
    host.setTool({ tool: 'pan', state: 'idle' });
  },
};
