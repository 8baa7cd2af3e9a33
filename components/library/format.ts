import { fibres, type FibreId } from '@/lib/knit/fibres';
import type { YarnFibre } from '@/lib/knit/yarn';
import { labToSrgbHex } from '@/lib/colour/convert';
import type { LibraryYarn } from '@/lib/db/yarns';

/** A fibre's name as the EU label writes it. */
export const fibreName = (id: FibreId) => {
  const n = fibres[id].names.eu;
  return id === 'polyester-cd' ? 'polyester (cationic-dyeable)' : n;
};

/** A fibre's name for a picker or a heading: "Polyamide". */
export const fibreLabel = (id: FibreId) => {
  const n = fibreName(id);
  return n.charAt(0).toUpperCase() + n.slice(1);
};

/** "87.8 % polyamide · 12.2 % elastane", largest share first. */
export function sharesText(shares: readonly YarnFibre[]): string {
  return [...shares]
    .sort((a, b) => b.share - a.share)
    .map((f) => (shares.length === 1 ? fibreName(f.fibre) : `${formatPct(f.share)} ${fibreName(f.fibre)}`))
    .join(' · ');
}

/** A fraction as a percentage with one decimal where it matters: 0.8776 → "87.8 %", 1 → "100 %". */
export function formatPct(fraction: number, digits = 1): string {
  const v = fraction * 100;
  const s = Number.isInteger(Number(v.toFixed(digits))) ? v.toFixed(0) : v.toFixed(digits);
  return `${s} %`;
}

/** A number for a table: fixed digits, trailing zeros kept for alignment. */
export const fixed = (v: number, digits = 1) => v.toFixed(digits);

/** Screen colour of a yarn: its own colour when coloured, else a neutral for dyeable yarns. */
export function yarnSwatch(yarn: Pick<LibraryYarn, 'colour'>): string | null {
  return yarn.colour.state === 'dyeable' ? null : labToSrgbHex(yarn.colour.lab);
}

/** Short label of a yarn for pickers: name and count. */
export const yarnOption = (y: Pick<LibraryYarn, 'name' | 'dtex'>) => `${y.name} · ${Number(y.dtex.toFixed(1))} dtex`;
