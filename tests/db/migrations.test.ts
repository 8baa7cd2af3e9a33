import { inject, describe, expect, it } from 'vitest';
import knexFactory from 'knex';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

describe('migrations', () => {
  it('migrate up and all the way down on a fresh database, then up again', async () => {
    const url = new URL(inject('databaseUrl'));
    const name = `needlemap_migr_${Date.now()}`;
    const adminUrl = new URL(url.toString());
    adminUrl.pathname = '/postgres';
    const admin = knexFactory({ client: 'pg', connection: adminUrl.toString() });
    await admin.raw(`create database "${name}"`);
    const dbUrl = new URL(url.toString());
    dbUrl.pathname = `/${name}`;
    const knex = knexFactory({
      client: 'pg',
      connection: dbUrl.toString(),
      migrations: { directory: path.join(root, 'db/migrations'), extension: 'ts', loadExtensions: ['.ts'] },
    });
    try {
      const [, applied] = await knex.migrate.latest();
      expect(applied.length).toBeGreaterThan(0);
      const tables = await knex('information_schema.tables').where({ table_schema: 'public' }).pluck('table_name');
      expect(tables).toEqual(expect.arrayContaining(['studios', 'users', 'styles', 'style_shares', 'audit_log', 'organisations']));
      await knex.migrate.rollback(undefined, true);
      const after = await knex('information_schema.tables').where({ table_schema: 'public' }).whereNot('table_name', 'like', 'knex_%').pluck('table_name');
      expect(after).toEqual([]);
      const [, again] = await knex.migrate.latest();
      expect(again.length).toBe(applied.length);
    } finally {
      await knex.destroy();
      await admin.raw(`drop database if exists "${name}" with (force)`);
      await admin.destroy();
    }
  });
});
