import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import { findStyle, findStyleWith, type Style } from './styles';
import type { Panel } from '@/lib/knit/panel';
import type { BodyMapSave } from '@/lib/validations/body-map';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import { randomUUID } from 'node:crypto';
import { generatePanels, outlineMeasurementsFromSpec } from '@/lib/knit/outline';
import { baseSizePointsCm } from './fit';
import { cylinderNeedles } from '@/lib/fit/needles';
import { fallbackDensity } from '@/lib/editor';

export interface BodyMap {
  /** The style's version this map belongs to (optimistic concurrency). */
  version: number;
  panels: Panel[];
  /** True when nothing is saved yet and the panels were generated from the style. */
  generated: boolean;
}

/**
 * The saved panels and zones of a style (`styleRef`: an SQL expression for its id) as a JSON array
 * of `Panel`, built by the database: panels in order, each with its zones in stacking order; empty
 * when none are saved.
 */
const panelsJsonSql = (styleRef: string) => `coalesce((select json_agg(json_build_object('id', p.id, 'kind', p.kind, 'name', p.name,
    'widthNeedles', p.width_needles, 'heightCourses', p.height_courses, 'knittedArea', p.knitted_area, 'cutOutline', p.cut_outline,
    'baseTextureId', coalesce(p.base_texture_id::text, ''),
    'zones', coalesce((select json_agg(json_build_object('id', z.id, 'name', z.name, 'textureId', z.texture_id, 'fn', z.fn,
      'order', z.stack_order, 'polygon', z.polygon) order by z.stack_order, z.id) from zones z where z.panel_id = p.id), '[]'::json))
    order by p.position) from panels p where p.style_id = ${styleRef}), '[]'::json)`;

/** The saved panels and zones of a style, in panel order (zones in stacking order); empty when none are saved. One query. */
export async function loadPanels(styleId: string, q: Knex | Knex.Transaction = db()): Promise<Panel[]> {
  const res = (await q.raw(`select ${panelsJsonSql('?')} as panels`, [styleId])) as { rows: { panels: Panel[] }[] };
  return res.rows[0]?.panels ?? [];
}

function uniqueViolation(err: unknown): boolean {
  return !!err && typeof err === 'object' && (err as { code?: string }).code === '23505';
}

/**
 * Saves the whole map when `input.version` is the style's current version, raising it by one;
 * otherwise 409 and nothing changes. Writes an audit entry.
 *
 * Two statements in one transaction. The first raises the version, checks it and locks the style
 * row (a concurrent save waits, then finds the version moved on: 409), drops the old panels (their
 * zones go with them) and names the textures that are not live textures of the studio (400). The
 * second inserts the panels, the zones, the style's texture list entries for the textures the map
 * uses and the audit entry. The style is read only when the first matched nothing, to tell 404
 * from 409. Panel and zone ids that belong to another style collide with their primary keys on
 * insert (the schema refuses duplicates within one map): a 400.
 */
export async function saveBodyMap(user: SessionUser, styleId: string, input: BodyMapSave, q: Knex = db()): Promise<{ version: number }> {
  const used = [...new Set(input.panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]))];
  return q.transaction(async (trx) => {
    const bump = trx('styles')
      .where({ id: styleId, studio_id: user.studioId, version: input.version })
      .whereNull('archived_at')
      .update({ version: trx.raw('version + 1'), updated_at: trx.fn.now() })
      .returning('version');
    const [first] = (await trx
      .with('bumped', bump)
      .with('dropped', trx('panels').where({ style_id: styleId }).whereExists(trx.select(trx.raw('1')).from('bumped')).del())
      .select(
        trx.raw('(select version from bumped) as version'),
        trx.raw(
          'array(select x::text from unnest(?::uuid[]) x where not exists (select 1 from textures t where t.id = x and t.studio_id = ? and t.archived_at is null)) as unknown',
          [used, user.studioId],
        ),
      )) as { version: number | null; unknown: string[] }[];
    if (first?.version == null) {
      const style = await findStyle(user, styleId, trx);
      if (!style) throw notFound('Style not found.');
      throw conflict('This body map was saved elsewhere after you opened it.', { currentVersion: style.version });
    }
    const version = first.version;
    if (first.unknown.length) {
      throw new HttpError(400, 'Some textures are not in the studio library.', { fieldErrors: { textureId: [`Unknown texture: ${first.unknown.join(', ')}`] } });
    }
    const zoneRows = input.panels.flatMap((p) =>
      p.zones.map((z) => ({ id: z.id, panel_id: p.id, name: z.name, texture_id: z.textureId, fn: z.fn, stack_order: z.order, polygon: JSON.stringify(z.polygon) })),
    );
    let insert = trx.with(
      'p',
      trx('panels').insert(
        input.panels.map((p, i) => ({
          id: p.id, style_id: styleId, position: i, kind: p.kind, name: p.name, width_needles: p.widthNeedles,
          height_courses: p.heightCourses, knitted_area: JSON.stringify(p.knittedArea), cut_outline: JSON.stringify(p.cutOutline),
          base_texture_id: p.baseTextureId,
        })),
      ),
    );
    if (zoneRows.length) insert = insert.with('z', trx('zones').insert(zoneRows));
    // Every texture the map uses belongs to the style's textures (mill and client see those).
    if (used.length) {
      insert = insert.with(
        'st',
        trx('style_textures').insert(used.map((texture_id) => ({ style_id: styleId, texture_id, added_by: user.id }))).onConflict(['style_id', 'texture_id']).ignore(),
      );
    }
    try {
      await insert.insert({
        studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'body-map.save',
        details: JSON.stringify({ panels: input.panels.length, zones: zoneRows.length, version }),
      }).into('audit_log');
    } catch (err) {
      if (uniqueViolation(err)) throw new HttpError(400, 'Panel or zone ids belong to another style.');
      throw err;
    }
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
  // The style and its saved panels in one query.
  const found = await findStyleWith<{ panels: Panel[] }>(user, styleId, { panels: q.raw(panelsJsonSql('st.id')) }, q);
  if (!found) return null;
  if (found.panels.length) return { version: found.style.version, panels: found.panels, generated: false };
  return generatedMap(user.studioId, found.style, q);
}

/** `loadBodyMap` for a style already read (and so known to be visible to the caller). */
export async function bodyMapOf(studioId: string, style: Style, q: Knex | Knex.Transaction = db()): Promise<BodyMap> {
  const panels = await loadPanels(style.id, q);
  if (panels.length) return { version: style.version, panels, generated: false };
  return generatedMap(studioId, style, q);
}

/** Panels generated from the style (nothing stored), shaped by the base size of its size spec when one is saved. */
async function generatedMap(studioId: string, style: Style, q: Knex | Knex.Transaction): Promise<BodyMap> {
  const [base, pointsCm] = await Promise.all([baseTextureForGeneration(studioId, style.id, q), baseSizePointsCm(style, q)]);
  const machineNeedles =
    style.machine.kind === 'circular'
      ? cylinderNeedles(style.machine.diameterIn, style.machine.gauge, style.machine.needleMultiple)
      : style.machine.bedNeedles;
  const generatedPanels = generatePanels({
    garment: style.garmentType,
    construction: style.construction,
    machineNeedles,
    density: base ?? fallbackDensity,
    sleeveStyle: style.machine.sleeveStyle ?? 'set-in',
    ...(pointsCm ? { measurements: outlineMeasurementsFromSpec(style.garmentType, pointsCm) } : {}),
    baseTextureId: base?.id ?? '',
    newId: () => randomUUID(),
  });
  return { version: style.version, panels: generatedPanels, generated: true };
}
