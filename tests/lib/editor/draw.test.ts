import { describe, expect, it } from 'vitest';
import { TestEditor, bodyDocument, rectZone } from './test-editor';

const square = [
  { x: 20, y: 30 },
  { x: 60, y: 30 },
  { x: 60, y: 90 },
  { x: 20, y: 90 },
];

describe('draw zone tool', () => {
  it('draws a zone by clicking points and closing on the first point', () => {
    const t = new TestEditor();
    t.keyDown('d');
    expect(t.state.tool).toMatchObject({ tool: 'draw-zone', state: 'idle' });
    t.clickPoints('front', square);
    expect(t.state.tool).toMatchObject({ tool: 'draw-zone', state: 'drawing', points: square });
    // hovering over the first point offers to close there
    t.pointerMove(t.at('front', 20.5, 30.5));
    expect(t.state.tool).toMatchObject({ state: 'drawing', overFirst: true });
    t.click(t.at('front', 20, 30));

    const zones = t.panel('front').zones;
    expect(zones).toHaveLength(1);
    const zone = zones[0]!;
    expect(zone.polygon).toEqual(square);
    expect(zone).toMatchObject({ id: 'new-1', name: 'Zone 1', fn: 'compression', textureId: 'jersey', order: 0 });
    expect(t.state.selection.zoneIds).toEqual(['new-1']);
    expect(t.state.tool).toMatchObject({ tool: 'draw-zone', state: 'idle' });
    expect(t.state.undoLabel).toBe('Add zone');
    expect(t.panel('back').zones).toHaveLength(0);
  });

  it('closes with Enter, and the whole zone is one undo step', () => {
    const t = new TestEditor();
    t.editor.setTool('draw-zone');
    t.clickPoints('back', square.slice(0, 3));
    expect(t.keyDown('Enter')).toBe(true);
    expect(t.panel('back').zones.map((z) => z.polygon)).toEqual([square.slice(0, 3)]);
    t.keyDown('z', { ctrl: true });
    expect(t.panel('back').zones).toHaveLength(0);
    expect(t.state.selection.zoneIds).toEqual([]);
    t.keyDown('z', { ctrl: true, shift: true });
    expect(t.panel('back').zones).toHaveLength(1);
  });

  it('refuses to close with fewer than 3 points', () => {
    const t = new TestEditor();
    t.editor.setTool('draw-zone');
    t.clickPoints('front', square.slice(0, 2));
    t.keyDown('Enter');
    expect(t.panel('front').zones).toHaveLength(0);
    expect(t.state.tool).toMatchObject({ state: 'drawing', problem: 'too-few-points' });
    expect(t.state.notice).toMatch(/at least 3/);
  });

  it('refuses a point whose edge would cross an earlier edge, and a crossing close', () => {
    const t = new TestEditor();
    t.editor.setTool('draw-zone');
    // a bow tie: the fourth point's edge crosses the first edge
    t.clickPoints('front', [
      { x: 20, y: 20 },
      { x: 80, y: 20 },
      { x: 20, y: 80 },
      { x: 80, y: 80 },
      { x: 50, y: 5 },
    ]);
    const tool = t.state.tool;
    expect(tool).toMatchObject({ state: 'drawing', problem: 'self-intersecting' });
    if (tool.tool !== 'draw-zone' || tool.state !== 'drawing') throw new Error('not drawing');
    // 20,20 → 80,20 → 20,80 → 80,80 is accepted as a chain; 50,5 would cross 80,20 → 20,80
    expect(tool.points).toHaveLength(4);
    // closing 80,80 → 20,20 crosses 80,20 → 20,80
    t.keyDown('Enter');
    expect(t.panel('front').zones).toHaveLength(0);
    expect(t.state.tool).toMatchObject({ problem: 'self-intersecting' });
  });

  it('Backspace takes back the last point; Escape drops the polygon', () => {
    const t = new TestEditor();
    t.editor.setTool('draw-zone');
    t.clickPoints('front', square.slice(0, 3));
    t.keyDown('Backspace');
    expect(t.state.tool).toMatchObject({ state: 'drawing', points: square.slice(0, 2) });
    t.keyDown('Escape');
    expect(t.state.tool).toMatchObject({ tool: 'draw-zone', state: 'idle' });
    t.keyDown('Enter');
    expect(t.panel('front').zones).toHaveLength(0);
    expect(t.state.canUndo).toBe(false);
  });

  it('snaps points to whole needles and courses by default, and not when the grid is off', () => {
    const t = new TestEditor();
    t.editor.setTool('draw-zone');
    t.clickPoints('front', [
      { x: 10.4, y: 10.3 },
      { x: 50.6, y: 10.2 },
      { x: 50.2, y: 40.7 },
    ]);
    t.keyDown('Enter');
    expect(t.points('new-1')).toEqual([
      [10, 10],
      [51, 10],
      [50, 41],
    ]);

    t.editor.setSnapping({ needleGrid: false });
    t.clickPoints('front', [
      { x: 100.5, y: 100.25 },
      { x: 140.5, y: 100.25 },
      { x: 140.5, y: 140.75 },
    ]);
    t.keyDown('Enter');
    const [first] = t.points('new-2');
    expect(first![0]).toBeCloseTo(100.5, 6);
    expect(first![1]).toBeCloseTo(100.25, 6);
  });

  it('snaps points to the repeat lattice of the zone texture when asked', () => {
    const t = new TestEditor({ drawDefaults: { textureId: 'mesh' } }); // 6 needles × 8 courses
    t.editor.setSnapping({ wholeRepeats: true });
    t.editor.setTool('draw-zone');
    t.clickPoints('front', [
      { x: 13, y: 11 },
      { x: 49, y: 13 },
      { x: 50, y: 45 },
    ]);
    t.keyDown('Enter');
    expect(t.points('new-1')).toEqual([
      [12, 8],
      [48, 16],
      [48, 48],
    ]);
    expect(t.zone('new-1').textureId).toBe('mesh');
  });

  it('holds points that fall outside the panel on its edge', () => {
    const t = new TestEditor();
    t.editor.setTool('draw-zone');
    t.click(t.at('front', 200, 10));
    t.click(t.at('front', 300, 10)); // past the right edge, over the gap
    t.click(t.at('front', 300, 60));
    t.keyDown('Enter');
    expect(t.points('new-1')).toEqual([
      [200, 10],
      [240, 10],
      [240, 60],
    ]);
  });

  it('keeps the points while the view is panned with Space held', () => {
    const t = new TestEditor();
    t.editor.setTool('draw-zone');
    t.clickPoints('front', square.slice(0, 2));
    t.keyDown(' ');
    const pan = t.state.camera.pan;
    t.drag({ x: 500, y: 300 }, { x: 450, y: 280 });
    t.editor.keyUp({ key: ' ' });
    expect(t.state.camera.pan).toEqual({ x: pan.x - 50, y: pan.y - 20 });
    expect(t.state.tool).toMatchObject({ state: 'drawing', points: square.slice(0, 2) });
    t.clickPoints('front', square.slice(2));
    t.click(t.at('front', 20, 30));
    expect(t.points('new-1')).toEqual(square.map((p) => [p.x, p.y]));
  });

  it('Ctrl+Z while placing points takes back a point, not an earlier zone', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 100, 100, 20, 20)]) });
    t.editor.setTool('draw-zone');
    t.clickPoints('front', square.slice(0, 3));
    t.keyDown('z', { meta: true });
    expect(t.state.tool).toMatchObject({ points: square.slice(0, 2) });
    expect(t.hasZone('a')).toBe(true);
  });

  it('does not draw on a read-only body map', () => {
    const t = new TestEditor({ readOnly: true });
    t.keyDown('d');
    expect(t.state.tool.tool).toBe('select');
    expect(t.editor.addZone('front', square)).toBeNull();
    expect(t.panel('front').zones).toHaveLength(0);
  });
});

describe('the limits of what a body map keeps', () => {
  // The save route refuses a panel of more than 200 zones and a zone of more than 400 points
  // (lib/validations/body-map.ts); the editor must stop the designer before a save would fail.
  const fullPanel = () => Array.from({ length: 200 }, (_, i) => rectZone(`z${i}`, (i % 20) * 11 + 1, Math.floor(i / 20) * 30 + 40, 8, 20, { order: i }));

  it('a full panel takes no new zone, and says why', () => {
    const t = new TestEditor({ doc: bodyDocument(fullPanel()) });
    t.keyDown('d');
    t.clickPoints('front', [{ x: 20, y: 350 }, { x: 60, y: 350 }, { x: 60, y: 390 }]);
    t.keyDown('Enter');
    expect(t.panel('front').zones).toHaveLength(200);
    expect(t.state.notice).toMatch(/at most 200 zones/);
    // the back panel still takes one
    t.keyDown('Escape');
    t.keyDown('d');
    t.clickPoints('back', square.slice(0, 3));
    t.keyDown('Enter');
    expect(t.panel('back').zones).toHaveLength(1);
  });

  it('copies that do not fit on a full panel are refused with a notice', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 40, 60)], fullPanel()) });
    t.editor.select(['a']);
    t.keyDown('c');
    expect(t.panel('back').zones).toHaveLength(200);
    expect(t.state.notice).toMatch(/at most 200 zones/);
  });

  it('a zone takes no more than 400 points', () => {
    const ring = Array.from({ length: 400 }, (_, i) => {
      const a = (2 * Math.PI * i) / 400;
      return { x: 120 + 100 * Math.cos(a), y: 200 + 150 * Math.sin(a) };
    });
    const t = new TestEditor({ doc: bodyDocument([{ ...rectZone('ring', 0, 0, 1, 1), polygon: ring }]) });
    expect(t.editor.insertVertex('ring', 1, { x: 220, y: 201 })).toBe(false);
    expect(t.points('ring')).toHaveLength(400);
  });
});
