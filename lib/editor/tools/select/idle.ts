/** Select tool, idle: hover feedback; a press picks a handle, a zone or starts a marquee. */
import { findZone } from '../../document';
import { hitTest } from '../../hit-test';
import { insertVertex } from '../../commands';
import { repeatOf, snapPoint } from '../../snapping';
import type { HitTarget } from '../../types';
import { zoneSelection, type StateHandlers, type ToolStateOf } from '../tool';

type Idle = ToolStateOf<'select', 'idle'>;

function sameHit(a: HitTarget | null, b: HitTarget | null): boolean {
  if (a === null || b === null) return a === b;
  if (a.kind !== b.kind || a.panelId !== b.panelId) return false;
  switch (a.kind) {
    case 'vertex':
    case 'edge':
      return b.kind === a.kind && a.zoneId === b.zoneId && a.index === b.index;
    case 'outline-vertex':
      return b.kind === a.kind && a.index === b.index;
    case 'zone':
      return b.kind === a.kind && a.zoneId === b.zoneId;
    case 'panel':
      return true;
  }
}

/** Handlers of the select tool at rest. */
export const selectIdle: StateHandlers<Idle> = {
  pointerMove(host, s, e) {
    const hover = hitTest(host.state, e.screen);
    if (!sameHit(hover, s.hover)) host.setTool({ ...s, hover });
  },

  pointerDown(host, s, e) {
    if ((e.button ?? 0) !== 0) return;
    const state = host.state;
    const hit = hitTest(state, e.screen);

    if (hit?.kind === 'vertex') {
      const ref = findZone(state.doc, hit.zoneId);
      if (!ref) return;
      host.setSelection({ ...state.selection, vertex: { zoneId: hit.zoneId, index: hit.index }, outlineVertex: null });
      if (state.readOnly) return;
      host.beginGesture('Move vertex');
      host.setTool({ tool: 'select', state: 'dragging-vertex', zoneId: hit.zoneId, index: hit.index, startPolygon: ref.zone.polygon });
      return;
    }

    if (hit?.kind === 'edge' && e.alt && !state.readOnly) {
      const ref = findZone(state.doc, hit.zoneId);
      if (!ref) return;
      const point = snapPoint(hit.point, state.snapping, repeatOf(state.textures, ref.zone.textureId));
      const index = hit.index + 1;
      host.beginGesture('Insert vertex');
      if (!host.change('Insert vertex', (doc) => insertVertex(doc, hit.zoneId, index, point))) {
        host.endGesture();
        host.notice('A point there would make edges cross');
        return;
      }
      const inserted = findZone(host.state.doc, hit.zoneId);
      if (!inserted) return;
      host.setSelection({ ...host.state.selection, vertex: { zoneId: hit.zoneId, index }, outlineVertex: null });
      host.setTool({ tool: 'select', state: 'dragging-vertex', zoneId: hit.zoneId, index, startPolygon: inserted.zone.polygon });
      return;
    }

    if (hit?.kind === 'outline-vertex') {
      const panel = state.doc.panels.find((p) => p.id === hit.panelId);
      if (!panel) return;
      host.setSelection({ zoneIds: [], vertex: null, outlineVertex: { panelId: hit.panelId, index: hit.index } });
      if (state.readOnly) return;
      host.beginGesture('Move cut-line point');
      host.setTool({ tool: 'select', state: 'dragging-outline', panelId: hit.panelId, index: hit.index, startOutline: panel.cutOutline });
      return;
    }

    if (hit?.kind === 'zone' || hit?.kind === 'edge') {
      const selected = state.selection.zoneIds.includes(hit.zoneId);
      let toggledOff = false;
      if (e.shift) {
        if (selected) {
          toggledOff = true;
          host.setSelection(zoneSelection(state.selection.zoneIds.filter((id) => id !== hit.zoneId)));
        } else {
          host.setSelection(zoneSelection([...state.selection.zoneIds, hit.zoneId]));
        }
      } else if (!selected) {
        host.setSelection(zoneSelection([hit.zoneId]));
      } else if (state.selection.vertex || state.selection.outlineVertex) {
        host.setSelection(zoneSelection(state.selection.zoneIds));
      }
      host.setTool({
        tool: 'select',
        state: 'pointing-zone',
        panelId: hit.panelId,
        zoneId: hit.zoneId,
        downAt: e.screen,
        toggledOff,
        shift: Boolean(e.shift),
      });
      return;
    }

    const before = e.shift ? state.selection.zoneIds : [];
    if (!e.shift) host.setSelection(zoneSelection([]));
    host.setTool({ tool: 'select', state: 'marquee', downAt: e.screen, current: e.screen, additive: Boolean(e.shift), active: false, before });
  },

  keyDown(host, _s, e) {
    if (e.key === 'Escape') {
      const sel = host.state.selection;
      if (sel.vertex) {
        host.setSelection(zoneSelection(sel.zoneIds));
        return true;
      }
      if (sel.zoneIds.length > 0 || sel.outlineVertex) {
        host.setSelection(zoneSelection([]));
        return true;
      }
    }
    return false;
  },
};
