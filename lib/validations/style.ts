import { z } from 'zod';
import { readDecimal } from './number';
import { sleeveStyles, type SleeveStyle } from '@/lib/knit/outline';

export const garmentTypes = ['long-sleeve-top', 'short-sleeve-top', 'tank', 'sports-bra', 'legging', 'shorts'] as const;
export type GarmentType = (typeof garmentTypes)[number];
export const garmentTypeLabels: Record<GarmentType, string> = {
  'long-sleeve-top': 'Long-sleeve top',
  'short-sleeve-top': 'Short-sleeve top',
  tank: 'Tank',
  'sports-bra': 'Sports bra',
  legging: 'Legging',
  shorts: 'Shorts',
};

export const constructions = ['seamless', 'flat'] as const;
export type Construction = (typeof constructions)[number];
export const constructionLabels: Record<Construction, string> = {
  seamless: 'Seamless (circular)',
  flat: 'Flat (V-bed)',
};

/** Workflow statuses: the product's own names. */
export const styleStatuses = ['draft', 'developing', 'client-review', 'released', 'sampling', 'production-ready'] as const;
export type StyleStatus = (typeof styleStatuses)[number];
export const styleStatusLabels: Record<StyleStatus, string> = {
  draft: 'Draft',
  developing: 'Developing',
  'client-review': 'Client review',
  released: 'Released to mill',
  sampling: 'Sampling',
  'production-ready': 'Production ready',
};

/** A number from JSON, or from a form field's text in decimal notation (lib/validations/number.ts). */
const numeric = <T extends z.ZodType>(inner: T) => z.preprocess(readDecimal, inner);


export const sleeveStyleLabels: Record<SleeveStyle, string> = { 'set-in': 'Set-in sleeve', raglan: 'Raglan sleeve' };
/** How the sleeves join the body in the generated outlines; absent on styles made before it existed (set-in). */
const sleeveStyleField = z.enum(sleeveStyles).optional();

export const circularMachineSchema = z.object({
  kind: z.literal('circular'),
  diameterIn: numeric(z.number({ error: 'Cylinder diameter must be a number' }).positive('Cylinder diameter must be above zero').max(40, 'Cylinder diameter above 40 in is not a body-size machine')),
  gauge: numeric(z.number({ error: 'Gauge must be a number' }).positive('Gauge must be above zero').max(60, 'Gauge above 60 needles per inch is not realistic')),
  needleMultiple: numeric(z.number().int().positive().max(64)).default(4),
  feeders: numeric(z.number().int().min(1, 'At least one feeder').max(200)),
  maxYarns: numeric(z.number().int().min(1).max(12)).default(3),
  sleeveStyle: sleeveStyleField,
});
export const flatMachineSchema = z.object({
  kind: z.literal('flat'),
  gauge: numeric(z.number({ error: 'Gauge must be a number' }).positive('Gauge must be above zero').max(60)),
  bedNeedles: numeric(z.number().int().min(20, 'A bed has at least 20 needles').max(2000)),
  maxYarns: numeric(z.number().int().min(1).max(16)).default(6),
  sleeveStyle: sleeveStyleField,
});
export const machineSchema = z.discriminatedUnion('kind', [circularMachineSchema, flatMachineSchema]);
export type MachineSetup = z.infer<typeof machineSchema>;

export const sizeRangeSchema = z
  .object({
    labels: z.array(z.string().trim().min(1).max(12)).min(1, 'At least one size').max(12),
    base: z.string().trim().min(1),
  })
  .refine((s) => s.labels.includes(s.base), { message: 'The base size must be one of the sizes', path: ['base'] })
  .refine((s) => new Set(s.labels).size === s.labels.length, { message: 'Sizes must be distinct', path: ['labels'] });
export type SizeRange = z.infer<typeof sizeRangeSchema>;

const styleFields = {
  code: z.string().trim().min(2, 'Style code needs at least 2 characters').max(24).regex(/^[A-Za-z0-9][A-Za-z0-9-_.]*$/, 'Letters, digits, - _ . only'),
  name: z.string().trim().min(2, 'Name needs at least 2 characters').max(120),
  season: z.string().trim().max(24).default(''),
  clientId: z.string().uuid().nullable().default(null),
  garmentType: z.enum(garmentTypes),
  construction: z.enum(constructions),
  machine: machineSchema,
  sizes: sizeRangeSchema,
  status: z.enum(styleStatuses).default('draft'),
};

export const styleCreateSchema = z
  .object(styleFields)
  .refine((s) => (s.construction === 'seamless') === (s.machine.kind === 'circular'), {
    message: 'Seamless styles use a circular machine; flat styles a V-bed',
    path: ['machine', 'kind'],
  });
export type StyleCreate = z.infer<typeof styleCreateSchema>;

export const stylePatchSchema = z
  .object({
    version: z.number().int().positive('The version you edited is required'),
    code: styleFields.code.optional(),
    name: styleFields.name.optional(),
    season: z.string().trim().max(24).optional(),
    clientId: z.string().uuid().nullable().optional(),
    garmentType: styleFields.garmentType.optional(),
    construction: styleFields.construction.optional(),
    machine: machineSchema.optional(),
    sizes: sizeRangeSchema.optional(),
    status: styleFields.status.optional(),
  })
  .strict();
export type StylePatch = z.infer<typeof stylePatchSchema>;

export const styleListQuerySchema = z.object({
  q: z.string().max(100).optional(),
  status: z.enum(styleStatuses).optional(),
  clientId: z.string().uuid().optional(),
});

export const idParamSchema = z.object({ id: z.string().uuid('Not a valid id') });
