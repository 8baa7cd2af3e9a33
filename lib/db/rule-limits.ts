import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { forbidden } from '@/lib/api/errors';
import { can } from '@/lib/auth/roles';
import { resolveRuleLimits, type StudioRuleLimits } from '@/lib/rules/limits';
import type { RuleLimitsInput } from '@/lib/validations/rule-limits';

/**
 * The studio's stitch-rule limits (studios.settings.ruleLimits), with the default where none is set.
 * Unguarded: every view that runs the rules for the studio's styles reads them.
 */
export async function studioRuleLimits(studioId: string, q: Db = db()): Promise<StudioRuleLimits> {
  const row = (await q('studios').where({ id: studioId }).first('settings')) as { settings: { ruleLimits?: Record<string, unknown> } } | undefined;
  return resolveRuleLimits(row?.settings?.ruleLimits ?? null);
}

/** Writes studios.settings.ruleLimits (a null value goes back to the default). Admin only. */
export async function setStudioRuleLimits(user: SessionUser, input: RuleLimitsInput, q: Knex = db()): Promise<StudioRuleLimits> {
  if (!can(user.role, 'studio:settings')) throw forbidden();
  const set = Object.fromEntries(Object.entries(input).filter(([, v]) => v !== null));
  await q.transaction(async (trx) => {
    await trx('studios').where({ id: user.studioId }).update({
      settings: trx.raw("jsonb_set(coalesce(settings, '{}'::jsonb), '{ruleLimits}', ?::jsonb, true)", [JSON.stringify(set)]),
    });
    await trx('audit_log').insert({ studio_id: user.studioId, user_id: user.id, action: 'studio.rule-limits', details: JSON.stringify({ set }) });
  });
  return studioRuleLimits(user.studioId, q);
}
