import { coursesWithoutElastane, textureYarnIds } from '@/lib/knit/texture';
import type { YarnLookup } from '@/lib/knit/yarn';
import type { RuleFinding } from './types';
import { firstLatticeStitch, usageLabel, usageWhere, type TextureUsage } from './usage';

/**
 * A compression zone whose texture lays no elastane in some course of its repeat (neither the
 * ground nor the plated yarn has elastane, or the course does not knit: from
 * `coursesWithoutElastane`). Such courses give no hold where the zone is meant to compress.
 */
export function checkCompressionElastane(usages: readonly TextureUsage[], yarns: YarnLookup): RuleFinding[] {
  const out: RuleFinding[] = [];
  for (const u of usages) {
    if (!u.zone || u.zone.fn !== 'compression' || !u.texture) continue;
    const missing = coursesWithoutElastane(u.texture, yarns);
    const first = missing[0];
    if (first === undefined) continue;
    out.push({
      rule: 'compression-elastane',
      severity: 'error',
      message:
        `${usageLabel(u)} is a compression zone, but ${u.texture.name} lays no elastane in ` +
        `${missing.length} of its ${u.texture.repeat.courses} courses (repeat course ${missing.map((c) => c + 1).join(', ')}). ` +
        'Plate elastane in every course, or use a compression texture.',
      where: {
        ...usageWhere(u),
        course: firstLatticeStitch(u.bounds.minY, u.texture.repeat.courses, first),
        yarnIds: textureYarnIds(u.texture),
      },
    });
  }
  return out;
}
