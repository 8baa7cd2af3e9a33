import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { findStyle } from './styles';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import type { PanelKind } from '@/lib/knit/panel';
import type { StitchBox, Trim, TrimKind, TrimMethod } from '@/lib/rules/trim';
import { trimPairingErrors, type TrimInput, type TrimPatch } from '@/lib/validations/library';

/**
 * A trim placed on a style. A style has one panel of each kind, so `panelKind` names the panel;
 * `toRuleTrim` gives the lib/rules `Trim` once the panel ids are known.
 */
export interface StyleTrim {
  id: string;
  styleId: string;
  panelKind: PanelKind;
  name: string;
  kind: TrimKind;
  method: TrimMethod;
  tempC: number | null;
  /** Knitted logo: the finest line or gap of the artwork, mm. */
  detailMm: number | null;
  box: StitchBox;
  version: number;
  createdAt: string;
  updatedAt: string;
}

interface TrimRow {
  id: string; style_id: string; panel_kind: PanelKind; name: string; kind: TrimKind; method: TrimMethod;
  temp_c: number | null; detail_mm: number | null; box: StitchBox; version: number; created_at: Date; updated_at: Date;
}

function toTrim(r: TrimRow): StyleTrim {
  return {
    id: r.id, styleId: r.style_id, panelKind: r.panel_kind, name: r.name, kind: r.kind, method: r.method, tempC: r.temp_c,
    detailMm: r.detail_mm, box: r.box, version: r.version, createdAt: r.created_at.toISOString(), updatedAt: r.updated_at.toISOString(),
  };
}

/** The rules' view of a trim, on the style's panel of that kind (undefined when the style has no such panel). */
export function toRuleTrim(trim: StyleTrim, panelIdByKind: ReadonlyMap<PanelKind, string>): Trim | undefined {
  const panelId = panelIdByKind.get(trim.panelKind);
  if (!panelId) return undefined;
  const out: Trim = { id: trim.id, panelId, kind: trim.kind, method: trim.method, box: trim.box };
  if (trim.name) out.name = trim.name;
  if (trim.tempC !== null) out.tempC = trim.tempC;
  if (trim.detailMm !== null) out.detailMm = trim.detailMm;
  return out;
}

async function visibleStyleOr404(user: SessionUser, styleId: string, q: Db) {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  return style;
}

/** The trims of a style the user can see, in the order they were placed. */
export async function listTrims(user: SessionUser, styleId: string, q: Db = db()): Promise<StyleTrim[]> {
  await visibleStyleOr404(user, styleId, q);
  return trimsOfStyle(styleId, q);
}

/** `listTrims` for a style the caller has already read (and so may see). */
export async function trimsOfStyle(styleId: string, q: Db = db()): Promise<StyleTrim[]> {
  const rows = (await q('trims').where({ style_id: styleId }).orderBy([{ column: 'created_at' }, { column: 'id' }])) as TrimRow[];
  return rows.map(toTrim);
}

export async function createTrim(user: SessionUser, styleId: string, input: TrimInput, q: Knex = db()): Promise<StyleTrim> {
  return q.transaction(async (trx) => {
    await visibleStyleOr404(user, styleId, trx);
    const [row] = (await trx('trims')
      .insert({
        style_id: styleId, panel_kind: input.panelKind, name: input.name, kind: input.kind, method: input.method,
        temp_c: input.tempC, detail_mm: input.detailMm, box: JSON.stringify(input.box), created_by: user.id,
      })
      .returning('*')) as [TrimRow];
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'trim.create',
      details: JSON.stringify({ trimId: row.id, kind: input.kind, panel: input.panelKind }),
    });
    return toTrim(row);
  });
}

/** Applies a patch when `patch.version` is the trim's version; otherwise 409 and nothing changes. */
export async function updateTrim(user: SessionUser, styleId: string, trimId: string, patch: TrimPatch, q: Knex = db()): Promise<StyleTrim> {
  return q.transaction(async (trx) => {
    await visibleStyleOr404(user, styleId, trx);
    const current = (await trx('trims').where({ id: trimId, style_id: styleId }).first()) as TrimRow | undefined;
    if (!current) throw notFound('Trim not found.');
    const values: Record<string, unknown> = { version: trx.raw('version + 1'), updated_at: trx.fn.now() };
    const changed: string[] = [];
    const pairing = trimPairingErrors({ kind: patch.kind ?? current.kind, method: patch.method ?? current.method });
    if (Object.keys(pairing).length > 0) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: pairing });
    const map: [keyof TrimPatch, string][] = [
      ['panelKind', 'panel_kind'], ['name', 'name'], ['kind', 'kind'], ['method', 'method'], ['tempC', 'temp_c'], ['detailMm', 'detail_mm'],
    ];
    for (const [k, col] of map) {
      if (patch[k] !== undefined) { values[col] = patch[k]; changed.push(k); }
    }
    if (patch.box) { values.box = JSON.stringify(patch.box); changed.push('box'); }
    const rows = (await trx('trims').where({ id: trimId, style_id: styleId, version: patch.version }).update(values).returning('*')) as TrimRow[];
    const row = rows[0];
    if (!row) throw conflict('Someone changed this trim after you opened it. Reload to see their changes.', { currentVersion: current.version });
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'trim.update', details: JSON.stringify({ trimId, fields: changed }),
    });
    return toTrim(row);
  });
}

/** Removes a trim; with `version`, only when it is still the trim's version (else 409). */
export async function deleteTrim(user: SessionUser, styleId: string, trimId: string, version?: number, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    await visibleStyleOr404(user, styleId, trx);
    const current = (await trx('trims').where({ id: trimId, style_id: styleId }).first()) as TrimRow | undefined;
    if (!current) throw notFound('Trim not found.');
    const n = await trx('trims').where({ id: trimId, style_id: styleId, ...(version !== undefined ? { version } : {}) }).del();
    if (n === 0) throw conflict('Someone changed this trim after you opened it. Reload to see their changes.', { currentVersion: current.version });
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'trim.delete',
      details: JSON.stringify({ trimId, kind: current.kind, panel: current.panel_kind }),
    });
  });
}
