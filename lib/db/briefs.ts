import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { changedKeys } from './changed-keys';
import type { SessionUser } from './users';
import { findStyle, type Style } from './styles';
import { storeFile, withStoredFiles } from './files';
import { conflict, forbidden, HttpError, notFound } from '@/lib/api/errors';
import { can, canSeeCosts } from '@/lib/auth/roles';
import type { InspectedUpload } from '@/lib/files/inspect';
import type { ObjectStore } from '@/lib/storage/object-store';
import { emptyBrief, readBriefAnswers, type BriefAnswers, type BriefSave, type ReferenceTag, type StoredBriefAnswers } from '@/lib/validations/brief';

export interface Brief {
  styleId: string;
  /** 0 while nothing is saved: the first save carries 0. */
  version: number;
  answers: BriefAnswers;
  /** True when prices were left out for this account (mill and client accounts never see them). */
  pricesHidden: boolean;
  saved: boolean;
  updatedAt: string | null;
  updatedBy: string | null;
}

export interface BriefReference {
  id: string;
  fileId: string;
  caption: string;
  tag: ReferenceTag;
  position: number;
  widthPx: number | null;
  heightPx: number | null;
  originalName: string;
  createdAt: string;
  /** Where the image is served for this style. */
  url: string;
}

/** The style, when the user may read its brief (studio staff, and client accounts it is shared with); else 404 or 403. */
async function briefStyle(user: SessionUser, styleId: string, q: Db): Promise<Style> {
  if (!can(user.role, 'brief:read')) throw forbidden();
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  return style;
}

function forViewer(user: SessionUser, answers: BriefAnswers): { answers: BriefAnswers; pricesHidden: boolean } {
  if (canSeeCosts(user.role)) return { answers, pricesHidden: false };
  return { answers: { ...answers, targetPrice: null }, pricesHidden: true };
}

interface BriefRow { style_id: string; answers: unknown; version: number; updated_at: Date; updated_by_name: string | null }

/** The brief of a style; the empty brief (version 0) while none is saved. */
export async function loadBrief(user: SessionUser, styleId: string, q: Db = db()): Promise<Brief> {
  await briefStyle(user, styleId, q);
  const row = (await q('briefs as b')
    .leftJoin('users as u', 'u.id', 'b.updated_by')
    .where({ 'b.style_id': styleId, 'b.studio_id': user.studioId })
    .first('b.style_id', 'b.answers', 'b.version', 'b.updated_at', 'u.name as updated_by_name')) as BriefRow | undefined;
  if (!row) return { styleId, version: 0, ...forViewer(user, emptyBrief), saved: false, updatedAt: null, updatedBy: null };
  const { answers } = readBriefAnswers(row.answers);
  return { styleId, version: row.version, ...forViewer(user, answers), saved: true, updatedAt: row.updated_at.toISOString(), updatedBy: row.updated_by_name };
}

/**
 * The brief's answers for the studio's own computations (prices included), read as `loadBrief` reads
 * them, with the fields that had to be reset named; null while no brief is saved. Staff callers only.
 */
export async function briefAnswersForStudio(studioId: string, styleId: string, q: Db = db()): Promise<StoredBriefAnswers | null> {
  const row = (await q('briefs').where({ style_id: styleId, studio_id: studioId }).first('answers')) as { answers: unknown } | undefined;
  return row ? readBriefAnswers(row.answers) : null;
}

/**
 * Saves the brief when `input.version` is the stored version (0 for the first save), raising it;
 * otherwise 409 and nothing changes. Sizes of the order must be the style's. The history entry
 * names the fields changed, never their values (a price stays out of what clients can read).
 */
export async function saveBrief(user: SessionUser, styleId: string, input: BriefSave, q: Knex = db()): Promise<Brief> {
  if (!can(user.role, 'style:edit')) throw forbidden();
  await q.transaction(async (trx) => {
    const style = await briefStyle(user, styleId, trx);
    const unknownSizes = Object.keys(input.answers.orderBySize).filter((s) => !style.sizes.labels.includes(s));
    if (unknownSizes.length) {
      throw new HttpError(400, 'Some fields need attention.', {
        fieldErrors: Object.fromEntries(unknownSizes.map((s) => [`answers.orderBySize.${s}`, [`${s} is not one of the style sizes (${style.sizes.labels.join(', ')})`]])),
      });
    }
    const current = (await trx('briefs').where({ style_id: styleId }).forUpdate().first('version', 'answers')) as { version: number; answers: unknown } | undefined;
    const stale = () => conflict('Someone saved this brief after you opened it. Your answers are still here; reload to see theirs.', { currentVersion: current?.version ?? 0 });
    if (!current) {
      if (input.version !== 0) throw stale();
      const inserted = await trx('briefs')
        .insert({ style_id: styleId, studio_id: user.studioId, answers: JSON.stringify(input.answers), updated_by: user.id })
        .onConflict('style_id').ignore()
        .returning('style_id');
      if (inserted.length === 0) throw stale();
    } else {
      const n = await trx('briefs')
        .where({ style_id: styleId, version: input.version })
        .update({ answers: JSON.stringify(input.answers), version: trx.raw('version + 1'), updated_by: user.id, updated_at: trx.fn.now() });
      if (n === 0) throw stale();
    }
    await trx('brief_versions').insert({
      style_id: styleId, studio_id: user.studioId, version: current ? input.version + 1 : 1, answers: JSON.stringify(input.answers), saved_by: user.id,
    });
    const fields = changedKeys(current ? readBriefAnswers(current.answers).answers : emptyBrief, input.answers);
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'brief.save', details: JSON.stringify({ fields }),
    });
  });
  return loadBrief(user, styleId, q);
}

// ---------------------------------------------------------------------------------------------
// Earlier versions

export interface BriefFieldChange {
  field: keyof BriefAnswers;
  before: unknown;
  after: unknown;
}

export interface BriefVersion {
  version: number;
  savedAt: string;
  savedBy: string | null;
  /** The full answers as saved, prices included. */
  answers: BriefAnswers;
  /** What differs from the version before it (from the empty brief for the first one). */
  changes: BriefFieldChange[];
  /** The version before it was not kept (the list holds the latest ones only, or the brief predates its history). */
  earlierUnknown: boolean;
}

const VERSIONS_LISTED = 50;

interface VersionRow { version: number; answers: unknown; saved_at: Date; saved_by_name: string | null }

/**
 * The brief's saved versions, newest first, each with what changed from the one before. Studio staff
 * only (admin, designer, colour lead): the answers hold the target price, so clients and mills get 403.
 */
export async function listBriefVersions(user: SessionUser, styleId: string, q: Db = db()): Promise<BriefVersion[]> {
  if (!canSeeCosts(user.role)) throw forbidden();
  await briefStyle(user, styleId, q);
  const rows = (await q('brief_versions as v')
    .leftJoin('users as u', 'u.id', 'v.saved_by')
    .where({ 'v.style_id': styleId, 'v.studio_id': user.studioId })
    .orderBy('v.version', 'desc')
    .limit(VERSIONS_LISTED + 1)
    .select('v.version', 'v.answers', 'v.saved_at', 'u.name as saved_by_name')) as VersionRow[];
  const read = rows.map((r) => ({ ...r, answers: readBriefAnswers(r.answers).answers }));
  return read.slice(0, VERSIONS_LISTED).map((r, i) => {
    const previous = read[i + 1];
    const earlierUnknown = previous ? previous.version !== r.version - 1 : r.version !== 1;
    // The oldest kept version of a brief saved before its history was kept has nothing to compare with.
    const before = previous?.answers ?? (earlierUnknown ? r.answers : emptyBrief);
    return {
      version: r.version, savedAt: r.saved_at.toISOString(), savedBy: r.saved_by_name, answers: r.answers, earlierUnknown,
      changes: changedKeys(before, r.answers).map((field) => ({ field, before: before[field], after: r.answers[field] })),
    };
  });
}

// ---------------------------------------------------------------------------------------------
// The reference board

interface RefRow {
  id: string; file_id: string; caption: string; tag: ReferenceTag; position: number; created_at: Date;
  width_px: number | null; height_px: number | null; original_name: string; storage_key: string; content_type: string;
}

function toReference(styleId: string, r: RefRow): BriefReference {
  return {
    id: r.id, fileId: r.file_id, caption: r.caption, tag: r.tag, position: r.position, widthPx: r.width_px, heightPx: r.height_px,
    originalName: r.original_name, createdAt: r.created_at.toISOString(), url: `/api/styles/${styleId}/brief/references/${r.id}/image`,
  };
}

function referenceRows(q: Db, styleId: string, studioId: string) {
  return q('brief_references as r')
    .join('files as f', 'f.id', 'r.file_id')
    .where({ 'r.style_id': styleId, 'f.studio_id': studioId })
    .select('r.id', 'r.file_id', 'r.caption', 'r.tag', 'r.position', 'r.created_at', 'f.width_px', 'f.height_px', 'f.original_name', 'f.storage_key', 'f.content_type');
}

/** The board in its order. */
export async function listReferences(user: SessionUser, styleId: string, q: Db = db()): Promise<BriefReference[]> {
  await briefStyle(user, styleId, q);
  const rows = (await referenceRows(q, styleId, user.studioId).orderBy([{ column: 'r.position' }, { column: 'r.created_at' }])) as RefRow[];
  return rows.map((r) => toReference(styleId, r));
}

/** One reference image's stored object, for serving it. */
export async function referenceImage(user: SessionUser, styleId: string, refId: string, q: Db = db()): Promise<{ storageKey: string; contentType: string; name: string }> {
  await briefStyle(user, styleId, q);
  const row = (await referenceRows(q, styleId, user.studioId).andWhere('r.id', refId).first()) as RefRow | undefined;
  if (!row) throw notFound('Reference not found.');
  return { storageKey: row.storage_key, contentType: row.content_type, name: row.original_name };
}

const MAX_REFERENCES = 60;

/** Stores an uploaded photo (already inspected by content) at the end of the board, with a history entry. */
export async function addReference(
  user: SessionUser, styleId: string, upload: InspectedUpload, originalName: string, fields: { caption: string; tag: ReferenceTag }, store: ObjectStore, q: Knex = db(),
): Promise<BriefReference> {
  if (!can(user.role, 'style:edit')) throw forbidden();
  await briefStyle(user, styleId, q);
  const id = await withStoredFiles(store, async (trx, written) => {
    await trx('styles').where({ id: styleId }).forUpdate().first('id');
    const count = Number(((await trx('brief_references').where({ style_id: styleId }).count('* as n').first()) as { n: string | number }).n);
    if (count >= MAX_REFERENCES) throw new HttpError(400, `The board holds at most ${MAX_REFERENCES} images.`, { fieldErrors: { file: [`At most ${MAX_REFERENCES} images`] } });
    const file = await storeFile(trx, store, {
      studioId: user.studioId, styleId, organisationId: null, uploadedBy: user.id, purpose: 'brief-reference', upload, originalName,
    }, written);
    const [row] = (await trx('brief_references')
      .insert({ style_id: styleId, file_id: file.id, caption: fields.caption, tag: fields.tag, position: count, created_by: user.id })
      .returning('id')) as { id: string }[];
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'brief.reference.add',
      details: JSON.stringify({ name: file.originalName, tag: fields.tag, caption: fields.caption }),
    });
    return row!.id;
  }, q);
  const ref = (await listReferences(user, styleId, q)).find((r) => r.id === id);
  if (!ref) throw notFound();
  return ref;
}

export async function updateReference(user: SessionUser, styleId: string, refId: string, patch: { caption?: string | undefined; tag?: ReferenceTag | undefined }, q: Knex = db()): Promise<BriefReference> {
  if (!can(user.role, 'style:edit')) throw forbidden();
  await briefStyle(user, styleId, q);
  const values: Record<string, unknown> = {};
  if (patch.caption !== undefined) values.caption = patch.caption;
  if (patch.tag !== undefined) values.tag = patch.tag;
  await q.transaction(async (trx) => {
    const n = Object.keys(values).length
      ? await trx('brief_references').where({ id: refId, style_id: styleId }).update(values)
      : await trx('brief_references').where({ id: refId, style_id: styleId }).count('* as n').first().then((r) => Number((r as { n: string }).n));
    if (!n) throw notFound('Reference not found.');
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'brief.reference.edit', details: JSON.stringify({ fields: Object.keys(values) }),
    });
  });
  const ref = (await listReferences(user, styleId, q)).find((r) => r.id === refId);
  if (!ref) throw notFound('Reference not found.');
  return ref;
}

/** Removes a reference and its stored image. */
export async function deleteReference(user: SessionUser, styleId: string, refId: string, store: ObjectStore, q: Knex = db()): Promise<void> {
  if (!can(user.role, 'style:edit')) throw forbidden();
  await briefStyle(user, styleId, q);
  const key = await q.transaction(async (trx) => {
    const row = (await referenceRows(trx, styleId, user.studioId).andWhere('r.id', refId).first()) as RefRow | undefined;
    if (!row) throw notFound('Reference not found.');
    await trx('brief_references').where({ id: refId }).del();
    await trx('files').where({ id: row.file_id }).del();
    const rest = (await trx('brief_references').where({ style_id: styleId }).orderBy(['position', 'created_at']).pluck('id')) as string[];
    for (const [i, id] of rest.entries()) await trx('brief_references').where({ id }).update({ position: i });
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'brief.reference.remove', details: JSON.stringify({ name: row.original_name }),
    });
    return row.storage_key;
  });
  await store.delete(key).catch((e) => console.error('Could not remove a reference image from the store', key, e));
}

/** Puts the board in the given order: the ids must be exactly the board's. */
export async function reorderReferences(user: SessionUser, styleId: string, ids: readonly string[], q: Knex = db()): Promise<BriefReference[]> {
  if (!can(user.role, 'style:edit')) throw forbidden();
  await briefStyle(user, styleId, q);
  await q.transaction(async (trx) => {
    const current = (await trx('brief_references').where({ style_id: styleId }).forUpdate().pluck('id')) as string[];
    const same = current.length === ids.length && new Set(ids).size === ids.length && ids.every((id) => current.includes(id));
    if (!same) throw conflict('The board changed since you opened it. Reload and arrange it again.', { ids: current });
    for (const [i, id] of ids.entries()) await trx('brief_references').where({ id }).update({ position: i });
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'brief.reference.reorder', details: JSON.stringify({ count: ids.length }),
    });
  });
  return listReferences(user, styleId, q);
}
