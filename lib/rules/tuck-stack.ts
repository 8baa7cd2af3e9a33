import { tallestTuckStack, type Texture } from '@/lib/knit/texture';
import type { RuleFinding, RuleLimits } from './types';
import { firstLatticeStitch, usageLabel, usageWhere, type TextureUsage } from './usage';

/**
 * Too many tucks stacked on one needle: the most tuck loops a needle holds before it knits again
 * (from `tallestTuckStack`), against `limits.maxTuckStack`. A needle that tucks but never knits in
 * the repeat piles loops without end. One finding per use of the texture, at the stack's first tuck.
 */
export function checkTuckStacks(usages: readonly TextureUsage[], limits: Pick<RuleLimits, 'maxTuckStack'>): RuleFinding[] {
  const out: RuleFinding[] = [];
  const stacks = new Map<Texture, ReturnType<typeof tallestTuckStack>>();
  for (const u of usages) {
    if (!u.texture) continue;
    if (!stacks.has(u.texture)) stacks.set(u.texture, tallestTuckStack(u.texture));
    const s = stacks.get(u.texture);
    if (!s || (!s.unbounded && s.tucks <= limits.maxTuckStack)) continue;
    const { needles, courses } = u.texture.repeat;
    out.push({
      rule: 'tuck-stack',
      severity: 'error',
      message: s.unbounded
        ? `${u.texture.name} in ${usageLabel(u)}: needle ${s.needle + 1} of the repeat tucks but never knits; its loops pile up without end.`
        : `${u.texture.name} in ${usageLabel(u)}: ${s.tucks} tucks stack on needle ${s.needle + 1} of the repeat, more than the ${limits.maxTuckStack} a needle can hold.`,
      where: {
        ...usageWhere(u),
        needle: firstLatticeStitch(u.bounds.minX, needles, s.needle),
        course: firstLatticeStitch(u.bounds.minY, courses, s.startCourse),
      },
    });
  }
  return out;
}
