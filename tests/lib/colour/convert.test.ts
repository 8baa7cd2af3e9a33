import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { inkOn, inSrgbGamut, labToSrgbHex, previewContrast, srgbHexToLab } from '@/lib/colour/convert';
import { deltaE2000 } from '@/lib/colour/difference';

describe('labToSrgbHex', () => {
  // IEC 61966-2-1 sRGB white is D65; L* 100, a* = b* = 0 under D65 is the white point.
  it('maps D65 white and black to #ffffff and #000000', () => {
    expect(labToSrgbHex({ L: 100, a: 0, b: 0 })).toBe('#ffffff');
    expect(labToSrgbHex({ L: 0, a: 0, b: 0 })).toBe('#000000');
  });

  // From memory: sRGB #808080 has L* ≈ 53.59 (D65) with a* = b* = 0.
  it('maps mid grey near L* 53.6 to #808080', () => {
    expect(labToSrgbHex({ L: 53.585, a: 0, b: 0 })).toBe('#808080');
  });

  it('round-trips in-gamut sRGB colours through Lab (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 0xffffff }), (n) => {
        const hex = `#${n.toString(16).padStart(6, '0')}`;
        const lab = srgbHexToLab(hex);
        expect(lab).toBeDefined();
        if (lab) expect(labToSrgbHex(lab)).toBe(hex);
      }),
    );
  });

  it('brings an out-of-gamut colour in by chroma and keeps it close in hue', () => {
    const vivid = { L: 50, a: 0, b: -120 };
    expect(inSrgbGamut(vivid)).toBe(false);
    const hex = labToSrgbHex(vivid);
    expect(hex).toMatch(/^#[0-9a-f]{6}$/);
    const back = srgbHexToLab(hex);
    expect(back).toBeDefined();
    // The clipped preview is still blue: negative b*, much smaller chroma.
    if (back) {
      expect(back.b).toBeLessThan(-20);
      expect(Math.hypot(back.a, back.b)).toBeLessThan(120);
    }
  });
});

describe('inSrgbGamut', () => {
  it('accepts sRGB primaries read back as Lab and rejects a chroma beyond them', () => {
    const red = srgbHexToLab('#ff0000');
    expect(red && inSrgbGamut({ L: red.L, a: red.a * 0.99, b: red.b * 0.99 })).toBe(true);
    expect(red && inSrgbGamut({ L: red.L, a: red.a * 1.2, b: red.b * 1.2 })).toBe(false);
  });
});

describe('srgbHexToLab', () => {
  it('returns undefined for text that is not a hex colour', () => {
    expect(srgbHexToLab('not a colour')).toBeUndefined();
  });

  it('is consistent with the difference functions (same hex → ΔE00 0)', () => {
    const a = srgbHexToLab('#3366cc');
    const b = srgbHexToLab('#36c');
    expect(a && b && deltaE2000(a, b)).toBeLessThan(1e-9);
  });
});

describe('contrast helpers', () => {
  // WCAG 2.x: black on white has contrast 21:1.
  it('gives 21 for white against black', () => {
    expect(previewContrast({ L: 100, a: 0, b: 0 }, { L: 0, a: 0, b: 0 })).toBeCloseTo(21, 6);
  });

  it('picks dark ink on a light colour and light ink on a dark one', () => {
    expect(inkOn({ L: 92, a: -2, b: 10 })).toBe('#000000');
    expect(inkOn({ L: 20, a: 10, b: -30 })).toBe('#ffffff');
  });
});
