/**
 * The studio's colour settings as the settings route takes them: the lab-dip tolerance for targets
 * without a standard, and the ΔE00 below which two tones of a colourway read as one. `null` puts a
 * setting back to the product default.
 */
import { z } from 'zod';
import { toleranceSchema } from './colour';

const isBlank = (v: unknown) => v === '' || (typeof v === 'number' && Number.isNaN(v));

/**
 * Two tones closer than this ΔE00 read as one. Bounds: below 1 two tones would have to be about one
 * lab-dip tolerance apart to be flagged, above 20 clearly different colours would be; common
 * practice, no published source.
 */
export const lowContrastBounds = { min: 1, max: 20 } as const;

const lowContrast = z.preprocess(
  (v) => (typeof v === 'string' && !isBlank(v) ? Number(v.trim().replace(',', '.')) : v),
  z
    .number({ error: 'The low-contrast threshold must be a number' })
    .refine((n) => Number.isFinite(n), { message: 'The low-contrast threshold must be a number' })
    .refine((n) => n >= lowContrastBounds.min, { message: `The low-contrast threshold must be at least ${lowContrastBounds.min}` })
    .refine((n) => n <= lowContrastBounds.max, { message: `The low-contrast threshold must be at most ${lowContrastBounds.max}` })
    .nullable(),
);

export const colourSettingsPutSchema = z
  .object({
    tolerance: toleranceSchema.nullable(),
    lowContrastDeltaE: lowContrast,
  })
  .strict();
export type ColourSettingsInput = z.infer<typeof colourSettingsPutSchema>;
