/**
 * Length units of the size spec. Stored in cm; shown and entered in cm or inches.
 * 1 in = 2.54 cm exactly (international yard and pound agreement, 1959).
 */

export const cmPerInch = 2.54;

export const lengthUnits = ['cm', 'in'] as const;
export type LengthUnit = (typeof lengthUnits)[number];

/** A stored cm value in the display unit. */
export function fromCm(cm: number, unit: LengthUnit): number {
  return unit === 'cm' ? cm : cm / cmPerInch;
}

/** An entered value in the display unit, to cm (kept to 0.1 µm so an inch entry survives a round trip). */
export function toCm(value: number, unit: LengthUnit): number {
  const cm = unit === 'cm' ? value : value * cmPerInch;
  return Math.round(cm * 1e5) / 1e5;
}

/** Decimals a length is shown with: a millimetre in cm, a hundredth in inches. */
export const unitDecimals: Record<LengthUnit, number> = { cm: 1, in: 2 };

/**
 * A cm value written in the display unit, or an empty string for none. In cm a value that is not a
 * whole millimetre (a grade of 1.25, say) shows its second decimal rather than being rounded away.
 */
export function formatLength(cm: number | null | undefined, unit: LengthUnit, decimals?: number): string {
  if (cm === null || cm === undefined || !Number.isFinite(cm)) return '';
  const v = fromCm(cm, unit);
  if (decimals !== undefined) return v.toFixed(decimals);
  const d = unitDecimals[unit];
  if (unit === 'cm' && Math.abs(Math.round(v * 10) - v * 10) > 1e-6 && Number(v.toFixed(2)) !== Number(v.toFixed(1))) return v.toFixed(2);
  return v.toFixed(d);
}

const vulgar: Record<string, number> = { '¼': 0.25, '½': 0.5, '¾': 0.75, '⅛': 0.125, '⅜': 0.375, '⅝': 0.625, '⅞': 0.875 };

/**
 * Reads a number as typed or pasted: a decimal point or comma ("31,5"), an optional unit suffix
 * ("31.5 cm", "12.4in", '12"'), and inch fractions ("12 1/4", "12¼", "3/8"). Returns null for an
 * empty entry and NaN for one that is not a number.
 */
export function parseLength(raw: string): { value: number; unit?: LengthUnit } | null {
  let s = raw.trim().replace(/\u00a0/g, ' ');
  if (s === '') return null;
  let unit: LengthUnit | undefined;
  const suffix = /\s*(cm|in|inch|inches|"|″)$/i.exec(s);
  if (suffix) {
    unit = /cm/i.test(suffix[1]!) ? 'cm' : 'in';
    s = s.slice(0, suffix.index).trim();
  }
  let sign = 1;
  if (s.startsWith('-') || s.startsWith('−')) {
    sign = -1;
    s = s.slice(1).trim();
  }
  const last = s.slice(-1);
  let whole = s;
  let fraction = 0;
  if (last in vulgar) {
    fraction = vulgar[last]!;
    whole = s.slice(0, -1).trim();
  } else {
    const m = /^(?:(\d+)\s+)?(\d+)\s*\/\s*(\d+)$/.exec(s);
    if (m) {
      const den = Number(m[3]);
      if (den === 0) return { value: NaN, ...(unit ? { unit } : {}) };
      fraction = Number(m[2]) / den;
      whole = m[1] ?? '';
    }
  }
  let value: number;
  if (whole === '') value = fraction;
  else if (/^\d+(?:[.,]\d+)?$|^[.,]\d+$/.test(whole)) value = Number(whole.replace(',', '.')) + fraction;
  else value = NaN;
  return { value: sign * value, ...(unit ? { unit } : {}) };
}

/** Parses an entry in the display unit (or its own suffix) to cm; null when empty, NaN when not a number. */
export function parseLengthCm(raw: string, unit: LengthUnit): number | null {
  const p = parseLength(raw);
  if (!p) return null;
  if (!Number.isFinite(p.value)) return NaN;
  return toCm(p.value, p.unit ?? unit);
}
