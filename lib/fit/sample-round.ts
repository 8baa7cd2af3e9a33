/**
 * Sample rounds: a sample's measured values against the spec and its tolerances, and the
 * corrections that change the spec. Values in cm.
 */
import { resolvePoint, setSizeValue, type PointGrade } from './grading';

export const sampleRoundKinds = ['proto', 'fit', 'pre-production'] as const;
export type SampleRoundKind = (typeof sampleRoundKinds)[number];
export const sampleRoundKindLabels: Record<SampleRoundKind, string> = {
  proto: 'Proto',
  fit: 'Fit',
  'pre-production': 'Pre-production',
};

/**
 * `within`: inside the tolerance; `near`: inside, but past three quarters of it (worth watching);
 * `outside`: beyond it; `no-spec`: nothing to compare with. The three-quarter mark is this
 * product's convention.
 */
export type DeviationStatus = 'within' | 'near' | 'outside' | 'no-spec';

export interface Deviation {
  /** Measured minus spec, cm: positive is larger than the spec. */
  deviationCm: number | null;
  status: DeviationStatus;
}

/** Rounding noise well under what a tape can read. */
const epsilon = 1e-6;

/** Measured against spec ± tolerance (cm). The limit itself is within tolerance. */
export function deviationOf(measuredCm: number, specCm: number | null, toleranceCm: number): Deviation {
  if (specCm === null) return { deviationCm: null, status: 'no-spec' };
  const d = measuredCm - specCm;
  const a = Math.abs(d);
  const status: DeviationStatus = a > toleranceCm + epsilon ? 'outside' : a > 0.75 * toleranceCm + epsilon ? 'near' : 'within';
  return { deviationCm: d, status };
}

export const correctionScopes = ['size', 'point'] as const;
/**
 * `size`: only this size takes the new value (at the base size this is the base value, which the
 * graded sizes follow); `point`: every size of the point moves by the same amount.
 */
export type CorrectionScope = (typeof correctionScopes)[number];

export interface Correction {
  size: string;
  toCm: number;
  scope: CorrectionScope;
}

/**
 * The point's grading after a correction. Throws a RangeError when a whole-point correction
 * meets a point with no base value.
 */
export function applyCorrection(point: PointGrade, sizes: readonly string[], base: string, c: Correction): PointGrade {
  if (c.scope === 'size') return setSizeValue(point, sizes, base, c.size, c.toCm);
  const current = resolvePoint(point, sizes, base)[c.size]?.valueCm ?? null;
  if (point.baseCm === null || current === null) throw new RangeError('The spec has no value at this point to move from');
  const delta = c.toCm - current;
  const overrides: Record<string, number> = {};
  for (const [size, v] of Object.entries(point.overrides)) overrides[size] = v + delta;
  return { ...point, baseCm: point.baseCm + delta, overrides };
}
