import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  compressionCaution,
  compressionEstimate,
  garmentExtension,
  laplacePressureMmHg,
  laplacePressurePa,
  pascalPerMmHg,
  tensionAt,
  withinCurve,
} from '@/lib/fit/compression';

describe('laplacePressureMmHg', () => {
  // Laplace's law for a cylinder, P = T / r (S. Thomas, "The use of the Laplace equation in the
  // calculation of sub-bandage pressure", World Wide Wounds 2002/2003; Barhoumi et al., IEEE MECBME
  // 2018: P from T in N/m and R in m). Worked by hand from SI definitions [COMPUTED]:
  // T = 1 N/cm = 100 N/m; girth 60 cm → r = 0.6 / 2π = 0.095493 m; P = 100 / 0.095493 = 1047.20 Pa;
  // ÷ 133.322 Pa/mmHg = 7.8547 mmHg.
  it('gives 7.855 mmHg for 1 N/cm around a 60 cm girth', () => {
    expect(laplacePressurePa(1, 60)).toBeCloseTo(1047.1976, 3);
    expect(laplacePressureMmHg(1, 60)).toBeCloseTo(7.8546, 3);
  });

  // The bandage form of the law (variables as listed on a bandage maker's clinical page: T in kgf,
  // N layers, C circumference in cm, W width in cm) is P(mmHg) = K·T·N / (C·W). From SI,
  // K = 9.80665 × 2π × 10⁴ / 133.322 = 4621.7 [COMPUTED]; the rounded constant usually quoted is
  // 4620 (from memory). Case: 1 kgf over a 10 cm wide bandage, 2 layers, 36 cm limb.
  it('agrees with the bandage form P = 4620 × T(kgf) × N / (C × W)', () => {
    const tensionNPerCm = (1 * 9.80665 * 2) / 10; // 1 kgf × 2 layers spread over 10 cm
    const bandageForm = (4620 * 1 * 2) / (36 * 10); // 25.67 mmHg
    expect(laplacePressureMmHg(tensionNPerCm, 36) / bandageForm).toBeCloseTo(1, 3);
  });

  it('uses 133.322 Pa per mmHg', () => {
    expect(pascalPerMmHg).toBe(133.322);
  });

  it('is proportional to tension and inverse to girth (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.double({ min: 10, max: 150, noNaN: true }),
        fc.double({ min: 1.1, max: 3, noNaN: true }),
        (t, g, k) => {
          const p = laplacePressureMmHg(t, g);
          expect(laplacePressureMmHg(t * k, g) / p).toBeCloseTo(k, 9);
          expect(laplacePressureMmHg(t, g * k) / p).toBeCloseTo(1 / k, 9);
        },
      ),
    );
  });

  it('rejects a girth of zero', () => {
    expect(() => laplacePressureMmHg(1, 0)).toThrow(RangeError);
  });
});

// An invented fabric test for the interpolation checks (not a measured fabric).
const curve = [
  { extension: 0.4, tensionNPerCm: 0.6 },
  { extension: 0.2, tensionNPerCm: 0.25 },
  { extension: 0.6, tensionNPerCm: 1.0 },
];

describe('tensionAt', () => {
  it('interpolates linearly between measured points (given in any order)', () => {
    expect(tensionAt(curve, 0.2)).toBeCloseTo(0.25, 12);
    expect(tensionAt(curve, 0.3)).toBeCloseTo(0.425, 12);
    expect(tensionAt(curve, 0.5)).toBeCloseTo(0.8, 12);
  });

  it('runs from the origin below the first point and is slack at or below zero', () => {
    expect(tensionAt(curve, 0.1)).toBeCloseTo(0.125, 12);
    expect(tensionAt(curve, 0)).toBe(0);
    expect(tensionAt(curve, -0.05)).toBe(0);
  });

  it('extends the last segment beyond the test, and says so', () => {
    expect(tensionAt(curve, 0.8)).toBeCloseTo(1.4, 12);
    expect(withinCurve(curve, 0.8)).toBe(false);
    expect(withinCurve(curve, 0.6)).toBe(true);
  });

  it('never leaves the range of its neighbours inside the curve (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 0.6, noNaN: true }), (x) => {
        const t = tensionAt(curve, x);
        expect(t).toBeGreaterThanOrEqual(0);
        expect(t).toBeLessThanOrEqual(1.0 + 1e-12);
      }),
    );
  });

  it('refuses an empty curve', () => {
    expect(() => tensionAt([], 0.2)).toThrow(RangeError);
  });
});

describe('compressionEstimate', () => {
  // Product design §11: extension = body girth ÷ garment relaxed girth − 1. 90 / 72 − 1 = 0.25.
  it('computes the extension from the girths', () => {
    expect(garmentExtension(90, 72)).toBeCloseTo(0.25, 12);
  });

  it('combines extension, interpolated tension and Laplace pressure, with the caution', () => {
    const e = compressionEstimate({ bodyGirthCm: 90, garmentRelaxedGirthCm: 72, curve });
    expect(e.extension).toBeCloseTo(0.25, 12);
    // 0.25 lies between 0.2 (0.25 N/cm) and 0.4 (0.6 N/cm): 0.25 + 0.25 × 0.35 = 0.3375 N/cm.
    expect(e.tensionNPerCm).toBeCloseTo(0.3375, 12);
    // 33.75 N/m ÷ (0.9 / 2π m) = 235.62 Pa = 1.767 mmHg.
    expect(e.pressurePa).toBeCloseTo(235.619, 2);
    expect(e.pressureMmHg).toBeCloseTo(1.7673, 3);
    expect(e.caution).toBe(compressionCaution);
    expect(e.caution).toMatch(/not a medical rating/);
    expect(e.extrapolated).toBe(false);
    expect(e.notes).toEqual([]);
  });

  it('notes a slack garment and an extrapolated tension', () => {
    const slack = compressionEstimate({ bodyGirthCm: 70, garmentRelaxedGirthCm: 72, curve });
    expect(slack.slack).toBe(true);
    expect(slack.pressureMmHg).toBe(0);
    expect(slack.notes.length).toBe(1);
    const far = compressionEstimate({ bodyGirthCm: 90, garmentRelaxedGirthCm: 50, curve });
    expect(far.extrapolated).toBe(true);
    expect(far.notes.join(' ')).toMatch(/extrapolated/);
  });
});
