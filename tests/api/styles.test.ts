import { describe, expect, it } from 'vitest';
import { as, newStyleBody, styleByCode, uniqueCode } from './helpers';

describe('styles API', () => {
  it('creates a style, lists it, reads it', async () => {
    const designer = await as('designer');
    const body = newStyleBody();
    const res = await designer.post('/api/styles', body);
    expect(res.status).toBe(201);
    expect(res.json.style).toMatchObject({ code: body.code, status: 'draft', revision: 1, version: 1, authorName: 'Tamsin Orlo' });
    const list = await designer.get(`/api/styles?q=${encodeURIComponent(body.code)}`);
    expect(list.json.styles.map((s: { code: string }) => s.code)).toEqual([body.code]);
    const one = await designer.get(`/api/styles/${res.json.style.id}`);
    expect(one.status).toBe(200);
    expect(one.json.style.machine).toEqual(body.machine);
  });

  it('answers 400 with field errors for bad input and saves nothing', async () => {
    const designer = await as('designer');
    const code = uniqueCode();
    const res = await designer.post('/api/styles', {
      ...newStyleBody(code),
      name: '',
      machine: { kind: 'circular', diameterIn: -3, gauge: 28, feeders: 8 },
      sizes: { labels: ['S', 'M'], base: 'XL' },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.fieldErrors)).toEqual(expect.arrayContaining(['name', 'machine.diameterIn', 'sizes.base']));
    const list = await designer.get(`/api/styles?q=${code}`);
    expect(list.json.styles).toHaveLength(0);
  });

  it('refuses a flat style on a circular machine', async () => {
    const designer = await as('designer');
    const res = await designer.post('/api/styles', { ...newStyleBody(), construction: 'flat' });
    expect(res.status).toBe(400);
    expect(res.json.fieldErrors['machine.kind']).toBeDefined();
  });

  it('refuses a duplicate code in the studio with a field error', async () => {
    const designer = await as('designer');
    const res = await designer.post('/api/styles', newStyleBody('HF27-101'));
    expect(res.status).toBe(400);
    expect(res.json.fieldErrors.code[0]).toMatch(/already used/);
  });

  it('PATCH with the current version saves; a stale version gets 409 and changes nothing', async () => {
    const designer = await as('designer');
    const created = (await designer.post('/api/styles', newStyleBody())).json.style;
    const first = await designer.patch(`/api/styles/${created.id}`, { version: created.version, name: 'Renamed once' });
    expect(first.status).toBe(200);
    expect(first.json.style.version).toBe(created.version + 1);
    const stale = await designer.patch(`/api/styles/${created.id}`, { version: created.version, name: 'Stale rename' });
    expect(stale.status).toBe(409);
    const now = (await designer.get(`/api/styles/${created.id}`)).json.style;
    expect(now.name).toBe('Renamed once');
    expect(now.version).toBe(created.version + 1);
  });

  it('PATCH rejects unknown fields and a missing version', async () => {
    const designer = await as('designer');
    const s = await styleByCode('HF27-103');
    expect((await designer.patch(`/api/styles/${s.id}`, { name: 'x y' })).status).toBe(400);
    expect((await designer.patch(`/api/styles/${s.id}`, { version: s.version, studioId: 'x' })).status).toBe(400);
  });

  it('DELETE archives: the style disappears from lists and reads, the row is kept', async () => {
    const designer = await as('designer');
    const created = (await designer.post('/api/styles', newStyleBody())).json.style;
    expect((await designer.delete(`/api/styles/${created.id}`)).status).toBe(200);
    expect((await designer.get(`/api/styles/${created.id}`)).status).toBe(404);
    expect((await designer.delete(`/api/styles/${created.id}`)).status).toBe(404);
  });

  it('answers 404 for an id that is not a uuid, not 500', async () => {
    const designer = await as('designer');
    expect((await designer.get('/api/styles/not-a-uuid')).status).toBe(400);
  });

  it('writes an audit entry for every change, listed in the history', async () => {
    const designer = await as('designer');
    const created = (await designer.post('/api/styles', newStyleBody())).json.style;
    await designer.patch(`/api/styles/${created.id}`, { version: created.version, status: 'developing' });
    const hist = await designer.get(`/api/styles/${created.id}/history`);
    expect(hist.json.entries.map((e: { action: string }) => e.action)).toEqual(['style.update', 'style.create']);
    expect(hist.json.entries[0].details).toEqual({ status: { from: 'draft', to: 'developing' } });
  });

  it('logs only the fields whose value changed, even when the form sends all of them', async () => {
    const designer = await as('designer');
    const body = newStyleBody();
    const created = (await designer.post('/api/styles', body)).json.style;
    // Every field, as the style form sends them; the machine with its keys in another order than stored.
    const machine = Object.fromEntries(Object.entries(body.machine).reverse());
    const all = { code: body.code, name: body.name, season: body.season, clientId: null, garmentType: body.garmentType,
      construction: body.construction, machine, sizes: body.sizes, status: 'draft' };
    const renamed = await designer.patch(`/api/styles/${created.id}`, { ...all, version: created.version, name: 'Renamed top' });
    expect(renamed.status).toBe(200);
    expect(renamed.json.style.version).toBe(created.version + 1);
    const hist = (await designer.get(`/api/styles/${created.id}/history`)).json.entries;
    expect(hist[0].details).toEqual({ name: { from: body.name, to: 'Renamed top' } });

    const resized = await designer.patch(`/api/styles/${created.id}`, {
      ...all, name: 'Renamed top', version: renamed.json.style.version, sizes: { labels: ['S', 'M', 'L', 'XL'], base: 'M' },
    });
    expect(resized.status).toBe(200);
    expect(Object.keys((await designer.get(`/api/styles/${created.id}/history`)).json.entries[0].details)).toEqual(['sizes']);
  });

  it('a save that changes nothing keeps the version and writes no history entry', async () => {
    const designer = await as('designer');
    const body = newStyleBody();
    const created = (await designer.post('/api/styles', body)).json.style;
    const same = await designer.patch(`/api/styles/${created.id}`, {
      version: created.version, code: body.code, name: body.name, season: body.season, clientId: null,
      garmentType: body.garmentType, construction: body.construction, machine: created.machine, sizes: body.sizes, status: 'draft',
    });
    expect(same.status).toBe(200);
    expect(same.json.style.version).toBe(created.version);
    const hist = (await designer.get(`/api/styles/${created.id}/history`)).json.entries;
    expect(hist.map((e: { action: string }) => e.action)).toEqual(['style.create']);
    // A stale version is still refused.
    expect((await designer.patch(`/api/styles/${created.id}`, { version: created.version + 5, name: body.name })).status).toBe(409);
  });
});

describe('isolation', () => {
  it('another studio never sees this studio\'s styles, and this one never sees theirs', async () => {
    const other = await as('otherStudioAdmin');
    const theirs = (await other.get('/api/styles')).json.styles.map((s: { code: string }) => s.code);
    expect(theirs).toEqual(['OX-001']);
    const ours = await styleByCode('HF27-101');
    expect((await other.get(`/api/styles/${ours.id}`)).status).toBe(404);
    expect((await other.patch(`/api/styles/${ours.id}`, { version: ours.version, name: 'hijack' })).status).toBe(404);
    expect((await other.delete(`/api/styles/${ours.id}`)).status).toBe(404);
    const designer = await as('designer');
    expect((await designer.get('/api/styles')).json.styles.map((s: { code: string }) => s.code)).not.toContain('OX-001');
  });

  it('the mill sees only the styles shared with its mill; the client only its own', async () => {
    // Other test files share styles of their own with the demo mill; the demo styles tell the rule.
    const demo = (codes: string[]) => codes.filter((c) => /^HF2/.test(c)).sort();
    const mill = await as('mill');
    const millStyles = (await mill.get('/api/styles')).json.styles;
    expect(demo(millStyles.map((s: { code: string }) => s.code))).toEqual(['HF26-118', 'HF27-101', 'HF27-105']);
    // Every style the mill sees is shared with its own organisation, and it sees no other share.
    for (const s of millStyles) expect(s.shares.map((x: { name: string }) => x.name)).toEqual(['Quellmoor Knitworks']);
    const client = await as('client');
    const clientStyles = (await client.get('/api/styles')).json.styles;
    expect(demo(clientStyles.map((s: { code: string }) => s.code))).toEqual(['HF27-101', 'HF27-102', 'HF27-104']);
    for (const s of clientStyles) expect(s.shares.map((x: { name: string }) => x.name)).toEqual(['Varrow Sport']);
    const notShared = await styleByCode('HF27-103');
    expect((await mill.get(`/api/styles/${notShared.id}`)).status).toBe(404);
    // Shares of other organisations are not disclosed to outside accounts.
    const shared = await styleByCode('HF27-101');
    const seen = (await mill.get(`/api/styles/${shared.id}`)).json.style.shares.map((s: { name: string }) => s.name);
    expect(seen).toEqual(['Quellmoor Knitworks']);
  });

  it('sharing a style with the mill makes it visible to the mill, unsharing hides it again', async () => {
    const designer = await as('designer');
    const mill = await as('mill');
    const orgs = (await designer.get('/api/organisations')).json.organisations;
    const quellmoor = orgs.find((o: { name: string }) => o.name === 'Quellmoor Knitworks');
    const created = (await designer.post('/api/styles', newStyleBody())).json.style;
    expect((await mill.get(`/api/styles/${created.id}`)).status).toBe(404);
    expect((await designer.post(`/api/styles/${created.id}/shares`, { organisationId: quellmoor.id })).status).toBe(201);
    expect((await mill.get(`/api/styles/${created.id}`)).status).toBe(200);
    expect((await designer.delete(`/api/styles/${created.id}/shares/${quellmoor.id}`)).status).toBe(200);
    expect((await mill.get(`/api/styles/${created.id}`)).status).toBe(404);
  });

  it('changing the client ends the former client\'s access and keeps the mill\'s', async () => {
    const designer = await as('designer');
    const client = await as('client');
    const mill = await as('mill');
    const orgs = (await designer.get('/api/organisations')).json.organisations as { id: string; name: string }[];
    const byName = (name: string) => orgs.find((o) => o.name === name)!.id;
    const created = (await designer.post('/api/styles', { ...newStyleBody(), clientId: byName('Varrow Sport') })).json.style;
    expect((await designer.post(`/api/styles/${created.id}/shares`, { organisationId: byName('Quellmoor Knitworks') })).status).toBe(201);
    expect((await client.get(`/api/styles/${created.id}`)).status).toBe(200);

    const moved = await designer.patch(`/api/styles/${created.id}`, { version: created.version, clientId: byName('Kestenholm Outdoor') });
    expect(moved.status).toBe(200);
    expect(moved.json.style.shares.map((s: { name: string }) => s.name).sort()).toEqual(['Kestenholm Outdoor', 'Quellmoor Knitworks']);
    expect((await client.get(`/api/styles/${created.id}`)).status).toBe(404);
    expect((await client.get('/api/styles')).json.styles.map((s: { id: string }) => s.id)).not.toContain(created.id);
    expect((await mill.get(`/api/styles/${created.id}`)).status).toBe(200);
    const hist = (await designer.get(`/api/styles/${created.id}/history`)).json.entries;
    const unshare = hist.find((e: { action: string }) => e.action === 'style.unshare');
    expect(unshare?.details).toMatchObject({ organisation: 'Varrow Sport', reason: 'client changed' });
    expect(hist.find((e: { action: string }) => e.action === 'style.update')?.details).toEqual({
      client: { from: 'Varrow Sport', to: 'Kestenholm Outdoor' },
    });
  });
});
