/** Number formats of the calculator: thousands separated, fixed decimals so columns align. */
const cache = new Map<number, Intl.NumberFormat>();

export function num(v: number, digits = 0): string {
  let f = cache.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
    cache.set(digits, f);
  }
  return f.format(v);
}

/** Grams with one decimal. */
export const grams = (g: number) => num(g, 1);
/** kg with one decimal (orders are rounded up to 0.1 kg). */
export const kg = (v: number) => num(v, 1);
/** A money amount in the studio's currency, two decimals (prices are per kg as entered in the library). */
export const money = (v: number) => num(v, 2);
