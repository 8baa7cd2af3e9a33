/**
 * Backup and restore with db/backup.sh and db/restore.sh: the test database (demo data plus what
 * the earlier test files wrote) is dumped, restored into a new database, and every table compared
 * row by row (count and a digest of the rows in a fixed order); then the copy is damaged (rows
 * wiped, a table dropped), restored over with --replace, and compared again. A restore into a
 * database that holds tables, without --replace, is refused and changes nothing.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';

const run = promisify(execFile);
const root = path.resolve(import.meta.dirname, '../..');

/** Per table: its row count and an md5 of all its rows as text, in text order. */
async function snapshot(knex: Knex): Promise<Record<string, { rows: number; digest: string }>> {
  const tables = (await knex('pg_tables').where({ schemaname: 'public' }).orderBy('tablename').pluck('tablename')) as string[];
  const out: Record<string, { rows: number; digest: string }> = {};
  for (const t of tables) {
    const r = (await knex.raw(`select count(*)::int as rows, coalesce(md5(string_agg(x::text, E'\\n' order by x::text)), '') as digest from "${t}" x`)).rows[0];
    out[t] = { rows: r.rows, digest: r.digest };
  }
  return out;
}

const source = inject('databaseUrl');
const copyName = `needlemap_restore_${Date.now()}_${process.pid}`;
const copyUrl = (() => { const u = new URL(source); u.pathname = `/${copyName}`; return u.toString(); })();
const adminUrl = (() => { const u = new URL(source); u.pathname = '/postgres'; return u.toString(); })();
let dir: string;
let src: Knex;

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'needlemap-backup-'));
  src = knexFactory({ client: 'pg', connection: source, pool: { min: 0, max: 2 } });
  // Mill packs still being built by earlier test files would change the source mid-comparison.
  for (let i = 0; i < 120; i++) {
    const busy = Number(((await src('mill_pack_jobs').whereIn('status', ['queued', 'running']).count<{ count: string }[]>('* as count'))[0]!).count);
    if (busy === 0) break;
    await new Promise((r) => setTimeout(r, 250));
  }
});
afterAll(async () => {
  await src?.destroy();
  const admin = knexFactory({ client: 'pg', connection: adminUrl, pool: { min: 0, max: 1 } });
  await admin.raw(`drop database if exists "${copyName}" with (force)`);
  await admin.destroy();
  rmSync(dir, { recursive: true, force: true });
});

describe('backup and restore', () => {
  let dump = '';

  it('db/backup.sh writes one timestamped dump of the database in DATABASE_URL', { timeout: 60_000 }, async () => {
    const { stdout } = await run('bash', [path.join(root, 'db/backup.sh')], { env: { ...process.env, DATABASE_URL: source, NEEDLEMAP_BACKUP_DIR: dir } });
    dump = stdout.trim().split('\n').at(-1)!;
    expect(path.dirname(dump)).toBe(dir);
    expect(path.basename(dump)).toMatch(/^needlemap_test_.+-\d{8}T\d{6}Z(-\d+)?\.dump$/);
    expect(readdirSync(dir)).toEqual([path.basename(dump)]); // no partial file left beside it
    expect(statSync(dump).size).toBeGreaterThan(1000);
  });

  it('db/restore.sh restores it into a new database: every table, every row the same', { timeout: 90_000 }, async () => {
    const before = await snapshot(src);
    await run('bash', [path.join(root, 'db/restore.sh'), dump], { env: { ...process.env, DATABASE_URL: copyUrl } });
    const copy = knexFactory({ client: 'pg', connection: copyUrl, pool: { min: 0, max: 2 } });
    try {
      const after = await snapshot(copy);
      expect(Object.keys(after)).toEqual(Object.keys(before));
      expect(Object.keys(after).length).toBeGreaterThan(20);
      expect(after.styles!.rows).toBeGreaterThan(5);
      expect(after).toEqual(before);
      // The restored database works as one: its migrations are recorded, its sequences go on.
      expect(Number((await copy('knex_migrations').count<{ count: string }[]>('* as count'))[0]!.count)).toBe(before.knex_migrations!.rows);
    } finally {
      await copy.destroy();
    }
  });

  it('refuses to restore over tables without --replace; with it, a damaged copy comes back whole', { timeout: 90_000 }, async () => {
    const copy = knexFactory({ client: 'pg', connection: copyUrl, pool: { min: 0, max: 2 } });
    try {
      const expected = await snapshot(copy);
      await copy.raw('truncate table zones, panels');
      await copy('audit_log').del();
      await copy.raw('drop table trims cascade');
      await copy.raw("create table stray_table (id int)");

      const refused = await run('bash', [path.join(root, 'db/restore.sh'), dump], { env: { ...process.env, DATABASE_URL: copyUrl } }).then(() => null, (e: Error & { stderr?: string }) => e);
      expect(refused).not.toBeNull();
      expect(refused!.stderr).toMatch(/--replace/);
      expect(await copy.schema.hasTable('stray_table')).toBe(true); // nothing changed

      await run('bash', [path.join(root, 'db/restore.sh'), dump, '--replace'], { env: { ...process.env, DATABASE_URL: copyUrl } });
      expect(await snapshot(copy)).toEqual(expected);
    } finally {
      await copy.destroy();
    }
  });
});
