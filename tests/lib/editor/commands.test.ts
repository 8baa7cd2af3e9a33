import { describe, expect, it } from 'vitest';
import { TestEditor, bodyDocument, bodyPanel, rectZone, textures } from './test-editor';
import { moveOutlineVertex, restorePanels, setCutOutline } from '@/lib/editor/commands';

function setup() {
  return new TestEditor({
    doc: bodyDocument(
      [
        rectZone('a', 20, 30, 40, 60),
        rectZone('b', 100, 100, 40, 40, { textureId: 'mesh', order: 1 }),
        rectZone('c', 150, 200, 30, 30, { textureId: 'unknown', order: 2 }),
      ],
      [rectZone('d', 10, 10, 20, 20)],
    ),
  });
}

describe('mirror', () => {
  it('adds a mirrored copy across the centre line and selects it', () => {
    const t = setup();
    t.editor.select(['a']);
    t.keyDown('m');
    const copy = t.zone('new-1');
    // x ↦ 240 − x, vertex order reversed to keep the winding
    expect(copy.polygon).toEqual([
      { x: 220, y: 90 },
      { x: 180, y: 90 },
      { x: 180, y: 30 },
      { x: 220, y: 30 },
    ]);
    expect(copy).toMatchObject({ name: 'a (mirror)', textureId: 'rib', fn: 'compression', order: 3 });
    expect(t.points('a')).toEqual([[20, 30], [60, 30], [60, 90], [20, 90]]);
    expect(t.state.selection.zoneIds).toEqual(['new-1']);
    t.editor.undo();
    expect(t.hasZone('new-1')).toBe(false);
    expect(t.state.selection.zoneIds).toEqual([]);
  });

  it('mirrors in place', () => {
    const t = setup();
    t.editor.select(['a']);
    t.keyDown('M', { shift: true });
    expect(t.panel('front').zones).toHaveLength(3);
    expect(t.points('a')).toEqual([[220, 90], [180, 90], [180, 30], [220, 30]]);
    expect(t.state.undoLabel).toBe('Mirror zone');
    t.editor.mirror('in-place');
    expect(t.points('a')).toEqual([[20, 30], [60, 30], [60, 90], [20, 90]]);
  });
});

describe('copy to the other panel', () => {
  it('copies front zones to the back at the same needles and courses', () => {
    const t = setup();
    t.editor.select(['a', 'b']);
    t.keyDown('c');
    const back = t.panel('back').zones;
    expect(back.map((z) => z.id)).toEqual(['d', 'new-1', 'new-2']);
    expect(t.zone('new-1').polygon).toEqual(t.zone('a').polygon);
    expect(t.zone('new-2')).toMatchObject({ name: 'b', textureId: 'mesh', order: 2 });
    expect(t.state.selection.zoneIds).toEqual(['new-1', 'new-2']);
    expect(t.state.undoLabel).toBe('Copy to other panel');
    t.editor.undo();
    expect(t.panel('back').zones.map((z) => z.id)).toEqual(['d']);
  });

  it('copies back to front, and says so when there is no other panel', () => {
    const t = setup();
    t.editor.copyToOtherPanel(['d']);
    expect(t.panel('front').zones.map((z) => z.id)).toContain('new-1');

    const single = new TestEditor({ doc: { version: 1, panels: [bodyPanel('front', 'front', [rectZone('a', 1, 1, 9, 9)])] } });
    expect(single.editor.copyToOtherPanel(['a'])).toEqual([]);
    expect(single.state.notice).toMatch(/No other panel/);
    expect(single.state.canUndo).toBe(false);
  });
});

describe('snap to whole repeats', () => {
  it('sizes a zone to whole repeats of its texture', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 10, 7), rectZone('m', 50, 50, 20, 30, { textureId: 'mesh' })]) });
    t.editor.select(['a', 'm']);
    t.keyDown('r');
    // rib 4 × 2: 10 → 12 needles (3 repeats), 7 → 8 courses (4 repeats)
    expect(t.points('a')).toEqual([[20, 30], [32, 30], [32, 38], [20, 38]]);
    // mesh 6 × 8: 20 → 18 needles, 30 → 32 courses
    expect(t.points('m')).toEqual([[50, 50], [68, 50], [68, 82], [50, 82]]);
    t.editor.undo();
    expect(t.points('a')).toEqual([[20, 30], [30, 30], [30, 37], [20, 37]]);
  });

  it('keeps the resized zone inside the panel and leaves zones of unknown textures alone', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('edge', 233, 394, 7, 5), rectZone('u', 10, 10, 9, 9, { textureId: 'unknown' })]) });
    t.editor.snapToRepeats(['edge', 'u']);
    // 7 → 8 needles would pass the right edge, so the zone shifts back in; 5 → 6 courses just fits
    expect(t.points('edge')).toEqual([[232, 394], [240, 394], [240, 400], [232, 400]]);
    expect(t.points('u')).toEqual([[10, 10], [19, 10], [19, 19], [10, 19]]);
  });
});

describe('nudge', () => {
  it('moves by one needle or course with the arrows, each press one step', () => {
    const t = setup();
    t.editor.select(['a']);
    t.keyDown('ArrowRight');
    t.keyDown('ArrowDown');
    t.keyDown('ArrowDown');
    expect(t.zone('a').polygon[0]).toEqual({ x: 21, y: 32 });
    t.editor.undo();
    expect(t.zone('a').polygon[0]).toEqual({ x: 21, y: 31 });
  });

  it('moves by a repeat with Shift, or by 10 when the repeat is unknown', () => {
    const t = setup();
    t.editor.select(['a', 'b', 'c']);
    t.keyDown('ArrowLeft', { shift: true });
    t.keyDown('ArrowUp', { shift: true });
    expect(t.zone('a').polygon[0]).toEqual({ x: 16, y: 28 }); // rib 4 × 2
    expect(t.zone('b').polygon[0]).toEqual({ x: 94, y: 92 }); // mesh 6 × 8
    expect(t.zone('c').polygon[0]).toEqual({ x: 140, y: 190 }); // unknown: 10
  });

  it('stops at the panel edge', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 1, 1, 10, 10)]) });
    t.editor.select(['a']);
    t.keyDown('ArrowLeft', { shift: true });
    expect(t.zone('a').polygon[0]).toEqual({ x: 0, y: 1 });
    const revision = t.state.revision;
    t.keyDown('ArrowLeft');
    expect(t.state.revision).toBe(revision); // nothing moved, nothing recorded
  });

  it('nudges the selected vertex only', () => {
    const t = setup();
    t.editor.selectVertex('a', 2);
    t.keyDown('ArrowRight');
    expect(t.points('a')).toEqual([[20, 30], [60, 30], [61, 90], [20, 90]]);
  });

  it('pans the view when nothing is selected', () => {
    const t = setup();
    const pan = t.state.camera.pan;
    t.keyDown('ArrowRight');
    expect(t.state.camera.pan).toEqual({ x: pan.x - 40, y: pan.y });
    expect(t.state.canUndo).toBe(false);
  });
});

describe('reorder', () => {
  const order = (t: TestEditor) =>
    t
      .panel('front')
      .zones.slice()
      .sort((x, y) => x.order - y.order)
      .map((z) => z.id);

  it('brings forward, sends backward, to front and to back', () => {
    const t = setup();
    expect(order(t)).toEqual(['a', 'b', 'c']);
    t.editor.select(['a']);
    t.keyDown('.');
    expect(order(t)).toEqual(['b', 'a', 'c']);
    t.keyDown('>');
    expect(order(t)).toEqual(['b', 'c', 'a']);
    t.keyDown(',');
    expect(order(t)).toEqual(['b', 'a', 'c']);
    t.keyDown('<');
    expect(order(t)).toEqual(['a', 'b', 'c']);
    expect(t.panel('front').zones.map((z) => z.order)).toEqual([0, 1, 2]);
    t.editor.undo();
    expect(order(t)).toEqual(['b', 'a', 'c']);
  });

  it('moves several selected zones together, keeping their own order', () => {
    const t = setup();
    t.editor.reorder('to-front', ['a', 'b']);
    expect(order(t)).toEqual(['c', 'a', 'b']);
    t.editor.reorder('backward', ['a', 'b']);
    expect(order(t)).toEqual(['a', 'b', 'c']);
  });

  it('sets the order from the zone list, top first', () => {
    const t = setup();
    t.editor.setZoneOrder('front', ['b', 'c', 'a']);
    expect(order(t)).toEqual(['a', 'c', 'b']);
    expect(t.state.undoLabel).toBe('Reorder zones');
    // a zone the list leaves out stays below the listed ones
    t.editor.setZoneOrder('front', ['a', 'b']);
    expect(order(t)).toEqual(['c', 'b', 'a']);
  });

  it('records nothing when the order does not change', () => {
    const t = setup();
    t.editor.reorder('to-front', ['c']);
    expect(t.state.canUndo).toBe(false);
  });
});

describe('delete, undo, redo', () => {
  it('deletes the selected zones and brings them back', () => {
    const t = setup();
    t.editor.select(['a', 'b']);
    t.keyDown('Delete');
    expect(t.panel('front').zones.map((z) => z.id)).toEqual(['c']);
    expect(t.state.selection.zoneIds).toEqual([]);
    t.keyDown('z', { meta: true });
    expect(t.panel('front').zones.map((z) => z.id)).toEqual(['a', 'b', 'c']);
    t.keyDown('z', { meta: true, shift: true });
    expect(t.panel('front').zones.map((z) => z.id)).toEqual(['c']);
    t.keyDown('z', { ctrl: true });
    t.editor.deleteZones(['c']);
    expect(t.state.canRedo).toBe(false); // a new edit drops the redo stack
  });

  it('deletes the selected vertex instead, down to 3 vertices', () => {
    const t = setup();
    t.editor.selectVertex('a', 1);
    t.keyDown('Backspace');
    expect(t.points('a')).toEqual([[20, 30], [60, 90], [20, 90]]);
    expect(t.state.selection).toMatchObject({ zoneIds: ['a'], vertex: null });
    t.editor.selectVertex('a', 0);
    t.keyDown('Backspace');
    expect(t.points('a')).toHaveLength(3);
    expect(t.state.notice).toMatch(/at least 3/);
  });
});

describe('zone properties', () => {
  it('renames, tags and sets the texture, each one undoable step', () => {
    const t = setup();
    expect(t.editor.renameZone('a', '  Side panel  ')).toBe(true);
    expect(t.editor.renameZone('a', '   ')).toBe(false);
    t.editor.setZoneFunction('ventilation', ['a', 'b']);
    t.editor.setZoneTexture('mesh', ['a']);
    expect(t.zone('a')).toMatchObject({ name: 'Side panel', fn: 'ventilation', textureId: 'mesh' });
    expect(t.zone('b').fn).toBe('ventilation');
    t.editor.undo();
    expect(t.zone('a').textureId).toBe('rib');
    t.editor.undo();
    expect(t.zone('b').fn).toBe('compression');
    t.editor.undo();
    expect(t.zone('a').name).toBe('a');
    expect(t.state.canUndo).toBe(false);
  });

  it('a zone takes the function of the texture it is given, unless the designer tagged it otherwise', () => {
    const made = { ...textures, vent: { ...textures.mesh!, fn: 'ventilation' as const }, squeeze: { ...textures.rib!, fn: 'compression' as const } };
    const t = new TestEditor({ textures: made, doc: setup().state.doc });
    // 'a' is on rib (made for nothing): it follows the new texture's function.
    t.editor.setZoneTexture('vent', ['a']);
    expect(t.zone('a')).toMatchObject({ textureId: 'vent', fn: 'ventilation' });
    // Its tag followed 'vent', so it follows again to 'squeeze'.
    t.editor.setZoneTexture('squeeze', ['a']);
    expect(t.zone('a').fn).toBe('compression');
    // A tag chosen by hand stays when the texture changes.
    t.editor.setZoneFunction('hem', ['a']);
    t.editor.setZoneTexture('vent', ['a']);
    expect(t.zone('a')).toMatchObject({ textureId: 'vent', fn: 'hem' });
    // A texture made for nothing leaves the tag as it is.
    t.editor.setZoneTexture('jersey', ['a']);
    expect(t.zone('a')).toMatchObject({ textureId: 'jersey', fn: 'hem' });
  });

  it('a new zone is tagged with what its texture is made for', () => {
    const made = { ...textures, vent: { ...textures.mesh!, fn: 'ventilation' as const } };
    const t = new TestEditor({ textures: made, doc: setup().state.doc });
    const id = t.editor.addZone('front', [{ x: 10, y: 100 }, { x: 60, y: 100 }, { x: 60, y: 160 }], { textureId: 'vent' });
    expect(t.zone(id!).fn).toBe('ventilation');
    const plain = t.editor.addZone('front', [{ x: 10, y: 200 }, { x: 60, y: 200 }, { x: 60, y: 260 }], { textureId: 'jersey' });
    expect(t.zone(plain!).fn).toBe('compression');
  });

  it('edits vertices by command and refuses crossing edges', () => {
    const t = setup();
    expect(t.editor.insertVertex('a', 1, { x: 40, y: 20 })).toBe(true);
    expect(t.editor.moveVertex('a', 1, { x: 40, y: 120 })).toBe(false);
    expect(t.editor.moveVertex('a', 1, { x: 40, y: 25 })).toBe(true);
    expect(t.editor.deleteVertex('a', 1)).toBe(true);
    expect(t.points('a')).toEqual([[20, 30], [60, 30], [60, 90], [20, 90]]);
    expect(t.editor.moveOutlinePoint('front', 0, { x: 0, y: 60 })).toBe(true);
    expect(t.panel('front').cutOutline[0]).toEqual({ x: 0, y: 60 });
  });
});

describe('structural sharing', () => {
  it('keeps unchanged panels and zones by reference', () => {
    const t = setup();
    const before = t.state.doc;
    t.editor.moveZones(3, 0, ['a']);
    const after = t.state.doc;
    expect(after.panels[1]).toBe(before.panels[1]);
    expect(after.panels[0]).not.toBe(before.panels[0]);
    expect(t.zone('b')).toBe(before.panels[0]!.zones[1]);
    t.editor.undo();
    expect(t.state.doc.panels[0]).toBe(before.panels[0]);
  });
});

describe('revision and dirty state', () => {
  it('counts document changes only, and knows what was saved', () => {
    const t = setup();
    expect(t.editor.isDirty()).toBe(false);
    t.editor.select(['a']);
    t.editor.zoomIn();
    t.editor.setSnapping({ needleGrid: false });
    expect(t.state.revision).toBe(0);

    t.editor.moveZones(1, 0);
    expect(t.state.revision).toBe(1);
    expect(t.editor.isDirty()).toBe(true);
    const sent = t.state.revision;
    t.editor.moveZones(1, 0); // an edit while the save is on its way
    t.editor.markSaved(sent, 2);
    expect(t.state.doc.version).toBe(2);
    expect(t.editor.isDirty()).toBe(true);
    t.editor.markSaved(t.state.revision, 3);
    expect(t.editor.isDirty()).toBe(false);
    t.editor.undo();
    expect(t.editor.isDirty()).toBe(true);
  });

  it('reloads a document clean, with the history cleared', () => {
    const t = setup();
    t.editor.select(['a']);
    t.editor.moveZones(1, 0);
    t.editor.loadDocument(bodyDocument([rectZone('x', 0, 0, 5, 5)]));
    expect(t.editor.isDirty()).toBe(false);
    expect(t.state.canUndo).toBe(false);
    expect(t.state.selection.zoneIds).toEqual([]);
    expect(t.editor.undo()).toBe(false);
  });
});

describe('replace outline', () => {
  it('replaces the cut lines in one undoable step and refuses a crossing outline', () => {
    const t = setup();
    const panelId = t.state.doc.panels[0]!.id;
    const before = t.state.doc.panels[0]!.cutOutline;
    const outline = [{ x: 10, y: 0 }, { x: 200, y: 0 }, { x: 230, y: 300 }, { x: 0, y: 300 }];
    expect(t.editor.replaceOutline(panelId, outline)).toBe(true);
    expect(t.state.doc.panels[0]!.cutOutline).toEqual(outline);
    t.editor.undo();
    expect(t.state.doc.panels[0]!.cutOutline).toEqual(before);
    // A crossing outline is refused.
    expect(t.editor.replaceOutline(panelId, [{ x: 0, y: 0 }, { x: 100, y: 100 }, { x: 100, y: 0 }, { x: 0, y: 100 }])).toBe(false);
  });
});

describe('moving a cut-line point', () => {
  it('moveOutlineVertex and setCutOutline carry a fashioned panel\'s knitted area with the cut lines', () => {
    const doc = bodyDocument();
    const front = doc.panels[0]!;
    const fashioned = { ...doc, panels: [{ ...front, knittedArea: front.cutOutline }, doc.panels[1]!] };
    const moved = moveOutlineVertex(fashioned, 'front', 1, { x: 70, y: 12 });
    expect(moved.panels[0]!.cutOutline[1]).toEqual({ x: 70, y: 12 });
    expect(moved.panels[0]!.knittedArea).toEqual(moved.panels[0]!.cutOutline);
    const outline = front.cutOutline.map((p, i) => (i === 2 ? { x: 150, y: 8 } : p));
    const set = setCutOutline(fashioned, 'front', outline);
    expect(set.panels[0]!.knittedArea).toEqual(outline);
    // A crossing move changes nothing.
    expect(moveOutlineVertex(fashioned, 'front', 4, { x: 0, y: 0 })).toBe(fashioned);
    // A tube keeps its rectangle.
    expect(moveOutlineVertex(doc, 'front', 1, { x: 70, y: 12 }).panels[0]!.knittedArea).toEqual(front.knittedArea);
  });
});

describe('restoring unsaved work', () => {
  it('puts a local copy in place as one undoable edit, onto the panel ids loaded now', () => {
    const t = setup();
    const before = t.state.doc;
    // A copy taken from generated panels carries other panel ids; its zones are what matter.
    const copy = before.panels.map((p, i) => ({ ...p, id: `old-${i}`, zones: i === 0 ? [...p.zones, rectZone('kept', 5, 300, 20, 20)] : p.zones }));
    expect(t.editor.restorePanels(copy)).toBe(true);
    expect(t.state.doc.panels.map((p) => p.id)).toEqual(before.panels.map((p) => p.id));
    expect(t.state.doc.panels[0]!.zones.map((z) => z.id)).toContain('kept');
    expect(t.state.doc.panels[1]).toBe(before.panels[1]);
    expect(t.state.undoLabel).toBe('Restore unsaved work');
    expect(t.editor.isDirty()).toBe(true);
    t.editor.undo();
    expect(t.state.doc.panels).toEqual(before.panels);
  });

  it('refuses panels that no longer match, and reports a copy equal to the document as no change', () => {
    const doc = bodyDocument();
    expect(restorePanels(doc, doc.panels.slice(0, 1))).toBeNull();
    expect(restorePanels(doc, [doc.panels[1]!, doc.panels[0]!])).toBeNull();
    expect(restorePanels(doc, structuredClone(doc.panels))).toBe(doc);
  });
});
