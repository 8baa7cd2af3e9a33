import { z } from 'zod';
import { fibreIds, type FibreId } from '@/lib/knit/fibres';
import { briefCompressionLevels, markets } from '@/lib/rules/brief';

export const sportLevels = ['recreational', 'club', 'competitive', 'elite'] as const;
export const sportLevelLabels: Record<(typeof sportLevels)[number], string> = {
  recreational: 'Recreational', club: 'Club', competitive: 'Competitive', elite: 'Elite',
};
export const climates = ['cold', 'temperate', 'warm', 'hot-humid', 'hot-dry'] as const;
export const climateLabels: Record<(typeof climates)[number], string> = {
  cold: 'Cold', temperate: 'Temperate', warm: 'Warm', 'hot-humid': 'Hot and humid', 'hot-dry': 'Hot and dry',
};
export const supportLevels = ['light', 'medium', 'high'] as const;
export const stretchLevels = ['low', 'medium', 'high', 'four-way'] as const;
export const stretchLabels: Record<(typeof stretchLevels)[number], string> = {
  low: 'Low', medium: 'Medium', high: 'High', 'four-way': 'Four-way',
};
export const referenceTags = ['colour', 'texture', 'silhouette', 'detail'] as const;
export type ReferenceTag = (typeof referenceTags)[number];

const blankToNull = (v: unknown) => (v === '' || v === undefined || v === null || (typeof v === 'number' && Number.isNaN(v)) ? null : v);
const num = (what: string, min: number, max: number) =>
  z.preprocess(
    (v) => {
      const b = blankToNull(v);
      return typeof b === 'string' ? Number(b.replace(',', '.')) : b;
    },
    z.number({ error: `${what} must be a number` }).min(min, `${what} must be at least ${min}`).max(max, `${what} must be at most ${max}`).nullable(),
  );
const text = (max: number) => z.string().trim().max(max, `At most ${max} characters`).default('');
const optionalEnum = <T extends readonly [string, ...string[]]>(values: T) => z.preprocess(blankToNull, z.enum(values).nullable()).default(null);
const date = z.preprocess(blankToNull, z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'A date as YYYY-MM-DD').nullable()).default(null);

/** The brief's answers, as stored and as the form edits them. */
export const briefAnswersSchema = z
  .object({
    customers: text(500),
    sport: text(120),
    level: optionalEnum(sportLevels),
    climate: optionalEnum(climates),
    season: text(40),
    purpose: text(2000),
    compression: optionalEnum(briefCompressionLevels),
    ventilationAreas: text(500),
    support: optionalEnum(supportLevels),
    stretch: optionalEnum(stretchLevels),
    weightUnit: z.enum(['gsm', 'garment']).default('gsm'),
    weightTarget: num('Weight target', 1, 5000).default(null),
    care: text(500),
    colourIntent: text(1000),
    tones: z.preprocess(blankToNull, z.coerce.number().int('Whole tones only').min(1, 'At least one tone').max(12, 'At most 12 tones').nullable()).default(null),
    targetPrice: num('Target price', 0, 100_000).default(null),
    orderBySize: z.preprocess(
      (v) => (v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).filter(([, n]) => blankToNull(n) !== null)) : v),
      z.record(z.string().min(1).max(12), z.coerce.number({ error: 'Garments must be a number' }).int('Whole garments only').min(0, 'At least 0').max(10_000_000, 'At most 10,000,000')),
    ).default({}),
    sampleDate: date,
    deliveryDate: date,
    fibresToAvoid: z.array(z.enum(fibreIds as [FibreId, ...FibreId[]])).max(30).default([]),
    recycledPct: num('Recycled content', 0, 100).default(null),
    markets: z.array(z.enum(markets)).max(markets.length).default([]),
  })
  .strict()
  .refine((b) => !b.sampleDate || !b.deliveryDate || b.sampleDate <= b.deliveryDate, {
    message: 'The delivery date comes after the sample date', path: ['deliveryDate'],
  });
export type BriefAnswers = z.infer<typeof briefAnswersSchema>;

export const emptyBrief: BriefAnswers = briefAnswersSchema.parse({});

/** Stored answers read through the schema, with the fields that did not pass it put back to their default. */
export interface StoredBriefAnswers {
  answers: BriefAnswers;
  /** The fields that failed the schema and were reset to their default (empty when the answers passed). */
  repaired: (keyof BriefAnswers)[];
}

/**
 * Parses stored answers, so answers saved before a field existed get its default. Answers that fail
 * the schema keep every field that passes it alone; the rest take their default and are named.
 */
export function readBriefAnswers(stored: unknown): StoredBriefAnswers {
  const parsed = briefAnswersSchema.safeParse(stored);
  if (parsed.success) return { answers: parsed.data, repaired: [] };
  const raw = stored && typeof stored === 'object' && !Array.isArray(stored) ? (stored as Record<string, unknown>) : {};
  const answers: Record<string, unknown> = { ...emptyBrief };
  const repaired: (keyof BriefAnswers)[] = [];
  for (const key of Object.keys(emptyBrief) as (keyof BriefAnswers)[]) {
    const one = briefAnswersSchema.shape[key].safeParse(raw[key]);
    if (one.success) answers[key] = one.data;
    else repaired.push(key);
  }
  const whole = briefAnswersSchema.safeParse(answers);
  if (whole.success) return { answers: whole.data, repaired };
  // Only the cross-field check is left (a delivery before the sample): the later date goes.
  return { answers: { ...(answers as BriefAnswers), deliveryDate: null }, repaired: [...repaired, 'deliveryDate'] };
}

/** Each answer's name as the questionnaire shows it. */
export const briefFieldLabels: Record<keyof BriefAnswers, string> = {
  customers: 'Customers', sport: 'Sport', level: 'Level', climate: 'Climate', season: 'Season', purpose: 'Purpose',
  compression: 'Compression level', ventilationAreas: 'Ventilation areas', support: 'Support', stretch: 'Stretch',
  weightUnit: 'Weight unit', weightTarget: 'Weight target', care: 'Care expectations', colourIntent: 'Colour intent',
  tones: 'Number of tones', targetPrice: 'Target price per garment', orderBySize: 'Order size per size',
  sampleDate: 'Sample date', deliveryDate: 'Delivery date', fibresToAvoid: 'Fibres to avoid', recycledPct: 'Recycled content, at least %',
  markets: 'Markets',
};

export const briefSaveSchema = z
  .object({
    /** The brief's version the edit started from; 0 when no brief was saved yet. */
    version: z.number({ error: 'The version you edited is required' }).int().min(0),
    answers: briefAnswersSchema,
  })
  .strict();
export type BriefSave = z.infer<typeof briefSaveSchema>;

export const referenceFieldsSchema = z
  .object({
    caption: z.string().trim().max(200, 'At most 200 characters').default(''),
    tag: z.enum(referenceTags, { error: 'Tag: colour, texture, silhouette or detail' }),
  })
  .strict();

export const referencePatchSchema = z
  .object({
    caption: z.string().trim().max(200, 'At most 200 characters').optional(),
    tag: z.enum(referenceTags, { error: 'Tag: colour, texture, silhouette or detail' }).optional(),
  })
  .strict();

export const referenceOrderSchema = z.object({ ids: z.array(z.string().uuid('Not a valid id')).min(1).max(200) }).strict();

export const referenceParamsSchema = z.object({ id: z.string().uuid('Not a valid id'), refId: z.string().uuid('Not a valid id') });
