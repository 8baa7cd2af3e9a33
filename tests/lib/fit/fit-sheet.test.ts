import { describe, expect, it } from 'vitest';
import { compressionBySize, flatNeedles, seamlessNeedles } from '@/lib/fit/fit-sheet';
import { defaultCompressionTarget } from '@/lib/fit/compression-target';
import { defaultSeamlessFactor } from '@/lib/fit/needles';
import { defaultSizeSpec, pointsForGarment, seamlessFromCutAndSew } from '@/lib/fit/spec';
import { garmentPoints, pointsOfMeasure, tubePoints } from '@/lib/fit/points';

const sizes = ['S', 'M', 'L'];
const machine = { kind: 'circular' as const, diameterIn: 14, gauge: 28, needleMultiple: 4 };
const density = { walesPerCm: 21, coursesPerCm: 29 };
const values = {
  'chest-half': { S: 29, M: 31, L: 33 },
  'waist-half': { S: 25, M: 27, L: null },
  'body-length-hps': { S: 62, M: 64, L: 66 },
};

// Needles = π × diameter × gauge rounded to the machine's multiple, half-width = needles ÷ 2 ÷
// wales per cm (product design §10; needle formula as cited in lib/fit/needles.ts). By hand
// [COMPUTED]: 14″ → 1231.5 → 1232; 15″ → 1319.5 → 1320; 13″ → 1143.5 → 1144 (multiple 4).
describe('seamless needles and cylinder per size', () => {
  const sheet = seamlessNeedles({ garment: 'long-sleeve-top', machine, sizes, values, density, cylinderDiametersIn: [11, 12, 13, 14, 15, 16, 17] });
  const m = sheet.find((s) => s.size === 'M')!;

  it('recommends the cylinder nearest the chest: 31 cm at 21 wales/cm → 15″ (1320 needles, 31.43 cm, +0.43)', () => {
    expect(m.decidedBy).toBe('chest-half');
    expect(m.cylinder!.diameterIn).toBe(15);
    expect(m.cylinder!.needles).toBe(1320);
    expect(m.cylinder!.residualCm).toBeCloseTo(1320 / 42 - 31, 9);
  });

  it('gives the needles across each half-width: 31 × 21 = 651 at the chest', () => {
    expect(m.points.find((p) => p.point === 'chest-half')!.needlesAcrossHalfWidth).toBe(651);
  });

  it('gives the density that reaches the waist on the size cylinder, and the nearest cylinder on its own', () => {
    const waist = m.points.find((p) => p.point === 'waist-half')!;
    // 1320 / 2 / 27 = 24.444 wales/cm, 16.4 % denser; courses follow the same ratio (loop shape kept).
    expect(waist.onSizeCylinder.walesPerCm).toBeCloseTo(1320 / 54, 9);
    expect(waist.onSizeCylinder.change).toBeCloseTo(1320 / 54 / 21 - 1, 9);
    expect(waist.onSizeCylinder.coursesPerCm).toBeCloseTo(29 * (1320 / 54 / 21), 9);
    expect(waist.onSizeCylinder.loopLengthChange).toBeCloseTo(21 / (1320 / 54) - 1, 9);
    // 13″ gives 1144 / 42 = 27.24 cm: nearest on its own.
    expect(waist.nearest.diameterIn).toBe(13);
  });

  it('leaves out what has no value, and gives courses along the lengths: 64 × 29 = 1856', () => {
    const l = sheet.find((s) => s.size === 'L')!;
    expect(l.points.map((p) => p.point)).toEqual(['chest-half']);
    expect(m.lengths).toEqual([{ point: 'body-length-hps', lengthCm: 64, courses: 1856 }]);
  });

  it('has no cylinder for a size without a chest value', () => {
    const [row] = seamlessNeedles({ garment: 'long-sleeve-top', machine, sizes: ['S'], values: {}, density, cylinderDiametersIn: [14] });
    expect(row!.cylinder).toBeNull();
  });
});

describe('flat needles per point', () => {
  // Width × wales per cm (the definition of wale density): 45.1 × 7.3 = 329.2 → 329 needles.
  it('gives needles per course at each width point and checks the bed', () => {
    const [row] = flatNeedles({
      garment: 'short-sleeve-top', machine: { kind: 'flat', gauge: 14, bedNeedles: 300 }, sizes: ['M'],
      values: { 'chest-half': { M: 45.1 }, 'across-shoulder': { M: 40 }, 'body-length-hps': { M: 68 } }, density: { walesPerCm: 7.3, coursesPerCm: 9.5 },
    });
    expect(row!.widths.map((w) => [w.point, w.needles, w.fitsBed])).toEqual([['chest-half', 329, false], ['across-shoulder', 292, true]]);
    expect(row!.lengths).toEqual([{ point: 'body-length-hps', lengthCm: 68, courses: 646 }]);
  });
});

describe('compression per size and girth', () => {
  const curve = [
    { extension: 0.1, tensionNPerCm: 0.3 }, { extension: 0.2, tensionNPerCm: 0.7 }, { extension: 0.3, tensionNPerCm: 1.2 },
    { extension: 0.4, tensionNPerCm: 1.8 }, { extension: 0.6, tensionNPerCm: 3.3 },
  ];
  it('pairs each half-width with its body girth and says what is missing', () => {
    const [m] = compressionBySize({
      garment: 'long-sleeve-top', sizes: ['M'], values, girths: { M: { chest: 96 } }, curve, target: defaultCompressionTarget,
    });
    expect(m!.girths.map((g) => [g.girth, g.point, g.garmentGirthCm])).toEqual([['chest', 'chest-half', 62]]);
    // 14.30 mmHg (worked in compression-target.test.ts): inside the moderate band.
    expect(m!.girths[0]!.estimate.pressureMmHg).toBeCloseTo(14.2999, 3);
    expect(m!.girths[0]!.status).toBe('within');
    expect(m!.missing.map((x) => x.girth)).toEqual(['waist', 'hip']);
  });
});

describe('cut-and-sew to seamless', () => {
  // Common practice, no published source: a seamless chest half-width of about 19 in fits like a
  // 20.5 in cut-and-sew one (52.07 cm → 48.26 cm).
  it('converts entered cut-and-sew half-widths with the studio factor', () => {
    expect(seamlessFromCutAndSew({ 'chest-half': { M: 52.07 } }, defaultSeamlessFactor)['chest-half']!.M).toBeCloseTo(48.26, 9);
    expect(seamlessFromCutAndSew({ 'waist-half': { S: 40 } }, 0.9)['waist-half']!.S).toBeCloseTo(36, 9);
  });
});

describe('points of measure and the default spec', () => {
  it('starts a legging with its own points, common-practice grades and tolerances, and no values', () => {
    const spec = defaultSizeSpec('legging', 'S', 13);
    expect(spec.points.map((p) => p.point)).toEqual(garmentPoints.legging);
    expect(spec.points.every((p) => p.baseCm === null)).toBe(true);
    expect(spec.points.find((p) => p.point === 'calf-half')).toMatchObject({ gradeCm: 0.75, toleranceCm: 0.5 });
    expect(spec.cylinderDiametersIn).toContain(13);
  });

  it('a top tube is set at chest, waist and bottom; a legging at its leg tubes', () => {
    expect(tubePoints('long-sleeve-top')).toEqual(['chest-half', 'waist-half', 'bottom-half']);
    expect(tubePoints('legging')).toEqual(['thigh-half', 'knee-half', 'calf-half', 'ankle-half']);
    expect(tubePoints('shorts')).toEqual(['thigh-half']);
    expect(pointsOfMeasure['across-shoulder'].kind).toBe('width');
  });

  it('keeps points stored for another garment after the garment own ones', () => {
    const spec = defaultSizeSpec('tank', 'M');
    const withSleeve = { ...spec, points: [...spec.points, { point: 'inseam' as const, baseCm: 70, gradeCm: 0, toleranceCm: 1, overrides: {} }] };
    const pts = pointsForGarment(withSleeve, 'long-sleeve-top').map((p) => p.point);
    expect(pts).toEqual([...garmentPoints['long-sleeve-top'], 'inseam']);
  });
});
