import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { coveredYarn, sharesSumToOne, validateYarn, yarnMap, type Yarn } from '@/lib/knit/yarn';

const pa78: Yarn = {
  id: 'pa78',
  name: 'PA 78 dtex f68',
  dtex: 78,
  fibres: [{ fibre: 'polyamide', share: 1 }],
  colour: { state: 'dyeable' },
};

describe('coveredYarn (product design §2: core dtex ÷ draft, cover dtex × (1 + take-up))', () => {
  it('single-covered 44 dtex elastane at draft 3.0 in 78 dtex polyamide with 10 % take-up', () => {
    const y = coveredYarn({ fibre: 'elastane', dtex: 44, draft: 3 }, { fibre: 'polyamide', dtex: 78, takeUp: 0.1 });
    // Core 44 / 3 = 14.6667 dtex; cover 78 × 1.1 = 85.8 dtex; total 100.4667 dtex.
    expect(y.coreDtex).toBeCloseTo(14.6667, 4);
    expect(y.coverDtex).toBeCloseTo(85.8, 10);
    expect(y.dtex).toBeCloseTo(100.4667, 4);
    // Elastane 14.6667 / 100.4667 = 0.14599; polyamide 85.8 / 100.4667 = 0.85401.
    const el = y.fibres.find((f) => f.fibre === 'elastane');
    const pa = y.fibres.find((f) => f.fibre === 'polyamide');
    expect(el?.share).toBeCloseTo(0.14599, 5);
    expect(pa?.share).toBeCloseTo(0.85401, 5);
    expect(sharesSumToOne(y.fibres)).toBe(true);
  });

  it('double-covered: two covers add, and one fibre in both covers appears once', () => {
    const y = coveredYarn({ fibre: 'elastane', dtex: 22, draft: 3.5 }, [
      { fibre: 'polyamide', dtex: 33, takeUp: 0.08 },
      { fibre: 'polyamide', dtex: 33, takeUp: 0.12 },
    ]);
    // Core 22 / 3.5 = 6.2857; covers 33 × 1.08 + 33 × 1.12 = 35.64 + 36.96 = 72.6; total 78.8857.
    expect(y.dtex).toBeCloseTo(78.8857, 4);
    expect(y.fibres).toHaveLength(2);
    expect(y.fibres.find((f) => f.fibre === 'polyamide')?.share).toBeCloseTo(72.6 / (22 / 3.5 + 72.6), 12);
  });

  it('rejects a draft below 1 and a negative take-up', () => {
    expect(() => coveredYarn({ fibre: 'elastane', dtex: 44, draft: 0.5 }, { fibre: 'polyamide', dtex: 78, takeUp: 0 })).toThrow(RangeError);
    expect(() => coveredYarn({ fibre: 'elastane', dtex: 44, draft: 3 }, { fibre: 'polyamide', dtex: 78, takeUp: -0.1 })).toThrow(RangeError);
    expect(() => coveredYarn({ fibre: 'elastane', dtex: 44, draft: 3 }, [])).toThrow(RangeError);
  });

  it('property: shares always sum to 1 and the dtex is core/draft + Σ cover × (1 + take-up)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 500, noNaN: true }),
        fc.double({ min: 1, max: 5, noNaN: true }),
        fc.double({ min: 10, max: 500, noNaN: true }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        (coreDtex, draft, coverDtex, takeUp) => {
          const y = coveredYarn({ fibre: 'elastane', dtex: coreDtex, draft }, { fibre: 'polyester', dtex: coverDtex, takeUp });
          expect(sharesSumToOne(y.fibres)).toBe(true);
          expect(y.dtex).toBeCloseTo(coreDtex / draft + coverDtex * (1 + takeUp), 9);
        },
      ),
    );
  });
});

describe('validateYarn and sharesSumToOne', () => {
  it('accepts a valid yarn', () => {
    expect(validateYarn(pa78)).toEqual([]);
  });

  it('finds shares that do not sum to 1, unknown and repeated fibres, bad dtex', () => {
    const bad: Yarn = {
      ...pa78,
      dtex: 0,
      fibres: [
        { fibre: 'polyamide', share: 0.5 },
        { fibre: 'polyamide', share: 0.2 },
        { fibre: 'kevlarish' as never, share: 0.1 },
      ],
    };
    const problems = validateYarn(bad).join('\n');
    expect(problems).toMatch(/positive dtex/);
    expect(problems).toMatch(/listed twice/);
    expect(problems).toMatch(/unknown fibre/);
    expect(problems).toMatch(/sum to 0\.8/);
  });

  it('polypropylene cannot be a dyeable yarn (dope-dyed only)', () => {
    const pp: Yarn = { ...pa78, id: 'pp', fibres: [{ fibre: 'polypropylene', share: 1 }] };
    expect(validateYarn(pp).join()).toMatch(/dope-dyed/);
    expect(validateYarn({ ...pp, colour: { state: 'dope-dyed', lab: { L: 30, a: 0, b: -20 } } })).toEqual([]);
  });

  it('property: normalised random shares sum to 1; a perturbed set does not', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.01, max: 1, noNaN: true }), { minLength: 1, maxLength: 6 }), (raw) => {
        const total = raw.reduce((s, v) => s + v, 0);
        const shares = raw.map((v) => ({ share: v / total }));
        expect(sharesSumToOne(shares)).toBe(true);
        const off = shares.map((s, i) => (i === 0 ? { share: s.share * 0.9 } : s));
        expect(sharesSumToOne(off)).toBe(false);
      }),
    );
  });

  it('yarnMap accepts an array, a record or a map', () => {
    expect(yarnMap([pa78]).get('pa78')).toBe(pa78);
    expect(yarnMap({ pa78 }).get('pa78')).toBe(pa78);
    expect(yarnMap(new Map([['pa78', pa78]])).get('pa78')).toBe(pa78);
  });
});
