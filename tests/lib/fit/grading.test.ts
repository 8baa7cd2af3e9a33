import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { clearOverrides, gradedValue, impossibleSizes, rebase, resolvePoint, resolveValues, sameValueCm, setSizeValue, type PointGrade } from '@/lib/fit/grading';

const sizes = ['XS', 'S', 'M', 'L', 'XL'];

// Linear grading by a constant increment per size step, with hand-set exceptions: common
// practice in pattern grading, no published source. Values worked by hand.
describe('grading from the base size', () => {
  const chest: PointGrade = { baseCm: 31, gradeCm: 2, overrides: {} };

  it('adds the grade going up and takes it off going down: 27, 29, 31, 33, 35', () => {
    const r = resolvePoint(chest, sizes, 'M');
    expect(sizes.map((s) => r[s]!.valueCm)).toEqual([27, 29, 31, 33, 35]);
    expect(sizes.every((s) => !r[s]!.overridden)).toBe(true);
  });

  it('grades from a base at the end of the range', () => {
    expect(gradedValue(chest, sizes, 'XS', 'XL')).toBe(39);
    expect(gradedValue(chest, sizes, 'XL', 'XS')).toBe(23);
  });

  it('an override wins over the graded value and says so', () => {
    const p = setSizeValue(chest, sizes, 'M', 'XL', 36.5);
    const r = resolvePoint(p, sizes, 'M');
    expect(r.XL).toEqual({ valueCm: 36.5, gradedCm: 35, overridden: true });
    expect(r.L!.valueCm).toBe(33);
  });

  it('typing the graded value into a size clears its override', () => {
    const p = setSizeValue(setSizeValue(chest, sizes, 'M', 'S', 28), sizes, 'M', 'S', 29);
    expect(p.overrides).toEqual({});
  });

  it('setting the base size changes every graded size but not an override', () => {
    const p = setSizeValue(setSizeValue(chest, sizes, 'M', 'XL', 36.5), sizes, 'M', 'M', 32);
    const r = resolvePoint(p, sizes, 'M');
    expect(sizes.map((s) => r[s]!.valueCm)).toEqual([28, 30, 32, 34, 36.5]);
  });

  it('clearing a size removes its override; clearing the base leaves nothing graded', () => {
    const p = setSizeValue(setSizeValue(chest, sizes, 'M', 'L', 40), sizes, 'M', 'L', null);
    expect(p.overrides).toEqual({});
    const empty = resolvePoint(setSizeValue(chest, sizes, 'M', 'M', null), sizes, 'M');
    expect(sizes.map((s) => empty[s]!.valueCm)).toEqual([null, null, null, null, null]);
  });

  it('re-grading drops every override', () => {
    expect(clearOverrides({ ...chest, overrides: { S: 1, L: 2 } }).overrides).toEqual({});
  });

  it('flags a grade too steep for the smallest sizes', () => {
    expect(impossibleSizes({ baseCm: 3, gradeCm: 2, overrides: {} }, sizes, 'M')).toEqual(['XS']);
  });

  it('rejects a base size outside the range', () => {
    expect(() => gradedValue(chest, sizes, 'XXL', 'M')).toThrow(RangeError);
  });

  it('moving the base to another size keeps every value (property)', () => {
    const arb = fc.record({
      baseCm: fc.double({ min: 10, max: 80, noNaN: true }),
      gradeCm: fc.double({ min: -3, max: 3, noNaN: true }),
      overrides: fc.dictionary(fc.constantFrom(...sizes), fc.double({ min: 10, max: 80, noNaN: true })),
    });
    fc.assert(
      fc.property(arb, fc.constantFrom(...sizes), fc.constantFrom(...sizes), (raw, from, to) => {
        const p: PointGrade = { ...raw, overrides: Object.fromEntries(Object.entries(raw.overrides).filter(([s]) => s !== from)) };
        const before = resolvePoint(p, sizes, from);
        const after = resolvePoint(rebase(p, sizes, from, to), sizes, to);
        // An override closer than sameValueCm (0.1 mm) to its graded value is not kept as one: values
        // stay within that, and exactly where they differ by more.
        for (const s of sizes) expect(Math.abs(after[s]!.valueCm! - before[s]!.valueCm!)).toBeLessThan(sameValueCm);
      }),
    );
  });

  it('resolves every point of a spec by size', () => {
    const v = resolveValues([{ point: 'chest-half', ...chest }, { point: 'inseam', baseCm: 72, gradeCm: 0, overrides: { XL: 74 } }], sizes, 'M');
    expect(v['chest-half']).toEqual({ XS: 27, S: 29, M: 31, L: 33, XL: 35 });
    expect(v.inseam).toEqual({ XS: 72, S: 72, M: 72, L: 72, XL: 74 });
  });
});
