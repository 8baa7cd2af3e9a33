/**
 * The fit sheet of a style: for each size, the needles and cylinder each tube point needs, the
 * needles and courses of a fashioned (flat) panel, and the compression estimate per body girth.
 * It puts together `needles.ts`, `compression-target.ts` and the graded spec; all lengths in cm.
 */
import { coursesForLength, cylinderNeedles, flatNeedlesAtPoint, recommendTube, tubeHalfWidthCm, type CylinderOption, type FlatPointNeedles } from './needles';
import { checkCompression, type CompressionCheck, type CompressionTarget } from './compression-target';
import type { ForceExtensionCurve } from './compression';
import { garmentPoints, girthLabels, pointsOfMeasure, primaryTubePoint, tubePoints, type FitGarment, type GirthKey, type PointKey } from './points';

export type FitMachine =
  | { kind: 'circular'; diameterIn: number; gauge: number; needleMultiple: number }
  | { kind: 'flat'; gauge: number; bedNeedles: number };

export interface Density { walesPerCm: number; coursesPerCm: number }

/** Resolved spec values: point → size → cm (null where not entered). */
export type SpecValues = Partial<Record<PointKey, Readonly<Record<string, number | null>>>>;

/** Body girths: size → girth → cm. */
export type BodyGirths = Readonly<Record<string, Partial<Record<GirthKey, number>>>>;

export interface DensityOnCylinder {
  diameterIn: number;
  needles: number;
  /** The relaxed half-width this cylinder gives at the texture's present density, cm. */
  halfWidthCm: number;
  residualCm: number;
  /** Relaxed wales per cm that reach the target on this cylinder, and the change (0.05 = 5 % denser). */
  walesPerCm: number;
  change: number;
  /**
   * Courses per cm and loop length at that density, if the structure keeps its loop shape:
   * wales and courses per cm both vary inversely with loop length in the relaxed state ("The
   * geometry and dimensional properties of plain-knit fabrics", Journal of the Textile Institute,
   * 1959). A guide for the mill's first setting, not a measured value.
   */
  coursesPerCm: number;
  loopLengthChange: number;
}

export interface TubePointNeedles {
  point: PointKey;
  targetHalfWidthCm: number;
  /** Needles across the half-width at the present density (half the tube's needles). */
  needlesAcrossHalfWidth: number;
  /** The available cylinder nearest this point on its own. */
  nearest: CylinderOption;
  /** On the cylinder chosen for the size. */
  onSizeCylinder: DensityOnCylinder;
}

export interface SeamlessSizeNeedles {
  size: string;
  /** The cylinder recommended for the size (nearest for its chest, or for a leg its thigh); null without a value there. */
  cylinder: CylinderOption | null;
  /** The point that chose it. */
  decidedBy: PointKey;
  points: TubePointNeedles[];
  /** Courses along each length point. */
  lengths: { point: PointKey; lengthCm: number; courses: number }[];
}

export interface FlatSizeNeedles {
  size: string;
  widths: (FlatPointNeedles & { point: PointKey; targetCm: number })[];
  lengths: { point: PointKey; lengthCm: number; courses: number }[];
}

function onCylinder(diameterIn: number, gauge: number, multiple: number, density: Density, targetHalfWidthCm: number): DensityOnCylinder {
  const needles = cylinderNeedles(diameterIn, gauge, multiple);
  const halfWidthCm = tubeHalfWidthCm(needles, density.walesPerCm);
  const walesPerCm = needles / 2 / targetHalfWidthCm;
  const ratio = walesPerCm / density.walesPerCm;
  return {
    diameterIn, needles, halfWidthCm, residualCm: halfWidthCm - targetHalfWidthCm, walesPerCm, change: ratio - 1,
    coursesPerCm: density.coursesPerCm * ratio, loopLengthChange: 1 / ratio - 1,
  };
}

const positive = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;

function lengthCourses(garment: FitGarment, values: SpecValues, size: string, density: Density) {
  return garmentPoints[garment]
    .filter((k) => pointsOfMeasure[k].kind === 'length')
    .flatMap((point) => {
      const lengthCm = values[point]?.[size];
      return positive(lengthCm) ? [{ point, lengthCm, courses: coursesForLength(lengthCm, density.coursesPerCm) }] : [];
    });
}

/**
 * Seamless: for each size, the cylinder nearest its deciding tube (the chest of a top, the thigh
 * of a leg) among the available diameters at the machine's gauge and needle multiple, then for
 * every tube point the needles across the half-width, the nearest cylinder on its own, and the
 * density that reaches the target on the size's cylinder.
 */
export function seamlessNeedles(input: {
  garment: FitGarment;
  machine: Extract<FitMachine, { kind: 'circular' }>;
  sizes: readonly string[];
  values: SpecValues;
  density: Density;
  cylinderDiametersIn: readonly number[];
}): SeamlessSizeNeedles[] {
  const { garment, machine, sizes, values, density } = input;
  const diametersIn = input.cylinderDiametersIn.length ? input.cylinderDiametersIn : [machine.diameterIn];
  const decidedBy = primaryTubePoint(garment);
  const base = { gauge: machine.gauge, walesPerCm: density.walesPerCm, diametersIn, multiple: machine.needleMultiple };
  return sizes.map((size) => {
    const primary = values[decidedBy]?.[size];
    const cylinder = positive(primary) ? recommendTube({ ...base, targetHalfWidthCm: primary }).cylinder : null;
    const sizeDiameter = cylinder?.diameterIn ?? machine.diameterIn;
    const points = tubePoints(garment).flatMap((point): TubePointNeedles[] => {
      const target = values[point]?.[size];
      if (!positive(target)) return [];
      const rec = recommendTube({ ...base, targetHalfWidthCm: target });
      return [{
        point,
        targetHalfWidthCm: target,
        needlesAcrossHalfWidth: Math.round(target * density.walesPerCm),
        nearest: rec.cylinder,
        onSizeCylinder: onCylinder(sizeDiameter, machine.gauge, machine.needleMultiple, density, target),
      }];
    });
    return { size, cylinder, decidedBy, points, lengths: lengthCourses(garment, values, size, density) };
  });
}

/**
 * Flat (V-bed): needles per course across each width point of a fashioned panel (the front panel
 * is as wide as the garment's half-width there; the mill adds its seam allowance), checked
 * against the bed, and courses along each length point.
 */
export function flatNeedles(input: {
  garment: FitGarment;
  machine: Extract<FitMachine, { kind: 'flat' }>;
  sizes: readonly string[];
  values: SpecValues;
  density: Density;
}): FlatSizeNeedles[] {
  const { garment, machine, sizes, values, density } = input;
  const widthPoints = garmentPoints[garment].filter((k) => pointsOfMeasure[k].kind !== 'length');
  return sizes.map((size) => ({
    size,
    widths: widthPoints.flatMap((point) => {
      const targetCm = values[point]?.[size];
      if (!positive(targetCm)) return [];
      return [{ point, targetCm, ...flatNeedlesAtPoint(targetCm, density.walesPerCm, { bedNeedles: machine.bedNeedles }) }];
    }),
    lengths: lengthCourses(garment, values, size, density),
  }));
}

export interface GirthCompression extends CompressionCheck {
  girth: GirthKey;
  point: PointKey;
  bodyGirthCm: number;
  garmentHalfWidthCm: number;
  garmentGirthCm: number;
}

export interface SizeCompression {
  size: string;
  girths: GirthCompression[];
  /** Girths that could not be estimated, and why. */
  missing: { girth: GirthKey; reason: string }[];
}

const levelLabels = { mild: 'mild', moderate: 'moderate', firm: 'firm' } as const;

/**
 * The compression estimate per size and body girth: garment relaxed girth (twice the half-width),
 * extension, tension from the compression texture's force–extension points, and pressure by
 * Laplace's law, checked against the style's target band.
 */
export function compressionBySize(input: {
  garment: FitGarment;
  sizes: readonly string[];
  values: SpecValues;
  girths: BodyGirths;
  curve: ForceExtensionCurve;
  target: CompressionTarget;
}): SizeCompression[] {
  const { garment, sizes, values, girths, curve, target } = input;
  const band = target.bands[target.level];
  const pairs = garmentPoints[garment].flatMap((point) => {
    const girth = pointsOfMeasure[point].girth;
    return girth ? [{ point, girth }] : [];
  });
  return sizes.map((size) => {
    const out: SizeCompression = { size, girths: [], missing: [] };
    for (const { point, girth } of pairs) {
      const bodyGirthCm = girths[size]?.[girth];
      const half = values[point]?.[size];
      if (!positive(bodyGirthCm)) { out.missing.push({ girth, reason: `No ${girthLabels[girth].toLowerCase()} body girth for this size` }); continue; }
      if (!positive(half)) { out.missing.push({ girth, reason: `No ${pointsOfMeasure[point].label.toLowerCase()} in the spec` }); continue; }
      const check = checkCompression({
        size, pointLabel: pointsOfMeasure[point].label, girthLabel: girthLabels[girth], bodyGirthCm, garmentHalfWidthCm: half,
        curve, band, levelLabel: levelLabels[target.level],
      });
      out.girths.push({ ...check, girth, point, bodyGirthCm, garmentHalfWidthCm: half, garmentGirthCm: half * 2 });
    }
    return out;
  });
}

/** The texture whose relaxed wales per cm is nearest the density a point needs (a structure change instead of a setting change). */
export function nearestDensity<T extends { walesPerCm: number }>(textures: readonly T[], walesPerCm: number): T | null {
  let best: T | null = null;
  for (const t of textures) if (!best || Math.abs(t.walesPerCm - walesPerCm) < Math.abs(best.walesPerCm - walesPerCm)) best = t;
  return best;
}
