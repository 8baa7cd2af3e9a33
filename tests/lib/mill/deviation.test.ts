import { describe, expect, it } from 'vitest';
import { defaultTestKnitThresholdPct, deviationPercent, testKnitDeviation } from '@/lib/mill/deviation';

// The 5 % default is common practice, no published source; the arithmetic is (measured − plan) ÷ plan.
describe('test-knit deviation', () => {
  it('is (measured − planned) ÷ planned in %', () => {
    expect(deviationPercent(20, 21)).toBeCloseTo(5, 12);
    expect(deviationPercent(28, 26.6)).toBeCloseTo(-5, 12);
    expect(() => deviationPercent(0, 1)).toThrow(RangeError);
  });
  it('flags past the threshold, not at it', () => {
    const d = testKnitDeviation({ walesPerCm: 20, coursesPerCm: 28, gsm: 180 }, { walesPerCm: 21, coursesPerCm: 30, gsm: 171 });
    expect(d.thresholdPct).toBe(defaultTestKnitThresholdPct);
    expect(d.figures.map((f) => [f.figure, f.flagged])).toEqual([['walesPerCm', false], ['coursesPerCm', true], ['gsm', false]]);
    expect(d.flagged).toBe(true);
  });
  it('skips g/m² when the plan has none, and uses the studio threshold', () => {
    const d = testKnitDeviation({ walesPerCm: 20, coursesPerCm: 28, gsm: null }, { walesPerCm: 21.5, coursesPerCm: 28, gsm: 200 }, 8);
    expect(d.figures).toHaveLength(2);
    expect(d.flagged).toBe(false);
  });
});
