/**
 * The quote of a style: per size, the cost of one garment line by line (yarn, knitting time on the
 * machine, making-up and finishing, trims and labels), its margin to the target price, and the
 * order by size. Every line carries how it was computed, in words and figures.
 */
import { knittingTime, type KnittingTime } from './production';
import { makingUpKeys, makingUpLabels, type MakingUpKey } from './rates';

export interface QuoteYarn {
  id: string;
  name: string;
  /** Price per kg in the quote currency; null when the library has none. */
  pricePerKg: number | null;
}

export interface QuoteMachine {
  /** A circular machine (speed in revolutions per minute) or a V-bed (carriage passes per minute, its knitting systems as feeders). */
  kind: 'circular' | 'flat';
  /** Speed: revolutions (circular) or carriage passes (V-bed) per minute. */
  speedPerMinute: number;
  /** Knitting systems (feeders) on the machine. */
  feeders: number;
  /** Feeders that knit one course of the structure. */
  feedersPerCourse: number;
  efficiency: number;
  /** Machine cost per minute of knitting. */
  minuteRate: number;
  /** Whose rate `minuteRate` is, in words (the studio's, a mill's, entered for the style). */
  minuteRateFrom?: string;
}

export interface QuoteTrim {
  name: string;
  kind: string;
  unitCost: number;
}

export interface QuoteSizeInput {
  size: string;
  /** Knitted grams per yarn for one garment of this size (cut-away waste included, before the waste allowance). */
  knittedGrams: Readonly<Record<string, number>>;
  /** Courses the machine knits for one garment of this size. */
  courses: number;
  /** Garments of this size in the order. */
  garments: number;
}

export interface QuoteInput {
  currency: string;
  yarns: readonly QuoteYarn[];
  /** Fraction added to the knitted grams for yarn lost in knitting and finishing (0.05 = 5 %). */
  wasteAllowance: number;
  machine: QuoteMachine;
  makingUp: Readonly<Record<MakingUpKey, number>>;
  trims: readonly QuoteTrim[];
  targetPricePerGarment: number | null;
  sizes: readonly QuoteSizeInput[];
}

export type CostGroup = 'yarn' | 'knitting' | 'making-up' | 'trims';

export interface CostLine {
  key: string;
  group: CostGroup;
  label: string;
  /** Cost per garment in the quote currency. */
  amount: number;
  /** How the figure was computed, with the numbers used. */
  how: string;
}

export interface SizeQuote {
  size: string;
  garments: number;
  lines: CostLine[];
  /** Gross yarn grams per garment (waste included). */
  yarnGrams: number;
  knitting: KnittingTime & { courses: number };
  /** Cost of one garment: the sum of its lines. */
  perGarment: number;
  /** Cost of the order of this size: per garment × garments. */
  orderCost: number;
  marginPerGarment: number | null;
  /** Margin as a share of the target price. */
  marginShare: number | null;
  orderRevenue: number | null;
  orderMargin: number | null;
  /** How the figures of the size were computed, with the numbers used. */
  how: {
    /** Cost per garment: the sum of its line groups. */
    perGarment: string;
    /** Target − cost, and its share of the target; null without a target price. */
    margin: string | null;
    /** Order cost of the size: per garment × garments. */
    orderCost: string;
    /** Order margin of the size: margin per garment × garments; null without a target price. */
    orderMargin: string | null;
  };
}

export interface Quote {
  currency: string;
  targetPricePerGarment: number | null;
  sizes: SizeQuote[];
  order: {
    garments: number; cost: number; revenue: number | null; margin: number | null; marginShare: number | null;
    /** How the order totals were computed: the sizes summed, the revenue at the target price, the margin. */
    how: { cost: string; revenue: string | null; margin: string | null };
  };
  /** What is missing for a complete quote, in words. */
  problems: string[];
}

const m2 = (n: number) => n.toFixed(2);
const g1 = (n: number) => n.toFixed(1);
const pct = (f: number) => `${(f * 100).toFixed(f * 100 % 1 === 0 ? 0 : 1)} %`;
const groupWords: Record<CostGroup, string> = { yarn: 'yarn', knitting: 'knitting', 'making-up': 'making-up', trims: 'trims' };

/** The speed and systems of the machine in its own words: a circular machine turns, a V-bed carriage passes. */
function machineWords(machine: QuoteMachine): { speed: string; systems: string } {
  switch (machine.kind) {
    case 'circular':
      return { speed: `${g1(machine.speedPerMinute)} rpm`, systems: `${machine.feeders} feeders` };
    case 'flat':
      return { speed: `${g1(machine.speedPerMinute)} carriage passes/min`, systems: `${machine.feeders} knitting system${machine.feeders === 1 ? '' : 's'}` };
  }
}

/**
 * Yarn cost of one garment for one yarn: knitted grams × (1 + waste allowance) × price per kg ÷ 1000.
 * Common practice, no published source (consumption per references.md §7(f)).
 */
export function yarnCost(knittedGrams: number, wasteAllowance: number, pricePerKg: number): { grossGrams: number; cost: number } {
  if (!(knittedGrams >= 0)) throw new RangeError(`Grams must be ≥ 0 (got ${knittedGrams}).`);
  if (!(wasteAllowance >= 0)) throw new RangeError(`The waste allowance must be ≥ 0 (got ${wasteAllowance}).`);
  if (!(pricePerKg >= 0)) throw new RangeError(`A price per kg is ≥ 0 (got ${pricePerKg}).`);
  const grossGrams = knittedGrams * (1 + wasteAllowance);
  return { grossGrams, cost: (grossGrams * pricePerKg) / 1000 };
}

/** Machine cost of one garment: knitting minutes × machine-minute rate. Common practice, no published source. */
export function machineCost(minutes: number, minuteRate: number): number {
  if (!(minutes >= 0) || !(minuteRate >= 0)) throw new RangeError('Minutes and the minute rate are ≥ 0.');
  return minutes * minuteRate;
}

/** Margin to the target price: target − cost, and its share of the target. Common practice. */
export function marginTo(target: number, cost: number): { margin: number; share: number | null } {
  const margin = target - cost;
  return { margin, share: target > 0 ? margin / target : null };
}

/** Computes the quote. Sizes keep their order; a yarn with no price counts as 0 and is named in `problems`. */
export function computeQuote(input: QuoteInput): Quote {
  const { currency, machine } = input;
  const problems: string[] = [];
  const yarns = new Map(input.yarns.map((y) => [y.id, y]));
  const unpriced = new Set<string>();
  const sizes: SizeQuote[] = input.sizes.map((s) => {
    if (!Number.isInteger(s.garments) || s.garments < 0) throw new RangeError(`Garments for size ${s.size} must be a whole number ≥ 0.`);
    const lines: CostLine[] = [];
    let yarnGrams = 0;
    for (const [yarnId, grams] of Object.entries(s.knittedGrams)) {
      if (grams <= 0) continue;
      const y = yarns.get(yarnId);
      const name = y?.name ?? 'Unknown yarn';
      const price = y?.pricePerKg ?? null;
      if (price === null) unpriced.add(name);
      const { grossGrams, cost } = yarnCost(grams, input.wasteAllowance, price ?? 0);
      yarnGrams += grossGrams;
      lines.push({
        key: `yarn:${yarnId}`,
        group: 'yarn',
        label: `Yarn: ${name}`,
        amount: cost,
        how:
          `${g1(grams)} g knitted + ${pct(input.wasteAllowance)} waste = ${g1(grossGrams)} g × ` +
          (price === null ? `no price per kg (counted as 0)` : `${m2(price)} ${currency}/kg ÷ 1000`) +
          ` = ${m2(cost)} ${currency}`,
      });
    }
    const time = knittingTime({
      courses: s.courses, rpm: machine.speedPerMinute, feeders: machine.feeders, feedersPerCourse: machine.feedersPerCourse, efficiency: machine.efficiency,
    });
    const mc = machineCost(time.minutes, machine.minuteRate);
    const words = machineWords(machine);
    lines.push({
      key: 'knitting',
      group: 'knitting',
      label: 'Knitting (machine time)',
      amount: mc,
      how:
        `${Math.round(s.courses)} courses ÷ (${words.speed} × ${words.systems} ÷ ${machine.feedersPerCourse} per course ` +
        `= ${g1(time.coursesPerMinute)} courses/min) ÷ ${pct(machine.efficiency)} efficiency = ${time.minutes.toFixed(2)} min × ` +
        `${m2(machine.minuteRate)} ${currency}/min${machine.minuteRateFrom ? ` (${machine.minuteRateFrom})` : ''} = ${m2(mc)} ${currency}`,
    });
    for (const k of makingUpKeys) {
      const v = input.makingUp[k];
      lines.push({ key: `making-up:${k}`, group: 'making-up', label: makingUpLabels[k], amount: v, how: `Entered per garment: ${m2(v)} ${currency}` });
    }
    for (const [i, t] of input.trims.entries()) {
      lines.push({
        key: `trim:${i}`,
        group: 'trims',
        label: `Trim: ${t.name}`,
        amount: t.unitCost,
        how: `${t.kind}: ${m2(t.unitCost)} ${currency} per piece, bought and applied`,
      });
    }
    const perGarment = lines.reduce((a, l) => a + l.amount, 0);
    const target = input.targetPricePerGarment;
    const margin = target === null ? null : marginTo(target, perGarment);
    const groups = (Object.keys(groupWords) as CostGroup[])
      .map((g) => ({ g, sum: lines.filter((l) => l.group === g).reduce((a, l) => a + l.amount, 0), any: lines.some((l) => l.group === g) }))
      .filter((x) => x.any);
    const each = `${s.garments} garment${s.garments === 1 ? '' : 's'}`;
    const how: SizeQuote['how'] = {
      perGarment: `${groups.map((x) => `${groupWords[x.g]} ${m2(x.sum)}`).join(' + ')} = ${m2(perGarment)} ${currency}`,
      margin: target === null || margin === null
        ? null
        : `target ${m2(target)} − cost ${m2(perGarment)} = ${m2(margin.margin)} ${currency}` +
          (margin.share === null ? ' (no share of a target of 0)' : `, ${(margin.share * 100).toFixed(1)} % of the target`),
      orderCost: `${m2(perGarment)} ${currency} per garment × ${each} = ${m2(perGarment * s.garments)} ${currency}`,
      orderMargin: margin === null ? null : `${m2(margin.margin)} ${currency} per garment × ${each} = ${m2(margin.margin * s.garments)} ${currency}`,
    };
    return {
      size: s.size,
      garments: s.garments,
      lines,
      yarnGrams,
      knitting: { ...time, courses: s.courses },
      perGarment,
      orderCost: perGarment * s.garments,
      marginPerGarment: margin?.margin ?? null,
      marginShare: margin?.share ?? null,
      orderRevenue: target === null ? null : target * s.garments,
      orderMargin: margin ? margin.margin * s.garments : null,
      how,
    };
  });
  if (unpriced.size) problems.push(`No price per kg in the library for ${[...unpriced].join(', ')}: counted as 0.`);
  if (input.targetPricePerGarment === null) problems.push('No target price in the brief: no margin.');
  const garments = sizes.reduce((a, s) => a + s.garments, 0);
  if (garments === 0) problems.push('No order size per size in the brief: the order totals are 0.');
  const cost = sizes.reduce((a, s) => a + s.orderCost, 0);
  const revenue = input.targetPricePerGarment === null ? null : input.targetPricePerGarment * garments;
  const margin = revenue === null ? null : revenue - cost;
  const marginShare = revenue && margin !== null ? margin / revenue : null;
  const sizeCosts = sizes.length ? sizes.map((s) => `${s.size} ${m2(s.orderCost)}`).join(' + ') : 'no sizes';
  const orderHow: Quote['order']['how'] = {
    cost: `${sizeCosts} = ${m2(cost)} ${currency} for ${garments} garments`,
    revenue: revenue === null ? null : `${m2(input.targetPricePerGarment ?? 0)} ${currency} target × ${garments} garments = ${m2(revenue)} ${currency}`,
    margin: revenue === null || margin === null
      ? null
      : `${m2(revenue)} at the target − ${m2(cost)} cost = ${m2(margin)} ${currency}` + (marginShare === null ? '' : `, ${(marginShare * 100).toFixed(1)} % of the target`),
  };
  return {
    currency,
    targetPricePerGarment: input.targetPricePerGarment,
    sizes,
    order: { garments, cost, revenue, margin, marginShare, how: orderHow },
    problems,
  };
}
