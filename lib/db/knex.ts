import knexFactory, { type Knex } from 'knex';
import config from '@/knexfile';

const globalForDb = globalThis as unknown as { needlemapDb?: Knex };

/** One Knex instance per server process (kept on globalThis so dev reloads don't leak pools). */
export function db(): Knex {
  if (!globalForDb.needlemapDb) {
    globalForDb.needlemapDb = knexFactory({
      ...config,
      connection: process.env.DATABASE_URL ?? (config.connection as string),
      pool: { min: 0, max: 10, acquireTimeoutMillis: 5000, createTimeoutMillis: 3000 },
      acquireConnectionTimeout: 5000,
    });
  }
  return globalForDb.needlemapDb;
}

export type Db = Knex | Knex.Transaction;
