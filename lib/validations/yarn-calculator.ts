/**
 * The yarn calculator's options, shared by its routes (query string) and its screen: the waste
 * allowance in %, the content method, and the run's garments per size.
 */
import { z } from 'zod';

export const contentMethods = ['nominal', 'eu-allowance'] as const;
export const contentMethodLabels: Record<(typeof contentMethods)[number], string> = {
  nominal: 'Nominal yarn counts',
  'eu-allowance': 'EU agreed allowances',
};

/** Highest waste allowance the calculator takes, %. */
export const maxWastePct = 50;
/** Most garments of one size in a run. */
export const maxGarmentsPerSize = 1_000_000;

const isBlank = (v: unknown) => v === undefined || v === null || (typeof v === 'string' && v.trim() === '');

/** A size label: any printable text of up to 16 characters (the style's own labels are up to 12). */
const sizeLabel = /^[^\p{Cc}]{1,16}$/u;

function decodeSize(raw: string): string | null {
  try {
    return decodeURIComponent(raw.trim());
  } catch {
    return null;
  }
}

/**
 * Garments per size as the query string carries them: `S:120,M:200,L:80`, each size label
 * URI-encoded (so a label may hold a comma or a colon). Sizes are checked against the style by the
 * data layer.
 */
const garmentsSchema = z.preprocess(
  (v, ctx) => {
    if (isBlank(v)) return {};
    if (typeof v !== 'string') return v;
    const entries: [string, number][] = [];
    const seen = new Set<string>();
    for (const part of v.split(',')) {
      if (part.trim() === '') continue;
      const at = part.lastIndexOf(':');
      const size = at > 0 ? decodeSize(part.slice(0, at)) : null;
      const n = at > 0 ? part.slice(at + 1).trim() : '';
      if (size === null || !sizeLabel.test(size) || n === '') {
        ctx.addIssue({ code: 'custom', message: `Write garments per size as S:120,M:200 ("${part.trim()}" is not)` });
        return z.NEVER;
      }
      if (seen.has(size)) {
        ctx.addIssue({ code: 'custom', message: `Size ${size} is given twice` });
        return z.NEVER;
      }
      seen.add(size);
      entries.push([size, Number(n)]);
    }
    return Object.fromEntries(entries);
  },
  z.record(
    z.string(),
    z
      .number({ error: 'Garments must be a whole number' })
      .int('Garments must be a whole number')
      .min(0, 'Garments cannot be negative')
      .max(maxGarmentsPerSize, `At most ${maxGarmentsPerSize.toLocaleString('en-GB')} garments per size`),
  ),
);

export const yarnCalculatorQuerySchema = z.object({
  waste: z.preprocess(
    (v) => (isBlank(v) ? undefined : typeof v === 'string' ? Number(v.replace(',', '.')) : v),
    z
      .number({ error: 'The waste allowance must be a number (per cent)' })
      .min(0, 'The waste allowance cannot be negative')
      .max(maxWastePct, `The waste allowance is at most ${maxWastePct} %`)
      .default(5),
  ),
  method: z.preprocess((v) => (isBlank(v) ? undefined : v), z.enum(contentMethods, { error: 'Choose nominal or eu-allowance' }).default('nominal')),
  qty: garmentsSchema,
});
export type YarnCalculatorQuery = z.infer<typeof yarnCalculatorQuerySchema>;

/** The query string of a calculator request, as the screen builds it for the CSV link. */
export function yarnCalculatorQueryString(q: { wastePct: number; method: (typeof contentMethods)[number]; garments: Readonly<Record<string, number>> }): string {
  const qty = Object.entries(q.garments)
    .map(([size, n]) => `${encodeURIComponent(size)}:${n}`)
    .join(',');
  const p = new URLSearchParams({ waste: String(q.wastePct), method: q.method, qty });
  return p.toString();
}
