import { db, type Db } from './knex';

/**
 * A studio's settings document (studios.settings: costing, colour, fit, machine limits, test knits),
 * `{}` when none is stored. Each reader picks and checks its own keys. `forUpdate` locks the row,
 * inside a transaction, for a read-modify-write.
 */
export async function studioSettings(studioId: string, q: Db = db(), opts: { forUpdate?: boolean } = {}): Promise<Record<string, unknown>> {
  const query = q('studios').where({ id: studioId });
  const row = (await (opts.forUpdate ? query.forUpdate() : query).first('settings')) as { settings: Record<string, unknown> | null } | undefined;
  return row?.settings ?? {};
}

/** Writes one top-level key of a studio's settings document, leaving the other keys as they are. */
export async function writeStudioSetting(studioId: string, key: string, value: unknown, q: Db = db()): Promise<void> {
  await q('studios').where({ id: studioId }).update({
    settings: q.raw("jsonb_set(coalesce(settings, '{}'::jsonb), array[?]::text[], ?::jsonb, true)", [key, JSON.stringify(value)]),
  });
}
