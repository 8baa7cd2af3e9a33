import { describe, expect, it } from 'vitest';
import { rectanglePolygon, type Panel } from '@/lib/knit/panel';
import { rasterizePanel } from '@/lib/knit/raster';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import {
  allowanceForLoss,
  consumptionBySize,
  garmentConsumption,
  keptYarnGrams,
  orderQuantities,
} from '@/lib/knit/consumption';

const yarn = (id: string, dtex: number, fibre: Yarn['fibres'][number]['fibre']): Yarn => ({
  id,
  name: id,
  dtex,
  fibres: [{ fibre, share: 1 }],
  colour: { state: 'dyeable' },
});

const jersey = (id: string, feeder: Texture['feeders'][number], loopMm: number, density = { walesPerCm: 10, coursesPerCm: 10 }): Texture => ({
  id,
  name: id,
  repeat: { needles: 1, courses: 1, cells: [['knit']] },
  feeders: [feeder],
  density,
  loopMm: { knit: loopMm, tuck: loopMm },
});

describe('garmentConsumption', () => {
  it('reproduces the references.md §7(f) example: 0.85 m² kept at 160 g/m², 15 % cut away, 5 % process loss → 168.4 g', () => {
    // 1000 × 1000 stitches at 10 × 10 per cm = 100 cm × 100 cm = 1 m² knitted.
    // 2 mm loops of 80 tex (800 dtex): 100 loops/cm² × 2 × 80 / 100 = 160 g/m² (handbook p.147 (c)).
    // Cut outline: 1000 × 850 stitches = 0.85 m² kept; the other 15 % is cut away (marker waste).
    const yarns = [yarn('y', 800, 'cotton')];
    const t = jersey('jersey', { ground: 'y' }, 2);
    const p: Panel = {
      id: 'p',
      name: 'body',
      kind: 'front',
      widthNeedles: 1000,
      heightCourses: 1000,
      knittedArea: rectanglePolygon(1000, 1000),
      cutOutline: rectanglePolygon(1000, 850),
      baseTextureId: 'jersey',
      zones: [],
    };
    const c = garmentConsumption({ panels: [rasterizePanel(p)], textures: [t], yarns, gauge: 28, wasteAllowance: allowanceForLoss(0.05) });
    // Kept 0.85 × 160 = 136 g; knitted 136 / 0.85 = 160 g; to buy 160 / 0.95 = 168.42 g.
    expect(c.keptGrams).toBeCloseTo(136, 9);
    expect(c.knittedGrams).toBeCloseTo(160, 9);
    expect(c.grossGrams).toBeCloseTo(168.42, 2);
    expect(c.yarns.y?.cutAwayGrams).toBeCloseTo(24, 9);
  });

  it('splits a plated texture into its yarns, per size, and orders a run', () => {
    const yarns = [yarn('pa78', 78, 'polyamide'), yarn('el44', 44, 'elastane')];
    const t = jersey('jersey', { ground: 'pa78', plated: { yarn: 'el44', draft: 3 } }, 3);
    // Per stitch: polyamide 3 mm × 7.8 tex × 1e-6 = 2.34e-5 g; elastane 3 mm × (4.4 / 3) tex × 1e-6 = 4.4e-6 g.
    const bySize = consumptionBySize({
      sizes: [
        { size: 'S', panels: [{ stitches: { jersey: { inside: 1_000_000, outside: 200_000 } } }] },
        { size: 'M', panels: [{ stitches: { jersey: { inside: 600_000, outside: 120_000 } } }, { stitches: { jersey: { inside: 600_000, outside: 120_000 } } }] },
      ],
      textures: { jersey: t },
      yarns,
      gauge: 28,
      wasteAllowance: 0.05,
    });
    const s = bySize.S;
    const m = bySize.M;
    // S: polyamide knitted 1.2e6 × 2.34e-5 = 28.08 g, kept 23.4 g, gross 28.08 × 1.05 = 29.484 g.
    expect(s?.yarns.pa78?.knittedGrams).toBeCloseTo(28.08, 9);
    expect(s?.yarns.pa78?.keptGrams).toBeCloseTo(23.4, 9);
    expect(s?.yarns.pa78?.grossGrams).toBeCloseTo(29.484, 9);
    // S: elastane knitted 1.2e6 × 4.4e-6 = 5.28 g, kept 4.4 g.
    expect(s?.yarns.el44?.knittedGrams).toBeCloseTo(5.28, 9);
    expect(s && keptYarnGrams(s)).toEqual({ pa78: expect.closeTo(23.4, 9), el44: expect.closeTo(4.4, 9) });
    // M: 1.44e6 stitches: polyamide 33.696 g, gross 35.3808 g; elastane 6.336 g, gross 6.6528 g.
    expect(m?.yarns.pa78?.grossGrams).toBeCloseTo(35.3808, 9);
    expect(m?.yarns.el44?.grossGrams).toBeCloseTo(6.6528, 9);

    // 500 × S + 800 × M. Polyamide 29.484 × 500 + 35.3808 × 800 = 14 742 + 28 304.64 = 43 046.64 g → 43.1 kg.
    // Elastane 5.544 × 500 + 6.6528 × 800 = 2 772 + 5 322.24 = 8 094.24 g → 8.1 kg.
    const order = orderQuantities({ bySize, garments: { S: 500, M: 800 } });
    expect(order.yarns.pa78?.grams).toBeCloseTo(43046.64, 6);
    expect(order.yarns.pa78?.gramsBySize.S).toBeCloseTo(14742, 6);
    expect(order.yarns.pa78?.kg).toBe(43.1);
    expect(order.yarns.el44?.kg).toBe(8.1);
    expect(order.kg).toBe(51.2);
    // In whole 2.5 kg cones: 43.05 → 18 cones = 45 kg; 8.09 → 4 cones = 10 kg.
    const cones = orderQuantities({ bySize, garments: { S: 500, M: 800 }, roundUpToKg: 2.5 });
    expect(cones.yarns.pa78?.kg).toBe(45);
    expect(cones.yarns.el44?.kg).toBe(10);
  });

  it('does not round an exact multiple up, skips sizes with no garments, and rejects bad input', () => {
    const yarns = [yarn('y', 100, 'polyester')];
    const t = jersey('t', { ground: 'y' }, 2.5);
    // Per stitch 2.5 mm × 10 tex × 1e-6 = 2.5e-5 g; 40 000 stitches = 1 g per garment; 1000 garments = 1 kg.
    const c = garmentConsumption({ panels: [{ stitches: { t: { inside: 40_000, outside: 0 } } }], textures: [t], yarns, gauge: 28 });
    expect(c.grossGrams).toBeCloseTo(1, 12);
    const order = orderQuantities({ bySize: { S: c }, garments: { S: 1000, XL: 0 } });
    expect(order.yarns.y?.kg).toBe(1);
    expect(() => orderQuantities({ bySize: { S: c }, garments: { S: -1 } })).toThrow(RangeError);
    expect(() => orderQuantities({ bySize: { S: c }, garments: { M: 10 } })).toThrow(/size "M"/);
    expect(() => garmentConsumption({ panels: [{ stitches: { nope: { inside: 1, outside: 0 } } }], textures: [t], yarns, gauge: 28 })).toThrow(/nope/);
    expect(() => garmentConsumption({ panels: [], textures: [t], yarns, gauge: 28, wasteAllowance: -0.1 })).toThrow(RangeError);
  });

  it('allowanceForLoss: a 5 % loss needs 5.263 % on top (1 / 0.95 = 1.05263)', () => {
    expect(1 + allowanceForLoss(0.05)).toBeCloseTo(1 / 0.95, 12);
    expect(allowanceForLoss(0)).toBe(0);
    expect(() => allowanceForLoss(1)).toThrow(RangeError);
  });
});
