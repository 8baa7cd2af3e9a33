import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cmPerInch, formatLength, fromCm, parseLength, parseLengthCm, toCm } from '@/lib/fit/units';

describe('cm and inches', () => {
  // 1 in = 2.54 cm exactly: the international yard and pound agreement of 1959.
  it('uses 2.54 cm per inch', () => {
    expect(cmPerInch).toBe(2.54);
    expect(toCm(20.5, 'in')).toBeCloseTo(52.07, 9);
    expect(fromCm(48.26, 'in')).toBeCloseTo(19, 9);
  });

  it('shows cm to a millimetre (a second decimal only when there is one) and inches to a hundredth', () => {
    expect(formatLength(31, 'cm')).toBe('31.0');
    expect(formatLength(19.75, 'cm')).toBe('19.75');
    expect(formatLength(31.04, 'cm')).toBe('31.04');
    expect(formatLength(31.0004, 'cm')).toBe('31.0');
    expect(formatLength(31.04, 'cm', 1)).toBe('31.0');
    expect(formatLength(31.115, 'in')).toBe('12.25');
    expect(formatLength(null, 'cm')).toBe('');
  });

  it('an inch entry survives the trip through cm at two decimals (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 100, max: 8000 }), (hundredths) => {
        const inches = hundredths / 100;
        expect(formatLength(toCm(inches, 'in'), 'in')).toBe(inches.toFixed(2));
      }),
    );
  });
});

describe('reading an entry', () => {
  it.each([
    ['31.5', 31.5],
    ['31,5', 31.5],
    [' 31 ', 31],
    ['.5', 0.5],
    ['12 1/4', 12.25],
    ['12¼', 12.25],
    ['3/8', 0.375],
    ['-1.5', -1.5],
  ])('%s → %d', (raw, value) => {
    expect(parseLength(raw)?.value).toBeCloseTo(value, 9);
  });

  it('takes a unit written after the number over the display unit', () => {
    expect(parseLengthCm('12 in', 'cm')).toBeCloseTo(30.48, 9);
    expect(parseLengthCm('12"', 'cm')).toBeCloseTo(30.48, 9);
    expect(parseLengthCm('30 cm', 'in')).toBe(30);
    expect(parseLengthCm('12', 'in')).toBeCloseTo(30.48, 9);
  });

  it('empty is null; words are NaN', () => {
    expect(parseLengthCm('', 'cm')).toBeNull();
    expect(parseLengthCm('wide', 'cm')).toBeNaN();
    expect(parseLengthCm('1/0', 'cm')).toBeNaN();
    expect(parseLengthCm('1.2.3', 'cm')).toBeNaN();
  });
});
