import { describe, expect, it } from 'vitest';
import { generatePanels, defaultMeasurements, type GarmentKind } from '@/lib/knit/outline';
import { isSimplePolygon, rasterizePanel } from '@/lib/knit/raster';

const density = { walesPerCm: 18, coursesPerCm: 24 };
const garments: GarmentKind[] = ['long-sleeve-top', 'short-sleeve-top', 'tank', 'sports-bra', 'legging', 'shorts'];

describe('generatePanels', () => {
  it('a seamless body panel is half the cylinder needles wide (product design: panel = half the cylinder)', () => {
    const panels = generatePanels({ garment: 'long-sleeve-top', construction: 'seamless', machineNeedles: 1232, density, baseTextureId: 't' });
    expect(panels.map((p) => p.kind)).toEqual(['front', 'back', 'sleeve-left', 'sleeve-right']);
    expect(panels[0]!.widthNeedles).toBe(616);
    // 60 cm body length at 24 courses/cm = 1440 courses.
    expect(panels[0]!.heightCourses).toBe(1440);
    expect(panels[0]!.knittedArea).toEqual([{ x: 0, y: 0 }, { x: 616, y: 0 }, { x: 616, y: 1440 }, { x: 0, y: 1440 }]);
  });

  it.each(garments)('%s: outlines are simple polygons inside their panels, for both constructions', (garment) => {
    for (const construction of ['seamless', 'flat'] as const) {
      const panels = generatePanels({ garment, construction, machineNeedles: construction === 'flat' ? 1000 : 1232, density, baseTextureId: 't' });
      for (const p of panels) {
        expect(isSimplePolygon(p.cutOutline)).toBe(true);
        for (const v of p.cutOutline) {
          expect(v.x).toBeGreaterThanOrEqual(0);
          expect(v.x).toBeLessThanOrEqual(p.widthNeedles);
          expect(v.y).toBeGreaterThanOrEqual(0);
          expect(v.y).toBeLessThanOrEqual(p.heightCourses);
          expect(Number.isInteger(v.x) && Number.isInteger(v.y)).toBe(true);
        }
        if (construction === 'flat') expect(p.knittedArea).toEqual(p.cutOutline);
      }
    }
  });

  it('the front neckline is deeper than the back, so the front keeps fewer stitches', () => {
    const [front, back] = generatePanels({ garment: 'tank', construction: 'seamless', machineNeedles: 1144, density, baseTextureId: 't' });
    const inside = (p: typeof front) => rasterizePanel(p!).stitches.t!.inside;
    expect(inside(front)).toBeLessThan(inside(back));
    // Cut-away waste is counted outside the cut outline but inside the knitted tube.
    const r = rasterizePanel(front!);
    expect(r.stitches.t!.inside + r.stitches.t!.outside).toBe(front!.widthNeedles * front!.heightCourses);
  });

  it('tank and bra have no sleeves; tops with sleeves get two sleeve panels', () => {
    for (const g of garments) {
      const kinds = generatePanels({ garment: g, construction: 'seamless', machineNeedles: 1232, density, baseTextureId: 't' }).map((p) => p.kind);
      expect(kinds.includes('sleeve-left')).toBe(defaultMeasurements(g).sleeveLengthCm > 0);
    }
  });
});
