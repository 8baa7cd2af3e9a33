import { z } from 'zod';

const uuid = (what: string) => z.string().uuid(`Not a valid ${what}`);

export const releaseParamsSchema = z.object({ id: uuid('id') });
export const styleIdParamSchema = z.object({ id: uuid('id') });
export const testKnitParamsSchema = z.object({ id: uuid('id') });

export const paperSchema = z.enum(['a4', 'letter'], { error: 'Choose A4 or US Letter' });

export const releaseCreateSchema = z
  .object({
    /** The style version the designer saw: a newer one gets 409. */
    version: z.number({ error: 'The style version is required' }).int().min(1),
    millIds: z.array(uuid('mill'), { error: 'Choose at least one mill' }).min(1, 'Choose at least one mill').max(20, 'At most 20 mills at once'),
    note: z.string().trim().max(2000, 'The note is at most 2000 characters').default(''),
  })
  .strict();
export type ReleaseCreate = z.infer<typeof releaseCreateSchema>;

export const reviewRequestSchema = z.object({ clientId: uuid('client') }).strict();
export type ReviewRequest = z.infer<typeof reviewRequestSchema>;

export const commentSchema = z
  .object({ body: z.string().trim().min(1, 'Write a comment').max(4000, 'A comment is at most 4000 characters') })
  .strict();

export const proposalDecisionSchema = z
  .object({
    decision: z.enum(['approved', 'changes-requested'], { error: 'Approve, or ask for changes' }),
    comment: z.string().trim().max(4000, 'A comment is at most 4000 characters').default(''),
  })
  .strict()
  .refine((d) => d.decision === 'approved' || d.comment.length > 0, { path: ['comment'], message: 'Say what should change' });
export type ProposalDecision = z.infer<typeof proposalDecisionSchema>;

/** A measured figure from a form field or JSON: a number in a range, decimal comma accepted. */
const figure = (label: string, min: number, max: number) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim().replace(',', '.'))) : v),
    z.number({ error: `${label} is required` }).finite(`${label} must be a number`).min(min, `${label} is at least ${min}`).max(max, `${label} is at most ${max}`),
  );

export const testKnitSubmissionSchema = z
  .object({
    walesPerCm: figure('Wales per cm', 1, 80),
    coursesPerCm: figure('Courses per cm', 1, 100),
    gsm: figure('g/m²', 10, 2000),
    note: z.string().trim().max(2000, 'The note is at most 2000 characters').default(''),
  })
  .strict();
export type TestKnitSubmission = z.infer<typeof testKnitSubmissionSchema>;

export const testKnitDecisionSchema = z
  .object({
    version: z.number({ error: 'The test knit version is required' }).int().min(1),
    decision: z.enum(['approved', 'change-requested'], { error: 'Approve, or ask for a change' }),
    comment: z.string().trim().max(4000, 'A comment is at most 4000 characters').default(''),
  })
  .strict()
  .refine((d) => d.decision === 'approved' || d.comment.length > 0, { path: ['comment'], message: 'Say what should change' });
export type TestKnitDecision = z.infer<typeof testKnitDecisionSchema>;

export const millPackStartSchema = z
  .object({ releaseId: uuid('release').nullable().default(null), paper: paperSchema.default('a4') })
  .strict();
export type MillPackStart = z.infer<typeof millPackStartSchema>;

export const jobParamsSchema = z.object({ id: uuid('job') });
export const fileParamsSchema = z.object({ id: uuid('file') });

export const exportKinds = ['swatch-sheet.pdf', 'tile.png', 'stitch-map.png', 'stitch-map.csv', 'stitch-map.json', 'yarn-list.csv'] as const;
export type ExportKind = (typeof exportKinds)[number];

export const exportParamsSchema = z.object({
  id: uuid('id'),
  kind: z.enum(exportKinds, { error: `The export is one of ${exportKinds.join(', ')}` }),
});

const optionalInt = (label: string, min: number, max: number) =>
  z.preprocess((v) => (v === undefined || v === '' ? undefined : Number(v)), z.number().int(`${label} is a whole number`).min(min, `${label} is at least ${min}`).max(max, `${label} is at most ${max}`).optional());

export const exportQuerySchema = z
  .object({
    release: uuid('release').optional(),
    paper: paperSchema.default('a4'),
    texture: z.string().min(1).max(100).optional(),
    panel: z.string().min(1).max(100).optional(),
    pxPerCm: z.preprocess((v) => (v === undefined || v === '' ? 100 : Number(v)), z.number({ error: 'px per cm must be a number' }).min(20, 'px per cm is at least 20').max(400, 'px per cm is at most 400')),
    repeatsX: optionalInt('Repeats across', 1, 200),
    repeatsY: optionalInt('Repeats up', 1, 200),
  })
  .strict();
export type ExportQuery = z.infer<typeof exportQuerySchema>;
