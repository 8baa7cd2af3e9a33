/**
 * The compression a style aims at, findings when a size falls outside it, and the change of a
 * half-width that would bring it back.
 *
 * Pressures by Laplace's law through `lib/fit/compression.ts`; the inverse solves that model for
 * the half-width, so it carries the same caution.
 */
import { compressionEstimate, laplacePressurePa, pascalPerMmHg, tensionAt, type CompressionEstimate, type ForceExtensionCurve } from './compression';

export const compressionLevels = ['mild', 'moderate', 'firm'] as const;
export type CompressionLevel = (typeof compressionLevels)[number];

export interface PressureBand { minMmHg: number; maxMmHg: number }

export interface CompressionTarget {
  level: CompressionLevel;
  bands: Record<CompressionLevel, PressureBand>;
}

/**
 * Default bands for sports and recovery garments, mmHg. Common practice, no published source;
 * they are not the classes of medical compression, which follow their own standards.
 */
export const defaultPressureBands: Record<CompressionLevel, PressureBand> = {
  mild: { minMmHg: 5, maxMmHg: 12 },
  moderate: { minMmHg: 12, maxMmHg: 20 },
  firm: { minMmHg: 20, maxMmHg: 30 },
};

export const defaultCompressionTarget: CompressionTarget = { level: 'moderate', bands: defaultPressureBands };

/** The caution that stands beside every compression figure. */
export const compressionFigureCaution =
  'An estimate from fabric tests and ideal geometry (Laplace’s law on a round limb), not a medical rating. ' +
  'Garments sold as medical compression follow their own standards, tests and licensed practice. ' +
  'High pressure can harm circulation.';

/**
 * The extension (fraction) at which the fabric's tension reaches `tensionNPerCm`, by bisection on
 * `tensionAt` (the same interpolation and extrapolation). Null when the curve never reaches it
 * below 300 % extension.
 */
export function extensionForTension(curve: ForceExtensionCurve, tensionNPerCm: number): number | null {
  if (!(tensionNPerCm > 0)) return 0;
  let lo = 0;
  let hi = 3;
  if (tensionAt(curve, hi) < tensionNPerCm) return null;
  for (let i = 0; i < 80; i += 1) {
    const mid = (lo + hi) / 2;
    if (tensionAt(curve, mid) < tensionNPerCm) lo = mid;
    else hi = mid;
  }
  return hi;
}

/**
 * The garment relaxed half-width (cm) that gives `pressureMmHg` on a body girth (cm): Laplace's law
 * turned round, T = P × r with r = girth ÷ 2π; the extension for that tension from the curve; then
 * garment girth = body girth ÷ (1 + extension), halved. Null when the fabric cannot reach it.
 */
export function halfWidthForPressure(curve: ForceExtensionCurve, bodyGirthCm: number, pressureMmHg: number): number | null {
  if (!(bodyGirthCm > 0)) throw new RangeError('body girth must be positive');
  // laplacePressurePa is linear in tension: the tension for the target is target ÷ (pressure at 1 N/cm).
  const tensionNPerCm = (pressureMmHg * pascalPerMmHg) / laplacePressurePa(1, bodyGirthCm);
  const extension = extensionForTension(curve, tensionNPerCm);
  if (extension === null) return null;
  return bodyGirthCm / (1 + extension) / 2;
}

export type BandStatus = 'slack' | 'below' | 'within' | 'above';

export interface CompressionFinding {
  status: Exclude<BandStatus, 'within'>;
  /** Sentence naming the size, girth, the pressure and the band. */
  message: string;
  /** Which measurement to change and by how much, or why no change of measurement reaches the band. */
  advice: string;
  /** The half-width that gives the middle of the band, cm, and the change from the present one. */
  targetHalfWidthCm: number | null;
  changeCm: number | null;
  /** Half-widths that give the band's edges (the loose edge is the wider): any value between is inside the band. */
  rangeCm: { fromCm: number; toCm: number } | null;
}

export interface CompressionCheck {
  estimate: CompressionEstimate;
  status: BandStatus;
  finding: CompressionFinding | null;
}

const f1 = (n: number) => n.toFixed(1);

/**
 * Estimates the pressure of one size at one girth and checks it against the band. The finding's
 * advice names the half-width to change and by how much to reach the middle of the band.
 */
export function checkCompression(input: {
  size: string;
  pointLabel: string;
  girthLabel: string;
  bodyGirthCm: number;
  garmentHalfWidthCm: number;
  curve: ForceExtensionCurve;
  band: PressureBand;
  levelLabel: string;
}): CompressionCheck {
  const { size, pointLabel, girthLabel, bodyGirthCm, garmentHalfWidthCm, curve, band, levelLabel } = input;
  const estimate = compressionEstimate({ bodyGirthCm, garmentRelaxedGirthCm: garmentHalfWidthCm * 2, curve });
  const p = estimate.pressureMmHg;
  const status: BandStatus = estimate.slack ? 'slack' : p < band.minMmHg ? 'below' : p > band.maxMmHg ? 'above' : 'within';
  if (status === 'within') return { estimate, status, finding: null };
  const mid = (band.minMmHg + band.maxMmHg) / 2;
  const target = halfWidthForPressure(curve, bodyGirthCm, mid);
  const loose = halfWidthForPressure(curve, bodyGirthCm, band.minMmHg);
  const tight = halfWidthForPressure(curve, bodyGirthCm, band.maxMmHg);
  const where = `Size ${size}, ${girthLabel.toLowerCase()} ${f1(bodyGirthCm)} cm`;
  const bandText = `the ${levelLabel} band (${f1(band.minMmHg)}–${f1(band.maxMmHg)} mmHg)`;
  const message =
    status === 'slack'
      ? `${where}: the garment is not stretched (relaxed girth ${f1(garmentHalfWidthCm * 2)} cm), so it gives no compression — below ${bandText}.`
      : `${where}: about ${f1(p)} mmHg, ${status === 'below' ? 'too loose for' : 'too tight for'} ${bandText}.`;
  let advice = `This fabric's test does not reach ${bandText} at this girth; choose a firmer texture or test it further.`;
  let changeCm: number | null = null;
  if (target !== null) {
    changeCm = target - garmentHalfWidthCm;
    const verb = changeCm < 0 ? 'Reduce' : 'Increase';
    advice = `${verb} the ${pointLabel.toLowerCase()} of size ${size} by ${f1(Math.abs(changeCm))} cm, to ${f1(target)} cm (the middle of the band).`;
    if (loose !== null && tight !== null) advice += ` Anything from ${f1(tight)} to ${f1(loose)} cm stays inside it.`;
  }
  return {
    estimate,
    status,
    finding: {
      status,
      message,
      advice,
      targetHalfWidthCm: target,
      changeCm,
      rangeCm: loose !== null && tight !== null ? { fromCm: tight, toCm: loose } : null,
    },
  };
}
