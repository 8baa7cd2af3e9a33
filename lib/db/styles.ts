import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { canonicalJson } from './changed-keys';
import { isOutsideRole } from '@/lib/auth/roles';
import type { SessionUser } from './users';
import type {
  Construction, GarmentType, MachineSetup, SizeRange, StyleCreate, StylePatch, StyleStatus,
} from '@/lib/validations/style';
import { conflict, HttpError, notFound } from '@/lib/api/errors';

export interface StyleShare { organisationId: string; name: string; kind: 'mill' | 'client' }

export interface Style {
  id: string;
  code: string;
  name: string;
  season: string;
  clientId: string | null;
  clientName: string | null;
  garmentType: GarmentType;
  construction: Construction;
  machine: MachineSetup;
  sizes: SizeRange;
  status: StyleStatus;
  revision: number;
  version: number;
  authorName: string | null;
  createdAt: string;
  updatedAt: string;
  shares: StyleShare[];
}

/**
 * Styles the user may see: their studio's, not archived, and for outside accounts only those
 * shared with their organisation. Every style query starts here.
 */
export function visibleStyles(user: SessionUser, q: Db = db()): Knex.QueryBuilder {
  const qb = q('styles as st').where('st.studio_id', user.studioId).whereNull('st.archived_at');
  if (isOutsideRole(user.role)) {
    qb.whereExists(
      q('style_shares as sh').whereRaw('sh.style_id = st.id').andWhere('sh.organisation_id', user.organisationId ?? ''),
    );
  }
  return qb;
}

interface StyleRow {
  id: string; code: string; name: string; season: string; client_id: string | null; client_name: string | null;
  garment_type: GarmentType; construction: Construction; machine: MachineSetup; sizes: SizeRange;
  status: StyleStatus; revision: number; version: number; author_name: string | null;
  created_at: string; updated_at: string; shares: StyleShare[] | null;
}

function toStyle(r: StyleRow): Style {
  return {
    id: r.id, code: r.code, name: r.name, season: r.season, clientId: r.client_id, clientName: r.client_name,
    garmentType: r.garment_type, construction: r.construction, machine: r.machine, sizes: r.sizes,
    status: r.status, revision: r.revision, version: r.version, authorName: r.author_name,
    createdAt: r.created_at, updatedAt: r.updated_at, shares: r.shares ?? [],
  };
}

/** A timestamp as `Date.toISOString` writes it (UTC, milliseconds), read as text: no Date made and written back per row. */
const isoSql = (column: string, as: string) => `to_char(${column} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') as ${as}`;

/**
 * The style columns of `st` and its shares, for the styles `qb` selects. The shares of all those
 * styles are gathered in one grouped join (one `json_agg` per style), not a lookup per row; `styleId`
 * narrows it to one style. Outside accounts see only their own organisation among the shares.
 */
function selectStyle(qb: Knex.QueryBuilder, q: Db, user: SessionUser, styleId?: string): Knex.QueryBuilder {
  const shares = q('style_shares as sh')
    .join('organisations as o', 'o.id', 'sh.organisation_id')
    .join('styles as ss', 'ss.id', 'sh.style_id')
    .where('ss.studio_id', user.studioId)
    .modify((b) => {
      if (styleId) b.andWhere('sh.style_id', styleId);
      if (isOutsideRole(user.role)) b.andWhere('sh.organisation_id', user.organisationId);
    })
    .groupBy('sh.style_id')
    .select('sh.style_id', q.raw(`json_agg(json_build_object('organisationId', o.id, 'name', o.name, 'kind', o.kind) order by o.kind, o.name) as shares`));
  return qb
    .leftJoin('organisations as c', 'c.id', 'st.client_id')
    .leftJoin('users as au', 'au.id', 'st.created_by')
    .leftJoin(shares.as('shs'), 'shs.style_id', 'st.id')
    .select(
      'st.id', 'st.code', 'st.name', 'st.season', 'st.client_id', 'c.name as client_name', 'st.garment_type',
      'st.construction', 'st.machine', 'st.sizes', 'st.status', 'st.revision', 'st.version',
      'au.name as author_name', q.raw(isoSql('st.created_at', 'created_at')), q.raw(isoSql('st.updated_at', 'updated_at')), 'shs.shares',
    );
}

export async function listStyles(
  user: SessionUser,
  filter: { q?: string; status?: StyleStatus; clientId?: string } = {},
  q: Db = db(),
): Promise<Style[]> {
  const qb = visibleStyles(user, q);
  if (filter.q) {
    const like = `%${filter.q.replace(/[\\%_]/g, (m) => `\\${m}`)}%`;
    qb.where((w) => w.whereILike('st.code', like).orWhereILike('st.name', like).orWhereILike('st.season', like));
  }
  if (filter.status) qb.andWhere('st.status', filter.status);
  if (filter.clientId) qb.andWhere('st.client_id', filter.clientId);
  const rows = (await selectStyle(qb, q, user).orderBy('st.updated_at', 'desc').limit(1000)) as StyleRow[];
  return rows.map(toStyle);
}

export async function findStyle(user: SessionUser, id: string, q: Db = db()): Promise<Style | null> {
  return (await findStyleWith(user, id, {}, q))?.style ?? null;
}

/**
 * `findStyle` with more values computed for the style's row (`st`) in the same query, e.g. its
 * panels: one round trip to the database instead of two. `columns` names each value's SQL.
 */
export async function findStyleWith<E extends Record<string, unknown>>(
  user: SessionUser,
  id: string,
  columns: { [K in keyof E]: Knex.Raw },
  q: Db = db(),
): Promise<(E & { style: Style }) | null> {
  const names = Object.keys(columns) as (keyof E & string)[];
  const row = (await selectStyle(visibleStyles(user, q).andWhere('st.id', id), q, user, id)
    .select(names.map((k) => q.raw(`? as ??`, [columns[k], `x_${k}`])))
    .first()) as (StyleRow & Record<string, unknown>) | undefined;
  if (!row) return null;
  const extra = Object.fromEntries(names.map((k) => [k, row[`x_${k}`]])) as E;
  return { ...extra, style: toStyle(row) };
}

/**
 * The versions of everything computed from a style, as one text: the style's version (raised by
 * every write to the style, its body map, its texture list, its fit and its releases), and a digest
 * of the id and version of each of its trims and colourways and of the studio's library textures,
 * yarns and colour standards (those carry versions of their own and change without the style), and
 * the studio's settings. Equal texts: equal data. Library rows are never deleted (they are
 * archived, which raises their version); trims are, and drop out of the digest.
 */
const dataStampSql = `concat_ws('/', st.version,
  (select md5(coalesce(string_agg(x.id::text || ':' || x.version, ',' order by x.id), '')) from trims x where x.style_id = st.id),
  (select md5(coalesce(string_agg(x.id::text || ':' || x.version, ',' order by x.id), '')) from colourways x where x.style_id = st.id),
  (select md5(coalesce(string_agg(x.id::text || ':' || x.version, ',' order by x.id), '')) from textures x where x.studio_id = st.studio_id),
  (select md5(coalesce(string_agg(x.id::text || ':' || x.version, ',' order by x.id), '')) from yarns x where x.studio_id = st.studio_id),
  (select md5(coalesce(string_agg(x.id::text || ':' || x.version, ',' order by x.id), '')) from colour_standards x where x.studio_id = st.studio_id),
  (select md5(coalesce(x.settings::text, '')) from studios x where x.id = st.studio_id))`;

/**
 * `findStyle` with the stamp of the style's data (see `dataStampSql`), in one query: the key of
 * the caches of computed figures and exports. Read the stamp before the data it stands for, so a
 * value kept under a stamp is never older than the stamp.
 */
export async function findStyleStamped(user: SessionUser, id: string, q: Db = db()): Promise<{ style: Style; stamp: string } | null> {
  return findStyleWith<{ stamp: string }>(user, id, { stamp: q.raw(dataStampSql) }, q);
}

/** The client organisation's name; 400 when it is not a client organisation of the studio. */
async function assertClientOfStudio(user: SessionUser, clientId: string | null | undefined, q: Db): Promise<string | null> {
  if (!clientId) return null;
  const org = (await q('organisations').where({ id: clientId, studio_id: user.studioId, kind: 'client' }).first('name')) as { name: string } | undefined;
  if (!org) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { clientId: ['Unknown client'] } });
  return org.name;
}

function uniqueViolation(err: unknown): boolean {
  return !!err && typeof err === 'object' && (err as { code?: string }).code === '23505';
}

const codeTaken = () =>
  new HttpError(400, 'Some fields need attention.', { fieldErrors: { code: ['This style code is already used in your studio'] } });

export async function createStyle(user: SessionUser, input: StyleCreate, q: Knex = db()): Promise<Style> {
  return q.transaction(async (trx) => {
    await assertClientOfStudio(user, input.clientId, trx);
    let id: string;
    try {
      const [row] = await trx('styles')
        .insert({
          studio_id: user.studioId,
          code: input.code,
          name: input.name,
          season: input.season,
          client_id: input.clientId,
          garment_type: input.garmentType,
          construction: input.construction,
          machine: JSON.stringify(input.machine),
          sizes: JSON.stringify(input.sizes),
          status: input.status,
          created_by: user.id,
        })
        .returning('id');
      id = (row as { id: string }).id;
    } catch (err) {
      if (uniqueViolation(err)) throw codeTaken();
      throw err;
    }
    if (input.clientId) {
      await trx('style_shares').insert({ style_id: id, organisation_id: input.clientId, shared_by: user.id }).onConflict().ignore();
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: id, user_id: user.id, action: 'style.create',
      details: JSON.stringify({ code: input.code, name: input.name }),
    });
    const style = await findStyle(user, id, trx);
    if (!style) throw notFound();
    return style;
  });
}

/** The short text fields of a style, logged in the history as from → to. */
const scalarFields = [
  ['code', 'code'], ['name', 'name'], ['season', 'season'],
  ['garmentType', 'garment_type'], ['construction', 'construction'], ['status', 'status'],
] as const satisfies readonly (readonly [keyof StylePatch & keyof Style, string])[];

/**
 * Applies a patch when `patch.version` is the stored version; otherwise 409 and nothing changes.
 * Only the fields whose value differs from the stored one are written and logged (short fields as
 * from → to); a patch that changes nothing answers the style as it is, without a new version. A new
 * client is given access and the former client's access ends, in the same transaction.
 */
export async function updateStyle(user: SessionUser, id: string, patch: StylePatch, q: Knex = db()): Promise<Style> {
  return q.transaction(async (trx) => {
    const current = await findStyle(user, id, trx);
    if (!current) throw notFound('Style not found.');
    const stale = () =>
      conflict('Someone saved this style after you opened it. Reload to see their changes.', { currentVersion: current.version });
    const construction = patch.construction ?? current.construction;
    const machine = patch.machine ?? current.machine;
    if ((construction === 'seamless') !== (machine.kind === 'circular')) {
      throw new HttpError(400, 'Some fields need attention.', {
        fieldErrors: { 'machine.kind': ['Seamless styles use a circular machine; flat styles a V-bed'] },
      });
    }
    const clientName = await assertClientOfStudio(user, patch.clientId, trx);
    if (patch.version !== current.version) throw stale();
    const values: Record<string, unknown> = {};
    const changed: Record<string, unknown> = {};
    for (const [k, col] of scalarFields) {
      const next = patch[k];
      if (next !== undefined && next !== current[k]) {
        values[col] = next;
        changed[k] = { from: current[k], to: next };
      }
    }
    const clientChanged = patch.clientId !== undefined && patch.clientId !== current.clientId;
    if (clientChanged) {
      values.client_id = patch.clientId;
      changed.client = { from: current.clientName, to: clientName };
    }
    if (patch.machine && canonicalJson(patch.machine) !== canonicalJson(current.machine)) {
      values.machine = JSON.stringify(patch.machine);
      changed.machine = patch.machine;
    }
    if (patch.sizes && canonicalJson(patch.sizes) !== canonicalJson(current.sizes)) {
      values.sizes = JSON.stringify(patch.sizes);
      changed.sizes = patch.sizes;
    }
    if (Object.keys(changed).length === 0) return current;

    let n: number;
    try {
      n = await trx('styles')
        .where({ id, studio_id: user.studioId, version: patch.version })
        .whereNull('archived_at')
        .update({ ...values, updated_at: trx.fn.now(), version: trx.raw('version + 1') });
    } catch (err) {
      if (uniqueViolation(err)) throw codeTaken();
      throw err;
    }
    if (n === 0) throw stale();
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: id, user_id: user.id, action: 'style.update', details: JSON.stringify(changed),
    });
    if (clientChanged) {
      if (current.clientId) {
        // Only the former client organisation's own share: mill shares stay.
        const removed = await trx('style_shares')
          .where({ style_id: id, organisation_id: current.clientId })
          .whereIn('organisation_id', trx('organisations').where({ studio_id: user.studioId, kind: 'client' }).select('id'))
          .del();
        if (removed > 0) {
          await trx('audit_log').insert({
            studio_id: user.studioId, style_id: id, user_id: user.id, action: 'style.unshare',
            details: JSON.stringify({ organisationId: current.clientId, organisation: current.clientName, reason: 'client changed' }),
          });
        }
      }
      if (patch.clientId) {
        await trx('style_shares').insert({ style_id: id, organisation_id: patch.clientId, shared_by: user.id }).onConflict().ignore();
      }
    }
    const style = await findStyle(user, id, trx);
    if (!style) throw notFound();
    return style;
  });
}

export async function archiveStyle(user: SessionUser, id: string, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    const n = await trx('styles')
      .where({ id, studio_id: user.studioId })
      .whereNull('archived_at')
      .update({ archived_at: trx.fn.now(), updated_at: trx.fn.now(), version: trx.raw('version + 1') });
    if (n === 0) throw notFound('Style not found.');
    await trx('audit_log').insert({ studio_id: user.studioId, style_id: id, user_id: user.id, action: 'style.archive', details: '{}' });
  });
}

export async function shareStyle(user: SessionUser, styleId: string, organisationId: string, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    const style = await findStyle(user, styleId, trx);
    if (!style) throw notFound('Style not found.');
    const org = await trx('organisations').where({ id: organisationId, studio_id: user.studioId }).first();
    if (!org) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { organisationId: ['Unknown organisation'] } });
    await trx('style_shares').insert({ style_id: styleId, organisation_id: organisationId, shared_by: user.id }).onConflict().ignore();
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'style.share', details: JSON.stringify({ organisation: org.name }),
    });
  });
}

export async function unshareStyle(user: SessionUser, styleId: string, organisationId: string, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    const style = await findStyle(user, styleId, trx);
    if (!style) throw notFound('Style not found.');
    const n = await trx('style_shares').where({ style_id: styleId, organisation_id: organisationId }).del();
    if (n === 0) throw notFound('That organisation had no access.');
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'style.unshare', details: JSON.stringify({ organisationId }),
    });
  });
}
