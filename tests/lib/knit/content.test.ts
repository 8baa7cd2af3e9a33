import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fibreIds, type FibreId } from '@/lib/knit/fibres';
import { rectanglePolygon, type Panel } from '@/lib/knit/panel';
import { rasterizePanel } from '@/lib/knit/raster';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import { garmentConsumption, keptYarnGrams } from '@/lib/knit/consumption';
import {
  applyAgreedAllowances,
  contentLabel,
  fibreContent,
  fibreMasses,
  largestRemainderPercents,
  labelCaution,
  type FibreShares,
  type LabelLine,
} from '@/lib/knit/content';

const yarn = (id: string, dtex: number, fibre: FibreId, extra: Partial<Yarn> = {}): Yarn => ({
  id,
  name: id,
  dtex,
  fibres: [{ fibre, share: 1 }],
  colour: { state: 'dyeable' },
  ...extra,
});

const pct = (s: FibreShares, f: FibreId) => (s[f] ?? 0) * 100;
const sum = (s: FibreShares) => Object.values(s).reduce((a, b) => a + (b ?? 0), 0);

describe('applyAgreedAllowances: Regulation (EU) No 1007/2011 Annex VIII and IX', () => {
  it('Annex VIII ternary worked example: wool 10.61 %, viscose 48.62 %, cotton 40.77 % (b = 4.0 on cotton)', () => {
    // "P1A% (wool) = 10,27 × [1 + (17,0 + 0,0)/100)] / [10,27 × 1.17 + 48,71 × 1.13 + 41,02 × (1 + (8,5 + 4,0)/100)] × 100 = 10,61 %"
    // Denominator: 12.0159 + 55.0423 + 46.1475 = 113.2057.
    const s = applyAgreedAllowances({ wool: 10.27, viscose: 48.71, cotton: 41.02 }, { pretreatmentLossPct: { cotton: 4.0 } });
    expect(pct(s, 'wool')).toBeCloseTo(10.61, 2);
    expect(pct(s, 'viscose')).toBeCloseTo(48.62, 2);
    // The regulation takes cotton by difference (40.77); computed directly it is 40.76. Accept either.
    expect(Math.abs(pct(s, 'cotton') - 40.765)).toBeLessThanOrEqual(0.0051);
    expect(sum(s)).toBeCloseTo(1, 12);
    // The denominator of the example, from the shares: wool 10.27 × 1.17 / share.
    expect((10.27 * 1.17) / (s.wool ?? NaN)).toBeCloseTo(113.2057, 3);
  });

  // references.md §2(e) activewear examples (computed from Annex IX, b = 0).
  const cases: [string, FibreShares, Partial<Record<FibreId, number>>][] = [
    ['dry 80 % PA filament + 20 % EL → 80.65 / 19.35', { polyamide: 0.8, elastane: 0.2 }, { polyamide: 80.65, elastane: 19.35 }],
    ['dry 72 % PA filament + 28 % PES → 72.82 / 27.18', { polyamide: 0.72, polyester: 0.28 }, { polyamide: 72.82, polyester: 27.18 }],
    ['dry 95 % CO + 5 % EL → 95.31 / 4.69', { cotton: 0.95, elastane: 0.05 }, { cotton: 95.31, elastane: 4.69 }],
    ['dry PES 88 / EL 12 stays 88.00 / 12.00 (equal allowances)', { polyester: 0.88, elastane: 0.12 }, { polyester: 88, elastane: 12 }],
  ];
  for (const [title, dry, expected] of cases) {
    it(title, () => {
      const s = applyAgreedAllowances(dry);
      for (const [f, v] of Object.entries(expected) as [FibreId, number][]) expect(pct(s, f)).toBeCloseTo(v, 2);
    });
  }

  it('staple polyamide takes 6.25 %: dry 80/20 PA/EL → 80 × 1.0625 / (85 + 20.3) = 80.72 % PA', () => {
    const s = applyAgreedAllowances({ polyamide: 80, elastane: 20 }, { staple: ['polyamide'] });
    expect(pct(s, 'polyamide')).toBeCloseTo(80.72, 2);
  });

  it('property: the result sums to 1 and does not depend on the scale of the input', () => {
    const fibre = fc.constantFrom(...fibreIds);
    fc.assert(
      fc.property(fc.dictionary(fibre, fc.double({ min: 0.001, max: 100, noNaN: true }), { minKeys: 1 }), fc.double({ min: 0.1, max: 1000, noNaN: true }), (dry, k) => {
        const a = applyAgreedAllowances(dry as FibreShares);
        const scaled = Object.fromEntries(Object.entries(dry).map(([f, v]) => [f, v * k])) as FibreShares;
        const b = applyAgreedAllowances(scaled);
        expect(sum(a)).toBeCloseTo(1, 12);
        for (const f of Object.keys(a) as FibreId[]) expect(b[f]).toBeCloseTo(a[f] ?? NaN, 12);
      }),
    );
  });
});

describe('fibreContent', () => {
  const pa = yarn('pa', 78, 'polyamide');
  const el = yarn('el', 44, 'elastane');
  const blend: Yarn = {
    id: 'blend',
    name: 'CO/PES 60/40',
    dtex: 200,
    fibres: [
      { fibre: 'cotton', share: 0.6 },
      { fibre: 'polyester', share: 0.4 },
    ],
    colour: { state: 'dyeable' },
  };

  it("'nominal': yarn grams × fibre shares", () => {
    // 100 g polyamide + 20 g elastane + 50 g of a 60/40 CO/PES blend = 170 g:
    // PA 100 / 170 = 58.824 %, EL 20 / 170 = 11.765 %, CO 30 / 170 = 17.647 %, PES 20 / 170 = 11.765 %.
    const s = fibreContent({ yarnGrams: { pa: 100, el: 20, blend: 50 }, yarns: [pa, el, blend], method: 'nominal' });
    expect(pct(s, 'polyamide')).toBeCloseTo(58.824, 3);
    expect(pct(s, 'cotton')).toBeCloseTo(17.647, 3);
    expect(pct(s, 'polyester')).toBeCloseTo(11.765, 3);
    expect(sum(s)).toBeCloseTo(1, 12);
    expect(fibreMasses({ yarnGrams: { pa: 100, blend: 50 }, yarns: [pa, blend] })).toEqual({ polyamide: 100, cotton: 30, polyester: 20 });
  });

  it("'eu-allowance' on a dry basis equals applyAgreedAllowances of the nominal shares", () => {
    const input = { yarnGrams: { pa: 80, el: 20 }, yarns: [pa, el] };
    const s = fibreContent({ ...input, method: 'eu-allowance', massBasis: 'dry' });
    expect(pct(s, 'polyamide')).toBeCloseTo(80.65, 2); // references.md §2(e)
  });

  it("'eu-allowance' from conditioned yarn masses first removes the commercial regain (registry values, from memory)", () => {
    // Polyamide regain 4.5 %, elastane 1.3 % (fibres.ts, memory). Dry: 80 / 1.045 = 76.5550, 20 / 1.013 = 19.7433.
    // With allowances: 76.5550 × 1.0575 = 80.9569; 19.7433 × 1.015 = 20.0395; PA = 80.9569 / 100.9964 = 80.158 %.
    const s = fibreContent({ yarnGrams: { pa: 80, el: 20 }, yarns: [pa, el], method: 'eu-allowance' });
    expect(pct(s, 'polyamide')).toBeCloseTo(80.158, 3);
  });

  it('a staple polyamide yarn takes the staple allowance', () => {
    const paStaple = yarn('pas', 78, 'polyamide', { staple: true });
    const s = fibreContent({ yarnGrams: { pas: 80, el: 20 }, yarns: [paStaple, el], method: 'eu-allowance', massBasis: 'dry' });
    expect(pct(s, 'polyamide')).toBeCloseTo(80.72, 2);
  });

  it('rejects unknown yarns and negative masses', () => {
    expect(() => fibreContent({ yarnGrams: { nope: 1 }, yarns: [pa], method: 'nominal' })).toThrow(/nope/);
    expect(() => fibreContent({ yarnGrams: { pa: -1 }, yarns: [pa], method: 'nominal' })).toThrow(RangeError);
    expect(() => fibreContent({ yarnGrams: { pa: 0 }, yarns: [pa], method: 'nominal' })).toThrow(RangeError);
  });

  it('property: shares sum to 1 for any yarn masses, both methods', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 500, noNaN: true }), fc.double({ min: 0, max: 500, noNaN: true }), fc.double({ min: 0, max: 500, noNaN: true }), fc.constantFrom('nominal' as const, 'eu-allowance' as const), (a, b, c, method) => {
        const s = fibreContent({ yarnGrams: { pa: a, el: b, blend: c }, yarns: [pa, el, blend], method });
        expect(sum(s)).toBeCloseTo(1, 12);
      }),
    );
  });
});

describe('largestRemainderPercents', () => {
  it('thirds give 34 / 33 / 33', () => {
    expect(largestRemainderPercents([1, 1, 1])).toEqual([34, 33, 33]);
  });

  it('a share that would round to 0 shows as 1 when asked', () => {
    // 99.7 / 0.3: largest remainder alone gives 100 / 0.
    expect(largestRemainderPercents([99.7, 0.3])).toEqual([100, 0]);
    expect(largestRemainderPercents([99.7, 0.3], true)).toEqual([99, 1]);
  });

  it('property: whole numbers summing to 100, each within 1 of the exact value', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.001, max: 100, noNaN: true }), { minLength: 1, maxLength: 10 }), (values) => {
        const p = largestRemainderPercents(values);
        expect(p.reduce((s, v) => s + v, 0)).toBe(100);
        const total = values.reduce((s, v) => s + v, 0);
        p.forEach((v, i) => {
          expect(Number.isInteger(v)).toBe(true);
          expect(Math.abs(v - ((values[i] as number) / total) * 100)).toBeLessThan(1);
        });
      }),
    );
  });
});

describe('contentLabel: EU (Regulation (EU) No 1007/2011)', () => {
  it('Annex I names in descending order (Art. 9(1)), whole percentages summing to 100', () => {
    const label = contentLabel({ elastane: 0.1935, polyamide: 0.8065 }, 'eu');
    expect(label.lines.map((l) => [l.name, l.percent])).toEqual([
      ['polyamide', 81],
      ['elastane', 19],
    ]);
    expect(label.text).toBe('81 % polyamide, 19 % elastane');
    expect(label.notes).toContain(labelCaution);
  });

  it("names every fibre by default, even under 5 % (Art. 9(1)); 'other fibres' only as an option (Art. 9(2))", () => {
    const shares = { polyester: 0.9, polyamide: 0.06, elastane: 0.04 };
    expect(contentLabel(shares, 'eu').text).toBe('90 % polyester, 6 % polyamide, 4 % elastane');
    const grouped = contentLabel(shares, 'eu', { otherFibres: true });
    expect(grouped.text).toBe('90 % polyester, 6 % polyamide, 4 % other fibres');
    expect(grouped.lines.at(-1)).toMatchObject({ name: 'other fibres', other: true, fibres: ['elastane'] });
    expect(grouped.notes.join('\n')).toMatch(/Art\. 9\(2\)/);
    // The note quotes Art. 9(2) (references.md §2(b)) and says which reading is applied, not that it is the law.
    const note = grouped.notes.find((n) => n.startsWith("'other fibres' (")) ?? '';
    expect(note).toContain('"a fibre which accounts for up to 5 %" or "fibres which collectively account for up to 15 %"');
    expect(note).toMatch(/applies the cautious reading/);
    expect(note).not.toMatch(/allowed for fibres of up to 5 % each and up to 15 % together/);
  });

  it("'other fibres': up to 5 % each (5 % itself included) and up to 15 % together", () => {
    // 85 + 5 + 5 + 5: three fibres of 5 % make 15 %: all grouped.
    expect(contentLabel({ polyester: 0.85, polyamide: 0.05, elastane: 0.05, cotton: 0.05 }, 'eu', { otherFibres: true }).text).toBe(
      '85 % polyester, 15 % other fibres',
    );
    // 84 + 4 × 4: four would make 16 % > 15 %, so three of them are grouped.
    const label = contentLabel({ polyester: 0.84, polyamide: 0.04, elastane: 0.04, cotton: 0.04, viscose: 0.04 }, 'eu', { otherFibres: true });
    expect(label.lines.find((l) => l.other)?.percent).toBe(12);
    expect(label.lines.filter((l) => !l.other)).toHaveLength(2);
    expect(label.lines.reduce((s, l) => s + l.percent, 0)).toBe(100);
  });

  it("'other fibres' takes its place by percentage (Art. 9(1) descending order); the smallest shares are grouped first, ties by name", () => {
    const label = contentLabel({ polyester: 0.8, polyamide: 0.05, acrylic: 0.05, cotton: 0.05, wool: 0.05 }, 'eu', { otherFibres: true });
    expect(label.text).toBe('80 % polyester, 15 % other fibres, 5 % wool');
    expect(label.lines.find((l) => l.other)?.fibres).toEqual(['acrylic', 'cotton', 'polyamide']);
    // 4 + 4 + 5 + 5: the two 4 % fibres, then cotton (before polyamide by name), fit in 15 %: 13 %.
    const mixed = contentLabel({ polyester: 0.82, polyamide: 0.05, cotton: 0.05, acrylic: 0.04, wool: 0.04 }, 'eu', { otherFibres: true });
    expect(mixed.text).toBe('82 % polyester, 13 % other fibres, 5 % polyamide');
    expect(mixed.lines.find((l) => l.other)?.fibres).toEqual(['acrylic', 'wool', 'cotton']);
  });

  it("notes a fibre grouped as 'other fibres' within the 3 % manufacturing tolerance (Art. 20(3)) of the 5 % limit", () => {
    const near = contentLabel({ polyester: 0.96, elastane: 0.04 }, 'eu', { otherFibres: true });
    expect(near.notes.some((n) => n.includes('elastane at') && n.includes('Art. 20(3)'))).toBe(true);
    // Every fibre named (Art. 9(1)): 5 % decides nothing, so no note for 6 % or 4 % elastane.
    expect(contentLabel({ polyester: 0.94, elastane: 0.06 }, 'eu').notes.some((n) => n.includes('elastane at'))).toBe(false);
    expect(contentLabel({ polyester: 0.96, elastane: 0.04 }, 'eu').notes.some((n) => n.includes('elastane at'))).toBe(false);
    // Named at 6 % beside 'other fibres': named correctly on either side of 5 %.
    const named = contentLabel({ polyester: 0.9, elastane: 0.06, polyamide: 0.04 }, 'eu', { otherFibres: true });
    expect(named.notes.some((n) => n.includes('elastane at'))).toBe(false);
    expect(named.notes.some((n) => n.includes('polyamide at'))).toBe(true);
    const far = contentLabel({ polyester: 0.91, elastane: 0.09 }, 'eu', { otherFibres: true });
    expect(far.notes.some((n) => n.includes('elastane at'))).toBe(false);
  });

  it("'shown as 1 %' only for a line the rounding put at 0 % (largest remainder, common practice, no published source)", () => {
    // 99.2 / 0.4 / 0.4: the one point left goes to elastane (tie, earlier line); polyamide rounds to 0 and is raised.
    const a = contentLabel({ polyester: 0.992, elastane: 0.004, polyamide: 0.004 }, 'eu');
    expect(a.text).toBe('98 % polyester, 1 % elastane, 1 % polyamide');
    expect(a.notes.filter((n) => n.includes('shown as 1 %'))).toEqual([expect.stringContaining('polyamide')]);
    // 98.8 / 0.6 / 0.6: the two points go to polyester and elastane; polyamide, above 0.5 %, still rounds to 0.
    const b = contentLabel({ polyester: 0.988, elastane: 0.006, polyamide: 0.006 }, 'eu');
    expect(b.text).toBe('98 % polyester, 1 % elastane, 1 % polyamide');
    expect(b.notes.filter((n) => n.includes('shown as 1 %'))).toEqual([expect.stringContaining('polyamide')]);
  });

  it("'100 %' only for a product of one fibre (Art. 7(1)); cationic-dyeable polyester is still polyester", () => {
    const one = contentLabel({ polyester: 0.7, 'polyester-cd': 0.3 }, 'eu');
    expect(one.text).toBe('100 % polyester');
    expect(one.lines[0]?.fibres).toEqual(['polyester', 'polyester-cd']);
    expect(one.notes.join('\n')).toMatch(/Art\. 7\(1\)/);
    // 99.6 % + 0.4 %: never '100 %' beside another fibre.
    const almost = contentLabel({ polyester: 0.996, elastane: 0.004 }, 'eu');
    expect(almost.text).toBe('99 % polyester, 1 % elastane');
    expect(almost.notes.join('\n')).not.toMatch(/Art\. 7\(1\)/);
  });
});

describe('contentLabel: US (16 CFR Part 303)', () => {
  it("generic names 'nylon' and 'spandex' (§303.7), order of predominance (§303.42(a))", () => {
    const label = contentLabel({ polyamide: 0.8, elastane: 0.2 }, 'us');
    expect(label.text).toBe('80% nylon, 20% spandex');
  });

  it("a fibre under 5 % is 'other fiber' (§303.6, §303.42(a)); two are 'other fibers'", () => {
    expect(contentLabel({ polyester: 0.96, polyamide: 0.04 }, 'us').text).toBe('96% polyester, 4% other fiber');
    expect(contentLabel({ polyester: 0.93, polyamide: 0.04, acrylic: 0.03 }, 'us').text).toBe('93% polyester, 7% other fibers');
    // 5 % exactly is named: "5 per centum or more".
    expect(contentLabel({ polyester: 0.95, polyamide: 0.05 }, 'us').text).toBe('95% polyester, 5% nylon');
  });

  it('elastane under 5 % may be named for its functional significance (§303.3(a): "96% acetate / 4% spandex" example)', () => {
    const named = contentLabel({ polyamide: 0.96, elastane: 0.04 }, 'us');
    expect(named.text).toBe('96% nylon, 4% spandex');
    expect(named.notes.join('\n')).toMatch(/303\.3\(a\)/);
    const grouped = contentLabel({ polyamide: 0.96, elastane: 0.04 }, 'us', { functionalFibres: [] });
    expect(grouped.text).toBe('96% nylon, 4% other fiber');
  });

  it('notes a share within the 3-point tolerance (§303.43, from memory) of the 5 % threshold', () => {
    const label = contentLabel({ polyester: 0.93, polyamide: 0.07 }, 'us');
    expect(label.notes.some((n) => n.includes('nylon') && n.includes('303.43'))).toBe(true);
  });

  it('no threshold note for a fibre named for its functional significance (its line does not change at 5 %)', () => {
    const named = contentLabel({ polyamide: 0.96, elastane: 0.04 }, 'us');
    expect(named.notes.some((n) => n.includes('spandex at') && n.includes('303.43'))).toBe(false);
    const grouped = contentLabel({ polyamide: 0.96, elastane: 0.04 }, 'us', { functionalFibres: [] });
    expect(grouped.notes.some((n) => n.includes('spandex at') && n.includes('303.43'))).toBe(true);
  });

  it("the functional-significance note gives 'stretch' as the reason only for an elastomeric fibre", () => {
    const stretch = contentLabel({ polyamide: 0.96, elastane: 0.04 }, 'us');
    expect(stretch.notes.join('\n')).toMatch(/spandex at 4\.0 % is under 5 % but named for its functional significance \(stretch\)/);
    const wool = contentLabel({ polyamide: 0.96, wool: 0.04 }, 'us', { functionalFibres: ['wool'] });
    expect(wool.text).toBe('96% nylon, 4% wool');
    const note = wool.notes.find((n) => n.includes('wool at'));
    expect(note).toMatch(/functional significance under 16 CFR 303\.3\(a\)/);
    expect(note).not.toMatch(/stretch/);
  });

  it('viscose, modal and lyocell count together as rayon for the 5 % rule (§303.6; rayon family from memory)', () => {
    const joined = contentLabel({ polyester: 0.94, viscose: 0.03, modal: 0.03 }, 'us');
    expect(joined.text).toBe('94% polyester, 6% rayon');
    expect([...(joined.lines[1]?.fibres ?? [])].sort()).toEqual(['modal', 'viscose']);
    expect(joined.notes.join('\n')).toMatch(/labelled together as rayon/);
    // One member under 5 %: the whole family is rayon (9 %), not "6% modal" beside an 'other fiber'.
    expect(contentLabel({ polyester: 0.91, modal: 0.06, viscose: 0.03 }, 'us').text).toBe('91% polyester, 9% rayon');
    expect(contentLabel({ polyester: 0.92, lyocell: 0.04, modal: 0.04 }, 'us').text).toBe('92% polyester, 8% rayon');
    // Every member 5 % or more: each keeps its own permitted name.
    expect(contentLabel({ polyester: 0.84, modal: 0.1, lyocell: 0.06 }, 'us').text).toBe('84% polyester, 10% modal, 6% lyocell');
    // Together still under 5 %: 'other fiber'.
    expect(contentLabel({ polyester: 0.96, viscose: 0.02, modal: 0.02 }, 'us').text).toBe('96% polyester, 4% other fiber');
    // EU names stay apart (Annex I Nos 22, 25, 33).
    expect(contentLabel({ polyester: 0.94, viscose: 0.03, modal: 0.03 }, 'eu').text).toBe('94 % polyester, 3 % modal, 3 % viscose');
  });

  it("'100%' for one fibre (§303.27)", () => {
    const label = contentLabel({ polyamide: 1 }, 'us');
    expect(label.text).toBe('100% nylon');
    expect(label.notes.join('\n')).toMatch(/303\.27/);
  });
});

describe('contentLabel: a share exactly at a threshold, computed from grams', () => {
  const pes = yarn('pes', 78, 'polyester');
  const pa = yarn('pa', 78, 'polyamide');
  const from = (polyesterGrams: number, polyamideGrams: number) =>
    fibreContent({ yarnGrams: { pes: polyesterGrams, pa: polyamideGrams }, yarns: [pes, pa], method: 'nominal' });

  it('32.3 g : 1.7 g (19:1) names the 5 % fibre in the US and group it in the EU', () => {
    const s = from(19 * 1.7, 1.7);
    // Precondition: the division lands just under 0.05, the case the comparison must survive.
    expect(s.polyamide).toBeLessThan(0.05);
    // §303.6: "5 per centum or more" is named (references.md §3).
    expect(contentLabel(s, 'us').text).toBe('95% polyester, 5% nylon');
    // Art. 9(2): "up to 5 %" may be 'other fibres' (references.md §2(b)).
    expect(contentLabel(s, 'eu', { otherFibres: true }).text).toBe('95 % polyester, 5 % other fibres');
  });

  it('property: any grams in an exact 19:1 ratio give the same labels', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 5000, noNaN: true }), (grams) => {
        const s = from(19 * grams, grams);
        expect(contentLabel(s, 'us').text).toBe('95% polyester, 5% nylon');
        expect(contentLabel(s, 'eu', { otherFibres: true }).text).toBe('95 % polyester, 5 % other fibres');
      }),
      { numRuns: 300 },
    );
  });
});

describe('contentLabel: properties', () => {
  it("percentages sum to 100, lines descend (EU 'other fibres' by its share, US 'other fiber(s)' last), every fibre is accounted for", () => {
    const fibre = fc.constantFrom(...fibreIds);
    fc.assert(
      fc.property(
        fc.dictionary(fibre, fc.double({ min: 0.0001, max: 1, noNaN: true }), { minKeys: 1 }),
        fc.constantFrom('eu' as const, 'us' as const),
        fc.boolean(),
        (shares, region, otherFibres) => {
          const label = contentLabel(shares as FibreShares, region, { otherFibres });
          expect(label.lines.reduce((s, l) => s + l.percent, 0)).toBe(100);
          // EU Art. 9(1): every line, 'other fibres' included, in descending order.
          // US §303.42(a): named fibres by predominance, then 'other fiber(s)'.
          const ordered = region === 'eu' ? label.lines : label.lines.filter((l) => !l.other);
          for (let i = 1; i < ordered.length; i++) {
            const [before, after] = [ordered[i - 1] as LabelLine, ordered[i] as LabelLine];
            expect(before.exactPercent).toBeGreaterThanOrEqual(after.exactPercent - 1e-7);
            expect(before.percent).toBeGreaterThanOrEqual(after.percent);
          }
          const otherAt = label.lines.findIndex((l) => l.other);
          if (otherAt >= 0 && region === 'us') expect(otherAt).toBe(label.lines.length - 1);
          expect(label.lines.flatMap((l) => l.fibres).sort()).toEqual(Object.keys(shares).sort());
          expect(label.lines.every((l) => l.percent >= 1)).toBe(true);
        },
      ),
    );
  });
});

describe('worked label cases, from the stitch raster to the label', () => {
  const panel = (baseTextureId: string): Panel => ({
    id: 'front',
    name: 'front',
    kind: 'front',
    widthNeedles: 100,
    heightCourses: 200,
    knittedArea: rectanglePolygon(100, 200),
    cutOutline: rectanglePolygon(100, 150),
    baseTextureId,
    zones: [],
  });

  it('plated polyamide/elastane jersey: 78 dtex PA + 44 dtex EL at draft 2.8', () => {
    const yarns = [yarn('pa78', 78, 'polyamide'), yarn('el44', 44, 'elastane')];
    const jersey: Texture = {
      id: 'jersey',
      name: 'plated jersey',
      repeat: { needles: 1, courses: 1, cells: [['knit']] },
      feeders: [{ ground: 'pa78', plated: { yarn: 'el44', draft: 2.8 } }],
      density: { walesPerCm: 16, coursesPerCm: 22 },
      loopMm: { knit: 2.6, tuck: 2.0 },
    };
    const c = garmentConsumption({ panels: [rasterizePanel(panel('jersey'))], textures: [jersey], yarns, gauge: 28 });
    // Every stitch lays the same loop length of both yarns, so the masses go as the linear densities:
    // PA 78, EL 44 / 2.8 = 15.7143 dtex; total 93.7143. PA 83.2317 %, EL 16.7683 % (references.md §7(e): 16.77 %).
    const nominal = fibreContent({ yarnGrams: keptYarnGrams(c), yarns, method: 'nominal' });
    expect(pct(nominal, 'elastane')).toBeCloseTo(16.7683, 3);
    // Largest remainder: floors 83 + 16 = 99; the larger remainder (.7683 vs .2317) takes the point → 83 / 17.
    expect(contentLabel(nominal, 'eu').text).toBe('83 % polyamide, 17 % elastane');
    expect(contentLabel(nominal, 'us').text).toBe('83% nylon, 17% spandex');
    // EU basis from conditioned masses (regain PA 4.5 %, EL 1.3 %, from memory):
    // dry PA 0.832317 / 1.045 = 0.796476, EL 0.167683 / 1.013 = 0.165531;
    // × (1 + allowance): 0.796476 × 1.0575 = 0.842273, 0.165531 × 1.015 = 0.168014; sum 1.010287;
    // PA 83.370 %, EL 16.630 % → still 83 / 17.
    const eu = fibreContent({ yarnGrams: keptYarnGrams(c), yarns, method: 'eu-allowance' });
    expect(pct(eu, 'polyamide')).toBeCloseTo(83.37, 2);
    expect(contentLabel(eu, 'eu').text).toBe('83 % polyamide, 17 % elastane');
  });

  it('polyester/polyamide/elastane two-tone: PES and PA courses alternate, both plated with elastane', () => {
    const yarns = [yarn('pes56', 56, 'polyester'), yarn('pa44', 44, 'polyamide'), yarn('el22', 22, 'elastane')];
    // 2 needles × 2 courses. Course 0: PES knits both needles; course 1: PA knits one needle and tucks the other.
    // Elastane 22 dtex at draft 3 plated on both courses. Loop lengths: knit 3.0 mm, tuck 2.0 mm.
    const twoTone: Texture = {
      id: 'two-tone',
      name: 'two-tone tuck',
      repeat: {
        needles: 2,
        courses: 2,
        cells: [
          ['knit', 'knit'],
          ['knit', 'tuck'],
        ],
      },
      feeders: [
        { ground: 'pes56', plated: { yarn: 'el22', draft: 3 } },
        { ground: 'pa44', plated: { yarn: 'el22', draft: 3 } },
      ],
      density: { walesPerCm: 15, coursesPerCm: 20 },
      loopMm: { knit: 3.0, tuck: 2.0 },
    };
    const c = garmentConsumption({ panels: [rasterizePanel(panel('two-tone'))], textures: [twoTone], yarns, gauge: 28 });
    // Mass ∝ dtex × loop length per repeat: PES 56 × 6.0 = 336; PA 44 × 5.0 = 220;
    // EL (22 / 3) × (6.0 + 5.0) = 80.6667; total 636.6667.
    // PES 52.7749 %, PA 34.5550 %, EL 12.6702 %.
    const s = fibreContent({ yarnGrams: keptYarnGrams(c), yarns, method: 'nominal' });
    expect(pct(s, 'polyester')).toBeCloseTo(52.7749, 3);
    expect(pct(s, 'polyamide')).toBeCloseTo(34.555, 3);
    expect(pct(s, 'elastane')).toBeCloseTo(12.6702, 3);
    // Floors 52 + 34 + 12 = 98; remainders .7749 (PES), .6702 (EL), .5550 (PA): PES and EL take a point each.
    expect(contentLabel(s, 'eu').text).toBe('53 % polyester, 34 % polyamide, 13 % elastane');
    expect(contentLabel(s, 'us').text).toBe('53% polyester, 34% nylon, 13% spandex');
  });

  it('two-tone with elastane on every other PA course only: elastane under 5 % in the US', () => {
    const yarns = [yarn('pes56', 56, 'polyester'), yarn('pa44', 44, 'polyamide'), yarn('el22', 22, 'elastane')];
    // 1 needle × 4 courses, all knit (3.0 mm): PES, PA + EL (d = 3.5), PES, PA.
    const t: Texture = {
      id: 't',
      name: 'stripe',
      repeat: { needles: 1, courses: 4, cells: [['knit'], ['knit'], ['knit'], ['knit']] },
      feeders: [{ ground: 'pes56' }, { ground: 'pa44', plated: { yarn: 'el22', draft: 3.5 } }, { ground: 'pes56' }, { ground: 'pa44' }],
      density: { walesPerCm: 15, coursesPerCm: 20 },
      loopMm: { knit: 3.0, tuck: 2.0 },
    };
    const c = garmentConsumption({ panels: [rasterizePanel(panel('t'))], textures: [t], yarns, gauge: 28 });
    // Per repeat (× 3 mm each): PES 2 × 56 = 112; PA 2 × 44 = 88; EL 22 / 3.5 = 6.2857; total 206.2857.
    // PES 54.2936 %, PA 42.6593 %, EL 3.0471 %.
    const s = fibreContent({ yarnGrams: keptYarnGrams(c), yarns, method: 'nominal' });
    expect(pct(s, 'elastane')).toBeCloseTo(3.0471, 3);
    // Floors 54 + 42 + 3 = 99; the largest remainder is PA's .6593 → 54 / 43 / 3.
    const us = contentLabel(s, 'us');
    expect(us.text).toBe('54% polyester, 43% nylon, 3% spandex');
    expect(us.notes.join('\n')).toMatch(/functional significance/);
    // 3.05 % is within 3 points of 5 %, but spandex named for its function keeps its line either side.
    expect(us.notes.some((n) => n.includes('spandex at') && n.includes('303.43'))).toBe(false);
    expect(contentLabel(s, 'eu').text).toBe('54 % polyester, 43 % polyamide, 3 % elastane');
  });
});
