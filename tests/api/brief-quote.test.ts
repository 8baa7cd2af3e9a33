/**
 * The brief (questionnaire, reference board, Brief vs plan) and the quote: saving with versions,
 * clear 400s, 409 on stale, history entries, uploads checked by content, and roles — the mill and
 * the client never see a cost, a price or a margin anywhere they can reach.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import knexFactory, { type Knex } from 'knex';
import { as, baseUrl, newStyleBody, styleByCode, type Client } from './helpers';
import { readPdf } from '../support/pdf-reader';

const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAIAAAACCAIAAAD91JpzAAAAFklEQVR4nGP8z8DAwMDAxMDAwMDAAAANHQEDasKb6QAAAABJRU5ErkJggg==',
  'base64',
);

async function upload(c: Client, styleId: string, bytes: Uint8Array, fields: Record<string, string>, name = 'ref.png') {
  const form = new FormData();
  form.set('file', new Blob([new Uint8Array(bytes)], { type: 'image/png' }), name);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  const res = await fetch(baseUrl() + `/api/styles/${styleId}/brief/references`, { method: 'POST', body: form, headers: { cookie: c.cookie } });
  const text = await res.text();
  return { status: res.status, json: text ? JSON.parse(text) : null };
}

describe('brief and quote routes', () => {
  afterAll(async () => { await knex?.destroy(); });
  let designer: Client;
  let client: Client;
  let mill: Client;
  let styleId: string;
  let knex: Knex;

  beforeAll(async () => {
    knex = knexFactory({ client: 'pg', connection: inject('databaseUrl'), pool: { min: 0, max: 2 } });
    designer = await as('designer');
    client = await as('client');
    mill = await as('mill');
    styleId = (await styleByCode('HF27-101')).id;
  });

  it('saves the brief with versions: 409 on a stale version, a history entry naming fields only', async () => {
    const before = (await designer.get(`/api/styles/${styleId}/brief`)).json.brief;
    const answers = {
      ...before.answers, sport: 'Trail running', compression: 'moderate', tones: 2, targetPrice: 47.35,
      orderBySize: { S: 120, M: 240, L: 180 }, markets: ['eu', 'us'], fibresToAvoid: ['wool'], recycledPct: 30,
    };
    const saved = await designer.put(`/api/styles/${styleId}/brief`, { version: before.version, answers });
    expect(saved.status).toBe(200);
    expect(saved.json.brief.version).toBe(before.version + 1);
    expect(saved.json.brief.answers.targetPrice).toBe(47.35);
    const stale = await designer.put(`/api/styles/${styleId}/brief`, { version: before.version, answers: { ...answers, sport: 'Cycling' } });
    expect(stale.status).toBe(409);
    expect((await designer.get(`/api/styles/${styleId}/brief`)).json.brief.answers.sport).toBe('Trail running');
    const history = await designer.get(`/api/styles/${styleId}/history`);
    const entry = JSON.stringify(history.json).match(/brief\.save[^}]*}/)?.[0] ?? '';
    expect(entry).toContain('targetPrice');
    expect(JSON.stringify(history.json)).not.toContain('47.35');
  });

  it('keeps every saved version of the brief for staff, with what changed; never for the client or the mill', async () => {
    const before = (await designer.get(`/api/styles/${styleId}/brief`)).json.brief;
    const saved = await designer.put(`/api/styles/${styleId}/brief`, { version: before.version, answers: { ...before.answers, sport: 'Fell running', tones: 3 } });
    expect(saved.status).toBe(200);
    const res = await designer.get(`/api/styles/${styleId}/brief/versions`);
    expect(res.status).toBe(200);
    const versions = res.json.versions as { version: number; savedBy: string | null; answers: { sport: string; targetPrice: number | null }; changes: { field: string; before: unknown; after: unknown }[] }[];
    expect(versions.map((v) => v.version)).toEqual([...versions.map((v) => v.version)].sort((a, b) => b - a));
    const [latest, previous] = versions;
    expect(latest!.version).toBe(before.version + 1);
    expect(latest!.answers.sport).toBe('Fell running');
    expect(latest!.savedBy).toBeTruthy();
    expect(latest!.changes.map((c) => c.field).sort()).toEqual(['sport', 'tones']);
    expect(latest!.changes.find((c) => c.field === 'sport')).toEqual({ field: 'sport', before: 'Trail running', after: 'Fell running' });
    // The version before holds the full answers as they were, price included.
    expect(previous!.version).toBe(before.version);
    expect(previous!.answers.sport).toBe('Trail running');
    expect(previous!.answers.targetPrice).toBe(47.35);
    expect((await designer.get(`/api/styles/${styleId}/history`)).text).toContain('brief.save');
    const colourLead = await as('colour-lead');
    expect((await colourLead.get(`/api/styles/${styleId}/brief/versions`)).status).toBe(200);
    expect((await client.get(`/api/styles/${styleId}/brief/versions`)).status).toBe(403);
    expect((await mill.get(`/api/styles/${styleId}/brief/versions`)).status).toBe(403);
    expect((await designer.get('/api/styles/not-a-uuid/brief/versions')).status).toBe(400);
    // Put the sport back for the tests below.
    await designer.put(`/api/styles/${styleId}/brief`, { version: latest!.version, answers: { ...latest!.answers, sport: 'Trail running', tones: 2 } });
  });

  it('answers bad input with 400 and field errors, never 500', async () => {
    const v = (await designer.get(`/api/styles/${styleId}/brief`)).json.brief.version;
    const bad = await designer.put(`/api/styles/${styleId}/brief`, { version: v, answers: { tones: 'many', markets: ['mars'], recycledPct: 140 } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.fieldErrors)).toEqual(expect.arrayContaining(['answers.tones', 'answers.markets.0', 'answers.recycledPct']));
    const size = await designer.put(`/api/styles/${styleId}/brief`, { version: v, answers: { orderBySize: { XXXL: 5 } } });
    expect(size.status).toBe(400);
    expect(size.json.fieldErrors['answers.orderBySize.XXXL']).toBeDefined();
    expect((await designer.put(`/api/styles/${styleId}/brief`, 'not json')).status).toBe(400);
    expect((await designer.get('/api/styles/not-a-uuid/brief')).status).toBe(400);
    expect((await designer.put(`/api/styles/${styleId}/quote`, { version: 0, inputs: { efficiency: 3 } })).status).toBe(400);
    expect((await designer.get(`/api/styles/${styleId}/quote/export?format=docx`)).status).toBe(400);
    expect((await designer.put('/api/settings/costing', { rates: { currency: 'euro' } })).status).toBe(400);
  });

  it('the client reads the brief without its price; the mill may not read it', async () => {
    const res = await client.get(`/api/styles/${styleId}/brief`);
    expect(res.status).toBe(200);
    expect(res.json.brief.answers.targetPrice).toBeNull();
    expect(res.json.brief.pricesHidden).toBe(true);
    expect(res.json.brief.answers.sport).toBe('Trail running');
    expect((await mill.get(`/api/styles/${styleId}/brief`)).status).toBe(403);
    expect((await client.put(`/api/styles/${styleId}/brief`, { version: 1, answers: {} })).status).toBe(403);
  });

  it('keeps a reference board: uploads checked by content, caption and tag, reorder, read-only for the client', async () => {
    const a = await upload(designer, styleId, tinyPng, { caption: 'Slate and ember', tag: 'colour' });
    expect(a.status).toBe(201);
    const b = await upload(designer, styleId, tinyPng, { caption: 'Rib detail', tag: 'detail' });
    expect(b.status).toBe(201);
    const notImage = await upload(designer, styleId, new TextEncoder().encode('just text, not a picture'), { tag: 'colour' }, 'fake.png');
    expect(notImage.status).toBeGreaterThanOrEqual(400);
    expect(notImage.status).toBeLessThan(500);
    expect(notImage.json.fieldErrors.file).toBeDefined();
    const badTag = await upload(designer, styleId, tinyPng, { tag: 'mood' });
    expect(badTag.status).toBe(400);
    const list = (await designer.get(`/api/styles/${styleId}/brief/references`)).json.references as { id: string }[];
    const ids = list.map((r) => r.id);
    const reversed = await designer.put(`/api/styles/${styleId}/brief/references/order`, { ids: [...ids].reverse() });
    expect(reversed.status).toBe(200);
    expect(reversed.json.references.map((r: { id: string }) => r.id)).toEqual([...ids].reverse());
    expect((await designer.put(`/api/styles/${styleId}/brief/references/order`, { ids: ids.slice(1) })).status).toBe(409);
    const patched = await designer.patch(`/api/styles/${styleId}/brief/references/${a.json.reference.id}`, { tag: 'texture', caption: 'Texture' });
    expect(patched.json.reference.tag).toBe('texture');
    expect((await designer.patch(`/api/styles/${styleId}/brief/references/${a.json.reference.id}`, { tag: 'mood' })).status).toBe(400);
    // The client sees the board and its images, and may not change it.
    const seen = await client.get(`/api/styles/${styleId}/brief/references`);
    expect(seen.json.references.length).toBe(list.length);
    const img = await fetch(baseUrl() + seen.json.references[0].url, { headers: { cookie: client.cookie } });
    expect(img.status).toBe(200);
    expect(img.headers.get('content-type')).toBe('image/png');
    expect((await upload(client, styleId, tinyPng, { tag: 'colour' })).status).toBe(403);
    expect((await client.delete(`/api/styles/${styleId}/brief/references/${a.json.reference.id}`)).status).toBe(403);
    expect((await mill.get(`/api/styles/${styleId}/brief/references`)).status).toBe(403);
    expect((await designer.delete(`/api/styles/${styleId}/brief/references/${b.json.reference.id}`)).status).toBe(200);
  });

  it('lists Brief vs plan findings: fibres to avoid, tones, label regions', async () => {
    const v = (await designer.get(`/api/styles/${styleId}/brief`)).json.brief;
    await designer.put(`/api/styles/${styleId}/brief`, { version: v.version, answers: { ...v.answers, fibresToAvoid: ['elastane'] } });
    const res = await designer.get(`/api/styles/${styleId}/brief/checks`);
    expect(res.status).toBe(200);
    const checks = res.json.checks as { id: string; status: string; message: string }[];
    expect(checks.find((c) => c.id === 'fibres-to-avoid')?.status).toBe('error');
    expect(checks.find((c) => c.id === 'label-regions')?.message).toMatch(/EU fibre names/);
    expect(checks.map((c) => c.id)).toEqual(expect.arrayContaining(['recycled', 'compression', 'tones']));
    expect((await client.get(`/api/styles/${styleId}/brief/checks`)).status).toBe(200);
    expect((await mill.get(`/api/styles/${styleId}/brief/checks`)).status).toBe(403);
  });

  it('counts tones for the client from the colours the colour section shows them (approved lab dips only)', async () => {
    type Cw = { name: string; targets: unknown[] };
    const planOf = (cws: Cw[]) => cws.map((c) => `${c.name}: ${c.targets.length}`).join(', ');
    const tonesFor = async (c: Client) => ((await c.get(`/api/styles/${styleId}/brief/checks`)).json.checks as { id: string; plan: string }[]).find((x) => x.id === 'tones');
    const staffColours = (await designer.get(`/api/styles/${styleId}/colourways`)).json.colourways as Cw[];
    const clientColours = (await client.get(`/api/styles/${styleId}/colourways`)).json.colourways as Cw[];
    // The demo style has targets without an approved dip, so the two views differ and the check can fail.
    expect(clientColours.reduce((a, c) => a + c.targets.length, 0)).toBeLessThan(staffColours.reduce((a, c) => a + c.targets.length, 0));
    expect((await tonesFor(designer))?.plan).toBe(planOf(staffColours));
    expect((await tonesFor(client))?.plan).toBe(clientColours.length ? planOf(clientColours) : '—');
  });

  it('quotes per size with how each figure was computed, saves entries with versions, downloads PDF and CSV', async () => {
    const res = await designer.get(`/api/styles/${styleId}/quote`);
    expect(res.status).toBe(200);
    const q = res.json.quote;
    expect(q.quote.sizes.map((s: { size: string }) => s.size)).toEqual(expect.arrayContaining(['S', 'M', 'L']));
    const m = q.quote.sizes.find((s: { size: string }) => s.size === 'M');
    expect(m.garments).toBe(240);
    expect(m.perGarment).toBeGreaterThan(0);
    expect(m.lines.find((l: { key: string }) => l.key === 'knitting').how).toMatch(/courses ÷ \(/);
    expect(m.lines.some((l: { group: string; how: string }) => l.group === 'yarn' && /waste/.test(l.how))).toBe(true);
    expect(q.quote.targetPricePerGarment).toBe(47.35);
    expect(q.studio.note).toBe('example value, set your own');
    const saved = await designer.put(`/api/styles/${styleId}/quote`, { version: q.version, inputs: { ...q.inputs, feedersPerCourse: 2, makingUp: { ...q.inputs.makingUp, cutting: 0.5 } } });
    expect(saved.status).toBe(200);
    expect(saved.json.quote.machine.feedersPerCourse).toBe(2);
    expect((await designer.put(`/api/styles/${styleId}/quote`, { version: q.version, inputs: q.inputs })).status).toBe(409);
    const pdf = await fetch(baseUrl() + `/api/styles/${styleId}/quote/export?format=pdf`, { headers: { cookie: designer.cookie } });
    expect(pdf.status).toBe(200);
    const pdfBytes = new Uint8Array(await pdf.arrayBuffer());
    expect(Buffer.from(pdfBytes).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // The PDF says how the totals were computed, as the page and the CSV do.
    const flat = (t: string) => t.replace(/\s+/g, ' ');
    const pdfText = flat((await readPdf(pdfBytes)).map((p) => p.text).join(' '));
    const sm = saved.json.quote.quote.sizes.find((s: { size: string }) => s.size === 'M');
    expect(sm.how.margin).toMatch(/^target 47\.35 − cost /);
    expect(pdfText).toContain(flat(sm.how.margin));
    expect(pdfText).toContain(flat(sm.how.perGarment));
    expect(pdfText).toContain(flat(saved.json.quote.quote.order.how.margin));
    const csv = await designer.get(`/api/styles/${styleId}/quote/export?format=csv`);
    expect(csv.text.split('\r\n')[0]).toMatch(/^style,size,line/);
    expect(csv.text).toContain('HF27-101,M,Total cost');
  });

  it('reads stored answers that fail the schema the same way for the brief and the quote, and says so in the quote', async () => {
    const created = await designer.post('/api/styles', newStyleBody());
    expect(created.status).toBe(201);
    const id = created.json.style.id as string;
    const saved = await designer.put(`/api/styles/${id}/brief`, { version: 0, answers: { sport: 'Cycling', targetPrice: 31.2, orderBySize: { S: 10, M: 20 }, tones: 2 } });
    expect(saved.status).toBe(200);
    // An answer stored under an older rule (more tones than the form takes now).
    await knex('briefs').where({ style_id: id }).update({ answers: knex.raw(`answers || '{"tones": 40}'::jsonb`) });
    const brief = (await designer.get(`/api/styles/${id}/brief`)).json.brief;
    expect(brief.answers.targetPrice).toBe(31.2);
    expect(brief.answers.tones).toBeNull();
    const quote = (await designer.get(`/api/styles/${id}/quote`)).json.quote;
    expect(quote.quote.targetPricePerGarment).toBe(31.2);
    expect(quote.quote.sizes.find((s: { size: string }) => s.size === 'M').garments).toBe(20);
    expect(quote.quote.problems.join(' ')).toMatch(/saved brief had answers .*number of tones/);
    const checks = (await designer.get(`/api/styles/${id}/brief/checks`)).json;
    expect(checks.saved).toBe(true);
  });

  it('uses the machine-minute rate of the mill the quote names, and says so in the knitting line', async () => {
    const admin = await as('admin');
    const orgs = (await admin.get('/api/organisations')).json.organisations as { id: string; name: string; kind: string }[];
    const mill = orgs.find((o) => o.kind === 'mill')!;
    const other = orgs.filter((o) => o.kind === 'mill')[1]!;
    const clientOrg = orgs.find((o) => o.kind === 'client')!;
    const studio = (await designer.get('/api/settings/costing')).json.costing;
    // No rates in the body: the studio rates stay as they are, only the mill rates change here.
    const rates = {};
    const set = await designer.put('/api/settings/costing', { mills: { [mill.id]: 0.61, [other.id]: null } });
    expect(set.status).toBe(200);
    expect(set.json.costing.mills.find((m: { id: string }) => m.id === mill.id).minuteRate).toBe(0.61);
    expect((await designer.put('/api/settings/costing', { rates, mills: { [clientOrg.id]: 0.5 } })).status).toBe(400);
    expect(set.json.costing.defaults).toEqual(studio.defaults);
    const q = (await designer.get(`/api/styles/${styleId}/quote`)).json.quote;
    const withMill = await designer.put(`/api/styles/${styleId}/quote`, { version: q.version, inputs: { ...q.inputs, minuteRate: null, millId: mill.id } });
    expect(withMill.status).toBe(200);
    const m = withMill.json.quote.quote.sizes.find((s: { size: string }) => s.size === 'M');
    const knitting = m.lines.find((l: { key: string }) => l.key === 'knitting');
    expect(knitting.how).toContain(`0.61 ${withMill.json.quote.quote.currency}/min (rate of ${mill.name})`);
    expect(knitting.amount).toBeCloseTo(m.knitting.minutes * 0.61, 10);
    // A mill with no rate: the studio rate, and the quote says why.
    const v = withMill.json.quote.version;
    const noRate = await designer.put(`/api/styles/${styleId}/quote`, { version: v, inputs: { ...withMill.json.quote.inputs, millId: other.id } });
    expect(noRate.json.quote.machine.minuteRate).toBe(studio.rates.machineMinuteRate);
    expect(noRate.json.quote.quote.problems.join(' ')).toContain(`${other.name} has no machine-minute rate`);
    // Only the studio mills: a client organisation or an unknown id is a 400, and nothing is saved.
    for (const bad of [clientOrg.id, '00000000-0000-4000-8000-000000000000', 'not-an-id']) {
      const res = await designer.put(`/api/styles/${styleId}/quote`, { version: noRate.json.quote.version, inputs: { ...noRate.json.quote.inputs, millId: bad } });
      expect(res.status, bad).toBe(400);
      expect(res.json.fieldErrors['inputs.millId'], bad).toBeDefined();
    }
    // Back to the studio rate for the tests below.
    await designer.put(`/api/styles/${styleId}/quote`, { version: noRate.json.quote.version, inputs: { ...noRate.json.quote.inputs, millId: null } });
    await designer.put('/api/settings/costing', { rates, mills: { [mill.id]: null } });
  });

  it('writes only the studio rates a PUT names: absent ones keep their saved value, null puts one back to its example', async () => {
    const before = (await designer.get('/api/settings/costing')).json.costing;
    const two = await designer.put('/api/settings/costing', { rates: { machineMinuteRate: 0.47, makingUp: { linking: 1.9 } } });
    expect(two.status).toBe(200);
    expect(two.json.costing.rates.machineMinuteRate).toBe(0.47);
    expect(two.json.costing.rates.makingUp.linking).toBe(1.9);
    // Only one of the two sent again: the other is still the saved one, and so is everything else.
    const one = await designer.put('/api/settings/costing', { rates: { machineMinuteRate: 0.52 } });
    expect(one.status).toBe(200);
    const read = (await designer.get('/api/settings/costing')).json.costing;
    expect(read.rates.machineMinuteRate).toBe(0.52);
    expect(read.rates.makingUp.linking).toBe(1.9);
    expect(read.defaults).not.toContain('makingUp.linking');
    expect(read.rates.efficiency).toBe(before.rates.efficiency);
    expect(read.rates.trimUnitCost).toEqual(before.rates.trimUnitCost);
    expect(read.mills).toEqual(before.mills);
    // An empty PUT changes nothing and leaves no history entry.
    const entries = async () => Number((await knex('audit_log').where({ action: 'studio.costing' }).count<{ n: string }[]>({ n: '*' }))[0]!.n);
    const logged = await entries();
    const none = await designer.put('/api/settings/costing', {});
    expect(none.status).toBe(200);
    expect(none.json.costing).toEqual(read);
    expect(await entries()).toBe(logged);
    // One key of a group changed: the rest of the group stays.
    const cut = await designer.put('/api/settings/costing', { rates: { makingUp: { cutting: 0.44 } } });
    expect(cut.json.costing.rates.makingUp).toMatchObject({ cutting: 0.44, linking: 1.9 });
    // Null: back to the example value, listed as such.
    const reset = await designer.put('/api/settings/costing', { rates: { makingUp: { linking: null } } });
    expect(reset.json.costing.defaults).toContain('makingUp.linking');
    expect(reset.json.costing.rates.makingUp.cutting).toBe(0.44);
    expect(reset.json.costing.rates.machineMinuteRate).toBe(0.52);
    // A bad value among good ones changes nothing.
    const bad = await designer.put('/api/settings/costing', { rates: { machineMinuteRate: 0.6, efficiency: 4 } });
    expect(bad.status).toBe(400);
    expect(bad.json.fieldErrors['rates.efficiency']).toBeDefined();
    expect((await designer.get('/api/settings/costing')).json.costing.rates.machineMinuteRate).toBe(0.52);
    // Back to the rates as they were, the way the Studio rates form sends them: every key, null for an example value.
    const value = (k: string, v: unknown) => (before.defaults.includes(k) ? null : v);
    const group = (g: string) => Object.fromEntries(Object.entries(before.rates[g] as Record<string, number>).map(([k, v]) => [k, value(`${g}.${k}`, v)]));
    const all = Object.fromEntries(Object.entries(before.rates as Record<string, unknown>).filter(([, v]) => typeof v !== 'object').map(([k, v]) => [k, value(k, v)]));
    const restored = await designer.put('/api/settings/costing', { rates: { ...all, makingUp: group('makingUp'), trimUnitCost: group('trimUnitCost') } });
    expect(restored.status).toBe(200);
    expect(restored.json.costing).toEqual(before);
  });

  it('the mill and the client get 403 on every cost route', async () => {
    for (const c of [client, mill]) {
      expect((await c.get(`/api/styles/${styleId}/quote`)).status).toBe(403);
      expect((await c.get(`/api/styles/${styleId}/quote/export?format=pdf`)).status).toBe(403);
      expect((await c.get(`/api/styles/${styleId}/quote/export?format=csv`)).status).toBe(403);
      expect((await c.put(`/api/styles/${styleId}/quote`, { version: 0, inputs: {} })).status).toBe(403);
      expect((await c.get('/api/settings/costing')).status).toBe(403);
      expect((await c.get('/api/library/yarns')).status).toBe(403);
    }
  });

  it('the mill and the client never see a price in any style JSON they can reach', async () => {
    const paths = [
      `/api/styles/${styleId}`, `/api/styles/${styleId}/textures`, `/api/styles/${styleId}/body-map`, `/api/styles/${styleId}/fit`,
      `/api/styles/${styleId}/fit/sheet`, `/api/styles/${styleId}/colourways`, `/api/styles/${styleId}/trims`, `/api/styles/${styleId}/history`,
      `/api/styles/${styleId}/brief`, `/api/styles/${styleId}/brief/checks`, `/api/styles/${styleId}/brief/references`, `/api/styles/${styleId}/brief/versions`, '/api/styles',
    ];
    // The staff view has prices, so the check below is not vacuous.
    expect((await designer.get(`/api/styles/${styleId}/textures`)).text).toMatch(/"pricePerKg":\d/);
    for (const c of [client, mill]) {
      for (const p of paths) {
        const res = await c.get(p);
        if (res.status !== 200) continue;
        expect(res.text, `${c.label} ${p}`).not.toMatch(/"pricePerKg":\d/);
        expect(res.text, `${c.label} ${p}`).not.toMatch(/"targetPrice":\d/);
        expect(res.text, `${c.label} ${p}`).not.toMatch(/"(margin|marginPerGarment|perGarment|orderCost|machineMinuteRate)"/);
        // The price as a JSON number (a timestamp such as 04:04:47.356 holds the same digits).
        expect(res.text, `${c.label} ${p}`).not.toMatch(/[:,[]47\.35[,}\]]/);
      }
    }
  });
});
