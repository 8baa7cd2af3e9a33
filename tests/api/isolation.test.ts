/**
 * Isolation between studios and from outside accounts. Every GET route (read from app/api), called
 * by the second demo studio's admin with the ids of the first studio's objects, answers 404 or 403
 * and leaks nothing; its write routes change nothing. Mill and client accounts never see another
 * organisation's styles, and never a price or a cost, in any answer they can reach.
 *
 * A new route with a path parameter this file does not know fails "every id is known": add the
 * parameter to `idFor`.
 */
import { randomUUID } from 'node:crypto';
import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { as, baseUrl, Client, newStyleBody, styleByCode, type Account } from './helpers';
import { discoverRoutes, type Method } from './routes';

const routes = discoverRoutes();
const getRoutes = routes.filter((r) => r.method === 'GET');
const exportKinds = ['swatch-sheet.pdf', 'tile.png', 'stitch-map.png', 'stitch-map.csv', 'stitch-map.json', 'yarn-list.csv'];

let knex: Knex;
/** The first studio's objects, all on one shared style (HF27-101) so the owner reads every one of them. */
const ids: Record<string, string> = {};
/** Strings that must never reach the other studio. */
let secrets: string[] = [];

const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAIAAAACCAIAAAD91JpzAAAAFklEQVR4nGP8z8DAwMDAxMDAwMDAAAANHQEDasKb6QAAAABJRU5ErkJggg==',
  'base64',
);

/** The id for a path parameter of a route, or null when this file does not know it. */
function idFor(template: string, param: string): string | null {
  if (param === 'id') {
    if (template.startsWith('/api/styles/')) return ids.style!;
    if (template.startsWith('/api/library/yarns/')) return ids.yarn!;
    if (template.startsWith('/api/library/textures/')) return ids.texture!;
    if (template.startsWith('/api/library/colour-standards/')) return ids.standard!;
    if (template.startsWith('/api/releases/')) return ids.release!;
    if (template.startsWith('/api/test-knits/')) return ids.testKnit!;
    if (template.startsWith('/api/files/')) return ids.file!;
    if (template.startsWith('/api/mill-pack-jobs/')) return ids.job!;
    if (template.startsWith('/api/members/')) return ids.member!;
    return null;
  }
  const byParam: Record<string, string | undefined> = {
    colourwayId: ids.colourway, labDipId: ids.labDip, roundId: ids.round, correctionId: ids.correction,
    trimId: ids.trim, organisationId: ids.client, refId: ids.reference, photoId: ids.roundPhoto,
  };
  return byParam[param] ?? null;
}

/** Every concrete path of a route (one per export kind), or null when a parameter is unknown. */
function pathsOf(template: string, styleOverride?: string): string[] | null {
  const params = [...template.matchAll(/\[(\w+)\]/g)].map((m) => m[1]!);
  let p = template;
  for (const param of params) {
    if (param === 'kind') continue;
    const id = param === 'id' && styleOverride && template.startsWith('/api/styles/') ? styleOverride : idFor(template, param);
    if (!id) return null;
    p = p.replace(`[${param}]`, id);
  }
  const query = (kind: string) =>
    kind === 'tile.png' ? `?texture=${ids.styleTexture}` : kind.startsWith('stitch-map.') ? `?panel=${ids.panel}` : '';
  if (params.includes('kind')) return exportKinds.map((k) => p.replace('[kind]', k) + query(k));
  if (p.endsWith('/quote/export')) return [`${p}?format=csv`, `${p}?format=pdf`];
  return [p];
}

interface Answer { status: number; text: string; json: any; type: string }
async function call(c: Client, method: Method, p: string, multipart = false): Promise<Answer> {
  let body: BodyInit | undefined;
  const headers: Record<string, string> = { cookie: c.cookie };
  if (method !== 'GET' && method !== 'DELETE') {
    if (multipart) {
      const form = new FormData();
      form.set('file', new Blob([tinyPng], { type: 'image/png' }), 'x.png');
      form.set('photo', new Blob([tinyPng], { type: 'image/png' }), 'x.png');
      body = form;
    } else {
      body = '{}';
      headers['content-type'] = 'application/json';
    }
  }
  const res = await fetch(baseUrl() + p, { method, body, headers, redirect: 'manual' });
  const type = res.headers.get('content-type') ?? '';
  const buf = Buffer.from(await res.arrayBuffer());
  const text = /pdf|png/.test(type) ? buf.toString('latin1') : buf.toString('utf8');
  let json: any = null;
  try { json = JSON.parse(text); } catch { json = null; }
  return { status: res.status, text, json, type };
}

async function rowCounts(): Promise<Record<string, number>> {
  const tables = (await knex('pg_tables').where({ schemaname: 'public' }).orderBy('tablename').pluck('tablename')) as string[];
  const out: Record<string, number> = {};
  for (const t of tables) out[t] = Number(((await knex(t).count<{ count: string }[]>('* as count'))[0]!).count);
  return out;
}

/** Keys holding a price or a cost: a number, text or an object of them (null, absent and yes/no flags are fine). */
function priceKeys(v: unknown, at = ''): string[] {
  if (!v || typeof v !== 'object') return [];
  const out: string[] = [];
  for (const [k, x] of Object.entries(v)) {
    const here = at ? `${at}.${k}` : k;
    const holdsValue = typeof x === 'number' || (typeof x === 'string' && x !== '') || (typeof x === 'object' && x !== null);
    if (/price|cost|margin/i.test(k) && holdsValue) out.push(here);
    out.push(...priceKeys(x, here));
  }
  return out;
}

beforeAll(async () => {
  knex = knexFactory({ client: 'pg', connection: inject('databaseUrl'), pool: { min: 0, max: 2 } });
  const designer = await as('designer');
  const style = await styleByCode('HF27-101');
  ids.style = style.id;
  const studio = (await knex('styles').where({ id: style.id }).first('studio_id')).studio_id as string;
  const orgs = await knex('organisations').where({ studio_id: studio }).select('id', 'name', 'kind');
  const mill = orgs.find((o) => o.name === 'Quellmoor Knitworks')!;
  ids.client = orgs.find((o) => o.name === 'Varrow Sport')!.id;

  // A release of the shared style with a test knit, a mill upload and a mill pack job.
  const rel = await designer.post(`/api/styles/${style.id}/releases`, { version: style.version, millIds: [mill.id] });
  expect(rel.status, rel.text).toBe(201);
  ids.release = rel.json.release.id;
  const knits = await designer.post(`/api/releases/${ids.release}/test-knits`);
  ids.testKnit = knits.json.testKnits[0].id;
  const form = new FormData();
  form.set('file', new Blob([tinyPng], { type: 'image/png' }), 'isolation.png');
  const up = await fetch(`${baseUrl()}/api/styles/${style.id}/files`, { method: 'POST', body: form, headers: { cookie: (await as('mill')).cookie } });
  ids.file = ((await up.json()) as { file: { id: string } }).file.id;
  ids.job = (await designer.post(`/api/styles/${style.id}/mill-pack`, { releaseId: ids.release, paper: 'a4' })).json.job.id;

  const one = async (table: string, where: Record<string, string>) => ((await knex(table).where(where).first('id')) as { id: string } | undefined)?.id;
  ids.colourway = (await one('colourways', { style_id: style.id }))!;
  ids.labDip = (await one('lab_dips', { style_id: style.id }))!;
  ids.round = (await one('sample_rounds', { style_id: style.id }))!;
  // A photo on the shared style's round (the demo data has none: its images would live in the store).
  const photoForm = new FormData();
  photoForm.set('photo', new Blob([tinyPng], { type: 'image/png' }), 'round.png');
  const photoUp = await fetch(`${baseUrl()}/api/styles/${style.id}/fit/rounds/${ids.round}/photos`, { method: 'POST', body: photoForm, headers: { cookie: designer.cookie } });
  expect(photoUp.status).toBe(201);
  ids.roundPhoto = ((await photoUp.json()) as { photo: { id: string } }).photo.id;
  ids.trim = (await one('trims', { style_id: style.id }))!;
  // Objects the demo data may not hold: a stand-in id (the owner check then lists the route as not exercised).
  const standIn = '00000000-0000-4000-8000-000000000000';
  ids.correction = (await knex('sample_corrections').where({ round_id: ids.round }).first('id'))?.id ?? standIn;
  ids.reference = (await knex.schema.hasTable('brief_references'))
    ? ((await knex('brief_references').where({ style_id: style.id }).first('id'))?.id ?? standIn)
    : standIn;
  ids.styleTexture = (await knex('style_textures').where({ style_id: style.id }).orderBy('position').first('texture_id')).texture_id;
  ids.panel = (await one('panels', { style_id: style.id }))!;
  ids.yarn = (await one('yarns', { studio_id: studio }))!;
  ids.texture = (await one('textures', { studio_id: studio }))!;
  ids.standard = (await one('colour_standards', { studio_id: studio }))!;
  ids.member = (await one('users', { studio_id: studio, email: 'designer@hollowfell.example' }))!;

  const names = [
    ...(await knex('styles').where({ studio_id: studio }).pluck('code')),
    ...(await knex('styles').where({ studio_id: studio }).pluck('name')),
    ...(await knex('yarns').where({ studio_id: studio }).pluck('name')),
    ...(await knex('textures').where({ studio_id: studio }).pluck('name')),
    ...orgs.map((o) => o.name as string),
    'Hollowfell', 'hollowfell.example',
  ] as string[];
  secrets = [...new Set(names.filter((n) => n && n.length >= 5))];
}, 120_000);
afterAll(async () => { await knex?.destroy(); });

describe('another studio', () => {
  it('every id is known and is real: the owning studio reads every GET route with them', { timeout: 120_000 }, async () => {
    const unknown = getRoutes.filter((r) => pathsOf(r.template) === null).map((r) => r.key);
    expect(unknown, 'add these path parameters to idFor').toEqual([]);
    const admin = await as('admin');
    const failing: string[] = [];
    const notExercised: string[] = [];
    for (const r of getRoutes) {
      for (const p of pathsOf(r.template)!) {
        if (p.includes('00000000-0000-4000-8000-000000000000')) { notExercised.push(r.key); continue; }
        const res = await call(admin, 'GET', p);
        if (res.status !== 200) failing.push(`${p} → ${res.status} ${res.text.slice(0, 100)}`);
      }
    }
    if (notExercised.length) console.log(`Isolation: no demo object for ${[...new Set(notExercised)].join(', ')} (called with a stand-in id only)`);
    expect(failing).toEqual([]);
  });

  it('every GET route with the first studio\'s ids answers 404 or 403 and leaks nothing', { timeout: 120_000 }, async () => {
    const other = await as('otherStudioAdmin');
    for (const r of getRoutes) {
      if (!r.template.includes('[')) continue;
      for (const p of pathsOf(r.template)!) {
        const res = await call(other, 'GET', p);
        expect([403, 404], `${p} → ${res.status} ${res.text.slice(0, 200)}`).toContain(res.status);
        expect(typeof res.json?.error, p).toBe('string');
        for (const s of secrets) expect(res.text.includes(s), `${p} leaks "${s}"`).toBe(false);
      }
    }
  });

  it('lists show only its own studio', { timeout: 60_000 }, async () => {
    const other = await as('otherStudioAdmin');
    for (const r of getRoutes.filter((x) => !x.template.includes('['))) {
      const res = await call(other, 'GET', r.template);
      expect(res.status, `${r.key} → ${res.status}`).toBeLessThan(500);
      for (const s of secrets) expect(res.text.includes(s), `${r.key} leaks "${s}"`).toBe(false);
    }
    const styles = (await other.get('/api/styles')).json.styles as { code: string }[];
    expect(styles.map((s) => s.code)).toEqual(['OX-001']);
  });

  it('its write routes with the first studio\'s ids are refused and change nothing', { timeout: 120_000 }, async () => {
    const other = await as('otherStudioAdmin');
    const before = await rowCounts();
    for (const r of routes.filter((x) => x.method !== 'GET' && x.template.includes('['))) {
      const paths = pathsOf(r.template);
      if (!paths) continue;
      for (const p of paths) {
        const res = await call(other, r.method, p, r.multipart);
        expect([400, 403, 404, 409], `${r.key} → ${res.status} ${res.text.slice(0, 200)}`).toContain(res.status);
        for (const s of secrets) expect(res.text.includes(s), `${r.key} leaks "${s}"`).toBe(false);
      }
    }
    const after = await rowCounts();
    delete before.sign_in_attempts; delete after.sign_in_attempts;
    expect(after).toEqual(before);
  });
});

describe('mill and client accounts', () => {
  const outside: Account[] = ['mill', 'client'];

  it('see nothing of a style not shared with them, on every style route', { timeout: 120_000 }, async () => {
    const notShared = await styleByCode('HF27-106');
    for (const who of outside) {
      const c = await as(who);
      for (const r of getRoutes.filter((x) => x.template.startsWith('/api/styles/['))) {
        for (const p of pathsOf(r.template, notShared.id) ?? []) {
          const res = await call(c, 'GET', p);
          expect([403, 404], `${who} ${p} → ${res.status} ${res.text.slice(0, 120)}`).toContain(res.status);
          expect(res.text.includes('Harbour fashioned tee'), `${who} ${p}`).toBe(false);
        }
      }
    }
  });

  it('the mill reaches released revisions only: a zone drawn after the release never reaches it', { timeout: 120_000 }, async () => {
    const designer = await as('designer');
    const mill = await as('mill');
    const studio = (await knex('styles').where({ id: ids.style }).first('studio_id')).studio_id as string;
    const quellmoor = (await knex('organisations').where({ studio_id: studio, name: 'Quellmoor Knitworks' }).first('id')).id as string;
    const textureId = (await knex('textures').where({ studio_id: studio }).whereNull('archived_at').orderBy('name').first('id')).id as string;
    const style = (await designer.post('/api/styles', newStyleBody())).json.style as { id: string };
    expect((await designer.post(`/api/styles/${style.id}/shares`, { organisationId: quellmoor })).status).toBe(201);
    const stamp = Date.now().toString(36);
    const releasedZone = `Released zone ${stamp}`;
    const laterZone = `Working copy zone ${stamp}`;
    const addZone = async (name: string) => {
      const map = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
      const panels = structuredClone(map.panels);
      panels[0].zones.push({
        id: randomUUID(), name, textureId, fn: 'compression', order: panels[0].zones.length + 1,
        polygon: [{ x: 10, y: 100 }, { x: 120, y: 100 }, { x: 120, y: 600 }, { x: 10, y: 600 }],
      });
      const res = await designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels });
      expect(res.status, res.text).toBe(200);
    };
    await addZone(releasedZone);
    const version = (await designer.get(`/api/styles/${style.id}`)).json.style.version as number;
    const rel = await designer.post(`/api/styles/${style.id}/releases`, { version, millIds: [quellmoor] });
    expect(rel.status, rel.text).toBe(201);
    const releaseId = rel.json.release.id as string;
    await addZone(laterZone);

    // The released revision holds the zone it was released with.
    const release = await call(mill, 'GET', `/api/releases/${releaseId}`);
    expect(release.status).toBe(200);
    expect(release.text).toContain(releasedZone);
    // No answer the mill can reach holds the zone drawn afterwards; the working copy's routes are refused.
    let reached = 0;
    for (const r of getRoutes) {
      for (const p of pathsOf(r.template, style.id) ?? []) {
        const res = await call(mill, 'GET', p.replace(ids.release!, releaseId));
        if (res.status !== 200) continue;
        reached++;
        expect(res.text.includes(laterZone), `${p} shows the working copy`).toBe(false);
      }
    }
    expect(reached).toBeGreaterThan(5);
    for (const p of ['body-map', 'textures', 'trims', 'yarn-calculator', 'yarn-order.csv', 'brief', 'history']) {
      expect((await call(mill, 'GET', `/api/styles/${style.id}/${p}`)).status, p).toBe(403);
    }
    // Pages: the working-copy sections send the mill to the mill pack; the pages it can open show the release.
    for (const section of ['', '/body-map', '/textures', '/yarns', '/trims']) {
      const res = await fetch(`${baseUrl()}/styles/${style.id}${section}`, { headers: { cookie: mill.cookie }, redirect: 'manual' });
      expect([303, 307, 308], section).toContain(res.status);
      expect(res.headers.get('location') ?? '', section).toMatch(new RegExp(`/styles/${style.id}/mill-pack$`));
    }
    for (const page of [`/styles/${style.id}/mill-pack`, `/styles/${style.id}/colour`, `/styles/${style.id}/fit`, `/styles/${style.id}/test-knits`, `/releases/${releaseId}`]) {
      const res = await call(mill, 'GET', page);
      expect(res.status, page).toBe(200);
      expect(res.text.includes(laterZone), `${page} shows the working copy`).toBe(false);
    }
    // The studio's own view of the working copy does have it (so the checks above could fail).
    expect((await call(designer, 'GET', `/api/styles/${style.id}/body-map`)).text).toContain(laterZone);
  });

  it('never get a price or a cost, in any answer they can reach', { timeout: 120_000 }, async () => {
    // The studio does see its prices (so the check below would find them if they leaked).
    const studioYarns = (await (await as('designer')).get('/api/library/yarns')).json.yarns as { pricePerKg: number | null }[];
    expect(studioYarns.some((y) => y.pricePerKg !== null)).toBe(true);
    const prices = [...new Set(studioYarns.map((y) => y.pricePerKg).filter((x): x is number => x !== null))];

    for (const who of outside) {
      const c = await as(who);
      let reached = 0;
      for (const r of getRoutes) {
        for (const p of pathsOf(r.template) ?? []) {
          const res = await call(c, 'GET', p);
          if (res.status !== 200) continue;
          reached++;
          if (res.json) expect(priceKeys(res.json), `${who} ${p}`).toEqual([]);
          if (/csv/.test(res.type)) {
            expect(res.text.split('\n')[0], `${who} ${p} header`).not.toMatch(/price|cost/i);
            for (const v of prices) expect(res.text.includes(`,${v.toFixed(2)}`), `${who} ${p} holds ${v}`).toBe(false);
          }
          if (/pdf/.test(res.type)) expect(res.text, `${who} ${p}`).not.toMatch(/\/(Price|Cost)\b/);
        }
      }
      expect(reached, `${who} reached some routes`).toBeGreaterThan(5);
    }
  });
});
