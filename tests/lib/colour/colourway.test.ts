import { describe, expect, it } from 'vitest';
import { colourwayRoute, planColourway, type ColourwayTarget } from '@/lib/colour/colourway';
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
const cotton = yarn('co', [['cotton', 1]]);

const navy = { L: 22, a: 3, b: -25 };
const red = { L: 45, a: 60, b: 35 };
const grey = { L: 62, a: 0, b: -2 };

const target = (id: string, yarnIds: string[], colour: ColourwayTarget['colour'], route: ColourwayTarget['route'] = 'garment-dyed'): ColourwayTarget => ({
  id, name: id, yarnIds, colour, route,
});
const kinds = (plan: ReturnType<typeof planColourway>) => plan.findings.map((f) => f.kind);

describe('colourwayRoute', () => {
  it('names the common route, mixed, or none', () => {
    expect(colourwayRoute([])).toBe('none');
    expect(colourwayRoute(['garment-dyed', 'garment-dyed'])).toBe('garment-dyed');
    expect(colourwayRoute(['garment-dyed', 'dope-dyed'])).toBe('mixed');
  });
});

describe('planColourway, mixed routes', () => {
  it('plans an all garment-dyed colourway as planDyeing does', () => {
    const plan = planColourway({ yarns: [pa, pes, el], targets: [target('ground', ['pa'], navy), target('accent', ['pes'], grey)] });
    expect(plan.route).toBe('garment-dyed');
    expect(plan.baths.map((b) => [b.order, b.stage, b.dyeClass])).toEqual([
      [1, 'garment', 'disperse'],
      [2, 'garment', 'acid'],
    ]);
    expect(kinds(plan)).toContain('heat-limit');
  });

  // Common practice, no published source: the usual way round the 130 °C disperse bath of a
  // polyester/elastane garment is a dope-dyed polyester, so the garment only sees the acid bath.
  it('a dope-dyed polyester accent leaves only the acid bath, with no heat finding for the elastane', () => {
    const plan = planColourway({
      yarns: [pa, pes, el],
      targets: [target('ground', ['pa'], navy), target('accent', ['pes'], grey, 'dope-dyed')],
    });
    expect(plan.route).toBe('mixed');
    expect(plan.baths.map((b) => b.dyeClass)).toEqual(['acid']);
    expect(kinds(plan)).not.toContain('heat-limit');
    expect(kinds(plan)).not.toContain('clash');
    expect(plan.findings.filter((f) => f.kind === 'grin-through')).toHaveLength(1);
  });

  // Product design §8: "two target colours on the same class clash unless one yarn comes coloured".
  it('a yarn-dyed polyamide accent does not clash with the garment-dyed polyamide ground, but takes up the acid bath', () => {
    const clash = planColourway({ yarns: [pa, pa2], targets: [target('ground', ['pa'], navy), target('accent', ['pa2'], red)] });
    expect(kinds(clash)).toContain('clash');

    const plan = planColourway({
      yarns: [pa, pa2],
      targets: [target('ground', ['pa'], navy), target('accent', ['pa2'], red, 'yarn-dyed')],
    });
    expect(kinds(plan)).not.toContain('clash');
    expect(plan.baths.map((b) => [b.order, b.stage, b.dyeClass, b.yarnIds])).toEqual([
      [1, 'yarn', 'acid', ['pa2']],
      [2, 'garment', 'acid', ['pa']],
    ]);
    const over = plan.findings.find((f) => f.kind === 'stain-risk');
    expect(over?.yarnIds).toEqual(['pa2']);
    expect(over?.message).toMatch(/pa2 \(accent\) comes coloured/);
  });

  it('judges contrast across routes once', () => {
    const plan = planColourway({
      yarns: [pa, pes],
      targets: [target('ground', ['pa'], grey, 'yarn-dyed'), target('accent', ['pes'], { L: 62.5, a: 0.3, b: -2.2 }, 'dope-dyed')],
    });
    expect(plan.findings.filter((f) => f.kind === 'low-contrast')).toHaveLength(1);
  });

  // Common practice, no published source: colour is added to the melt or spinning solution of
  // man-made fibres only, so a natural fibre cannot be dope-dyed.
  it('refuses to dope-dye cotton', () => {
    const plan = planColourway({ yarns: [cotton, pa], targets: [target('a', ['co'], red, 'dope-dyed'), target('b', ['pa'], navy)] });
    const f = plan.findings.find((x) => x.kind === 'undyeable');
    expect(f?.severity).toBe('error');
    expect(f?.yarnIds).toEqual(['co']);
    expect(f?.instead).toMatch(/Yarn-dye it or garment-dye it/);
  });

  // Common practice, no published source: raw-white elastane grins through a dark ground, whether
  // the ground was dyed in the garment or spun in its colour.
  it('names the elastane grin-through of an all dope-dyed colourway, which has no bath', () => {
    const plan = planColourway({ yarns: [pes, el], targets: [target('body', ['pes'], navy, 'dope-dyed')] });
    expect(plan.baths).toEqual([]);
    expect(plan.findings.filter((f) => f.kind === 'grin-through').map((f) => f.yarnIds)).toEqual([['el']]);
  });

  it('keeps a library yarn that comes coloured in its own colour', () => {
    const black = yarn('pp', [['polypropylene', 1]], { state: 'dope-dyed', lab: { L: 18, a: 0, b: -1 } });
    const plan = planColourway({ yarns: [pa, black], targets: [target('ground', ['pa'], navy)] });
    expect(plan.baths).toHaveLength(1);
    expect(kinds(plan)).not.toContain('undyeable');
  });
});
