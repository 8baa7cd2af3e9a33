import { z } from 'zod';

const maybe = <T extends z.ZodType>(s: T) => s.nullable().default(null);

/**
 * The studio's stitch-rule limits for its machines (studios.settings.ruleLimits); null takes the
 * default of lib/rules. Bounds keep out typing slips, not machines: common practice, no published source.
 */
export const ruleLimitsSchema = z
  .object({
    maxFloatMm: maybe(
      z.number({ error: 'The float limit must be a number of mm' }).positive('The float limit must be above 0 mm').max(50, 'A float limit above 50 mm is not realistic'),
    ),
    maxTuckStack: maybe(
      z.number({ error: 'The tuck limit must be a number' }).int('Whole tucks only').min(1, 'At least one tuck').max(12, 'More than 12 stacked tucks is not realistic'),
    ),
  })
  .strict();
export type RuleLimitsInput = z.infer<typeof ruleLimitsSchema>;

export const ruleLimitsPutSchema = z.object({ limits: ruleLimitsSchema }).strict();
