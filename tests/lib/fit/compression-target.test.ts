import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compressionEstimate, laplacePressureMmHg, tensionAt } from '@/lib/fit/compression';
import {
  checkCompression, compressionFigureCaution, defaultPressureBands, extensionForTension, halfWidthForPressure,
} from '@/lib/fit/compression-target';

// A plated mock-rib test curve (extension as a fraction, N per cm): invented demo values.
const curve = [
  { extension: 0.1, tensionNPerCm: 0.3 },
  { extension: 0.2, tensionNPerCm: 0.7 },
  { extension: 0.3, tensionNPerCm: 1.2 },
  { extension: 0.4, tensionNPerCm: 1.8 },
  { extension: 0.6, tensionNPerCm: 3.3 },
];

// Laplace’s law for a cylinder, P = T / r ("The use of the Laplace equation in the
// calculation of sub-bandage pressure", World Wide Wounds, 2002), worked by hand [COMPUTED]:
// chest 96 cm on a 31 cm half-width (62 cm relaxed girth): extension 96/62 − 1 = 0.548387;
// tension 1.8 + (0.148387 / 0.2) × 1.5 = 2.912903 N/cm; r = 0.96 / 2π = 0.152789 m;
// P = 291.2903 / 0.152789 = 1906.5 Pa = 14.300 mmHg.
describe('the compression estimate of a size', () => {
  it('gives 14.30 mmHg for a 31 cm half-width on a 96 cm chest', () => {
    const e = compressionEstimate({ bodyGirthCm: 96, garmentRelaxedGirthCm: 62, curve });
    expect(e.extension).toBeCloseTo(0.548387, 6);
    expect(e.tensionNPerCm).toBeCloseTo(2.912903, 6);
    expect(e.pressureMmHg).toBeCloseTo(14.2999, 3);
  });

  it('is inside the moderate band and outside the firm one (too loose), with advice to reduce the chest', () => {
    const base = { size: 'M', pointLabel: 'Chest half-width', girthLabel: 'Chest', bodyGirthCm: 96, garmentHalfWidthCm: 31, curve };
    expect(checkCompression({ ...base, band: defaultPressureBands.moderate, levelLabel: 'moderate' }).status).toBe('within');
    const firm = checkCompression({ ...base, band: defaultPressureBands.firm, levelLabel: 'firm' });
    expect(firm.status).toBe('below');
    // Middle of the firm band, 25 mmHg: T = 25 × 133.322 × 0.152789 / 100 = 5.0925 N/cm, beyond the
    // test's last point, so on the last segment's slope (7.5 N/cm per unit): e = 0.6 + 1.7925 / 7.5
    // = 0.8390; half-width 96 / 1.8390 / 2 = 26.10 cm [COMPUTED].
    expect(firm.finding!.targetHalfWidthCm).toBeCloseTo(26.101, 2);
    expect(firm.finding!.changeCm).toBeCloseTo(26.101 - 31, 2);
    expect(firm.finding!.advice).toMatch(/^Reduce the chest half-width of size M by 4\.9 cm, to 26\.1 cm/);
    expect(firm.finding!.message).toMatch(/too loose/);
  });

  it('is too tight in the mild band, with advice to increase', () => {
    const mild = checkCompression({
      size: 'M', pointLabel: 'Chest half-width', girthLabel: 'Chest', bodyGirthCm: 96, garmentHalfWidthCm: 31, curve,
      band: defaultPressureBands.mild, levelLabel: 'mild',
    });
    expect(mild.status).toBe('above');
    expect(mild.finding!.changeCm).toBeGreaterThan(0);
    expect(mild.finding!.advice).toMatch(/^Increase the chest half-width/);
    // The wider edge of the range gives the band's lower limit, the narrower its upper limit.
    const { fromCm, toCm } = mild.finding!.rangeCm!;
    expect(fromCm).toBeLessThan(toCm);
  });

  it('a garment wider than the body is slack: no pressure, a finding', () => {
    const c = checkCompression({
      size: 'XL', pointLabel: 'Waist half-width', girthLabel: 'Waist', bodyGirthCm: 80, garmentHalfWidthCm: 41, curve,
      band: defaultPressureBands.moderate, levelLabel: 'moderate',
    });
    expect(c.status).toBe('slack');
    expect(c.estimate.pressureMmHg).toBe(0);
    expect(c.finding!.changeCm).toBeLessThan(0);
  });

  it('says when the fabric cannot reach the band', () => {
    const flat = [{ extension: 0.2, tensionNPerCm: 0.1 }, { extension: 0.4, tensionNPerCm: 0.1 }];
    const c = checkCompression({
      size: 'S', pointLabel: 'Calf half-width', girthLabel: 'Calf', bodyGirthCm: 36, garmentHalfWidthCm: 15, curve: flat,
      band: defaultPressureBands.firm, levelLabel: 'firm',
    });
    expect(c.finding!.targetHalfWidthCm).toBeNull();
    expect(c.finding!.advice).toMatch(/does not reach/);
  });

  it('names the caution: estimate, not medical, circulation', () => {
    expect(compressionFigureCaution).toMatch(/estimate/);
    expect(compressionFigureCaution).toMatch(/not a medical rating/);
    expect(compressionFigureCaution).toMatch(/circulation/);
  });
});

describe('turning the estimate round', () => {
  // 16 mmHg on a 96 cm chest: T = 16 × 133.322 × 0.152789 / 100 = 3.2592 N/cm; on the 0.4–0.6
  // segment e = 0.4 + (3.2592 − 1.8) / 1.5 × 0.2 = 0.59456; half-width 96 / 1.59456 / 2 = 30.102 cm.
  it('finds the half-width for a pressure: 16 mmHg on a 96 cm chest → 30.10 cm', () => {
    expect(halfWidthForPressure(curve, 96, 16)).toBeCloseTo(30.1023, 3);
  });

  it('finds the extension for a tension on the curve', () => {
    expect(extensionForTension(curve, 1.2)).toBeCloseTo(0.3, 9);
    expect(extensionForTension(curve, 0)).toBe(0);
  });

  it('gives back the half-width that made the pressure (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 60, max: 120, noNaN: true }), fc.double({ min: 0.05, max: 0.9, noNaN: true }), (body, e) => {
        const half = body / (1 + e) / 2;
        const p = laplacePressureMmHg(tensionAt(curve, e), body);
        expect(halfWidthForPressure(curve, body, p)).toBeCloseTo(half, 6);
      }),
    );
  });
});
