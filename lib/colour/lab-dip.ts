/**
 * Reading a lab dip: its difference from the target as numbers and as the words a colour lead
 * uses (lighter / darker, stronger / weaker, and the hue it has moved toward), and the mean of
 * several instrument readings. The colour differences themselves come from ./difference (culori).
 */
import { converter } from 'culori';
import { labDipDecision, toleranceFormulaLabel, type LabDipDecision, type LabDipTolerance } from './difference';
import { toCuloriLab65, type Lab } from './lab';

const toLch65 = converter('lch65');

/** The four hue neighbours the colour trade names a hue shift by. */
export type HueWord = 'redder' | 'yellower' | 'greener' | 'bluer';

/** Below this (CIELAB units) a component difference is read as no difference. */
export const sameBelow = 0.05;

/**
 * The word for a hue difference ΔH*ab of a sample from its standard: the neighbouring hue the
 * sample has turned toward. CIELAB hue angles run red (0°) → yellow (90°) → green (180°) → blue
 * (270°); a positive ΔH turns anticlockwise (toward larger angles). Between red and yellow, a
 * positive ΔH reads yellower and a negative one redder, and so on round the circle. Common
 * practice in lab-dip reports, no published source. Undefined for a neutral standard (no hue)
 * or a difference below `sameBelow`.
 */
export function hueShiftWord(standard: Lab, dH: number): HueWord | undefined {
  if (Math.abs(dH) < sameBelow) return undefined;
  const lch = toLch65(toCuloriLab65(standard));
  if (lch.h === undefined || lch.c < 0.5) return undefined;
  const h = ((lch.h % 360) + 360) % 360;
  const quadrant = Math.floor(h / 90) % 4;
  const order: readonly HueWord[] = ['redder', 'yellower', 'greener', 'bluer'];
  const ahead = order[(quadrant + 1) % 4] as HueWord;
  const behind = order[quadrant] as HueWord;
  return dH > 0 ? ahead : behind;
}

export interface LabDipReading extends LabDipDecision {
  /** The hue neighbour the sample has turned toward, when it has. */
  hue: HueWord | undefined;
  /** One short phrase per component that differs: "darker (ΔL −0.62)". */
  phrases: string[];
  /** One sentence: "Within tolerance: CMC(2:1) 0.72 ≤ 1.00; darker, weaker, bluer." */
  summary: string;
}

const signed = (n: number) => `${n >= 0 ? '+' : '−'}${Math.abs(n).toFixed(2)}`;

/**
 * Read a lab dip against its target: `labDipDecision` (CMC standard → sample and CIEDE2000, the
 * tolerance's pass or fail) with the components in words. Lightness from ΔL*, strength from ΔC*ab,
 * hue from ΔH*ab (`hueShiftWord`). Sources: ISO 105-J03:2009 and AATCC TM173 for the decision.
 */
export function readLabDip(standard: Lab, sample: Lab, tolerance?: LabDipTolerance): LabDipReading {
  const d = labDipDecision(standard, sample, tolerance);
  const hue = hueShiftWord(standard, d.components.dH);
  const phrases: string[] = [];
  if (d.words.lightness !== 'same') phrases.push(`${d.words.lightness} (ΔL ${signed(d.components.dL)})`);
  if (d.words.chroma !== 'same') phrases.push(`${d.words.chroma} (ΔC ${signed(d.components.dC)})`);
  if (hue) phrases.push(`${hue} (ΔH ${signed(d.components.dH)})`);
  const verdict = d.pass ? 'Within tolerance' : 'Outside tolerance';
  const limit = `${toleranceFormulaLabel(d.tolerance)} ${d.deltaE.toFixed(2)} ${d.pass ? '≤' : '>'} ${d.tolerance.max.toFixed(2)}`;
  const words = phrases.length ? phrases.map((p) => p.replace(/ \(.*\)$/, '')).join(', ') : 'no difference to speak of';
  return { ...d, hue, phrases, summary: `${verdict}: ${limit}; ${words}.` };
}

/**
 * The mean of several readings of one sample (each CIELAB D65/10°), component by component, as
 * colour instruments average readings of a sample turned between measurements (common practice,
 * no published source). Throws on an empty list.
 */
export function meanLab(readings: readonly Lab[]): Lab {
  if (readings.length === 0) throw new RangeError('No readings to average.');
  const sum = readings.reduce((s, r) => ({ L: s.L + r.L, a: s.a + r.a, b: s.b + r.b }), { L: 0, a: 0, b: 0 });
  const n = readings.length;
  return { L: sum.L / n, a: sum.a / n, b: sum.b / n };
}

export interface ReadingsParse {
  readings: Lab[];
  /** Problems by line (1-based), in plain words; empty when every line read. */
  errors: { line: number; message: string }[];
}

export const readingLimits = { maxReadings: 50, L: [0, 100], ab: [-128, 128] } as const;

/**
 * Lab readings from CSV text, as colour instruments export them: one reading per line, with
 * comma, semicolon or tab between values. A header line naming the L*, a* and b* columns (in any
 * order, with or without the asterisk or a bracketed note such as "(D65/10)", among other columns) picks the columns; without one, the
 * first three numbers of each line are L, a, b. With semicolons or tabs a decimal comma is
 * accepted. Blank lines and lines starting with `#` are skipped.
 */
export function parseLabReadings(text: string): ReadingsParse {
  const lines = text.split(/\r\n|\n|\r/);
  const readings: Lab[] = [];
  const errors: ReadingsParse['errors'] = [];
  let columns: { L: number; a: number; b: number } | null = null;
  let delimiter: ',' | ';' | '\t' | null = null;
  lines.forEach((raw, index) => {
    const line = raw.trim();
    const lineNo = index + 1;
    if (!line || line.startsWith('#')) return;
    delimiter ??= line.includes('\t') ? '\t' : line.includes(';') ? ';' : ',';
    const cells = line.split(delimiter).map((c) => c.trim().replace(/^"(.*)"$/, '$1').trim());
    const numbers = cells.filter((c) => isNumber(c, delimiter)).length;
    // A header: the first line with words and fewer than three numbers.
    if (readings.length === 0 && errors.length === 0 && columns === null && numbers < 3 && cells.some((c) => /[a-z]/i.test(c))) {
      const find = (name: 'l' | 'a' | 'b') => cells.findIndex((c) => c.toLowerCase().replace(/\(.*?\)/g, '').replace(/[^a-z]/g, '') === name);
      const L = find('l');
      const a = find('a');
      const b = find('b');
      if (L >= 0 && a >= 0 && b >= 0) {
        columns = { L, a, b };
        return;
      }
      errors.push({ line: lineNo, message: 'The header must name the L*, a* and b* columns.' });
      return;
    }
    const values = columns
      ? [cells[columns.L], cells[columns.a], cells[columns.b]]
      : cells.filter((c) => isNumber(c, delimiter)).slice(0, 3);
    if (values.length < 3 || values.some((v) => v === undefined || !isNumber(v, delimiter))) {
      errors.push({ line: lineNo, message: 'Needs three numbers: L*, a*, b*.' });
      return;
    }
    const [L, a, b] = values.map((v) => toNumber(v as string, delimiter)) as [number, number, number];
    if (L < readingLimits.L[0] || L > readingLimits.L[1]) {
      errors.push({ line: lineNo, message: `L* must be between 0 and 100 (got ${L}).` });
      return;
    }
    if ([a, b].some((v) => v < readingLimits.ab[0] || v > readingLimits.ab[1])) {
      errors.push({ line: lineNo, message: 'a* and b* must be between −128 and 128.' });
      return;
    }
    readings.push({ L, a, b });
  });
  if (readings.length > readingLimits.maxReadings) {
    errors.push({ line: 0, message: `At most ${readingLimits.maxReadings} readings per lab dip (got ${readings.length}).` });
  }
  if (readings.length === 0 && errors.length === 0) errors.push({ line: 0, message: 'No readings found.' });
  return { readings, errors };
}

function toNumber(cell: string, delimiter: string | null): number {
  const s = delimiter !== ',' ? cell.replace(',', '.') : cell;
  return Number(s.replace(/^\u2212/, '-'));
}

function isNumber(cell: string, delimiter: string | null): boolean {
  if (!/^[+\-\u2212]?(\d+([.,]\d*)?|[.,]\d+)$/.test(cell)) return false;
  if (delimiter === ',' && cell.includes(',')) return false;
  return Number.isFinite(toNumber(cell, delimiter));
}
