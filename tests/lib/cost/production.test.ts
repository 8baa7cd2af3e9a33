import { describe, expect, it } from 'vitest';
import {
  circularProductionKgPerHour, circularProductionKgPerShift, coursesPerMinute, productionNeedles, knittingTime,
} from '@/lib/cost';

describe('coursesPerMinute', () => {
  it('72 feeders at 25 rpm knit 1800 courses per minute (Knitting calculations, chapter 9, "L = 72 x 25 = 1800 courses/min"; Textile Technical Handbook p. 147 (i))', () => {
    expect(coursesPerMinute(25, 72)).toBe(1800);
  });
  it('halves when a course of the structure takes two feeders (common practice, no published source)', () => {
    expect(coursesPerMinute(25, 72, 2)).toBe(900);
  });
  it('refuses a speed of zero, no feeders, or more feeders per course than the machine has', () => {
    expect(() => coursesPerMinute(0, 8)).toThrow(RangeError);
    expect(() => coursesPerMinute(60, 0)).toThrow(RangeError);
    expect(() => coursesPerMinute(60, 4, 5)).toThrow(RangeError);
  });
});

describe('knittingTime', () => {
  it('divides the courses by courses per minute and by the efficiency (handbook p. 147 (i) with the §7(g) efficiency factor)', () => {
    // 2520 courses on 8 feeders at 60 rpm: 480 courses/min → 5.25 min ideal, ÷ 0.84 = 6.25 min.
    const t = knittingTime({ courses: 2520, rpm: 60, feeders: 8, efficiency: 0.84 });
    expect(t.coursesPerMinute).toBe(480);
    expect(t.idealMinutes).toBeCloseTo(5.25, 10);
    expect(t.minutes).toBeCloseTo(6.25, 10);
  });
  it('with the handbook machine (72 feeders, 25 rpm) 1800 courses take one minute at full efficiency', () => {
    expect(knittingTime({ courses: 1800, rpm: 25, feeders: 72, efficiency: 1 }).minutes).toBe(1);
  });
  it('refuses an efficiency outside (0, 1]', () => {
    expect(() => knittingTime({ courses: 10, rpm: 60, feeders: 8, efficiency: 0 })).toThrow(RangeError);
    expect(() => knittingTime({ courses: 10, rpm: 60, feeders: 8, efficiency: 1.2 })).toThrow(RangeError);
  });
});

describe('circular production', () => {
  // Worked example from textiletutorials.com (production formula and examples), as references.md §7(g)
  // records it: kg/h = π·D·E·rpm·F·l·tex·60·η / 10⁹ with 30 in, E18, 38 rpm, 80 feeders, 2 mm loops,
  // 70 tex, 95 % efficiency, an 8 h shift → "329.07 kg per shift".
  const machine = { diameterIn: 30, gauge: 18, rpm: 38, feeders: 80, loopMm: 2, tex: 70, efficiency: 0.95 };

  it('gives the textiletutorials.com worked example\'s "329.07 kg per shift" with π = 3.14, as the example computes it', () => {
    expect(circularProductionKgPerShift({ ...machine, pi: 3.14 }, 480)).toBeCloseTo(329.07, 2);
  });
  it('gives 329.24 kg per shift with π itself (references.md §7(g), computed from the textiletutorials.com example)', () => {
    expect(circularProductionKgPerShift(machine, 480)).toBeCloseTo(329.24, 2);
  });
  it('per hour is an eighth of the 8 h shift', () => {
    expect(circularProductionKgPerHour({ ...machine, pi: 3.14 })).toBeCloseTo(329.0712 / 8, 4);
  });
  it('takes the needle count directly: the example\'s 3.14 × 30 × 18 = 1695.6 needles give its 329.07 kg (textiletutorials.com)', () => {
    const { diameterIn: _d, gauge: _g, ...rest } = machine;
    expect(circularProductionKgPerShift({ ...rest, needles: 1695.6 }, 480)).toBeCloseTo(329.07, 2);
  });
  it('prefers the given needles to π × D × E, so a real count changes the figure (common practice, no published source)', () => {
    // A 30 in E18 cylinder with 1680 needles (a multiple of 24 below π × 30 × 18 = 1696.5):
    // 1680 × 38 × 80 × 2 × 70 × 0.95 × 480 ÷ 10⁹ = 326.043648 kg per shift.
    const withCount = circularProductionKgPerShift({ ...machine, needles: 1680 }, 480);
    expect(withCount).toBeCloseTo(326.0436, 4);
    expect(withCount).toBeLessThan(circularProductionKgPerShift(machine, 480));
    expect(productionNeedles({ diameterIn: 30, gauge: 18 })).toBeCloseTo(Math.PI * 540, 10);
  });
  it('refuses a production with neither the needles nor diameter and gauge, or with no needles', () => {
    const { diameterIn: _d, gauge: _g, ...rest } = machine;
    expect(() => circularProductionKgPerHour(rest)).toThrow(RangeError);
    expect(() => circularProductionKgPerHour({ ...rest, needles: 0 })).toThrow(RangeError);
    expect(() => circularProductionKgPerHour({ ...rest, diameterIn: 30 })).toThrow(RangeError);
  });
});
