/** Zoom tool: a click zooms in two times at the cursor, Alt+click zooms out. */
import { zoomCameraAt } from '../../camera';
import type { StateHandlers, ToolStateOf } from '../tool';

type ZoomIdle = ToolStateOf<'zoom', 'idle'>;

/** Handlers of the zoom tool. */
export const zoomIdle: StateHandlers<ZoomIdle> = {
  pointerDown(host, _s, e) {
    if ((e.button ?? 0) !== 0) return;
    host.setCamera(zoomCameraAt(host.state.camera, e.screen, e.alt ? 0.5 : 2));
  },
};
