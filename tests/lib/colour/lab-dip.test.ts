import { describe, expect, it } from 'vitest';
import { hueShiftWord, meanLab, parseLabReadings, readLabDip } from '@/lib/colour/lab-dip';
import type { Lab } from '@/lib/colour/lab';

const lch = (L: number, C: number, hDeg: number): Lab => ({
  L,
  a: C * Math.cos((hDeg * Math.PI) / 180),
  b: C * Math.sin((hDeg * Math.PI) / 180),
});

describe('hueShiftWord', () => {
  // Common practice, no published source: a hue shift is named by the neighbour hue it turns
  // toward on the CIELAB circle red 0°, yellow 90°, green 180°, blue 270°.
  it.each([
    [30, +1, 'yellower'],
    [30, -1, 'redder'],
    [120, +1, 'greener'],
    [120, -1, 'yellower'],
    [200, +1, 'bluer'],
    [200, -1, 'greener'],
    [300, +1, 'redder'],
    [300, -1, 'bluer'],
  ] as const)('hue %i°, ΔH %i → %s', (h, dH, word) => {
    expect(hueShiftWord(lch(50, 40, h), dH)).toBe(word);
  });

  it('has no word for a neutral standard or a tiny difference', () => {
    expect(hueShiftWord({ L: 50, a: 0.1, b: -0.1 }, 1)).toBeUndefined();
    expect(hueShiftWord(lch(50, 40, 30), 0.01)).toBeUndefined();
  });
});

describe('readLabDip', () => {
  // Sharma, Wu & Dalal (2005) Table 1, pair 32, as standard → sample: CMC(2:1) 0.9901 (references.md
  // §6.2, computed and cross-checked with culori), a pass at the default CMC(2:1) ≤ 1.0; ΔE00 1.5381.
  it('reads Sharma pair 32 as within tolerance, darker, stronger, greener', () => {
    const r = readLabDip({ L: 90.9257, a: -0.5406, b: -0.9208 }, { L: 88.6381, a: -0.8985, b: -0.7239 });
    expect(r.pass).toBe(true);
    expect(r.deltaECMC21).toBeCloseTo(0.9901, 4);
    expect(r.deltaE2000).toBeCloseTo(1.5381, 4);
    expect(r.words.lightness).toBe('darker');
    expect(r.words.chroma).toBe('stronger');
    expect(r.hue).toBe('greener');
    expect(r.phrases[0]).toBe('darker (ΔL −2.29)');
    expect(r.summary).toBe('Within tolerance: CMC(2:1) 0.99 ≤ 1.00; darker, stronger, greener.');
  });

  // Pair 22: CMC(2:1) 1.0060, a fail at 1.0 (references.md §9).
  it('reads Sharma pair 22 as outside tolerance, stronger only', () => {
    const r = readLabDip({ L: 50, a: 2.5, b: 0 }, { L: 50, a: 3.2972, b: 0 });
    expect(r.pass).toBe(false);
    expect(r.deltaECMC21).toBeCloseTo(1.006, 3);
    expect(r.hue).toBeUndefined();
    expect(r.summary).toBe('Outside tolerance: CMC(2:1) 1.01 > 1.00; stronger.');
  });

  it('judges by the tolerance it is given', () => {
    const r = readLabDip({ L: 50, a: 2.5, b: 0 }, { L: 50, a: 3.2972, b: 0 }, { formula: 'de2000', max: 1.5 });
    expect(r.pass).toBe(true);
    expect(r.summary).toMatch(/^Within tolerance: ΔE00 /);
  });
});

describe('meanLab', () => {
  it('averages readings component by component', () => {
    expect(meanLab([{ L: 40, a: 2, b: -10 }, { L: 42, a: 4, b: -12 }])).toEqual({ L: 41, a: 3, b: -11 });
    expect(() => meanLab([])).toThrow(RangeError);
  });
});

describe('parseLabReadings', () => {
  it('reads the L*, a*, b* columns a header names, among others', () => {
    const p = parseLabReadings('Reading,L*,a*,b*,Illuminant\n1,32.10,-3.20,-18.40,D65\n2,32.30,-3.00,-18.10,D65\n');
    expect(p.errors).toEqual([]);
    expect(p.readings).toEqual([
      { L: 32.1, a: -3.2, b: -18.4 },
      { L: 32.3, a: -3, b: -18.1 },
    ]);
  });

  it('reads columns in any order and with a bracketed note', () => {
    const p = parseLabReadings('b* (D65/10)\tL* (D65/10)\ta* (D65/10)\n-18.4\t32.1\t-3.2');
    expect(p.readings).toEqual([{ L: 32.1, a: -3.2, b: -18.4 }]);
  });

  it('reads lines without a header, with semicolons and decimal commas', () => {
    const p = parseLabReadings('# dip A\n32,1;-3,2;-18,4\n\n32,5;-3,0;-18,0\n');
    expect(p.errors).toEqual([]);
    expect(p.readings).toHaveLength(2);
    expect(p.readings[1]).toEqual({ L: 32.5, a: -3, b: -18 });
  });

  it('takes the first three numbers of a headerless line with a sample name', () => {
    expect(parseLabReadings('Dip A,32.1,-3.2,-18.4').readings).toEqual([{ L: 32.1, a: -3.2, b: -18.4 }]);
  });

  it('names the lines it cannot read', () => {
    const p = parseLabReadings('L,a,b\n32.1,-3.2,-18.4\n32.1,x,-18\n140,0,0\n10,0,300');
    expect(p.readings).toHaveLength(1);
    expect(p.errors.map((e) => e.line)).toEqual([3, 4, 5]);
    expect(p.errors[1]?.message).toMatch(/L\* must be between 0 and 100/);
  });

  it('refuses an empty text, a header without L, a, b, and too many readings', () => {
    expect(parseLabReadings('  \n').errors[0]?.message).toBe('No readings found.');
    expect(parseLabReadings('x,y,z\n1,2,3').errors[0]).toEqual({ line: 1, message: 'The header must name the L*, a* and b* columns.' });
    const many = Array.from({ length: 51 }, () => '50,0,0').join('\n');
    expect(parseLabReadings(many).errors[0]?.message).toMatch(/At most 50 readings/);
  });
});
