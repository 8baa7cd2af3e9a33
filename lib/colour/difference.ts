import { converter, differenceCiede2000, differenceCmc, differenceHueChroma } from 'culori';
import { toCuloriLab65, type Lab } from './lab';

const ciede2000 = differenceCiede2000();
const toLch65 = converter('lch65');

/**
 * CIEDE2000 colour difference ΔE00 between two CIELAB colours, with kL = kC = kH = 1.
 * Symmetric in its arguments. Computed by culori's `differenceCiede2000`, which follows
 * Sharma, Wu & Dalal (2005), Color Research & Application 30(1):21–30.
 */
export function deltaE2000(a: Lab, b: Lab): number {
  return ciede2000(toCuloriLab65(a), toCuloriLab65(b));
}

/**
 * CMC(l:c) colour difference of a sample against its standard. Not symmetric: the weighting
 * functions are taken from the standard, so the order matters (standard first).
 * l:c = 2:1 is the textile acceptability setting (ISO 105-J03; AATCC TM173), 1:1 the
 * perceptibility setting. Computed by culori's `differenceCmc`, whose own default is 1:1.
 */
export function deltaECMC(standard: Lab, sample: Lab, l = 2, c = 1): number {
  return differenceCmc(l, c)(toCuloriLab65(standard), toCuloriLab65(sample));
}

/**
 * The differences of a sample from its standard, sample minus standard: ΔL*, Δa*, Δb*, ΔC*ab and
 * the signed hue difference ΔH*ab (positive when the sample's hue angle lies anticlockwise of the
 * standard's). Chroma and hue via culori (LCh under D65).
 */
export interface LabComponents {
  dL: number;
  da: number;
  db: number;
  dC: number;
  dH: number;
}

export function labComponents(standard: Lab, sample: Lab): LabComponents {
  const std = toLch65(toCuloriLab65(standard));
  const smp = toLch65(toCuloriLab65(sample));
  const hueMagnitude = Math.abs(
    differenceHueChroma({ h: std.h ?? 0, c: std.c }, { h: smp.h ?? 0, c: smp.c }),
  );
  // culori gives the size of ΔH; its direction is the sign of the turn from standard to sample.
  const turn = standard.a * sample.b - standard.b * sample.a;
  return {
    dL: sample.L - standard.L,
    da: sample.a - standard.a,
    db: sample.b - standard.b,
    dC: smp.c - std.c,
    dH: turn < 0 ? -hueMagnitude : hueMagnitude,
  };
}

/** The studio's lab-dip tolerance: a formula and the largest difference still accepted. */
export type LabDipTolerance =
  | { formula: 'cmc'; l: number; c: number; max: number }
  | { formula: 'de2000'; max: number };

/** The formula of a tolerance as the screens and documents write it: "CMC(2:1)" or "ΔE00". */
export function toleranceFormulaLabel(t: LabDipTolerance): string {
  return t.formula === 'cmc' ? `CMC(${t.l}:${t.c})` : 'ΔE00';
}

/** A tolerance as the screens and documents write it: "CMC(2:1) ≤ 1.00". */
export function toleranceLabel(t: LabDipTolerance): string {
  return `${toleranceFormulaLabel(t)} ≤ ${t.max.toFixed(2)}`;
}

/** Default tolerance: CMC(2:1) ≤ 1.0 (AATCC TM173 §3.2, "the boundary … of ΔEcmc = 1.0"). */
export const defaultLabDipTolerance: LabDipTolerance = { formula: 'cmc', l: 2, c: 1, max: 1.0 };

/** Words for the direction of a lab dip's difference, for the colour lead's reading. */
export interface LabDipWords {
  lightness: 'lighter' | 'darker' | 'same';
  redGreen: 'redder' | 'greener' | 'same';
  yellowBlue: 'yellower' | 'bluer' | 'same';
  chroma: 'stronger' | 'weaker' | 'same';
}

export interface LabDipDecision {
  pass: boolean;
  /** The difference the decision was made on, by the tolerance's formula. */
  deltaE: number;
  tolerance: LabDipTolerance;
  deltaE2000: number;
  deltaECMC21: number;
  components: LabComponents;
  words: LabDipWords;
}

/** Components smaller than this read as "same" (CIELAB units). */
const sameBelow = 0.05;

function word<T extends string>(value: number, positive: T, negative: T): T | 'same' {
  if (Math.abs(value) < sameBelow) return 'same';
  return value > 0 ? positive : negative;
}

/**
 * Accept or reject a lab dip: pass when the difference of the sample from the standard, by the
 * tolerance's formula, is at most `tolerance.max`. CMC is taken standard → sample. Also returns
 * ΔE00, CMC(2:1), the component differences and their words.
 * Sources: ISO 105-J03:2009 (a single tolerance on ΔEcmc(l:c)); AATCC TM173 (CMC unit = 1.0).
 */
export function labDipDecision(
  standard: Lab,
  sample: Lab,
  tolerance: LabDipTolerance = defaultLabDipTolerance,
): LabDipDecision {
  const de2000 = deltaE2000(standard, sample);
  const cmc21 = deltaECMC(standard, sample, 2, 1);
  let deltaE: number;
  switch (tolerance.formula) {
    case 'cmc':
      deltaE = deltaECMC(standard, sample, tolerance.l, tolerance.c);
      break;
    case 'de2000':
      deltaE = de2000;
      break;
    default: {
      const unknown: never = tolerance;
      throw new Error(`unknown tolerance formula: ${JSON.stringify(unknown)}`);
    }
  }
  const components = labComponents(standard, sample);
  return {
    pass: deltaE <= tolerance.max,
    deltaE,
    tolerance,
    deltaE2000: de2000,
    deltaECMC21: cmc21,
    components,
    words: {
      lightness: word(components.dL, 'lighter', 'darker'),
      redGreen: word(components.da, 'redder', 'greener'),
      yellowBlue: word(components.db, 'yellower', 'bluer'),
      chroma: word(components.dC, 'stronger', 'weaker'),
    },
  };
}
