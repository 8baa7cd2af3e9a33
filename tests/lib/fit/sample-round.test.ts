import { describe, expect, it } from 'vitest';
import { resolvePoint, type PointGrade } from '@/lib/fit/grading';
import { applyCorrection, deviationOf } from '@/lib/fit/sample-round';

const sizes = ['XS', 'S', 'M', 'L', 'XL'];
const chest: PointGrade = { baseCm: 31, gradeCm: 2, overrides: { XL: 36 } };
const values = (p: PointGrade) => { const r = resolvePoint(p, sizes, 'M'); return sizes.map((s) => r[s]!.valueCm); };

// A measurement is in tolerance when it lies within spec ± tolerance, the limit included: common
// practice in garment inspection, no published source. The three-quarter "near" mark is this
// product's own convention.
describe('deviation against tolerance', () => {
  it('is measured minus spec', () => {
    expect(deviationOf(32.4, 31, 1)).toEqual({ deviationCm: expect.closeTo(1.4, 9), status: 'outside' });
    expect(deviationOf(30.2, 31, 1).deviationCm).toBeCloseTo(-0.8, 9);
  });

  it('the limit is within; past three quarters is near; beyond is outside', () => {
    expect(deviationOf(32, 31, 1).status).toBe('near');
    expect(deviationOf(31.75, 31, 1).status).toBe('within');
    expect(deviationOf(31.76, 31, 1).status).toBe('near');
    expect(deviationOf(32.01, 31, 1).status).toBe('outside');
    expect(deviationOf(31, 31, 0).status).toBe('within');
  });

  it('has nothing to say without a spec value', () => {
    expect(deviationOf(30, null, 1)).toEqual({ deviationCm: null, status: 'no-spec' });
  });
});

describe('applying a correction to the spec', () => {
  it('on one size sets it by hand, leaving the others', () => {
    expect(values(applyCorrection(chest, sizes, 'M', { size: 'L', toCm: 32.5, scope: 'size' }))).toEqual([27, 29, 31, 32.5, 36]);
  });

  it('on the base size moves the graded sizes with it, not the overrides', () => {
    expect(values(applyCorrection(chest, sizes, 'M', { size: 'M', toCm: 30, scope: 'size' }))).toEqual([26, 28, 30, 32, 36]);
  });

  it('on the whole point moves every size by the same amount, overrides included', () => {
    expect(values(applyCorrection(chest, sizes, 'M', { size: 'L', toCm: 32, scope: 'point' }))).toEqual([26, 28, 30, 32, 35]);
  });

  it('cannot move a point that has no value', () => {
    expect(() => applyCorrection({ baseCm: null, gradeCm: 2, overrides: {} }, sizes, 'M', { size: 'M', toCm: 30, scope: 'point' })).toThrow(RangeError);
  });
});
