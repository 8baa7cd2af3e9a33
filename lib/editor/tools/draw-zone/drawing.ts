/**
 * Draw zone tool, placing points: click adds a point, clicking the first point or Enter closes,
 * Backspace takes back the last point, Escape drops the polygon. A point whose edge would cross
 * an earlier edge is refused, and so is a closed polygon that is not simple.
 */
import { panelLayout, stitchToScreen } from '../../camera';
import { panelIsFull, zonePolygonProblem } from '../../commands';
import { findPanel } from '../../document';
import { panelLimits } from '@/lib/knit/panel';
import { chainCrossesItself } from '../../geometry';
import type { DrawProblem, EditorState, PointerInput } from '../../types';
import type { StateHandlers, ToolHost, ToolStateOf } from '../tool';
import { drawPointOn } from './idle';

type Drawing = ToolStateOf<'draw-zone', 'drawing'>;

/** Distance in screen pixels within which a click lands on the first point and closes. */
export const closeRadiusPx = 8;

const problemText: Record<DrawProblem, string> = {
  'too-few-points': 'A zone needs at least 3 points',
  'too-many-points': `A zone has at most ${panelLimits.maxVertices} points`,
  'panel-full': `A panel holds at most ${panelLimits.maxZonesPerPanel} zones: merge or delete some first`,
  'self-intersecting': 'Zone edges may not cross',
  'zero-area': 'The points lie on one line',
};

function overFirst(state: EditorState, s: Drawing, e: PointerInput): boolean {
  const first = s.points[0];
  const layout = panelLayout(state, s.panelId);
  if (!first || !layout || s.points.length < 3) return false;
  const q = stitchToScreen(layout, first);
  return Math.hypot(q.x - e.screen.x, q.y - e.screen.y) <= closeRadiusPx;
}

function refuse(host: ToolHost, s: Drawing, problem: DrawProblem): void {
  host.setTool({ ...s, problem });
  host.notice(problemText[problem]);
}

/** Close the polygon: add the zone, or stay drawing with the reason it was refused. */
function finish(host: ToolHost, s: Drawing): void {
  const problem = zonePolygonProblem(s.points);
  if (problem) return refuse(host, s, problem);
  const panel = findPanel(host.state.doc, s.panelId);
  if (panel && panelIsFull(panel)) return refuse(host, s, 'panel-full');
  const id = host.addZone(s.panelId, s.points);
  if (!id) return refuse(host, s, 'self-intersecting');
  host.notice(null);
  host.setTool({ tool: 'draw-zone', state: 'idle', hover: null, hoverPanelId: null });
}

/** Handlers of the draw zone tool while points are placed. */
export const drawDrawing: StateHandlers<Drawing> = {
  pointerMove(host, s, e) {
    const over = overFirst(host.state, s, e);
    const hover = over ? s.points[0]! : drawPointOn(host.state, s.panelId, e.screen);
    if (over === s.overFirst && hover?.x === s.hover?.x && hover?.y === s.hover?.y) return;
    host.setTool({ ...s, hover, overFirst: over });
  },

  pointerDown(host, s, e) {
    if ((e.button ?? 0) !== 0) return;
    if (overFirst(host.state, s, e)) return finish(host, s);
    const p = drawPointOn(host.state, s.panelId, e.screen);
    if (!p) return;
    const last = s.points[s.points.length - 1];
    if (last && last.x === p.x && last.y === p.y) return; // a second click on the same stitch
    const points = [...s.points, p];
    if (points.length > panelLimits.maxVertices) return refuse(host, s, 'too-many-points');
    if (chainCrossesItself(points)) return refuse(host, s, 'self-intersecting');
    host.notice(null);
    host.setTool({ ...s, points, hover: p, overFirst: false, problem: null });
  },

  keyDown(host, s, e) {
    // Undo while placing points takes back the last point rather than an earlier edit.
    const undoKey = (e.ctrl || e.meta) && !e.shift && e.key.toLowerCase() === 'z';
    switch (undoKey ? 'Backspace' : e.key) {
      case 'Enter':
        finish(host, s);
        return true;
      case 'Escape':
        drawDrawing.cancel?.(host, s);
        return true;
      case 'Backspace':
      case 'Delete': {
        const points = s.points.slice(0, -1);
        host.notice(null);
        if (points.length === 0) host.setTool({ tool: 'draw-zone', state: 'idle', hover: null, hoverPanelId: null });
        else host.setTool({ ...s, points, overFirst: false, problem: null });
        return true;
      }
      default:
        return false;
    }
  },

  cancel(host) {
    host.notice(null);
    host.setTool({ tool: 'draw-zone', state: 'idle', hover: null, hoverPanelId: null });
  },
};
