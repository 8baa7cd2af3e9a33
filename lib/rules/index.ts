/**
 * The rule checks of product design §12, run together on every change.
 */
import { planDyeing, type DyePlan, type DyeRoute, type DyeTarget } from '@/lib/colour/dye-plan';
import type { Panel } from '@/lib/knit/panel';
import { rasterizePanel } from '@/lib/knit/raster';
import { yarnMap, type YarnLookup } from '@/lib/knit/yarn';
import { checkCompressionElastane } from './compression-elastane';
import { checkDyeClashes } from './dye-clash';
import { checkFloats } from './floats';
import { checkTrimHeat, checkTrimReheat, type TextureGrid } from './trim-heat';
import { checkKnittedLogoDetail, checkTrimVentilation, type ZoneGrid } from './trim-placement';
import type { Trim } from './trim';
import { checkTuckStacks } from './tuck-stack';
import { defaultRuleLimits, type RuleFinding, type RuleLimits, type RuleMachine, type RuleSeverity } from './types';
import { textureMap, textureUsages, usageWhere, type TextureLookup } from './usage';
import { checkYarnCount } from './yarn-count';
import { checkZoneRepeats } from './zone-repeat';

export * from './types';
export * from './trim';
export { describeRuleLimits, resolveRuleLimits, ruleLimitSourceLabels, type RuleLimitSource, type StudioRuleLimits } from './limits';
export { checkCompressionElastane } from './compression-elastane';
export { checkDyeClashes } from './dye-clash';
export { checkFloats } from './floats';
export { checkTrimHeat, checkTrimReheat, texturesUnderBox, type TextureGrid } from './trim-heat';
export { checkKnittedLogoDetail, checkTrimVentilation, stitchSizeMm, type ZoneGrid } from './trim-placement';
export { checkTuckStacks } from './tuck-stack';
export { checkYarnCount, styleYarnIds } from './yarn-count';
export { checkZoneRepeats } from './zone-repeat';
export { textureMap, textureUsages, type TextureLookup, type TextureUsage } from './usage';

export interface RulesInput {
  panels: readonly Panel[];
  textures: TextureLookup;
  yarns: YarnLookup;
  machine: RuleMachine;
  limits?: Partial<RuleLimits>;
  trims?: readonly Trim[];
  /** The colourway's dye plan, or what `planDyeing` needs to make it. */
  dye?: DyePlan | { targets: readonly DyeTarget[]; route: DyeRoute };
  /**
   * Rasters already drawn for the live summary, by panel id; drawn here when missing. The trim rules
   * need the zone of every stitch: a panel with trims is drawn again with `zoneMap` unless its raster
   * has `zoneCells`.
   */
  rasters?: ReadonlyMap<string, TextureGrid & { zoneCells?: Uint16Array }>;
}

const severityRank: Record<RuleSeverity, number> = { error: 0, warning: 1, info: 2 };

/**
 * Run every rule and return the findings, errors first, then by panel order. Rules: unknown
 * textures, distinct yarns against the machine, float length, tuck stacks, zone vs repeat, elastane
 * in compression zones, dye clashes, heat-applied trims (temperature, second application), trims
 * over ventilation zones, knitted logos finer than a stitch.
 */
export function runRules(input: RulesInput): RuleFinding[] {
  const textures = textureMap(input.textures);
  const yarns = yarnMap(input.yarns);
  const limits: RuleLimits = { ...defaultRuleLimits, ...input.limits };
  const usages = textureUsages(input.panels, textures);
  const known = usages.filter((u) => u.texture !== undefined);

  const findings: RuleFinding[] = [
    ...usages
      .filter((u) => u.texture === undefined)
      .map(
        (u): RuleFinding => ({
          rule: 'unknown-texture',
          severity: 'error',
          message: `${u.zone ? `Zone ${u.zone.name}` : `The base of ${u.panel.name}`} uses texture "${u.textureId}", which is not in the library.`,
          where: usageWhere(u),
        }),
      ),
    ...checkYarnCount(input.panels, textures, input.machine),
    ...checkFloats(known, input.machine, limits),
    ...checkTuckStacks(known, limits),
    ...checkZoneRepeats(known),
    ...checkCompressionElastane(known, yarns),
  ];

  if (input.dye) {
    const plan = 'baths' in input.dye ? input.dye : planDyeing({ yarns, targets: input.dye.targets, route: input.dye.route });
    findings.push(...checkDyeClashes(plan));
  }

  const trims = input.trims ?? [];
  if (trims.length > 0) {
    const rasters = new Map<string, TextureGrid>(input.rasters ?? []);
    const zoneGrids = new Map<string, ZoneGrid>();
    for (const panel of input.panels) {
      if (!trims.some((t) => t.panelId === panel.id)) continue;
      const given = input.rasters?.get(panel.id);
      if (given?.zoneCells) {
        zoneGrids.set(panel.id, { width: given.width, height: given.height, zoneCells: given.zoneCells });
        continue;
      }
      const drawn = rasterizePanel(panel, { zoneMap: true, counts: false });
      if (!given) rasters.set(panel.id, drawn);
      if (drawn.zoneCells) zoneGrids.set(panel.id, { width: drawn.width, height: drawn.height, zoneCells: drawn.zoneCells });
    }
    findings.push(
      ...checkTrimHeat(trims, rasters, textures, yarns),
      ...checkTrimReheat(trims),
      ...checkTrimVentilation(trims, input.panels, zoneGrids),
      ...checkKnittedLogoDetail(trims, rasters, textures, input.machine.gauge),
    );
  }

  const panelRank = new Map(input.panels.map((p, i) => [p.id, i]));
  return findings
    .map((f, i) => ({ f, i }))
    .sort(
      (p, q) =>
        severityRank[p.f.severity] - severityRank[q.f.severity] ||
        (panelRank.get(p.f.where.panelId ?? '') ?? -1) - (panelRank.get(q.f.where.panelId ?? '') ?? -1) ||
        p.i - q.i,
    )
    .map(({ f }) => f);
}
