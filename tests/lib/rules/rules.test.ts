import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fibres } from '@/lib/knit/fibres';
import { rectanglePolygon, type Panel, type Zone } from '@/lib/knit/panel';
import { needlePitchMm, type StitchAction, type Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import {
  checkCompressionElastane,
  checkFloats,
  checkTrimHeat,
  checkTrimReheat,
  checkTuckStacks,
  checkYarnCount,
  checkZoneRepeats,
  defaultRuleLimits,
  describeRuleLimits,
  resolveRuleLimits,
  runRules,
  textureMap,
  textureUsages,
  texturesUnderBox,
  type RuleMachine,
  type Trim,
} from '@/lib/rules';
import { firstLatticeStitch } from '@/lib/rules/usage';
import { rasterizePanel } from '@/lib/knit/raster';
import { yarnMap } from '@/lib/knit/yarn';

// ---- builders ---------------------------------------------------------------------------------

const yarn = (id: string, make: [Yarn['fibres'][number]['fibre'], number][]): Yarn => ({
  id,
  name: id,
  dtex: 78,
  fibres: make.map(([fibre, share]) => ({ fibre, share })),
  colour: { state: 'dyeable' },
});

const yarns = [
  yarn('pa', [['polyamide', 1]]),
  yarn('pa2', [['polyamide', 1]]),
  yarn('el', [['elastane', 1]]),
  yarn('pes', [['polyester', 1]]),
  yarn('pp', [['polypropylene', 1]]),
];

const K = 'knit' as const;
const T = 'tuck' as const;
const M = 'miss' as const;

/** A texture from chart rows ('k', 't', 'm'), every course fed by `ground`, plated with `plated`. */
function texture(
  id: string,
  rows: string[],
  ground = 'pa',
  plated: string | ((course: number) => string | undefined) | undefined = 'el',
): Texture {
  const cells: StitchAction[][] = rows.map((r) => [...r].map((ch) => (ch === 'k' ? K : ch === 't' ? T : M)));
  return {
    id,
    name: id,
    repeat: { needles: cells[0]?.length ?? 0, courses: cells.length, cells },
    feeders: cells.map((_, c) => {
      const p = typeof plated === 'function' ? plated(c) : plated;
      return p ? { ground, plated: { yarn: p, draft: 2.8 } } : { ground };
    }),
    density: { walesPerCm: 16, coursesPerCm: 22 },
    loopMm: { knit: 2.8, tuck: 3.2 },
  };
}

const jersey = texture('jersey', ['k']);

function zone(id: string, textureId: string, x0: number, y0: number, x1: number, y1: number, fn: Zone['fn'] = 'support'): Zone {
  return {
    id,
    name: id,
    textureId,
    fn,
    order: 1,
    polygon: [
      { x: x0, y: y0 },
      { x: x1, y: y0 },
      { x: x1, y: y1 },
      { x: x0, y: y1 },
    ],
  };
}

function panel(id: string, zones: Zone[] = [], base = 'jersey', width = 120, height = 200): Panel {
  return {
    id,
    name: id,
    kind: 'front',
    widthNeedles: width,
    heightCourses: height,
    knittedArea: rectanglePolygon(width, height),
    cutOutline: rectanglePolygon(width, height),
    baseTextureId: base,
    zones,
  };
}

const seamless: RuleMachine = { construction: 'seamless', gauge: 28, maxYarns: 3 };
const usagesOf = (panels: Panel[], textures: Texture[]) => textureUsages(panels, textureMap(textures));

// ---- rules ------------------------------------------------------------------------------------

describe('checkYarnCount', () => {
  // Common practice, no published source: a seamless machine carries about two to three yarns; the
  // limit comes from the machine setup.
  it('flags a style with more distinct yarns than the machine carries', () => {
    const mesh = texture('mesh', ['kt'], 'pa2', 'el');
    const accent = texture('accent', ['k'], 'pes', undefined);
    const panels = [panel('front', [zone('z1', 'mesh', 0, 0, 40, 40), zone('z2', 'accent', 40, 0, 80, 40)])];
    const textures = textureMap([jersey, mesh, accent]);
    const found = checkYarnCount(panels, textures, seamless);
    expect(found).toHaveLength(1);
    expect(found[0]?.severity).toBe('error');
    expect(found[0]?.where.yarnIds).toEqual(['pa', 'el', 'pa2', 'pes']);
    expect(checkYarnCount(panels, textures, { maxYarns: 4 })).toEqual([]);
  });
});

describe('checkFloats', () => {
  // Float = consecutive misses × needle pitch; pitch = 25.4 / E mm (references.md §7b).
  // 7 misses at E28 = 7 × 0.9071 = 6.35 mm > 6 mm; at E32 = 5.56 mm ≤ 6 mm.
  const floaty = texture('floaty', ['kmmmmmmm']);

  it('flags a float longer than the limit, placed on its first stitch in the zone', () => {
    const panels = [panel('front', [zone('z', 'floaty', 10, 20, 60, 60)])];
    const found = checkFloats(usagesOf(panels, [jersey, floaty]), seamless, defaultRuleLimits);
    expect(found).toHaveLength(1);
    const f = found[0];
    expect(f?.rule).toBe('float-length');
    expect(f?.severity).toBe('warning');
    expect(f?.message).toContain(`${(7 * needlePitchMm(28)).toFixed(1)} mm`);
    // Float starts at repeat needle 1; the first needle ≥ 10 with needle mod 8 = 1 is 17.
    expect(f?.where).toMatchObject({ panelId: 'front', zoneId: 'z', textureId: 'floaty', needle: 17, course: 20 });
  });

  it('accepts the same float at a finer gauge', () => {
    const panels = [panel('front', [zone('z', 'floaty', 0, 0, 64, 64)])];
    expect(checkFloats(usagesOf(panels, [jersey, floaty]), { gauge: 32 }, defaultRuleLimits)).toEqual([]);
  });

  it('makes a course that misses on every needle an error', () => {
    const gap = texture('gap', ['kk', 'mm']);
    const found = checkFloats(usagesOf([panel('front', [], 'gap')], [gap]), seamless, defaultRuleLimits);
    expect(found[0]?.severity).toBe('error');
    expect(found[0]?.where.course).toBe(1);
  });
});

describe('checkTuckStacks', () => {
  const stack = (tucks: number) => texture(`t${tucks}`, [...Array.from({ length: tucks }, () => 'tk'), 'kk']);

  it('flags more stacked tucks than the limit, and passes the limit itself', () => {
    const five = stack(5);
    const four = stack(4);
    const found = checkTuckStacks(usagesOf([panel('front', [zone('z', 't5', 0, 0, 40, 60)])], [jersey, five]), defaultRuleLimits);
    expect(found).toHaveLength(1);
    expect(found[0]?.message).toMatch(/5 tucks/);
    expect(found[0]?.where).toMatchObject({ zoneId: 'z', needle: 0, course: 0 });
    expect(checkTuckStacks(usagesOf([panel('front', [zone('z', 't4', 0, 0, 40, 60)])], [jersey, four]), defaultRuleLimits)).toEqual([]);
  });

  it('flags a needle that tucks and never knits', () => {
    const never = texture('never', ['tk', 'tk']);
    const found = checkTuckStacks(usagesOf([panel('front', [], 'never')], [never]), defaultRuleLimits);
    expect(found[0]?.message).toMatch(/never knits/);
  });
});

describe('studio limits', () => {
  // The studio's own limits replace the defaults key by key; the figures are the studio's (invented here).
  it('takes the keys a studio set and says where each limit comes from', () => {
    expect(resolveRuleLimits(null)).toEqual({ limits: defaultRuleLimits, source: { maxFloatMm: 'default', maxTuckStack: 'default' } });
    const set = resolveRuleLimits({ maxFloatMm: 8 });
    expect(set).toEqual({ limits: { maxFloatMm: 8, maxTuckStack: defaultRuleLimits.maxTuckStack }, source: { maxFloatMm: 'studio', maxTuckStack: 'default' } });
    expect(describeRuleLimits(set)).toBe(`floats up to 8 mm (studio setting), ${defaultRuleLimits.maxTuckStack} stacked tucks (default)`);
    // Stored values that are not a positive number fall back to the default.
    expect(resolveRuleLimits({ maxFloatMm: -1, maxTuckStack: 'x' }).source).toEqual({ maxFloatMm: 'default', maxTuckStack: 'default' });
  });

  it('runRules checks floats and tuck stacks against the limits it is given', () => {
    // 7 misses at E28 = 6.35 mm (pitch 25.4 / 28 mm, references.md §7b): over the 6 mm default, within 7 mm.
    const floaty = texture('floaty', ['kmmmmmmm']);
    const five = texture('t5', ['tk', 'tk', 'tk', 'tk', 'tk', 'kk']);
    const panels = [panel('front', [zone('a', 'floaty', 0, 0, 64, 64), zone('b', 't5', 64, 0, 104, 60)])];
    const input = { panels, textures: [jersey, floaty, five], yarns, machine: seamless };
    const rules = (f: ReturnType<typeof runRules>) => f.map((x) => x.rule).filter((r) => r === 'float-length' || r === 'tuck-stack').sort();
    expect(rules(runRules(input))).toEqual(['float-length', 'tuck-stack']);
    expect(rules(runRules({ ...input, limits: resolveRuleLimits({ maxFloatMm: 7, maxTuckStack: 5 }).limits }))).toEqual([]);
  });
});

describe('checkZoneRepeats', () => {
  const rib = texture('rib', ['kkmm', 'kkmm']); // 4 × 2 repeat

  const run = (z: Zone) => checkZoneRepeats(usagesOf([panel('front', [z])], [jersey, rib]));

  it('flags a zone narrower than its repeat', () => {
    const found = run(zone('z', 'rib', 8, 10, 11, 20));
    expect(found[0]?.severity).toBe('warning');
    expect(found[0]?.message).toMatch(/smaller than one 4 × 2 repeat/);
  });

  it('passes a zone of whole repeats on the lattice', () => {
    expect(run(zone('z', 'rib', 8, 10, 16, 20))).toEqual([]);
  });

  it('notes a zone that ends on a partial repeat, with the edge', () => {
    const found = run(zone('z', 'rib', 8, 10, 18, 20));
    expect(found[0]?.severity).toBe('info');
    expect(found[0]?.where).toMatchObject({ needle: 18, course: 10 });
  });

  it('does not count the panel edge as a partial repeat', () => {
    // 108 is on the 4-needle lattice; the right edge is clipped to the 120-needle panel's edge.
    expect(run(zone('z', 'rib', 108, 10, 130, 20))).toEqual([]);
  });
});

describe('checkCompressionElastane', () => {
  const y = yarnMap(yarns);
  // Plated elastane on every other course only.
  const half = texture('half', ['k', 'k'], 'pa', (c) => (c % 2 === 0 ? 'el' : undefined));
  const full = texture('full', ['k', 'k'], 'pa', 'el');

  it('flags a compression zone whose texture lacks elastane in some course', () => {
    const found = checkCompressionElastane(usagesOf([panel('front', [zone('c', 'half', 0, 31, 40, 80, 'compression')])], [jersey, half]), y);
    expect(found).toHaveLength(1);
    expect(found[0]?.severity).toBe('error');
    // Repeat course 1 (second course); first course ≥ 31 with course mod 2 = 1 is 31.
    expect(found[0]?.where).toMatchObject({ zoneId: 'c', course: 31, yarnIds: ['pa', 'el'] });
  });

  it('passes full plating, and does not apply to other zone functions', () => {
    expect(checkCompressionElastane(usagesOf([panel('front', [zone('c', 'full', 0, 0, 40, 80, 'compression')])], [jersey, full]), y)).toEqual([]);
    expect(checkCompressionElastane(usagesOf([panel('front', [zone('v', 'half', 0, 0, 40, 80, 'ventilation')])], [jersey, half]), y)).toEqual([]);
  });
});

describe('trim heat', () => {
  const ppMesh = texture('pp-mesh', ['k'], 'pp', undefined);
  const panels = [panel('front', [zone('logo-area', 'pp-mesh', 40, 40, 80, 80, 'trim-area')])];
  const rasters = new Map(panels.map((p) => [p.id, rasterizePanel(p)]));
  const textures = textureMap([jersey, ppMesh]);
  const y = yarnMap(yarns);
  const heatLimit = (id: keyof typeof fibres): number => {
    const limit = fibres[id].heatLimitC;
    if (limit === undefined) throw new Error(`the registry gives ${id} no heat limit`);
    return limit;
  };
  const elastaneLimit = heatLimit('elastane'); // registry: a low-authority secondary source
  const ppLimit = heatLimit('polypropylene'); // registry: from memory
  const trim = (id: string, box: Trim['box'], tempC?: number, method: Trim['method'] = 'heat-press'): Trim => ({
    id,
    panelId: 'front',
    kind: 'heat-transfer',
    method,
    ...(tempC === undefined ? {} : { tempC }),
    box,
  });

  it('reads the textures under a box from the raster', () => {
    const r = rasters.get('front');
    expect(r && texturesUnderBox(r, { x: 30, y: 30, width: 20, height: 20 })).toEqual(['jersey', 'pp-mesh']);
    expect(r && texturesUnderBox(r, { x: 0, y: 0, width: 10, height: 10 })).toEqual(['jersey']);
  });

  it('flags a transfer hotter than the elastane under it', () => {
    // Jersey is polyamide plated with elastane; which of them suffer depends on their registry limits.
    const temp = elastaneLimit + 10;
    const found = checkTrimHeat([trim('t1', { x: 0, y: 0, width: 20, height: 10 }, temp)], rasters, textures, y);
    expect(found).toHaveLength(1);
    expect(found[0]?.message).toMatch(/elastane \(limit/);
    const hurt = [heatLimit('polyamide') < temp ? 'pa' : null, 'el'].filter((v) => v !== null);
    expect(found[0]?.where).toMatchObject({ panelId: 'front', textureId: 'jersey', yarnIds: hurt, trimIds: ['t1'] });
  });

  it('passes a transfer within the limits of every fibre under it', () => {
    expect(checkTrimHeat([trim('t1', { x: 0, y: 0, width: 20, height: 10 }, Math.min(elastaneLimit, heatLimit('polyamide')))], rasters, textures, y)).toEqual([]);
  });

  it('flags polypropylene only when the box covers the zone knitted with it', () => {
    const temp = ppLimit + 10;
    expect(temp).toBeLessThanOrEqual(elastaneLimit); // so only polypropylene can be hurt
    const over = checkTrimHeat([trim('t1', { x: 50, y: 50, width: 10, height: 10 }, temp)], rasters, textures, y);
    expect(over[0]?.where.yarnIds).toEqual(['pp']);
    expect(checkTrimHeat([trim('t2', { x: 0, y: 0, width: 10, height: 10 }, temp)], rasters, textures, y)).toEqual([]);
  });

  it('asks for a temperature on a heat-applied trim, and ignores sewn ones', () => {
    expect(checkTrimHeat([trim('t1', { x: 0, y: 0, width: 5, height: 5 })], rasters, textures, y)[0]?.severity).toBe('warning');
    expect(checkTrimHeat([trim('t1', { x: 0, y: 0, width: 5, height: 5 }, 400, 'sewn')], rasters, textures, y)).toEqual([]);
  });

  it('flags a second heat application on the same area', () => {
    const a = trim('a', { x: 0, y: 0, width: 20, height: 20 }, 150);
    const b = trim('b', { x: 10, y: 10, width: 20, height: 20 }, 150);
    const beside = trim('c', { x: 20, y: 0, width: 10, height: 15 }, 150); // touches a, overlaps b
    const sewn = trim('d', { x: 5, y: 5, width: 5, height: 5 }, undefined, 'sewn');
    const found = checkTrimReheat([a, b, beside, sewn]);
    expect(found.map((f) => f.where.trimIds)).toEqual([
      ['a', 'b'],
      ['b', 'c'],
    ]);
  });
});

describe('runRules', () => {
  it('runs every rule, errors first, with locations', () => {
    const floaty = texture('floaty', ['kmmmmmmm']);
    const panels = [
      panel('front', [zone('f', 'floaty', 0, 0, 64, 64), zone('x', 'missing', 0, 64, 16, 80)]),
      panel('back'),
    ];
    const found = runRules({
      panels,
      textures: [jersey, floaty],
      yarns,
      machine: { ...seamless, maxYarns: 2 },
      dye: {
        route: 'garment-dyed',
        targets: [
          { id: 'navy', yarnIds: ['pa'], colour: { L: 22, a: 3, b: -25 } },
          { id: 'red', yarnIds: ['pa2'], colour: { L: 45, a: 60, b: 35 } },
        ],
      },
      trims: [{ id: 'logo', panelId: 'back', kind: 'heat-transfer', method: 'heat-press', tempC: 400, box: { x: 0, y: 0, width: 10, height: 10 } }],
    });
    const rules = found.map((f) => f.rule);
    expect(rules).toEqual(expect.arrayContaining(['unknown-texture', 'float-length', 'dye-clash', 'trim-heat']));
    expect(rules).not.toContain('yarn-count'); // jersey and floaty use pa + el only
    const severities = found.map((f) => f.severity);
    expect(severities).toEqual([...severities].sort((p, q) => ['error', 'warning', 'info'].indexOf(p) - ['error', 'warning', 'info'].indexOf(q)));
    expect(found.find((f) => f.rule === 'dye-clash')?.where.yarnIds?.sort()).toEqual(['pa', 'pa2']);
    expect(found.find((f) => f.rule === 'trim-heat')?.where.panelId).toBe('back');
  });

  it('finds nothing on a plain jersey style', () => {
    expect(runRules({ panels: [panel('front'), panel('back')], textures: [jersey], yarns, machine: seamless })).toEqual([]);
  });
});

describe('firstLatticeStitch', () => {
  it('is the first stitch at or after the edge with the given place in the repeat (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 500, noNaN: true }), fc.integer({ min: 1, max: 24 }), fc.nat(), (min, period, o) => {
        const offset = o % period;
        const s = firstLatticeStitch(min, period, offset);
        expect(s % period).toBe(offset);
        expect(s + 0.5).toBeGreaterThanOrEqual(min); // its centre is inside
        expect(s - period + 0.5).toBeLessThan(min); // and no earlier one is
      }),
    );
  });
});
