import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import type { Lab } from '@/lib/colour/lab';
import type { LabDipTolerance } from '@/lib/colour/difference';
import type { ColourStandardInput, ColourStandardPatch, StandardSource } from '@/lib/validations/colour';

/** A named colour of the studio library. */
export interface ColourStandard {
  id: string;
  name: string;
  /** CIELAB, D65 / 10°. */
  lab: Lab;
  source: StandardSource;
  notes: string;
  tolerance: LabDipTolerance;
  version: number;
  createdAt: string;
  updatedAt: string;
  archivedAt: string | null;
}

interface StandardRow {
  id: string; studio_id: string; name: string; lab_l: number; lab_a: number; lab_b: number; source: StandardSource; notes: string;
  tolerance_formula: 'cmc' | 'de2000'; tolerance_l: number | null; tolerance_c: number | null; tolerance_max: number;
  version: number; created_at: Date; updated_at: Date; archived_at: Date | null;
}

function toleranceOf(r: StandardRow): LabDipTolerance {
  return r.tolerance_formula === 'de2000'
    ? { formula: 'de2000', max: r.tolerance_max }
    : { formula: 'cmc', l: r.tolerance_l ?? 2, c: r.tolerance_c ?? 1, max: r.tolerance_max };
}

function toStandard(r: StandardRow): ColourStandard {
  return {
    id: r.id,
    name: r.name,
    lab: { L: r.lab_l, a: r.lab_a, b: r.lab_b },
    source: r.source,
    notes: r.notes,
    tolerance: toleranceOf(r),
    version: r.version,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    archivedAt: r.archived_at ? r.archived_at.toISOString() : null,
  };
}

function columnsOf(input: ColourStandardInput) {
  const t = input.tolerance;
  return {
    name: input.name,
    lab_l: input.lab.L,
    lab_a: input.lab.a,
    lab_b: input.lab.b,
    source: input.source,
    notes: input.notes,
    tolerance_formula: t.formula,
    tolerance_l: t.formula === 'cmc' ? t.l : null,
    tolerance_c: t.formula === 'cmc' ? t.c : null,
    tolerance_max: t.max,
  };
}

const nameTaken = () =>
  new HttpError(400, 'Some fields need attention.', { fieldErrors: { name: ['A colour standard of this name is already in the library'] } });

function uniqueViolation(err: unknown): boolean {
  return !!err && typeof err === 'object' && (err as { code?: string }).code === '23505';
}

/** The studio's colour standards that are not archived, by name. */
export async function listColourStandards(user: SessionUser, q: Db = db()): Promise<ColourStandard[]> {
  const rows = (await q('colour_standards').where({ studio_id: user.studioId }).whereNull('archived_at').orderBy('name')) as StandardRow[];
  return rows.map(toStandard);
}

/** One standard of the studio (archived ones too, so targets that use them still read); null when not the studio's. */
export async function findColourStandard(user: SessionUser, id: string, q: Db = db()): Promise<ColourStandard | null> {
  const row = (await q('colour_standards').where({ id, studio_id: user.studioId }).first()) as StandardRow | undefined;
  return row ? toStandard(row) : null;
}

/** Standards of a studio by id, archived included, for reading colourway targets. */
export async function colourStandardsByIds(studioId: string, ids: readonly string[], q: Db = db()): Promise<Map<string, ColourStandard>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const rows = (await q('colour_standards').where({ studio_id: studioId }).whereIn('id', unique)) as StandardRow[];
  return new Map(rows.map((r) => [r.id, toStandard(r)]));
}

export async function createColourStandard(user: SessionUser, input: ColourStandardInput, q: Knex = db()): Promise<ColourStandard> {
  return q.transaction(async (trx) => {
    let row: StandardRow;
    try {
      [row] = (await trx('colour_standards')
        .insert({ studio_id: user.studioId, created_by: user.id, ...columnsOf(input) })
        .returning('*')) as [StandardRow];
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'colour-standard.create',
      details: JSON.stringify({ standardId: row.id, name: input.name }),
    });
    return toStandard(row);
  });
}

/** Applies a patch when `patch.version` is the stored version; otherwise 409 and nothing changes. */
export async function updateColourStandard(
  user: SessionUser,
  id: string,
  patch: ColourStandardPatch,
  q: Knex = db(),
): Promise<ColourStandard> {
  return q.transaction(async (trx) => {
    const current = await findColourStandard(user, id, trx);
    if (!current || current.archivedAt) throw notFound('Colour standard not found.');
    const { version, ...changes } = patch;
    const merged: ColourStandardInput = {
      name: changes.name ?? current.name,
      lab: changes.lab ?? current.lab,
      source: changes.source ?? current.source,
      notes: changes.notes ?? current.notes,
      tolerance: changes.tolerance ?? current.tolerance,
    };
    let n: number;
    try {
      n = await trx('colour_standards')
        .where({ id, studio_id: user.studioId, version })
        .whereNull('archived_at')
        .update({ ...columnsOf(merged), version: trx.raw('version + 1'), updated_at: trx.fn.now() });
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    if (n === 0) {
      throw conflict('Someone saved this colour standard after you opened it. Reload to see their changes.', { currentVersion: current.version });
    }
    const fields = Object.keys(changes).filter((k) => changes[k as keyof typeof changes] !== undefined);
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'colour-standard.update',
      details: JSON.stringify({ standardId: id, name: merged.name, fields }),
    });
    const updated = await findColourStandard(user, id, trx);
    if (!updated) throw notFound();
    return updated;
  });
}

/** Archives a standard: hidden from the library; colourway targets that use it keep reading it. */
export async function archiveColourStandard(user: SessionUser, id: string, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    const n = await trx('colour_standards')
      .where({ id, studio_id: user.studioId })
      .whereNull('archived_at')
      .update({ archived_at: trx.fn.now(), updated_at: trx.fn.now(), version: trx.raw('version + 1') });
    if (n === 0) throw notFound('Colour standard not found.');
    await trx('audit_log').insert({
      studio_id: user.studioId, user_id: user.id, action: 'colour-standard.archive', details: JSON.stringify({ standardId: id }),
    });
  });
}
