import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { findStyle } from './styles';
import { yarnForViewer, yarnsByIds, type LibraryYarn } from './yarns';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import { textureYarnIds, type Feeder, type ForceExtensionPoint, type Texture } from '@/lib/knit/texture';
import { decodeCells, encodeCells } from '@/lib/library/chart';
import {
  textureEntryOf, textureInputSchema, type StyleTexturesPut, type TextureFamily, type TextureFunction, type TextureInput,
  type TexturePatch,
} from '@/lib/validations/library';

/** A texture of the studio library: the lib/knit `Texture` plus what the library keeps about it. */
export interface LibraryTexture extends Texture {
  family: TextureFamily;
  function: TextureFunction | null;
  /** Gauge the texture was developed on, needles per inch. */
  gauge: number;
  version: number;
  createdAt: string;
  updatedAt: string;
  archivedAt: string | null;
}

interface TextureRow {
  id: string; studio_id: string; name: string; family: TextureFamily; function: TextureFunction | null;
  repeat_needles: number; repeat_courses: number; cells: string[]; feeders: Feeder[]; gauge: number;
  wales_per_cm: number; courses_per_cm: number; loop_knit_mm: number; loop_tuck_mm: number;
  force_extension: ForceExtensionPoint[] | null; notes: string; version: number;
  created_at: Date; updated_at: Date; archived_at: Date | null;
}

function toTexture(r: TextureRow): LibraryTexture {
  const t: LibraryTexture = {
    id: r.id,
    name: r.name,
    repeat: { needles: r.repeat_needles, courses: r.repeat_courses, cells: decodeCells(r.cells) },
    feeders: r.feeders,
    density: { walesPerCm: r.wales_per_cm, coursesPerCm: r.courses_per_cm },
    loopMm: { knit: r.loop_knit_mm, tuck: r.loop_tuck_mm },
    family: r.family,
    function: r.function,
    gauge: r.gauge,
    version: r.version,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    archivedAt: r.archived_at ? r.archived_at.toISOString() : null,
  };
  if (r.force_extension && r.force_extension.length > 0) t.forceExtension = r.force_extension;
  if (r.notes) t.notes = r.notes;
  return t;
}

/** The stored fields of a library texture, as the schema's output. */
export function textureInputOf(t: LibraryTexture): TextureInput {
  return {
    name: t.name,
    family: t.family,
    function: t.function,
    gauge: t.gauge,
    repeat: { needles: t.repeat.needles, courses: t.repeat.courses, cells: t.repeat.cells },
    feeders: t.feeders,
    density: t.density,
    loopMm: t.loopMm,
    forceExtension: t.forceExtension ? [...t.forceExtension] : null,
    notes: t.notes ?? '',
  };
}

function columnsOf(input: TextureInput) {
  return {
    name: input.name,
    family: input.family,
    function: input.function,
    repeat_needles: input.repeat.needles,
    repeat_courses: input.repeat.courses,
    cells: encodeCells(input.repeat.cells),
    feeders: JSON.stringify(input.feeders),
    gauge: input.gauge,
    wales_per_cm: input.density.walesPerCm,
    courses_per_cm: input.density.coursesPerCm,
    loop_knit_mm: input.loopMm.knit,
    loop_tuck_mm: input.loopMm.tuck,
    force_extension: input.forceExtension ? JSON.stringify(input.forceExtension) : null,
    notes: input.notes,
  };
}

const nameTaken = () =>
  new HttpError(400, 'Some fields need attention.', { fieldErrors: { name: ['A texture of this name is already in the library'] } });

function uniqueViolation(err: unknown): boolean {
  return !!err && typeof err === 'object' && (err as { code?: string }).code === '23505';
}

/**
 * Every feeder yarn must be an active yarn of the studio. The yarn rows are share-locked so a yarn
 * cannot be archived while a texture that uses it is being saved.
 */
async function assertFeederYarns(studioId: string, feeders: readonly Feeder[], trx: Knex.Transaction): Promise<void> {
  const ids = [...new Set(feeders.flatMap((f) => (f.plated ? [f.ground, f.plated.yarn] : [f.ground])))];
  const found = new Set(
    (await trx('yarns').where({ studio_id: studioId }).whereNull('archived_at').whereIn('id', ids).forShare().pluck('id')) as string[],
  );
  const errors: Record<string, string[]> = {};
  feeders.forEach((f, c) => {
    if (!found.has(f.ground)) errors[`feeders.${c}.ground`] = ['Not a yarn of the studio library'];
    if (f.plated && !found.has(f.plated.yarn)) errors[`feeders.${c}.plated.yarn`] = ['Not a yarn of the studio library'];
  });
  if (Object.keys(errors).length > 0) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: errors });
}

/** The studio's textures that are not archived, by name. */
export async function listTextures(user: SessionUser, q: Db = db()): Promise<LibraryTexture[]> {
  const rows = (await q('textures').where({ studio_id: user.studioId }).whereNull('archived_at').orderBy('name')) as TextureRow[];
  return rows.map(toTexture);
}

/** One texture of the studio (archived ones too, so old references still read); null when not the studio's. */
export async function findTexture(user: SessionUser, id: string, q: Db = db()): Promise<LibraryTexture | null> {
  const row = (await q('textures').where({ id, studio_id: user.studioId }).first()) as TextureRow | undefined;
  return row ? toTexture(row) : null;
}

/** Textures of the studio by id (archived ones too, so old references still read), in the order of `ids`; unknown ids are left out. */
export async function texturesByIds(studioId: string, ids: readonly string[], q: Db = db()): Promise<LibraryTexture[]> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return [];
  const rows = (await q('textures').where({ studio_id: studioId }).whereIn('id', unique)) as TextureRow[];
  const byId = new Map(rows.map((r) => [r.id, r]));
  return unique.flatMap((id) => {
    const r = byId.get(id);
    return r ? [toTexture(r)] : [];
  });
}

/** The textures on a style's list, in its order (the caller has checked that the style is visible). */
export async function texturesOfStyleList(studioId: string, styleId: string, q: Db = db()): Promise<LibraryTexture[]> {
  const rows = (await q('style_textures as stx')
    .join('textures as t', 't.id', 'stx.texture_id')
    .where({ 'stx.style_id': styleId, 't.studio_id': studioId })
    .orderBy([{ column: 'stx.position' }, { column: 't.name' }])
    .select('t.*')) as TextureRow[];
  return rows.map(toTexture);
}

/** The yarns a set of textures feeds, for computing with them. */
export async function yarnsOfTextures(studioId: string, textures: readonly Texture[], q: Db = db()): Promise<LibraryYarn[]> {
  return yarnsByIds(studioId, textures.flatMap(textureYarnIds), q);
}

export async function createTexture(user: SessionUser, input: TextureInput, q: Knex = db()): Promise<LibraryTexture> {
  return q.transaction(async (trx) => {
    await assertFeederYarns(user.studioId, input.feeders, trx);
    let row: TextureRow;
    try {
      [row] = (await trx('textures')
        .insert({ studio_id: user.studioId, created_by: user.id, ...columnsOf(input) })
        .returning('*')) as [TextureRow];
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'texture.create', details: JSON.stringify({ textureId: row.id, name: input.name }),
    });
    return toTexture(row);
  });
}

/**
 * Applies a patch when `patch.version` is the stored version; otherwise 409 and nothing changes.
 * The patched texture is validated whole (chart against repeat, feeders, lib/knit validateTexture).
 */
export async function updateTexture(user: SessionUser, id: string, patch: TexturePatch, q: Knex = db()): Promise<LibraryTexture> {
  return q.transaction(async (trx) => {
    const current = await findTexture(user, id, trx);
    if (!current || current.archivedAt) throw notFound('Texture not found.');
    const { version, ...changes } = patch;
    const defined = Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined));
    const input = textureInputSchema.parse({ ...textureEntryOf(textureInputOf(current)), ...defined });
    await assertFeederYarns(user.studioId, input.feeders, trx);
    let n: number;
    try {
      n = await trx('textures')
        .where({ id, studio_id: user.studioId, version })
        .whereNull('archived_at')
        .update({ ...columnsOf(input), version: trx.raw('version + 1'), updated_at: trx.fn.now() });
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    if (n === 0) {
      throw conflict('Someone saved this texture after you opened it. Your edits are still here; reload to see theirs.', {
        currentVersion: current.version,
      });
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'texture.update', details: JSON.stringify({ textureId: id, fields: Object.keys(defined) }),
    });
    const updated = await findTexture(user, id, trx);
    if (!updated) throw notFound('Texture not found.');
    return updated;
  });
}

/** Codes of the live styles that use the texture. */
export async function stylesUsingTexture(studioId: string, textureId: string, q: Db = db()): Promise<string[]> {
  return (await q('style_textures as stx')
    .join('styles as st', 'st.id', 'stx.style_id')
    .where({ 'stx.texture_id': textureId, 'st.studio_id': studioId })
    .whereNull('st.archived_at')
    .orderBy('st.code')
    .pluck('st.code')) as string[];
}

/** Archives the texture (kept, hidden from the library); refused while a live style uses it. */
export async function archiveTexture(user: SessionUser, id: string, version: number, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    const current = await trx('textures').where({ id, studio_id: user.studioId }).whereNull('archived_at').forUpdate().first();
    if (!current) throw notFound('Texture not found.');
    if (current.version !== version) {
      throw conflict('Someone saved this texture after you opened it. Reload to see their changes before archiving it.', { currentVersion: current.version });
    }
    const styles = await stylesUsingTexture(user.studioId, id, trx);
    if (styles.length > 0) {
      throw conflict(`This texture is used by ${styles.length === 1 ? 'style' : 'styles'} ${styles.join(', ')}. Remove it from them first.`, { styles });
    }
    await trx('textures')
      .where({ id, studio_id: user.studioId })
      .update({ archived_at: trx.fn.now(), updated_at: trx.fn.now(), version: trx.raw('version + 1') });
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'texture.archive', details: JSON.stringify({ textureId: id, name: current.name }),
    });
  });
}

// ---------------------------------------------------------------------------------------------
// The textures a style uses

export interface StyleTextures {
  /** The style's version: a change to the list must carry it. */
  version: number;
  textures: LibraryTexture[];
  /** The yarns those textures feed (without prices for mill and client accounts). */
  yarns: LibraryYarn[];
}

/**
 * The textures of a style the user can see (mill and client accounts: styles shared with them),
 * in the style's order, with the yarns they use.
 */
export async function listStyleTextures(user: SessionUser, styleId: string, q: Db = db()): Promise<StyleTextures> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const textures = await texturesOfStyleList(user.studioId, styleId, q);
  const yarns = (await yarnsOfTextures(user.studioId, textures, q)).map((y) => yarnForViewer(user, y));
  return { version: style.version, textures, yarns };
}

/**
 * Replaces the style's texture list when `input.version` is the style's version (raising it);
 * otherwise 409 and nothing changes. Every texture must be a live texture of the studio.
 */
export async function setStyleTextures(user: SessionUser, styleId: string, input: StyleTexturesPut, q: Knex = db()): Promise<StyleTextures> {
  await q.transaction(async (trx) => {
    const style = await findStyle(user, styleId, trx);
    if (!style) throw notFound('Style not found.');
    const known = new Set(
      (await trx('textures')
        .where({ studio_id: user.studioId })
        .whereNull('archived_at')
        .whereIn('id', input.textureIds)
        .forShare()
        .pluck('id')) as string[],
    );
    const errors: Record<string, string[]> = {};
    input.textureIds.forEach((id, i) => {
      if (!known.has(id)) errors[`textureIds.${i}`] = ['Not a texture of the studio library'];
    });
    if (Object.keys(errors).length > 0) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: errors });
    // A texture the saved body map uses stays: the mill and the client read the style's textures.
    const inMap = (await trx('panels as p')
      .leftJoin('zones as z', 'z.panel_id', 'p.id')
      .where('p.style_id', styleId)
      .select('p.base_texture_id', 'z.texture_id')) as { base_texture_id: string | null; texture_id: string | null }[];
    const usedByMap = new Set(inMap.flatMap((r) => [r.base_texture_id, r.texture_id]).filter((id): id is string => !!id));
    const dropped = [...usedByMap].filter((id) => !input.textureIds.includes(id));
    if (dropped.length > 0) {
      const names = (await trx('textures').whereIn('id', dropped).orderBy('name').pluck('name')) as string[];
      throw conflict(`The body map uses ${names.join(', ')}: change the zones and panel bases that use ${names.length === 1 ? 'it' : 'them'} first.`, { textures: dropped });
    }
    const bumped = await trx('styles')
      .where({ id: styleId, studio_id: user.studioId, version: input.version })
      .whereNull('archived_at')
      .update({ version: trx.raw('version + 1'), updated_at: trx.fn.now() });
    if (bumped === 0) {
      throw conflict('Someone saved this style after you opened it. Reload to see their changes.', { currentVersion: style.version });
    }
    const before = (await trx('style_textures').where({ style_id: styleId }).pluck('texture_id')) as string[];
    await trx('style_textures').where({ style_id: styleId }).del();
    if (input.textureIds.length > 0) {
      await trx('style_textures').insert(
        input.textureIds.map((textureId, position) => ({ style_id: styleId, texture_id: textureId, position, added_by: user.id })),
      );
    }
    const added = input.textureIds.filter((id) => !before.includes(id));
    const removed = before.filter((id) => !input.textureIds.includes(id));
    const names = async (ids: string[]) =>
      ids.length ? ((await trx('textures').whereIn('id', ids).orderBy('name').pluck('name')) as string[]) : [];
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'style.textures',
      details: JSON.stringify({ added: await names(added), removed: await names(removed) }),
    });
  });
  return listStyleTextures(user, styleId, q);
}
