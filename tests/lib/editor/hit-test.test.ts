import { describe, expect, it } from 'vitest';
import { chainCrossesItself, pointInPolygon } from '@/lib/editor/geometry';
import { hitTest } from '@/lib/editor/hit-test';
import { TestEditor, bodyDocument, rectZone } from './test-editor';

describe('hit testing', () => {
  const doc = bodyDocument([rectZone('low', 20, 20, 60, 60, { order: 0 }), rectZone('high', 50, 50, 60, 60, { order: 1 })]);

  it('finds the topmost zone where zones overlap', () => {
    const t = new TestEditor({ doc });
    expect(hitTest(t.state, t.at('front', 60, 60))).toMatchObject({ kind: 'zone', zoneId: 'high' });
    expect(hitTest(t.state, t.at('front', 30, 30))).toMatchObject({ kind: 'zone', zoneId: 'low' });
    t.editor.reorder('to-front', ['low']);
    expect(hitTest(t.state, t.at('front', 60, 60))).toMatchObject({ kind: 'zone', zoneId: 'low' });
  });

  it('offers vertex handles of selected zones only, within a few screen pixels at any zoom', () => {
    const t = new TestEditor({ doc });
    const corner = t.at('front', 20, 20);
    const outside = { x: corner.x - 3, y: corner.y - 3 };
    expect(hitTest(t.state, outside)).toMatchObject({ kind: 'panel' });
    t.editor.select(['low']);
    expect(hitTest(t.state, outside)).toMatchObject({ kind: 'vertex', zoneId: 'low', index: 0 });
    expect(hitTest(t.state, { x: corner.x + 9, y: corner.y + 9 })).toMatchObject({ kind: 'zone', zoneId: 'low' });
    t.editor.zoomAt(corner, 8);
    const near = t.at('front', 20, 20);
    expect(hitTest(t.state, { x: near.x + 4, y: near.y })).toMatchObject({ kind: 'vertex', index: 0 });
  });

  it('misses between the panels', () => {
    const t = new TestEditor({ doc });
    const right = t.at('front', 240, 100);
    expect(hitTest(t.state, { x: right.x + 20, y: right.y })).toBeNull();
  });
});

describe('polygon helpers', () => {
  it('tells a chain that crosses itself', () => {
    expect(chainCrossesItself([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 0, y: 10 }])).toBe(false);
    expect(chainCrossesItself([{ x: 0, y: 0 }, { x: 10, y: 10 }, { x: 10, y: 0 }, { x: 0, y: 10 }])).toBe(true);
    // doubling back along the last edge
    expect(chainCrossesItself([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 5, y: 0 }])).toBe(true);
  });

  it('tests points inside a concave polygon', () => {
    const l = [{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 10 }, { x: 0, y: 10 }];
    expect(pointInPolygon({ x: 2, y: 8 }, l)).toBe(true);
    expect(pointInPolygon({ x: 8, y: 8 }, l)).toBe(false);
  });
});
