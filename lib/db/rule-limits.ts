import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { studioSettings, writeStudioSetting } from './studio-settings';
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
  return resolveRuleLimits(((await studioSettings(studioId, q)).ruleLimits as Record<string, unknown> | undefined) ?? null);
}

/** Writes studios.settings.ruleLimits (a null value goes back to the default). Admin only. */
export async function setStudioRuleLimits(user: SessionUser, input: RuleLimitsInput, q: Knex = db()): Promise<StudioRuleLimits> {
  if (!can(user.role, 'studio:settings')) throw forbidden();
  const set = Object.fromEntries(Object.entries(input).filter(([, v]) => v !== null));
  await q.transaction(async (trx) => {
    await writeStudioSetting(user.studioId, 'ruleLimits', set, trx);
    await trx('audit_log').insert({ studio_id: user.studioId, user_id: user.id, action: 'studio.rule-limits', details: JSON.stringify({ set }) });
  });
  return studioRuleLimits(user.studioId, q);
}
