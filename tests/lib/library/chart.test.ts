import { describe, expect, it } from 'vitest';
import {
  blankChart, countActions, decodeCells, encodeCells, feederSets, fillCourse, fillNeedle, paintCell, resizeChart, shiftChart,
} from '@/lib/library/chart';

// Chart editing is this product's own behaviour: no published source; the checks are invariants.
const A = { ground: 'a' };
const B = { ground: 'b', plated: { yarn: 'el', draft: 2.8 } };

describe('stitch chart', () => {
  it('stores courses as k/t/m strings and reads them back', () => {
    const cells = decodeCells(['kt', 'mk']);
    expect(cells).toEqual([['knit', 'tuck'], ['miss', 'knit']]);
    expect(encodeCells(cells)).toEqual(['kt', 'mk']);
    expect(() => decodeCells(['kx'])).toThrow(/Course 1/);
  });

  it('paints a cell without touching the input; a repaint of the same action is the same chart', () => {
    const c = blankChart(3, 2, A);
    const p = paintCell(c, 1, 2, 'tuck');
    expect(c.cells[1]).toEqual(['knit', 'knit', 'knit']);
    expect(p.cells[1]).toEqual(['knit', 'knit', 'tuck']);
    expect(paintCell(p, 1, 2, 'tuck')).toBe(p);
    expect(paintCell(p, 5, 0, 'miss')).toBe(p);
  });

  it('fills a course and a needle', () => {
    const c = fillNeedle(fillCourse(blankChart(3, 3, A), 0, 'miss'), 1, 'tuck');
    expect(encodeCells(c.cells)).toEqual(['mtm', 'ktk', 'ktk']);
  });

  it('shifts with wrap-around, courses keeping their feeders, and four shifts of a 4-wide chart give it back', () => {
    let c = { cells: decodeCells(['kkkt', 'mkkk']), feeders: [A, B] };
    const right = shiftChart(c, 'right');
    expect(encodeCells(right.cells)).toEqual(['tkkk', 'kmkk']);
    const up = shiftChart(c, 'up');
    expect(encodeCells(up.cells)).toEqual(['mkkk', 'kkkt']);
    expect(up.feeders).toEqual([B, A]);
    for (let i = 0; i < 4; i++) c = shiftChart(c, 'left');
    expect(encodeCells(c.cells)).toEqual(['kkkt', 'mkkk']);
    expect(shiftChart(shiftChart(c, 'down'), 'up')).toEqual(c);
  });

  it('resizes keeping content; new courses take the last feeder', () => {
    const c = { cells: decodeCells(['kt', 'mk']), feeders: [A, B] };
    const big = resizeChart(c, 3, 3);
    expect(encodeCells(big.cells)).toEqual(['ktk', 'mkk', 'kkk']);
    expect(big.feeders).toEqual([A, B, B]);
    expect(encodeCells(resizeChart(big, 2, 2).cells)).toEqual(['kt', 'mk']);
    expect(() => resizeChart(c, 0, 2)).toThrow(RangeError);
  });

  it('counts actions and groups feeders into sets', () => {
    expect(countActions(decodeCells(['ktm', 'kkm']))).toEqual({ knit: 3, tuck: 1, miss: 2 });
    const { sets, courseSet } = feederSets([A, B, A, { ground: 'b', plated: { yarn: 'el', draft: 2.8 } }]);
    expect(sets).toEqual([A, B]);
    expect(courseSet).toEqual([0, 1, 0, 1]);
  });
});
