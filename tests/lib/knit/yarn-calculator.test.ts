import { describe, expect, it } from 'vitest';
import { rectanglePolygon, type Panel } from '@/lib/knit/panel';
import { needlePitchMm, type Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import { gradePointsFor, gradedSizeStitches, orderTable, panelGrades, yarnCalculator, type GradedPoints, type YarnCalculatorInput } from '@/lib/knit/yarn-calculator';
import { consumptionBySize } from '@/lib/knit/consumption';

const pa: Yarn = { id: 'pa', name: 'PA 78', dtex: 78, fibres: [{ fibre: 'polyamide', share: 1 }], colour: { state: 'dyeable' } };
const el: Yarn = { id: 'el', name: 'EL 44', dtex: 44, fibres: [{ fibre: 'elastane', share: 1 }], colour: { state: 'dyeable' } };

const jersey = (id: string, plated: boolean): Texture => ({
  id, name: id,
  repeat: { needles: 1, courses: 1, cells: [['knit']] },
  feeders: [{ ground: 'pa', ...(plated ? { plated: { yarn: 'el', draft: 2.8 } } : {}) }],
  density: { walesPerCm: 20, coursesPerCm: 25 },
  loopMm: { knit: 2.6, tuck: 2.2 },
});
const textures = new Map([['plain', jersey('plain', false)], ['comp', jersey('comp', true)]]);

function panel(id: string, kind: Panel['kind'], zones: Panel['zones'] = []): Panel {
  return {
    id, name: id, kind, widthNeedles: 100, heightCourses: 200,
    knittedArea: rectanglePolygon(100, 200),
    cutOutline: [{ x: 0, y: 50 }, { x: 100, y: 50 }, { x: 100, y: 200 }, { x: 0, y: 200 }],
    baseTextureId: 'plain', zones,
  };
}
const band = { id: 'z', name: 'band', textureId: 'comp', fn: 'compression' as const, order: 1, polygon: [{ x: 0, y: 100 }, { x: 100, y: 100 }, { x: 100, y: 150 }, { x: 0, y: 150 }] };
const panels = [panel('f', 'front', [band]), panel('b', 'back'), panel('sl', 'sleeve-left')];

// A graded spec: S is 2 cm narrower in chest half-width (50 → 48) and 1.5 cm shorter (60 → 58.5);
// the sleeve 1 cm shorter (60 → 59) with the armhole 1 cm less (20 → 19).
const graded: GradedPoints = {
  'chest-half': { S: 48, M: 50, L: 52 },
  'body-length-hps': { S: 58.5, M: 60, L: 61.5 },
  'sleeve-length': { S: 59, M: 60, L: 61 },
  armhole: { S: 19, M: 20, L: 21 },
};

const base: YarnCalculatorInput = {
  panels, textures, yarns: [pa, el], gauge: 28, garment: 'long-sleeve-top', sizes: ['S', 'M', 'L'], baseSize: 'M',
  graded, wasteAllowance: 0.05, method: 'nominal', garments: { S: 100, M: 200, L: 0 },
};

describe('grading panels by width × length (common practice, no published source)', () => {
  it('picks chest × body length for body panels, armhole × sleeve length for sleeves, hip × (inseam + rise) for bottoms', () => {
    expect(gradePointsFor('long-sleeve-top', 'front').width[0]).toEqual(['chest-half']);
    expect(gradePointsFor('long-sleeve-top', 'front').length[0]).toEqual(['body-length-hps']);
    expect(gradePointsFor('long-sleeve-top', 'sleeve-right')).toEqual({ width: [['armhole'], ['chest-half']], length: [['sleeve-length']] });
    expect(gradePointsFor('legging', 'front')).toMatchObject({ width: [['hip-half'], ['thigh-half'], ['waist-half']], length: [['inseam', 'rise'], ['inseam'], ['rise']] });
  });

  it('scales by the ratios to the base size: S body = 48/50 × 58.5/60, sleeve = 19/20 × 59/60 (hand computed)', () => {
    const g = panelGrades({ garment: 'long-sleeve-top', panels, baseSize: 'M', size: 'S', values: graded });
    expect(g[0]!.factor).toBeCloseTo((48 / 50) * (58.5 / 60), 12);
    expect(g[0]!.widthPoints).toEqual(['chest-half']);
    expect(g[2]!.factor).toBeCloseTo((19 / 20) * (59 / 60), 12);
    expect(panelGrades({ garment: 'long-sleeve-top', panels, baseSize: 'M', size: 'M', values: null })[0]!.factor).toBe(1);
  });

  it('falls back to the next point, counts a missing dimension as 1, and gives null with neither', () => {
    const partial: GradedPoints = { 'bottom-half': { S: 45, M: 50 } };
    const g = panelGrades({ garment: 'tank', panels: [panels[0]!], baseSize: 'M', size: 'S', values: partial });
    expect(g[0]).toMatchObject({ widthPoints: ['bottom-half'], lengthRatio: null });
    expect(g[0]!.factor).toBeCloseTo(0.9, 12);
    expect(panelGrades({ garment: 'tank', panels: [panels[0]!], baseSize: 'M', size: 'S', values: {} })[0]!.factor).toBeNull();
  });
});

describe('yarnCalculator', () => {
  const { figures, summary } = yarnCalculator(base);

  it('per texture: stitches inside and outside the cut lines and the metres and grams of each yarn (product design §3, §5)', () => {
    const comp = figures.textures.find((t) => t.textureId === 'comp')!;
    expect(comp).toMatchObject({ inside: 5000, outside: 0 });
    const pam = comp.yarns.find((y) => y.yarnId === 'pa')!;
    const elm = comp.yarns.find((y) => y.yarnId === 'el')!;
    // One knit per stitch: 2.6 mm of PA; the elastane is drafted 2.8, so 2.6 / 2.8 mm off the package.
    expect(pam.metres).toBeCloseTo((5000 * 2.6) / 1000, 9);
    expect(elm.metres).toBeCloseTo((5000 * 2.6) / 2.8 / 1000, 9);
    // grams = metres × tex / 1000 (tex = dtex / 10).
    expect(pam.grams).toBeCloseTo((13 * 7.8) / 1000, 9);
    const plain = figures.textures.find((t) => t.textureId === 'plain')!;
    expect(plain.outside).toBe(3 * 100 * 50);
    expect(plain.yarns[0]!.grams).toBeGreaterThan(plain.yarns[0]!.keptGrams);
  });

  it('the base size is the body map as drawn, with the waste allowance on the knitted grams', () => {
    const m = figures.sizes.find((s) => s.size === 'M')!;
    expect(m.basis).toBe('drawn');
    expect(m.consumption).toEqual(summary.consumption);
    const y = m.consumption!.yarns.pa!;
    expect(y.grossGrams).toBeCloseTo(y.knittedGrams * 1.05, 9);
  });

  it('other sizes scale the stitches panel by panel, so grams scale by the same factors', () => {
    const s = figures.sizes.find((x) => x.size === 'S')!;
    expect(s.basis).toBe('graded');
    const fb = (48 / 50) * (58.5 / 60);
    const fs = (19 / 20) * (59 / 60);
    // The elastane is only in the front band: it scales with the body factor alone.
    expect(s.consumption!.yarns.el!.knittedGrams).toBeCloseTo(figures.sizes[1]!.consumption!.yarns.el!.knittedGrams * fb, 9);
    // Polyamide: two body panels and a sleeve of equal grams before grading (the band is PA too, in equal loops).
    const perPanel = figures.sizes[1]!.consumption!.yarns.pa!.knittedGrams / 3;
    expect(s.consumption!.yarns.pa!.knittedGrams).toBeCloseTo(perPanel * (2 * fb + fs), 9);
    expect(figures.grading.mode).toBe('graded');
    expect(figures.grading.explanation).toMatch(/body panels: chest half-width × body length from HPS; sleeves: armhole × sleeve length/);
  });

  it('without a graded spec shows the base size’s grams for every size and says so', () => {
    const { figures: f } = yarnCalculator({ ...base, graded: null });
    expect(f.sizes.map((s) => s.basis)).toEqual(['base-grams', 'drawn', 'base-grams']);
    expect(f.sizes[0]!.consumption).toEqual(f.sizes[1]!.consumption);
    expect(f.grading.mode).toBe('base-only');
    expect(f.grading.explanation).toMatch(/no graded size spec/);
  });

  it('orders the run: gross grams × garments per size, kg rounded up to 0.1 (lib/knit/consumption orderQuantities)', () => {
    const o = figures.order!;
    const gS = figures.sizes[0]!.consumption!.yarns.pa!.grossGrams;
    const gM = figures.sizes[1]!.consumption!.yarns.pa!.grossGrams;
    expect(o.yarns.pa!.grams).toBeCloseTo(100 * gS + 200 * gM, 6);
    expect(o.yarns.pa!.kg).toBeCloseTo(Math.ceil((100 * gS + 200 * gM) / 100 - 1e-9) / 10, 9);
    expect(o.totalGarments).toBe(300);
    expect(o.garments.L).toBe(0);
  });

  it('gives the content and both labels from the kept grams, and the care advice for those fibres', () => {
    expect(figures.content!.labels.eu.text).toMatch(/polyamide/);
    expect(figures.content!.labels.us.text).toMatch(/nylon.*spandex/);
    const grams = figures.content!.fibreGrams;
    expect(grams.elastane! / (grams.elastane! + grams.polyamide!)).toBeCloseTo(figures.content!.shares.elastane!, 9);
    expect(figures.care!.categories.dry.decidedBy).toEqual(['elastane']);
  });

  it('computes costs only with prices, and only when every yarn has one', () => {
    expect(figures.sizes[1]!.costPerGarment).toBeUndefined();
    const priced = yarnCalculator({ ...base, pricesPerKg: { pa: 10, el: 20 } }).figures;
    const m = priced.sizes[1]!;
    expect(m.costPerGarment).toBeCloseTo((m.consumption!.yarns.pa!.grossGrams * 10 + m.consumption!.yarns.el!.grossGrams * 20) / 1000, 9);
    expect(priced.order!.cost).toBeCloseTo(priced.order!.yarns.pa!.kg * 10 + priced.order!.yarns.el!.kg * 20, 9);
    const missing = yarnCalculator({ ...base, pricesPerKg: { pa: 10 } }).figures;
    expect(missing.unpricedYarnIds).toEqual(['el']);
    expect(missing.order!.cost).toBeUndefined();
  });

  it('spends a float of one needle pitch on a miss (product design §3)', () => {
    const floaty: Texture = { ...jersey('float', false), repeat: { needles: 2, courses: 1, cells: [['knit', 'miss']] } };
    const t = new Map([['float', floaty]]);
    const p = { ...panel('f', 'front'), baseTextureId: 'float' };
    const f = yarnCalculator({ ...base, panels: [p], textures: t }).figures;
    const stitches = 100 * 200;
    expect(f.textures[0]!.yarns[0]!.metres).toBeCloseTo((stitches / 2) * (2.6 + needlePitchMm(28)) / 1000, 9);
  });

  it('writes the order table with a header and one row per yarn; prices only when asked', () => {
    const rows = orderTable(figures, [{ id: 'pa', name: 'PA 78', supplierRef: 'R1', dtex: 78, pricePerKg: 10 }, { id: 'el', name: 'EL 44', supplierRef: '', dtex: 44 }]);
    expect(rows[0]).toEqual([
      'yarn', 'supplier_ref', 'dtex', 'g_per_garment_S', 'g_per_garment_M', 'g_per_garment_L', 'garments_S', 'garments_M', 'garments_L',
      'kg_S', 'kg_M', 'kg_L', 'kg_run', 'kg_order', 'waste_allowance_pct',
    ]);
    expect(rows).toHaveLength(3);
    expect(rows[1]![0]).toBe('PA 78');
    expect(rows[1]![13]).toBe(figures.order!.yarns.pa!.kg);
    expect(orderTable(figures, [{ id: 'pa', name: 'PA 78', supplierRef: 'R1', dtex: 78, pricePerKg: 10 }], { withPrices: true })[0]).toContain('order_cost');
  });

  it('refuses a waste allowance outside 0–100 %', () => {
    expect(() => yarnCalculator({ ...base, wasteAllowance: -0.1 })).toThrow(RangeError);
  });
});

describe('gradedSizeStitches (the body map summary\'s size picker and the calculator share it)', () => {
  it('scales each panel by its grade; the calculator\'s per-size grams come from the same stitches', () => {
    const { figures, summary } = yarnCalculator(base);
    const s = gradedSizeStitches({ garment: 'long-sleeve-top', panels, rasters: summary.rasters, baseSize: 'M', size: 'S', graded });
    expect(s.basis).toBe('graded');
    // Front: chest 48/50 × length 58.5/60 (the grade of the spec above).
    const front = summary.rasters.get('f')!.stitches.plain!;
    expect(s.panels![0]!.stitches.plain!.inside).toBeCloseTo(front.inside * (48 / 50) * (58.5 / 60), 9);
    const grams = consumptionBySize({ sizes: [{ size: 'S', panels: s.panels! }], textures, yarns: [pa, el], gauge: 28, wasteAllowance: base.wasteAllowance }).S!;
    expect(grams.grossGrams).toBeCloseTo(figures.sizes.find((x) => x.size === 'S')!.consumption!.grossGrams, 9);
    expect(grams.grossGrams).toBeLessThan(figures.sizes.find((x) => x.size === 'M')!.consumption!.grossGrams);
  });

  it('the base size is drawn as it is; a size without graded values takes the base size\'s grams', () => {
    const { summary } = yarnCalculator(base);
    expect(gradedSizeStitches({ garment: 'long-sleeve-top', panels, rasters: summary.rasters, baseSize: 'M', size: 'M', graded }).basis).toBe('drawn');
    const none = gradedSizeStitches({ garment: 'long-sleeve-top', panels, rasters: summary.rasters, baseSize: 'M', size: 'S', graded: null });
    expect(none).toMatchObject({ basis: 'base-grams', panels: null });
  });
});
