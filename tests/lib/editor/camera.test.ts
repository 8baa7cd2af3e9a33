import { describe, expect, it } from 'vitest';
import { centreOn, layoutPanels, panelChromeMargins, screenToStitch, stitchToScreen, zoomLimits } from '@/lib/editor/camera';
import { TestEditor, bodyDocument, bodyPanel, rectZone, textures } from './test-editor';

describe('layout', () => {
  it('lays panels side by side with a gap, at the stitch density of each', () => {
    const t = new TestEditor();
    const [front, back] = t.editor.layout();
    // jersey: 16 wales/cm and 20 courses/cm at 32 px/cm → 2 px per needle, 1.6 px per course
    expect(front).toMatchObject({ panelId: 'front', origin: { x: 10, y: 10 }, pxPerNeedle: 2, pxPerCourse: 1.6 });
    expect(front!.widthPx).toBeCloseTo(480, 9);
    expect(front!.heightPx).toBeCloseTo(640, 9);
    // 240 needles = 15 cm, then a 4 cm gap
    expect(back!.origin.x).toBeCloseTo(10 + (15 + 4) * 32, 9);
    expect(back!.origin.y).toBe(10);
  });

  it('gives non-square stitches separate x and y scales', () => {
    const mesh = { ...bodyPanel('m', 'front'), baseTextureId: 'mesh' }; // 14 wales, 18 courses per cm
    const [l] = layoutPanels([mesh], { pxPerCm: 28, pan: { x: 0, y: 0 } }, textures, 4);
    expect(l!.pxPerNeedle).toBeCloseTo(2, 12);
    expect(l!.pxPerCourse).toBeCloseTo(28 / 18, 12);
    const s = stitchToScreen(l!, { x: 7, y: 9 });
    expect(s.x).toBeCloseTo(14, 12);
    expect(s.y).toBeCloseTo(14, 12);
  });

  it('converts stitch space to screen and back', () => {
    const t = new TestEditor();
    const back = t.editor.layout()[1]!;
    const p = { x: 123.25, y: 77.5 };
    const q = screenToStitch(back, stitchToScreen(back, p));
    expect(q.x).toBeCloseTo(p.x, 9);
    expect(q.y).toBeCloseTo(p.y, 9);
    expect(t.editor.screenToStitch(stitchToScreen(back, p))?.panelId).toBe('back');
    expect(t.editor.screenToStitch({ x: 500, y: 300 })).toBeNull(); // in the gap
  });
});

describe('zoom', () => {
  it('zooms with the wheel about the cursor, keeping the stitch under it fixed', () => {
    const t = new TestEditor();
    const cursor = { x: 737, y: 211 };
    const under = t.editor.screenToStitch(cursor);
    expect(under?.panelId).toBe('back');
    const zoom = t.state.camera.pxPerCm;
    t.editor.wheel({ screen: cursor, deltaY: -300 });
    expect(t.state.camera.pxPerCm).toBeCloseTo(zoom * 2, 9);
    const after = t.editor.screenToStitch(cursor);
    expect(after?.panelId).toBe('back');
    expect(after!.point.x).toBeCloseTo(under!.point.x, 9);
    expect(after!.point.y).toBeCloseTo(under!.point.y, 9);
    t.editor.wheel({ screen: cursor, deltaY: 120 });
    expect(t.editor.screenToStitch(cursor)!.point.x).toBeCloseTo(under!.point.x, 9);
  });

  it('stops at the zoom limits', () => {
    const t = new TestEditor();
    for (let i = 0; i < 40; i++) t.editor.wheel({ screen: { x: 100, y: 100 }, deltaY: 600 });
    expect(t.state.camera.pxPerCm).toBe(zoomLimits.minPxPerCm);
    for (let i = 0; i < 60; i++) t.editor.wheel({ screen: { x: 100, y: 100 }, deltaY: -600 });
    expect(t.state.camera.pxPerCm).toBe(zoomLimits.maxPxPerCm);
  });

  it('zooms with the buttons about the middle of the viewport', () => {
    const t = new TestEditor();
    const centre = { x: 500, y: 300 };
    const front = t.editor.layout()[0]!;
    const under = screenToStitch(front, centre);
    t.editor.zoomIn();
    t.editor.zoomIn();
    expect(t.state.camera.pxPerCm).toBeCloseTo(64, 9);
    const again = screenToStitch(t.editor.layout()[0]!, centre);
    expect(again.x).toBeCloseTo(under.x, 9);
    expect(again.y).toBeCloseTo(under.y, 9);
    t.editor.zoomOut();
    expect(t.state.camera.pxPerCm).toBeCloseTo(32 * Math.SQRT2, 9);
  });

  it('fits all panels in the viewport', () => {
    const t = new TestEditor();
    t.editor.zoomIn();
    t.keyDown('0');
    const layout = t.editor.layout();
    const left = Math.min(...layout.map((l) => l.origin.x));
    const right = Math.max(...layout.map((l) => l.origin.x + l.widthPx));
    const top = Math.min(...layout.map((l) => l.origin.y));
    const bottom = Math.max(...layout.map((l) => l.origin.y + l.heightPx));
    expect(left).toBeGreaterThanOrEqual(0);
    expect(top).toBeGreaterThanOrEqual(0);
    expect(right).toBeLessThanOrEqual(1000);
    expect(bottom).toBeLessThanOrEqual(600);
    // Room is kept above for each panel's name and needle ruler (drawn up to 40 px above it) and
    // to the left for the course ruler (labels up to 50 px to the left).
    expect(top).toBeGreaterThanOrEqual(40);
    expect(left).toBeGreaterThanOrEqual(50);
    // tall panels: the height fills the viewport less its margins, centred across between them
    const m = panelChromeMargins;
    expect(top).toBeCloseTo(m.top, 6);
    expect(bottom - top).toBeCloseTo(600 - m.top - m.bottom, 6);
    expect(left - m.left).toBeCloseTo(1000 - m.right - right, 6);
  });

  it('zooms in and out at the cursor with the zoom tool', () => {
    const t = new TestEditor();
    t.keyDown('z');
    const cursor = t.at('front', 100, 100);
    t.click(cursor);
    expect(t.state.camera.pxPerCm).toBeCloseTo(64, 9);
    const p = t.editor.screenToStitch(cursor)!.point;
    expect(p.x).toBeCloseTo(100, 9);
    expect(p.y).toBeCloseTo(100, 9);
    t.click(cursor, { alt: true });
    expect(t.state.camera.pxPerCm).toBeCloseTo(32, 9);
  });
});

describe('pan', () => {
  it('pans with the pan tool, the middle button and Shift+wheel', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 40, 60)]) });
    t.keyDown('p');
    t.drag({ x: 100, y: 100 }, { x: 130, y: 90 });
    expect(t.state.camera.pan).toEqual({ x: 40, y: 0 });

    t.keyDown('s');
    t.drag(t.at('front', 30, 50), { x: 0, y: 0 }, { button: 1 });
    expect(t.points('a')[0]).toEqual([20, 30]); // the zone did not move
    expect(t.state.selection.zoneIds).toEqual([]);
    expect(t.state.camera.pan.x).toBeLessThan(40);

    const x = t.state.camera.pan.x;
    t.editor.wheel({ screen: { x: 0, y: 0 }, deltaY: 50, shift: true });
    expect(t.state.camera.pan.x).toBe(x - 50);
  });

  it('does not record camera moves in the history', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 40, 60)]) });
    t.editor.moveZones(5, 0, ['a']);
    t.editor.zoomIn();
    t.editor.panBy(20, 20);
    const camera = t.state.camera;
    t.editor.undo();
    expect(t.points('a')[0]).toEqual([20, 30]);
    expect(t.state.camera).toBe(camera);
    expect(t.state.canUndo).toBe(false);
  });
});

describe('centreOn', () => {
  // Geometry of the layout: common practice, no published source (a point is visible when it lies inside the viewport).
  const inside = (p: { x: number; y: number }, w = 1000, h = 600) => p.x >= 0 && p.x <= w && p.y >= 0 && p.y <= h;

  it('pans a stitch off screen into the middle of the viewport, keeping the zoom', () => {
    const t = new TestEditor();
    t.editor.setCamera({ pxPerCm: 32, pan: { x: -2000, y: -900 } });
    const place = { x: 200, y: 350 };
    expect(inside(t.at('back', place.x, place.y))).toBe(false);
    const camera = centreOn(t.state, 'back', place);
    expect(camera.pxPerCm).toBe(32);
    t.editor.centreOn('back', place);
    const s = t.at('back', place.x, place.y);
    expect(s.x).toBeCloseTo(500, 9);
    expect(s.y).toBeCloseTo(300, 9);
    // A camera move, not an edit.
    expect(t.state.canUndo).toBe(false);
  });

  it('zooms out just enough for a box larger than the viewport, and never zooms in', () => {
    const t = new TestEditor();
    // The whole back panel (15 cm × 20 cm) at 100 px/cm is 2000 px tall: too big for 600 px less 2 × 32 margin.
    t.editor.setCamera({ pxPerCm: 100, pan: { x: 0, y: 0 } });
    const box = { minX: 0, minY: 0, maxX: 240, maxY: 400 };
    t.editor.centreOn('back', box);
    expect(t.state.camera.pxPerCm).toBeCloseTo((600 - 64) / 20, 9);
    const tl = t.at('back', 0, 0);
    const br = t.at('back', 240, 400);
    expect(inside(tl) && inside(br)).toBe(true);
    expect(tl.y).toBeCloseTo(32, 9);
    // A small box at a coarse zoom keeps the zoom.
    t.editor.setCamera({ pxPerCm: 4, pan: { x: 0, y: 0 } });
    t.editor.centreOn('front', { minX: 10, minY: 10, maxX: 20, maxY: 20 });
    expect(t.state.camera.pxPerCm).toBe(4);
  });

  it('leaves the camera alone for an unknown panel', () => {
    const t = new TestEditor();
    const before = t.state.camera;
    expect(centreOn(t.state, 'nope', { x: 1, y: 1 })).toBe(before);
  });
});
