import type { DyePlan } from '@/lib/colour/dye-plan';
import type { RuleFinding } from './types';

/** Dye clashes from the colourway's dye plan (`planDyeing`), as rule findings on the yarns concerned. */
export function checkDyeClashes(plan: DyePlan): RuleFinding[] {
  return plan.findings
    .filter((f) => f.kind === 'clash')
    .map((f) => ({
      rule: 'dye-clash' as const,
      severity: 'error' as const,
      message: `${f.message} ${f.instead}`,
      where: { yarnIds: f.yarnIds },
    }));
}
