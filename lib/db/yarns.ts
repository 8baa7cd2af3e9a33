import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';
import type { CountUnit } from '@/lib/knit/count';
import type { LabColour, Yarn, YarnColour, YarnFibre } from '@/lib/knit/yarn';
import {
  yarnEntryOf, yarnInputSchema, type ColourState, type Lustre, type StoredMakeUp, type YarnInput, type YarnPatch,
} from '@/lib/validations/library';

/** A yarn of the studio library: the lib/knit `Yarn` plus what the library keeps about it. */
export interface LibraryYarn extends Yarn {
  supplierRef: string;
  countUnit: CountUnit;
  lustre: Lustre | null;
  staple: boolean;
  makeUp: StoredMakeUp;
  pricePerKg: number | null;
  recycledShare: number | null;
  version: number;
  createdAt: string;
  updatedAt: string;
  archivedAt: string | null;
}

interface YarnRow {
  id: string; studio_id: string; name: string; supplier_ref: string; dtex: number; count_unit: CountUnit;
  filaments: number | null; lustre: Lustre | null; staple: boolean; make_up: StoredMakeUp; fibres: YarnFibre[];
  colour_state: ColourState; colour_lab: LabColour | null; price_per_kg: string | null; recycled_share: number | null;
  version: number; created_at: Date; updated_at: Date; archived_at: Date | null;
}

function colourOf(r: YarnRow): YarnColour {
  if (r.colour_state === 'dyeable' || !r.colour_lab) return { state: 'dyeable' };
  return { state: r.colour_state, lab: r.colour_lab };
}

function toYarn(r: YarnRow): LibraryYarn {
  return {
    id: r.id,
    name: r.name,
    dtex: r.dtex,
    fibres: r.fibres,
    colour: colourOf(r),
    ...(r.filaments !== null ? { filaments: r.filaments } : {}),
    supplierRef: r.supplier_ref,
    countUnit: r.count_unit,
    lustre: r.lustre,
    staple: r.staple,
    makeUp: r.make_up,
    pricePerKg: r.price_per_kg === null ? null : Number(r.price_per_kg),
    recycledShare: r.recycled_share,
    version: r.version,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    archivedAt: r.archived_at ? r.archived_at.toISOString() : null,
  };
}

function columnsOf(input: YarnInput) {
  return {
    name: input.name,
    supplier_ref: input.supplierRef,
    dtex: input.dtex,
    count_unit: input.countUnit,
    filaments: input.filaments,
    lustre: input.lustre,
    staple: input.staple,
    make_up: JSON.stringify(input.makeUp),
    fibres: JSON.stringify(input.fibres),
    colour_state: input.colour.state,
    colour_lab: input.colour.state === 'dyeable' ? null : JSON.stringify(input.colour.lab),
    price_per_kg: input.pricePerKg,
    recycled_share: input.recycledShare,
  };
}

const nameTaken = () =>
  new HttpError(400, 'Some fields need attention.', { fieldErrors: { name: ['A yarn of this name is already in the library'] } });

function uniqueViolation(err: unknown): boolean {
  return !!err && typeof err === 'object' && (err as { code?: string }).code === '23505';
}

/** A yarn as an account may see it: prices are the studio's own and never reach mill or client accounts. */
export function yarnForViewer<T extends LibraryYarn>(user: SessionUser, yarn: T): T {
  return isOutsideRole(user.role) ? { ...yarn, pricePerKg: null } : yarn;
}

/** The studio's yarns that are not archived, by name. */
export async function listYarns(user: SessionUser, q: Db = db()): Promise<LibraryYarn[]> {
  const rows = (await q('yarns').where({ studio_id: user.studioId }).whereNull('archived_at').orderBy('name')) as YarnRow[];
  return rows.map(toYarn);
}

/** One yarn of the studio (archived ones too, so old references still read); null when not the studio's. */
export async function findYarn(user: SessionUser, id: string, q: Db = db()): Promise<LibraryYarn | null> {
  const row = (await q('yarns').where({ id, studio_id: user.studioId }).first()) as YarnRow | undefined;
  return row ? toYarn(row) : null;
}

/** Yarns of a studio by id (archived included), for reading textures. */
export async function yarnsByIds(studioId: string, ids: readonly string[], q: Db = db()): Promise<LibraryYarn[]> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return [];
  const rows = (await q('yarns').where({ studio_id: studioId }).whereIn('id', unique).orderBy('name')) as YarnRow[];
  return rows.map(toYarn);
}

export async function createYarn(user: SessionUser, input: YarnInput, q: Knex = db()): Promise<LibraryYarn> {
  return q.transaction(async (trx) => {
    let row: YarnRow;
    try {
      [row] = (await trx('yarns')
        .insert({ studio_id: user.studioId, created_by: user.id, ...columnsOf(input) })
        .returning('*')) as [YarnRow];
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'yarn.create', details: JSON.stringify({ yarnId: row.id, name: input.name }),
    });
    return toYarn(row);
  });
}

/**
 * Applies a patch when `patch.version` is the stored version; otherwise 409 and nothing changes.
 * The patched yarn is validated whole (a count change re-reads the make-up, and so on).
 */
export async function updateYarn(user: SessionUser, id: string, patch: YarnPatch, q: Knex = db()): Promise<LibraryYarn> {
  return q.transaction(async (trx) => {
    const current = await findYarn(user, id, trx);
    if (!current || current.archivedAt) throw notFound('Yarn not found.');
    const { version, ...changes } = patch;
    const defined = Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined));
    const input = yarnInputSchema.parse({ ...yarnEntryOf(current), ...defined });
    let n: number;
    try {
      n = await trx('yarns')
        .where({ id, studio_id: user.studioId, version })
        .whereNull('archived_at')
        .update({ ...columnsOf(input), version: trx.raw('version + 1'), updated_at: trx.fn.now() });
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    if (n === 0) {
      throw conflict('Someone saved this yarn after you opened it. Reload to see their changes.', { currentVersion: current.version });
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'yarn.update', details: JSON.stringify({ yarnId: id, fields: Object.keys(defined) }),
    });
    const updated = await findYarn(user, id, trx);
    if (!updated) throw notFound('Yarn not found.');
    return updated;
  });
}

/** Names of the active textures whose feeders use the yarn. */
export async function texturesUsingYarn(studioId: string, yarnId: string, q: Db = db()): Promise<string[]> {
  return (await q('textures')
    .where({ studio_id: studioId })
    .whereNull('archived_at')
    .where((w) =>
      w
        .whereRaw('feeders @> ?::jsonb', [JSON.stringify([{ ground: yarnId }])])
        .orWhereRaw('feeders @> ?::jsonb', [JSON.stringify([{ plated: { yarn: yarnId } }])]),
    )
    .orderBy('name')
    .pluck('name')) as string[];
}

/** Archives the yarn (kept, hidden from the library); refused while an active texture feeds it. */
export async function archiveYarn(user: SessionUser, id: string, version: number, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    const current = await trx('yarns').where({ id, studio_id: user.studioId }).whereNull('archived_at').forUpdate().first();
    if (!current) throw notFound('Yarn not found.');
    if (current.version !== version) {
      throw conflict('Someone saved this yarn after you opened it. Reload to see their changes before archiving it.', { currentVersion: current.version });
    }
    const users = await texturesUsingYarn(user.studioId, id, trx);
    if (users.length > 0) {
      throw conflict(`This yarn feeds ${users.length === 1 ? 'a texture' : `${users.length} textures`} (${users.join(', ')}). Change their feeders first.`, { textures: users });
    }
    await trx('yarns')
      .where({ id, studio_id: user.studioId })
      .update({ archived_at: trx.fn.now(), updated_at: trx.fn.now(), version: trx.raw('version + 1') });
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'yarn.archive', details: JSON.stringify({ yarnId: id, name: current.name }),
    });
  });
}
