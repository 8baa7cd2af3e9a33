import { describe, expect, it } from 'vitest';
import { generatePanels, defaultMeasurements, outlineMeasurementsFromSpec, type GarmentKind } from '@/lib/knit/outline';
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

describe('outlineMeasurementsFromSpec', () => {
  it('a wider chest half-width gives a wider fashioned body panel in needles (panel width = chest half-width × wales per cm)', () => {
    const narrow = outlineMeasurementsFromSpec('long-sleeve-top', { 'chest-half': 44 });
    const wide = outlineMeasurementsFromSpec('long-sleeve-top', { 'chest-half': 52 });
    const front = (m: typeof narrow) => generatePanels({ garment: 'long-sleeve-top', construction: 'flat', machineNeedles: 2000, density, measurements: m, baseTextureId: 't' })[0]!;
    // 44 cm × 18 wales/cm = 792 needles; 52 cm × 18 = 936.
    expect(front(narrow).widthNeedles).toBe(792);
    expect(front(wide).widthNeedles).toBe(936);
  });

  it('takes each missing, empty or non-positive point from the defaults', () => {
    const m = outlineMeasurementsFromSpec('long-sleeve-top', { 'body-length-hps': 66, 'sleeve-length': null, 'across-shoulder': 0 });
    expect(m).toEqual({ ...defaultMeasurements('long-sleeve-top'), lengthCm: 66 });
    expect(outlineMeasurementsFromSpec('tank', {})).toEqual(defaultMeasurements('tank'));
  });

  it('a longer body length gives more courses (60 → 66 cm at 24 courses/cm: 1440 → 1584)', () => {
    const m = outlineMeasurementsFromSpec('long-sleeve-top', { 'body-length-hps': 66 });
    const [front] = generatePanels({ garment: 'long-sleeve-top', construction: 'seamless', machineNeedles: 1232, density, measurements: m, baseTextureId: 't' });
    expect(front!.heightCourses).toBe(1584);
  });

  it('reads the straight armhole as the diagonal from shoulder point to underarm (3-4-5 triangle)', () => {
    // Chest half 44, across shoulder 36: the underarm sits 4 cm out; a 5 cm straight armhole is 3 cm deep.
    expect(outlineMeasurementsFromSpec('long-sleeve-top', { 'chest-half': 44, 'across-shoulder': 36, armhole: 5 }).armholeDepthCm).toBeCloseTo(3, 9);
  });

  it('bottoms: the outseam is inseam + rise; thigh and ankle half-widths shape the leg', () => {
    const m = outlineMeasurementsFromSpec('legging', { inseam: 70, rise: 24, 'thigh-half': 22, 'ankle-half': 9 });
    expect(m.lengthCm).toBe(94);
    expect(m.riseCm).toBe(24);
    expect(m.thighHalfCm).toBe(22);
    expect(m.legOpeningHalfCm).toBe(9);
  });
});

describe('raglan sleeves', () => {
  const length = (a: { x: number; y: number }, b: { x: number; y: number }, d = density) => Math.hypot((b.x - a.x) / d.walesPerCm, (b.y - a.y) / d.coursesPerCm);

  it.each([
    ['seamless', 1232, density],
    ['flat', 1000, density],
    ['seamless', 1144, { walesPerCm: 13.5, coursesPerCm: 21 }],
  ] as const)('%s (%i needles): the body raglan line and the sleeve raglan line are the same length within two courses', (construction, machineNeedles, d) => {
    const [front, back, sleeve] = generatePanels({ garment: 'long-sleeve-top', construction, machineNeedles, density: d, sleeveStyle: 'raglan', baseTextureId: 't' });
    // Body: the outline runs neck point → underarm (left edge) with nothing between: a straight line.
    const body = (p: typeof front) => {
      const o = p!.cutOutline;
      const under = o.findIndex((v) => v.x === 0);
      return length(o[under - 1]!, o[under]!, d);
    };
    expect(body(front)).toBeCloseTo(body(back), 9);
    // Sleeve: top left → top right → underarm (right edge): the line from the top's corner to the underarm.
    const s = sleeve!.cutOutline;
    const sleeveLine = length(s[1]!, s[2]!, d);
    expect(s[2]!.x).toBe(sleeve!.widthNeedles);
    expect(Math.abs(sleeveLine - body(front))).toBeLessThanOrEqual(2 / d.coursesPerCm);
    // Common practice, no published source: a raglan body has no shoulder seam or armhole curve, so fewer vertices above the underarm.
    const setIn = generatePanels({ garment: 'long-sleeve-top', construction, machineNeedles, density: d, baseTextureId: 't' })[0]!;
    const underarmY = front!.cutOutline.find((v) => v.x === 0)!.y;
    expect(front!.cutOutline.filter((v) => v.y < underarmY).length).toBeLessThan(setIn.cutOutline.filter((v) => v.y < underarmY).length);
    for (const p of [front!, back!, sleeve!]) expect(isSimplePolygon(p.cutOutline)).toBe(true);
  });

  it('a raglan changes the outlines only: the same panel sizes, another sleeve top', () => {
    const raglan = generatePanels({ garment: 'long-sleeve-top', construction: 'seamless', machineNeedles: 1232, density, sleeveStyle: 'raglan', baseTextureId: 't' });
    const setIn = generatePanels({ garment: 'long-sleeve-top', construction: 'seamless', machineNeedles: 1232, density, baseTextureId: 't' });
    expect(raglan[0]!.widthNeedles).toBe(setIn[0]!.widthNeedles);
    expect(raglan[0]!.heightCourses).toBe(setIn[0]!.heightCourses);
    expect(raglan[2]!.cutOutline).not.toEqual(setIn[2]!.cutOutline);
  });

  it('garments without sleeves ignore the raglan choice; set-in is the default', () => {
    for (const g of ['tank', 'sports-bra', 'legging'] as const) {
      expect(generatePanels({ garment: g, construction: 'seamless', machineNeedles: 1232, density, sleeveStyle: 'raglan', baseTextureId: 't' }))
        .toEqual(generatePanels({ garment: g, construction: 'seamless', machineNeedles: 1232, density, baseTextureId: 't' }));
    }
    expect(generatePanels({ garment: 'long-sleeve-top', construction: 'seamless', machineNeedles: 1232, density, sleeveStyle: 'set-in', baseTextureId: 't' }))
      .toEqual(generatePanels({ garment: 'long-sleeve-top', construction: 'seamless', machineNeedles: 1232, density, baseTextureId: 't' }));
  });
});
