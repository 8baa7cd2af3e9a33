import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import { findStyle } from './styles';
import type { Panel, PanelKind, StitchPolygon, Zone } from '@/lib/knit/panel';
import type { BodyMapSave } from '@/lib/validations/body-map';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import { randomUUID } from 'node:crypto';
import { generatePanels } from '@/lib/knit/outline';
import { cylinderNeedles } from '@/lib/fit/needles';
import { fallbackDensity } from '@/lib/editor';

export interface BodyMap {
  /** The style's version this map belongs to (optimistic concurrency). */
  version: number;
  panels: Panel[];
  /** True when nothing is saved yet and the panels were generated from the style. */
  generated: boolean;
}

interface PanelRow {
  id: string; kind: PanelKind; name: string; width_needles: number; height_courses: number;
  knitted_area: StitchPolygon; cut_outline: StitchPolygon; base_texture_id: string | null; position: number;
}

/**
 * The saved panels and zones of a style, in panel order (zones in stacking order); empty when none
 * are saved. One query: each panel row carries its zones as a JSON array.
 */
export async function loadPanels(styleId: string, q: Knex | Knex.Transaction = db()): Promise<Panel[]> {
  const rows = (await q('panels as p')
    .where('p.style_id', styleId)
    .orderBy('p.position')
    .select(
      'p.id', 'p.kind', 'p.name', 'p.width_needles', 'p.height_courses', 'p.knitted_area', 'p.cut_outline', 'p.base_texture_id', 'p.position',
      q.raw(
        `coalesce((select json_agg(json_build_object('id', z.id, 'name', z.name, 'textureId', z.texture_id, 'fn', z.fn,
           'order', z.stack_order, 'polygon', z.polygon) order by z.stack_order, z.id)
           from zones z where z.panel_id = p.id), '[]'::json) as zones`,
      ),
    )) as (PanelRow & { zones: Zone[] })[];
  return rows.map((p) => ({
    id: p.id, kind: p.kind, name: p.name, widthNeedles: p.width_needles, heightCourses: p.height_courses,
    knittedArea: p.knitted_area, cutOutline: p.cut_outline, baseTextureId: p.base_texture_id ?? '',
    zones: p.zones,
  }));
}

/** Texture ids among `ids` that are not live textures of the studio. */
export async function unknownTextureIds(studioId: string, ids: string[], q: Knex | Knex.Transaction = db()): Promise<string[]> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return [];
  const found = new Set(
    (await q('textures').where({ studio_id: studioId }).whereNull('archived_at').whereIn('id', unique).pluck('id')) as string[],
  );
  return unique.filter((id) => !found.has(id));
}

function uniqueViolation(err: unknown): boolean {
  return !!err && typeof err === 'object' && (err as { code?: string }).code === '23505';
}

/**
 * Saves the whole map when `input.version` is the style's current version, raising it by one;
 * otherwise 409 and nothing changes. Writes an audit entry.
 *
 * One statement raises the version, checks it and locks the style row (a concurrent save waits,
 * then finds the version moved on: 409). The style is read only when that statement matched
 * nothing, to tell 404 from 409. Panel and zone ids that belong to another style collide with
 * their primary keys on insert (the schema refuses duplicates within one map): a 400.
 */
export async function saveBodyMap(user: SessionUser, styleId: string, input: BodyMapSave, q: Knex = db()): Promise<{ version: number }> {
  const textureIds = input.panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]);
  return q.transaction(async (trx) => {
    const bumped = await trx('styles')
      .where({ id: styleId, studio_id: user.studioId, version: input.version })
      .whereNull('archived_at')
      .update({ version: trx.raw('version + 1'), updated_at: trx.fn.now() })
      .returning('version');
    if (bumped.length === 0) {
      const style = await findStyle(user, styleId, trx);
      if (!style) throw notFound('Style not found.');
      throw conflict('This body map was saved elsewhere after you opened it.', { currentVersion: style.version });
    }
    const version = (bumped[0] as { version: number }).version;
    const unknown = await unknownTextureIds(user.studioId, textureIds, trx);
    if (unknown.length) {
      throw new HttpError(400, 'Some textures are not in the studio library.', { fieldErrors: { textureId: [`Unknown texture: ${unknown.join(', ')}`] } });
    }
    await trx('panels').where({ style_id: styleId }).del();
    const zoneRows = input.panels.flatMap((p) =>
      p.zones.map((z) => ({ id: z.id, panel_id: p.id, name: z.name, texture_id: z.textureId, fn: z.fn, stack_order: z.order, polygon: JSON.stringify(z.polygon) })),
    );
    try {
      await trx('panels').insert(
        input.panels.map((p, i) => ({
          id: p.id, style_id: styleId, position: i, kind: p.kind, name: p.name, width_needles: p.widthNeedles,
          height_courses: p.heightCourses, knitted_area: JSON.stringify(p.knittedArea), cut_outline: JSON.stringify(p.cutOutline),
          base_texture_id: p.baseTextureId,
        })),
      );
      for (let i = 0; i < zoneRows.length; i += 500) await trx('zones').insert(zoneRows.slice(i, i + 500));
    } catch (err) {
      if (uniqueViolation(err)) throw new HttpError(400, 'Panel or zone ids belong to another style.');
      throw err;
    }
    // Every texture the map uses belongs to the style's textures (mill and client see those).
    const used = [...new Set(textureIds)];
    if (used.length) {
      await trx('style_textures')
        .insert(used.map((texture_id) => ({ style_id: styleId, texture_id, added_by: user.id })))
        .onConflict(['style_id', 'texture_id'])
        .ignore();
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'body-map.save',
      details: JSON.stringify({ panels: input.panels.length, zones: zoneRows.length, version }),
    });
    return { version };
  });
}

/**
 * The texture that fills generated panels: the style's first texture, else the studio's first
 * jersey-like texture, else any; with its density. Null when the library is empty.
 */
export async function baseTextureForGeneration(
  studioId: string,
  styleId: string,
  q: Knex | Knex.Transaction = db(),
): Promise<{ id: string; walesPerCm: number; coursesPerCm: number } | null> {
  const row =
    (await q('style_textures as st')
      .join('textures as t', 't.id', 'st.texture_id')
      .where({ 'st.style_id': styleId })
      .whereNull('t.archived_at')
      .orderBy([{ column: 'st.position' }, { column: 't.name' }])
      .first('t.id', 't.wales_per_cm', 't.courses_per_cm')) ??
    (await q('textures')
      .where({ studio_id: studioId })
      .whereNull('archived_at')
      .orderByRaw("case family when 'jersey' then 0 else 1 end, name")
      .first('id', 'wales_per_cm', 'courses_per_cm'));
  if (!row) return null;
  return { id: row.id, walesPerCm: Number(row.wales_per_cm), coursesPerCm: Number(row.courses_per_cm) };
}

/** The saved map, or panels generated from the style when nothing is saved yet (not stored until saved). */
export async function loadBodyMap(user: SessionUser, styleId: string, q: Knex = db()): Promise<BodyMap | null> {
  const style = await findStyle(user, styleId, q);
  if (!style) return null;
  const panels = await loadPanels(styleId, q);
  if (panels.length) return { version: style.version, panels, generated: false };
  const base = await baseTextureForGeneration(user.studioId, styleId, q);
  const machineNeedles =
    style.machine.kind === 'circular'
      ? cylinderNeedles(style.machine.diameterIn, style.machine.gauge, style.machine.needleMultiple)
      : style.machine.bedNeedles;
  const generatedPanels = generatePanels({
    garment: style.garmentType,
    construction: style.construction,
    machineNeedles,
    density: base ?? fallbackDensity,
    baseTextureId: base?.id ?? '',
    newId: () => randomUUID(),
  });
  return { version: style.version, panels: generatedPanels, generated: true };
}
