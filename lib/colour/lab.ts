import type { Lab65 } from 'culori';

/**
 * A colour in CIELAB. Needlemap's targets and lab-dip readings are CIELAB under D65 with the
 * CIE 1964 10° observer, as textile colour measurement reports them.
 */
export interface Lab {
  L: number;
  a: number;
  b: number;
}

/**
 * True when two colours are the same to within `tolerance` in each of L*, a* and b* (default 1e-6:
 * the same stored value, allowing for a round trip through JSON and floating-point columns).
 */
export function sameLab(p: Lab, q: Lab, tolerance = 1e-6): boolean {
  return Math.abs(p.L - q.L) <= tolerance && Math.abs(p.a - q.a) <= tolerance && Math.abs(p.b - q.b) <= tolerance;
}

/**
 * The colour as a culori `lab65` object. culori's plain `lab` mode is D50 and would be adapted to
 * D65 before any difference is taken, which changes the result; `lab65` passes the values through.
 */
export function toCuloriLab65(colour: Lab): Lab65 {
  return { mode: 'lab65', l: colour.L, a: colour.a, b: colour.b };
}

/** A culori `lab65` object back to `{ L, a, b }`. */
export function fromCuloriLab65(colour: Lab65): Lab {
  return { L: colour.l, a: colour.a, b: colour.b };
}
