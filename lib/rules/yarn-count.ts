import type { Panel } from '@/lib/knit/panel';
import { textureYarnIds, type Texture } from '@/lib/knit/texture';
import type { RuleFinding, RuleMachine } from './types';
import { textureUsages } from './usage';

/** Distinct yarn ids the textures on these panels use (ground and plated), in first-use order. */
export function styleYarnIds(panels: readonly Panel[], textures: ReadonlyMap<string, Texture>): string[] {
  const ids = new Set<string>();
  for (const u of textureUsages(panels, textures)) {
    if (u.texture) for (const id of textureYarnIds(u.texture)) ids.add(id);
  }
  return [...ids];
}

/**
 * Too many distinct yarns for the machine: the style's textures together use more yarns than the
 * machine setup can carry (`machine.maxYarns`; about two to three on a seamless machine — common
 * practice, no published source).
 */
export function checkYarnCount(
  panels: readonly Panel[],
  textures: ReadonlyMap<string, Texture>,
  machine: Pick<RuleMachine, 'maxYarns'>,
): RuleFinding[] {
  const ids = styleYarnIds(panels, textures);
  if (ids.length <= machine.maxYarns) return [];
  return [
    {
      rule: 'yarn-count',
      severity: 'error',
      message:
        `The style uses ${ids.length} distinct yarns; the machine carries ${machine.maxYarns}. ` +
        'Bring textures onto shared yarns or split the style across machine setups.',
      where: { yarnIds: ids },
    },
  ];
}
