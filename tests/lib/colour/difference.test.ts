import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  deltaE2000,
  deltaECMC,
  defaultLabDipTolerance,
  labComponents,
  labDipDecision,
  toleranceFormulaLabel,
  toleranceLabel,
} from '@/lib/colour/difference';
import type { Lab } from '@/lib/colour/lab';
import sharma from '@/tests/fixtures/ciede2000_sharma_table1.json';

interface SharmaPair {
  pair: number;
  L1: number;
  a1: number;
  b1: number;
  L2: number;
  a2: number;
  b2: number;
  dE00: number;
  cmc21_computed: number;
  cmc11_computed: number;
}

const pairs = sharma.pairs as SharmaPair[];
const first = (p: SharmaPair): Lab => ({ L: p.L1, a: p.a1, b: p.b1 });
const second = (p: SharmaPair): Lab => ({ L: p.L2, a: p.a2, b: p.b2 });
const pairNo = (n: number): SharmaPair => {
  const p = pairs.find((q) => q.pair === n);
  if (!p) throw new Error(`no Sharma pair ${n}`);
  return p;
};

// Values are given to 4 decimals; a correct implementation rounds to them (|Δ| ≤ 5e-5).
const within4dp = (actual: number, expected: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(5e-5 + 1e-9);

describe('deltaE2000', () => {
  it('has all 34 pairs in the fixture', () => {
    expect(pairs.map((p) => p.pair)).toEqual(Array.from({ length: 34 }, (_, i) => i + 1));
  });

  // Sharma, Wu & Dalal (2005), Color Res. Appl. 30(1):21–30, Table 1 — all 34 pairs, 4 d.p.
  it.each(pairs)('Sharma et al. (2005) Table 1 pair $pair → $dE00', (p) => {
    within4dp(deltaE2000(first(p), second(p)), p.dE00);
  });

  // Sharma et al. (2005): pairs 9–15 sit on the mean-hue discontinuity; a change of 1e-4 in b
  // moves ΔE00 from 7.1792 to 7.2195 (pairs 10 → 11).
  it('reproduces the jump across the hue discontinuity (Sharma pairs 10 and 11)', () => {
    const jump =
      deltaE2000(first(pairNo(11)), second(pairNo(11))) - deltaE2000(first(pairNo(10)), second(pairNo(10)));
    expect(jump).toBeCloseTo(7.2195 - 7.1792, 3);
  });

  // ΔE00 is symmetric (Sharma et al. 2005, pairs 7 and 8 are one pair both ways).
  it('is symmetric on every Sharma pair', () => {
    for (const p of pairs) {
      expect(deltaE2000(second(p), first(p))).toBeCloseTo(deltaE2000(first(p), second(p)), 10);
    }
  });

  const labArb = fc.record({
    L: fc.double({ min: 0, max: 100, noNaN: true }),
    a: fc.double({ min: -120, max: 120, noNaN: true }),
    b: fc.double({ min: -120, max: 120, noNaN: true }),
  });

  it('is symmetric, non-negative and zero on identical colours (property)', () => {
    fc.assert(
      fc.property(labArb, labArb, (x, y) => {
        const d = deltaE2000(x, y);
        expect(d).toBeGreaterThanOrEqual(0);
        expect(Math.abs(d - deltaE2000(y, x))).toBeLessThan(1e-9);
        expect(deltaE2000(x, x)).toBeLessThan(1e-9);
      }),
    );
  });
});

describe('deltaECMC', () => {
  // CMC(2:1) and (1:1) columns of the fixture: computed with Lab1 as standard and cross-checked
  // against an independent implementation (references.md §6.2) — reference-library values, not
  // published in the Sharma paper.
  it.each(pairs)('CMC(2:1) and (1:1) on Sharma pair $pair (computed reference values)', (p) => {
    within4dp(deltaECMC(first(p), second(p)), p.cmc21_computed);
    within4dp(deltaECMC(first(p), second(p), 1, 1), p.cmc11_computed);
  });

  // python-colormath tests/test_color_diff.py, test_cmc_accuracy (references.md §6.2):
  // 2:1 → 1.443, 1:1 → 1.482.
  it('matches the reference-library pair (0.9, 16.3, −2.22) → (0.7, 14.2, −1.80)', () => {
    const std = { L: 0.9, a: 16.3, b: -2.22 };
    const smp = { L: 0.7, a: 14.2, b: -1.8 };
    expect(deltaECMC(std, smp)).toBeCloseTo(1.443, 3);
    expect(deltaECMC(std, smp, 1, 1)).toBeCloseTo(1.482, 3);
  });

  // python-colormath "Testing atan H behavior": 44.346 at 2:1.
  it('matches the reference-library large difference (atan H behaviour)', () => {
    expect(
      deltaECMC({ L: 69.417, a: -12.612, b: -11.271 }, { L: 83.386, a: 39.426, b: -17.525 }),
    ).toBeCloseTo(44.346, 3);
  });

  // colour-science colour/difference/tests/test_delta_e.py, test_delta_E_CMC (8 d.p. there).
  it.each([
    [{ L: 100, a: 426.67945353, b: 72.39590835 }, 172.70477129],
    [{ L: 100, a: 74.05216981, b: 276.45318193 }, 20.59732717],
    [{ L: 100, a: 8.32281957, b: -73.58297716 }, 121.71841479],
  ])('matches the colour-science reference value %#', (sample, expected) => {
    expect(deltaECMC({ L: 100, a: 21.57210357, b: 272.2281935 }, sample)).toBeCloseTo(expected, 6);
  });

  // references.md §6.2: CMC is asymmetric; Sharma pair 17 gives 37.9233 standard → sample and
  // 16.8740 reversed (computed, cross-checked).
  it('is asymmetric: the standard comes first', () => {
    const p = pairNo(17);
    within4dp(deltaECMC(first(p), second(p)), 37.9233);
    within4dp(deltaECMC(second(p), first(p)), 16.874);
  });

  it('defaults to 2:1, not culori’s 1:1', () => {
    const p = pairNo(32);
    expect(deltaECMC(first(p), second(p))).toBe(deltaECMC(first(p), second(p), 2, 1));
    expect(deltaECMC(first(p), second(p))).not.toBeCloseTo(deltaECMC(first(p), second(p), 1, 1), 2);
  });
});

describe('labDipDecision', () => {
  // references.md §9 (AATCC TM173 CMC unit = 1.0; boundary cases from the Sharma pairs as
  // standard → sample): pair 32 CMC(2:1) 0.9901 passes at cf 1.0 although ΔE00 = 1.5381;
  // pair 22 (1.0060) and pair 24 (1.0534) fail.
  it('passes Sharma pair 32 at CMC(2:1) ≤ 1.0 although ΔE00 is 1.54', () => {
    const p = pairNo(32);
    const d = labDipDecision(first(p), second(p));
    expect(d.pass).toBe(true);
    within4dp(d.deltaE, 0.9901);
    within4dp(d.deltaE2000, 1.5381);
    expect(d.tolerance).toEqual(defaultLabDipTolerance);
  });

  it.each([
    [22, 1.006],
    [24, 1.0534],
  ])('fails Sharma pair %i (CMC(2:1) %f) at cf 1.0', (n, cmc) => {
    const p = pairNo(n);
    const d = labDipDecision(first(p), second(p));
    expect(d.pass).toBe(false);
    within4dp(d.deltaE, cmc);
  });

  it('uses the studio tolerance: pair 24 passes at cf 1.1, pair 32 fails on ΔE00 ≤ 1.0', () => {
    const p24 = pairNo(24);
    expect(labDipDecision(first(p24), second(p24), { formula: 'cmc', l: 2, c: 1, max: 1.1 }).pass).toBe(true);
    const p32 = pairNo(32);
    expect(labDipDecision(first(p32), second(p32), { formula: 'de2000', max: 1.0 }).pass).toBe(false);
  });

  it('accepts a difference exactly at the tolerance (≤, not <)', () => {
    const p = pairNo(22);
    const exact = deltaECMC(first(p), second(p));
    expect(labDipDecision(first(p), second(p), { formula: 'cmc', l: 2, c: 1, max: exact }).pass).toBe(true);
  });

  it('names the direction of the difference in words', () => {
    // Sharma pair 32: the sample is darker (ΔL −2.29), greener (Δa −0.36) and yellower (Δb +0.20).
    const d = labDipDecision(first(pairNo(32)), second(pairNo(32)));
    expect(d.words.lightness).toBe('darker');
    expect(d.words.redGreen).toBe('greener');
    expect(d.words.yellowBlue).toBe('yellower');
  });
});

describe('labComponents', () => {
  // CIE 15: ΔE*ab² = ΔL*² + ΔC*ab² + ΔH*ab² — the components must rebuild the CIE76 difference.
  it('splits ΔE*ab into ΔL, ΔC and ΔH (property)', () => {
    const labArb = fc.record({
      L: fc.double({ min: 0, max: 100, noNaN: true }),
      a: fc.double({ min: -100, max: 100, noNaN: true }),
      b: fc.double({ min: -100, max: 100, noNaN: true }),
    });
    fc.assert(
      fc.property(labArb, labArb, (x, y) => {
        const c = labComponents(x, y);
        const de76sq = c.dL ** 2 + c.da ** 2 + c.db ** 2;
        expect(c.dL ** 2 + c.dC ** 2 + c.dH ** 2).toBeCloseTo(de76sq, 6);
      }),
    );
  });

  it('gives ΔH the sign of the hue turn from standard to sample', () => {
    // Standard on +a* (hue 0°), sample at hue +90° turns anticlockwise: ΔH > 0; the mirror < 0.
    expect(labComponents({ L: 50, a: 20, b: 0 }, { L: 50, a: 0, b: 20 }).dH).toBeGreaterThan(0);
    expect(labComponents({ L: 50, a: 20, b: 0 }, { L: 50, a: 0, b: -20 }).dH).toBeLessThan(0);
  });
});

describe('tolerance labels', () => {
  it('write the formula and the limit as the screens and documents show them', () => {
    expect(toleranceLabel({ formula: 'cmc', l: 2, c: 1, max: 1 })).toBe('CMC(2:1) ≤ 1.00');
    expect(toleranceLabel({ formula: 'de2000', max: 0.8 })).toBe('ΔE00 ≤ 0.80');
    expect(toleranceFormulaLabel({ formula: 'cmc', l: 1, c: 1, max: 0.6 })).toBe('CMC(1:1)');
  });
});
