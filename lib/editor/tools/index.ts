/** Routes an event to the handler of the active tool state. */
import type { KeyInput, PointerInput, ToolId, ToolState } from '../types';
import { drawDrawing } from './draw-zone/drawing';
import { drawIdle } from './draw-zone/idle';
import { panIdle } from './pan/idle';
import { panPanning } from './pan/panning';
import { zoomIdle } from './zoom/idle';
import { selectDraggingOutline } from './select/dragging-outline';
import { selectDraggingVertex } from './select/dragging-vertex';
import { selectIdle } from './select/idle';
import { selectMarquee } from './select/marquee';
import { selectPointingZone } from './select/pointing-zone';
import { selectTranslating } from './select/translating';
import type { StateHandlers, ToolHost } from './tool';

/** The handlers of a tool state with the state bound in. */
export interface BoundHandlers {
  pointerDown(host: ToolHost, e: PointerInput): void;
  pointerMove(host: ToolHost, e: PointerInput): void;
  pointerUp(host: ToolHost, e: PointerInput): void;
  keyDown(host: ToolHost, e: KeyInput): boolean;
  cancel(host: ToolHost): void;
}

function bind<S extends ToolState>(h: StateHandlers<S>, s: S): BoundHandlers {
  return {
    pointerDown: (host, e) => h.pointerDown?.(host, s, e),
    pointerMove: (host, e) => h.pointerMove?.(host, s, e),
    pointerUp: (host, e) => h.pointerUp?.(host, s, e),
    keyDown: (host, e) => h.keyDown?.(host, s, e) ?? false,
    cancel: (host) => h.cancel?.(host, s),
  };
}

/** The handlers for the state the active tool is in. */
export function handlersFor(s: ToolState): BoundHandlers {
  switch (s.tool) {
    case 'select':
      switch (s.state) {
        case 'idle':
          return bind(selectIdle, s);
        case 'pointing-zone':
          return bind(selectPointingZone, s);
        case 'translating':
          return bind(selectTranslating, s);
        case 'dragging-vertex':
          return bind(selectDraggingVertex, s);
        case 'dragging-outline':
          return bind(selectDraggingOutline, s);
        case 'marquee':
          return bind(selectMarquee, s);
      }
      break;
    case 'draw-zone':
      switch (s.state) {
        case 'idle':
          return bind(drawIdle, s);
        case 'drawing':
          return bind(drawDrawing, s);
      }
      break;
    case 'pan':
      switch (s.state) {
        case 'idle':
          return bind(panIdle, s);
        case 'panning':
          return bind(panPanning, s);
      }
      break;
    case 'zoom':
      return bind(zoomIdle, s);
  }
}

/** The resting state of a tool. */
export function idleState(tool: ToolId): ToolState {
  switch (tool) {
    case 'select':
      return { tool: 'select', state: 'idle', hover: null };
    case 'draw-zone':
      return { tool: 'draw-zone', state: 'idle', hover: null, hoverPanelId: null };
    case 'pan':
      return { tool: 'pan', state: 'idle' };
    case 'zoom':
      return { tool: 'zoom', state: 'idle' };
  }
}
