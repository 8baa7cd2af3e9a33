import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { as, styleByCode } from './helpers';

interface ColourSettings { tolerance: Record<string, unknown>; lowContrastDeltaE: number; defaults: string[] }

const navy = { L: 24.5, a: 1.8, b: -21.6 };
// 4 L* units lighter: ΔE00 2.97 from navy (CIEDE2000, lib/colour/difference).
const lighterNavy = { L: 28.5, a: 1.8, b: -21.6 };

let initial: ColourSettings;
let ridgeId = '';
let yarnIds: Record<string, string> = {};

const restoreBody = (s: ColourSettings) => ({
  tolerance: s.defaults.includes('tolerance') ? null : s.tolerance,
  lowContrastDeltaE: s.defaults.includes('lowContrastDeltaE') ? null : s.lowContrastDeltaE,
});

beforeAll(async () => {
  const lead = await as('colour-lead');
  initial = (await lead.get('/api/settings/colour')).json.colour;
  ridgeId = (await styleByCode('HF27-101')).id;
  const yarns = (await lead.get(`/api/styles/${ridgeId}/colourways`)).json.yarns as { id: string; name: string }[];
  yarnIds = Object.fromEntries(yarns.map((y) => [y.name, y.id]));
});

// The other tests expect the seeded settings: put them back whatever happens here.
afterAll(async () => {
  await (await as('colour-lead')).put('/api/settings/colour', restoreBody(initial));
});

async function twoNavies(): Promise<{ lowContrast: number; targetId: string }> {
  const lead = await as('colour-lead');
  const res = await lead.post(`/api/styles/${ridgeId}/colourways`, {
    name: `Settings two-tone ${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 6)}`,
    targets: [
      { name: 'Ground', yarnIds: [yarnIds['Polyamide 6.6 78/68 semi-dull']], route: 'garment-dyed', colour: { source: 'lab', lab: navy } },
      { name: 'Accent', yarnIds: [yarnIds['Cationic-dyeable polyester 84/72']], route: 'garment-dyed', colour: { source: 'lab', lab: lighterNavy } },
    ],
  });
  expect(res.status).toBe(201);
  const cw = res.json.colourway as { targets: { id: string }[]; plan: { findings: { kind: string }[] } };
  return { lowContrast: cw.plan.findings.filter((f) => f.kind === 'low-contrast').length, targetId: cw.targets[0]!.id };
}

describe('studio colour settings', () => {
  it('the designer reads them; the colour lead writes a ΔE00 tolerance and a low-contrast threshold, and the plan and new dips use them', async () => {
    const designer = await as('designer');
    const read = await designer.get('/api/settings/colour');
    expect(read.status).toBe(200);
    expect(read.json.colour).toEqual(initial);
    const costingBefore = (await designer.get('/api/settings/costing')).json.costing;

    // At the product default (ΔE00 5, common practice, no published source) the two navies read as one.
    const lead = await as('colour-lead');
    expect((await lead.put('/api/settings/colour', { tolerance: initial.tolerance, lowContrastDeltaE: null })).status).toBe(200);
    expect((await twoNavies()).lowContrast).toBe(1);

    const res = await lead.put('/api/settings/colour', { tolerance: { formula: 'de2000', max: '0.8' }, lowContrastDeltaE: '2,5' });
    expect(res.status).toBe(200);
    expect(res.json.colour).toEqual({ tolerance: { formula: 'de2000', max: 0.8 }, lowContrastDeltaE: 2.5, defaults: [] });
    expect((await designer.get('/api/settings/colour')).json.colour).toEqual(res.json.colour);
    const after = await twoNavies();
    expect(after.lowContrast).toBe(0);

    // A new lab dip for a target without a standard is judged by the studio tolerance.
    const mill = await as('mill');
    const dip = await mill.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: after.targetId, measured: { L: 24.9, a: 2.4, b: -21.0 } });
    expect(dip.status).toBe(201);
    expect(dip.json.labDip.tolerance).toEqual({ formula: 'de2000', max: 0.8 });

    // The costing settings beside them are untouched.
    expect((await designer.get('/api/settings/costing')).json.costing).toEqual(costingBefore);

    // Null puts both back to the product defaults.
    const reset = await lead.put('/api/settings/colour', { tolerance: null, lowContrastDeltaE: null });
    expect(reset.json.colour).toEqual({ tolerance: { formula: 'cmc', l: 2, c: 1, max: 1 }, lowContrastDeltaE: 5, defaults: ['tolerance', 'lowContrastDeltaE'] });
  });

  it('answers 400 with field errors for values out of bounds and changes nothing', async () => {
    const lead = await as('colour-lead');
    const before = (await lead.get('/api/settings/colour')).json.colour;
    const bad = await lead.put('/api/settings/colour', { tolerance: { formula: 'cmc', l: 9, c: 1, max: 0 }, lowContrastDeltaE: 0.2 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.fieldErrors)).toEqual(expect.arrayContaining(['tolerance.l', 'tolerance.max', 'lowContrastDeltaE']));
    expect(bad.json.fieldErrors.lowContrastDeltaE[0]).toMatch(/at least 1/);
    expect((await lead.put('/api/settings/colour', { tolerance: { formula: 'grey scale', max: 1 }, lowContrastDeltaE: 30 })).json.fieldErrors).toMatchObject({
      'tolerance.formula': [expect.stringMatching(/CMC or ΔE00/)],
      lowContrastDeltaE: [expect.stringMatching(/at most 20/)],
    });
    expect((await lead.put('/api/settings/colour', { lowContrastDeltaE: 3 })).status).toBe(400);
    expect((await lead.put('/api/settings/colour', { tolerance: null, lowContrastDeltaE: null, costing: {} })).status).toBe(400);
    expect((await lead.put('/api/settings/colour', 'not json')).status).toBe(400);
    expect((await lead.get('/api/settings/colour')).json.colour).toEqual(before);
  });

  it('only the admin and the colour lead write; the mill and the client do not read', async () => {
    const body = restoreBody(initial);
    expect((await (await as('designer')).put('/api/settings/colour', body)).status).toBe(403);
    expect((await (await as('mill')).get('/api/settings/colour')).status).toBe(403);
    expect((await (await as('client')).get('/api/settings/colour')).status).toBe(403);
    expect((await (await as('admin')).put('/api/settings/colour', body)).status).toBe(200);
  });
});
