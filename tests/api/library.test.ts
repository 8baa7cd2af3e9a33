import { describe, expect, it } from 'vitest';
import { as, newStyleBody, styleByCode } from './helpers';

let seq = 0;
const unique = (what: string) => `${what} ${Date.now().toString(36)}-${(seq++).toString(36)}`;

const yarnBody = (over: Record<string, unknown> = {}) => ({
  name: unique('Test polyamide'),
  supplierRef: 'TST-1',
  count: { value: 70, unit: 'den' },
  makeUp: { kind: 'single', fibre: 'polyamide' },
  colour: { state: 'dyeable' },
  ...over,
});

async function libraryYarn(name: string) {
  const designer = await as('designer');
  const y = (await designer.get('/api/library/yarns')).json.yarns.find((x: { name: string }) => x.name === name);
  if (!y) throw new Error(`no yarn ${name}`);
  return y as { id: string; version: number; dtex: number };
}

async function textureBody(over: Record<string, unknown> = {}) {
  const pa = await libraryYarn('Polyamide 6.6 78/68 semi-dull');
  const el = await libraryYarn('Bare elastane 22 dtex');
  return {
    name: unique('Test mock rib'),
    family: 'mock-rib',
    function: 'compression',
    repeat: { needles: 2, courses: 2, cells: ['kt', 'kk'] },
    feeders: [{ ground: pa.id, plated: { yarn: el.id, draft: 2.6 } }, { ground: pa.id, plated: { yarn: el.id, draft: 2.6 } }],
    density: { walesPerCm: 22, coursesPerCm: 30 },
    loopMm: { knit: 2.3, tuck: 1.7 },
    forceExtension: [{ extension: 0.2, tensionNPerCm: 0.8 }, { extension: 0.4, tensionNPerCm: 1.9 }],
    ...over,
  };
}

describe('library: yarns', () => {
  it('accepts a count in any unit and stores dtex; covered yarns get their shares from core and cover', async () => {
    const designer = await as('designer');
    const den = await designer.post('/api/library/yarns', yarnBody());
    expect(den.status).toBe(201);
    // 70 den = 70 / 9 tex = 77.78 dtex (tex = den / 9; dtex = 10 × tex).
    expect(den.json.yarn.dtex).toBeCloseTo(77.778, 2);
    expect(den.json.yarn).toMatchObject({ countUnit: 'den', fibres: [{ fibre: 'polyamide', share: 1 }], version: 1 });

    const ne = await designer.post('/api/library/yarns', yarnBody({ count: 'Ne 40/1', makeUp: { kind: 'single', fibre: 'modal' }, staple: true }));
    expect(ne.status).toBe(201);
    // Ne 40 = 590.54 / 40 tex = 14.76 tex = 147.6 dtex.
    expect(ne.json.yarn.dtex).toBeCloseTo(147.64, 1);

    const covered = await designer.post('/api/library/yarns', yarnBody({
      count: undefined,
      makeUp: {
        kind: 'covered',
        core: { fibre: 'elastane', count: { value: 20, unit: 'den' }, draft: 3 },
        cover: { fibre: 'polyamide', count: { value: 40, unit: 'den' }, takeUpPct: 10 },
      },
    }));
    expect(covered.status).toBe(201);
    // Core 22.22 dtex / 3 = 7.41; cover 44.44 × 1.1 = 48.89; total 56.30 dtex (product design §2).
    const y = covered.json.yarn;
    expect(y.dtex).toBeCloseTo(56.296, 2);
    const el = y.fibres.find((f: { fibre: string }) => f.fibre === 'elastane');
    expect(el.share).toBeCloseTo(7.4074 / 56.2963, 4);

    const one = await designer.get(`/api/library/yarns/${den.json.yarn.id}`);
    expect(one.status).toBe(200);
    expect(one.json.yarn.name).toBe(den.json.yarn.name);
  });

  it('answers 400 with field errors for bad input and saves nothing', async () => {
    const designer = await as('designer');
    const name = unique('Bad yarn');
    const res = await designer.post('/api/library/yarns', yarnBody({ name: 'x', count: '78 furlongs', pricePerKg: -2 }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.fieldErrors)).toEqual(expect.arrayContaining(['name', 'count', 'pricePerKg']));

    const blend = await designer.post('/api/library/yarns', yarnBody({
      name, makeUp: { kind: 'blend', fibres: [{ fibre: 'polyamide', sharePct: 80 }, { fibre: 'elastane', sharePct: 15 }] },
    }));
    expect(blend.status).toBe(400);
    expect(blend.json.fieldErrors['makeUp.fibres'][0]).toMatch(/95 %/);

    const pp = await designer.post('/api/library/yarns', yarnBody({ name, makeUp: { kind: 'single', fibre: 'polypropylene' } }));
    expect(pp.status).toBe(400);
    expect(pp.json.fieldErrors['colour.state'][0]).toMatch(/dope-dyed/);

    expect((await designer.post('/api/library/yarns', 'not json')).status).toBe(400);
    const list = (await designer.get('/api/library/yarns')).json.yarns;
    expect(list.filter((y: { name: string }) => y.name === name)).toHaveLength(0);
  });

  it('refuses a second active yarn of the same name with a field error', async () => {
    const designer = await as('designer');
    const res = await designer.post('/api/library/yarns', yarnBody({ name: 'Bare elastane 22 dtex' }));
    expect(res.status).toBe(400);
    expect(res.json.fieldErrors.name[0]).toMatch(/already/);
  });

  it('PATCH with the current version saves; a stale version gets 409 and changes nothing', async () => {
    const designer = await as('designer');
    const y = (await designer.post('/api/library/yarns', yarnBody())).json.yarn;
    const first = await designer.patch(`/api/library/yarns/${y.id}`, { version: y.version, count: '44 dtex', supplierRef: 'TST-2' });
    expect(first.status).toBe(200);
    expect(first.json.yarn).toMatchObject({ dtex: 44, countUnit: 'dtex', supplierRef: 'TST-2', version: y.version + 1 });
    const stale = await designer.patch(`/api/library/yarns/${y.id}`, { version: y.version, supplierRef: 'STALE' });
    expect(stale.status).toBe(409);
    const now = (await designer.get(`/api/library/yarns/${y.id}`)).json.yarn;
    expect(now.supplierRef).toBe('TST-2');
    expect((await designer.patch(`/api/library/yarns/${y.id}`, { supplierRef: 'no version' })).status).toBe(400);
    expect((await designer.patch(`/api/library/yarns/${y.id}`, { version: now.version, studioId: 'x' })).status).toBe(400);
    const badPatch = await designer.patch(`/api/library/yarns/${y.id}`, { version: now.version, count: { value: -1, unit: 'dtex' } });
    expect(badPatch.status).toBe(400);
    expect(badPatch.json.fieldErrors['count.value']).toBeDefined();
  });

  it('the colour lead reads the library but may not change it; client and mill may not read it', async () => {
    const colour = await as('colour-lead');
    expect((await colour.get('/api/library/yarns')).status).toBe(200);
    expect((await colour.post('/api/library/yarns', yarnBody())).status).toBe(403);
    for (const who of ['client', 'mill'] as const) {
      const c = await as(who);
      expect((await c.get('/api/library/yarns')).status).toBe(403);
      expect((await c.get('/api/library/textures')).status).toBe(403);
    }
  });

  it('archiving a yarn that feeds a texture is refused; an unused one disappears from the library', async () => {
    const designer = await as('designer');
    const pa = await libraryYarn('Polyamide 6.6 78/68 semi-dull');
    const refused = await designer.delete(`/api/library/yarns/${pa.id}?version=${pa.version}`);
    expect(refused.status).toBe(409);
    expect(refused.json.textures).toContain('Plain plated jersey');
    const y = (await designer.post('/api/library/yarns', yarnBody())).json.yarn;
    expect((await designer.delete(`/api/library/yarns/${y.id}?version=${y.version}`)).status).toBe(200);
    const list = (await designer.get('/api/library/yarns')).json.yarns;
    expect(list.map((x: { id: string }) => x.id)).not.toContain(y.id);
    expect((await designer.delete(`/api/library/yarns/${y.id}?version=${y.version + 1}`)).status).toBe(404);
  });

  it('archiving a yarn takes the version you saw: a stale one gets 409, a missing or bad one 400, and the yarn stays', async () => {
    const designer = await as('designer');
    const y = (await designer.post('/api/library/yarns', yarnBody())).json.yarn;
    const edited = (await designer.patch(`/api/library/yarns/${y.id}`, { version: y.version, supplierRef: 'EDITED' })).json.yarn;
    const stale = await designer.delete(`/api/library/yarns/${y.id}?version=${y.version}`);
    expect(stale.status).toBe(409);
    expect(stale.json.currentVersion).toBe(edited.version);
    for (const q of ['', '?version=', '?version=abc', '?version=0', '?version=1.5']) {
      const res = await designer.delete(`/api/library/yarns/${y.id}${q}`);
      expect(res.status, q).toBe(400);
      expect(res.json.fieldErrors.version, q).toBeDefined();
    }
    const still = await designer.get(`/api/library/yarns/${y.id}`);
    expect(still.json.yarn).toMatchObject({ supplierRef: 'EDITED', version: edited.version });
    expect((await designer.get('/api/library/yarns')).json.yarns.map((x: { id: string }) => x.id)).toContain(y.id);
    expect((await designer.delete(`/api/library/yarns/${y.id}?version=${edited.version}`)).status).toBe(200);
  });
});

describe('library: textures', () => {
  it('the demo library holds at least eight textures across all seven families, compression ones with a curve', async () => {
    const designer = await as('designer');
    const textures = (await designer.get('/api/library/textures')).json.textures as {
      family: string; function: string | null; forceExtension?: unknown[];
    }[];
    expect(textures.length).toBeGreaterThanOrEqual(8);
    // The seven families of the library issue, each at least once.
    expect([...new Set(textures.map((t) => t.family))]).toEqual(expect.arrayContaining(['jersey', 'mock-rib', 'rib-like', 'mesh', 'pique', 'float-jacquard', 'terry']));
    for (const t of textures.filter((x) => x.function === 'compression')) expect(t.forceExtension?.length).toBeGreaterThan(2);
  });

  it('creates a texture, reads its chart back, saves a painted cell, and 409s a stale version', async () => {
    const designer = await as('designer');
    const res = await designer.post('/api/library/textures', await textureBody());
    expect(res.status).toBe(201);
    const t = res.json.texture;
    expect(t.repeat.cells).toEqual([['knit', 'tuck'], ['knit', 'knit']]);
    expect(t.gauge).toBe(28);

    const painted = await designer.patch(`/api/library/textures/${t.id}`, {
      version: t.version,
      repeat: { needles: 2, courses: 2, cells: [['knit', 'tuck'], ['miss', 'knit']] },
    });
    expect(painted.status).toBe(200);
    expect(painted.json.texture.repeat.cells[1]).toEqual(['miss', 'knit']);
    expect(painted.json.texture.version).toBe(t.version + 1);

    const stale = await designer.patch(`/api/library/textures/${t.id}`, { version: t.version, notes: 'stale' });
    expect(stale.status).toBe(409);
    const now = (await designer.get(`/api/library/textures/${t.id}`)).json.texture;
    expect(now.repeat.cells[1]).toEqual(['miss', 'knit']);
    expect(now.notes).toBeUndefined();
  });

  it('answers 400 with field errors: chart not matching the repeat, feeders, unknown yarns', async () => {
    const designer = await as('designer');
    const shape = await designer.post('/api/library/textures', await textureBody({ repeat: { needles: 3, courses: 2, cells: ['kt', 'kx'] } }));
    expect(shape.status).toBe(400);
    expect(Object.keys(shape.json.fieldErrors)).toEqual(expect.arrayContaining(['repeat.cells.1']));

    const rows = await designer.post('/api/library/textures', await textureBody({ repeat: { needles: 3, courses: 2, cells: ['ktk', 'kk'] } }));
    expect(rows.status).toBe(400);
    expect(rows.json.fieldErrors['repeat.cells.1'][0]).toMatch(/2 needles/);

    const body = await textureBody();
    const feeders = await designer.post('/api/library/textures', { ...body, feeders: body.feeders.slice(0, 1) });
    expect(feeders.status).toBe(400);
    expect(feeders.json.fieldErrors.feeders[0]).toMatch(/2 courses/);

    const ghost = '00000000-0000-4000-8000-000000000000';
    const unknown = await designer.post('/api/library/textures', { ...body, feeders: [{ ground: ghost }, body.feeders[1]] });
    expect(unknown.status).toBe(400);
    expect(unknown.json.fieldErrors['feeders.0.ground'][0]).toMatch(/studio library/);

    const draft = await designer.post('/api/library/textures', { ...body, feeders: [{ ground: body.feeders[0]!.ground, plated: { yarn: ghost, draft: 0.5 } }, body.feeders[1]] });
    expect(draft.status).toBe(400);
    expect(draft.json.fieldErrors['feeders.0.plated.draft']).toBeDefined();

    const curve = await designer.post('/api/library/textures', await textureBody({
      forceExtension: [{ extension: 0.4, tensionNPerCm: 1 }, { extension: 0.2, tensionNPerCm: 2 }],
    }));
    expect(curve.status).toBe(400);
    expect(curve.json.fieldErrors['forceExtension.1.extension']).toBeDefined();
  });

  it('archiving a texture a style uses is refused; an unused one is archived', async () => {
    const designer = await as('designer');
    const textures = (await designer.get('/api/library/textures')).json.textures as { id: string; name: string }[];
    const used = textures.find((t) => t.name === 'Plain plated jersey')! as { id: string; name: string; version: number };
    const refused = await designer.delete(`/api/library/textures/${used.id}?version=${used.version}`);
    expect(refused.status).toBe(409);
    expect(refused.json.styles).toContain('HF27-101');
    const t = (await designer.post('/api/library/textures', await textureBody())).json.texture;
    expect((await designer.delete(`/api/library/textures/${t.id}?version=${t.version}`)).status).toBe(200);
    expect((await designer.get('/api/library/textures')).json.textures.map((x: { id: string }) => x.id)).not.toContain(t.id);
  });

  it('archiving a texture from a stale tab gets 409 and keeps the newer save; no version is a 400', async () => {
    const designer = await as('designer');
    const t = (await designer.post('/api/library/textures', await textureBody())).json.texture;
    // Another tab saves a painted cell after this one opened the texture.
    const saved = await designer.patch(`/api/library/textures/${t.id}`, { version: t.version, repeat: { needles: 2, courses: 2, cells: ['km', 'kk'] } });
    expect(saved.status).toBe(200);
    const stale = await designer.delete(`/api/library/textures/${t.id}?version=${t.version}`);
    expect(stale.status).toBe(409);
    expect(stale.json.currentVersion).toBe(saved.json.texture.version);
    const missing = await designer.delete(`/api/library/textures/${t.id}`);
    expect(missing.status).toBe(400);
    expect(missing.json.fieldErrors.version).toBeDefined();
    expect((await designer.delete(`/api/library/textures/${t.id}?version=x`)).status).toBe(400);
    const now = (await designer.get(`/api/library/textures/${t.id}`)).json.texture;
    expect(now.archivedAt ?? null).toBeNull();
    expect(now.repeat.cells[0]).toEqual(['knit', 'miss']);
    expect((await designer.delete(`/api/library/textures/${t.id}?version=${now.version}`)).status).toBe(200);
  });
});

describe('library: studio isolation', () => {
  it('the second studio sees none of the first studio library and cannot use it', async () => {
    const other = await as('otherStudioAdmin');
    expect((await other.get('/api/library/yarns')).json.yarns).toEqual([]);
    expect((await other.get('/api/library/textures')).json.textures).toEqual([]);
    const pa = await libraryYarn('Polyamide 6.6 78/68 semi-dull');
    expect((await other.get(`/api/library/yarns/${pa.id}`)).status).toBe(404);
    expect((await other.patch(`/api/library/yarns/${pa.id}`, { version: pa.version, name: 'Taken over' })).status).toBe(404);
    expect((await other.delete(`/api/library/yarns/${pa.id}?version=${pa.version}`)).status).toBe(404);
    const designer = await as('designer');
    const texture = (await designer.get('/api/library/textures')).json.textures[0];
    expect((await other.get(`/api/library/textures/${texture.id}`)).status).toBe(404);
    // Feeding another studio's yarn is refused like an unknown yarn.
    const stolen = await other.post('/api/library/textures', await textureBody());
    expect(stolen.status).toBe(400);
    expect(stolen.json.fieldErrors['feeders.0.ground']).toBeDefined();
    const ridge = await styleByCode('HF27-101');
    expect((await other.get(`/api/styles/${ridge.id}/textures`)).status).toBe(404);
    expect((await other.get(`/api/styles/${ridge.id}/trims`)).status).toBe(404);
    // Nothing the designer sees changed.
    expect((await designer.get(`/api/library/yarns/${pa.id}`)).json.yarn.name).toBe('Polyamide 6.6 78/68 semi-dull');
  });
});

describe('a style textures and trims', () => {
  it('the mill reads the textures of a style released to it, with their yarns, from the release; not the working copy, not of other styles', async () => {
    const mill = await as('mill');
    const ridge = await styleByCode('HF27-101');
    const releases = (await mill.get(`/api/styles/${ridge.id}/releases`)).json.releases as { id: string; revision: number }[];
    const seeded = releases.reduce((a, b) => (a.revision <= b.revision ? a : b));
    const res = await mill.get(`/api/releases/${seeded.id}`);
    expect(res.status).toBe(200);
    const snapshot = res.json.release.snapshot;
    expect(snapshot.textures.map((t: { name: string }) => t.name)).toEqual([
      'Plain plated jersey', '2×1 mock rib compression', 'Eyelet ventilation mesh', 'Float jacquard colour block',
    ]);
    const yarnIds = new Set(snapshot.yarns.map((y: { id: string }) => y.id));
    for (const t of snapshot.textures) for (const f of t.feeders) expect(yarnIds.has(f.ground)).toBe(true);
    // The working copy's list is the studio's (and the client's) to read, not the mill's.
    expect((await mill.get(`/api/styles/${ridge.id}/textures`)).status).toBe(403);
    const updraft = await styleByCode('HF27-102');
    expect((await mill.get(`/api/styles/${updraft.id}/releases`)).status).toBe(404);
  });

  it('PUT replaces the list with the style version; stale gets 409; textures must be the studio library', async () => {
    const designer = await as('designer');
    const style = (await designer.post('/api/styles', newStyleBody())).json.style;
    const textures = (await designer.get('/api/library/textures')).json.textures as { id: string }[];
    const ids = textures.slice(0, 2).map((t) => t.id);
    const put = await designer.put(`/api/styles/${style.id}/textures`, { version: style.version, textureIds: ids });
    expect(put.status).toBe(200);
    expect(put.json.version).toBe(style.version + 1);
    expect(put.json.textures.map((t: { id: string }) => t.id)).toEqual(ids);
    const stale = await designer.put(`/api/styles/${style.id}/textures`, { version: style.version, textureIds: [] });
    expect(stale.status).toBe(409);
    expect((await designer.get(`/api/styles/${style.id}/textures`)).json.textures).toHaveLength(2);
    const ghost = await designer.put(`/api/styles/${style.id}/textures`, { version: put.json.version, textureIds: ['00000000-0000-4000-8000-000000000000'] });
    expect(ghost.status).toBe(400);
    expect(ghost.json.fieldErrors['textureIds.0']).toBeDefined();
    const twice = await designer.put(`/api/styles/${style.id}/textures`, { version: put.json.version, textureIds: [ids[0], ids[0]] });
    expect(twice.status).toBe(400);
    const history = (await designer.get(`/api/styles/${style.id}/history`)).json;
    expect(JSON.stringify(history)).toContain('style.textures');
  });

  it('trims: create, validate, patch with version, 409 when stale, delete', async () => {
    const designer = await as('designer');
    const style = (await designer.post('/api/styles', newStyleBody())).json.style;
    const bad = await designer.post(`/api/styles/${style.id}/trims`, {
      panelKind: 'collar', kind: 'heat-transfer', method: 'heat-press', tempC: 900, box: { x: 0, y: 0, width: 0, height: 10 },
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.fieldErrors)).toEqual(expect.arrayContaining(['panelKind', 'tempC', 'box.width']));
    const res = await designer.post(`/api/styles/${style.id}/trims`, {
      panelKind: 'front', name: 'Chest logo', kind: 'heat-transfer', method: 'heat-press', tempC: 150, box: { x: 300, y: 200, width: 80, height: 50 },
    });
    expect(res.status).toBe(201);
    const trim = res.json.trim;
    expect(trim).toMatchObject({ panelKind: 'front', tempC: 150, box: { x: 300, y: 200, width: 80, height: 50 }, version: 1 });
    const moved = await designer.patch(`/api/styles/${style.id}/trims/${trim.id}`, { version: 1, box: { x: 310, y: 200, width: 80, height: 50 } });
    expect(moved.status).toBe(200);
    expect(moved.json.trim.version).toBe(2);
    expect((await designer.patch(`/api/styles/${style.id}/trims/${trim.id}`, { version: 1, tempC: 160 })).status).toBe(409);
    expect((await designer.delete(`/api/styles/${style.id}/trims/${trim.id}?version=1`)).status).toBe(409);
    const list = (await designer.get(`/api/styles/${style.id}/trims`)).json.trims;
    expect(list).toHaveLength(1);
    expect(list[0].tempC).toBe(150);
    expect((await designer.delete(`/api/styles/${style.id}/trims/${trim.id}?version=2`)).status).toBe(200);
    expect((await designer.get(`/api/styles/${style.id}/trims`)).json.trims).toHaveLength(0);
  });

  it('the client reads the trims of a style shared with it; the colour lead may not place one', async () => {
    const client = await as('client');
    const ridge = await styleByCode('HF27-101');
    const trims = (await client.get(`/api/styles/${ridge.id}/trims`)).json.trims;
    expect(trims.map((t: { name: string }) => t.name).sort()).toEqual(['Care label', 'Chest logo']);
    const colour = await as('colour-lead');
    expect((await colour.post(`/api/styles/${ridge.id}/trims`, { panelKind: 'front', kind: 'printed-tag', method: 'printed', box: { x: 1, y: 1, width: 1, height: 1 } })).status).toBe(403);
  });
});
