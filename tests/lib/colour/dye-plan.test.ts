import { describe, expect, it } from 'vitest';
import { planDyeing, bathProfiles, type DyeTarget } from '@/lib/colour/dye-plan';
import { fibres } from '@/lib/knit/fibres';
import type { Yarn } from '@/lib/knit/yarn';

const yarn = (id: string, fibreShares: [Yarn['fibres'][number]['fibre'], number][], colour: Yarn['colour'] = { state: 'dyeable' }): Yarn => ({
  id,
  name: id,
  dtex: 78,
  fibres: fibreShares.map(([fibre, share]) => ({ fibre, share })),
  colour,
});

const pa = yarn('pa', [['polyamide', 1]]);
const pa2 = yarn('pa2', [['polyamide', 1]]);
const pes = yarn('pes', [['polyester', 1]]);
const el = yarn('el', [['elastane', 1]]);
const pp = yarn('pp', [['polypropylene', 1]]);
const wool = yarn('wool', [['wool', 1]]);
const cotton = yarn('co', [['cotton', 1]]);

const navy = { L: 22, a: 3, b: -25 };
const grey = { L: 62, a: 0, b: -2 };
const red = { L: 45, a: 60, b: 35 };

const target = (id: string, yarnIds: string[], colour: DyeTarget['colour']): DyeTarget => ({ id, yarnIds, colour });
const kinds = (plan: ReturnType<typeof planDyeing>) => plan.findings.map((f) => f.kind);

describe('planDyeing, garment-dyed', () => {
  // Cross-dyed two-tone: acid dyes colour polyamide only, disperse dyes colour polyester and also
  // stain polyamide (references.md §8: "Acid dyes … applied to … nylon", disperse "main use is to
  // dye polyester, but they can also be used to dye nylon" — an encyclopedia article on dyes, read
  // in a secondary copy; the two-tone logic from memory).
  it('dyes a polyamide + polyester two-tone in a disperse then an acid bath, with a stain risk', () => {
    const plan = planDyeing({
      yarns: [pa, pes],
      targets: [target('ground', ['pa'], navy), target('accent', ['pes'], grey)],
      route: 'garment-dyed',
    });
    expect(plan.baths.map((b) => [b.order, b.dyeClass, b.targetId])).toEqual([
      [1, 'disperse', 'accent'],
      [2, 'acid', 'ground'],
    ]);
    const disperse = plan.baths[0];
    expect(disperse?.fibres).toEqual(['polyester']);
    expect(disperse?.yarnIds).toEqual(['pes']);
    expect(disperse?.temperatureC).toBe(130); // references.md §8: disperse at 130 °C [VERIFIED-2nd]
    expect(kinds(plan)).not.toContain('clash');
    const stain = plan.findings.find((f) => f.kind === 'stain-risk');
    expect(stain?.yarnIds).toEqual(['pa']);
    expect(stain?.message).toMatch(/polyamide/);
    expect(stain?.instead).toMatch(/reduction clearing/);
  });

  // Polyamide + cationic-dyeable polyester two-tone: cationic dyes colour the modified polyester,
  // acid dyes the polyamide (references.md §8: cationic for CDP from memory, acid for nylon
  // verified-2nd); cationic dyes also stain polyamide (from memory: its carboxyl end groups take up
  // basic dye). Both baths stay at or below the boil, so plated elastane is not overheated.
  it('dyes a polyamide + cationic polyester two-tone in a cationic then an acid bath, with a stain on the polyamide', () => {
    const cd = yarn('cd', [['polyester-cd', 1]]);
    const plan = planDyeing({
      yarns: [pa, cd, el],
      targets: [target('ground', ['pa'], navy), target('accent', ['cd'], grey)],
      route: 'garment-dyed',
    });
    expect(plan.baths.map((b) => [b.order, b.dyeClass, b.targetId, b.temperatureC])).toEqual([
      [1, 'cationic', 'accent', 100],
      [2, 'acid', 'ground', 98],
    ]);
    expect(kinds(plan)).not.toContain('clash');
    expect(kinds(plan)).not.toContain('heat-limit');
    const stain = plan.findings.filter((f) => f.kind === 'stain-risk');
    expect(stain).toHaveLength(1);
    expect(stain[0]?.yarnIds).toEqual(['pa']);
    expect(stain[0]?.message).toMatch(/cationic bath stains the polyamide/);
    expect(stain[0]?.instead).toMatch(/reserving agent/);
    expect(plan.findings.find((f) => f.kind === 'grin-through')?.yarnIds).toEqual(['el']);
  });

  // Polyamide/elastane in one colour: the acid bath at 98 °C (common practice, no published source:
  // polyamide is dyed with acid dyes at or near the boil) is below elastane's wet limit in the fibre
  // registry (120 °C, from memory), so no heat finding; bare elastane takes little dye (product
  // design §8) and grins through.
  it('dyes polyamide + elastane in one acid bath at 98 °C without a heat finding', () => {
    const plan = planDyeing({ yarns: [pa, el], targets: [target('body', ['pa', 'el'], navy)], route: 'garment-dyed' });
    expect(plan.baths).toHaveLength(1);
    expect(plan.baths[0]?.dyeClass).toBe('acid');
    expect(plan.baths[0]?.temperatureC).toBe(98);
    expect(kinds(plan)).not.toContain('heat-limit');
    expect(kinds(plan)).not.toContain('undyeable');
    expect(kinds(plan)).not.toContain('stain-risk');
    expect(plan.findings.find((f) => f.kind === 'grin-through')?.yarnIds).toEqual(['el']);
  });

  // Polyester/elastane at 130 °C: "Dyeing polyester/elastane at 130 C: Permanent drawing of
  // elastane fibre; Loss of stretch recovery power … Heavy staining of elastane fibres" (dye-maker
  // technical note, 2000, read in a secondary copy; references.md §8 [VERIFIED-2nd]).
  it('flags the heat limit and elastane staining of a polyester + elastane bath at 130 °C', () => {
    const plan = planDyeing({ yarns: [pes, el], targets: [target('body', ['pes', 'el'], grey)], route: 'garment-dyed' });
    const heat = plan.findings.find((f) => f.kind === 'heat-limit');
    expect(heat?.severity).toBe('error');
    expect(heat?.yarnIds).toEqual(['el']);
    expect(heat?.message).toMatch(/130 °C/);
    expect(plan.findings.find((f) => f.kind === 'stain-risk')?.yarnIds).toEqual(['el']);
  });

  // Wool + polyester two-tone: the polyester needs the disperse bath at 130 °C (references.md §8,
  // verified-2nd); wool is dyed at the boil and yellows and weakens in long baths well above it
  // (common practice, no published source; registry wetLimitC 105 °C), and disperse dyes stain it
  // (from memory).
  it('flags the heat limit and the disperse stain on the wool of a wool + polyester two-tone at 130 °C', () => {
    const plan = planDyeing({ yarns: [wool, pes], targets: [target('a', ['wool'], red), target('b', ['pes'], navy)], route: 'garment-dyed' });
    expect(plan.baths.map((b) => [b.dyeClass, b.temperatureC])).toEqual([
      ['disperse', 130],
      ['acid', 98],
    ]);
    const heat = plan.findings.filter((f) => f.kind === 'heat-limit');
    expect(heat).toHaveLength(1);
    expect(heat[0]?.yarnIds).toEqual(['wool']);
    expect(heat[0]?.targetIds).toEqual(['b']);
    expect(heat[0]?.message).toMatch(/130 °C, above the wet limit of wool 105 °C/);
    expect(heat[0]?.message).toMatch(/wool yellows/);
    const stain = plan.findings.filter((f) => f.kind === 'stain-risk');
    expect(stain).toHaveLength(1);
    expect(stain[0]?.yarnIds).toEqual(['wool']);
    expect(stain[0]?.message).toMatch(/disperse bath stains the wool/);
    expect(stain[0]?.instead).toMatch(/not in a hot alkaline reduction bath/);
  });

  // The same two-tone with the disperse bath run at the boil (a studio override) is within wool's
  // limit: the heat finding goes, the stain stays.
  it('keeps the wool stain but drops its heat finding when the disperse bath runs at 100 °C', () => {
    const plan = planDyeing({
      yarns: [wool, pes],
      targets: [target('a', ['wool'], red), target('b', ['pes'], navy)],
      route: 'garment-dyed',
      options: { bathTemperatureC: { disperse: 100 } },
    });
    expect(kinds(plan)).not.toContain('heat-limit');
    expect(plan.findings.find((f) => f.kind === 'stain-risk')?.yarnIds).toEqual(['wool']);
  });

  // Acrylic + polyester two-tone: cationic dyes for the acrylic (references.md §8, verified-2nd) at
  // the boil, disperse at 130 °C for the polyester. Acrylic softens above its wet glass transition
  // and is not dyed much above the boil (from memory, registry wetLimitC 105 °C); disperse dyes
  // colour acrylic too ("can also be used to dye … acrylic fibers", references.md §8, verified-2nd).
  it('flags the heat limit and the disperse stain on the acrylic of an acrylic + polyester two-tone', () => {
    const pan = yarn('pan', [['acrylic', 1]]);
    const plan = planDyeing({ yarns: [pan, pes], targets: [target('a', ['pan'], red), target('b', ['pes'], navy)], route: 'garment-dyed' });
    expect(plan.baths.map((b) => [b.dyeClass, b.temperatureC])).toEqual([
      ['disperse', 130],
      ['cationic', 100],
    ]);
    const heat = plan.findings.filter((f) => f.kind === 'heat-limit');
    expect(heat).toHaveLength(1);
    expect(heat[0]?.yarnIds).toEqual(['pan']);
    expect(heat[0]?.message).toMatch(/disperse bath runs at 130 °C, above the wet limit of acrylic 105 °C/);
    expect(heat[0]?.message).toMatch(/acrylic softens, shrinks/);
    expect(plan.findings.find((f) => f.kind === 'stain-risk')?.yarnIds).toEqual(['pan']);
  });

  // Their own baths stay within the limits: wool in acid at about 98 °C, acrylic in cationic at the
  // boil (bath profiles: acid 98 °C common practice, cationic 100 °C from memory).
  it('finds no heat limit for wool in its acid bath or acrylic in its cationic bath', () => {
    const pan = yarn('pan', [['acrylic', 1]]);
    for (const y of [wool, pan]) {
      const plan = planDyeing({ yarns: [y], targets: [target('a', [y.id], red)], route: 'garment-dyed' });
      expect(plan.baths).toHaveLength(1);
      expect(kinds(plan)).toEqual([]);
    }
  });

  it('drops the heat finding when the studio runs the disperse bath at the elastane limit', () => {
    const limit = fibres.elastane.wetLimitC;
    expect(limit).toBeDefined();
    const plan = planDyeing({
      yarns: [pes, el],
      targets: [target('body', ['pes', 'el'], grey)],
      route: 'garment-dyed',
      options: { bathTemperatureC: { disperse: limit } },
    });
    expect(plan.baths[0]?.temperatureC).toBe(limit);
    expect(kinds(plan)).not.toContain('heat-limit');
  });

  // "Unmodified polypropylene fiber is difficult to dye due to the absence of dye sites" (Springer
  // chapter abstract, references.md §8 [VERIFIED-2nd]): model it as dope-dyed only.
  it('finds polypropylene undyeable in a garment-dyeing run', () => {
    const plan = planDyeing({ yarns: [pp, pa], targets: [target('a', ['pp'], red), target('b', ['pa'], navy)], route: 'garment-dyed' });
    const f = plan.findings.find((x) => x.kind === 'undyeable');
    expect(f?.severity).toBe('error');
    expect(f?.yarnIds).toEqual(['pp']);
    expect(f?.instead).toMatch(/dope-dyed/);
    expect(plan.baths.map((b) => b.dyeClass)).toEqual(['acid']);
  });

  // Product design §8: "yarns of one dye class take one colour: two target colours on the same
  // class clash unless one yarn comes coloured".
  it('finds a clash for two polyamide yarns with two target colours', () => {
    const plan = planDyeing({ yarns: [pa, pa2], targets: [target('a', ['pa'], navy), target('b', ['pa2'], red)], route: 'garment-dyed' });
    const clash = plan.findings.filter((f) => f.kind === 'clash');
    expect(clash).toHaveLength(1);
    expect(clash[0]?.yarnIds.sort()).toEqual(['pa', 'pa2']);
    expect(clash[0]?.targetIds.sort()).toEqual(['a', 'b']);
    expect(clash[0]?.instead).toMatch(/dope-dyed or yarn-dyed/);
  });

  it('has no clash when one of the two polyamides comes dope-dyed, but warns it takes up the bath', () => {
    const dope = yarn('pa2', [['polyamide', 1]], { state: 'dope-dyed', lab: red });
    const plan = planDyeing({ yarns: [pa, dope], targets: [target('a', ['pa'], navy)], route: 'garment-dyed' });
    expect(kinds(plan)).not.toContain('clash');
    expect(plan.findings.find((f) => f.kind === 'stain-risk')?.yarnIds).toEqual(['pa2']);
  });

  it('treats two targets within the same-shade tolerance as one bath colour', () => {
    // Sharma et al. (2005) pair 33: ΔE00 0.6377 < 1.0.
    const plan = planDyeing({
      yarns: [pa, pa2],
      targets: [
        target('a', ['pa'], { L: 6.7747, a: -0.2908, b: -2.4247 }),
        target('b', ['pa2'], { L: 5.8714, a: -0.0985, b: -2.2286 }),
      ],
      route: 'garment-dyed',
    });
    expect(kinds(plan)).not.toContain('clash');
    expect(kinds(plan)).toContain('low-contrast');
  });

  // Wool takes acid and reactive dyes (product design §8): an acid bath for the polyamide colours
  // the wool as well, so a polyamide/wool two-tone clashes in the acid bath.
  it('finds the acid bath clash of a wool + polyamide two-tone', () => {
    const plan = planDyeing({ yarns: [pa, wool], targets: [target('a', ['pa'], navy), target('b', ['wool'], red)], route: 'garment-dyed' });
    const clash = plan.findings.find((f) => f.kind === 'clash');
    expect(clash?.message).toMatch(/acid/);
    expect(clash?.yarnIds.sort()).toEqual(['pa', 'wool']);
  });

  // Cellulosics take reactive dyes, polyester disperse (references.md §8): two baths, hottest first.
  it('dyes a cotton + polyester two-tone in disperse then reactive, without staining the cotton', () => {
    const plan = planDyeing({ yarns: [cotton, pes], targets: [target('a', ['co'], red), target('b', ['pes'], navy)], route: 'garment-dyed' });
    expect(plan.baths.map((b) => b.dyeClass)).toEqual(['disperse', 'reactive']);
    expect(plan.baths[1]?.temperatureC).toBe(bathProfiles.reactive.temperatureC);
    expect(kinds(plan)).toEqual([]);
  });

  // Low contrast by CIEDE2000: Sharma et al. (2005) pair 27 differs by ΔE00 1.8731.
  it('finds two tones too close to read as two, with their ΔE00', () => {
    const plan = planDyeing({
      yarns: [pa, pes],
      targets: [
        target('a', ['pa'], { L: 61.2901, a: 3.7196, b: -5.3901 }),
        target('b', ['pes'], { L: 61.4292, a: 2.248, b: -4.962 }),
      ],
      route: 'garment-dyed',
    });
    const f = plan.findings.find((x) => x.kind === 'low-contrast');
    expect(f?.message).toMatch(/ΔE00 1\.9/);
    expect(f?.yarnIds).toEqual(['pa', 'pes']);
    const relaxed = planDyeing({
      yarns: [pa, pes],
      targets: [
        target('a', ['pa'], { L: 61.2901, a: 3.7196, b: -5.3901 }),
        target('b', ['pes'], { L: 61.4292, a: 2.248, b: -4.962 }),
      ],
      route: 'garment-dyed',
      options: { lowContrastDeltaE: 1.8 },
    });
    expect(kinds(relaxed)).not.toContain('low-contrast');
  });

  // Product design §8: elastane takes little dye; a raw-white elastane shows most under a dark
  // ground (common practice, no published source). A dope-dyed ground needs no bath, and still shows it.
  it('finds the grin-through of bare elastane under a dope-dyed black polyester, with no bath at all', () => {
    const black = yarn('pes-black', [['polyester', 1]], { state: 'dope-dyed', lab: { L: 18, a: 0, b: -1 } });
    const plan = planDyeing({ yarns: [black, el], targets: [], route: 'garment-dyed' });
    expect(plan.baths).toEqual([]);
    const grin = plan.findings.filter((f) => f.kind === 'grin-through');
    expect(grin).toHaveLength(1);
    expect(grin[0]?.yarnIds).toEqual(['el']);
  });

  it('finds no grin-through while nothing in the garment is coloured', () => {
    const plan = planDyeing({ yarns: [pes, el], targets: [], route: 'garment-dyed' });
    expect(plan.findings).toEqual([]);
  });

  it('refuses a target that names an unknown yarn', () => {
    expect(() => planDyeing({ yarns: [pa], targets: [target('a', ['nope'], navy)], route: 'garment-dyed' })).toThrow(/nope/);
  });
});

describe('planDyeing, yarn-dyed', () => {
  it('dyes each yarn on its own: two polyamides in two colours do not clash', () => {
    const plan = planDyeing({ yarns: [pa, pa2], targets: [target('a', ['pa'], navy), target('b', ['pa2'], red)], route: 'yarn-dyed' });
    expect(kinds(plan)).not.toContain('clash');
    expect(plan.baths.map((b) => [b.dyeClass, b.yarnIds])).toEqual([
      ['acid', ['pa']],
      ['acid', ['pa2']],
    ]);
  });

  it('still finds the heat limit of a covered polyester/elastane yarn dyed at 130 °C', () => {
    const covered = yarn('cov', [['polyester', 0.85], ['elastane', 0.15]]);
    const plan = planDyeing({ yarns: [covered, pa], targets: [target('a', ['cov'], grey), target('b', ['pa'], navy)], route: 'yarn-dyed' });
    expect(plan.findings.find((f) => f.kind === 'heat-limit')?.yarnIds).toEqual(['cov']);
    // On its own bath the polyamide is not stained by the polyester's disperse dye.
    expect(plan.findings.filter((f) => f.kind === 'stain-risk').flatMap((f) => f.yarnIds)).toEqual(['cov']);
  });
});
