/**
 * Compression estimate of a knitted tube on the body, by Laplace's law for a cylinder.
 *
 * Units: tension in N per cm of fabric (a force per unit width, along the girth), girths in cm,
 * extension as a fraction (0.25 = 25 % stretched), pressure in Pa and mmHg.
 */

import type { ForceExtensionPoint } from '@/lib/knit/texture';

export type { ForceExtensionPoint };

/** 1 mmHg = 133.322 Pa (conventional millimetre of mercury, 133.322 387 415 Pa). */
export const pascalPerMmHg = 133.322;

/**
 * Pressure (mmHg) under a fabric sleeve in tension around a cylinder of the given girth, by
 * Laplace's law for a cylinder, P = T / r with r = girth / 2π (SI: T in N/m, r in m, P in Pa).
 * Source: Laplace's law as used for sub-bandage pressure (S. Thomas, "The use of the Laplace
 * equation in the calculation of sub-bandage pressure", World Wide Wounds, 2002/2003); the unit
 * conversion is computed from the SI definitions.
 */
export function laplacePressureMmHg(tensionNPerCm: number, girthCm: number): number {
  return laplacePressurePa(tensionNPerCm, girthCm) / pascalPerMmHg;
}

/** As `laplacePressureMmHg`, in Pa: T (N/cm × 100 = N/m) ÷ (girth (cm ÷ 100 = m) ÷ 2π). */
export function laplacePressurePa(tensionNPerCm: number, girthCm: number): number {
  if (!(girthCm > 0)) throw new RangeError('girth must be positive');
  const tensionNPerM = tensionNPerCm * 100;
  const radiusM = girthCm / 100 / (2 * Math.PI);
  return tensionNPerM / radiusM;
}

/** A texture's force–extension points (`Texture.forceExtension`), in any order. */
export type ForceExtensionCurve = readonly ForceExtensionPoint[];

function sortedCurve(curve: ForceExtensionCurve): ForceExtensionPoint[] {
  if (curve.length === 0) throw new RangeError('force–extension curve has no points');
  return [...curve].sort((p, q) => p.extension - q.extension);
}

/**
 * Tension (N/cm) at an extension, by linear interpolation between the curve's measured points.
 * At or below zero extension the fabric is slack (0 N/cm); between zero and the first measured
 * point the curve runs from the origin; beyond the last point the last segment is extended
 * (`withinCurve` says whether that happened).
 */
export function tensionAt(curve: ForceExtensionCurve, extension: number): number {
  if (extension <= 0) return 0;
  const points = sortedCurve(curve);
  const firstExtension = points[0]?.extension ?? 0;
  const path = firstExtension > 0 ? [{ extension: 0, tensionNPerCm: 0 }, ...points] : points;
  // The segment that holds the extension, or the last one when the extension lies beyond the test.
  let i = path.findIndex((p, k) => k > 0 && extension <= p.extension);
  if (i === -1) i = path.length - 1;
  const lo = path[i - 1];
  const hi = path[i];
  if (!hi) return 0;
  if (!lo || hi.extension === lo.extension) return hi.tensionNPerCm;
  const t = (extension - lo.extension) / (hi.extension - lo.extension);
  return lo.tensionNPerCm + t * (hi.tensionNPerCm - lo.tensionNPerCm);
}

/** Whether an extension lies inside the measured range of the curve (no extrapolation needed). */
export function withinCurve(curve: ForceExtensionCurve, extension: number): boolean {
  const points = sortedCurve(curve);
  const last = points[points.length - 1];
  return extension <= (last?.extension ?? 0);
}

/** Extension of a garment worn on the body: body girth ÷ garment relaxed girth − 1. */
export function garmentExtension(bodyGirthCm: number, garmentRelaxedGirthCm: number): number {
  if (!(garmentRelaxedGirthCm > 0)) throw new RangeError('garment girth must be positive');
  return bodyGirthCm / garmentRelaxedGirthCm - 1;
}

export const compressionCaution =
  'An estimate from the fabric test and Laplace’s law, not a medical rating. Medical compression ' +
  'follows its own standards and licensed practice; measure the garment on a body or form before ' +
  'making any claim.';

export interface CompressionEstimate {
  extension: number;
  tensionNPerCm: number;
  pressurePa: number;
  pressureMmHg: number;
  /** True when the extension lies beyond the last tested point and the tension was extrapolated. */
  extrapolated: boolean;
  /** True when the garment is not stretched on this body (no pressure). */
  slack: boolean;
  caution: string;
  notes: string[];
}

/**
 * Estimated pressure of a knitted tube on a body girth: extension from the girths, tension from the
 * texture's force–extension curve, pressure by Laplace's law. Always returned with the caution.
 */
export function compressionEstimate(input: {
  bodyGirthCm: number;
  garmentRelaxedGirthCm: number;
  curve: ForceExtensionCurve;
}): CompressionEstimate {
  const { bodyGirthCm, garmentRelaxedGirthCm, curve } = input;
  const extension = garmentExtension(bodyGirthCm, garmentRelaxedGirthCm);
  const tensionNPerCm = tensionAt(curve, extension);
  const pressurePa = laplacePressurePa(tensionNPerCm, bodyGirthCm);
  const slack = extension <= 0;
  const extrapolated = !slack && !withinCurve(curve, extension);
  const notes: string[] = [];
  if (slack) notes.push('The garment is not stretched at this girth, so it exerts no pressure.');
  if (extrapolated) {
    notes.push(
      `The extension (${(extension * 100).toFixed(0)} %) is beyond the fabric test's last point; ` +
        'the tension was extrapolated. Test the fabric further before relying on it.',
    );
  }
  return {
    extension,
    tensionNPerCm,
    pressurePa,
    pressureMmHg: pressurePa / pascalPerMmHg,
    extrapolated,
    slack,
    caution: compressionCaution,
    notes,
  };
}
