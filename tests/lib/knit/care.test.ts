import { describe, expect, it } from 'vitest';
import {
  careAdvice, careCategories, careLines, careOption, careOptions, fibreCareLimits, type CareCategory,
} from '@/lib/knit/care';
import { fibreIds, fibres, type Fibre } from '@/lib/knit/fibres';

const fToC = (f: number) => ((f - 32) * 5) / 9;

describe('the care wordings', () => {
  it('uses the Care Labeling Rule water temperatures for cold, warm and hot (16 CFR 423 Appendix A, references.md §3, verified-2nd)', () => {
    // Cold: up to 86 °F; warm: 87–111 °F; hot: 112–145 °F.
    const wash = (id: string) => careOption('wash', id);
    expect(wash('machine-30-gentle').us).toMatch(/cold/);
    expect(wash('machine-30-gentle').maxC!).toBeLessThanOrEqual(fToC(86) + 1e-9);
    expect(wash('machine-40').us).toMatch(/warm/);
    expect(wash('machine-40').maxC!).toBeGreaterThan(fToC(86));
    expect(wash('machine-40').maxC!).toBeLessThanOrEqual(fToC(111));
    expect(wash('machine-60').us).toMatch(/hot/);
    expect(wash('machine-60').maxC!).toBeGreaterThanOrEqual(fToC(112));
    expect(wash('machine-60').maxC!).toBeLessThanOrEqual(fToC(145));
  });

  it('orders each category strictest first, ranks 0, 1, 2, … (the product’s own list)', () => {
    for (const category of careCategories) {
      expect(careOptions[category].map((o) => o.rank)).toEqual(careOptions[category].map((_, i) => i));
      for (const o of careOptions[category]) expect(o.category).toBe(category);
    }
    // Temperatures rise with the rank where the options carry one.
    const temps = careOptions.iron.flatMap((o) => (o.maxC === undefined ? [] : [o.maxC]));
    expect(temps).toEqual([...temps].sort((a, b) => a - b));
  });
});

describe('fibre care limits against the fibre registry (lib/knit/fibres.ts)', () => {
  it('names a known option and a source status for every fibre and category', () => {
    for (const id of fibreIds) {
      const limits = fibreCareLimits[id];
      for (const category of careCategories) {
        expect(() => careOption(category, limits[category])).not.toThrow();
        expect(['verified', 'verified-2nd', 'common-practice', 'memory']).toContain(limits.sources[category].status);
        expect(limits.sources[category].why.length).toBeGreaterThan(3);
      }
    }
  });

  it('never allows an iron above a fibre’s dry-heat limit (registry values: memory, or computed for polylactide)', () => {
    for (const id of fibreIds) {
      const f: Fibre = fibres[id];
      const iron = careOption('iron', fibreCareLimits[id].iron);
      if (f.heatLimitC !== undefined && iron.maxC !== undefined) expect(iron.maxC).toBeLessThanOrEqual(f.heatLimitC);
    }
  });

  it('never allows a wash above a fibre’s wet-processing limit (elastane 120 °C, polylactide 115 °C: memory)', () => {
    for (const id of fibreIds) {
      const f: Fibre = fibres[id];
      const wash = careOption('wash', fibreCareLimits[id].wash);
      if (f.wetLimitC !== undefined) expect(wash.maxC!).toBeLessThanOrEqual(f.wetLimitC);
    }
  });
});

describe('careAdvice: the strictest fibre wins', () => {
  it('a polyamide/elastane compression knit: 40 °C, no bleach, no tumble drying, cool iron, no dry cleaning (common practice; elastane bleach and solvent limits from memory)', () => {
    const a = careAdvice({ polyamide: 0.78, elastane: 0.22 });
    expect(a.categories.wash.limit.id).toBe('machine-40');
    expect(a.categories.wash.decidedBy).toEqual(['polyamide', 'elastane']);
    expect(a.categories.bleach.limit.id).toBe('no-bleach');
    expect(a.categories.bleach.decidedBy).toEqual(['elastane']);
    expect(a.categories.dry.limit.id).toBe('line-dry');
    expect(a.categories.dry.limit.eu).toMatch(/Do not tumble dry/);
    expect(a.categories.dry.decidedBy).toEqual(['elastane']);
    expect(a.categories.iron.limit.id).toBe('iron-cool');
    expect(a.categories.dryClean.limit.id).toBe('no-dry-clean');
    expect(a.categories.dryClean.status).toBe('memory');
    expect(a.categories.dry.status).toBe('common-practice');
  });

  it('a trace of elastane still rules out the dryer (every fibre present counts; common practice)', () => {
    const a = careAdvice({ polyester: 0.99, elastane: 0.01 });
    expect(a.categories.dry.decidedBy).toEqual(['elastane']);
    expect(a.categories.dry.allowed.map((o) => o.id)).toEqual(['dry-flat', 'line-dry']);
    // Polyester alone would take a 60 °C wash and the dryer (from memory).
    const pes = careAdvice({ polyester: 1 });
    expect(pes.categories.wash.limit.id).toBe('machine-60');
    expect(pes.categories.dry.limit.id).toBe('tumble-low');
    expect(pes.categories.iron.limit.id).toBe('iron-warm');
  });

  it('takes the lowest wash temperature and the lowest iron of the fibres (wool hand wash; polypropylene no iron: memory)', () => {
    const a = careAdvice({ polyamide: 0.5, wool: 0.3, polypropylene: 0.2 });
    expect(a.categories.wash.limit.id).toBe('hand-30');
    expect(a.categories.wash.decidedBy).toEqual(['wool']);
    expect(a.categories.iron.limit.id).toBe('no-iron');
    expect(a.categories.iron.decidedBy).toEqual(['polypropylene']);
    expect(a.categories.dry.limit.id).toBe('dry-flat');
  });

  it('is the same whatever the order of the fibres (invariant)', () => {
    const a = careAdvice({ elastane: 0.2, cotton: 0.5, viscose: 0.3 });
    const b = careAdvice({ viscose: 0.3, cotton: 0.5, elastane: 0.2 });
    for (const c of careCategories) expect(a.categories[c].limit.id).toBe(b.categories[c].limit.id);
  });

  it('is never more permissive than any single fibre’s limit (invariant over every pair of fibres)', () => {
    for (const x of fibreIds) {
      for (const y of fibreIds) {
        const a = careAdvice({ [x]: 0.6, [y]: 0.4 });
        for (const c of careCategories as readonly CareCategory[]) {
          const rx = careOption(c, fibreCareLimits[x][c]).rank;
          const ry = careOption(c, fibreCareLimits[y][c]).rank;
          expect(a.categories[c].limit.rank).toBe(Math.min(rx, ry));
        }
      }
    }
  });

  it('suggests the print line with a heat transfer, and no softener on synthetic knits (common practice)', () => {
    expect(careAdvice({ polyamide: 0.8, elastane: 0.2 }, { heatTransfer: true }).extras).toEqual(['like-colours', 'inside-out', 'no-iron-trim', 'no-softener']);
    expect(careAdvice({ cotton: 1 }).extras).toEqual(['like-colours']);
  });

  it('refuses an empty garment or an unknown fibre', () => {
    expect(() => careAdvice({})).toThrow(RangeError);
    expect(() => careAdvice({ kevlar: 1 } as never)).toThrow(/Unknown fibre/);
  });

  it('carries the Care Labeling Rule notes: a washing or dry-cleaning instruction (§423.6(b)) and a permanent label (§423.1(a)), verified', () => {
    const notes = careAdvice({ polyamide: 1 }).notes.join(' ');
    expect(notes).toMatch(/423\.6\(b\)/);
    expect(notes).toMatch(/423\.1\(a\)/);
    expect(notes).toMatch(/each market/);
  });
});

describe('careLines', () => {
  const advice = careAdvice({ polyamide: 0.8, elastane: 0.2 }, { heatTransfer: true });

  it('writes the limit of every category, then the extras, in the region’s words', () => {
    expect(careLines(advice, 'eu')).toEqual([
      'Machine wash at 40 °C',
      'Do not bleach',
      'Do not tumble dry; line dry in the shade',
      'Cool iron, up to 110 °C',
      'Do not dry clean',
      'Wash with similar colours',
      'Wash and iron inside out',
      'Do not iron on the print or transfer',
      'Do not use fabric softener',
    ]);
    expect(careLines(advice, 'us').slice(0, 2)).toEqual(['Machine wash warm', 'Do not bleach']);
  });

  it('takes a stricter choice and refuses one beyond the limit', () => {
    expect(careLines(advice, 'us', { wash: 'machine-30-gentle' }, [])[0]).toBe('Machine wash cold, gentle cycle');
    expect(() => careLines(advice, 'eu', { wash: 'machine-60' })).toThrow(/beyond/);
    expect(() => careLines(advice, 'eu', { dry: 'tumble-low' })).toThrow(/beyond/);
  });
});
