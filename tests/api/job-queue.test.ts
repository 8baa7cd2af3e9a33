/**
 * Long exports go through the PostgreSQL job queue, not the request that asked for them: a job put
 * on the queue by anyone (here by the test, as another app server would) is built by the running
 * server's worker; a request answers at once with the job to poll.
 */
import knexFactory, { type Knex } from 'knex';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { as, styleByCode } from './helpers';

let knex: Knex;
let boss: PgBoss;

beforeAll(async () => {
  knex = knexFactory({ client: 'pg', connection: inject('databaseUrl'), pool: { min: 0, max: 2 } });
  // The same queue as the app's (lib/jobs/queue.ts): schema job_queue, queue mill-pack.
  boss = new PgBoss({ connectionString: inject('databaseUrl'), schema: 'job_queue', max: 2, supervise: false, schedule: false });
  boss.on('error', () => {});
  await boss.start();
});
afterAll(async () => {
  await boss?.stop({ graceful: false, wait: false }).catch(() => {});
  await knex?.destroy();
});

async function waitForJob(id: string, ms = 60_000): Promise<{ status: string; file_id: string | null; pages: number | null; error: string }> {
  const end = Date.now() + ms;
  for (;;) {
    const row = await knex('mill_pack_jobs').where({ id }).first('status', 'file_id', 'pages', 'error');
    if (row.status === 'done' || row.status === 'failed' || Date.now() > end) return row;
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe('job queue', () => {
  it('the server created its queue in PostgreSQL', async () => {
    const queues = (await knex.withSchema('job_queue').from('queue').pluck('name')) as string[];
    expect(queues).toContain('mill-pack');
  });

  it('builds a mill pack put on the queue by another process', { timeout: 90_000 }, async () => {
    const ridge = await styleByCode('HF27-101');
    const designer = await knex('users').where({ email: 'designer@hollowfell.example' }).first('id', 'studio_id');
    const [row] = await knex('mill_pack_jobs')
      .insert({ studio_id: designer.studio_id, style_id: ridge.id, release_id: null, requested_by: designer.id, paper: 'letter', step: 'Waiting to start' })
      .returning('id');
    const jobId = (row as { id: string }).id;
    expect(await boss.send('mill-pack', { jobId })).toBeTruthy();
    const done = await waitForJob(jobId);
    expect(done.error).toBe('');
    expect(done.status).toBe('done');
    expect(done.file_id).toBeTruthy();
    expect(done.pages).toBeGreaterThan(3);
  });

  it('a request answers 202 with a queued job, and the queue holds it until a worker builds it', { timeout: 90_000 }, async () => {
    const ridge = await styleByCode('HF27-101');
    const designer = await as('designer');
    const res = await designer.post(`/api/styles/${ridge.id}/mill-pack`, { paper: 'a4' });
    expect(res.status).toBe(202);
    expect(['queued', 'running']).toContain(res.json.job.status);
    const queued = await knex.withSchema('job_queue').from('job').where({ name: 'mill-pack' }).whereRaw("data->>'jobId' = ?", [res.json.job.id]).first('id');
    expect(queued).toBeTruthy();
    expect((await waitForJob(res.json.job.id)).status).toBe('done');
  });
});
