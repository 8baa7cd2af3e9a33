/**
 * Machine throughput and knitting time: how many courses a machine knits per minute, how long one
 * garment takes, and the production of a circular machine in kg.
 */

/**
 * Courses knitted per minute: every feeder (knitting system) lays one course per revolution, so
 * courses/min = feeders × rpm; when a course of the structure needs more than one feeder (two
 * yarns knitted one after the other into one course), divide by the feeders per course.
 * Source: Textile Technical Handbook (2023), p. 147 "Knitting – General formulae" (i),
 * "Course/min = No. of feeders x Cylinder speed (rpm)"; references.md §7(g).
 * @param rpm machine speed, revolutions per minute (for a V-bed: carriage passes per minute)
 * @param feeders knitting systems on the machine
 * @param feedersPerCourse feeders that knit one course of the structure (1 for plain knitting)
 */
export function coursesPerMinute(rpm: number, feeders: number, feedersPerCourse = 1): number {
  if (!(rpm > 0)) throw new RangeError(`The machine speed must be above zero (got ${rpm}).`);
  if (!(feeders > 0)) throw new RangeError(`The machine needs at least one feeder (got ${feeders}).`);
  if (!(feedersPerCourse > 0) || feedersPerCourse > feeders) {
    throw new RangeError(`Feeders per course must lie between 1 and the feeders of the machine (got ${feedersPerCourse}).`);
  }
  return (rpm * feeders) / feedersPerCourse;
}

export interface KnittingTimeInput {
  /** Courses to knit for one garment (all its tubes or panels). */
  courses: number;
  rpm: number;
  feeders: number;
  feedersPerCourse?: number;
  /** Share of the time the machine actually knits (stops, doffing, yarn breaks): 0 < η ≤ 1. */
  efficiency: number;
}

export interface KnittingTime {
  coursesPerMinute: number;
  /** Minutes at full speed: courses ÷ courses per minute. */
  idealMinutes: number;
  /** Minutes with the efficiency factor: ideal ÷ η. */
  minutes: number;
}

/**
 * Knitting time of one garment: courses ÷ (rpm × feeders ÷ feeders per course), divided by the
 * efficiency. Source: courses/min from the Textile Technical Handbook (2023), p. 147 (i); the
 * efficiency factor as in the textiletutorials.com production formula (references.md §7(g)).
 */
export function knittingTime(input: KnittingTimeInput): KnittingTime {
  if (!(input.courses >= 0) || !Number.isFinite(input.courses)) throw new RangeError(`Courses must be a number ≥ 0 (got ${input.courses}).`);
  if (!(input.efficiency > 0 && input.efficiency <= 1)) throw new RangeError(`The efficiency lies in (0, 1] (got ${input.efficiency}).`);
  const cpm = coursesPerMinute(input.rpm, input.feeders, input.feedersPerCourse ?? 1);
  const idealMinutes = input.courses / cpm;
  return { coursesPerMinute: cpm, idealMinutes, minutes: idealMinutes / input.efficiency };
}

export interface CircularProductionInput {
  /** Needles in the cylinder, when known (a machine's count is π × D × E rounded to its needle multiple). */
  needles?: number;
  /** Cylinder diameter, inches: with `gauge`, gives the needles (π × D × E) when `needles` is not given. */
  diameterIn?: number;
  /** Needles per inch: with `diameterIn`, gives the needles when `needles` is not given. */
  gauge?: number;
  rpm: number;
  feeders: number;
  /** Loop (stitch) length, mm. */
  loopMm: number;
  /** Linear density of the yarn, tex. */
  tex: number;
  efficiency: number;
  /** π as used for the needles from diameter and gauge; the worked example uses 3.14. */
  pi?: number;
}

/**
 * Needles of the cylinder: `needles` when given, else π × diameter (in) × gauge (needles per inch).
 * Source: textiletutorials.com, "Needle number of machine, = ∏× diameter of cylinder× gauge".
 */
export function productionNeedles(input: Pick<CircularProductionInput, 'needles' | 'diameterIn' | 'gauge' | 'pi'>): number {
  if (input.needles !== undefined) {
    if (!(input.needles > 0) || !Number.isFinite(input.needles)) throw new RangeError(`needles must be above zero (got ${input.needles}).`);
    return input.needles;
  }
  const { diameterIn, gauge } = input;
  if (diameterIn === undefined || gauge === undefined) throw new RangeError('Give the needles, or the cylinder diameter and the gauge.');
  if (!(diameterIn > 0)) throw new RangeError(`diameterIn must be above zero (got ${diameterIn}).`);
  if (!(gauge > 0)) throw new RangeError(`gauge must be above zero (got ${gauge}).`);
  return (input.pi ?? Math.PI) * diameterIn * gauge;
}

/**
 * Production of a circular machine, kg per minute of running: N·rpm·F·l·tex·η ÷ 10⁹, with N the
 * needles (given, or π × D × E); each feeder lays N × l mm of yarn per revolution; mm × tex ÷ 10⁹ = kg.
 * Source: textiletutorials.com, production kg/h = "∏×D×G× RPM of cylinder × Number of feeder × loop
 * length in mm × tex×60× efficiency / 1000×1000×1000" (references.md §7(g)).
 */
export function circularProductionKgPerMinute(input: CircularProductionInput): number {
  const needles = productionNeedles(input);
  for (const [name, v] of Object.entries({ rpm: input.rpm, feeders: input.feeders, loopMm: input.loopMm, tex: input.tex })) {
    if (!(v > 0)) throw new RangeError(`${name} must be above zero (got ${v}).`);
  }
  if (!(input.efficiency > 0 && input.efficiency <= 1)) throw new RangeError(`The efficiency lies in (0, 1] (got ${input.efficiency}).`);
  return (needles * input.rpm * input.feeders * input.loopMm * input.tex * input.efficiency) / 1e9;
}

/** Production in kg per hour (× 60 minutes); references.md §7(g). */
export function circularProductionKgPerHour(input: CircularProductionInput): number {
  return circularProductionKgPerMinute(input) * 60;
}

/** Production in kg for a shift of `minutes` (the textiletutorials.com worked example: 8 h = 480 min). */
export function circularProductionKgPerShift(input: CircularProductionInput, minutes = 480): number {
  if (!(minutes > 0)) throw new RangeError('A shift lasts more than zero minutes.');
  return circularProductionKgPerMinute(input) * minutes;
}
