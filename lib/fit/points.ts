/**
 * Points of measure, body girths and the defaults a new size spec starts from.
 *
 * Half-widths are measured flat across the garment (relaxed), lengths along it; all in cm.
 * The grade rules and tolerances below are common practice for knitted performance garments,
 * no published source: a studio edits them per style.
 */

/** The garments a style can be (the same words as the style's garment type). */
export type FitGarment = 'long-sleeve-top' | 'short-sleeve-top' | 'tank' | 'sports-bra' | 'legging' | 'shorts';

export const pointKeys = [
  'chest-half', 'waist-half', 'bottom-half', 'body-length-hps', 'sleeve-length', 'across-shoulder', 'armhole',
  'hip-half', 'thigh-half', 'knee-half', 'calf-half', 'ankle-half', 'inseam', 'rise',
] as const;
export type PointKey = (typeof pointKeys)[number];

export const girthKeys = ['chest', 'waist', 'hip', 'thigh', 'calf'] as const;
export type GirthKey = (typeof girthKeys)[number];

export interface PointOfMeasure {
  key: PointKey;
  label: string;
  /** `half-width`: flat across the garment (a girth halved); `width`: flat across, not a girth; `length`: along it. */
  kind: 'half-width' | 'width' | 'length';
  /** Grade per size step, cm. Common practice, no published source. */
  defaultGradeCm: number;
  /** ± tolerance, cm. Common practice, no published source. */
  defaultToleranceCm: number;
  /** The body girth this half-width goes round, for the compression estimate. */
  girth?: GirthKey;
}

const P = (key: PointKey, label: string, kind: PointOfMeasure['kind'], grade: number, tol: number, girth?: GirthKey): PointOfMeasure =>
  girth ? { key, label, kind, defaultGradeCm: grade, defaultToleranceCm: tol, girth } : { key, label, kind, defaultGradeCm: grade, defaultToleranceCm: tol };

/** Every point of measure, in sheet order. */
export const pointsOfMeasure: Record<PointKey, PointOfMeasure> = {
  'chest-half': P('chest-half', 'Chest half-width', 'half-width', 2, 1, 'chest'),
  'waist-half': P('waist-half', 'Waist half-width', 'half-width', 2, 1, 'waist'),
  // A top's bottom edge sits round the hip.
  'bottom-half': P('bottom-half', 'Bottom half-width', 'half-width', 2, 1, 'hip'),
  'body-length-hps': P('body-length-hps', 'Body length from HPS', 'length', 1.5, 1),
  'sleeve-length': P('sleeve-length', 'Sleeve length', 'length', 1, 1),
  'across-shoulder': P('across-shoulder', 'Across shoulder', 'width', 1, 0.5),
  armhole: P('armhole', 'Armhole (straight)', 'length', 1, 0.5),
  'hip-half': P('hip-half', 'Hip half-width', 'half-width', 2, 1, 'hip'),
  'thigh-half': P('thigh-half', 'Thigh half-width', 'half-width', 1.25, 0.75, 'thigh'),
  'knee-half': P('knee-half', 'Knee half-width', 'half-width', 0.75, 0.5),
  'calf-half': P('calf-half', 'Calf half-width', 'half-width', 0.75, 0.5, 'calf'),
  'ankle-half': P('ankle-half', 'Ankle half-width', 'half-width', 0.5, 0.5),
  inseam: P('inseam', 'Inseam', 'length', 0, 1),
  rise: P('rise', 'Front rise', 'length', 0.75, 0.5),
};

const tops: PointKey[] = ['chest-half', 'waist-half', 'bottom-half', 'body-length-hps', 'sleeve-length', 'across-shoulder', 'armhole'];

/** The points of measure a garment's sheet shows, in order. */
export const garmentPoints: Record<FitGarment, readonly PointKey[]> = {
  'long-sleeve-top': tops,
  'short-sleeve-top': tops,
  tank: tops.filter((k) => k !== 'sleeve-length'),
  'sports-bra': ['chest-half', 'bottom-half', 'body-length-hps', 'across-shoulder', 'armhole'],
  legging: ['waist-half', 'hip-half', 'thigh-half', 'knee-half', 'calf-half', 'ankle-half', 'inseam', 'rise'],
  shorts: ['waist-half', 'hip-half', 'thigh-half', 'inseam', 'rise'],
};

/** The body girths a garment's sheet asks for. */
export const garmentGirths: Record<FitGarment, readonly GirthKey[]> = {
  'long-sleeve-top': ['chest', 'waist', 'hip'],
  'short-sleeve-top': ['chest', 'waist', 'hip'],
  tank: ['chest', 'waist', 'hip'],
  'sports-bra': ['chest', 'waist'],
  legging: ['waist', 'hip', 'thigh', 'calf'],
  shorts: ['waist', 'hip', 'thigh'],
};

export const girthLabels: Record<GirthKey, string> = { chest: 'Chest', waist: 'Waist', hip: 'Hip', thigh: 'Thigh', calf: 'Calf' };

/**
 * The half-widths a seamless tube sets directly (its relaxed width comes from the cylinder's
 * needles and the texture's density); lengths come from courses. Tops are one body tube; bottoms
 * are knitted leg by leg, each leg a tube, and joined at the rise, so their waist and hip are not
 * tubes of their own. Common practice, no published source.
 */
export function tubePoints(garment: FitGarment): PointKey[] {
  const legs: PointKey[] = ['thigh-half', 'knee-half', 'calf-half', 'ankle-half'];
  const bottoms = garment === 'legging' || garment === 'shorts';
  return garmentPoints[garment].filter((k) => pointsOfMeasure[k].kind === 'half-width' && (!bottoms || legs.includes(k)));
}

/** The tube point that decides the cylinder of a size: the chest of a top, the thigh of a leg. */
export function primaryTubePoint(garment: FitGarment): PointKey {
  return garment === 'legging' || garment === 'shorts' ? 'thigh-half' : 'chest-half';
}

/**
 * Cylinder diameters of body-size circular machines a studio is likely to have, inches.
 * Common practice, no published source.
 */
export const defaultCylinderDiametersIn: readonly number[] = [11, 12, 13, 14, 15, 16, 17];

export function isPointKey(v: string): v is PointKey {
  return (pointKeys as readonly string[]).includes(v);
}
