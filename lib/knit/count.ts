/**
 * Yarn counts (linear density).
 *
 * Direct systems (mass per length): tex = g per 1000 m, dtex = g per 10 000 m, denier = g per 9000 m.
 * Indirect systems (length per mass): Nm = km per kg = 1000 / tex; Ne (English cotton count, hanks of
 * 840 yd per lb) = 590.5412 / tex.
 * Sources: ASTM D2260 ("den = 9 × tex"; "590.54 divided by 30, or 19.7 cotton count"); the Ne factor is
 * exact from 1 yd = 0.9144 m and 1 lb = 0.45359237 kg.
 */

export const countUnits = ['tex', 'dtex', 'den', 'Nm', 'Ne'] as const;
export type CountUnit = (typeof countUnits)[number];

/** Grams in one avoirdupois pound (exact by definition). */
const GRAMS_PER_LB = 453.59237;
/** Metres in one yard (exact by definition). */
const METRES_PER_YARD = 0.9144;
/** Ne × tex = 453 592.37 / (840 × 0.9144) = 590.5412… (hank of 840 yd per lb). */
export const NE_TEX_FACTOR = (GRAMS_PER_LB * 1000) / (840 * METRES_PER_YARD);
/** Nm × tex = 1000. */
export const NM_TEX_FACTOR = 1000;

function assertPositiveCount(value: number, unit: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RangeError(`A yarn count must be a positive number; got ${value} ${unit}`);
  }
}

/** Converts a count in `unit` to tex (g/km). */
export function toTex(value: number, unit: CountUnit): number {
  assertPositiveCount(value, unit);
  switch (unit) {
    case 'tex':
      return value;
    case 'dtex':
      return value / 10;
    case 'den':
      return value / 9;
    case 'Nm':
      return NM_TEX_FACTOR / value;
    case 'Ne':
      return NE_TEX_FACTOR / value;
  }
}

/** Converts tex (g/km) to a count in `unit`. */
export function fromTex(tex: number, unit: CountUnit): number {
  assertPositiveCount(tex, 'tex');
  switch (unit) {
    case 'tex':
      return tex;
    case 'dtex':
      return tex * 10;
    case 'den':
      return tex * 9;
    case 'Nm':
      return NM_TEX_FACTOR / tex;
    case 'Ne':
      return NE_TEX_FACTOR / tex;
  }
}

/**
 * Converts a yarn count between systems: tex, dtex, denier, Nm, Ne.
 * Formulas: product design §1; ASTM D2260 table of conversion factors.
 * @throws RangeError for a value that is not a positive finite number.
 */
export function convertCount(value: number, from: CountUnit, to: CountUnit): number {
  if (from === to) {
    assertPositiveCount(value, from);
    return value;
  }
  return fromTex(toTex(value, from), to);
}

/** True for the systems where a bigger number means a finer yarn. */
export function isIndirectCount(unit: CountUnit): boolean {
  return unit === 'Nm' || unit === 'Ne';
}

export interface ParsedCount {
  /** Resultant linear density of the (folded) yarn, dtex. */
  dtex: number;
  unit: CountUnit;
  /** The count of one ply as written, in `unit`. */
  count: number;
  /** Number of plies folded together (1 for a single yarn). */
  plies: number;
  /** Filament count where written ("78 dtex f68", "78/68 dtex"). */
  filaments?: number;
  /** The entry as given. */
  text: string;
}

export class CountParseError extends Error {
  constructor(
    message: string,
    readonly text: string,
  ) {
    super(message);
    this.name = 'CountParseError';
  }
}

// Longest names first so that "dtex" is not read as "d" + "tex".
const unitAliases: readonly [string, CountUnit][] = [
  ['decitex', 'dtex'],
  ['denier', 'den'],
  ['dtex', 'dtex'],
  ['den', 'den'],
  ['tex', 'tex'],
  ['nec', 'Ne'],
  ['ne', 'Ne'],
  ['nm', 'Nm'],
  ['td', 'den'],
  ['d', 'den'],
];

const NUMBER = String.raw`\d+(?:[.,]\d+)?`;
const bodyPattern = new RegExp(
  String.raw`^(${NUMBER})(?:\s*([/x×*])\s*(${NUMBER}))?(?:\s*f\s*(\d+))?$`,
  'i',
);

function parseNumber(s: string): number {
  return Number(s.replace(',', '.'));
}

function splitUnit(text: string): { unit: CountUnit; body: string } | undefined {
  const lower = text.toLowerCase();
  for (const [alias, unit] of unitAliases) {
    if (lower.startsWith(alias) && !/^[a-z]/i.test(text.slice(alias.length))) {
      return { unit, body: text.slice(alias.length).trim() };
    }
    if (lower.endsWith(alias)) {
      const body = text.slice(0, text.length - alias.length).trim();
      // "78 dtex" or "40den" or "70D": the unit must follow a digit, a space or a filament mark.
      if (body.length > 0 && /[\d\s]$/.test(text.slice(0, text.length - alias.length))) {
        return { unit, body };
      }
    }
  }
  return undefined;
}

/**
 * Reads a yarn count as a designer types it and returns the resultant dtex.
 *
 * Accepted forms: "78 dtex", "40den", "70D", "20 tex", "Ne 30/1", "30/1 Ne", "Nm 2/48", "Nm 48/2",
 * "2x78 dtex", "78 dtex f68", "78/68 dtex" (a direct count over its filament count), decimal comma.
 * In "a/b" and "a×b" for Ne and Nm, and in "a×b" for direct counts, the smaller number is the ply
 * count. Folded yarn: resultant tex = plies × single-ply tex (follows from the definitions; see
 * references.md §1).
 * @throws CountParseError with a message that says what was expected.
 */
export function parseCount(text: string): ParsedCount {
  const original = text;
  const trimmed = text.trim().replace(/\s+/g, ' ');
  if (trimmed === '') throw new CountParseError('Enter a yarn count, e.g. "78 dtex" or "Ne 30/1".', original);
  // A filament mark after the unit: "78 dtex f68".
  let trailingFilaments: number | undefined;
  let unitText = trimmed;
  const trailing = /^(.*[a-z])\s*f\s*(\d+)$/i.exec(trimmed);
  if (trailing && splitUnit(trailing[1] ?? '')) {
    unitText = (trailing[1] ?? '').trim();
    trailingFilaments = Number(trailing[2]);
  }
  const split = splitUnit(unitText);
  if (!split) {
    if (new RegExp(`^${NUMBER}$`).test(trimmed)) {
      throw new CountParseError(
        `"${trimmed}" has no unit: write it with one of tex, dtex, den, Nm or Ne (e.g. "${trimmed} dtex").`,
        original,
      );
    }
    throw new CountParseError(
      `"${trimmed}" is not a yarn count: expected a number with tex, dtex, den, Nm or Ne (e.g. "78 dtex", "Ne 30/1").`,
      original,
    );
  }
  const { unit, body } = split;
  const m = bodyPattern.exec(body);
  if (!m) {
    throw new CountParseError(
      `"${trimmed}": could not read the number part "${body}"; expected e.g. "78", "30/1" or "2x78".`,
      original,
    );
  }
  const a = parseNumber(m[1] ?? '');
  const sep = m[2];
  const b = m[3] !== undefined ? parseNumber(m[3]) : undefined;
  let filaments = m[4] !== undefined ? Number(m[4]) : undefined;
  if (trailingFilaments !== undefined) {
    if (filaments !== undefined) {
      throw new CountParseError(`"${trimmed}" gives the filament count twice.`, original);
    }
    filaments = trailingFilaments;
  }

  let count = a;
  let plies = 1;
  if (sep !== undefined && b !== undefined) {
    const direct = !isIndirectCount(unit);
    if (direct && sep === '/') {
      // "78/68 dtex": count over filaments.
      if (filaments !== undefined) {
        throw new CountParseError(`"${trimmed}" gives the filament count twice.`, original);
      }
      if (!Number.isInteger(b)) {
        throw new CountParseError(`"${trimmed}": the filament count after "/" must be a whole number.`, original);
      }
      filaments = b;
    } else {
      plies = Math.min(a, b);
      count = Math.max(a, b);
      if (!Number.isInteger(plies)) {
        throw new CountParseError(
          `"${trimmed}": one of the two numbers must be a whole ply count (e.g. "Nm 2/48", "Ne 30/1").`,
          original,
        );
      }
    }
  }
  if (!(count > 0) || !(plies > 0)) {
    throw new CountParseError(`"${trimmed}": a yarn count must be greater than zero.`, original);
  }
  if (filaments !== undefined && !(filaments > 0)) {
    throw new CountParseError(`"${trimmed}": the filament count must be greater than zero.`, original);
  }
  const tex = toTex(count, unit) * plies;
  const parsed: ParsedCount = { dtex: tex * 10, unit, count, plies, text: original };
  if (filaments !== undefined) parsed.filaments = filaments;
  return parsed;
}

/** Shorthand: the resultant dtex of a count entry string. @throws CountParseError */
export function parseCountDtex(text: string): number {
  return parseCount(text).dtex;
}

/** Formats a dtex value in another unit, e.g. `formatCount(78, 'den')` → "70.2 den". */
export function formatCount(dtex: number, unit: CountUnit, fractionDigits = 1): string {
  const value = convertCount(dtex, 'dtex', unit);
  const n = Number(value.toFixed(fractionDigits)).toString();
  return unit === 'Ne' || unit === 'Nm' ? `${unit} ${n}` : `${n} ${unit}`;
}
