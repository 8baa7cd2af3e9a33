import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { forbidden } from '@/lib/api/errors';
import { can } from '@/lib/auth/roles';
import { studioColourSettings, type StudioColourSettings } from './colourways';
import type { ColourSettingsInput } from '@/lib/validations/colour-settings';

/** The studio's colour settings, with the ones left at the product default. Studio staff only. */
export async function readColourSettings(user: SessionUser, q: Db = db()): Promise<StudioColourSettings> {
  if (!can(user.role, 'library:read')) throw forbidden();
  return studioColourSettings(user.studioId, q);
}

/**
 * Writes studios.settings.labDipTolerance and .lowContrastDeltaE (a null removes the key, so the
 * product default applies). Lab dips already sent keep the tolerance they were judged by. Written
 * to the audit log.
 */
export async function setColourSettings(user: SessionUser, input: ColourSettingsInput, q: Knex = db()): Promise<StudioColourSettings> {
  if (!can(user.role, 'colour:edit')) throw forbidden();
  await q.transaction(async (trx) => {
    const set = { labDipTolerance: input.tolerance, lowContrastDeltaE: input.lowContrastDeltaE };
    const keep = Object.fromEntries(Object.entries(set).filter(([, v]) => v !== null));
    const drop = Object.keys(set).filter((k) => !(k in keep));
    await trx('studios').where({ id: user.studioId }).update({
      settings: trx.raw("(coalesce(settings, '{}'::jsonb) - ?::text[]) || ?::jsonb", [drop, JSON.stringify(keep)]),
    });
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'studio.colour', details: JSON.stringify({ set: Object.keys(keep), defaults: drop }),
    });
  });
  return studioColourSettings(user.studioId, q);
}
