import { describe, expect, it } from 'vitest';
import { rectanglePolygon, type Panel, type Zone } from '@/lib/knit/panel';
import { rasterizePanel } from '@/lib/knit/raster';
import { needlePitchMm, type Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import {
  checkKnittedLogoDetail, checkTrimVentilation, runRules, stitchSizeMm, trimLabel, type Trim, type ZoneGrid,
} from '@/lib/rules';

const yarns: Yarn[] = [{ id: 'pa', name: 'pa', dtex: 78, fibres: [{ fibre: 'polyamide', share: 1 }], colour: { state: 'dyeable' } }];

const texture = (id: string, walesPerCm: number, coursesPerCm: number): Texture => ({
  id, name: id, repeat: { needles: 1, courses: 1, cells: [['knit']] }, feeders: [{ ground: 'pa' }],
  density: { walesPerCm, coursesPerCm }, loopMm: { knit: 2.4, tuck: 1.8 },
});
const jersey = texture('jersey', 20, 28);
const mesh = texture('mesh', 16, 24);
const textures = new Map([jersey, mesh].map((t) => [t.id, t]));

const zone = (id: string, fn: Zone['fn'], x: number, y: number, w: number, h: number, order = 1, textureId = 'mesh'): Zone => ({
  id, name: id, textureId, fn, order,
  polygon: [{ x, y }, { x: x + w, y }, { x: x + w, y: y + h }, { x, y: y + h }],
});

const panel = (zones: Zone[]): Panel => ({
  id: 'front', name: 'Front', kind: 'front', widthNeedles: 100, heightCourses: 100,
  knittedArea: rectanglePolygon(100, 100), cutOutline: rectanglePolygon(100, 100), baseTextureId: 'jersey', zones,
});

const trim = (id: string, box: Trim['box'], extra: Partial<Trim> = {}): Trim => ({
  id, name: id, panelId: 'front', kind: 'woven-label', method: 'sewn', box, ...extra,
});

function grids(p: Panel): Map<string, ZoneGrid> {
  const r = rasterizePanel(p, { zoneMap: true, counts: false });
  return new Map([[p.id, { width: r.width, height: r.height, zoneCells: r.zoneCells! }]]);
}

describe('trim over a ventilation zone (common practice, no published source)', () => {
  const p = panel([zone('Underarm vent', 'ventilation', 0, 0, 40, 40), zone('Side panel', 'compression', 60, 0, 40, 40, 1, 'jersey')]);

  it('flags a trim that covers part of a ventilation zone, with the share covered', () => {
    // Box 30..50 × 10..20: needles 30–39 are in the vent, 40–49 are not: half the trim.
    const found = checkTrimVentilation([trim('Neck label', { x: 30, y: 10, width: 20, height: 10 })], [p], grids(p));
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ rule: 'trim-ventilation', severity: 'warning', where: { panelId: 'front', zoneId: 'Underarm vent', trimIds: ['Neck label'] } });
    expect(found[0]?.message).toMatch(/Underarm vent \(50 % of the trim\)/);
  });

  it('leaves trims on closed zones or the base alone, and touching edges do not count', () => {
    expect(checkTrimVentilation([trim('a', { x: 60, y: 0, width: 20, height: 20 })], [p], grids(p))).toEqual([]);
    expect(checkTrimVentilation([trim('b', { x: 40, y: 50, width: 20, height: 20 })], [p], grids(p))).toEqual([]);
    // The box starts on the vent's right edge (x = 40): no stitch centre of the vent is inside it.
    expect(checkTrimVentilation([trim('c', { x: 40, y: 0, width: 10, height: 10 })], [p], grids(p))).toEqual([]);
  });

  it('counts the zone as it shows: a closed zone stacked over the vent hides it', () => {
    const covered = panel([zone('vent', 'ventilation', 0, 0, 40, 40, 1), zone('logo patch', 'trim-area', 0, 0, 20, 20, 2, 'jersey')]);
    expect(checkTrimVentilation([trim('a', { x: 5, y: 5, width: 10, height: 10 })], [covered], grids(covered))).toEqual([]);
    expect(checkTrimVentilation([trim('b', { x: 15, y: 5, width: 10, height: 10 })], [covered], grids(covered))).toHaveLength(1);
  });
});

describe('knitted logo finer than a stitch (stitch size from the relaxed density, product design §4)', () => {
  const p = panel([zone('Mesh', 'ventilation', 50, 0, 50, 100)]);
  const rasters = new Map([[p.id, rasterizePanel(p)]]);
  const logo = (detailMm: number | undefined, box = { x: 10, y: 10, width: 30, height: 20 }) =>
    trim('Chest logo', box, { kind: 'knitted-logo', method: 'knitted', ...(detailMm !== undefined ? { detailMm } : {}) });

  it('a stitch of 20 wales/cm × 28 courses/cm is 0.50 mm × 0.357 mm (10 ÷ density)', () => {
    expect(stitchSizeMm(jersey).widthMm).toBeCloseTo(0.5, 12);
    expect(stitchSizeMm(jersey).heightMm).toBeCloseTo(10 / 28, 12);
  });

  it('flags a detail under the larger of the stitch width and height, and passes one at or above it', () => {
    const fine = checkKnittedLogoDetail([logo(0.4)], rasters, textures, 28);
    expect(fine).toHaveLength(1);
    expect(fine[0]).toMatchObject({ rule: 'knitted-logo-detail', severity: 'warning', where: { textureId: 'jersey', trimIds: ['Chest logo'] } });
    expect(fine[0]?.message).toMatch(/0\.40 mm.*0\.50 mm wide and 0\.36 mm high/);
    expect(checkKnittedLogoDetail([logo(0.5)], rasters, textures, 28)).toEqual([]);
  });

  it('takes the coarsest stitch when the logo spans two textures (mesh 16 wales/cm: 0.625 mm)', () => {
    const across = logo(0.55, { x: 40, y: 10, width: 20, height: 20 });
    const found = checkKnittedLogoDetail([across], rasters, textures, 28);
    expect(found[0]?.where.textureId).toBe('mesh');
    expect(found[0]?.message).toMatch(/at least 0\.63 mm/);
  });

  it('falls back to the needle pitch (25.4 ÷ gauge) off the panel, and asks for a missing detail', () => {
    const off = checkKnittedLogoDetail([logo(0.5, { x: 500, y: 500, width: 10, height: 10 })], rasters, textures, 28);
    expect(off[0]?.message).toMatch(new RegExp(`one needle at 28 gauge is ${needlePitchMm(28).toFixed(2)} mm`));
    expect(checkKnittedLogoDetail([logo(undefined)], rasters, textures, 28)[0]?.severity).toBe('info');
  });

  it('ignores other trims', () => {
    expect(checkKnittedLogoDetail([trim('label', { x: 0, y: 0, width: 5, height: 5 }, { detailMm: 0.01 })], rasters, textures, 28)).toEqual([]);
  });
});

describe('runRules with trims', () => {
  it('runs the placement rules with the others and names trims by their names', () => {
    const p = panel([zone('Underarm vent', 'ventilation', 0, 0, 40, 40)]);
    const found = runRules({
      panels: [p], textures, yarns, machine: { construction: 'seamless', gauge: 28, maxYarns: 3 },
      trims: [
        trim('Vent label', { x: 5, y: 5, width: 10, height: 10 }),
        trim('Logo', { x: 50, y: 50, width: 10, height: 10 }, { kind: 'knitted-logo', method: 'knitted', detailMm: 0.2 }),
      ],
    });
    expect(found.map((f) => f.rule)).toEqual(expect.arrayContaining(['trim-ventilation', 'knitted-logo-detail']));
    expect(found.find((f) => f.rule === 'trim-ventilation')?.message).toMatch(/^Trim Vent label \(woven label\)/);
  });

  it('labels a trim without a name by its kind and id', () => {
    expect(trimLabel({ id: 't9', kind: 'care-label' })).toBe('care label t9');
    expect(trimLabel({ id: 't9', kind: 'heat-transfer', name: ' Chest logo ' })).toBe('Chest logo (heat transfer)');
  });
});
