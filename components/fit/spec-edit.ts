import { rebase, setSizeValue, clearOverrides } from '@/lib/fit/grading';
import type { SizeSpec, SizeSpecPoint } from '@/lib/fit/spec';
import { pointsOfMeasure, type GirthKey, type PointKey } from '@/lib/fit/points';
import { parseLengthCm, type LengthUnit } from '@/lib/fit/units';
import { seamlessEquivalent } from '@/lib/fit/needles';

/** Column ids of the grids: a size column, or the grade and tolerance columns of the spec. */
export const sizeCol = (size: string) => `size:${size}`;
export const sizeOfCol = (colId: string) => (colId.startsWith('size:') ? colId.slice(5) : null);

export interface Edit { spec: SizeSpec; error?: string }

const fail = (spec: SizeSpec, error: string): Edit => ({ spec, error });

function readLength(raw: string | null, unit: LengthUnit, what: string, opts: { allowNegative?: boolean; allowZero?: boolean } = {}): number | null | string {
  if (raw === null) return null;
  const cm = parseLengthCm(raw, unit);
  if (cm === null) return null;
  if (Number.isNaN(cm)) return `“${raw.trim()}” is not a number (${what}).`;
  if (!opts.allowNegative && cm < 0) return `${what} cannot be negative.`;
  if (!opts.allowZero && !opts.allowNegative && cm === 0) return `${what} must be above zero.`;
  return cm;
}

function withPoint(spec: SizeSpec, point: PointKey, change: (p: SizeSpecPoint) => SizeSpecPoint): SizeSpec {
  return { ...spec, points: spec.points.map((p) => (p.point === point ? change(p) : p)) };
}

/** One cell of the size spec: a size's value, the grade or the tolerance of a point. */
export function editSpecCell(spec: SizeSpec, sizes: readonly string[], unit: LengthUnit, point: PointKey, colId: string, raw: string | null): Edit {
  const label = pointsOfMeasure[point].label;
  const size = sizeOfCol(colId);
  if (size !== null) {
    const v = readLength(raw, unit, `${label}, ${size}`);
    if (typeof v === 'string') return fail(spec, v);
    return { spec: withPoint(spec, point, (p) => ({ ...p, ...setSizeValue(p, sizes, spec.baseSize, size, v) })) };
  }
  if (colId === 'grade') {
    const v = readLength(raw, unit, `${label} grade`, { allowNegative: true });
    if (typeof v === 'string') return fail(spec, v);
    return { spec: withPoint(spec, point, (p) => ({ ...p, gradeCm: v ?? 0 })) };
  }
  if (colId === 'tol') {
    const v = readLength(raw, unit, `${label} tolerance`, { allowZero: true });
    if (typeof v === 'string') return fail(spec, v);
    return { spec: withPoint(spec, point, (p) => ({ ...p, toleranceCm: v ?? pointsOfMeasure[point].defaultToleranceCm })) };
  }
  return { spec };
}

/** One body girth of one size. */
export function editGirthCell(spec: SizeSpec, unit: LengthUnit, girth: GirthKey, colId: string, raw: string | null): Edit {
  const size = sizeOfCol(colId);
  if (size === null) return { spec };
  const v = readLength(raw, unit, `${girth} girth, ${size}`);
  if (typeof v === 'string') return fail(spec, v);
  const bySize = { ...(spec.girths[size] ?? {}) };
  if (v === null) delete bySize[girth];
  else bySize[girth] = v;
  return { spec: { ...spec, girths: { ...spec.girths, [size]: bySize } } };
}

/** One cut-and-sew half-width of one size (rows `cs:<point>`; the seamless rows are read only). */
export function editCutAndSewCell(spec: SizeSpec, unit: LengthUnit, rowId: string, colId: string, raw: string | null): Edit {
  const size = sizeOfCol(colId);
  if (size === null || !rowId.startsWith('cs:')) return { spec };
  const point = rowId.slice(3) as PointKey;
  const v = readLength(raw, unit, `cut-and-sew ${pointsOfMeasure[point].label.toLowerCase()}, ${size}`);
  if (typeof v === 'string') return fail(spec, v);
  const bySize = { ...(spec.cutAndSew[point] ?? {}) };
  if (v === null) delete bySize[size];
  else bySize[size] = v;
  return { spec: { ...spec, cutAndSew: { ...spec.cutAndSew, [point]: bySize } } };
}

/**
 * A block pasted at a cell: row by row, column by column from there, through the grid's own cell
 * edit. Cells beyond the grid are dropped; empty pasted cells leave a cell as it was.
 */
export function pasteBlock(
  spec: SizeSpec,
  grid: string[][],
  start: { rowId: string; colId: string },
  rowIds: readonly string[],
  colIds: readonly string[],
  edit: (spec: SizeSpec, rowId: string, colId: string, raw: string) => Edit,
): { spec: SizeSpec; errors: string[]; cells: number } {
  const r0 = rowIds.indexOf(start.rowId);
  const c0 = colIds.indexOf(start.colId);
  let next = spec;
  const errors: string[] = [];
  let cells = 0;
  if (r0 < 0 || c0 < 0) return { spec, errors: ['Paste into an editable cell.'], cells };
  grid.forEach((line, i) => {
    const rowId = rowIds[r0 + i];
    if (!rowId) return;
    line.forEach((raw, j) => {
      const colId = colIds[c0 + j];
      if (!colId || raw.trim() === '') return;
      const res = edit(next, rowId, colId, raw);
      if (res.error) errors.push(res.error);
      else { next = res.spec; cells += 1; }
    });
  });
  return { spec: next, errors, cells };
}

/** Moves the base size, keeping every value. */
export function changeBaseSize(spec: SizeSpec, sizes: readonly string[], base: string): SizeSpec {
  return { ...spec, baseSize: base, points: spec.points.map((p) => ({ ...p, ...rebase(p, sizes, spec.baseSize, base) })) };
}

/** Grades every point from the base size again (drops the overrides). */
export function regradeAll(spec: SizeSpec): SizeSpec {
  return { ...spec, points: spec.points.map((p) => ({ ...p, ...clearOverrides(p) })) };
}

/** Sets the spec's half-widths to the seamless equivalents of the cut-and-sew entries, size by size (base first). */
export function applySeamlessEquivalents(spec: SizeSpec, sizes: readonly string[], factor: number): SizeSpec {
  let next = spec;
  for (const [point, bySize] of Object.entries(spec.cutAndSew) as [PointKey, Record<string, number> | undefined][]) {
    if (!bySize) continue;
    const ordered = [...Object.keys(bySize)].sort((a, b) => (a === spec.baseSize ? -1 : b === spec.baseSize ? 1 : 0));
    for (const size of ordered) {
      const cm = bySize[size];
      if (cm === undefined || !sizes.includes(size)) continue;
      next = withPoint(next, point, (p) => ({ ...p, ...setSizeValue(p, sizes, next.baseSize, size, Math.round(seamlessEquivalent(cm, factor) * 10) / 10) }));
    }
  }
  return next;
}
