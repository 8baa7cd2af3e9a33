import { formatLength, type LengthUnit } from '@/lib/fit/units';

/** A length in the display unit, without the unit. */
export const len = (cm: number | null | undefined, unit: LengthUnit) => formatLength(cm, unit);

/** A signed length difference in the display unit (+0.4, −1.2), with a true minus sign. */
export function signedLen(cm: number | null | undefined, unit: LengthUnit): string {
  if (cm === null || cm === undefined || !Number.isFinite(cm)) return '';
  const s = formatLength(Math.abs(cm), unit);
  if (Number(s) === 0) return formatLength(0, unit);
  return `${cm < 0 ? '−' : '+'}${s}`;
}

export const fixed = (n: number, d: number) => n.toFixed(d);
export const signedPct = (fraction: number, d = 1) => `${fraction < 0 ? '−' : '+'}${Math.abs(fraction * 100).toFixed(d)} %`;
export const int = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
