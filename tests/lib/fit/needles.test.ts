import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  coursesForLength,
  cutAndSewEquivalent,
  cylinderNeedles,
  defaultSeamlessFactor,
  flatNeedlesAtPoint,
  recommendTube,
  seamlessEquivalent,
  tubeHalfWidthCm,
  walesPerCmForHalfWidth,
} from '@/lib/fit/needles';

describe('cylinderNeedles', () => {
  // "Needle number of machine = π × diameter of cylinder × gauge" (textiletutorials.com,
  // references.md §7b). 30″ × E28 = 2638.9 → 2639 needles [COMPUTED].
  it('is π × diameter × gauge: 30″ × E28 → 2639', () => {
    expect(cylinderNeedles(30, 28)).toBe(2639);
  });

  // references.md §7b [COMPUTED]: 30″ × E24 → 2261.9; 34″ × E28 → 2990.8.
  it.each([
    [30, 24, 2262],
    [34, 28, 2991],
  ])('%i″ × E%i → %i', (d, e, n) => {
    expect(cylinderNeedles(d, e)).toBe(n);
  });

  // Rounded to the machine's needle multiple (real cylinders are built to a count divisible by the
  // feeder or pattern repeat — references.md §7b, from memory): 2638.9 / 8 = 329.9 → 330 × 8.
  it('rounds to the needle multiple: 30″ × E28 with multiple 8 → 2640, 24 → 2640, 7 → 2639', () => {
    expect(cylinderNeedles(30, 28, 8)).toBe(2640);
    expect(cylinderNeedles(30, 28, 24)).toBe(2640);
    expect(cylinderNeedles(30, 28, 7)).toBe(2639); // 377 × 7
    expect(cylinderNeedles(30, 24, 8)).toBe(2264); // 2261.9 / 8 = 282.7 → 283 × 8
  });

  it('is always a multiple and within half a multiple of π·D·E (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 8, max: 40, noNaN: true }),
        fc.integer({ min: 5, max: 40 }),
        fc.integer({ min: 1, max: 48 }),
        (d, e, m) => {
          const n = cylinderNeedles(d, e, m);
          expect(n % m).toBe(0);
          expect(Math.abs(n - Math.PI * d * e)).toBeLessThanOrEqual(m / 2 + 1e-9);
        },
      ),
    );
  });

  it('rejects a zero gauge or a fractional multiple', () => {
    expect(() => cylinderNeedles(30, 0)).toThrow(RangeError);
    expect(() => cylinderNeedles(30, 28, 2.5)).toThrow(RangeError);
  });
});

describe('tubeHalfWidthCm', () => {
  // Product design §10: half-width = needles ÷ 2 ÷ relaxed wales per cm. 2640 / 2 / 28 = 47.14 cm.
  it('is needles ÷ 2 ÷ wales per cm', () => {
    expect(tubeHalfWidthCm(2640, 28)).toBeCloseTo(47.142857, 6);
  });

  it('inverts through walesPerCmForHalfWidth (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 200, max: 4000 }), fc.double({ min: 5, max: 80, noNaN: true }), (n, w) => {
        const half = tubeHalfWidthCm(n, w);
        expect(walesPerCmForHalfWidth(n, half)).toBeCloseTo(w, 9);
      }),
    );
  });
});

describe('recommendTube', () => {
  // A 46 cm relaxed half-width at E28 with 22 wales/cm: 13″ → 1144 needles → 26.0 cm;
  // 15″ → 1319.5 → 1320 → 30.0 cm; 17″ → 1495.4 → 1496 (multiple 8) → 34.0 cm. Hand arithmetic.
  const base = { gauge: 28, walesPerCm: 22, diametersIn: [17, 13, 15], multiple: 8 };

  it('picks the nearest cylinder and reports the residual', () => {
    const r = recommendTube({ ...base, targetHalfWidthCm: 31 });
    expect(r.cylinder.diameterIn).toBe(15);
    expect(r.cylinder.needles).toBe(1320);
    expect(r.cylinder.halfWidthCm).toBeCloseTo(30, 9);
    expect(r.cylinder.residualCm).toBeCloseTo(-1, 9);
    expect(r.options.map((o) => o.diameterIn)).toEqual([15, 17, 13]);
  });

  it('gives the density that closes the gap on the chosen cylinder', () => {
    const r = recommendTube({ ...base, targetHalfWidthCm: 31 });
    // 1320 / 2 / 31 = 21.29 wales/cm: 3.2 % more open than 22.
    expect(r.densityChange.walesPerCm).toBeCloseTo(1320 / 62, 9);
    expect(r.densityChange.change).toBeCloseTo(1320 / 62 / 22 - 1, 9);
    expect(tubeHalfWidthCm(r.densityChange.needles, r.densityChange.walesPerCm)).toBeCloseTo(31, 9);
  });

  it('gives the density change on the current cylinder when one is named', () => {
    const r = recommendTube({ ...base, targetHalfWidthCm: 31, currentDiameterIn: 17 });
    expect(r.densityChange.diameterIn).toBe(17);
    expect(r.densityChange.needles).toBe(1496);
    expect(r.densityChange.change).toBeGreaterThan(0); // denser, to bring 34 cm in to 31 cm
  });

  it('never recommends a cylinder farther from the target than another option (property)', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 8, max: 36 }), { minLength: 1, maxLength: 8 }),
        fc.double({ min: 15, max: 60, noNaN: true }),
        (diametersIn, target) => {
          const r = recommendTube({ gauge: 28, walesPerCm: 22, diametersIn, targetHalfWidthCm: target });
          for (const o of r.options) {
            expect(Math.abs(r.cylinder.residualCm)).toBeLessThanOrEqual(Math.abs(o.residualCm));
          }
        },
      ),
    );
  });

  it('refuses an empty list of diameters', () => {
    expect(() => recommendTube({ ...base, diametersIn: [], targetHalfWidthCm: 30 })).toThrow(RangeError);
  });
});

describe('seamlessEquivalent', () => {
  // Common practice, no published source: a seamless chest half-width of about 19 in fits like a
  // 20.5 in cut-and-sew one. This is the default factor's check value.
  it('turns a 20.5 in cut-and-sew chest half-width into about 19 in seamless', () => {
    expect(seamlessEquivalent(20.5)).toBeCloseTo(19, 6);
    expect(defaultSeamlessFactor).toBeLessThan(1); // seamless measures smaller for the same fit
  });

  it('uses a studio factor when given and inverts through cutAndSewEquivalent (property)', () => {
    expect(seamlessEquivalent(50, 0.9)).toBeCloseTo(45, 9);
    fc.assert(
      fc.property(fc.double({ min: 10, max: 80, noNaN: true }), fc.double({ min: 0.7, max: 1, noNaN: true }), (w, f) => {
        expect(cutAndSewEquivalent(seamlessEquivalent(w, f), f)).toBeCloseTo(w, 9);
      }),
    );
  });
});

describe('flat knitting at a point of measure', () => {
  // Wale density definition: needles across = width × wales/cm. 45.1 cm × 7.3 wales/cm = 329.23.
  it('gives needles per course for a width, rounded, with the residual', () => {
    const r = flatNeedlesAtPoint(45.1, 7.3);
    expect(r.needles).toBe(329);
    expect(r.widthCm).toBeCloseTo(329 / 7.3, 9);
    expect(r.residualCm).toBeCloseTo(329 / 7.3 - 45.1, 9);
    expect(r.fitsBed).toBe(true);
  });

  it('rounds to an even count when asked, and checks the bed width', () => {
    // 329.23 / 2 = 164.6 → 165 pairs = 330 needles.
    const r = flatNeedlesAtPoint(45.1, 7.3, { even: true, bedNeedles: 300 });
    expect(r.needles).toBe(330);
    expect(r.fitsBed).toBe(false);
  });

  it('gives courses along a length: 68 cm × 9.5 courses/cm = 646', () => {
    expect(coursesForLength(68, 9.5)).toBe(646);
  });
});
