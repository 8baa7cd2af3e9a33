import { longestFloat, type Texture } from '@/lib/knit/texture';
import type { RuleFinding, RuleLimits, RuleMachine } from './types';
import { firstLatticeStitch, usageLabel, usageWhere, type TextureUsage } from './usage';

/**
 * A float longer than the limit: the longest run of misses in a course of the texture's repeat
 * (wrapping across the repeat, from `longestFloat`), in mm at the machine's gauge, against
 * `limits.maxFloatMm`. A course that misses on every needle floats across the whole fabric.
 * One finding per use of the texture, placed at the float's first stitch in that zone or panel.
 */
export function checkFloats(
  usages: readonly TextureUsage[],
  machine: Pick<RuleMachine, 'gauge'>,
  limits: Pick<RuleLimits, 'maxFloatMm'>,
): RuleFinding[] {
  const out: RuleFinding[] = [];
  const floats = new Map<Texture, ReturnType<typeof longestFloat>>();
  for (const u of usages) {
    if (!u.texture) continue;
    if (!floats.has(u.texture)) floats.set(u.texture, longestFloat(u.texture, machine.gauge));
    const f = floats.get(u.texture);
    if (!f || (!f.unbounded && (f.mm ?? 0) <= limits.maxFloatMm)) continue;
    const { needles, courses } = u.texture.repeat;
    out.push({
      rule: 'float-length',
      severity: f.unbounded ? 'error' : 'warning',
      message: f.unbounded
        ? `${u.texture.name} in ${usageLabel(u)}: course ${f.course + 1} of the repeat misses on every needle, so its yarn floats across the whole fabric.`
        : `${u.texture.name} in ${usageLabel(u)}: a float over ${f.needles} needles (${(f.mm ?? 0).toFixed(1)} mm) is longer than the ${limits.maxFloatMm} mm limit; it will snag.`,
      where: {
        ...usageWhere(u),
        needle: firstLatticeStitch(u.bounds.minX, needles, f.startNeedle),
        course: firstLatticeStitch(u.bounds.minY, courses, f.course),
      },
    });
  }
  return out;
}
