import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { studioSettings } from './studio-settings';
import type { SessionUser } from './users';
import { findStyle, type Style } from './styles';
import { storeFile, withStoredFiles } from './files';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import type { InspectedUpload } from '@/lib/files/inspect';
import type { ObjectStore } from '@/lib/storage/object-store';
import type { ForceExtensionPoint } from '@/lib/knit/texture';
import type { TextureFunction } from '@/lib/validations/library';
import type {
  CorrectionCreate, CorrectionDecision, SampleCommentCreate, SampleRoundCreate, SampleRoundPatch, SeamlessFactorPut, SizeSpecSave,
} from '@/lib/validations/fit';
import { defaultSizeSpec, pointsForGarment, type SizeSpec, type SizeSpecPoint } from '@/lib/fit/spec';
import { resolvePoint, resolveValues } from '@/lib/fit/grading';
import { applyCorrection, type CorrectionScope, type SampleRoundKind } from '@/lib/fit/sample-round';
import { defaultSeamlessFactor } from '@/lib/fit/needles';
import { defaultCompressionTarget, type CompressionTarget } from '@/lib/fit/compression-target';
import { compressionBySize, flatNeedles, seamlessNeedles, type FlatSizeNeedles, type SeamlessSizeNeedles, type SizeCompression } from '@/lib/fit/fit-sheet';
import { compressionFigureCaution } from '@/lib/fit/compression-target';
import { girthKeys, pointsOfMeasure, type GirthKey, type PointKey } from '@/lib/fit/points';

// ---------------------------------------------------------------------------------------------
// Types at the boundary

/** A texture of the style, as far as fit needs it. */
export interface FitTexture {
  id: string;
  name: string;
  function: TextureFunction | null;
  walesPerCm: number;
  coursesPerCm: number;
  forceExtension: ForceExtensionPoint[] | null;
}

export interface SampleMeasurement { point: PointKey; measuredCm: number; specCm: number | null; toleranceCm: number }
export interface SampleComment { id: string; userName: string | null; body: string; createdAt: string }
export type CorrectionStatus = 'proposed' | 'accepted' | 'rejected';
export interface SampleCorrection {
  id: string; roundId: string; point: PointKey; size: string; fromCm: number | null; toCm: number; scope: CorrectionScope;
  reason: string; status: CorrectionStatus; proposedBy: string | null; proposedAt: string; decidedBy: string | null; decidedAt: string | null;
}
/** A photo of a round's sample; `url` is the private download route, which checks the caller. */
export interface SampleRoundPhoto {
  id: string; fileId: string; url: string; name: string; contentType: string; widthPx: number | null; heightPx: number | null;
  byteSize: number; uploadedBy: string | null; createdAt: string;
}
export interface SampleRound {
  id: string; roundNo: number; kind: SampleRoundKind; size: string; receivedOn: string | null; notes: string;
  createdBy: string | null; createdAt: string; updatedAt: string;
  measurements: SampleMeasurement[]; comments: SampleComment[]; corrections: SampleCorrection[]; photos: SampleRoundPhoto[];
}

export interface StudioSeamlessFactor {
  factor: number;
  /** True when the studio has not set one and the common-practice default applies. */
  isDefault: boolean;
}

/** Everything the Fit section shows, read at one version of the style. */
export interface FitDocument {
  /** The style's version: a write must carry it. */
  version: number;
  styleId: string;
  garmentType: Style['garmentType'];
  construction: Style['construction'];
  machine: Style['machine'];
  sizes: string[];
  spec: SizeSpec;
  /** False when nothing is saved yet and the spec shows the defaults. */
  saved: boolean;
  updatedAt: string | null;
  updatedBy: string | null;
  studioFactor: StudioSeamlessFactor;
  textures: FitTexture[];
  rounds: SampleRound[];
}

interface SpecRow {
  style_id: string; base_size: string; base_texture_id: string | null; compression_texture_id: string | null;
  cylinder_diameters_in: number[]; compression_target: CompressionTarget; updated_at: Date; updated_by_name: string | null;
}
interface PointRow { point: PointKey; position: number; base_cm: number | null; grade_cm: number; tolerance_cm: number }
interface ValueRow { point: PointKey; size: string; value_cm: number }
interface GirthRow { size: string; girth: GirthKey; value_cm: number }
interface TextureRow {
  id: string; name: string; function: TextureFunction | null; wales_per_cm: number; courses_per_cm: number;
  force_extension: ForceExtensionPoint[] | null;
}

const fieldError = (field: string, message: string) =>
  new HttpError(400, 'Some fields need attention.', { fieldErrors: { [field]: [message] } });

const stale = (currentVersion: number) =>
  conflict('Someone saved this style after you opened it. Your entries are still here; reload to see theirs.', { currentVersion });

async function visibleStyle(user: SessionUser, styleId: string, q: Db): Promise<Style> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  return style;
}

/**
 * Raises the style's version when `version` is the stored one; otherwise 409 and nothing changes.
 * `null` raises it whatever it is, for writes that cannot collide with another (a photo added or
 * removed): a write carrying the older version, such as deleting that round, then gets its 409.
 */
async function bumpVersion(user: SessionUser, style: Style, version: number | null, trx: Knex.Transaction): Promise<number> {
  const bumped = await trx('styles')
    .where({ id: style.id, studio_id: user.studioId, ...(version === null ? {} : { version }) })
    .whereNull('archived_at')
    .update({ version: trx.raw('version + 1'), updated_at: trx.fn.now() })
    .returning('version');
  if (bumped.length === 0) throw version === null ? notFound('Style not found.') : stale(style.version);
  return (bumped[0] as { version: number }).version;
}

async function audit(user: SessionUser, styleId: string, action: string, details: Record<string, unknown>, trx: Db) {
  await trx('audit_log').insert({ studio_id: user.studioId, style_id: styleId, user_id: user.id, action, details: JSON.stringify(details) });
}

// ---------------------------------------------------------------------------------------------
// Reading

/** The style's textures with their density and force–extension points, in the style's order. */
export async function fitTextures(user: SessionUser, styleId: string, q: Db = db()): Promise<FitTexture[]> {
  const rows = (await q('style_textures as stx')
    .join('textures as t', 't.id', 'stx.texture_id')
    .where({ 'stx.style_id': styleId, 't.studio_id': user.studioId })
    .orderBy([{ column: 'stx.position' }, { column: 't.name' }])
    .select('t.id', 't.name', 't.function', 't.wales_per_cm', 't.courses_per_cm', 't.force_extension')) as TextureRow[];
  return rows.map((r) => ({
    id: r.id, name: r.name, function: r.function, walesPerCm: Number(r.wales_per_cm), coursesPerCm: Number(r.courses_per_cm),
    forceExtension: r.force_extension && r.force_extension.length > 0 ? r.force_extension : null,
  }));
}

/** The studio's seamless equivalence factor (studios.settings.fit.seamlessFactor), or the common-practice default. */
export async function studioSeamlessFactor(studioId: string, q: Db = db()): Promise<StudioSeamlessFactor> {
  const f = ((await studioSettings(studioId, q)).fit as { seamlessFactor?: unknown } | undefined)?.seamlessFactor;
  return typeof f === 'number' && f > 0 ? { factor: f, isDefault: false } : { factor: defaultSeamlessFactor, isDefault: true };
}

/** The stored spec of a style, or null when none is saved. Sizes outside `labels` are left out. */
async function loadSpec(styleId: string, labels: readonly string[], q: Db): Promise<(SizeSpec & { updatedAt: string; updatedBy: string | null }) | null> {
  const row = (await q('size_specs as s')
    .leftJoin('users as u', 'u.id', 's.updated_by')
    .where('s.style_id', styleId)
    .first('s.*', 'u.name as updated_by_name')) as SpecRow | undefined;
  if (!row) return null;
  const [points, overrides, girths, cutAndSew] = await Promise.all([
    q('size_spec_points').where({ style_id: styleId }).orderBy('position') as Promise<PointRow[]>,
    q('size_spec_overrides').where({ style_id: styleId }).whereIn('size', labels) as Promise<ValueRow[]>,
    q('size_body_girths').where({ style_id: styleId }).whereIn('size', labels) as Promise<GirthRow[]>,
    q('cut_and_sew_entries').where({ style_id: styleId }).whereIn('size', labels) as Promise<ValueRow[]>,
  ]);
  const spec: SizeSpec = {
    baseSize: row.base_size,
    points: points.map((p) => ({
      point: p.point, baseCm: p.base_cm, gradeCm: p.grade_cm, toleranceCm: p.tolerance_cm,
      overrides: Object.fromEntries(overrides.filter((o) => o.point === p.point).map((o) => [o.size, o.value_cm])),
    })),
    girths: {},
    cutAndSew: {},
    baseTextureId: row.base_texture_id,
    compressionTextureId: row.compression_texture_id,
    cylinderDiametersIn: row.cylinder_diameters_in.map(Number),
    target: row.compression_target ?? defaultCompressionTarget,
  };
  for (const g of girths) (spec.girths[g.size] ??= {})[g.girth] = g.value_cm;
  for (const c of cutAndSew) (spec.cutAndSew[c.point] ??= {})[c.size] = c.value_cm;
  return { ...spec, updatedAt: row.updated_at.toISOString(), updatedBy: row.updated_by_name };
}

function defaultTextures(textures: readonly FitTexture[]) {
  return {
    baseTextureId: textures[0]?.id ?? null,
    compressionTextureId: textures.find((t) => t.function === 'compression' && t.forceExtension)?.id ?? textures.find((t) => t.forceExtension)?.id ?? null,
  };
}

/**
 * The saved size spec's values per point of measure and size, cm (graded and overridden as the Fit
 * section shows them), with its base size; null when no spec is saved.
 */
export async function gradedSizeSpec(style: Style, q: Db = db()): Promise<{ baseSize: string; values: Partial<Record<PointKey, Record<string, number | null>>> } | null> {
  const stored = await loadSpec(style.id, style.sizes.labels, q);
  if (!stored) return null;
  const baseSize = style.sizes.labels.includes(stored.baseSize) ? stored.baseSize : style.sizes.base;
  return { baseSize, values: resolveValues(pointsForGarment(stored, style.garmentType), style.sizes.labels, baseSize) };
}

/** The base size's value of every point of measure in the style's saved size spec, cm; null when no spec is saved. */
export async function baseSizePointsCm(style: Style, q: Db = db()): Promise<Partial<Record<PointKey, number | null>> | null> {
  const spec = await gradedSizeSpec(style, q);
  if (!spec) return null;
  return Object.fromEntries(Object.entries(spec.values).map(([point, bySize]) => [point, bySize?.[spec.baseSize] ?? null]));
}

/** The spec the style has, or its defaults; points in the garment's order; the base size one of the style's sizes. */
function effectiveSpec(style: Style, stored: SizeSpec | null, textures: readonly FitTexture[]): SizeSpec {
  const diameter = style.machine.kind === 'circular' ? style.machine.diameterIn : undefined;
  const spec = stored ?? { ...defaultSizeSpec(style.garmentType, style.sizes.base, diameter), ...defaultTextures(textures) };
  const baseSize = style.sizes.labels.includes(spec.baseSize) ? spec.baseSize : style.sizes.base;
  return { ...spec, baseSize, points: pointsForGarment(spec, style.garmentType) };
}

async function loadRounds(styleId: string, q: Db): Promise<SampleRound[]> {
  const rounds = (await q('sample_rounds as r')
    .leftJoin('users as u', 'u.id', 'r.created_by')
    .where('r.style_id', styleId)
    .orderBy('r.round_no')
    .select('r.*', 'u.name as created_by_name', q.raw("to_char(r.received_on, 'YYYY-MM-DD') as received_on_text"))) as {
    id: string; round_no: number; kind: SampleRoundKind; size: string; received_on_text: string | null; notes: string;
    created_by_name: string | null; created_at: Date; updated_at: Date;
  }[];
  if (rounds.length === 0) return [];
  const ids = rounds.map((r) => r.id);
  const [measurements, comments, corrections, photos] = await Promise.all([
    q('sample_measurements').whereIn('round_id', ids) as Promise<{ round_id: string; point: PointKey; measured_cm: number; spec_cm: number | null; tolerance_cm: number }[]>,
    q('sample_comments as c').leftJoin('users as u', 'u.id', 'c.user_id').whereIn('c.round_id', ids).orderBy([{ column: 'c.created_at' }, { column: 'c.id' }])
      .select('c.*', 'u.name as user_name') as Promise<{ id: string; round_id: string; user_name: string | null; body: string; created_at: Date }[]>,
    q('sample_corrections as k').leftJoin('users as p', 'p.id', 'k.proposed_by').leftJoin('users as d', 'd.id', 'k.decided_by')
      .whereIn('k.round_id', ids).orderBy([{ column: 'k.proposed_at' }, { column: 'k.id' }])
      .select('k.*', 'p.name as proposed_by_name', 'd.name as decided_by_name') as Promise<{
        id: string; round_id: string; point: PointKey; size: string; from_cm: number | null; to_cm: number; scope: CorrectionScope; reason: string;
        status: CorrectionStatus; proposed_by_name: string | null; proposed_at: Date; decided_by_name: string | null; decided_at: Date | null;
      }[]>,
    q('sample_round_photos as p').join('files as f', 'f.id', 'p.file_id').leftJoin('users as u', 'u.id', 'p.created_by')
      .whereIn('p.round_id', ids).orderBy([{ column: 'p.created_at' }, { column: 'p.id' }])
      .select('p.id', 'p.round_id', 'p.file_id', 'p.created_at', 'f.original_name', 'f.content_type', 'f.width_px', 'f.height_px', 'f.byte_size', 'u.name as uploaded_by_name') as Promise<{
        id: string; round_id: string; file_id: string; created_at: Date; original_name: string; content_type: string;
        width_px: number | null; height_px: number | null; byte_size: number; uploaded_by_name: string | null;
      }[]>,
  ]);
  const order = (p: PointKey) => Object.keys(pointsOfMeasure).indexOf(p);
  return rounds.map((r) => ({
    id: r.id, roundNo: r.round_no, kind: r.kind, size: r.size, receivedOn: r.received_on_text, notes: r.notes,
    createdBy: r.created_by_name, createdAt: r.created_at.toISOString(), updatedAt: r.updated_at.toISOString(),
    measurements: measurements
      .filter((m) => m.round_id === r.id)
      .sort((a, b) => order(a.point) - order(b.point))
      .map((m) => ({ point: m.point, measuredCm: m.measured_cm, specCm: m.spec_cm, toleranceCm: m.tolerance_cm })),
    comments: comments.filter((c) => c.round_id === r.id).map((c) => ({ id: c.id, userName: c.user_name, body: c.body, createdAt: c.created_at.toISOString() })),
    corrections: corrections.filter((k) => k.round_id === r.id).map((k) => ({
      id: k.id, roundId: k.round_id, point: k.point, size: k.size, fromCm: k.from_cm, toCm: k.to_cm, scope: k.scope, reason: k.reason,
      status: k.status, proposedBy: k.proposed_by_name, proposedAt: k.proposed_at.toISOString(), decidedBy: k.decided_by_name,
      decidedAt: k.decided_at ? k.decided_at.toISOString() : null,
    })),
    photos: photos.filter((p) => p.round_id === r.id).map((p) => ({
      id: p.id, fileId: p.file_id, url: `/api/files/${p.file_id}`, name: p.original_name, contentType: p.content_type,
      widthPx: p.width_px, heightPx: p.height_px, byteSize: p.byte_size, uploadedBy: p.uploaded_by_name, createdAt: p.created_at.toISOString(),
    })),
  }));
}

/**
 * The Fit section of a style for anyone who can see it (mill and client accounts: styles shared
 * with them): the spec or its defaults, the studio factor, the style's textures, the sample rounds.
 */
export async function loadFit(user: SessionUser, styleId: string, q: Db = db()): Promise<FitDocument> {
  return fitOfStyle(user, await visibleStyle(user, styleId, q), q);
}

/** `loadFit` for a style the caller has already read (and so may see). */
export async function fitOfStyle(user: SessionUser, style: Style, q: Db = db()): Promise<FitDocument> {
  const [stored, textures, studioFactor, rounds] = await Promise.all([
    loadSpec(style.id, style.sizes.labels, q),
    fitTextures(user, style.id, q),
    studioSeamlessFactor(user.studioId, q),
    loadRounds(style.id, q),
  ]);
  return {
    version: style.version,
    styleId: style.id,
    garmentType: style.garmentType,
    construction: style.construction,
    machine: style.machine,
    sizes: style.sizes.labels,
    spec: effectiveSpec(style, stored, textures),
    saved: stored !== null,
    updatedAt: stored?.updatedAt ?? null,
    updatedBy: stored?.updatedBy ?? null,
    studioFactor,
    textures,
    rounds,
  };
}

// ---------------------------------------------------------------------------------------------
// The computed sheet (needles, cylinders, compression): what the mill needs from fit

export interface FitSheet {
  version: number;
  styleId: string;
  construction: Style['construction'];
  baseSize: string;
  sizes: string[];
  baseTexture: { id: string; name: string; walesPerCm: number; coursesPerCm: number } | null;
  compressionTexture: { id: string; name: string } | null;
  seamless: SeamlessSizeNeedles[] | null;
  flat: FlatSizeNeedles[] | null;
  compression: SizeCompression[] | null;
  caution: string;
  /** Why a part of the sheet is empty. */
  notes: string[];
}

/** The needles, cylinders and compression estimate computed from the saved spec (or its defaults). */
export function computeFitSheet(doc: FitDocument): FitSheet {
  const { spec } = doc;
  const notes: string[] = [];
  const values = resolveValues(spec.points, doc.sizes, spec.baseSize);
  const base = doc.textures.find((t) => t.id === spec.baseTextureId) ?? doc.textures[0] ?? null;
  const compressionTexture = doc.textures.find((t) => t.id === spec.compressionTextureId) ?? null;
  const density = base ? { walesPerCm: base.walesPerCm, coursesPerCm: base.coursesPerCm } : null;
  if (!density) notes.push('The style has no texture yet: add one to compute needles.');
  let seamless: SeamlessSizeNeedles[] | null = null;
  let flat: FlatSizeNeedles[] | null = null;
  if (density && doc.machine.kind === 'circular') {
    seamless = seamlessNeedles({ garment: doc.garmentType, machine: doc.machine, sizes: doc.sizes, values, density, cylinderDiametersIn: spec.cylinderDiametersIn });
  } else if (density && doc.machine.kind === 'flat') {
    flat = flatNeedles({ garment: doc.garmentType, machine: doc.machine, sizes: doc.sizes, values, density });
  }
  let compression: SizeCompression[] | null = null;
  if (compressionTexture?.forceExtension) {
    compression = compressionBySize({ garment: doc.garmentType, sizes: doc.sizes, values, girths: spec.girths, curve: compressionTexture.forceExtension, target: spec.target });
  } else {
    notes.push('No compression texture with a force–extension test is chosen: no compression estimate.');
  }
  return {
    version: doc.version, styleId: doc.styleId, construction: doc.construction, baseSize: spec.baseSize, sizes: doc.sizes,
    baseTexture: base ? { id: base.id, name: base.name, walesPerCm: base.walesPerCm, coursesPerCm: base.coursesPerCm } : null,
    compressionTexture: compressionTexture ? { id: compressionTexture.id, name: compressionTexture.name } : null,
    seamless, flat, compression, caution: compressionFigureCaution, notes,
  };
}

export async function loadFitSheet(user: SessionUser, styleId: string, q: Db = db()): Promise<FitSheet> {
  return computeFitSheet(await loadFit(user, styleId, q));
}

// ---------------------------------------------------------------------------------------------
// Writing the spec

async function assertStyleTexture(user: SessionUser, styleId: string, textureId: string | null, field: string, needsCurve: boolean, q: Db) {
  if (!textureId) return;
  const t = (await q('style_textures as stx')
    .join('textures as tx', 'tx.id', 'stx.texture_id')
    .where({ 'stx.style_id': styleId, 'stx.texture_id': textureId, 'tx.studio_id': user.studioId })
    .first('tx.force_extension')) as { force_extension: unknown[] | null } | undefined;
  if (!t) throw fieldError(field, 'Not one of the style textures');
  if (needsCurve && !(Array.isArray(t.force_extension) && t.force_extension.length > 0)) {
    throw fieldError(field, 'This texture has no force–extension test; choose one that has');
  }
}

function assertSizes(style: Style, input: SizeSpecSave) {
  const labels = new Set(style.sizes.labels);
  const errors: Record<string, string[]> = {};
  const check = (path: string, size: string) => {
    if (!labels.has(size)) errors[path] = [`${size} is not one of the style sizes (${style.sizes.labels.join(', ')})`];
  };
  check('baseSize', input.baseSize);
  input.points.forEach((p, i) => Object.keys(p.overrides).forEach((s) => check(`points.${i}.overrides.${s}`, s)));
  Object.keys(input.girths).forEach((s) => check(`girths.${s}`, s));
  for (const [point, bySize] of Object.entries(input.cutAndSew)) {
    if (pointsOfMeasure[point as PointKey].kind !== 'half-width') errors[`cutAndSew.${point}`] = ['Only half-widths convert between cut-and-sew and seamless'];
    Object.keys(bySize ?? {}).forEach((s) => check(`cutAndSew.${point}.${s}`, s));
  }
  if (Object.keys(errors).length > 0) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: errors });
}

/**
 * Writes the spec row and its points (all of them, or only those named), each point's overrides
 * replaced for the style's sizes. Rows of sizes the style no longer has are left alone.
 */
async function writeSpec(user: SessionUser, style: Style, spec: SizeSpec, trx: Knex.Transaction, only?: readonly PointKey[]) {
  const labels = style.sizes.labels;
  await trx('size_specs')
    .insert({
      style_id: style.id, base_size: spec.baseSize, base_texture_id: spec.baseTextureId, compression_texture_id: spec.compressionTextureId,
      cylinder_diameters_in: spec.cylinderDiametersIn, compression_target: JSON.stringify(spec.target), updated_by: user.id,
    })
    .onConflict('style_id')
    .merge(['base_size', 'base_texture_id', 'compression_texture_id', 'cylinder_diameters_in', 'compression_target', 'updated_by', 'updated_at']);
  const points = spec.points.map((p, position) => ({ p, position })).filter(({ p }) => !only || only.includes(p.point));
  for (const { p, position } of points) {
    await trx('size_spec_points')
      .insert({ style_id: style.id, point: p.point, position, base_cm: p.baseCm, grade_cm: p.gradeCm, tolerance_cm: p.toleranceCm })
      .onConflict(['style_id', 'point'])
      .merge();
  }
  const keys = points.map(({ p }) => p.point);
  if (keys.length) {
    await trx('size_spec_overrides').where({ style_id: style.id }).whereIn('point', keys).whereIn('size', labels).del();
    const rows = points.flatMap(({ p }) =>
      Object.entries(p.overrides)
        .filter(([size]) => size !== spec.baseSize && labels.includes(size))
        .map(([size, value_cm]) => ({ style_id: style.id, point: p.point, size, value_cm })),
    );
    if (rows.length) await trx('size_spec_overrides').insert(rows);
  }
}

function pointChanged(a: SizeSpecPoint | undefined, b: SizeSpecPoint): boolean {
  if (!a) return b.baseCm !== null || Object.keys(b.overrides).length > 0;
  return a.baseCm !== b.baseCm || a.gradeCm !== b.gradeCm || a.toleranceCm !== b.toleranceCm ||
    JSON.stringify(Object.entries(a.overrides).sort()) !== JSON.stringify(Object.entries(b.overrides).sort());
}

/**
 * Saves the size spec when `input.version` is the style's version, raising it by one; otherwise
 * 409 and nothing changes. Sizes must be the style's; textures must be the style's (the
 * compression one with a force–extension test). Values of sizes the style no longer has are kept.
 */
export async function saveSizeSpec(user: SessionUser, styleId: string, input: SizeSpecSave, q: Knex = db()): Promise<FitDocument> {
  await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    assertSizes(style, input);
    await assertStyleTexture(user, style.id, input.baseTextureId, 'baseTextureId', false, trx);
    await assertStyleTexture(user, style.id, input.compressionTextureId, 'compressionTextureId', true, trx);
    const before = await loadSpec(style.id, style.sizes.labels, trx);
    const version = await bumpVersion(user, style, input.version, trx);
    const { version: _version, ...fields } = input;
    await writeSpec(user, style, { ...fields, points: fields.points }, trx);
    const labels = style.sizes.labels;
    await trx('size_body_girths').where({ style_id: style.id }).whereIn('size', labels).del();
    const girthRows = Object.entries(input.girths).flatMap(([size, g]) =>
      girthKeys.flatMap((girth) => (g[girth] !== undefined ? [{ style_id: style.id, size, girth, value_cm: g[girth] }] : [])),
    );
    if (girthRows.length) await trx('size_body_girths').insert(girthRows);
    await trx('cut_and_sew_entries').where({ style_id: style.id }).whereIn('size', labels).del();
    const csRows = Object.entries(input.cutAndSew).flatMap(([point, bySize]) =>
      Object.entries(bySize ?? {}).map(([size, value_cm]) => ({ style_id: style.id, point, size, value_cm })),
    );
    if (csRows.length) await trx('cut_and_sew_entries').insert(csRows);
    const old = new Map((before?.points ?? []).map((p) => [p.point, p]));
    const changed = input.points.filter((p) => pointChanged(old.get(p.point), p)).map((p) => p.point);
    await audit(user, style.id, 'fit.spec.save', {
      version, baseSize: input.baseSize, changedPoints: changed, girthSizes: Object.keys(input.girths).length, first: before === null,
    }, trx);
  });
  return loadFit(user, styleId, q);
}

/**
 * Sets the studio's seamless equivalence factor when `input.expected` is the factor the studio
 * has now (null: none set); otherwise 409 and nothing changes. Recorded in the style's history.
 */
export async function setStudioSeamlessFactor(user: SessionUser, styleId: string, input: SeamlessFactorPut, q: Knex = db()): Promise<StudioSeamlessFactor> {
  return q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    const stored = ((await studioSettings(user.studioId, trx, { forUpdate: true })).fit as { seamlessFactor?: unknown } | undefined)?.seamlessFactor;
    const current = typeof stored === 'number' ? stored : null;
    if (current !== input.expected) {
      throw conflict('Someone changed the studio factor after you opened this page. Reload to see it.', { currentFactor: current });
    }
    await trx('studios')
      .where({ id: user.studioId })
      .update({
        settings: trx.raw(
          "jsonb_set(coalesce(settings, '{}'::jsonb), '{fit}', coalesce(settings->'fit', '{}'::jsonb) || jsonb_build_object('seamlessFactor', ?::double precision))",
          [input.factor],
        ),
      });
    await audit(user, style.id, 'fit.factor', { from: current ?? defaultSeamlessFactor, to: input.factor }, trx);
    return { factor: input.factor, isDefault: false };
  });
}

// ---------------------------------------------------------------------------------------------
// Sample rounds

/** The spec as stored, created from the defaults when the style has none yet. */
async function specForWrite(user: SessionUser, style: Style, trx: Knex.Transaction): Promise<SizeSpec> {
  const stored = await loadSpec(style.id, style.sizes.labels, trx);
  if (stored) return effectiveSpec(style, stored, []);
  const spec = effectiveSpec(style, null, await fitTextures(user, style.id, trx));
  await writeSpec(user, style, spec, trx);
  return spec;
}

function snapshot(spec: SizeSpec, sizes: readonly string[], size: string, point: PointKey) {
  const p = spec.points.find((x) => x.point === point);
  if (!p) return { spec_cm: null, tolerance_cm: pointsOfMeasure[point].defaultToleranceCm };
  return { spec_cm: resolvePoint(p, sizes, spec.baseSize)[size]?.valueCm ?? null, tolerance_cm: p.toleranceCm };
}

function assertRoundSize(style: Style, size: string) {
  if (!style.sizes.labels.includes(size)) throw fieldError('size', `${size} is not one of the style sizes (${style.sizes.labels.join(', ')})`);
}

async function roundOf(styleId: string, roundId: string, trx: Db) {
  const round = (await trx('sample_rounds').where({ id: roundId, style_id: styleId }).forUpdate().first()) as
    | { id: string; round_no: number; kind: SampleRoundKind; size: string }
    | undefined;
  if (!round) throw notFound('Sample round not found.');
  return round;
}

/**
 * Records a sample round with its measurements, each held against the spec and tolerance of the
 * sample size at this moment. Carries the style's version (409 when stale).
 */
export async function createSampleRound(user: SessionUser, styleId: string, input: SampleRoundCreate, q: Knex = db()): Promise<{ round: SampleRound; doc: FitDocument }> {
  const id = await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    assertRoundSize(style, input.size);
    await bumpVersion(user, style, input.version, trx);
    const spec = await specForWrite(user, style, trx);
    // Serialises round numbers per style: the version bump above already holds the style row.
    const last = (await trx('sample_rounds').where({ style_id: style.id }).max('round_no as n').first()) as { n: number | null };
    const roundNo = (last?.n ?? 0) + 1;
    const [row] = (await trx('sample_rounds')
      .insert({
        style_id: style.id, round_no: roundNo, kind: input.kind, size: input.size, received_on: input.receivedOn, notes: input.notes,
        created_by: user.id, updated_by: user.id,
      })
      .returning('id')) as { id: string }[];
    const roundId = row!.id;
    const ms = Object.entries(input.measurements).map(([point, measured]) => ({
      round_id: roundId, point, measured_cm: measured, ...snapshot(spec, style.sizes.labels, input.size, point as PointKey),
    }));
    if (ms.length) await trx('sample_measurements').insert(ms);
    await audit(user, style.id, 'fit.round.create', { roundNo, kind: input.kind, size: input.size, measured: ms.length }, trx);
    return roundId;
  });
  const doc = await loadFit(user, styleId, q);
  return { round: doc.rounds.find((r) => r.id === id)!, doc };
}

/**
 * Changes a round. Measurements, when given, replace the round's: points measured before keep
 * the spec they were held against (unless the sample size changed); new points take today's.
 */
export async function updateSampleRound(user: SessionUser, styleId: string, roundId: string, input: SampleRoundPatch, q: Knex = db()): Promise<FitDocument> {
  await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    const round = await roundOf(style.id, roundId, trx);
    if (input.size !== undefined) assertRoundSize(style, input.size);
    await bumpVersion(user, style, input.version, trx);
    const values: Record<string, unknown> = { updated_by: user.id, updated_at: trx.fn.now() };
    if (input.kind !== undefined) values.kind = input.kind;
    if (input.size !== undefined) values.size = input.size;
    if (input.receivedOn !== undefined) values.received_on = input.receivedOn;
    if (input.notes !== undefined) values.notes = input.notes;
    await trx('sample_rounds').where({ id: round.id }).update(values);
    const size = input.size ?? round.size;
    if (input.measurements !== undefined || size !== round.size) {
      const spec = await specForWrite(user, style, trx);
      const prior = (await trx('sample_measurements').where({ round_id: round.id })) as { point: PointKey; measured_cm: number; spec_cm: number | null; tolerance_cm: number }[];
      const byPoint = new Map(prior.map((m) => [m.point, m]));
      const measured = input.measurements ?? Object.fromEntries(prior.map((m) => [m.point, m.measured_cm]));
      await trx('sample_measurements').where({ round_id: round.id }).del();
      const rows = Object.entries(measured).map(([point, measured_cm]) => {
        const keep = size === round.size ? byPoint.get(point as PointKey) : undefined;
        return {
          round_id: round.id, point, measured_cm,
          ...(keep ? { spec_cm: keep.spec_cm, tolerance_cm: keep.tolerance_cm } : snapshot(spec, style.sizes.labels, size, point as PointKey)),
        };
      });
      if (rows.length) await trx('sample_measurements').insert(rows);
    }
    await audit(user, style.id, 'fit.round.update', { roundNo: round.round_no, fields: Object.keys(input).filter((k) => k !== 'version') }, trx);
  });
  return loadFit(user, styleId, q);
}

export async function addSampleComment(user: SessionUser, styleId: string, roundId: string, input: SampleCommentCreate, q: Knex = db()): Promise<FitDocument> {
  await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    const round = await roundOf(style.id, roundId, trx);
    await bumpVersion(user, style, input.version, trx);
    await trx('sample_comments').insert({ round_id: round.id, user_id: user.id, body: input.body });
    await audit(user, style.id, 'fit.round.comment', { roundNo: round.round_no }, trx);
  });
  return loadFit(user, styleId, q);
}

/** Proposes a change of the spec from a round; it changes nothing until accepted. */
export async function proposeCorrection(user: SessionUser, styleId: string, roundId: string, input: CorrectionCreate, q: Knex = db()): Promise<FitDocument> {
  await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    const round = await roundOf(style.id, roundId, trx);
    assertRoundSize(style, input.size);
    const spec = await specForWrite(user, style, trx);
    const point = spec.points.find((p) => p.point === input.point);
    if (!point) throw fieldError('point', 'Not a point of this spec');
    const fromCm = resolvePoint(point, style.sizes.labels, spec.baseSize)[input.size]?.valueCm ?? null;
    if (input.scope === 'point' && (point.baseCm === null || fromCm === null)) {
      throw fieldError('scope', 'The spec has no value here to move from: correct this size only');
    }
    await bumpVersion(user, style, input.version, trx);
    await trx('sample_corrections').insert({
      round_id: round.id, point: input.point, size: input.size, from_cm: fromCm, to_cm: input.toCm, scope: input.scope, reason: input.reason,
      proposed_by: user.id,
    });
    await audit(user, style.id, 'fit.correction.propose', { roundNo: round.round_no, point: input.point, size: input.size, toCm: input.toCm, scope: input.scope }, trx);
  });
  return loadFit(user, styleId, q);
}

/**
 * Accepts (the spec takes the new value, recorded in the style's history) or rejects a proposed
 * correction. Carries the style's version; a correction decided already is a 409.
 */
export async function decideCorrection(
  user: SessionUser, styleId: string, roundId: string, correctionId: string, input: CorrectionDecision, q: Knex = db(),
): Promise<FitDocument> {
  await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    const round = await roundOf(style.id, roundId, trx);
    const c = (await trx('sample_corrections').where({ id: correctionId, round_id: round.id }).forUpdate().first()) as
      | { id: string; point: PointKey; size: string; to_cm: number; scope: CorrectionScope; status: CorrectionStatus }
      | undefined;
    if (!c) throw notFound('Correction not found.');
    if (c.status !== 'proposed') throw conflict(`This correction was ${c.status} already.`, { status: c.status });
    const spec = await specForWrite(user, style, trx);
    const point = spec.points.find((p) => p.point === c.point);
    if (!point) throw fieldError('point', 'Not a point of this spec');
    if (!style.sizes.labels.includes(c.size)) throw fieldError('size', `${c.size} is no longer one of the style sizes`);
    const fromCm = resolvePoint(point, style.sizes.labels, spec.baseSize)[c.size]?.valueCm ?? null;
    let next: SizeSpecPoint | null = null;
    if (input.decision === 'accept') {
      try {
        next = { ...point, ...applyCorrection(point, style.sizes.labels, spec.baseSize, { size: c.size, toCm: c.to_cm, scope: c.scope }) };
      } catch (err) {
        if (err instanceof RangeError) throw fieldError('scope', 'The spec has no value here to move from: correct this size only');
        throw err;
      }
      if (next.baseCm !== null && next.baseCm <= 0) throw fieldError('toCm', 'The correction would take the base size to zero or below');
    }
    const version = await bumpVersion(user, style, input.version, trx);
    if (next) {
      const accepted = next;
      await writeSpec(user, style, { ...spec, points: spec.points.map((p) => (p.point === accepted.point ? accepted : p)) }, trx, [accepted.point]);
    }
    await trx('sample_corrections')
      .where({ id: c.id })
      .update({ status: input.decision === 'accept' ? 'accepted' : 'rejected', from_cm: fromCm, decided_by: user.id, decided_at: trx.fn.now() });
    await audit(user, style.id, input.decision === 'accept' ? 'fit.correction.accept' : 'fit.correction.reject', {
      version, roundNo: round.round_no, point: c.point, size: c.size, fromCm, toCm: c.to_cm, scope: c.scope,
    }, trx);
  });
  return loadFit(user, styleId, q);
}

/** Photos one round may hold. */
export const maxRoundPhotos = 40;

/**
 * Attaches a photo (already inspected by content) to a round, with a history entry. The file's row,
 * the stored object and the photo are written together or not at all. Carries no version (a photo
 * collides with nothing) but raises it, so a round deletion made on an older view gets its 409.
 */
export async function addRoundPhoto(
  user: SessionUser, styleId: string, roundId: string, photo: { upload: InspectedUpload; name: string }, store: ObjectStore, q: Knex = db(),
): Promise<{ photo: SampleRoundPhoto; doc: FitDocument }> {
  const id = await withStoredFiles(store, async (trx, written) => {
    const style = await visibleStyle(user, styleId, trx);
    const round = await roundOf(style.id, roundId, trx);
    const count = Number(((await trx('sample_round_photos').where({ round_id: round.id }).count('* as n').first()) as { n: string | number }).n);
    if (count >= maxRoundPhotos) throw fieldError('photo', `A round holds at most ${maxRoundPhotos} photos: remove one first`);
    const version = await bumpVersion(user, style, null, trx);
    const file = await storeFile(trx, store, {
      studioId: user.studioId, styleId: style.id, organisationId: null, uploadedBy: user.id, purpose: 'sample-round-photo',
      upload: photo.upload, originalName: photo.name,
    }, written);
    const [row] = (await trx('sample_round_photos').insert({ round_id: round.id, file_id: file.id, created_by: user.id }).returning('id')) as { id: string }[];
    await audit(user, style.id, 'fit.round.photo.add', {
      version, roundNo: round.round_no, kind: round.kind, size: round.size, name: file.originalName, widthPx: file.widthPx, heightPx: file.heightPx, bytes: file.byteSize,
    }, trx);
    return row!.id;
  }, q);
  const doc = await loadFit(user, styleId, q);
  const added = doc.rounds.flatMap((r) => r.photos).find((p) => p.id === id);
  if (!added) throw notFound('Photo not found.');
  return { photo: added, doc };
}

/** The stored objects of a round's photos (all of them, or one), locked with their rows. */
async function roundPhotoFiles(roundId: string, trx: Knex.Transaction, photoId?: string) {
  const qb = trx('sample_round_photos as p').join('files as f', 'f.id', 'p.file_id').where('p.round_id', roundId);
  if (photoId) qb.andWhere('p.id', photoId);
  return (await qb.forUpdate().select('p.id', 'f.id as file_id', 'f.storage_key', 'f.original_name')) as
    { id: string; file_id: string; storage_key: string; original_name: string }[];
}

/** Deletes stored objects once their rows are gone; a failure leaves an unreferenced object and is logged. */
async function dropObjects(store: ObjectStore, keys: readonly string[]) {
  for (const key of keys) await store.delete(key).catch((e) => console.error('Could not remove a sample-round photo from the store', key, e));
}

/** Removes a photo from a round and its stored image, with a history entry; raises the version as adding does. */
export async function removeRoundPhoto(user: SessionUser, styleId: string, roundId: string, photoId: string, store: ObjectStore, q: Knex = db()): Promise<FitDocument> {
  const key = await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    const round = await roundOf(style.id, roundId, trx);
    const [photo] = await roundPhotoFiles(round.id, trx, photoId);
    if (!photo) throw notFound('Photo not found.');
    const version = await bumpVersion(user, style, null, trx);
    // The photo's row goes with its file (on delete cascade).
    await trx('files').where({ id: photo.file_id, studio_id: user.studioId }).del();
    await audit(user, style.id, 'fit.round.photo.remove', { version, roundNo: round.round_no, kind: round.kind, size: round.size, name: photo.original_name }, trx);
    return photo.storage_key;
  });
  await dropObjects(store, [key]);
  return loadFit(user, styleId, q);
}

/**
 * Deletes a round with its measurements, comments, corrections and photos. The spec changes of its
 * accepted corrections stay (they are the spec now, each with its own history entry); its proposed
 * ones go with it. Carries the style's version (409 when stale); recorded in the style's history.
 */
export async function deleteSampleRound(user: SessionUser, styleId: string, roundId: string, version: number, store: ObjectStore, q: Knex = db()): Promise<FitDocument> {
  const keys = await q.transaction(async (trx) => {
    const style = await visibleStyle(user, styleId, trx);
    const round = await roundOf(style.id, roundId, trx);
    const next = await bumpVersion(user, style, version, trx);
    const photos = await roundPhotoFiles(round.id, trx);
    const count = async (table: string) => Number(((await trx(table).where({ round_id: round.id }).count('* as n').first()) as { n: string | number }).n);
    const byStatus = (await trx('sample_corrections').where({ round_id: round.id }).groupBy('status').select('status').count('* as n')) as { status: CorrectionStatus; n: string | number }[];
    const corrections = Object.fromEntries((['accepted', 'proposed', 'rejected'] as const).map((k) => [k, Number(byStatus.find((b) => b.status === k)?.n ?? 0)]));
    const details = {
      version: next, roundNo: round.round_no, kind: round.kind, size: round.size,
      measured: await count('sample_measurements'), comments: await count('sample_comments'), photos: photos.length, corrections,
    };
    if (photos.length) await trx('files').whereIn('id', photos.map((p) => p.file_id)).andWhere('studio_id', user.studioId).del();
    await trx('sample_rounds').where({ id: round.id }).del();
    await audit(user, style.id, 'fit.round.delete', details, trx);
    return photos.map((p) => p.storage_key);
  });
  await dropObjects(store, keys);
  return loadFit(user, styleId, q);
}
