import { beforeAll, describe, expect, it } from 'vitest';
import { as, baseUrl, newStyleBody, styleByCode, type Client } from './helpers';

let seq = 0;
const unique = (what: string) => `${what} ${Date.now().toString(36)}-${(seq++).toString(36)}`;

const navy = { L: 24.5, a: 1.8, b: -21.6 };
const red = { L: 45, a: 58, b: 34 };
const teal = { L: 58.2, a: -24.5, b: -4.8 };

interface StyleYarn { id: string; name: string; fibres: { fibre: string }[]; colour: { state: string }; feeds: string }

let ridgeId = '';
let yarns: Record<'pa78' | 'pa44' | 'cd84' | 'el22', string>;

beforeAll(async () => {
  ridgeId = (await styleByCode('HF27-101')).id;
  const lead = await as('colour-lead');
  const list = (await lead.get(`/api/styles/${ridgeId}/colourways`)).json.yarns as StyleYarn[];
  const by = (name: string) => {
    const y = list.find((x) => x.name === name);
    if (!y) throw new Error(`HF27-101 has no yarn ${name}`);
    return y.id;
  };
  yarns = {
    pa78: by('Polyamide 6.6 78/68 semi-dull'),
    pa44: by('Polyamide 44/34 full-dull'),
    cd84: by('Cationic-dyeable polyester 84/72'),
    el22: by('Bare elastane 22 dtex'),
  };
});

const labTarget = (name: string, yarnIds: string[], lab: { L: number; a: number; b: number }, route = 'garment-dyed') => ({
  name, yarnIds, route, colour: { source: 'lab', lab },
});

async function twoTone(targets: object[] = [labTarget('Ground', [yarns.pa78, yarns.pa44], navy), labTarget('Accent', [yarns.cd84], teal)]) {
  const lead = await as('colour-lead');
  const res = await lead.post(`/api/styles/${ridgeId}/colourways`, { name: unique('Two-tone'), notes: 'Studio only', targets });
  expect(res.status).toBe(201);
  return res.json.colourway as { id: string; version: number; targets: { id: string; name: string }[] };
}

async function submit(targetId: string, measured = { L: 24.9, a: 2.4, b: -21.0 }) {
  const mill = await as('mill');
  const res = await mill.post(`/api/styles/${ridgeId}/lab-dips`, { targetId, measured, comment: 'Dip from the dye house' });
  expect(res.status).toBe(201);
  return res.json.labDip as { id: string; version: number; sequence: number; status: string };
}

/** A 1 × 1 px PNG. */
const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

/** Uploads a file to the style through the style's file route (multipart), as a signed-in client. */
async function uploadPhoto(client: Client, styleId: string) {
  const form = new FormData();
  form.set('file', new Blob([png], { type: 'image/png' }), 'dip.png');
  const res = await fetch(`${baseUrl()}/api/styles/${styleId}/files`, { method: 'POST', body: form, headers: { cookie: client.cookie } });
  expect(res.status).toBe(201);
  return ((await res.json()) as { file: { id: string } }).file.id;
}

describe('colour standards', () => {
  it('the colour lead adds one with the default tolerance CMC(2:1) ≤ 1.0; the designer reads but may not add', async () => {
    const lead = await as('colour-lead');
    const name = unique('Moor Blue');
    const res = await lead.post('/api/library/colour-standards', { name, lab: { L: '31.2', a: '-2,5', b: -28 }, source: 'measured' });
    expect(res.status).toBe(201);
    expect(res.json.standard).toMatchObject({ name, lab: { L: 31.2, a: -2.5, b: -28 }, tolerance: { formula: 'cmc', l: 2, c: 1, max: 1 }, version: 1 });
    const designer = await as('designer');
    expect((await designer.get('/api/library/colour-standards')).json.standards.map((s: { name: string }) => s.name)).toContain(name);
    expect((await designer.post('/api/library/colour-standards', { name: unique('x'), lab: navy, source: 'digital' })).status).toBe(403);
  });

  it('answers 400 with field errors and saves nothing', async () => {
    const lead = await as('colour-lead');
    const name = unique('Broken');
    const res = await lead.post('/api/library/colour-standards', {
      name, lab: { L: 140, a: 'x', b: -3 }, source: 'guessed', tolerance: { formula: 'cmc', l: 2, c: 1, max: 0 },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.fieldErrors)).toEqual(expect.arrayContaining(['lab.L', 'lab.a', 'source', 'tolerance.max']));
    expect(res.json.fieldErrors['lab.L'][0]).toMatch(/at most 100/);
    expect((await lead.post('/api/library/colour-standards', { lab: navy, source: 'measured' })).json.fieldErrors.name).toBeDefined();
    expect((await lead.post('/api/library/colour-standards', 'not json')).status).toBe(400);
    const names = (await lead.get('/api/library/colour-standards')).json.standards.map((s: { name: string }) => s.name);
    expect(names).not.toContain(name);
  });

  it('refuses a duplicate name with a field error', async () => {
    const lead = await as('colour-lead');
    const res = await lead.post('/api/library/colour-standards', { name: 'Fellside Navy', lab: navy, source: 'measured' });
    expect(res.status).toBe(400);
    expect(res.json.fieldErrors.name[0]).toMatch(/already in the library/);
  });

  it('PATCH at the current version saves; a stale version gets 409 and changes nothing; DELETE archives', async () => {
    const lead = await as('colour-lead');
    const s = (await lead.post('/api/library/colour-standards', { name: unique('Tarn'), lab: teal, source: 'digital' })).json.standard;
    const first = await lead.patch(`/api/library/colour-standards/${s.id}`, { version: s.version, tolerance: { formula: 'de2000', max: 0.8 } });
    expect(first.status).toBe(200);
    expect(first.json.standard).toMatchObject({ version: 2, tolerance: { formula: 'de2000', max: 0.8 }, lab: teal });
    const stale = await lead.patch(`/api/library/colour-standards/${s.id}`, { version: s.version, lab: red });
    expect(stale.status).toBe(409);
    expect((await lead.get(`/api/library/colour-standards/${s.id}`)).json.standard.lab).toEqual(teal);
    expect((await lead.get('/api/library/colour-standards/not-a-uuid')).status).toBe(400);
    expect((await lead.delete(`/api/library/colour-standards/${s.id}`)).status).toBe(200);
    expect((await lead.get('/api/library/colour-standards')).json.standards.map((x: { id: string }) => x.id)).not.toContain(s.id);
    expect((await lead.patch(`/api/library/colour-standards/${s.id}`, { version: 3, notes: 'x' })).status).toBe(404);
  });
});

describe('colourways', () => {
  it('plans a polyamide + cationic polyester two-tone: cationic then acid bath, the polyamide stain, elastane grin-through', async () => {
    const cw = await twoTone();
    const designer = await as('designer');
    const read = (await designer.get(`/api/styles/${ridgeId}/colourways/${cw.id}`)).json.colourway;
    expect(read.targets.map((t: { name: string }) => t.name)).toEqual(['Ground', 'Accent']);
    expect(read.plan.route).toBe('garment-dyed');
    expect(read.plan.baths.map((b: { dyeClass: string; temperatureC: number }) => [b.dyeClass, b.temperatureC])).toEqual([
      ['cationic', 100],
      ['acid', 98],
    ]);
    const kinds = read.plan.findings.map((f: { kind: string }) => f.kind);
    expect(kinds).toContain('stain-risk');
    expect(kinds).toContain('grin-through');
    expect(kinds).not.toContain('clash');
  });

  it('finds the clash of two polyamide yarns with two colours, and lifts it when one is yarn-dyed', async () => {
    const cw = await twoTone([labTarget('Ground', [yarns.pa78], navy), labTarget('Trim', [yarns.pa44], red)]);
    const lead = await as('colour-lead');
    const read = (await lead.get(`/api/styles/${ridgeId}/colourways/${cw.id}`)).json.colourway;
    const clash = read.plan.findings.find((f: { kind: string }) => f.kind === 'clash');
    expect(clash.yarnIds.sort()).toEqual([yarns.pa44, yarns.pa78].sort());
    expect(clash.instead).toMatch(/dope-dyed or yarn-dyed/);
    const patched = await lead.patch(`/api/styles/${ridgeId}/colourways/${cw.id}`, {
      version: cw.version,
      targets: [
        { id: cw.targets[0]!.id, ...labTarget('Ground', [yarns.pa78], navy) },
        { id: cw.targets[1]!.id, ...labTarget('Trim', [yarns.pa44], red, 'yarn-dyed') },
      ],
    });
    expect(patched.status).toBe(200);
    expect(patched.json.colourway.plan.route).toBe('mixed');
    expect(patched.json.colourway.plan.findings.map((f: { kind: string }) => f.kind)).not.toContain('clash');
    expect(patched.json.colourway.targets.map((t: { id: string }) => t.id)).toEqual(cw.targets.map((t) => t.id));
  });

  it('answers 400 with field errors for yarns, colours and standards, and saves nothing', async () => {
    const lead = await as('colour-lead');
    const before = (await lead.get(`/api/styles/${ridgeId}/colourways`)).json.colourways.length;
    const res = await lead.post(`/api/styles/${ridgeId}/colourways`, {
      name: unique('Bad'),
      targets: [
        labTarget('A', [yarns.pa78], { L: 120, a: 0, b: 0 }),
        labTarget('B', [yarns.pa78], navy),
        { name: 'C', yarnIds: [], route: 'sprayed', colour: { source: 'standard', standardId: '' } },
      ],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.fieldErrors)).toEqual(
      expect.arrayContaining(['targets.0.colour.lab.L', 'targets.1.yarnIds', 'targets.2.yarnIds', 'targets.2.route', 'targets.2.colour.standardId']),
    );
    const foreign = await lead.post(`/api/styles/${ridgeId}/colourways`, {
      name: unique('Bad'),
      targets: [
        labTarget('A', ['00000000-0000-4000-8000-000000000000'], navy),
        { name: 'B', yarnIds: [yarns.cd84], route: 'garment-dyed', colour: { source: 'standard', standardId: '00000000-0000-4000-8000-000000000000' } },
      ],
    });
    expect(foreign.status).toBe(400);
    expect(foreign.json.fieldErrors['targets.0.yarnIds'][0]).toMatch(/Not a yarn of this style/);
    expect(foreign.json.fieldErrors['targets.1.colour.standardId'][0]).toMatch(/Not a colour standard/);
    expect((await lead.get(`/api/styles/${ridgeId}/colourways`)).json.colourways.length).toBe(before);
  });

  it('a stale version gets 409 and changes nothing; only the colour lead and admin edit', async () => {
    const cw = await twoTone();
    const lead = await as('colour-lead');
    const ok = await lead.patch(`/api/styles/${ridgeId}/colourways/${cw.id}`, { version: cw.version, name: unique('Renamed') });
    expect(ok.status).toBe(200);
    const stale = await lead.patch(`/api/styles/${ridgeId}/colourways/${cw.id}`, { version: cw.version, name: 'Stale', targets: [] });
    expect(stale.status).toBe(409);
    const now = (await lead.get(`/api/styles/${ridgeId}/colourways/${cw.id}`)).json.colourway;
    expect(now.name).toBe(ok.json.colourway.name);
    expect(now.targets).toHaveLength(2);
    expect((await (await as('designer')).patch(`/api/styles/${ridgeId}/colourways/${cw.id}`, { version: now.version, name: 'x' })).status).toBe(403);
    expect((await (await as('mill')).patch(`/api/styles/${ridgeId}/colourways/${cw.id}`, { version: now.version, name: 'x' })).status).toBe(403);
  });

  it('removing a target that has lab dips keeps the dips', async () => {
    const cw = await twoTone();
    const dip = await submit(cw.targets[1]!.id, { L: 58.4, a: -24, b: -5 });
    const lead = await as('colour-lead');
    const res = await lead.patch(`/api/styles/${ridgeId}/colourways/${cw.id}`, {
      version: cw.version,
      targets: [{ id: cw.targets[0]!.id, ...labTarget('Ground', [yarns.pa78, yarns.pa44, yarns.cd84], navy) }],
    });
    expect(res.status).toBe(200);
    expect(res.json.colourway.targets).toHaveLength(1);
    const kept = await lead.get(`/api/styles/${ridgeId}/lab-dips/${dip.id}`);
    expect(kept.status).toBe(200);
    expect(kept.json.labDip.targetName).toBe('Accent');
  });

  it('a client reviewer sees approved colours only: no dye plan, no notes, no other targets or dips', async () => {
    const cw = await twoTone();
    const approved = await submit(cw.targets[0]!.id);
    await submit(cw.targets[1]!.id, { L: 57, a: -22, b: -6 });
    const lead = await as('colour-lead');
    expect((await lead.patch(`/api/styles/${ridgeId}/lab-dips/${approved.id}`, { version: approved.version, decision: 'approved' })).status).toBe(200);
    const client = await as('client');
    const seen = (await client.get(`/api/styles/${ridgeId}/colourways`)).json.colourways.find((c: { id: string }) => c.id === cw.id);
    expect(seen.targets.map((t: { name: string }) => t.name)).toEqual(['Ground']);
    expect(seen.plan).toBeNull();
    expect(seen.notes).toBe('');
    const dips = (await client.get(`/api/styles/${ridgeId}/lab-dips`)).json.labDips;
    expect(dips.every((d: { status: string }) => d.status === 'approved')).toBe(true);
    expect(dips.map((d: { id: string }) => d.id)).toContain(approved.id);
    const none = await twoTone();
    expect((await client.get(`/api/styles/${ridgeId}/colourways/${none.id}`)).status).toBe(404);
  });

  it('a colour edited after its dip was approved is withheld from the client and marked for the colour lead', async () => {
    const cw = await twoTone();
    const dip = await submit(cw.targets[0]!.id);
    const lead = await as('colour-lead');
    const client = await as('client');
    expect((await lead.patch(`/api/styles/${ridgeId}/lab-dips/${dip.id}`, { version: dip.version, decision: 'approved' })).status).toBe(200);
    const path = `/api/styles/${ridgeId}/colourways/${cw.id}`;
    expect((await client.get(path)).json.colourway.targets.map((t: { name: string }) => t.name)).toEqual(['Ground']);
    const before = (await lead.get(path)).json.colourway;
    expect(before.targets.map((t: { approval: string }) => t.approval)).toEqual(['approved', 'open']);

    // The ground moves to red: the approved dip was judged against navy.
    const edit = (lab: typeof navy, version: number) =>
      lead.patch(path, {
        version,
        targets: [
          { id: cw.targets[0]!.id, ...labTarget('Ground', [yarns.pa78, yarns.pa44], lab) },
          { id: cw.targets[1]!.id, ...labTarget('Accent', [yarns.cd84], teal) },
        ],
      });
    const moved = await edit(red, before.version);
    expect(moved.status).toBe(200);
    expect(moved.json.colourway.targets.map((t: { approval: string }) => t.approval)).toEqual(['changed-since-approval', 'open']);
    expect((await client.get(path)).status).toBe(404);
    expect((await client.get(`/api/styles/${ridgeId}/colourways`)).json.colourways.map((c: { id: string }) => c.id)).not.toContain(cw.id);
    // Its approved dip was of another colour: withheld too.
    expect((await client.get(`/api/styles/${ridgeId}/lab-dips`)).json.labDips.map((d: { id: string }) => d.id)).not.toContain(dip.id);
    expect((await client.get(`/api/styles/${ridgeId}/lab-dips/${dip.id}`)).status).toBe(404);
    expect((await lead.get(`/api/styles/${ridgeId}/lab-dips/${dip.id}`)).json.labDip.status).toBe('approved');

    // Back to the colour the dip was judged against: approved again.
    const back = await edit(navy, moved.json.colourway.version);
    expect(back.json.colourway.targets[0].approval).toBe('approved');
    expect((await client.get(path)).json.colourway.targets[0].colour).toEqual(navy);
    expect((await client.get(`/api/styles/${ridgeId}/lab-dips/${dip.id}`)).status).toBe(200);
  });

  it('a target on a colour standard is withheld from the client once the standard’s colour is edited', async () => {
    const lead = await as('colour-lead');
    const client = await as('client');
    const standard = (await lead.post('/api/library/colour-standards', { name: unique('Scree'), lab: navy, source: 'measured' })).json.standard;
    const cw = await twoTone([
      { name: 'Ground', yarnIds: [yarns.pa78, yarns.pa44], route: 'garment-dyed', colour: { source: 'standard', standardId: standard.id } },
    ]);
    const dip = await submit(cw.targets[0]!.id);
    expect((await lead.patch(`/api/styles/${ridgeId}/lab-dips/${dip.id}`, { version: dip.version, decision: 'approved' })).status).toBe(200);
    const path = `/api/styles/${ridgeId}/colourways/${cw.id}`;
    expect((await client.get(path)).status).toBe(200);
    expect((await lead.patch(`/api/library/colour-standards/${standard.id}`, { version: standard.version, lab: { ...navy, L: navy.L + 0.5 } })).status).toBe(200);
    expect((await client.get(path)).status).toBe(404);
    expect((await lead.get(path)).json.colourway.targets[0].approval).toBe('changed-since-approval');
    expect((await client.get(`/api/styles/${ridgeId}/lab-dips`)).json.labDips.map((d: { id: string }) => d.id)).not.toContain(dip.id);
  });

  it('DELETE archives the colourway: hidden, its dips no longer listed', async () => {
    const cw = await twoTone();
    await submit(cw.targets[0]!.id);
    const lead = await as('colour-lead');
    expect((await lead.delete(`/api/styles/${ridgeId}/colourways/${cw.id}`)).status).toBe(200);
    expect((await lead.get(`/api/styles/${ridgeId}/colourways/${cw.id}`)).status).toBe(404);
    expect((await lead.get(`/api/styles/${ridgeId}/colourways`)).json.colourways.map((c: { id: string }) => c.id)).not.toContain(cw.id);
    expect((await lead.delete(`/api/styles/${ridgeId}/colourways/${cw.id}`)).status).toBe(404);
  });

  it('a style without textures takes a colourway without targets, and refuses yarns', async () => {
    const designer = await as('designer');
    const s = (await designer.post('/api/styles', newStyleBody())).json.style;
    const lead = await as('colour-lead');
    expect((await lead.post(`/api/styles/${s.id}/colourways`, { name: 'Empty' })).status).toBe(201);
    const res = await lead.post(`/api/styles/${s.id}/colourways`, { name: 'With yarn', targets: [labTarget('A', [yarns.pa78], navy)] });
    expect(res.status).toBe(400);
    expect(res.json.fieldErrors['targets.0.yarnIds']).toBeDefined();
  });
});

describe('lab dips', () => {
  it('the mill sends CSV readings: the mean is the measured colour, with ΔE and words; written to the history', async () => {
    const cw = await twoTone();
    const mill = await as('mill');
    const res = await mill.post(`/api/styles/${ridgeId}/lab-dips`, {
      targetId: cw.targets[0]!.id,
      readingsCsv: 'Reading;L*;a*;b*\n1;24,6;2,0;-21,2\n2;24,8;2,2;-21,0\n',
      comment: 'Two readings',
    });
    expect(res.status).toBe(201);
    const dip = res.json.labDip;
    expect(dip.readings).toHaveLength(2);
    expect(dip.measured.L).toBeCloseTo(24.7, 6);
    expect(dip.measured.a).toBeCloseTo(2.1, 6);
    expect(dip.measured.b).toBeCloseTo(-21.1, 6);
    expect(dip).toMatchObject({ sequence: 1, status: 'submitted', organisationName: 'Quellmoor Knitworks', targetLab: navy });
    expect(dip.reading.deltaECMC21).toBeGreaterThan(0);
    expect(dip.reading.words.lightness).toBe('lighter');
    expect(dip.reading.summary).toMatch(/^(Within|Outside) tolerance: CMC\(2:1\)/);
    expect((await submit(cw.targets[0]!.id)).sequence).toBe(2);
    const history = (await (await as('designer')).get(`/api/styles/${ridgeId}/history`)).json.entries;
    expect(history.some((e: { action: string; details: { labDipId?: string } }) => e.action === 'lab-dip.submit' && e.details.labDipId === dip.id)).toBe(true);
  });

  it('answers 400 with field errors for unreadable readings, a missing colour and a foreign target', async () => {
    const cw = await twoTone();
    const mill = await as('mill');
    const bad = await mill.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: cw.targets[0]!.id, readingsCsv: 'L,a,b\n24.5,1.8,-21.6\n24.5,oops,-21\n' });
    expect(bad.status).toBe(400);
    expect(bad.json.fieldErrors.readingsCsv[0]).toMatch(/^Line 3: /);
    const none = await mill.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: cw.targets[0]!.id });
    expect(none.status).toBe(400);
    expect(none.json.fieldErrors.measured).toBeDefined();
    const range = await mill.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: cw.targets[0]!.id, measured: { L: -1, a: 0, b: 300 } });
    expect(Object.keys(range.json.fieldErrors)).toEqual(expect.arrayContaining(['measured.L', 'measured.b']));
    const shorts = await styleByCode('HF27-105');
    const foreign = await mill.post(`/api/styles/${shorts.id}/lab-dips`, { targetId: cw.targets[0]!.id, measured: navy });
    expect(foreign.status).toBe(400);
    expect(foreign.json.fieldErrors.targetId).toBeDefined();
    expect((await (await as('colour-lead')).get(`/api/styles/${ridgeId}/lab-dips?colourwayId=${cw.id}`)).json.labDips).toHaveLength(0);
  });

  it('the mill attaches a photo uploaded to the style; a photo of another style is refused', async () => {
    const cw = await twoTone();
    const mill = await as('mill');
    const photoId = await uploadPhoto(mill, ridgeId);
    const res = await mill.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: cw.targets[0]!.id, measured: navy, photoFileId: photoId });
    expect(res.status).toBe(201);
    expect(res.json.labDip.photoFileId).toBe(photoId);
    const lead = await as('colour-lead');
    const photo = await fetch(`${baseUrl()}/api/files/${photoId}`, { headers: { cookie: lead.cookie } });
    expect(photo.status).toBe(200);
    expect(photo.headers.get('content-type')).toBe('image/png');
    const shorts = await styleByCode('HF27-105');
    const elsewhere = await uploadPhoto(mill, shorts.id);
    const refused = await mill.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: cw.targets[0]!.id, measured: navy, photoFileId: elsewhere });
    expect(refused.status).toBe(400);
    expect(refused.json.fieldErrors.photoFileId[0]).toMatch(/Not a photo uploaded to this style/);
  });

  it('the mill submits only for styles shared with it and sees only its own dips', async () => {
    const mill = await as('mill');
    const notShared = await styleByCode('HF27-103');
    expect((await mill.get(`/api/styles/${notShared.id}/colourways`)).status).toBe(404);
    expect((await mill.post(`/api/styles/${notShared.id}/lab-dips`, { targetId: '00000000-0000-4000-8000-000000000000', measured: navy })).status).toBe(404);
    const cw = await twoTone();
    const admin = await as('admin');
    const byStudio = (await admin.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: cw.targets[0]!.id, measured: navy })).json.labDip;
    expect(byStudio.organisationName).toBeNull();
    const theirs = (await mill.get(`/api/styles/${ridgeId}/lab-dips`)).json.labDips.map((d: { id: string }) => d.id);
    expect(theirs).not.toContain(byStudio.id);
    expect((await mill.get(`/api/styles/${ridgeId}/lab-dips/${byStudio.id}`)).status).toBe(404);
  });

  it('the colour lead approves or rejects once, with a comment to reject; a second or stale decision gets 409', async () => {
    const cw = await twoTone();
    const lead = await as('colour-lead');
    const a = await submit(cw.targets[0]!.id);
    const noComment = await lead.patch(`/api/styles/${ridgeId}/lab-dips/${a.id}`, { version: a.version, decision: 'rejected' });
    expect(noComment.status).toBe(400);
    expect(noComment.json.fieldErrors.comment[0]).toMatch(/Say what to change/);
    expect((await lead.patch(`/api/styles/${ridgeId}/lab-dips/${a.id}`, { version: a.version, decision: 'maybe' })).json.fieldErrors.decision).toBeDefined();
    const rejected = await lead.patch(`/api/styles/${ridgeId}/lab-dips/${a.id}`, { version: a.version, decision: 'rejected', comment: 'Too red' });
    expect(rejected.status).toBe(200);
    expect(rejected.json.labDip).toMatchObject({ status: 'rejected', decisionComment: 'Too red', decidedByName: 'Iona Vesk', version: a.version + 1 });
    const again = await lead.patch(`/api/styles/${ridgeId}/lab-dips/${a.id}`, { version: a.version + 1, decision: 'approved' });
    expect(again.status).toBe(409);
    expect(again.json.error).toMatch(/already rejected by Iona Vesk/);

    const b = await submit(cw.targets[0]!.id);
    expect((await lead.patch(`/api/styles/${ridgeId}/lab-dips/${b.id}`, { version: b.version + 5, decision: 'approved' })).status).toBe(409);
    expect((await lead.get(`/api/styles/${ridgeId}/lab-dips/${b.id}`)).json.labDip.status).toBe('submitted');
    expect((await (await as('designer')).patch(`/api/styles/${ridgeId}/lab-dips/${b.id}`, { version: b.version, decision: 'approved' })).status).toBe(403);
    expect((await (await as('mill')).patch(`/api/styles/${ridgeId}/lab-dips/${b.id}`, { version: b.version, decision: 'approved' })).status).toBe(403);

    // The submitter sees the decision, and the history has it.
    const mine = (await (await as('mill')).get(`/api/styles/${ridgeId}/lab-dips/${a.id}`)).json.labDip;
    expect(mine).toMatchObject({ status: 'rejected', decisionComment: 'Too red' });
    const history = (await lead.get(`/api/styles/${ridgeId}/history`)).json.entries;
    const decided = history.find((e: { action: string; details: { labDipId?: string } }) => e.action === 'lab-dip.decide' && e.details.labDipId === a.id);
    expect(decided.details).toMatchObject({ decision: 'rejected', comment: 'Too red', target: 'Ground' });
  });
});

describe('colour isolation', () => {
  it('another studio sees nothing: admin@oxbow.example gets 404 for our style and standards, and an empty library', async () => {
    const other = await as('otherStudioAdmin');
    const lead = await as('colour-lead');
    const ours = (await lead.get('/api/library/colour-standards')).json.standards as { id: string; version: number; name: string }[];
    const fellside = ours.find((s) => s.name === 'Fellside Navy')!;
    expect((await other.get('/api/library/colour-standards')).json.standards.map((s: { name: string }) => s.name)).not.toContain('Fellside Navy');
    expect((await other.get(`/api/library/colour-standards/${fellside.id}`)).status).toBe(404);
    expect((await other.patch(`/api/library/colour-standards/${fellside.id}`, { version: fellside.version, name: 'Hijack' })).status).toBe(404);
    expect((await other.delete(`/api/library/colour-standards/${fellside.id}`)).status).toBe(404);
    expect((await other.get(`/api/styles/${ridgeId}/colourways`)).status).toBe(404);
    expect((await other.post(`/api/styles/${ridgeId}/colourways`, { name: 'Hijack' })).status).toBe(404);
    expect((await other.get(`/api/styles/${ridgeId}/lab-dips`)).status).toBe(404);
    const cw = (await lead.get(`/api/styles/${ridgeId}/colourways`)).json.colourways[0];
    expect((await other.get(`/api/styles/${ridgeId}/colourways/${cw.id}`)).status).toBe(404);
    expect((await other.patch(`/api/styles/${ridgeId}/colourways/${cw.id}`, { version: cw.version, name: 'x' })).status).toBe(404);
    expect((await other.post(`/api/styles/${ridgeId}/lab-dips`, { targetId: cw.targets[0].id, measured: navy })).status).toBe(404);
    const dip = (await lead.get(`/api/styles/${ridgeId}/lab-dips`)).json.labDips[0];
    expect((await other.patch(`/api/styles/${ridgeId}/lab-dips/${dip.id}`, { version: dip.version, decision: 'approved' })).status).toBe(404);
    // A standard of another studio cannot be used by ours.
    const theirs = (await other.post('/api/library/colour-standards', { name: unique('Oxbow Red'), lab: red, source: 'digital' })).json.standard;
    const res = await lead.post(`/api/styles/${ridgeId}/colourways`, {
      name: unique('Borrowed'),
      targets: [{ name: 'A', yarnIds: [yarns.pa78], route: 'garment-dyed', colour: { source: 'standard', standardId: theirs.id } }],
    });
    expect(res.status).toBe(400);
    expect(res.json.fieldErrors['targets.0.colour.standardId']).toBeDefined();
  });
});
