import { describe, expect, it } from 'vitest';
import { rectanglePolygon, type Panel } from '@/lib/knit/panel';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import { summariseBodyMap } from '@/lib/knit/summary';

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

function panel(id: string, zones: Panel['zones'] = []): Panel {
  return {
    id, name: id, kind: id === 'f' ? 'front' : 'back', widthNeedles: 100, heightCourses: 200,
    knittedArea: rectanglePolygon(100, 200),
    // Keep the top 50 courses out of the garment (cut away).
    cutOutline: [{ x: 0, y: 50 }, { x: 100, y: 50 }, { x: 100, y: 200 }, { x: 0, y: 200 }],
    baseTextureId: 'plain', zones,
  };
}

describe('summariseBodyMap', () => {
  it('counts stitches and area per texture, inside and outside the cut lines', () => {
    const zone = { id: 'z', name: 'band', textureId: 'comp', fn: 'compression' as const, order: 1, polygon: [{ x: 0, y: 100 }, { x: 100, y: 100 }, { x: 100, y: 150 }, { x: 0, y: 150 }] };
    const s = summariseBodyMap({ panels: [panel('f', [zone]), panel('b')], textures, yarns: [pa, el], gauge: 28 });
    const comp = s.textures.find((t) => t.textureId === 'comp')!;
    const plain = s.textures.find((t) => t.textureId === 'plain')!;
    expect(comp).toMatchObject({ inside: 100 * 50, outside: 0 });
    expect(plain.inside).toBe(2 * 100 * 150 - 5000);
    expect(plain.outside).toBe(2 * 100 * 50);
    // Area: stitches ÷ (20 × 25 stitches per cm²) — product design §4.
    expect(comp.insideCm2).toBeCloseTo(5000 / 500, 9);
  });

  it('grams and content follow from kept stitches; elastane only where plated', () => {
    const zone = { id: 'z', name: 'band', textureId: 'comp', fn: 'compression' as const, order: 1, polygon: rectanglePolygon(100, 200) };
    const s = summariseBodyMap({ panels: [panel('f', [zone])], textures, yarns: [pa, el], gauge: 28 });
    // Hand check: 78 dtex PA and 44 dtex EL at draft 2.8 on equal loop lengths:
    // EL share = (44/2.8) / (78 + 44/2.8) = 15.714 / 93.714 = 16.77 % (references.md §7(e) worked example).
    expect(s.content!.elastane!).toBeCloseTo(15.714286 / 93.714286, 5);
    expect(s.labels!.eu.text).toMatch(/83 % polyamide.*17 % elastane/);
    expect(s.labels!.us.text).toMatch(/nylon/i);
    expect(s.consumption!.yarns.pa!.cutAwayGrams).toBeGreaterThan(0);
  });

  it('reuses the raster of an unchanged panel and redraws a changed one', () => {
    const f = panel('f');
    const b = panel('b');
    const first = summariseBodyMap({ panels: [f, b], textures, yarns: [pa, el], gauge: 28 });
    const b2 = { ...b, zones: [{ id: 'z', name: 'z', textureId: 'comp', fn: 'compression' as const, order: 1, polygon: rectanglePolygon(10, 10) }] };
    const second = summariseBodyMap({ panels: [f, b2], textures, yarns: [pa, el], gauge: 28, previous: { panels: [f, b], rasters: first.rasters } });
    expect(second.rasters.get('f')).toBe(first.rasters.get('f'));
    expect(second.rasters.get('b')).not.toBe(first.rasters.get('b'));
  });

  it('names an unknown texture instead of computing grams', () => {
    const s = summariseBodyMap({ panels: [{ ...panel('f'), baseTextureId: 'missing' }], textures, yarns: [pa], gauge: 28 });
    expect(s.consumption).toBeNull();
    expect(s.problems[0]).toMatch(/not in the library/);
  });
});
