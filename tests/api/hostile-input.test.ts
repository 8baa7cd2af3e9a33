/**
 * Hostile input at every write route (read from app/api, so a new route is covered the day it
 * lands): oversized bodies, wrong content types, malformed and deeply nested JSON,
 * prototype-pollution keys, NUL and lone surrogates, random JSON (fast-check); non-UUID ids on
 * every route; then field by field: SQL-like and markup-like text stored verbatim and rendered as
 * text, search strings, huge polygons, NaN and Infinity, unicode edge cases. Every answer is a 4xx
 * with a JSON error (or, for valid input, a success): never a 500, and a refused request changes
 * nothing in the database.
 */
import { randomUUID } from 'node:crypto';
import { request as httpRequest } from 'node:http';
import fc from 'fast-check';
import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { as, baseUrl, Client, newStyleBody, type Account } from './helpers';
import { discoverRoutes } from './routes';

const routes = discoverRoutes();
const writeRoutes = routes.filter((r) => r.method !== 'GET' && r.key !== 'POST /api/auth/sign-out');
const jsonRoutes = writeRoutes.filter((r) => r.parsesBody);
const multipartRoutes = writeRoutes.filter((r) => r.multipart);

/** Who reaches the route's validation (anyone else gets 403 first). */
function callerFor(key: string): Account {
  if (key === 'POST /api/releases/[id]/decision') return 'client';
  if (key === 'POST /api/test-knits/[id]/submission') return 'mill';
  return 'admin';
}

let styleId = '';
/** A path for the template: the style's own id where the route is under a style, random UUIDs for the rest. */
function fill(template: string, override?: string): string {
  return template
    .replace('[kind]', 'swatch-sheet.pdf')
    .replace(/\[(\w+)\]/g, (_m, name: string) => override ?? (name === 'id' && template.startsWith('/api/styles/') ? styleId : randomUUID()));
}

interface Answer { status: number; json: any; text: string; headers: Headers }

async function send(c: Client, method: string, p: string, body: BodyInit | undefined, headers: Record<string, string>): Promise<Answer> {
  const res = await fetch(baseUrl() + p, { method, body, headers: { ...(c.cookie ? { cookie: c.cookie } : {}), ...headers }, redirect: 'manual' });
  const text = await res.text();
  let json: any = null;
  try { json = JSON.parse(text); } catch { json = null; }
  return { status: res.status, json, text, headers: res.headers };
}

/** A refusal: 4xx, a JSON body with a readable `error`, no internals. */
function expectRefused(res: Answer, what: string, statuses?: number[]) {
  expect(res.status, `${what} → ${res.status} ${res.text.slice(0, 200)}`).toBeGreaterThanOrEqual(400);
  expect(res.status, `${what} → ${res.status} ${res.text.slice(0, 200)}`).toBeLessThan(500);
  if (statuses) expect(statuses, `${what} → ${res.status} ${res.text.slice(0, 200)}`).toContain(res.status);
  expect(typeof res.json?.error, `${what}: JSON error body, got ${res.text.slice(0, 200)}`).toBe('string');
  expect(res.text, what).not.toMatch(/\bat [\w.<>]+ \(|node_modules|\.tsx?:\d/);
}
/** Anything but a server fault; a refusal must be JSON. */
function expectNoFault(res: Answer, what: string) {
  expect(res.status, `${what} → ${res.status} ${res.text.slice(0, 200)}`).toBeLessThan(500);
  if (res.status >= 400) expect(typeof res.json?.error, `${what}: JSON error body, got ${res.text.slice(0, 200)}`).toBe('string');
}

/**
 * One request on a connection of its own (a server may close a connection after refusing an upload
 * whose body it did not read; a pooled client would then fail the next request on that socket).
 */
function sendOnce(c: Client, method: string, p: string, body: string, headers: Record<string, string>): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const u = new URL(baseUrl() + p);
    const req = httpRequest(
      { host: u.hostname, port: u.port, path: u.pathname + u.search, method, agent: false, headers: { cookie: c.cookie, ...headers, 'content-length': String(Buffer.byteLength(body)) } },
      (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (d: string) => (text += d));
        res.on('end', () => {
          let json: any = null;
          try { json = JSON.parse(text); } catch { json = null; }
          resolve({ status: res.statusCode ?? 0, json, text, headers: new Headers() });
        });
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

/**
 * A multipart upload that declares 200 MB and sends only its first bytes: the answer must come
 * before the body (a server that read it all first would wait here until the test times out).
 */
function declaredHuge(c: Client, p: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const u = new URL(baseUrl() + p);
    let done = false;
    const req = httpRequest(
      {
        host: u.hostname, port: u.port, path: u.pathname, method: 'POST', agent: false,
        headers: { cookie: c.cookie, 'content-type': 'multipart/form-data; boundary=b', 'content-length': String(200 * 1024 * 1024) },
      },
      (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (d: string) => (text += d));
        res.on('end', () => {
          done = true;
          req.destroy();
          let json: any = null;
          try { json = JSON.parse(text); } catch { json = null; }
          resolve({ status: res.statusCode ?? 0, json, text, headers: new Headers() });
        });
      },
    );
    req.on('error', (e) => { if (!done) reject(e); });
    req.write('--b\r\nContent-Disposition: form-data; name="file"; filename="huge.png"\r\nContent-Type: image/png\r\n\r\n');
  });
}

let knex: Knex;
async function rowCounts(): Promise<Record<string, number>> {
  const tables = (await knex('pg_tables').where({ schemaname: 'public' }).orderBy('tablename').pluck('tablename')) as string[];
  const out: Record<string, number> = {};
  for (const t of tables) out[t] = Number(((await knex(t).count<{ count: string }[]>('* as count'))[0]!).count);
  return out;
}

/** Waits for background work an accepted request started (mill packs build after the answer). */
async function settle() {
  for (let i = 0; i < 120; i++) {
    const busy = Number(((await knex('mill_pack_jobs').whereIn('status', ['queued', 'running']).count<{ count: string }[]>('* as count'))[0]!).count);
    if (busy === 0) return;
    await new Promise((r) => setTimeout(r, 250));
  }
}

const clients = new Map<Account, Client>();
const clientFor = async (key: string) => {
  const who = callerFor(key);
  if (!clients.has(who)) clients.set(who, await as(who));
  return clients.get(who)!;
};

beforeAll(async () => {
  knex = knexFactory({ client: 'pg', connection: inject('databaseUrl'), pool: { min: 0, max: 2 } });
  const designer = await as('designer');
  styleId = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Hostile input target' })).json.style.id;
  // Every caller signs in now, not in the middle of a row count: a sign-in writes a session row.
  for (const r of routes) await clientFor(r.key);
});
afterAll(async () => { await knex?.destroy(); });

describe('hostile bodies at every write route', () => {
  it('finds the write routes', () => {
    expect(jsonRoutes.length).toBeGreaterThan(25);
    expect(multipartRoutes.map((r) => r.key)).toEqual(expect.arrayContaining(['POST /api/styles/[id]/files']));
  });

  it('refuses every hostile body with a 4xx JSON error and changes nothing', { timeout: 120_000 }, async () => {
    await settle();
    const before = await rowCounts();
    const json = { 'content-type': 'application/json' };
    const big = JSON.stringify({ name: 'x'.repeat(5 * 1024 * 1024) });
    const deep = `{"name":${'['.repeat(100_000)}${']'.repeat(100_000)}}`;
    const attacks: [string, BodyInit, Record<string, string>, number[]][] = [
      ['5 MB body', big, json, [413]],
      ['text/plain', '{"name":"x"}', { 'content-type': 'text/plain' }, [415]],
      ['form-urlencoded', 'name=x&version=1', { 'content-type': 'application/x-www-form-urlencoded' }, [415]],
      ['malformed JSON', '{"name":', json, [400]],
      ['empty body', '', json, [400]],
      ['100 000 levels of nesting', deep, json, [400]],
      ['NUL in a string', '{"name":"a\\u0000b","body":"a\\u0000b","version":1}', json, [400]],
      ['lone surrogate', '{"name":"a\\ud800b","body":"a\\ud800b","version":1}', json, [400]],
      ['Infinity by overflow', '{"version":1e999,"name":1e999}', json, [400, 404, 409]],
    ];
    for (const r of jsonRoutes) {
      const c = await clientFor(r.key);
      for (const [what, body, headers, statuses] of attacks) {
        expectRefused(await send(c, r.method, fill(r.template), body, headers), `${r.key}: ${what}`, statuses);
      }
      // Keys that would pollute a prototype if merged naively; plain top-level values of the wrong type.
      for (const body of ['{"__proto__":{"role":"admin","isAdmin":true},"constructor":{"prototype":{"role":"admin"}}}', 'null', '[]', '"text"', '42']) {
        const res = await send(c, r.method, fill(r.template), body, json);
        expectNoFault(res, `${r.key}: ${body.slice(0, 30)}`);
      }
    }
    // Nothing a refused request touched was written (prototype keys included: no new rows at all).
    await settle();
    expect(await rowCounts()).toEqual(before);
    // No prototype was polluted in the server: a plain read still answers normally.
    const me = await (await as('designer')).get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.json.user?.role ?? me.json.role).toBe('designer');
  });

  it('a body over the limit sent without Content-Length (chunked) is cut off at the limit', async () => {
    const designer = await as('designer');
    // Far more than the socket buffers hold, so a server that stops reading is seen to stop.
    const total = 32 * 1024 * 1024;
    const name = `Chunked ${Date.now().toString(36)}`;
    // Its own connection (agent: false): the server cuts this one off mid-body, and a socket it
    // reset must never go back to the pool the other requests of this file share.
    const outcome = await new Promise<{ answer: Answer | null; sentBytes: number; error: string | null }>((resolve) => {
      const u = new URL(`${baseUrl()}/api/styles`);
      let sent = 0;
      let done = false;
      const req = httpRequest(
        { host: u.hostname, port: u.port, path: u.pathname, method: 'POST', agent: false, headers: { cookie: designer.cookie, 'content-type': 'application/json', 'transfer-encoding': 'chunked' } },
        (res) => {
          let text = '';
          const finish = () => {
            if (done) return;
            done = true;
            req.destroy();
            let json: any = null;
            try { json = JSON.parse(text); } catch { json = null; }
            resolve({ answer: { status: res.statusCode ?? 0, json, text, headers: new Headers() }, sentBytes: sent, error: null });
          };
          res.setEncoding('utf8');
          res.on('data', (d: string) => (text += d));
          res.on('end', finish);
          res.on('error', finish);
          res.on('aborted', finish);
        },
      );
      // A server that stops reading may close the connection before its answer is read here:
      // then the proof is that it closed before the whole body went out.
      req.on('error', (e: NodeJS.ErrnoException) => {
        if (done) return;
        done = true;
        resolve({ answer: null, sentBytes: sent, error: e.code ?? e.message });
      });
      const chunk = 'x'.repeat(64 * 1024);
      const pump = () => {
        while (!done && sent < total) {
          const piece = sent === 0 ? `{"code":"CHUNKED-1","name":"${name}","x":"${'x'.repeat(64 * 1024 - 60)}` : chunk;
          sent += piece.length;
          if (!req.write(piece)) { req.once('drain', pump); return; }
        }
        if (!done) req.end();
      };
      pump();
    });
    if (outcome.answer) {
      expect(outcome.answer.status).toBe(413);
      expect((outcome.answer.json as { error: string }).error).toMatch(/too large/);
    } else {
      expect(['EPIPE', 'ECONNRESET']).toContain(outcome.error);
      expect(outcome.sentBytes).toBeLessThan(total);
    }
    // Nothing of it was stored.
    expect(Number(((await knex('styles').where({ name }).count<{ count: string }[]>('* as count'))[0]!).count)).toBe(0);
  });

  it('upload routes refuse the wrong content type, an oversized declaration and a broken form', async () => {
    for (const r of multipartRoutes) {
      const c = await clientFor(r.key);
      const p = fill(r.template);
      expectRefused(await sendOnce(c, r.method, p, '{"file":"x"}', { 'content-type': 'application/json' }), `${r.key}: JSON`, [415]);
      expectRefused(await sendOnce(c, r.method, p, 'x', { 'content-type': 'text/plain' }), `${r.key}: text`, [415]);
      expectRefused(
        await sendOnce(c, r.method, p, '--b\r\nContent-Disposition: form-data; name="file"; filename="a.png"\r\n\r\nnot closed',
          { 'content-type': 'multipart/form-data; boundary=b' }),
        `${r.key}: broken form`, [400, 404],
      );
      expectRefused(await declaredHuge(c, p), `${r.key}: 200 MB declared`, [413]);
    }
  });

  it('random JSON bodies (property-based): never a 500, and refused ones change nothing', { timeout: 120_000 }, async () => {
    for (const r of jsonRoutes) {
      const c = await clientFor(r.key);
      await settle();
      const before = await rowCounts();
      let accepted = 0;
      await fc.assert(
        fc.asyncProperty(
          fc.oneof(
            fc.jsonValue({ maxDepth: 4 }),
            fc.dictionary(fc.constantFrom('version', 'name', 'id', 'textureIds', 'panels', 'decision', 'body', '__proto__', 'constructor'), fc.jsonValue({ maxDepth: 3 })),
          ),
          async (body) => {
            const res = await send(c, r.method, fill(r.template), JSON.stringify(body), { 'content-type': 'application/json' });
            expectNoFault(res, `${r.key}: ${JSON.stringify(body).slice(0, 120)}`);
            if (res.status < 400) accepted++;
          },
        ),
        { numRuns: 12, seed: 20270101 },
      );
      await settle();
      if (accepted === 0) expect(await rowCounts(), `${r.key} changed the database on a refused request`).toEqual(before);
    }
  });
});

describe('ids that are not UUIDs, on every route', () => {
  const bad = ['not-a-uuid', "1' OR '1'='1", '..%2F..%2Fetc%2Fpasswd', 'x'.repeat(2000), '00000000-0000-0000-0000-00000000000g', '%00', '%F0%9F%A7%B6'];
  it('answers 400 or 404 with a JSON error, never a 500', { timeout: 120_000 }, async () => {
    for (const r of routes.filter((x) => x.template.includes('['))) {
      const c = await clientFor(r.key);
      for (const id of bad) {
        const p = r.template.replace('[kind]', 'swatch-sheet.pdf').replace(/\[(\w+)\]/g, id);
        const body = r.method === 'GET' || r.method === 'DELETE' ? undefined : r.multipart ? new FormData() : '{}';
        const headers: Record<string, string> = body === '{}' ? { 'content-type': 'application/json' } : {};
        expectRefused(await send(c, r.method, p, body, headers), `${r.key} with id ${id.slice(0, 40)}`, [400, 404]);
      }
    }
  });
});

describe('text fields: stored verbatim, rendered as text', () => {
  const samples = [
    "'; DROP TABLE styles; --",
    "Robert'); DELETE FROM users WHERE ('1'='1",
    '1 OR 1=1 UNION SELECT password_hash FROM users',
    '<script>alert("nm-xss")</script>',
    '<img src=x onerror=alert(1)> & "quotes" \'single\'',
    '{{7*7}} ${7*7} %s %n',
    'Knit 🧶 mesh 𝔑 — ½ · 日本語 · עִברִית',
    'e\u0301\u0301\u0301 combining',
    '\u202Eright-to-left override',
    'zero\u200Bwidth\uFEFFjoin',
    '\\ back\\slash \\\\ and %_ wildcards',
  ];

  it('style names and yarn names come back exactly as sent', { timeout: 60_000 }, async () => {
    const designer = await as('designer');
    for (const name of samples) {
      const created = await designer.post('/api/styles', { ...newStyleBody(), name });
      expect(created.status, `${name}: ${created.text}`).toBe(201);
      const read = await designer.get(`/api/styles/${created.json.style.id}`);
      expect(read.json.style.name).toBe(name);
      const yarn = await designer.post('/api/library/yarns', {
        name: `${name} ${randomUUID().slice(0, 6)}`, count: '78 dtex', makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' },
      });
      expect(yarn.status, `${name}: ${yarn.text}`).toBe(201);
      expect((await designer.get(`/api/library/yarns/${yarn.json.yarn.id}`)).json.yarn.name.startsWith(name)).toBe(true);
    }
  });

  it('search strings that look like SQL or wildcards are searched for literally', async () => {
    const designer = await as('designer');
    const all = (await designer.get('/api/styles')).json.styles as { name: string; code: string; season: string }[];
    for (const q of ["' OR '1'='1", "'; DROP TABLE styles; --", '%', '_', '\\', '%_%', 'UNION SELECT', '🧶', '\u202E']) {
      const res = await designer.get(`/api/styles?q=${encodeURIComponent(q)}`);
      expect(res.status, q).toBe(200);
      const expected = all.filter((s) => [s.code, s.name, s.season].some((f) => f.toLowerCase().includes(q.toLowerCase()))).length;
      expect(res.json.styles.length, q).toBe(expected);
    }
    expectRefused(await designer.get(`/api/styles?q=${encodeURIComponent('a\u0000b')}`), 'NUL in the search', [400]);
    expectRefused(await designer.get(`/api/styles?q=${'x'.repeat(101)}`), 'overlong search', [400]);
    expectRefused(await designer.get('/api/styles?status=%27%20OR%201%3D1'), 'status filter', [400]);
    expectRefused(await designer.get('/api/styles?clientId=1%20OR%201%3D1'), 'client filter', [400]);
  });

  it('markup in a name is escaped in the pages that show it', async () => {
    const designer = await as('designer');
    const name = '<script>alert("nm-xss")</script><img src=x onerror=alert(2)>';
    const style = (await designer.post('/api/styles', { ...newStyleBody(), name })).json.style;
    // The list renders in the browser from the API; the style's own pages render on the server.
    for (const page of ['/styles', `/styles/${style.id}`, `/styles/${style.id}/body-map`, `/styles/${style.id}/history`]) {
      const res = await designer.get(page);
      expect(res.status, page).toBe(200);
      expect(res.text, page).not.toContain('<script>alert("nm-xss")');
      expect(res.text, page).not.toContain('<img src=x onerror');
    }
    // It is there, as text: escaped in the HTML (and in the page data as a JSON string).
    const workspace = (await designer.get(`/styles/${style.id}`)).text;
    expect(workspace).toContain('&lt;script&gt;alert(&quot;nm-xss&quot;)&lt;/script&gt;');
  });

  it('NUL characters and lone surrogates are refused with a readable reason', async () => {
    const designer = await as('designer');
    for (const bad of ['a\u0000b', 'a\ud800b', '\udfffz']) {
      const res = await designer.request('POST', '/api/styles', JSON.stringify({ ...newStyleBody(), name: bad }));
      expectRefused(res, JSON.stringify(bad), [400]);
      expect(res.json.error).toMatch(/NUL|Unicode/);
    }
  });
});

describe('numbers and geometry', () => {
  const rect = (x0: number, y0: number, x1: number, y1: number) => [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];

  async function freshMap() {
    const designer = await as('designer');
    const style = (await designer.post('/api/styles', newStyleBody())).json.style;
    const map = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
    return { designer, style, map };
  }

  it('huge polygons, too many zones or panels: 400 or 413 quickly, nothing saved', { timeout: 60_000 }, async () => {
    const { designer, style, map } = await freshMap();
    const texture = map.panels[0].baseTextureId as string;
    const zone = (polygon: { x: number; y: number }[], i = 0) => ({ id: randomUUID(), name: `Z${i}`, textureId: texture, fn: 'compression', order: i, polygon });
    const circle = (n: number) => Array.from({ length: n }, (_, k) => ({ x: 300 + 200 * Math.cos((2 * Math.PI * k) / n), y: 1000 + 200 * Math.sin((2 * Math.PI * k) / n) }));
    const cases: [string, unknown][] = [
      ['a 50 000-vertex polygon', [{ ...map.panels[0], zones: [zone(circle(50_000))] }, ...map.panels.slice(1)]],
      ['401 vertices', [{ ...map.panels[0], zones: [zone(circle(401))] }, ...map.panels.slice(1)]],
      ['300 zones on a panel', [{ ...map.panels[0], zones: Array.from({ length: 300 }, (_, i) => zone(rect(10, 10 + i, 20, 11 + i), i)) }, ...map.panels.slice(1)]],
      ['9 panels', Array.from({ length: 9 }, () => ({ ...map.panels[0], id: randomUUID() }))],
      ['a vertex at 1e308 (outside) ', [{ ...map.panels[0], zones: [zone([{ x: 1e308, y: 1 }, { x: 2, y: 1 }, { x: 2, y: 5 }])] }, ...map.panels.slice(1)]],
      ['a panel 1e9 needles wide', [{ ...map.panels[0], widthNeedles: 1e9 }, ...map.panels.slice(1)]],
    ];
    for (const [what, panels] of cases) {
      const start = Date.now();
      const res = await designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels });
      expectRefused(res, what, [400, 413]);
      expect(Date.now() - start, `${what} took too long`).toBeLessThan(5000);
    }
    // Numbers JSON cannot say directly: overflow to Infinity, and strings.
    const template = JSON.stringify({ version: map.version, panels: [{ ...map.panels[0], widthNeedles: '@W@' }, ...map.panels.slice(1)] });
    const raw = (v: string) => designer.request('PUT', `/api/styles/${style.id}/body-map`, template.replace('"@W@"', v));
    expect((await raw(String(map.panels[0].widthNeedles))).status, 'the template itself is valid').toBe(200);
    map.version += 1;
    const stale = JSON.stringify({ version: map.version, panels: [{ ...map.panels[0], widthNeedles: '@W@' }, ...map.panels.slice(1)] });
    const raw2 = (v: string) => designer.request('PUT', `/api/styles/${style.id}/body-map`, stale.replace('"@W@"', v));
    for (const v of ['1e999', '-1e999', '"NaN"', '"Infinity"', '1.5', '-0', 'null', '"616"']) {
      const res = await raw2(v);
      expectRefused(res, `widthNeedles ${v}`, [400]);
      expect(Object.keys(res.json.fieldErrors ?? {}), `widthNeedles ${v}`).toContain('panels.0.widthNeedles');
    }
    expect((await designer.get(`/api/styles/${style.id}/body-map`)).json.version).toBe(map.version);
  });

  it('panel and zone ids of another style are refused, and neither map changes', async () => {
    const a = await freshMap();
    const b = await freshMap();
    const texture = a.map.panels[0].baseTextureId as string;
    const zone = { id: randomUUID(), name: 'Owned by A', textureId: texture, fn: 'compression', order: 1, polygon: rect(10, 100, 60, 300) };
    const savedA = await a.designer.put(`/api/styles/${a.style.id}/body-map`, { version: a.map.version, panels: [{ ...a.map.panels[0], zones: [zone] }, ...a.map.panels.slice(1)] });
    expect(savedA.status).toBe(200);
    const mapA = (await a.designer.get(`/api/styles/${a.style.id}/body-map`)).json;
    // B's save carries A's panel ids, then A's zone id.
    const stealPanels = await b.designer.put(`/api/styles/${b.style.id}/body-map`, { version: b.map.version, panels: mapA.panels });
    expectRefused(stealPanels, 'panel ids of another style', [400]);
    const stealZone = await b.designer.put(`/api/styles/${b.style.id}/body-map`, { version: b.map.version, panels: [{ ...b.map.panels[0], zones: [zone] }, ...b.map.panels.slice(1)] });
    expectRefused(stealZone, 'a zone id of another style', [400]);
    expect((await a.designer.get(`/api/styles/${a.style.id}/body-map`)).json).toEqual(mapA);
    const nowB = (await b.designer.get(`/api/styles/${b.style.id}/body-map`)).json;
    expect(nowB.version).toBe(b.map.version);
    expect(nowB.generated).toBe(true);
  });

  it('NaN and Infinity in numeric fields of styles, trims, yarns and lab dips are refused', async () => {
    const designer = await as('designer');
    const bad: unknown[] = ['NaN', 'Infinity', '-Infinity', '1e999', null, '', ' ', '0x10', [], {}];
    for (const v of bad) {
      const body = newStyleBody();
      const res = await designer.post('/api/styles', { ...body, machine: { ...body.machine, diameterIn: v } });
      expectRefused(res, `diameterIn ${JSON.stringify(v)}`, [400]);
      expect(Object.keys(res.json.fieldErrors ?? {}), `diameterIn ${JSON.stringify(v)}`).toEqual(['machine.diameterIn']);
      expectRefused(
        await designer.post(`/api/styles/${styleId}/trims`, { panelKind: 'front', kind: 'woven-label', method: 'sewn', box: { x: v, y: 1, width: 10, height: 10 } }),
        `trim box ${JSON.stringify(v)}`, [400],
      );
      expectRefused(
        await designer.post('/api/library/yarns', { name: `NaN yarn ${randomUUID()}`, count: { value: v, unit: 'dtex' }, makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' } }),
        `yarn count ${JSON.stringify(v)}`, [400],
      );
    }
    for (const v of ['1e999', '-1e999']) {
      expectRefused(await designer.request('POST', '/api/styles', `{"code":"INF-1","name":"Inf","garmentType":"tank","construction":"seamless","machine":{"kind":"circular","diameterIn":${v},"gauge":28,"feeders":8},"sizes":{"labels":["M"],"base":"M"}}`), `raw ${v}`, [400]);
      expectRefused(await designer.request('PATCH', `/api/styles/${styleId}`, `{"version":${v},"name":"x y"}`), `version ${v}`, [400]);
    }
  });

  it('a prototype key next to valid fields is ignored or refused, never applied', async () => {
    const designer = await as('designer');
    const raw = JSON.stringify({ ...newStyleBody(), status: undefined }).replace(/^\{/, '{"__proto__":{"status":"released","studioId":"x"},"constructor":{"prototype":{"status":"released"}},');
    const res = await designer.request('POST', '/api/styles', raw);
    expectNoFault(res, 'style with __proto__');
    if (res.status === 201) {
      expect(res.json.style.status).toBe('draft');
      const again = (await designer.post('/api/styles', newStyleBody())).json.style;
      expect(again.status).toBe('draft');
    }
  });
});
