import { describe, expect, it } from 'vitest';
import { moveZones } from '@/lib/editor/commands';
import { beginGesture, cancelGesture, createHistory, endGesture, recordChange, redo, undo } from '@/lib/editor/history';
import { TestEditor, bodyDocument, rectZone } from './test-editor';

const doc0 = bodyDocument([rectZone('a', 20, 30, 40, 60)], [rectZone('b', 20, 30, 40, 60)]);

describe('history', () => {
  it('keeps one entry per change outside a gesture, as panel diffs', () => {
    const doc1 = moveZones(doc0, ['a'], 1, 0);
    const doc2 = moveZones(doc1, ['b'], 0, 1);
    let h = recordChange(createHistory(), 'one', doc0, doc1);
    h = recordChange(h, 'two', doc1, doc2);
    expect(h.undo.map((e) => e.label)).toEqual(['one', 'two']);
    expect(h.undo[0]!.diffs.map((d) => d.panelId)).toEqual(['front']);
    const r = undo(h, doc2)!;
    expect(r.doc.panels[1]).toBe(doc1.panels[1]);
    expect(r.doc.panels[0]).toBe(doc2.panels[0]);
  });

  it('squashes a gesture into one entry from the first before to the last after', () => {
    let h = beginGesture(createHistory(), 'Move zone');
    let doc = doc0;
    for (let i = 0; i < 5; i++) {
      const next = moveZones(doc, ['a'], 1, 0);
      h = recordChange(h, 'Move zone', doc, next);
      doc = next;
    }
    expect(h.undo).toHaveLength(0);
    h = endGesture(h);
    expect(h.undo).toHaveLength(1);
    expect(h.undo[0]!.diffs[0]!.before).toBe(doc0.panels[0]);
    expect(h.undo[0]!.diffs[0]!.after).toBe(doc.panels[0]);
    expect(undo(h, doc)!.doc.panels[0]).toBe(doc0.panels[0]);
  });

  it('drops a gesture that ends where it began, and one that is cancelled', () => {
    let h = beginGesture(createHistory(), 'Move zone');
    const moved = moveZones(doc0, ['a'], 3, 0);
    h = recordChange(h, 'Move zone', doc0, moved);
    const back = { ...moved, panels: [doc0.panels[0]!, moved.panels[1]!] };
    h = recordChange(h, 'Move zone', moved, back);
    expect(endGesture(h).undo).toHaveLength(0);

    let h2 = beginGesture(createHistory(), 'Move zone');
    h2 = recordChange(h2, 'Move zone', doc0, moved);
    const c = cancelGesture(h2, moved);
    expect(c.doc.panels[0]).toBe(doc0.panels[0]);
    expect(c.history.pending).toBeNull();
    expect(c.history.undo).toHaveLength(0);
  });

  it('clears redo on a new change and keeps at most the limit', () => {
    let h = createHistory(3);
    let doc = doc0;
    for (let i = 0; i < 5; i++) {
      const next = moveZones(doc, ['a'], 1, 0);
      h = recordChange(h, `step ${i}`, doc, next);
      doc = next;
    }
    expect(h.undo.map((e) => e.label)).toEqual(['step 2', 'step 3', 'step 4']);
    const u = undo(h, doc)!;
    expect(u.history.redo).toHaveLength(1);
    const after = recordChange(u.history, 'other', u.doc, moveZones(u.doc, ['b'], 1, 0));
    expect(after.redo).toHaveLength(0);
    expect(redo(after, u.doc)).toBeNull();
  });
});

describe('editor store', () => {
  it('tells subscribers once per event, and only when something changed', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 40, 60)]) });
    const n0 = t.notifications;
    t.keyDown('q'); // not bound
    t.editor.setTool('select'); // already there
    expect(t.notifications).toBe(n0);
    t.editor.mirror('copy', ['a']); // document, selection, history flags: one notification
    expect(t.notifications).toBe(n0 + 1);
    const s = t.editor.getState();
    expect(t.editor.getState()).toBe(s);
  });

  it('stops telling a listener after it unsubscribes', () => {
    const t = new TestEditor();
    let heard = 0;
    const off = t.editor.subscribe(() => heard++);
    t.editor.zoomIn();
    off();
    t.editor.zoomIn();
    expect(heard).toBe(1);
  });

  it('shows the gesture in progress so autosave can wait', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 40, 60)]) });
    t.pointerDown(t.at('front', 30, 50)).pointerMove(t.at('front', 40, 50));
    expect(t.state.gesture).toBe('Move zone');
    t.pointerUp(t.at('front', 40, 50));
    expect(t.state.gesture).toBeNull();
  });
});
