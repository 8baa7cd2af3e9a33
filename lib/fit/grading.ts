/**
 * Grading a size spec: a base-size value and a grade rule per point of measure fill the other
 * sizes; any size can be overridden.
 *
 * Linear grading by a constant increment per size step is common practice in pattern grading,
 * no published source. Values in cm.
 */

/** One point of measure's grading: what the designer entered. */
export interface PointGrade {
  /** Value at the base size, cm; null while not entered. */
  baseCm: number | null;
  /** Change per size step, cm (added going up the size range, taken off going down). */
  gradeCm: number;
  /** Sizes whose value is set by hand, cm. */
  overrides: Readonly<Record<string, number>>;
}

export interface ResolvedCell {
  /** The value the size has: its override, else the graded value. */
  valueCm: number | null;
  /** The value grading alone gives. */
  gradedCm: number | null;
  overridden: boolean;
}

/** Values closer than this are the same measurement (a tenth of a millimetre). */
export const sameValueCm = 0.01;

function stepsFromBase(sizes: readonly string[], base: string, size: string): number {
  const b = sizes.indexOf(base);
  const i = sizes.indexOf(size);
  if (b < 0) throw new RangeError(`The base size ${base} is not among the sizes`);
  if (i < 0) throw new RangeError(`Size ${size} is not among the sizes`);
  return i - b;
}

/** The graded value of a size: base + grade × (size steps from the base). Null without a base value. */
export function gradedValue(point: PointGrade, sizes: readonly string[], base: string, size: string): number | null {
  if (point.baseCm === null) return null;
  return point.baseCm + point.gradeCm * stepsFromBase(sizes, base, size);
}

/** Every size's value of one point: overrides first, else grading from the base size. */
export function resolvePoint(point: PointGrade, sizes: readonly string[], base: string): Record<string, ResolvedCell> {
  const out: Record<string, ResolvedCell> = {};
  for (const size of sizes) {
    const gradedCm = size === base ? point.baseCm : gradedValue(point, sizes, base, size);
    const o = size === base ? undefined : point.overrides[size];
    out[size] = o === undefined ? { valueCm: gradedCm, gradedCm, overridden: false } : { valueCm: o, gradedCm, overridden: true };
  }
  return out;
}

/**
 * Sets one size's value. The base size sets the base value (and so every graded size); another
 * size becomes an override, or stops being one when the value equals what grading gives. `null`
 * clears: the base value, or the override (back to graded).
 */
export function setSizeValue(point: PointGrade, sizes: readonly string[], base: string, size: string, valueCm: number | null): PointGrade {
  if (size === base) return { ...point, baseCm: valueCm };
  const overrides = { ...point.overrides };
  delete overrides[size];
  if (valueCm !== null) {
    const graded = gradedValue(point, sizes, base, size);
    if (graded === null || Math.abs(graded - valueCm) >= sameValueCm) overrides[size] = valueCm;
  }
  return { ...point, overrides };
}

/** Drops every override: all sizes graded from the base again. */
export function clearOverrides(point: PointGrade): PointGrade {
  return { ...point, overrides: {} };
}

/**
 * Moves the base to another size without changing any size's value: the new base value is what
 * that size had, and a size keeps an override only where its value differs from the new grading.
 */
export function rebase(point: PointGrade, sizes: readonly string[], oldBase: string, newBase: string): PointGrade {
  if (oldBase === newBase) return point;
  const before = resolvePoint(point, sizes, oldBase);
  let next: PointGrade = { baseCm: before[newBase]?.valueCm ?? null, gradeCm: point.gradeCm, overrides: {} };
  for (const size of sizes) {
    if (size === newBase) continue;
    const v = before[size]?.valueCm ?? null;
    if (v !== null) next = setSizeValue(next, sizes, newBase, size, v);
  }
  return next;
}

/** Graded values at or below zero: a grade too steep for the smallest sizes. */
export function impossibleSizes(point: PointGrade, sizes: readonly string[], base: string): string[] {
  const resolved = resolvePoint(point, sizes, base);
  return sizes.filter((s) => {
    const v = resolved[s]?.valueCm;
    return v !== null && v !== undefined && v <= 0;
  });
}

/** Every point's values per size, for the sheet: point → size → cm. */
export function resolveValues<K extends string>(
  points: readonly (PointGrade & { point: K })[],
  sizes: readonly string[],
  base: string,
): Partial<Record<K, Record<string, number | null>>> {
  const out: Partial<Record<K, Record<string, number | null>>> = {};
  for (const p of points) {
    const resolved = resolvePoint(p, sizes, base);
    out[p.point] = Object.fromEntries(sizes.map((s) => [s, resolved[s]?.valueCm ?? null]));
  }
  return out;
}
