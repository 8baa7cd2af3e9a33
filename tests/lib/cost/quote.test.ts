import { describe, expect, it } from 'vitest';
import { applyRatesChange, computeQuote, defaultCostRates, machineCost, marginTo, quoteCsv, resolveRates, yarnCost, type QuoteInput } from '@/lib/cost';

describe('yarnCost', () => {
  it('adds the waste allowance to the knitted grams, then grams × price per kg ÷ 1000 (common practice; consumption per references.md §7(f))', () => {
    const c = yarnCost(200, 0.05, 8);
    expect(c.grossGrams).toBeCloseTo(210, 10);
    expect(c.cost).toBeCloseTo(1.68, 10);
  });
  it('refuses negative grams or prices', () => {
    expect(() => yarnCost(-1, 0, 1)).toThrow(RangeError);
    expect(() => yarnCost(1, 0, -1)).toThrow(RangeError);
  });
});

describe('machineCost and margin (common practice, no published source)', () => {
  it('minutes × minute rate', () => expect(machineCost(6.25, 0.4)).toBeCloseTo(2.5, 10));
  it('margin to the target price and its share', () => {
    const m = marginTo(20, 15);
    expect(m.margin).toBe(5);
    expect(m.share).toBe(0.25);
    expect(marginTo(0, 1).share).toBeNull();
  });
});

const input = (over: Partial<QuoteInput> = {}): QuoteInput => ({
  currency: 'EUR',
  yarns: [
    { id: 'pa', name: 'PA 78/68', pricePerKg: 8 },
    { id: 'el', name: 'EL 44', pricePerKg: 20 },
  ],
  wasteAllowance: 0.05,
  machine: { kind: 'circular', speedPerMinute: 60, feeders: 8, feedersPerCourse: 1, efficiency: 0.84, minuteRate: 0.4 },
  makingUp: { cutting: 0.3, linking: 1.2, dyeing: 0.9, heatSetting: 0.25 },
  trims: [{ name: 'Neck label', kind: 'heat-transfer', unitCost: 0.35 }],
  targetPricePerGarment: 20,
  sizes: [
    { size: 'S', knittedGrams: { pa: 180, el: 20 }, courses: 2520, garments: 100 },
    { size: 'M', knittedGrams: { pa: 200, el: 22 }, courses: 2640, garments: 150 },
  ],
  ...over,
});

describe('computeQuote', () => {
  it('sums yarn, machine time, making-up and trims per garment and per order by size', () => {
    const q = computeQuote(input());
    const s = q.sizes[0]!;
    // Yarn: 180 × 1.05 × 8 / 1000 = 1.512; 20 × 1.05 × 20 / 1000 = 0.42. Knitting: 6.25 min × 0.4 = 2.5.
    // Making-up 2.65, trim 0.35 → 1.512 + 0.42 + 2.5 + 2.65 + 0.35 = 7.432.
    expect(s.lines.find((l) => l.key === 'yarn:pa')!.amount).toBeCloseTo(1.512, 10);
    expect(s.lines.find((l) => l.key === 'knitting')!.amount).toBeCloseTo(2.5, 10);
    expect(s.knitting.minutes).toBeCloseTo(6.25, 10);
    expect(s.perGarment).toBeCloseTo(7.432, 10);
    expect(s.orderCost).toBeCloseTo(743.2, 8);
    expect(s.marginPerGarment).toBeCloseTo(12.568, 10);
    expect(s.marginShare).toBeCloseTo(0.6284, 10);
    expect(q.order.garments).toBe(250);
    expect(q.order.cost).toBeCloseTo(s.orderCost + q.sizes[1]!.orderCost, 8);
    expect(q.order.revenue).toBe(5000);
    expect(q.problems).toEqual([]);
  });
  it('says how each figure was computed', () => {
    const s = computeQuote(input()).sizes[0]!;
    expect(s.lines.find((l) => l.key === 'yarn:pa')!.how).toBe('180.0 g knitted + 5 % waste = 189.0 g × 8.00 EUR/kg ÷ 1000 = 1.51 EUR');
    expect(s.lines.find((l) => l.key === 'knitting')!.how).toContain('2520 courses ÷ (60.0 rpm × 8 feeders ÷ 1 per course = 480.0 courses/min) ÷ 84 % efficiency = 6.25 min');
  });
  it('says how the size total, the margin and the order totals were computed (common practice, no published source)', () => {
    const q = computeQuote(input());
    const s = q.sizes[0]!;
    // Size S: yarn 1.512 + 0.42 = 1.932, knitting 2.5, making-up 2.65, trims 0.35 → 7.432 per garment;
    // margin 20 − 7.432 = 12.568 = 62.84 % of 20; × 100 garments: 743.20 and 1256.80.
    expect(s.how.perGarment).toBe('yarn 1.93 + knitting 2.50 + making-up 2.65 + trims 0.35 = 7.43 EUR');
    expect(s.how.margin).toBe('target 20.00 − cost 7.43 = 12.57 EUR, 62.8 % of the target');
    expect(s.how.orderCost).toBe('7.43 EUR per garment × 100 garments = 743.20 EUR');
    expect(s.how.orderMargin).toBe('12.57 EUR per garment × 100 garments = 1256.80 EUR');
    // Size M: yarn 1.68 + 0.462, knitting 2640 ÷ 480 ÷ 0.84 min × 0.4 = 2.61905, + 3.00 → 7.76105 × 150 = 1164.16;
    // the order: 743.20 + 1164.16 = 1907.36 for 250 garments, 5000 at the target, 3092.64 margin (61.9 %).
    expect(q.order.how.cost).toBe('S 743.20 + M 1164.16 = 1907.36 EUR for 250 garments');
    expect(q.order.how.revenue).toBe('20.00 EUR target × 250 garments = 5000.00 EUR');
    expect(q.order.how.margin).toBe('5000.00 at the target − 1907.36 cost = 3092.64 EUR, 61.9 % of the target');
  });
  it('says whose machine-minute rate the knitting line used', () => {
    const q = computeQuote(input({ machine: { ...input().machine, minuteRateFrom: 'rate of Test Mill' } }));
    expect(q.sizes[0]!.lines.find((l) => l.key === 'knitting')!.how).toMatch(/× 0\.40 EUR\/min \(rate of Test Mill\) = 2\.50 EUR$/);
    expect(computeQuote(input()).sizes[0]!.lines.find((l) => l.key === 'knitting')!.how).toMatch(/× 0\.40 EUR\/min = 2\.50 EUR$/);
  });
  it('has no margin explanation without a target price', () => {
    const q = computeQuote(input({ targetPricePerGarment: null }));
    expect(q.sizes[0]!.how.margin).toBeNull();
    expect(q.sizes[0]!.how.orderMargin).toBeNull();
    expect(q.order.how.revenue).toBeNull();
    expect(q.order.how.margin).toBeNull();
    expect(q.sizes[0]!.how.orderCost).toMatch(/× 100 garments = 743\.20 EUR$/);
  });
  it('words the knitting speed by the machine: rpm for a circular machine, carriage passes for a V-bed', () => {
    const circular = computeQuote(input()).sizes[0]!.lines.find((l) => l.key === 'knitting')!.how;
    expect(circular).toContain('60.0 rpm × 8 feeders');
    const flat = computeQuote(input({ machine: { kind: 'flat', speedPerMinute: 24, feeders: 2, feedersPerCourse: 1, efficiency: 0.8, minuteRate: 0.3 } }));
    const how = flat.sizes[0]!.lines.find((l) => l.key === 'knitting')!.how;
    expect(how).toContain('2520 courses ÷ (24.0 carriage passes/min × 2 knitting systems ÷ 1 per course = 48.0 courses/min)');
    expect(how).not.toMatch(/rpm|feeders/);
    // The figures do not depend on the wording: 2520 ÷ 48 ÷ 0.8 = 65.625 min.
    expect(flat.sizes[0]!.knitting.minutes).toBeCloseTo(65.625, 10);
  });
  it('names yarns without a price, and a missing target price', () => {
    const q = computeQuote(input({ yarns: [{ id: 'pa', name: 'PA 78/68', pricePerKg: null }], targetPricePerGarment: null }));
    expect(q.problems.join(' ')).toMatch(/PA 78\/68/);
    expect(q.problems.join(' ')).toMatch(/target price/);
    expect(q.sizes[0]!.marginPerGarment).toBeNull();
  });
  it('writes a CSV with a row per line and the totals', () => {
    const csv = quoteCsv(computeQuote(input()), { styleCode: 'HF27-101', styleName: 'Top' });
    expect(csv.split('\r\n')[0]).toMatch(/^style,size,line/);
    expect(csv).toContain('HF27-101,S,Total cost,total,7.432,100,743.2,');
    expect(csv).toContain('Order margin');
    // The totals carry their "how" too.
    expect(csv).toContain('Total cost,total,7.432,100,743.2,yarn 1.93 + knitting 2.50 + making-up 2.65 + trims 0.35 = 7.43 EUR; order: 7.43 EUR per garment × 100 garments = 743.20 EUR');
    expect(csv).toContain('Margin,total,12.568,100,1256.8,"target 20.00 − cost 7.43 = 12.57 EUR, 62.8 % of the target; order: 12.57 EUR per garment × 100 garments = 1256.80 EUR"');
    expect(csv).toContain('Order cost,order,,250,1907.3571,S 743.20 + M 1164.16 = 1907.36 EUR for 250 garments');
  });
});

describe('resolveRates', () => {
  it('fills what the studio has not set with the example defaults and lists them', () => {
    const { rates, defaults } = resolveRates({ machineMinuteRate: 0.5, makingUp: { cutting: 0.4 } });
    expect(rates.machineMinuteRate).toBe(0.5);
    expect(rates.makingUp.cutting).toBe(0.4);
    expect(rates.makingUp.linking).toBe(defaultCostRates.makingUp.linking);
    expect(defaults).toContain('efficiency');
    expect(defaults).toContain('makingUp.linking');
    expect(defaults).not.toContain('machineMinuteRate');
  });
});

describe('applyRatesChange (common practice, no published source)', () => {
  const stored = { machineMinuteRate: 0.5, efficiency: 0.8, makingUp: { cutting: 0.4, dyeing: 1.1 } };
  it('writes the given keys and keeps the absent ones, key by key in making-up', () => {
    const next = applyRatesChange(stored, { efficiency: 0.9, makingUp: { linking: 1.5 } });
    expect(next).toEqual({ machineMinuteRate: 0.5, efficiency: 0.9, makingUp: { cutting: 0.4, dyeing: 1.1, linking: 1.5 } });
    expect(resolveRates(next).defaults).not.toContain('machineMinuteRate');
  });
  it('null puts a key back to its example default; an emptied group goes away', () => {
    const next = applyRatesChange(stored, { machineMinuteRate: null, makingUp: { cutting: null, dyeing: null } });
    expect(next).toEqual({ efficiency: 0.8 });
    const { rates, defaults } = resolveRates(next);
    expect(rates.machineMinuteRate).toBe(defaultCostRates.machineMinuteRate);
    expect(defaults).toEqual(expect.arrayContaining(['machineMinuteRate', 'makingUp.cutting', 'makingUp.dyeing']));
  });
  it('starts from nothing stored and leaves the stored object as it was', () => {
    expect(applyRatesChange(null, { currency: 'CHF' })).toEqual({ currency: 'CHF' });
    applyRatesChange(stored, { makingUp: { cutting: 2 } });
    expect(stored.makingUp.cutting).toBe(0.4);
  });
});
