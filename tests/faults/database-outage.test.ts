/**
 * PostgreSQL stopped in the middle of use and started again, against the fault project's own
 * database and app server (tests/setup/fault-env.ts): while it is down the API answers 503 with a
 * clear JSON message (no stack trace, never a 500) and pages show the friendly error page; once it
 * is back the app recovers by itself (same process) and nothing that was saved is lost.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, accounts, anonymous, as, demoPassword, newStyleBody } from '../api/helpers';
import { alive, rowCounts, startDatabase, stopDatabase, until, withDb } from './control';

const rect = (x0: number, y0: number, x1: number, y1: number) => [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];

type Map = { version: number; panels: { id: string; zones: { id: string; name: string; textureId: string }[]; baseTextureId: string }[] };

function withZones(map: Map, names: string[]) {
  const panels = structuredClone(map.panels) as Map['panels'];
  const texture = panels[0]!.baseTextureId;
  panels[0]!.zones = names.map((name, i) => ({
    id: randomUUID(), name, textureId: texture, fn: 'compression', order: i + 1, polygon: rect(10 + i, 100, 60 + i, 300),
  })) as never;
  return panels;
}

/** Text that would mean internals leaked: a stack frame, a source path, an error class name. */
const leak = /\bat [\w.<>]+ \(|node_modules|\.tsx?:\d|\.js:\d|ECONNREFUSED|KnexTimeoutError|Error: /;

function expectClear503(res: { status: number; json: any; text: string; headers: Headers }, what: string) {
  expect(res.status, what).toBe(503);
  expect(res.headers.get('content-type'), what).toMatch(/application\/json/);
  expect(res.json?.error, what).toMatch(/database is unavailable/i);
  expect(res.json?.retryable, what).toBe(true);
  expect(res.text, what).not.toMatch(leak);
}

let designer: Client;
let styleId: string;
let saved: Map;
let before: Record<string, number>;

beforeAll(async () => {
  designer = await as('designer');
  styleId = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Outage test top' })).json.style.id;
  const map = (await designer.get(`/api/styles/${styleId}/body-map`)).json as Map;
  const put = await designer.put(`/api/styles/${styleId}/body-map`, { version: map.version, panels: withZones(map, ['Saved before the outage']) });
  expect(put.status).toBe(200);
  saved = (await designer.get(`/api/styles/${styleId}/body-map`)).json as Map;
  before = await withDb(rowCounts);
});
afterAll(async () => {
  await startDatabase().catch(() => {});
});

describe('PostgreSQL stopped and started again', () => {
  it('while it is down: every API answer is a clear 503 in JSON, pages show the friendly error page', { timeout: 60_000 }, async () => {
    const fresh = new Client('fresh');
    await stopDatabase('fast');
    try {
      const calls: [string, () => ReturnType<Client['get']>][] = [
        ['styles list', () => designer.get('/api/styles')],
        ['style', () => designer.get(`/api/styles/${styleId}`)],
        ['body map read', () => designer.get(`/api/styles/${styleId}/body-map`)],
        ['body map save', () => designer.put(`/api/styles/${styleId}/body-map`, { version: saved.version, panels: withZones(saved, ['During the outage']) })],
        ['style create', () => designer.post('/api/styles', newStyleBody())],
        ['library', () => designer.get('/api/library/yarns')],
        ['me', () => designer.get('/api/auth/me')],
        ['sign-in', () => fresh.post('/api/auth/sign-in', { email: accounts.designer, password: demoPassword })],
      ];
      for (const [what, call] of calls) expectClear503(await call(), what);
      // The bare route does not need the database.
      expect((await anonymous().get('/api/health')).status).toBe(200);

      // A page view: an error answer with the app's HTML shell, which the browser turns into the friendly
      // error page (tests/faults/body-map-outage.test.ts looks at it in Chromium); never internals.
      for (const page of ['/styles', `/styles/${styleId}/body-map`]) {
        const res = await designer.get(page);
        expect(res.status, page).toBeGreaterThanOrEqual(500);
        expect(res.headers.get('content-type'), page).toMatch(/text\/html/);
        expect(res.text, page).toMatch(/digest/);
        expect(res.text, page).not.toMatch(leak);
      }
    } finally {
      await startDatabase();
    }
  });

  it('recovers by itself, in the same app process, with nothing saved lost', { timeout: 60_000 }, async () => {
    const took = await until(async () => (await designer.get('/api/styles')).status === 200, 30_000);
    expect(took).toBeLessThan(30_000);
    expect(alive(inject('serverPid'))).toBe(true);
    const now = (await designer.get(`/api/styles/${styleId}/body-map`)).json as Map;
    expect(now).toEqual(saved);
    expect(await withDb(rowCounts)).toEqual(before);
    // And it writes again.
    const put = await designer.put(`/api/styles/${styleId}/body-map`, { version: now.version, panels: withZones(now, ['After the outage']) });
    expect(put.status).toBe(200);
    saved = (await designer.get(`/api/styles/${styleId}/body-map`)).json as Map;
    // The page works again, too.
    const page = await designer.get('/styles');
    expect(page.status).toBe(200);
  });

  it('a crash-like stop under traffic: only 200, 409 or 503 answers; after recovery the last acknowledged save is there', { timeout: 90_000 }, async () => {
    const admin = await as('admin');
    const sent = new Map<number, string[]>(); // version a save would produce → its zone names
    let version = saved.version;
    let acked = version;
    const statuses: number[] = [];
    const bodies: string[] = [];
    let stopAt = Number.POSITIVE_INFINITY;
    const deadline = Date.now() + 60_000;
    let outageDone = false;
    let okAfterOutage = 0;

    const note = (res: { status: number; text: string }) => {
      statuses.push(res.status);
      if (![200, 409].includes(res.status)) bodies.push(res.text);
      if (outageDone && res.status === 200) okAfterOutage++;
    };
    const enough = () => Date.now() > deadline || (outageDone && okAfterOutage >= 30);

    const saver = async () => {
      let n = 0;
      while (!enough() && n < 2000) {
        n++;
        const names = [`Traffic save ${n}`];
        sent.set(version + 1, names);
        const res = await designer.put(`/api/styles/${styleId}/body-map`, { version, panels: withZones(saved, names) });
        note(res);
        if (res.status === 200) { version = res.json.version; acked = version; }
        if (res.status === 409) version = res.json.currentVersion ?? (await designer.get(`/api/styles/${styleId}/body-map`)).json.version;
        if (res.status === 503) await new Promise((r) => setTimeout(r, 100));
      }
    };
    const reader = async (c: Client) => {
      let n = 0;
      while (!enough() && n < 4000) {
        n++;
        note(await c.get(n % 2 ? '/api/styles' : `/api/styles/${styleId}/body-map`));
        if (statuses.at(-1) === 503) await new Promise((r) => setTimeout(r, 100));
      }
    };
    const outage = async () => {
      await new Promise((r) => setTimeout(r, 1500));
      stopAt = statuses.length;
      await stopDatabase('immediate');
      await new Promise((r) => setTimeout(r, 2500));
      await startDatabase();
      outageDone = true;
    };
    await Promise.all([saver(), reader(designer), reader(admin), outage()]);

    const unexpected = [...new Set(statuses.filter((s) => ![200, 409, 503].includes(s)))];
    expect(unexpected, bodies.slice(0, 3).join('\n')).toEqual([]);
    expect(statuses.slice(stopAt).filter((s) => s === 503).length).toBeGreaterThan(0);
    expect(okAfterOutage).toBeGreaterThanOrEqual(30);
    for (const b of bodies) expect(b).not.toMatch(leak);
    expect(alive(inject('serverPid'))).toBe(true);

    // What the database holds: the last acknowledged save or a later one that was sent, never less; no zone lost or doubled.
    const now = (await designer.get(`/api/styles/${styleId}/body-map`)).json as Map;
    expect(now.version).toBeGreaterThanOrEqual(acked);
    expect(now.panels[0]!.zones.map((z) => z.name)).toEqual(sent.get(now.version));
    const zoneRows = await withDb((knex) => knex('zones as z').join('panels as p', 'p.id', 'z.panel_id').where('p.style_id', styleId).count<{ count: string }[]>('* as count'));
    expect(Number(zoneRows[0]!.count)).toBe(1);
  });
});
