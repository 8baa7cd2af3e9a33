/**
 * Colour schemas: the studio's colour standards, a style's colourways and their targets, lab-dip
 * submissions and decisions. Shared by the route handlers and the forms. Colours are CIELAB
 * D65 / 10°; the maths lives in lib/colour.
 */
import { z } from 'zod';
import { targetRoutes } from '@/lib/colour/colourway';
import { parseLabReadings, readingLimits } from '@/lib/colour/lab-dip';
import { defaultLabDipTolerance, type LabDipTolerance } from '@/lib/colour/difference';

const isBlank = (v: unknown) => v === '' || v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v));
const toNumber = (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? Number(v.trim().replace(',', '.').replace(/^\u2212/, '-')) : v);

/** A required number between `min` and `max`; form strings are read as numbers. */
const num = (what: string, min: number, max: number) =>
  z.preprocess(
    (v) => (isBlank(v) ? undefined : toNumber(v)),
    z
      .number({ error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a number`) })
      .refine((n) => Number.isFinite(n), { message: `${what} must be a number` })
      .refine((n) => n >= min, { message: `${what} must be at least ${min}` })
      .refine((n) => n <= max, { message: `${what} must be at most ${max}` }),
  );

const uuid = (what: string) => z.string({ error: `${what} is required` }).min(1, `${what} is required`).uuid(`${what} is not a valid id`);
const version = z.number({ error: 'The version you edited is required' }).int().positive('The version you edited is required');

/** A CIELAB colour, D65 / 10° (the same ranges as yarn colours in the library). */
export const labSchema = z.object({
  L: num('L*', 0, 100),
  a: num('a*', -128, 128),
  b: num('b*', -128, 128),
});
export type LabInput = z.infer<typeof labSchema>;

// ---------------------------------------------------------------------------------------------
// Colour standards

export const standardSources = ['measured', 'client-agreed', 'digital'] as const;
export type StandardSource = (typeof standardSources)[number];
export const standardSourceLabels: Record<StandardSource, string> = {
  measured: 'Measured from a physical standard',
  'client-agreed': 'Agreed with the client',
  digital: 'Digital value, not yet measured',
};

export const toleranceFormulas = ['cmc', 'de2000'] as const;

/** The acceptance tolerance of a standard: CMC(l:c) or CIEDE2000, and the largest ΔE still accepted. */
export const toleranceSchema = z.discriminatedUnion(
  'formula',
  [
    z.object({
      formula: z.literal('cmc'),
      l: num('l', 0.5, 4).default(2),
      c: num('c', 0.5, 4).default(1),
      max: num('The tolerance', 0.1, 10),
    }),
    z.object({ formula: z.literal('de2000'), max: num('The tolerance', 0.1, 10) }),
  ],
  { error: 'Choose CMC or ΔE00' },
) satisfies z.ZodType<LabDipTolerance, unknown>;

/** Default: CMC(2:1) ≤ 1.0 (AATCC TM173 §3.2); the one value of lib/colour. */
export const defaultTolerance: LabDipTolerance = defaultLabDipTolerance;

const standardName = z
  .string({ error: 'Name is required' })
  .trim()
  .min(2, 'Name needs at least 2 characters')
  .max(80, 'Name is at most 80 characters');

const standardFields = {
  name: standardName,
  lab: labSchema,
  source: z.enum(standardSources, { error: 'Choose where the values come from' }),
  notes: z.string().trim().max(500, 'Notes are at most 500 characters').default(''),
  tolerance: toleranceSchema.default(defaultTolerance),
};

export const colourStandardInputSchema = z.object(standardFields).strict();
export type ColourStandardInput = z.infer<typeof colourStandardInputSchema>;

export const colourStandardPatchSchema = z
  .object({
    version,
    name: standardName.optional(),
    lab: labSchema.optional(),
    source: standardFields.source.optional(),
    notes: z.string().trim().max(500, 'Notes are at most 500 characters').optional(),
    tolerance: toleranceSchema.optional(),
  })
  .strict();
export type ColourStandardPatch = z.infer<typeof colourStandardPatchSchema>;

// ---------------------------------------------------------------------------------------------
// Colourways

const targetName = z
  .string({ error: 'Name the target' })
  .trim()
  .min(1, 'Name the target')
  .max(60, 'A target name is at most 60 characters');

/** Where a target's colour comes from: a studio colour standard, or CIELAB values entered here. */
const targetColourSchema = z.discriminatedUnion(
  'source',
  [
    z.object({ source: z.literal('standard'), standardId: uuid('The colour standard') }),
    z.object({ source: z.literal('lab'), lab: labSchema }),
  ],
  { error: 'Choose a colour standard or enter L*, a*, b*' },
);

export const colourwayTargetSchema = z
  .object({
    /** Present for a target that is already saved (its lab dips stay with it). */
    id: uuid('The target').optional(),
    name: targetName,
    yarnIds: z.array(uuid('The yarn'), { error: 'Choose the yarns' }).min(1, 'Choose at least one yarn').max(12),
    route: z.enum(targetRoutes, { error: 'Choose garment-dyed, yarn-dyed or dope-dyed' }),
    colour: targetColourSchema,
  })
  .strict();
export type ColourwayTargetInput = z.infer<typeof colourwayTargetSchema>;

const colourwayName = z
  .string({ error: 'Name the colourway' })
  .trim()
  .min(1, 'Name the colourway')
  .max(60, 'A colourway name is at most 60 characters');

const targetsSchema = z
  .array(colourwayTargetSchema)
  .max(12, 'At most 12 targets in a colourway')
  // Runs even when a target has other problems, so every field error shows at once.
  .superRefine(
    (targets, ctx) => {
      const owner = new Map<string, number>();
      const names = new Map<string, number>();
      targets.forEach((t, i) => {
        if (!t || typeof t !== 'object') return;
        (Array.isArray(t.yarnIds) ? t.yarnIds : []).forEach((y) => {
          const before = owner.get(y);
          if (before !== undefined && before !== i) {
            ctx.addIssue({ code: 'custom', path: [i, 'yarnIds'], message: `A yarn takes one target; it is already in target ${before + 1}` });
          }
          owner.set(y, before ?? i);
        });
        const key = typeof t.name === 'string' ? t.name.trim().toLowerCase() : '';
        const seen = names.get(key);
        if (key && seen !== undefined) ctx.addIssue({ code: 'custom', path: [i, 'name'], message: 'Two targets have this name' });
        else if (key) names.set(key, i);
        if (t.id && targets.findIndex((x) => x?.id === t.id) !== i) {
          ctx.addIssue({ code: 'custom', path: [i, 'id'], message: 'This target is listed twice' });
        }
      });
    },
    { when: (payload) => Array.isArray(payload.value) },
  );

export const colourwayInputSchema = z
  .object({
    name: colourwayName,
    notes: z.string().trim().max(1000, 'Notes are at most 1000 characters').default(''),
    targets: targetsSchema.default([]),
  })
  .strict();
export type ColourwayInput = z.infer<typeof colourwayInputSchema>;

export const colourwayPatchSchema = z
  .object({
    version,
    name: colourwayName.optional(),
    notes: z.string().trim().max(1000, 'Notes are at most 1000 characters').optional(),
    targets: targetsSchema.optional(),
  })
  .strict();
export type ColourwayPatch = z.infer<typeof colourwayPatchSchema>;

// ---------------------------------------------------------------------------------------------
// Lab dips

/**
 * A lab-dip submission: the target it matches, and the measured colour, either entered as one
 * reading or as CSV text of several readings (their mean is the measured colour); optionally a
 * photo of the dip, uploaded to the style beforehand.
 */
export const labDipInputSchema = z
  .object({
    targetId: uuid('The target'),
    measured: labSchema.optional(),
    readingsCsv: z.string().max(20_000, 'The readings are too long for one lab dip').optional(),
    /** A photo uploaded to the style first (POST /api/styles/[id]/files), by its file id. */
    photoFileId: uuid('The photo').optional(),
    comment: z.string().trim().max(1000, 'A comment is at most 1000 characters').default(''),
  })
  .strict()
  .superRefine((v, ctx) => {
    const hasCsv = v.readingsCsv !== undefined && v.readingsCsv.trim() !== '';
    if (!v.measured && !hasCsv) {
      ctx.addIssue({ code: 'custom', path: ['measured'], message: 'Enter the measured L*, a*, b* or paste the readings' });
      return;
    }
    if (v.measured && hasCsv) {
      ctx.addIssue({ code: 'custom', path: ['readingsCsv'], message: 'Enter one reading or paste readings, not both' });
      return;
    }
    if (hasCsv) {
      const parsed = parseLabReadings(v.readingsCsv ?? '');
      for (const e of parsed.errors.slice(0, 5)) {
        ctx.addIssue({ code: 'custom', path: ['readingsCsv'], message: e.line > 0 ? `Line ${e.line}: ${e.message}` : e.message });
      }
    }
  })
  .transform((v) => {
    const readings = v.measured ? [v.measured] : parseLabReadings(v.readingsCsv ?? '').readings;
    return { targetId: v.targetId, readings, comment: v.comment, photoFileId: v.photoFileId ?? null };
  });
export type LabDipInput = z.output<typeof labDipInputSchema>;
export { readingLimits };

export const labDipDecisions = ['approved', 'rejected'] as const;
export type LabDipDecisionValue = (typeof labDipDecisions)[number];

export const labDipDecisionSchema = z
  .object({
    version,
    decision: z.enum(labDipDecisions, { error: 'Approve or reject' }),
    comment: z.string().trim().max(1000, 'A comment is at most 1000 characters').default(''),
  })
  .strict()
  .refine((v) => v.decision !== 'rejected' || v.comment.length > 0, {
    path: ['comment'],
    message: 'Say what to change when rejecting',
  });
export type LabDipDecisionInput = z.infer<typeof labDipDecisionSchema>;

export const labDipQuerySchema = z.object({ colourwayId: uuid('The colourway').optional() }).strict();

// ---------------------------------------------------------------------------------------------
// Route parameters

export const standardParamsSchema = z.object({ id: uuid('The colour standard') });
export const colourwayParamsSchema = z.object({ id: uuid('The style'), colourwayId: uuid('The colourway') });
export const labDipParamsSchema = z.object({ id: uuid('The style'), labDipId: uuid('The lab dip') });
