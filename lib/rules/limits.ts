import { defaultRuleLimits, type RuleLimits } from './types';

/** Where a limit comes from: the studio set it for its machines, or it is the product default. */
export type RuleLimitSource = 'studio' | 'default';

export const ruleLimitSourceLabels: Record<RuleLimitSource, string> = {
  studio: 'studio setting',
  default: 'default',
};

/** The studio's stitch-rule limits (studios.settings.ruleLimits) with where each one comes from. */
export interface StudioRuleLimits {
  limits: RuleLimits;
  source: Record<keyof RuleLimits, RuleLimitSource>;
}

const limitKeys = ['maxFloatMm', 'maxTuckStack'] as const satisfies readonly (keyof RuleLimits)[];

/**
 * The limits a studio set over `defaultRuleLimits`: a key that is absent, null or not a positive
 * finite number takes the default.
 */
export function resolveRuleLimits(set: Partial<Record<keyof RuleLimits, unknown>> | null | undefined): StudioRuleLimits {
  const limits: RuleLimits = { ...defaultRuleLimits };
  const source: Record<keyof RuleLimits, RuleLimitSource> = { maxFloatMm: 'default', maxTuckStack: 'default' };
  for (const k of limitKeys) {
    const v = set?.[k];
    if (typeof v === 'number' && Number.isFinite(v) && v > 0) {
      limits[k] = v;
      source[k] = 'studio';
    }
  }
  return { limits, source };
}

/** The limits in words with where each comes from, e.g. "floats up to 6 mm (default), 4 stacked tucks (studio setting)". */
export function describeRuleLimits({ limits, source }: StudioRuleLimits): string {
  return `floats up to ${limits.maxFloatMm} mm (${ruleLimitSourceLabels[source.maxFloatMm]}), ${limits.maxTuckStack} stacked tucks (${ruleLimitSourceLabels[source.maxTuckStack]})`;
}
