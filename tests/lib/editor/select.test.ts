import { describe, expect, it } from 'vitest';
import { isSimplePolygon } from '@/lib/editor/geometry';
import { TestEditor, bodyDocument, rectZone } from './test-editor';

function setup(options: ConstructorParameters<typeof TestEditor>[0] = {}) {
  return new TestEditor({
    doc: bodyDocument([rectZone('a', 20, 30, 40, 60), rectZone('b', 100, 100, 40, 40, { textureId: 'mesh', order: 1 })], [
      rectZone('c', 20, 30, 40, 60),
    ]),
    ...options,
  });
}

const aStart: [number, number][] = [
  [20, 30],
  [60, 30],
  [60, 90],
  [20, 90],
];

describe('select tool', () => {
  it('selects on click, adds and removes with Shift, clears on empty space', () => {
    const t = setup();
    t.click(t.at('front', 30, 50));
    expect(t.state.selection.zoneIds).toEqual(['a']);
    t.click(t.at('front', 120, 120), { shift: true });
    expect(t.state.selection.zoneIds).toEqual(['a', 'b']);
    t.click(t.at('front', 30, 50), { shift: true });
    expect(t.state.selection.zoneIds).toEqual(['b']);
    t.click(t.at('front', 200, 300));
    expect(t.state.selection.zoneIds).toEqual([]);
  });

  it('shows what is under the pointer', () => {
    const t = setup();
    t.pointerMove(t.at('front', 120, 120));
    expect(t.state.tool).toMatchObject({ state: 'idle', hover: { kind: 'zone', zoneId: 'b' } });
    t.pointerMove(t.at('front', 200, 300));
    expect(t.state.tool).toMatchObject({ hover: { kind: 'panel', panelId: 'front' } });
  });

  it('moves a zone by dragging, snapped to whole needles, and undoes the move in one step', () => {
    const t = setup();
    const before = t.state.doc;
    t.drag(t.at('front', 30, 50), t.at('front', 40.3, 55.4));
    expect(t.points('a')).toEqual(aStart.map(([x, y]) => [x + 10, y + 5]));
    expect(t.state.undoLabel).toBe('Move zone');
    expect(t.state.gesture).toBeNull();

    t.keyDown('z', { ctrl: true });
    expect(t.points('a')).toEqual(aStart);
    expect(t.state.doc.panels).toEqual(before.panels);
    expect(t.state.canUndo).toBe(false);

    t.keyDown('y', { ctrl: true });
    expect(t.points('a')).toEqual(aStart.map(([x, y]) => [x + 10, y + 5]));
  });

  it('moves by whole repeats of the zone texture when repeat snapping is on', () => {
    const t = setup();
    t.editor.setSnapping({ wholeRepeats: true }); // rib: 4 needles × 2 courses
    t.drag(t.at('front', 30, 50), t.at('front', 35.2, 53.1));
    expect(t.points('a')).toEqual(aStart.map(([x, y]) => [x + 4, y + 4]));
  });

  it('keeps a dragged zone inside the panel', () => {
    const t = setup();
    t.drag(t.at('front', 30, 50), t.at('front', -300, -300));
    expect(t.points('a')).toEqual(aStart.map(([x, y]) => [x - 20, y - 30]));
  });

  it('drags every selected zone together, and a plain click narrows the selection', () => {
    const t = setup();
    t.editor.select(['a', 'b']);
    t.drag(t.at('front', 30, 50), t.at('front', 35, 50));
    expect(t.zone('a').polygon[0]).toEqual({ x: 25, y: 30 });
    expect(t.zone('b').polygon[0]).toEqual({ x: 105, y: 100 });
    expect(t.state.selection.zoneIds).toEqual(['a', 'b']);
    t.click(t.at('front', 110, 110));
    expect(t.state.selection.zoneIds).toEqual(['b']);
  });

  it('squashes a vertex drag into one history entry', () => {
    const t = setup();
    t.click(t.at('front', 30, 50));
    t.drag(t.at('front', 60, 90), t.at('front', 70, 100), {}, 12);
    expect(t.zone('a').polygon[2]).toEqual({ x: 70, y: 100 });
    expect(t.state.selection.vertex).toEqual({ zoneId: 'a', index: 2 });
    expect(t.state.undoLabel).toBe('Move vertex');
    t.editor.undo();
    expect(t.points('a')).toEqual(aStart);
    expect(t.state.canUndo).toBe(false); // the click that selected is not in the history either
    t.editor.redo();
    expect(t.zone('a').polygon[2]).toEqual({ x: 70, y: 100 });
  });

  it('keeps the last valid shape when a vertex would make edges cross', () => {
    const t = setup();
    t.click(t.at('front', 30, 50));
    t.drag(t.at('front', 60, 30), t.at('front', 10, 60));
    const polygon = t.zone('a').polygon;
    expect(isSimplePolygon(polygon)).toBe(true);
    expect(polygon[1]).not.toEqual({ x: 60, y: 30 });
    expect(polygon[1]).not.toEqual({ x: 10, y: 60 });
    expect(t.state.notice).toBe('Edges would cross');
  });

  it('puts a drag back on Escape and records nothing', () => {
    const t = setup();
    t.pointerDown(t.at('front', 30, 50));
    t.pointerMove(t.at('front', 50, 70));
    expect(t.points('a')).not.toEqual(aStart);
    t.keyDown('Escape');
    expect(t.points('a')).toEqual(aStart);
    t.pointerMove(t.at('front', 60, 80)).pointerUp(t.at('front', 60, 80));
    expect(t.points('a')).toEqual(aStart);
    expect(t.state.canUndo).toBe(false);
  });

  it('undo during a drag puts back only the drag', () => {
    const t = setup();
    t.editor.moveZones(0, 2, ['b']);
    t.pointerDown(t.at('front', 30, 50)).pointerMove(t.at('front', 50, 70));
    t.keyDown('z', { ctrl: true });
    expect(t.points('a')).toEqual(aStart);
    expect(t.zone('b').polygon[0]).toEqual({ x: 100, y: 102 });
    expect(t.state.tool).toMatchObject({ tool: 'select', state: 'idle' });
    expect(t.state.undoLabel).toBe('Move zone');
  });

  it('inserts a vertex with Alt on an edge and drags it, as one step', () => {
    const t = setup();
    t.click(t.at('front', 30, 50));
    t.drag(t.at('front', 40, 30), t.at('front', 40, 20), { alt: true });
    expect(t.points('a')).toEqual([[20, 30], [40, 20], [60, 30], [60, 90], [20, 90]]);
    t.editor.undo();
    expect(t.points('a')).toEqual(aStart);
  });

  it('selects the zones inside a marquee', () => {
    const t = setup();
    t.drag(t.at('front', 5, 5), t.at('front', 150, 95));
    expect(t.state.selection.zoneIds).toEqual(['a']);
    t.drag(t.at('front', 5, 95), t.at('front', 150, 150), { shift: true });
    expect(t.state.selection.zoneIds).toEqual(['a', 'b']);
    expect(t.state.tool).toMatchObject({ state: 'idle' });
  });

  it('drags cut-outline points only while cut-line editing is on, undoably', () => {
    const t = setup();
    const outline = t.panel('front').cutOutline;
    t.drag(t.at('front', 80, 0), t.at('front', 90, 10));
    expect(t.panel('front').cutOutline).toBe(outline);

    t.keyDown('l');
    expect(t.state.editOutline).toBe(true);
    t.drag(t.at('front', 80, 0), t.at('front', 90, 10));
    expect(t.panel('front').cutOutline[1]).toEqual({ x: 90, y: 10 });
    expect(t.state.undoLabel).toBe('Move cut-line point');
    expect(t.panel('back').cutOutline).toEqual(outline);
    t.editor.undo();
    expect(t.panel('front').cutOutline).toBe(outline);
  });

  it('on a fashioned (flat) panel the knitted area follows a dragged cut-line point; on a tube it stays the rectangle', () => {
    // Product design: a flat-knit panel's knitted area is its outline itself.
    const doc = bodyDocument();
    const front = doc.panels[0]!;
    const fashioned = { ...doc, panels: [{ ...front, knittedArea: front.cutOutline }, doc.panels[1]!] };
    const t = new TestEditor({ doc: fashioned });
    t.keyDown('l');
    t.drag(t.at('front', 80, 0), t.at('front', 90, 10));
    expect(t.panel('front').cutOutline[1]).toEqual({ x: 90, y: 10 });
    expect(t.panel('front').knittedArea).toEqual(t.panel('front').cutOutline);
    t.editor.undo();
    expect(t.panel('front').knittedArea).toEqual(front.cutOutline);

    const tube = new TestEditor({ doc: bodyDocument() });
    tube.keyDown('l');
    tube.drag(tube.at('front', 80, 0), tube.at('front', 90, 10));
    expect(tube.panel('front').cutOutline[1]).toEqual({ x: 90, y: 10 });
    expect(tube.panel('front').knittedArea).toEqual([{ x: 0, y: 0 }, { x: 240, y: 0 }, { x: 240, y: 400 }, { x: 0, y: 400 }]);
  });

  it('selects but does not move zones on a read-only body map', () => {
    const t = setup({ readOnly: true });
    t.drag(t.at('front', 30, 50), t.at('front', 50, 70));
    expect(t.state.selection.zoneIds).toEqual(['a']);
    expect(t.points('a')).toEqual(aStart);
    t.keyDown('Delete');
    expect(t.hasZone('a')).toBe(true);
  });
});
