import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { studioSettings } from './studio-settings';
import type { SessionUser } from './users';
import { findStyle } from './styles';
import { listStyleTextures } from './textures';
import { colourStandardsByIds, type ColourStandard } from './colour-standards';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import { planColourway, type ColourwayPlan, type TargetRoute } from '@/lib/colour/colourway';
import { defaultLabDipTolerance, type LabDipTolerance } from '@/lib/colour/difference';
import { defaultLowContrastDeltaE } from '@/lib/colour/dye-plan';
import { sameLab, type Lab } from '@/lib/colour/lab';
import type { Yarn } from '@/lib/knit/yarn';
import type { ColourwayInput, ColourwayPatch, ColourwayTargetInput } from '@/lib/validations/colour';

/** A target of a colourway, with its colour resolved (from its standard, or as entered). */
export interface ColourwayTarget {
  id: string;
  name: string;
  position: number;
  yarnIds: string[];
  route: TargetRoute;
  /** `standard`: the colour follows a studio colour standard; `lab`: entered here. */
  source: 'standard' | 'lab';
  standardId: string | null;
  standardName: string | null;
  /** CIELAB D65 / 10°. */
  colour: Lab;
  /** What lab dips for this target are judged by: the standard's, else the studio's. */
  tolerance: LabDipTolerance;
  /**
   * `approved`: a lab dip judged against the current colour is approved; `changed-since-approval`:
   * a dip was approved, but against a colour the target (or its standard) no longer has; `open`:
   * no approved dip. Client reviewers see `approved` targets only.
   */
  approval: TargetApproval;
}

export type TargetApproval = 'approved' | 'changed-since-approval' | 'open';

export interface Colourway {
  id: string;
  styleId: string;
  name: string;
  notes: string;
  position: number;
  version: number;
  createdAt: string;
  updatedAt: string;
  targets: ColourwayTarget[];
  /** The dye plan; null for client reviewers, who see approved colours only. */
  plan: ColourwayPlan | null;
  /** Yarns named by targets that the style no longer uses (left out of the plan). */
  unusedYarnIds: string[];
}

/** A yarn of the style as the colour section shows it: the lib/knit yarn and where it is used. */
export interface StyleYarn extends Yarn {
  /** Textures of the style that use it. */
  textureNames: string[];
  /** Fed as a ground yarn, plated (behind the ground), or both. */
  feeds: 'ground' | 'plated' | 'both';
}

export interface StyleColourways {
  colourways: Colourway[];
  yarns: StyleYarn[];
  settings: StudioColourSettings;
}

export interface StudioColourSettings {
  /** The studio's lab-dip tolerance for targets without a standard. */
  tolerance: LabDipTolerance;
  /** Two tones closer than this ΔE00 will not read as two. */
  lowContrastDeltaE: number;
  /** The settings the studio has not set, which take the product default. */
  defaults: ('tolerance' | 'lowContrastDeltaE')[];
}

interface ColourwayRow {
  id: string; style_id: string; name: string; notes: string; position: number; version: number;
  created_at: Date; updated_at: Date; archived_at: Date | null;
}
interface TargetRow {
  id: string; colourway_id: string; position: number; name: string; yarn_ids: string[]; route: TargetRoute;
  standard_id: string | null; lab_l: number | null; lab_a: number | null; lab_b: number | null; archived_at: Date | null;
}

const fieldError = (fieldErrors: Record<string, string[]>) => new HttpError(400, 'Some fields need attention.', { fieldErrors });

/** The studio's colour settings (studios.settings), with the product defaults where none is set. */
export async function studioColourSettings(studioId: string, q: Db = db()): Promise<StudioColourSettings> {
  const s = await studioSettings(studioId, q);
  const t = s.labDipTolerance as { formula?: string; l?: unknown; c?: unknown; max?: unknown } | undefined;
  let tolerance: LabDipTolerance = defaultLabDipTolerance;
  if (t && typeof t.max === 'number' && t.max > 0) {
    tolerance =
      t.formula === 'de2000'
        ? { formula: 'de2000', max: t.max }
        : { formula: 'cmc', l: typeof t.l === 'number' ? t.l : 2, c: typeof t.c === 'number' ? t.c : 1, max: t.max };
  }
  const setLow = typeof s.lowContrastDeltaE === 'number' && s.lowContrastDeltaE > 0;
  const low = setLow ? (s.lowContrastDeltaE as number) : defaultLowContrastDeltaE;
  const defaults: StudioColourSettings['defaults'] = [];
  if (tolerance === defaultLabDipTolerance) defaults.push('tolerance');
  if (!setLow) defaults.push('lowContrastDeltaE');
  return { tolerance, lowContrastDeltaE: low, defaults };
}

/** The yarns of the style's textures, with the textures that use each. */
async function styleYarns(user: SessionUser, styleId: string, q: Db): Promise<StyleYarn[]> {
  const { textures, yarns } = await listStyleTextures(user, styleId, q);
  return yarns.map((y) => {
    const using = textures.filter((t) => t.feeders.some((f) => f.ground === y.id || f.plated?.yarn === y.id));
    const ground = textures.some((t) => t.feeders.some((f) => f.ground === y.id));
    const plated = textures.some((t) => t.feeders.some((f) => f.plated?.yarn === y.id));
    return {
      id: y.id,
      name: y.name,
      dtex: y.dtex,
      fibres: y.fibres,
      colour: y.colour,
      textureNames: using.map((t) => t.name),
      feeds: ground && plated ? 'both' : plated ? 'plated' : 'ground',
    };
  });
}

function toTarget(
  r: TargetRow,
  standards: Map<string, ColourStandard>,
  studioTolerance: LabDipTolerance,
  approvedLabs: ReadonlyMap<string, readonly Lab[]>,
): ColourwayTarget {
  const standard = r.standard_id ? standards.get(r.standard_id) : undefined;
  const colour = standard ? standard.lab : { L: r.lab_l ?? 0, a: r.lab_a ?? 0, b: r.lab_b ?? 0 };
  const judged = approvedLabs.get(r.id) ?? [];
  return {
    id: r.id,
    name: r.name,
    position: r.position,
    yarnIds: r.yarn_ids,
    route: r.route,
    source: r.standard_id ? 'standard' : 'lab',
    standardId: r.standard_id,
    standardName: standard?.name ?? null,
    colour,
    tolerance: standard ? standard.tolerance : studioTolerance,
    approval: judged.some((lab) => sameLab(lab, colour)) ? 'approved' : judged.length > 0 ? 'changed-since-approval' : 'open',
  };
}

/** Per target, the target colours its approved lab dips were judged against (`lab_dips.target_lab`). */
async function approvedDipLabs(targetIds: readonly string[], q: Db): Promise<Map<string, Lab[]>> {
  const labs = new Map<string, Lab[]>();
  if (targetIds.length === 0) return labs;
  const rows = (await q('lab_dips').whereIn('target_id', targetIds).andWhere({ status: 'approved' }).select('target_id', 'target_lab')) as {
    target_id: string;
    target_lab: Lab;
  }[];
  for (const r of rows) labs.set(r.target_id, [...(labs.get(r.target_id) ?? []), r.target_lab]);
  return labs;
}

/**
 * The style's colourways, each with its targets (colours resolved from their standards) and its
 * dye plan over the style's yarns, plus the yarns and the studio's colour settings. Client
 * reviewers see approved colours only: the targets whose current colour is the one an approved lab
 * dip was judged against, no plan, no notes.
 */
export async function listColourways(user: SessionUser, styleId: string, q: Db = db()): Promise<StyleColourways> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const [yarns, settings] = await Promise.all([styleYarns(user, styleId, q), studioColourSettings(user.studioId, q)]);
  const rows = (await q('colourways').where({ style_id: styleId }).whereNull('archived_at').orderBy([{ column: 'position' }, { column: 'created_at' }])) as ColourwayRow[];
  const targetRows = rows.length
    ? ((await q('colourway_targets').whereIn('colourway_id', rows.map((r) => r.id)).whereNull('archived_at').orderBy('position')) as TargetRow[])
    : [];
  const standards = await colourStandardsByIds(user.studioId, targetRows.flatMap((t) => (t.standard_id ? [t.standard_id] : [])), q);
  const client = user.role === 'client';
  const approvedLabs = await approvedDipLabs(targetRows.map((t) => t.id), q);
  const known = new Set(yarns.map((y) => y.id));

  const colourways: Colourway[] = [];
  for (const r of rows) {
    let targets = targetRows.filter((t) => t.colourway_id === r.id).map((t) => toTarget(t, standards, settings.tolerance, approvedLabs));
    if (client) {
      // A colour edited after its dip was approved is not the approved colour: withhold it.
      targets = targets.filter((t) => t.approval === 'approved');
      if (targets.length === 0) continue;
    }
    const unusedYarnIds = [...new Set(targets.flatMap((t) => t.yarnIds.filter((y) => !known.has(y))))];
    const plan = client
      ? null
      : planColourway({
          yarns,
          targets: targets
            .map((t) => ({ id: t.id, name: t.name, colour: t.colour, route: t.route, yarnIds: t.yarnIds.filter((y) => known.has(y)) }))
            .filter((t) => t.yarnIds.length > 0),
          options: { lowContrastDeltaE: settings.lowContrastDeltaE },
        });
    colourways.push({
      id: r.id,
      styleId: r.style_id,
      name: r.name,
      notes: client ? '' : r.notes,
      position: r.position,
      version: r.version,
      createdAt: r.created_at.toISOString(),
      updatedAt: r.updated_at.toISOString(),
      targets,
      plan,
      unusedYarnIds,
    });
  }
  return { colourways, yarns, settings };
}

/** One colourway of the style as `listColourways` gives it; 404 when it is not there. */
export async function findColourway(user: SessionUser, styleId: string, colourwayId: string, q: Db = db()): Promise<Colourway> {
  const { colourways } = await listColourways(user, styleId, q);
  const found = colourways.find((c) => c.id === colourwayId);
  if (!found) throw notFound('Colourway not found.');
  return found;
}

/**
 * Checks targets against the style and the library: every yarn is a yarn of the style's textures
 * that is dyeable (yarns that come coloured take no target), every standard is the studio's and
 * live (or already the target's), and every target id belongs to this colourway. Field errors.
 */
async function checkTargets(
  user: SessionUser,
  styleId: string,
  targets: readonly ColourwayTargetInput[],
  existing: readonly TargetRow[],
  q: Db,
): Promise<Map<string, ColourStandard>> {
  const yarns = await styleYarns(user, styleId, q);
  const byId = new Map(yarns.map((y) => [y.id, y]));
  const standardIds = targets.flatMap((t) => (t.colour.source === 'standard' ? [t.colour.standardId] : []));
  const standards = await colourStandardsByIds(user.studioId, standardIds, q);
  const errors: Record<string, string[]> = {};
  const add = (path: string, message: string) => (errors[path] ??= []).push(message);
  targets.forEach((t, i) => {
    t.yarnIds.forEach((id) => {
      const yarn = byId.get(id);
      if (!yarn) add(`targets.${i}.yarnIds`, 'Not a yarn of this style’s textures');
      else if (yarn.colour.state !== 'dyeable') add(`targets.${i}.yarnIds`, `${yarn.name} comes ${yarn.colour.state}: it keeps its own colour`);
    });
    if (t.colour.source === 'standard') {
      const s = standards.get(t.colour.standardId);
      const before = existing.find((e) => e.id === t.id);
      if (!s) add(`targets.${i}.colour.standardId`, 'Not a colour standard of the studio');
      else if (s.archivedAt && before?.standard_id !== s.id) add(`targets.${i}.colour.standardId`, 'This colour standard is archived');
    }
    if (t.id && !existing.some((e) => e.id === t.id)) add(`targets.${i}.id`, 'Not a target of this colourway');
  });
  if (Object.keys(errors).length > 0) throw fieldError(errors);
  return standards;
}

/**
 * Replaces the colourway's targets: saved ones keep their id (and their lab dips), new ones are
 * added, and removed ones are deleted, or archived when lab dips refer to them.
 */
async function writeTargets(colourwayId: string, targets: readonly ColourwayTargetInput[], existing: readonly TargetRow[], trx: Knex.Transaction) {
  const keep = new Set(targets.flatMap((t) => (t.id ? [t.id] : [])));
  const removed = existing.filter((e) => !keep.has(e.id));
  if (removed.length) {
    const withDips = new Set(
      (await trx('lab_dips').whereIn('target_id', removed.map((r) => r.id)).distinct('target_id').pluck('target_id')) as string[],
    );
    const archive = removed.filter((r) => withDips.has(r.id)).map((r) => r.id);
    const drop = removed.filter((r) => !withDips.has(r.id)).map((r) => r.id);
    if (archive.length) await trx('colourway_targets').whereIn('id', archive).update({ archived_at: trx.fn.now() });
    if (drop.length) await trx('colourway_targets').whereIn('id', drop).del();
  }
  for (const [position, t] of targets.entries()) {
    const values = {
      position,
      name: t.name,
      yarn_ids: t.yarnIds,
      route: t.route,
      standard_id: t.colour.source === 'standard' ? t.colour.standardId : null,
      lab_l: t.colour.source === 'lab' ? t.colour.lab.L : null,
      lab_a: t.colour.source === 'lab' ? t.colour.lab.a : null,
      lab_b: t.colour.source === 'lab' ? t.colour.lab.b : null,
    };
    if (t.id) await trx('colourway_targets').where({ id: t.id, colourway_id: colourwayId }).update(values);
    else await trx('colourway_targets').insert({ colourway_id: colourwayId, ...values });
  }
  return { removed: removed.map((r) => r.name) };
}

const nameTaken = () => fieldError({ name: ['A colourway of this name is already on the style'] });

function uniqueViolation(err: unknown): boolean {
  return !!err && typeof err === 'object' && (err as { code?: string }).code === '23505';
}

function describeTargets(targets: readonly ColourwayTargetInput[]) {
  return targets.map((t) => ({
    name: t.name,
    route: t.route,
    colour: t.colour.source === 'lab' ? t.colour.lab : { standardId: t.colour.standardId },
  }));
}

export async function createColourway(user: SessionUser, styleId: string, input: ColourwayInput, q: Knex = db()): Promise<Colourway> {
  const id = await q.transaction(async (trx) => {
    const style = await findStyle(user, styleId, trx);
    if (!style) throw notFound('Style not found.');
    await checkTargets(user, styleId, input.targets, [], trx);
    const last = (await trx('colourways').where({ style_id: styleId }).max('position as max').first()) as { max: number | null } | undefined;
    let row: ColourwayRow;
    try {
      [row] = (await trx('colourways')
        .insert({ style_id: styleId, name: input.name, notes: input.notes, position: (last?.max ?? -1) + 1, created_by: user.id })
        .returning('*')) as [ColourwayRow];
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    await writeTargets(row.id, input.targets, [], trx);
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'colourway.create',
      details: JSON.stringify({ colourwayId: row.id, name: input.name, targets: describeTargets(input.targets) }),
    });
    return row.id;
  });
  return findColourway(user, styleId, id, q);
}

/**
 * Applies a patch (name, notes, the whole target list) when `patch.version` is the colourway's
 * version, raising it; otherwise 409 and nothing changes.
 */
export async function updateColourway(
  user: SessionUser,
  styleId: string,
  colourwayId: string,
  patch: ColourwayPatch,
  q: Knex = db(),
): Promise<Colourway> {
  await q.transaction(async (trx) => {
    const style = await findStyle(user, styleId, trx);
    if (!style) throw notFound('Style not found.');
    const current = (await trx('colourways').where({ id: colourwayId, style_id: styleId }).whereNull('archived_at').first()) as ColourwayRow | undefined;
    if (!current) throw notFound('Colourway not found.');
    const existing = (await trx('colourway_targets').where({ colourway_id: colourwayId }).whereNull('archived_at')) as TargetRow[];
    if (patch.targets) await checkTargets(user, styleId, patch.targets, existing, trx);
    const values: Record<string, unknown> = { version: trx.raw('version + 1'), updated_at: trx.fn.now() };
    if (patch.name !== undefined) values.name = patch.name;
    if (patch.notes !== undefined) values.notes = patch.notes;
    let n: number;
    try {
      n = await trx('colourways').where({ id: colourwayId, style_id: styleId, version: patch.version }).whereNull('archived_at').update(values);
    } catch (err) {
      if (uniqueViolation(err)) throw nameTaken();
      throw err;
    }
    if (n === 0) {
      throw conflict('Someone saved this colourway after you opened it. Reload to see their changes.', { currentVersion: current.version });
    }
    const removed = patch.targets ? (await writeTargets(colourwayId, patch.targets, existing, trx)).removed : [];
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'colourway.update',
      details: JSON.stringify({
        colourwayId,
        name: patch.name ?? current.name,
        fields: Object.keys(patch).filter((k) => k !== 'version'),
        ...(patch.targets ? { targets: describeTargets(patch.targets), removed } : {}),
      }),
    });
  });
  return findColourway(user, styleId, colourwayId, q);
}

/** Archives a colourway (hidden; its targets and lab dips are kept). */
export async function archiveColourway(user: SessionUser, styleId: string, colourwayId: string, q: Knex = db()): Promise<void> {
  await q.transaction(async (trx) => {
    const style = await findStyle(user, styleId, trx);
    if (!style) throw notFound('Style not found.');
    const row = (await trx('colourways').where({ id: colourwayId, style_id: styleId }).whereNull('archived_at').first()) as ColourwayRow | undefined;
    if (!row) throw notFound('Colourway not found.');
    await trx('colourways').where({ id: colourwayId }).update({ archived_at: trx.fn.now(), updated_at: trx.fn.now(), version: trx.raw('version + 1') });
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'colourway.archive',
      details: JSON.stringify({ colourwayId, name: row.name }),
    });
  });
}
