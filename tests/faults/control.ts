/**
 * Fault controls for the fault tests: stop and start the fault project's own PostgreSQL (never the
 * shared one), switch the S3 fault switch, and read the database directly.
 */
import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import { inject } from 'vitest';
import knexFactory, { type Knex } from 'knex';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';

const run = promisify(execFile);
const root = path.resolve(import.meta.dirname, '../..');

function pgEnv(extra: Record<string, string> = {}) {
  return {
    ...process.env,
    NEEDLEMAP_PG_PORT: inject('faultPgPort'),
    NEEDLEMAP_PGDATA: inject('faultPgData'),
    NEEDLEMAP_PG_FSYNC: 'off',
    NEEDLEMAP_DB: 'needlemap_faults',
    ...extra,
  };
}

/** Stops the fault project's PostgreSQL: `fast` ends sessions cleanly, `immediate` is crash-like. */
export async function stopDatabase(mode: 'fast' | 'immediate' = 'fast') {
  await run('bash', [path.join(root, 'db/setup.sh'), 'stop'], { env: pgEnv({ NEEDLEMAP_PG_STOP_MODE: mode }) });
}

export async function startDatabase() {
  await run('bash', [path.join(root, 'db/setup.sh'), 'start'], { env: pgEnv() });
}

/** Sets the fault switch in front of the S3 fake (see faultSwitch in tests/setup/fault-env.ts). */
export async function s3Mode(mode: 'pass' | 'refuse' | 'cut' | 'hold'): Promise<void> {
  const res = await fetch(`${inject('faultSwitchUrl')}?mode=${mode}`, { method: 'POST' });
  if (!res.ok) throw new Error(`fault switch answered ${res.status}`);
}
/** Writes refused or cut since the last switch, and writes held now. */
export async function s3Switch(): Promise<{ failedWrites: number; held: number }> {
  return (await (await fetch(inject('faultSwitchUrl'))).json()) as { failedWrites: number; held: number };
}

/** Keys of the objects stored in the S3 fake under `prefix` (read straight from the fake, not through the switch). */
export async function storedKeys(prefix: string): Promise<string[]> {
  const client = new S3Client({
    region: 'us-east-1', endpoint: inject('s3Endpoint'), forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
  try {
    const res = await client.send(new ListObjectsV2Command({ Bucket: inject('s3Bucket'), Prefix: prefix }));
    return (res.Contents ?? []).map((o) => o.Key ?? '');
  } finally {
    client.destroy();
  }
}

/**
 * Runs `fn` with a direct connection to the fault database, closed again afterwards (an idle
 * connection left open would only log its own loss when the database is stopped).
 */
export async function withDb<T>(fn: (knex: Knex) => Promise<T>): Promise<T> {
  const knex = knexFactory({ client: 'pg', connection: inject('databaseUrl'), pool: { min: 0, max: 2 } });
  try {
    return await fn(knex);
  } finally {
    await knex.destroy();
  }
}

/** Row counts of every table of the public schema (the migrations table included). */
export async function rowCounts(knex: Knex): Promise<Record<string, number>> {
  const tables = (await knex('pg_tables').where({ schemaname: 'public' }).orderBy('tablename').pluck('tablename')) as string[];
  const out: Record<string, number> = {};
  for (const t of tables) out[t] = Number(((await knex(t).count<{ count: string }[]>('* as count'))[0]!).count);
  return out;
}

/** True when the process with this id still runs. */
export function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** Retries `fn` every 250 ms until it returns true or `ms` pass; answers the time it took. */
export async function until(fn: () => Promise<boolean>, ms: number): Promise<number> {
  const start = Date.now();
  while (Date.now() - start < ms) {
    try {
      if (await fn()) return Date.now() - start;
    } catch {
      /* not yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`not reached within ${ms} ms`);
}
