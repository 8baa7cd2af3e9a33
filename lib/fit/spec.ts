/**
 * A style's size spec as the product keeps it: graded points of measure with tolerances, the body
 * each size is meant for, the cut-and-sew measurements known to fit, and the fit settings.
 */
import type { PointGrade } from './grading';
import { seamlessEquivalent } from './needles';
import { defaultCompressionTarget, type CompressionTarget } from './compression-target';
import { defaultCylinderDiametersIn, garmentPoints, pointsOfMeasure, type FitGarment, type GirthKey, type PointKey } from './points';

export interface SizeSpecPoint extends PointGrade {
  point: PointKey;
  /** ± tolerance, cm. */
  toleranceCm: number;
}

export interface SizeSpec {
  baseSize: string;
  points: SizeSpecPoint[];
  /** size → girth → cm: the body each size is meant for. */
  girths: Record<string, Partial<Record<GirthKey, number>>>;
  /** point → size → cm: cut-and-sew half-widths known to fit, converted by the studio factor. */
  cutAndSew: Partial<Record<PointKey, Record<string, number>>>;
  /** The texture whose density sets needles (null: the style's first texture). */
  baseTextureId: string | null;
  /** The texture whose force–extension test gives the compression (null: none chosen). */
  compressionTextureId: string | null;
  /** Cylinders the mill can use, inches. */
  cylinderDiametersIn: number[];
  target: CompressionTarget;
}

/** The spec a style starts from: its garment's points with common-practice grades and tolerances, no values. */
export function defaultSizeSpec(garment: FitGarment, baseSize: string, machineDiameterIn?: number): SizeSpec {
  const diameters = new Set(defaultCylinderDiametersIn);
  if (machineDiameterIn !== undefined) diameters.add(machineDiameterIn);
  return {
    baseSize,
    points: garmentPoints[garment].map((point) => ({
      point,
      baseCm: null,
      gradeCm: pointsOfMeasure[point].defaultGradeCm,
      toleranceCm: pointsOfMeasure[point].defaultToleranceCm,
      overrides: {},
    })),
    girths: {},
    cutAndSew: {},
    baseTextureId: null,
    compressionTextureId: null,
    cylinderDiametersIn: [...diameters].sort((a, b) => a - b),
    target: defaultCompressionTarget,
  };
}

/**
 * The spec's points in the garment's sheet order, with any point the garment lacks a row for
 * added from its defaults; points stored for another garment type are kept after them.
 */
export function pointsForGarment(spec: SizeSpec, garment: FitGarment): SizeSpecPoint[] {
  const byKey = new Map(spec.points.map((p) => [p.point, p]));
  const own = garmentPoints[garment].map(
    (point) =>
      byKey.get(point) ?? {
        point, baseCm: null, gradeCm: pointsOfMeasure[point].defaultGradeCm, toleranceCm: pointsOfMeasure[point].defaultToleranceCm, overrides: {},
      },
  );
  const rest = spec.points.filter((p) => !garmentPoints[garment].includes(p.point));
  return [...own, ...rest];
}

/**
 * The seamless half-widths that fit like the entered cut-and-sew ones, by the studio factor
 * (`seamlessEquivalent`): point → size → cm.
 */
export function seamlessFromCutAndSew(
  cutAndSew: SizeSpec['cutAndSew'],
  factor: number,
): Partial<Record<PointKey, Record<string, number>>> {
  const out: Partial<Record<PointKey, Record<string, number>>> = {};
  for (const [point, bySize] of Object.entries(cutAndSew) as [PointKey, Record<string, number> | undefined][]) {
    if (!bySize) continue;
    out[point] = Object.fromEntries(Object.entries(bySize).map(([size, cm]) => [size, seamlessEquivalent(cm, factor)]));
  }
  return out;
}
