import { z } from 'zod';
import { girthKeys, pointKeys } from '@/lib/fit/points';
import { compressionLevels } from '@/lib/fit/compression-target';
import { correctionScopes, sampleRoundKinds } from '@/lib/fit/sample-round';

const version = z.number({ error: 'The version you edited is required' }).int().positive('The version you edited is required');

const num = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be a number`);
/** A garment or body measurement, cm. */
const lengthCm = (what: string) => num(what).positive(`${what} must be above zero`).max(400, `${what} above 400 cm is not a garment measurement`);
const sizeLabel = z.string().trim().min(1, 'Name the size').max(12, 'At most 12 characters');
const sizeKey = z.string().min(1, 'Name the size').max(12, 'At most 12 characters');

const point = z.enum(pointKeys, { error: 'Not a point of measure' });

export const sizeSpecPointSchema = z.object({
  point,
  baseCm: lengthCm('The base-size value').nullable(),
  gradeCm: num('The grade').min(-30, 'A grade of more than 30 cm per size is not realistic').max(30, 'A grade of more than 30 cm per size is not realistic'),
  toleranceCm: num('The tolerance').min(0, 'The tolerance cannot be negative').max(20, 'A tolerance above 20 cm is not realistic'),
  overrides: z.record(sizeKey, lengthCm('The value')).default({}),
});

const band = z
  .object({
    minMmHg: num('The lower limit').min(0, 'The lower limit cannot be negative').max(100, 'Above 100 mmHg is not a garment'),
    maxMmHg: num('The upper limit').positive('The upper limit must be above zero').max(100, 'Above 100 mmHg is not a garment'),
  })
  .refine((b) => b.maxMmHg > b.minMmHg, { message: 'The upper limit must be above the lower one', path: ['maxMmHg'] });

export const compressionTargetSchema = z.object({
  level: z.enum(compressionLevels, { error: 'Choose mild, moderate or firm' }),
  bands: z.object({ mild: band, moderate: band, firm: band }),
});

const girths = z.partialRecord(z.enum(girthKeys, { error: 'Not a body girth' }), lengthCm('The body girth'));

export const sizeSpecSaveSchema = z
  .object({
    version,
    baseSize: sizeLabel,
    points: z.array(sizeSpecPointSchema).max(pointKeys.length),
    girths: z.record(sizeKey, girths).default({}),
    cutAndSew: z.partialRecord(point, z.record(sizeKey, lengthCm('The cut-and-sew value'))).default({}),
    baseTextureId: z.string().uuid('Not a texture id').nullable().default(null),
    compressionTextureId: z.string().uuid('Not a texture id').nullable().default(null),
    cylinderDiametersIn: z
      .array(num('The diameter').positive('A diameter must be above zero').max(40, 'Above 40 in is not a body-size cylinder'))
      .min(1, 'Name at least one cylinder')
      .max(30, 'At most 30 cylinders'),
    target: compressionTargetSchema,
  })
  .strict()
  .superRefine((s, ctx) => {
    const seen = new Set<string>();
    s.points.forEach((p, i) => {
      if (seen.has(p.point)) ctx.addIssue({ code: 'custom', path: ['points', i, 'point'], message: 'This point of measure is listed twice' });
      seen.add(p.point);
    });
    if (new Set(s.cylinderDiametersIn).size !== s.cylinderDiametersIn.length) {
      ctx.addIssue({ code: 'custom', path: ['cylinderDiametersIn'], message: 'A diameter is listed twice' });
    }
  });
export type SizeSpecSave = z.infer<typeof sizeSpecSaveSchema>;

export const seamlessFactorSchema = z
  .object({
    factor: num('The factor').min(0.5, 'A factor below 0.5 is not realistic').max(1.2, 'A factor above 1.2 is not realistic'),
    /** The factor you saw (null when the studio had none): a change by someone else since is a 409. */
    expected: num('The factor you saw').nullable(),
  })
  .strict();
export type SeamlessFactorPut = z.infer<typeof seamlessFactorSchema>;

const measurements = z.partialRecord(point, lengthCm('The measured value'));
const receivedOn = z.iso.date({ error: 'A date like 2027-03-14' }).nullable();

export const sampleRoundCreateSchema = z
  .object({
    version,
    kind: z.enum(sampleRoundKinds, { error: 'Choose proto, fit or pre-production' }),
    size: sizeLabel,
    receivedOn: receivedOn.default(null),
    notes: z.string().trim().max(4000, 'At most 4000 characters').default(''),
    measurements: measurements.default({}),
  })
  .strict();
export type SampleRoundCreate = z.infer<typeof sampleRoundCreateSchema>;

export const sampleRoundPatchSchema = z
  .object({
    version,
    kind: z.enum(sampleRoundKinds, { error: 'Choose proto, fit or pre-production' }).optional(),
    size: sizeLabel.optional(),
    receivedOn: receivedOn.optional(),
    notes: z.string().trim().max(4000, 'At most 4000 characters').optional(),
    measurements: measurements.optional(),
  })
  .strict();
export type SampleRoundPatch = z.infer<typeof sampleRoundPatchSchema>;

export const sampleCommentSchema = z
  .object({ version, body: z.string().trim().min(1, 'Write a comment').max(4000, 'At most 4000 characters') })
  .strict();
export type SampleCommentCreate = z.infer<typeof sampleCommentSchema>;

export const correctionCreateSchema = z
  .object({
    version,
    point,
    size: sizeLabel,
    toCm: lengthCm('The new value'),
    scope: z.enum(correctionScopes, { error: 'Apply to this size or to the whole point' }),
    reason: z.string().trim().max(1000, 'At most 1000 characters').default(''),
  })
  .strict();
export type CorrectionCreate = z.infer<typeof correctionCreateSchema>;

export const correctionDecisionSchema = z
  .object({ version, decision: z.enum(['accept', 'reject'], { error: 'Accept or reject' }) })
  .strict();
export type CorrectionDecision = z.infer<typeof correctionDecisionSchema>;

export const fitParamsSchema = z.object({ id: z.string().uuid('Not a valid id') });
export const roundParamsSchema = z.object({ id: z.string().uuid('Not a valid id'), roundId: z.string().uuid('Not a valid id') });
export const correctionParamsSchema = roundParamsSchema.extend({ correctionId: z.string().uuid('Not a valid id') });
export const roundPhotoParamsSchema = roundParamsSchema.extend({ photoId: z.string().uuid('Not a valid id') });

/** Deleting a round carries the style's version in the query string (`?version=12`). */
export const sampleRoundDeleteSchema = z.object({
  version: z.coerce.number({ error: 'The version you edited is required' }).int('The version you edited is required').positive('The version you edited is required'),
});
export type SampleRoundDelete = z.infer<typeof sampleRoundDeleteSchema>;
