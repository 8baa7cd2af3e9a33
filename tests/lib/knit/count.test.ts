import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  convertCount,
  countUnits,
  CountParseError,
  formatCount,
  NE_TEX_FACTOR,
  parseCount,
  parseCountDtex,
  type CountUnit,
} from '@/lib/knit/count';

describe('convertCount: published factors and worked examples', () => {
  it('denier = 9 × tex (ASTM D2260 table: "den = 9 × tex")', () => {
    expect(convertCount(1, 'tex', 'den')).toBe(9);
    expect(convertCount(270, 'den', 'tex')).toBeCloseTo(30, 12);
  });

  it('dtex = 10 × tex and Nm = 1000 / tex (pint default_en.txt: tex = g/km, number_meter = km/kg)', () => {
    expect(convertCount(7.8, 'tex', 'dtex')).toBeCloseTo(78, 12);
    expect(convertCount(20, 'tex', 'Nm')).toBeCloseTo(50, 12);
  });

  it('cotton count of 30 tex is 590.54 / 30 = 19.7 (ASTM D2260 worked example 2)', () => {
    const ne = convertCount(30, 'tex', 'Ne');
    expect(Number(ne.toFixed(1))).toBe(19.7);
    expect(ne).toBeCloseTo(590.54 / 30, 3);
  });

  it('Ne factor from the pint definitions: Ne = 840 yd/lb, yd = 0.9144 m, lb = 7000 × 64.79891 mg', () => {
    // Ne 1 = one pound per 840 yards; in g/km: (7000 × 0.06479891 g) / (840 × 0.9144 m) × 1000.
    const poundG = 7000 * 0.06479891;
    const texOfNe1 = (poundG / (840 * 0.9144)) * 1000;
    expect(convertCount(1, 'Ne', 'tex')).toBeCloseTo(texOfNe1, 9);
    // references.md §1: K = 590.5412 (computed from the exact yd and lb).
    expect(NE_TEX_FACTOR).toBeCloseTo(590.5412, 4);
  });

  it('agrees with the D2260 table cells 0.590 541 (Ne·tex/1000) and 0.885 812 (worsted = 1.5 × cotton count)', () => {
    expect(NE_TEX_FACTOR / 1000).toBeCloseTo(0.590541, 6);
    // D2260 worked example 1: "worsted count equivalent to a cotton count of 10 is 1.5 times 10".
    // Worsted hank 560 yd: its tex factor is 1.5 × the cotton factor; the table cell gives 0.885 812.
    expect((1.5 * NE_TEX_FACTOR) / 1000).toBeCloseTo(0.885812, 6);
  });

  it('Ne × denier ≈ 5315 ("Denier x Ne 5315", a secondary web source in references.md §1)', () => {
    expect(Math.round(convertCount(1, 'Ne', 'den'))).toBe(5315);
    // Exact: 9 × 590.5412 = 5314.871 (references.md §1, computed).
    expect(convertCount(1, 'Ne', 'den')).toBeCloseTo(5314.871, 3);
  });

  // references.md §1 worked-example table, computed from the exact definitions.
  const table: [string, number, CountUnit, Partial<Record<CountUnit, number>>][] = [
    ['Ne 30/1 cotton', 30, 'Ne', { tex: 19.6847, dtex: 196.847, den: 177.162, Nm: 50.801 }],
    ['Ne 40/1 cotton', 40, 'Ne', { tex: 14.7635, dtex: 147.635, den: 132.872, Nm: 67.734 }],
    ['78 dtex nylon filament', 78, 'dtex', { tex: 7.8, den: 70.2, Nm: 128.205, Ne: 75.71 }],
    ['40 den elastane', 40, 'den', { tex: 4.4444, dtex: 44.444, Nm: 225, Ne: 132.872 }],
    ['150 den polyester', 150, 'den', { tex: 16.6667, dtex: 166.667, Nm: 60, Ne: 35.432 }],
    ['30 tex (D2260 example)', 30, 'tex', { dtex: 300, den: 270, Nm: 33.333, Ne: 19.685 }],
  ];
  for (const [label, value, unit, expected] of table) {
    it(`worked example: ${label} (references.md §1 table, computed)`, () => {
      for (const [to, v] of Object.entries(expected) as [CountUnit, number][]) {
        // The table gives 3 decimals (4 for tex): compare to half a unit in the last place.
        const decimals = (String(v).split('.')[1] ?? '').length;
        expect(Math.abs(convertCount(value, unit, to) - v)).toBeLessThanOrEqual(0.5 * 10 ** -Math.max(decimals, 0) + 1e-9);
      }
    });
  }

  it('rejects counts that are not positive finite numbers', () => {
    expect(() => convertCount(0, 'dtex', 'den')).toThrow(RangeError);
    expect(() => convertCount(-5, 'Ne', 'tex')).toThrow(RangeError);
    expect(() => convertCount(Number.NaN, 'tex', 'tex')).toThrow(RangeError);
    expect(() => convertCount(Number.POSITIVE_INFINITY, 'Nm', 'tex')).toThrow(RangeError);
  });
});

describe('convertCount: properties (fast-check)', () => {
  const unit = fc.constantFrom(...countUnits);
  const value = fc.double({ min: 0.01, max: 1e5, noNaN: true });

  it('conversions invert: a → b → a returns the value', () => {
    fc.assert(
      fc.property(value, unit, unit, (v, a, b) => {
        const back = convertCount(convertCount(v, a, b), b, a);
        expect(Math.abs(back - v) / v).toBeLessThan(1e-12);
      }),
    );
  });

  it('conversions compose: a → b → c equals a → c', () => {
    fc.assert(
      fc.property(value, unit, unit, unit, (v, a, b, c) => {
        const viaB = convertCount(convertCount(v, a, b), b, c);
        const direct = convertCount(v, a, c);
        expect(Math.abs(viaB - direct) / direct).toBeLessThan(1e-12);
      }),
    );
  });

  it('direct counts grow and indirect counts shrink with mass per length', () => {
    fc.assert(
      fc.property(value, value, (t1, t2) => {
        fc.pre(t1 < t2);
        expect(convertCount(t1, 'tex', 'den')).toBeLessThan(convertCount(t2, 'tex', 'den'));
        expect(convertCount(t1, 'tex', 'Ne')).toBeGreaterThan(convertCount(t2, 'tex', 'Ne'));
      }),
    );
  });
});

describe('parseCount', () => {
  it('reads direct counts with the unit after the number', () => {
    expect(parseCountDtex('78 dtex')).toBe(78);
    expect(parseCountDtex('40den')).toBeCloseTo(40 / 0.9, 10);
    expect(parseCountDtex('70D')).toBeCloseTo(70 / 0.9, 10);
    expect(parseCountDtex('20 tex')).toBe(200);
    expect(parseCountDtex('1,5 tex')).toBe(15);
  });

  it('reads "Ne 30/1" as a single Ne 30 yarn (196.847 dtex, references.md §1 table)', () => {
    const p = parseCount('Ne 30/1');
    expect(p).toMatchObject({ unit: 'Ne', count: 30, plies: 1 });
    expect(p.dtex).toBeCloseTo(196.847, 3);
    expect(parseCountDtex('30/1 Ne')).toBeCloseTo(196.847, 3);
  });

  it('reads "Nm 2/48" as two plies of Nm 48: resultant tex = 2 × 1000/48 = 41.667 (references.md §1, resultant Nm 24)', () => {
    const p = parseCount('Nm 2/48');
    expect(p).toMatchObject({ unit: 'Nm', count: 48, plies: 2 });
    expect(p.dtex).toBeCloseTo(416.667, 3);
    expect(parseCountDtex('Nm 48/2')).toBeCloseTo(416.667, 3);
    // Resultant count: Nm 48 / 2 plies = Nm 24.
    expect(convertCount(p.dtex, 'dtex', 'Nm')).toBeCloseTo(24, 10);
  });

  it('reads plies and filament counts of filament yarns', () => {
    expect(parseCount('2x78 dtex')).toMatchObject({ dtex: 156, plies: 2, count: 78 });
    expect(parseCount('78 dtex f68')).toMatchObject({ dtex: 78, filaments: 68 });
    expect(parseCount('78/68 dtex')).toMatchObject({ dtex: 78, filaments: 68, plies: 1 });
    expect(parseCount('dtex 78 f 68')).toMatchObject({ dtex: 78, filaments: 68 });
  });

  it('gives clear errors', () => {
    const message = (text: string) => {
      try {
        parseCount(text);
      } catch (e) {
        expect(e).toBeInstanceOf(CountParseError);
        return (e as Error).message;
      }
      throw new Error(`"${text}" was accepted`);
    };
    expect(message('78')).toMatch(/no unit/);
    expect(message('')).toMatch(/Enter a yarn count/);
    expect(message('78 furlongs')).toMatch(/not a yarn count/);
    expect(message('0 dtex')).toMatch(/greater than zero/);
    expect(message('Ne 2.5/3.5')).toMatch(/whole ply count/);
    expect(message('78/68 dtex f12')).toMatch(/filament count twice/);
  });

  it('round-trips through formatCount', () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 2000 }), fc.constantFrom(...countUnits), (dtex, unit) => {
        const text = formatCount(dtex, unit, 6);
        expect(parseCountDtex(text) / dtex).toBeCloseTo(1, 5);
      }),
    );
  });
});
