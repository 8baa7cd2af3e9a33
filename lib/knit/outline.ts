/**
 * Default panels of a style: the knitted area and the cut outline of each panel in stitch space,
 * generated from the garment type, the construction, the machine and the base size's measurements.
 *
 * Seamless: the body tube gives a front and a back panel, each half the cylinder's needles wide;
 * the knitted area is the full rectangle and the cut outline is the garment part kept (neckline,
 * shoulders, armholes cut away). Sleeves of long-sleeve tops are further panels. Flat (V-bed):
 * the panel is fashioned, so its knitted area is the outline itself.
 *
 * Coordinates: x in needles from the left, y in courses from the top (the neck end of a top, the
 * waist of a bottom). Curves are sampled as polylines with whole-stitch vertices.
 */
import { rectanglePolygon, type Panel, type PanelKind, type StitchPoint, type StitchPolygon } from './panel';

export type GarmentKind = 'long-sleeve-top' | 'short-sleeve-top' | 'tank' | 'sports-bra' | 'legging' | 'shorts';

/** How a sleeve joins the body: a set-in armhole with a sleeve cap, or a raglan line from the neck to the underarm. */
export const sleeveStyles = ['set-in', 'raglan'] as const;
export type SleeveStyle = (typeof sleeveStyles)[number];

/** The width of a raglan sleeve's top, the part of the neckline it forms, cm. Common practice, no published source. */
const raglanSleeveTopCm = 6;

/** Base-size measurements that shape the panels, cm (flat, half-girths where named). */
export interface OutlineMeasurements {
  /** Body length from the high point of the shoulder, or the outseam for bottoms. */
  lengthCm: number;
  /** Armhole depth from the shoulder line (tops). */
  armholeDepthCm: number;
  /** Across shoulder, point to point (tops). */
  acrossShoulderCm: number;
  /** Chest half-width, flat across (tops): the width of a fashioned body panel. */
  chestHalfCm: number;
  /** Neck width, seam to seam (tops). */
  neckWidthCm: number;
  frontNeckDropCm: number;
  backNeckDropCm: number;
  /** Shoulder slope, vertical drop from neck point to shoulder point. */
  shoulderSlopeCm: number;
  /** Sleeve length from shoulder point (long and short sleeve). */
  sleeveLengthCm: number;
  /** Upper-arm (bicep) half-girth and cuff half-width. */
  bicepHalfCm: number;
  cuffHalfCm: number;
  /** Bottoms: rise (waist to crotch), thigh and ankle/leg-opening half-widths. */
  riseCm: number;
  thighHalfCm: number;
  legOpeningHalfCm: number;
}

/**
 * Typical base-size (women's M) measurements per garment type. Invented for the demo from common
 * practice; the size spec (Fit section) replaces them when it exists.
 */
export function defaultMeasurements(garment: GarmentKind): OutlineMeasurements {
  const top: OutlineMeasurements = {
    lengthCm: 60, armholeDepthCm: 19, acrossShoulderCm: 36, chestHalfCm: 50, neckWidthCm: 17, frontNeckDropCm: 8, backNeckDropCm: 2,
    shoulderSlopeCm: 4, sleeveLengthCm: 60, bicepHalfCm: 13, cuffHalfCm: 8, riseCm: 0, thighHalfCm: 0, legOpeningHalfCm: 0,
  };
  switch (garment) {
    case 'long-sleeve-top': return top;
    case 'short-sleeve-top': return { ...top, sleeveLengthCm: 18, cuffHalfCm: 12 };
    case 'tank': return { ...top, lengthCm: 58, armholeDepthCm: 22, acrossShoulderCm: 28, chestHalfCm: 42, neckWidthCm: 20, frontNeckDropCm: 12, sleeveLengthCm: 0 };
    case 'sports-bra': return { ...top, lengthCm: 32, armholeDepthCm: 17, acrossShoulderCm: 24, chestHalfCm: 38, neckWidthCm: 18, frontNeckDropCm: 14, backNeckDropCm: 10, sleeveLengthCm: 0 };
    case 'legging': return { ...top, lengthCm: 90, riseCm: 26, thighHalfCm: 24, legOpeningHalfCm: 10, sleeveLengthCm: 0 };
    case 'shorts': return { ...top, lengthCm: 40, riseCm: 26, thighHalfCm: 25, legOpeningHalfCm: 24, sleeveLengthCm: 0 };
  }
}

/** The points of measure of a size spec that shape the outline (the Fit section's keys), cm. */
export type OutlinePointsCm = Partial<Record<'chest-half' | 'body-length-hps' | 'sleeve-length' | 'across-shoulder' | 'armhole' | 'thigh-half' | 'ankle-half' | 'inseam' | 'rise', number | null>>;

/**
 * The outline measurements of a garment from its base size's points of measure, each missing (or
 * non-positive) value taken from `defaultMeasurements`. The straight armhole runs from the shoulder
 * point to the underarm, so its depth is the vertical leg of that diagonal (Pythagoras; the
 * horizontal leg is half the difference of chest half-width and across shoulder). Bottoms: the
 * outseam is inseam + rise. Common practice for reading a spec sheet, no published source.
 */
export function outlineMeasurementsFromSpec(garment: GarmentKind, pointsCm: OutlinePointsCm): OutlineMeasurements {
  const d = defaultMeasurements(garment);
  const v = (key: keyof OutlinePointsCm): number | undefined => {
    const x = pointsCm[key];
    return typeof x === 'number' && Number.isFinite(x) && x > 0 ? x : undefined;
  };
  const m: OutlineMeasurements = { ...d };
  if (garment === 'legging' || garment === 'shorts') {
    m.riseCm = v('rise') ?? d.riseCm;
    const inseam = v('inseam');
    if (inseam !== undefined) m.lengthCm = inseam + m.riseCm;
    m.thighHalfCm = v('thigh-half') ?? d.thighHalfCm;
    if (garment === 'legging') m.legOpeningHalfCm = v('ankle-half') ?? d.legOpeningHalfCm;
    m.legOpeningHalfCm = Math.min(m.legOpeningHalfCm, m.thighHalfCm);
    return m;
  }
  m.lengthCm = v('body-length-hps') ?? d.lengthCm;
  m.acrossShoulderCm = v('across-shoulder') ?? d.acrossShoulderCm;
  m.chestHalfCm = v('chest-half') ?? d.chestHalfCm;
  if (d.sleeveLengthCm > 0) m.sleeveLengthCm = v('sleeve-length') ?? d.sleeveLengthCm;
  const straight = v('armhole');
  if (straight !== undefined) {
    const across = Math.max(m.chestHalfCm - m.acrossShoulderCm, 0) / 2;
    m.armholeDepthCm = straight > across ? Math.sqrt(straight * straight - across * across) : straight;
  }
  return m;
}

export interface PanelGenerationInput {
  garment: GarmentKind;
  construction: 'seamless' | 'flat';
  /** Seamless: the cylinder's needle count; flat: the bed width in needles. */
  machineNeedles: number;
  density: { walesPerCm: number; coursesPerCm: number };
  measurements?: OutlineMeasurements;
  /** Set-in (the default) or raglan; only tops with sleeves take a raglan. */
  sleeveStyle?: SleeveStyle;
  baseTextureId: string;
  /** Ids for the generated panels (defaults to kind names). */
  newId?: (kind: PanelKind) => string;
}

const round = (v: number) => Math.round(v);

/** Samples a quarter ellipse from `from` to `to`, bulging towards `corner`'s opposite side. */
function quarterCurve(from: StitchPoint, to: StitchPoint, steps: number, bulge: 'x-first' | 'y-first'): StitchPoint[] {
  const pts: StitchPoint[] = [];
  for (let i = 1; i < steps; i++) {
    const t = (i / steps) * (Math.PI / 2);
    const fx = bulge === 'x-first' ? Math.sin(t) : 1 - Math.cos(t);
    const fy = bulge === 'x-first' ? 1 - Math.cos(t) : Math.sin(t);
    pts.push({ x: round(from.x + (to.x - from.x) * fx), y: round(from.y + (to.y - from.y) * fy) });
  }
  return pts;
}

function dedupe(poly: StitchPoint[]): StitchPolygon {
  const out: StitchPoint[] = [];
  for (const p of poly) {
    const last = out[out.length - 1];
    if (!last || last.x !== p.x || last.y !== p.y) out.push(p);
  }
  const first = out[0];
  const last = out[out.length - 1];
  if (first && last && out.length > 1 && first.x === last.x && first.y === last.y) out.pop();
  return out;
}

/** A top's neck, shoulder and underarm points on a body panel `w` needles wide and `h` courses tall. */
function topPoints(w: number, h: number, m: OutlineMeasurements, d: PanelGenerationInput['density']) {
  const mid = w / 2;
  const neckHalf = Math.min((m.neckWidthCm * d.walesPerCm) / 2, w * 0.3);
  const shoulderHalf = Math.min(Math.max((m.acrossShoulderCm * d.walesPerCm) / 2, neckHalf + 4), mid);
  const slope = m.shoulderSlopeCm * d.coursesPerCm;
  const armBottom = Math.min(slope + m.armholeDepthCm * d.coursesPerCm, h - 4);
  return {
    armBottom,
    neckL: { x: round(mid - neckHalf), y: 0 },
    neckR: { x: round(mid + neckHalf), y: 0 },
    shL: { x: round(mid - shoulderHalf), y: round(slope) },
    shR: { x: round(mid + shoulderHalf), y: round(slope) },
    armL: { x: 0, y: round(armBottom) },
    armR: { x: w, y: round(armBottom) },
  };
}

/**
 * The raglan line of a top's body panel, from the neck point down to the underarm, as a run across
 * (needles) and a drop (courses). Front and back have the same line.
 */
function bodyRaglan(w: number, h: number, m: OutlineMeasurements, d: PanelGenerationInput['density']): { acrossNeedles: number; dropCourses: number } {
  const { neckL, armL } = topPoints(w, h, m, d);
  return { acrossNeedles: neckL.x - armL.x, dropCourses: armL.y - neckL.y };
}

/**
 * The outline of a top's body panel (front or back) on a panel `w` needles wide and `h` courses tall.
 * Set-in: shoulder line and armhole curve; raglan: a straight line from the neck point to the underarm.
 */
function topOutline(w: number, h: number, m: OutlineMeasurements, d: PanelGenerationInput['density'], front: boolean, sleeveStyle: SleeveStyle): StitchPolygon {
  const { armBottom, neckL, neckR, shL, shR, armL, armR } = topPoints(w, h, m, d);
  const drop = Math.min((front ? m.frontNeckDropCm : m.backNeckDropCm) * d.coursesPerCm, armBottom - 2);
  const neckBottom = { x: round(w / 2), y: round(Math.max(drop, 1)) };
  let leftSide: StitchPoint[];
  let rightSide: StitchPoint[];
  switch (sleeveStyle) {
    case 'set-in':
      leftSide = [shL, ...quarterCurve(shL, armL, 8, 'y-first')];
      rightSide = [...quarterCurve(armR, shR, 8, 'x-first'), shR];
      break;
    case 'raglan':
      leftSide = [];
      rightSide = [];
      break;
  }
  return dedupe([
    neckL,
    ...leftSide,
    armL,
    { x: 0, y: h },
    { x: w, y: h },
    armR,
    ...rightSide,
    neckR,
    ...quarterCurve(neckR, neckBottom, 6, 'y-first'),
    neckBottom,
    ...quarterCurve(neckBottom, neckL, 6, 'x-first'),
  ]);
}

/**
 * A raglan sleeve laid flat: a narrow top (part of the neckline) and on each side a raglan line to
 * the underarm as long as the body's (so the two are joined course to course), tapering to the cuff.
 * The drop solves |sleeve line| = |body line| in cm for the sleeve's own run across (Pythagoras).
 */
function raglanSleeveOutline(w: number, h: number, m: OutlineMeasurements, d: PanelGenerationInput['density'], body: { acrossNeedles: number; dropCourses: number }): StitchPolygon {
  const mid = w / 2;
  const cuffHalf = Math.min(m.cuffHalfCm * d.walesPerCm, mid);
  const topHalf = Math.min((raglanSleeveTopCm * d.walesPerCm) / 2, mid - 1);
  const topL = { x: round(mid - topHalf), y: 0 };
  const topR = { x: w - topL.x, y: 0 };
  const bodyCm = Math.hypot(body.acrossNeedles / d.walesPerCm, body.dropCourses / d.coursesPerCm);
  const acrossCm = topL.x / d.walesPerCm;
  const dropCm = bodyCm > acrossCm ? Math.sqrt(bodyCm * bodyCm - acrossCm * acrossCm) : 0;
  const drop = Math.min(Math.max(round(dropCm * d.coursesPerCm), 1), h - 2);
  return dedupe([
    topL,
    topR,
    { x: w, y: drop },
    { x: round(mid + cuffHalf), y: h },
    { x: round(mid - cuffHalf), y: h },
    { x: 0, y: drop },
  ]);
}

/** A sleeve laid flat (the full sleeve tube opened): cap curve at the top, tapering to the cuff. */
function sleeveOutline(w: number, h: number, m: OutlineMeasurements, d: PanelGenerationInput['density']): StitchPolygon {
  const mid = w / 2;
  const cuffHalf = Math.min(m.cuffHalfCm * d.walesPerCm, mid);
  const capHeight = Math.min(m.armholeDepthCm * 0.55 * d.coursesPerCm, h * 0.4);
  const capTop = { x: round(mid), y: 0 };
  const left = { x: 0, y: round(capHeight) };
  const right = { x: w, y: round(capHeight) };
  return dedupe([
    capTop,
    ...quarterCurve(capTop, right, 8, 'x-first'),
    right,
    { x: round(mid + cuffHalf), y: h },
    { x: round(mid - cuffHalf), y: h },
    left,
    ...quarterCurve(left, capTop, 8, 'y-first'),
  ]);
}

/** One leg's front or back of a bottom: waist at the top, the crotch curve on the inner side, tapering to the leg opening. */
function bottomOutline(w: number, h: number, m: OutlineMeasurements, d: PanelGenerationInput['density']): StitchPolygon {
  const rise = Math.min(m.riseCm * d.coursesPerCm, h * 0.7);
  const thigh = Math.min(m.thighHalfCm * d.walesPerCm, w);
  const opening = Math.min(m.legOpeningHalfCm * d.walesPerCm, thigh);
  const crotch = { x: round(w - Math.max(w - thigh, 0)), y: round(rise) };
  const innerTop = { x: round(w - Math.max((w - thigh) * 0.2, 2)), y: 0 };
  return dedupe([
    { x: 0, y: 0 },
    innerTop,
    ...quarterCurve(innerTop, crotch, 6, 'y-first'),
    crotch,
    { x: round(w / 2 + opening / 2), y: h },
    { x: round(Math.max(w / 2 - opening / 2, 0)), y: h },
  ]);
}

/**
 * The style's default panels. Widths and heights are whole needles and courses; every outline lies
 * inside its panel and is a simple polygon.
 */
export function generatePanels(input: PanelGenerationInput): Panel[] {
  const m = input.measurements ?? defaultMeasurements(input.garment);
  const d = input.density;
  const id = input.newId ?? ((k: PanelKind) => k);
  const bottoms = input.garment === 'legging' || input.garment === 'shorts';
  const panels: Panel[] = [];
  const make = (kind: PanelKind, name: string, w: number, h: number, outline: StitchPolygon, flat: boolean): Panel => ({
    id: id(kind),
    name,
    kind,
    widthNeedles: w,
    heightCourses: h,
    knittedArea: flat ? outline : rectanglePolygon(w, h),
    cutOutline: outline,
    baseTextureId: input.baseTextureId,
    zones: [],
  });

  const flat = input.construction === 'flat';
  if (bottoms) {
    // Seamless bottoms: one tube per leg; the panels are the front and back of one leg, mirrored for the other.
    const w = flat ? Math.min(input.machineNeedles, round(m.thighHalfCm * d.walesPerCm * 1.15)) : round(input.machineNeedles / 2);
    const h = round(m.lengthCm * d.coursesPerCm);
    const outline = bottomOutline(w, h, m, d);
    panels.push(make('front', 'Front (leg)', w, h, outline, flat));
    panels.push(make('back', 'Back (leg)', w, h, outline, flat));
    return panels;
  }

  const bodyW = flat
    ? Math.min(input.machineNeedles, round(Math.max(m.chestHalfCm, m.acrossShoulderCm) * d.walesPerCm))
    : round(input.machineNeedles / 2);
  const bodyH = round(m.lengthCm * d.coursesPerCm);
  const sleeves = m.sleeveLengthCm > 0;
  const sleeveStyle: SleeveStyle = sleeves ? (input.sleeveStyle ?? 'set-in') : 'set-in';
  panels.push(make('front', 'Front', bodyW, bodyH, topOutline(bodyW, bodyH, m, d, true, sleeveStyle), flat));
  panels.push(make('back', 'Back', bodyW, bodyH, topOutline(bodyW, bodyH, m, d, false, sleeveStyle), flat));
  if (sleeves) {
    const sw = Math.min(input.machineNeedles, round(m.bicepHalfCm * 2 * d.walesPerCm));
    const sh = round(m.sleeveLengthCm * d.coursesPerCm);
    const outline = sleeveStyle === 'raglan' ? raglanSleeveOutline(sw, sh, m, d, bodyRaglan(bodyW, bodyH, m, d)) : sleeveOutline(sw, sh, m, d);
    panels.push(make('sleeve-left', 'Left sleeve', sw, sh, outline, flat));
    panels.push(make('sleeve-right', 'Right sleeve', sw, sh, outline, flat));
  }
  return panels;
}
