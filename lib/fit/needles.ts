/**
 * Needle counts and tube widths: circular (seamless) cylinders and flat (V-bed) panels.
 *
 * Gauge E is needles per inch. Widths are relaxed widths in cm; densities are relaxed wales per cm.
 */

/**
 * The needle count of a circular cylinder: π × diameter (in) × gauge (needles per inch), rounded to
 * the nearest whole multiple of the machine's needle multiple (1 when the machine has none).
 * Source: "Needle number of machine = π × diameter of cylinder × gauge" (textiletutorials.com);
 * "Gauge E = needles in cylinder / (dia (inch) × 3.14)" (knitting-calculation slides).
 */
export function cylinderNeedles(diameterIn: number, gauge: number, multiple = 1): number {
  if (!(diameterIn > 0) || !(gauge > 0)) throw new RangeError('diameter and gauge must be positive');
  if (!Number.isInteger(multiple) || multiple < 1) throw new RangeError('needle multiple must be a whole number ≥ 1');
  return Math.max(multiple, Math.round((Math.PI * diameterIn * gauge) / multiple) * multiple);
}

/**
 * Relaxed half-width (cm) of a seamless tube, as measured flat: needles ÷ 2 ÷ relaxed wales per cm.
 * The tube lies flat with half its needles on each face (product design, "Fit and needles").
 */
export function tubeHalfWidthCm(needles: number, walesPerCm: number): number {
  if (!(walesPerCm > 0)) throw new RangeError('wales per cm must be positive');
  return needles / 2 / walesPerCm;
}

/** Relaxed wales per cm that give a tube of `needles` the target half-width (cm). */
export function walesPerCmForHalfWidth(needles: number, targetHalfWidthCm: number): number {
  if (!(targetHalfWidthCm > 0)) throw new RangeError('target half-width must be positive');
  return needles / 2 / targetHalfWidthCm;
}

export interface CylinderOption {
  diameterIn: number;
  needles: number;
  /** Relaxed half-width the cylinder gives at the texture's density, cm. */
  halfWidthCm: number;
  /** Achieved minus target, cm: positive is wider than the target. */
  residualCm: number;
}

export interface DensityChange {
  diameterIn: number;
  needles: number;
  /** Relaxed wales per cm needed on this cylinder to reach the target exactly. */
  walesPerCm: number;
  /** Relative change of density from the texture's present wales per cm (0.05 = 5 % denser). */
  change: number;
}

export interface TubeRecommendation {
  /** The available cylinder that comes nearest the target at the present density. */
  cylinder: CylinderOption;
  /** Every available cylinder, nearest first. */
  options: CylinderOption[];
  /** The density that reaches the target on the current cylinder (or on the nearest one). */
  densityChange: DensityChange;
}

/**
 * Recommend a cylinder from the available diameters, and the density change that would close the
 * gap, for a target relaxed half-width (cm). Needles by `cylinderNeedles`, widths by
 * `tubeHalfWidthCm`; the density change is on `currentDiameterIn` when given, else on the nearest
 * cylinder.
 */
export function recommendTube(input: {
  targetHalfWidthCm: number;
  gauge: number;
  walesPerCm: number;
  diametersIn: readonly number[];
  multiple?: number;
  currentDiameterIn?: number;
}): TubeRecommendation {
  const { targetHalfWidthCm, gauge, walesPerCm, diametersIn, multiple = 1 } = input;
  if (diametersIn.length === 0) throw new RangeError('no cylinder diameters to choose from');
  const options = diametersIn
    .map((diameterIn): CylinderOption => {
      const needles = cylinderNeedles(diameterIn, gauge, multiple);
      const halfWidthCm = tubeHalfWidthCm(needles, walesPerCm);
      return { diameterIn, needles, halfWidthCm, residualCm: halfWidthCm - targetHalfWidthCm };
    })
    .sort((x, y) => Math.abs(x.residualCm) - Math.abs(y.residualCm) || x.diameterIn - y.diameterIn);
  const cylinder = options[0];
  if (!cylinder) throw new RangeError('no cylinder diameters to choose from');
  const diameterIn = input.currentDiameterIn ?? cylinder.diameterIn;
  const needles = cylinderNeedles(diameterIn, gauge, multiple);
  const needed = walesPerCmForHalfWidth(needles, targetHalfWidthCm);
  return {
    cylinder,
    options,
    densityChange: { diameterIn, needles, walesPerCm: needed, change: needed / walesPerCm - 1 },
  };
}

/**
 * Default studio factor from a cut-and-sew half-width to the seamless half-width that fits alike:
 * a seamless chest half-width of about 19 in fits like a 20.5 in cut-and-sew one, because seamless
 * knits stretch more. Common practice, no published source; a studio sets its own.
 */
export const defaultSeamlessFactor = 19 / 20.5;

/** The seamless half-width that fits like a cut-and-sew half-width (same unit in and out). */
export function seamlessEquivalent(cutAndSewHalfWidth: number, factor = defaultSeamlessFactor): number {
  if (!(factor > 0)) throw new RangeError('seamless factor must be positive');
  return cutAndSewHalfWidth * factor;
}

/** The cut-and-sew half-width that a seamless half-width fits like (inverse of `seamlessEquivalent`). */
export function cutAndSewEquivalent(seamlessHalfWidth: number, factor = defaultSeamlessFactor): number {
  if (!(factor > 0)) throw new RangeError('seamless factor must be positive');
  return seamlessHalfWidth / factor;
}

export interface FlatPointNeedles {
  /** Needles knitted across the point of measure in each course. */
  needles: number;
  /** The relaxed width those needles give, cm (differs from the target by the rounding). */
  widthCm: number;
  residualCm: number;
  /** False when the needles exceed the bed (then the panel cannot be knitted in one piece). */
  fitsBed: boolean;
}

/**
 * Flat (V-bed) knitting: needles per course across a point of measure of a fashioned panel, from
 * the panel's relaxed width there (cm) and the texture's relaxed wales per cm, rounded to whole
 * needles (to an even count when `even`, for a centred neck or a 1×1 rib). Wales per cm × width is
 * the definition of wale density.
 */
export function flatNeedlesAtPoint(
  widthCm: number,
  walesPerCm: number,
  options: { bedNeedles?: number; even?: boolean } = {},
): FlatPointNeedles {
  if (!(widthCm > 0) || !(walesPerCm > 0)) throw new RangeError('width and wales per cm must be positive');
  const step = options.even ? 2 : 1;
  const needles = Math.max(step, Math.round((widthCm * walesPerCm) / step) * step);
  const achieved = needles / walesPerCm;
  return {
    needles,
    widthCm: achieved,
    residualCm: achieved - widthCm,
    fitsBed: options.bedNeedles === undefined || needles <= options.bedNeedles,
  };
}

/** Courses along a length point of measure (body or sleeve length), cm × relaxed courses per cm. */
export function coursesForLength(lengthCm: number, coursesPerCm: number): number {
  if (!(lengthCm > 0) || !(coursesPerCm > 0)) throw new RangeError('length and courses per cm must be positive');
  return Math.round(lengthCm * coursesPerCm);
}
