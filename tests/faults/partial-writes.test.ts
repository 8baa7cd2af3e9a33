/**
 * Uploads and exports that fail half-way leave no partial record: no `files` row, no history entry,
 * no stored object, no changed test knit or sample round. The object store is failed through the
 * fault switch in front of the S3 fake (refused, cut off mid-body, or held while the database goes
 * away), the database through the fault project's own PostgreSQL.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { as, baseUrl, newStyleBody, type Client } from '../api/helpers';
import { s3Mode, s3Switch, startDatabase, stopDatabase, storedKeys, until, withDb } from './control';

const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAIAAAACCAIAAAD91JpzAAAAFklEQVR4nGP8z8DAwMDAxMDAwMDAAAANHQEDasKb6QAAAABJRU5ErkJggg==',
  'base64',
);

async function upload(c: Client, styleId: string, name = 'fault.png') {
  const form = new FormData();
  form.set('file', new Blob([tinyPng], { type: 'image/png' }), name);
  const res = await fetch(`${baseUrl()}/api/styles/${styleId}/files`, { method: 'POST', body: form, headers: { cookie: c.cookie } });
  const text = await res.text();
  let json: any = null;
  try { json = JSON.parse(text); } catch { /* not JSON */ }
  return { status: res.status, json, text };
}

let designer: Client;
let styleId: string;
let studioId: string;

/** What a failed write must not leave behind, for this style. */
async function traces() {
  return withDb(async (knex) => ({
    files: Number((await knex('files').where({ style_id: styleId }).count<{ count: string }[]>('* as count'))[0]!.count),
    audit: (await knex('audit_log').where({ style_id: styleId }).orderBy('id').pluck('action')) as string[],
    objects: await storedKeys(`${studioId}/${styleId}/`),
  }));
}

beforeAll(async () => {
  designer = await as('designer');
  const style = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Partial write test' })).json.style;
  styleId = style.id;
  studioId = await withDb(async (knex) => (await knex('styles').where({ id: styleId }).first('studio_id')).studio_id as string);
  // One good upload first: the store works, and there is something that must stay.
  expect((await upload(designer, styleId, 'kept.png')).status).toBe(201);
});
afterAll(async () => {
  await s3Mode('pass').catch(() => {});
  await startDatabase().catch(() => {});
});

describe('a write that fails half-way leaves nothing behind', () => {
  it('the object store refuses the upload: 503 in JSON, no row, no history entry, no object', async () => {
    const before = await traces();
    await s3Mode('refuse');
    try {
      const res = await upload(designer, styleId);
      expect(res.status).toBe(503);
      expect(res.json.error).toMatch(/storage is unavailable/i);
      expect((await s3Switch()).failedWrites).toBeGreaterThan(0);
    } finally {
      await s3Mode('pass');
    }
    expect(await traces()).toEqual(before);
  });

  it('the object store dies in the middle of the body: 503, nothing kept', async () => {
    const before = await traces();
    await s3Mode('cut');
    try {
      const res = await upload(designer, styleId);
      expect(res.status).toBe(503);
      expect(res.json.retryable).toBe(true);
    } finally {
      await s3Mode('pass');
    }
    expect(await traces()).toEqual(before);
  });

  it('the database goes away after the object was stored: 503, the object is removed again, no row', { timeout: 60_000 }, async () => {
    const before = await traces();
    await s3Mode('hold');
    let res: Awaited<ReturnType<typeof upload>>;
    try {
      const pending = upload(designer, styleId, 'late.png');
      await until(async () => (await s3Switch()).held > 0, 15_000);
      await stopDatabase('immediate');
      await s3Mode('pass'); // the object is stored now; the transaction cannot finish
      res = await pending;
    } finally {
      await s3Mode('pass');
      await startDatabase();
    }
    expect(res.status).toBe(503);
    expect(res.json.error).toMatch(/database is unavailable/i);
    await until(async () => (await designer.get(`/api/styles/${styleId}`)).status === 200, 30_000);
    expect(await traces()).toEqual(before);
  });

  it('a mill pack whose file cannot be stored ends as failed, with its reason, and leaves no file', { timeout: 60_000 }, async () => {
    const before = await traces();
    await s3Mode('refuse');
    let job: { id: string; status: string; error: string; fileId: string | null };
    try {
      const started = await designer.post(`/api/styles/${styleId}/mill-pack`, { paper: 'a4' });
      expect(started.status).toBe(202);
      job = started.json.job;
      await until(async () => {
        job = (await designer.get(`/api/mill-pack-jobs/${job.id}`)).json.job;
        return job.status === 'failed' || job.status === 'done';
      }, 45_000);
    } finally {
      await s3Mode('pass');
    }
    expect(job!.status).toBe('failed');
    expect(job!.fileId).toBeNull();
    expect(job!.error).toMatch(/storage is unavailable/i);
    expect(await traces()).toEqual(before);

    // The same pack with the store back: done, one file, one object.
    const again = (await designer.post(`/api/styles/${styleId}/mill-pack`, { paper: 'a4' })).json.job;
    let done = again;
    await until(async () => {
      done = (await designer.get(`/api/mill-pack-jobs/${again.id}`)).json.job;
      return done.status === 'done' || done.status === 'failed';
    }, 45_000);
    expect(done.status).toBe('done');
    const after = await traces();
    expect(after.files).toBe(before.files + 1);
    expect(after.objects.length).toBe(before.objects.length + 1);
  });

  it('a test-knit photo that cannot be stored leaves the test knit as it was', { timeout: 60_000 }, async () => {
    // A release to the demo mill with one test knit requested.
    const textures = (await designer.get('/api/library/textures')).json.textures as { id: string }[];
    const style = (await designer.post('/api/styles', newStyleBody())).json.style;
    const put = await designer.put(`/api/styles/${style.id}/textures`, { version: style.version, textureIds: [textures[0]!.id] });
    const orgs = (await (await as('admin')).get('/api/organisations')).json.organisations as { id: string; name: string }[];
    const mill = orgs.find((o) => o.name === 'Quellmoor Knitworks')!;
    const release = (await designer.post(`/api/styles/${style.id}/releases`, { version: put.json.version, millIds: [mill.id] })).json.release;
    const knit = (await designer.post(`/api/releases/${release.id}/test-knits`)).json.testKnits[0];
    const millUser = await as('mill');
    const knitRow = () => withDb((knex) => knex('test_knits').where({ id: knit.id }).first());
    const before = await knitRow();
    const filesBefore = await withDb(async (knex) => Number((await knex('files').where({ style_id: style.id }).count<{ count: string }[]>('* as count'))[0]!.count));

    await s3Mode('cut');
    let status: number;
    try {
      const form = new FormData();
      form.set('photo', new Blob([tinyPng], { type: 'image/png' }), 'knit.png');
      form.set('walesPerCm', '20.5');
      form.set('coursesPerCm', '28');
      form.set('gsm', '180');
      status = (await fetch(`${baseUrl()}/api/test-knits/${knit.id}/submission`, { method: 'POST', body: form, headers: { cookie: millUser.cookie } })).status;
    } finally {
      await s3Mode('pass');
    }
    expect(status).toBe(503);
    expect(await knitRow()).toEqual(before);
    const filesAfter = await withDb(async (knex) => Number((await knex('files').where({ style_id: style.id }).count<{ count: string }[]>('* as count'))[0]!.count));
    expect(filesAfter).toBe(filesBefore);
    expect(await storedKeys(`${studioId}/${style.id}/`)).toEqual([]);
  });

  it('a sample-round photo that cannot be stored leaves the round, the style version and the history as they were', { timeout: 60_000 }, async () => {
    const style = (await designer.get(`/api/styles/${styleId}`)).json.style;
    const round = (await designer.post(`/api/styles/${styleId}/fit/rounds`, { version: style.version, kind: 'proto', size: 'M', measurements: { 'chest-half': 31 } })).json;
    expect(round.round).toBeDefined();
    const before = await traces();
    await s3Mode('refuse');
    let res: { status: number; json: any };
    try {
      const form = new FormData();
      form.set('photo', new Blob([tinyPng], { type: 'image/png' }), 'front.png');
      const r = await fetch(`${baseUrl()}/api/styles/${styleId}/fit/rounds/${round.round.id}/photos`, { method: 'POST', body: form, headers: { cookie: designer.cookie } });
      res = { status: r.status, json: await r.json() };
    } finally {
      await s3Mode('pass');
    }
    expect(res.status).toBe(503);
    expect(res.json.error).toMatch(/storage is unavailable/i);
    expect(await traces()).toEqual(before);
    const fit = (await designer.get(`/api/styles/${styleId}/fit`)).json.fit;
    expect(fit.version).toBe(round.fit.version);
    expect(fit.rounds[0].photos).toEqual([]);
  });

  it('exports while the database is down answer 503 in JSON (they write nothing)', { timeout: 60_000 }, async () => {
    await stopDatabase('fast');
    try {
      const res = await designer.get(`/api/styles/${styleId}/exports/swatch-sheet.pdf`);
      expect(res.status).toBe(503);
      expect(res.json.error).toMatch(/database is unavailable/i);
    } finally {
      await startDatabase();
    }
    await until(async () => (await designer.get(`/api/styles/${styleId}/exports/yarn-list.csv`)).status === 200, 30_000);
  });
});
