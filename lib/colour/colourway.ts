/**
 * A colourway's dye plan with mixed routes: each target says how its yarns get their colour —
 * dyed in the garment's baths, dyed as yarn before knitting, or spun in the colour (dope-dyed).
 *
 * Built on `planDyeing` (./dye-plan): the yarn-dyed targets are planned on the yarn route (one
 * bath per yarn, at the dye house that dyes the packages); their yarns and the dope-dyed ones then
 * enter the garment coloured, and the garment-dyed targets are planned on the garment route with
 * everything else, so the overdye, clash, heat and stain findings of the garment baths see them.
 */
import { fibres, type FibreId } from '@/lib/knit/fibres';
import { yarnMap, type Yarn, type YarnLookup } from '@/lib/knit/yarn';
import { planDyeing, type DyeBath, type DyeFinding, type DyePlanOptions, type DyeTarget } from './dye-plan';
import type { Lab } from './lab';

export const targetRoutes = ['garment-dyed', 'yarn-dyed', 'dope-dyed'] as const;
/** How one target's yarns are coloured. */
export type TargetRoute = (typeof targetRoutes)[number];

export const targetRouteLabels: Record<TargetRoute, string> = {
  'garment-dyed': 'Garment-dyed',
  'yarn-dyed': 'Yarn-dyed',
  'dope-dyed': 'Dope-dyed',
};

/** A target colour of a colourway for a group of yarns (CIELAB, D65 / 10°), with its route. */
export interface ColourwayTarget {
  id: string;
  name: string;
  yarnIds: readonly string[];
  colour: Lab;
  route: TargetRoute;
}

/** The colourway's route as one word: the targets' common route, or `mixed`. */
export type ColourwayRoute = TargetRoute | 'mixed' | 'none';

/** Where a bath runs: on the yarn packages before knitting, or on the knitted garment. */
export type BathStage = 'yarn' | 'garment';

export interface ColourwayBath extends DyeBath {
  stage: BathStage;
}

export interface ColourwayPlan {
  route: ColourwayRoute;
  /** Yarn baths first (they come before knitting), then the garment baths; `order` runs across both. */
  baths: ColourwayBath[];
  findings: DyeFinding[];
}

/** The route of a colourway whose targets have these routes. */
export function colourwayRoute(routes: readonly TargetRoute[]): ColourwayRoute {
  const distinct = [...new Set(routes)];
  if (distinct.length === 0) return 'none';
  return distinct.length === 1 ? (distinct[0] as TargetRoute) : 'mixed';
}

function fibresOf(yarn: Yarn): FibreId[] {
  return yarn.fibres.filter((f) => f.share > 0).map((f) => f.fibre);
}

/**
 * Plan a colourway whose targets may take different routes: baths (yarn baths, then garment baths,
 * numbered in the order they run) and findings, as `planDyeing` gives them, plus one check of its
 * own: natural fibres cannot be dope-dyed (colour is added to the polymer melt or spinning solution
 * of man-made fibres only; common practice, no published source). Yarns that come coloured from
 * the library keep their own colour whatever the target says.
 */
export function planColourway(input: {
  yarns: YarnLookup;
  targets: readonly ColourwayTarget[];
  options?: DyePlanOptions;
}): ColourwayPlan {
  const yarns = yarnMap(input.yarns);
  const { targets, options } = input;
  const findings: DyeFinding[] = [];

  // Dope-dyeing is for man-made fibres: a natural fibre in a dope-dyed target cannot get its colour.
  for (const t of targets.filter((x) => x.route === 'dope-dyed')) {
    for (const id of t.yarnIds) {
      const yarn = yarns.get(id);
      if (!yarn || yarn.colour.state !== 'dyeable') continue;
      const natural = fibresOf(yarn).filter((f) => fibres[f].natural);
      if (natural.length === 0) continue;
      findings.push({
        kind: 'undyeable',
        severity: 'error',
        yarnIds: [id],
        targetIds: [t.id],
        message: `${yarn.name} is ${natural.join(' and ')}, a natural fibre: it cannot be dope-dyed to ${t.name}, because only man-made fibres are coloured in the melt or spinning solution.`,
        instead: 'Yarn-dye it or garment-dye it, or choose a man-made fibre spun in the colour.',
      });
    }
  }

  // Yarn route: the yarn-dyed targets' yarns, each dyed on its own. Every yarn is listed so the
  // plan can name pale elastane; only the targeted ones are dyed.
  const yarnTargets: DyeTarget[] = targets
    .filter((t) => t.route === 'yarn-dyed')
    .map((t) => ({ id: t.id, name: t.name, yarnIds: [...t.yarnIds], colour: t.colour }));
  const yarnPlan = yarnTargets.length
    ? planDyeing({ yarns: [...yarns.values()], targets: yarnTargets, route: 'yarn-dyed', options })
    : { route: 'yarn-dyed' as const, baths: [], findings: [] };

  // The garment: yarn-dyed and dope-dyed yarns come coloured; the rest go through the baths.
  const coloured = new Map<string, Yarn>();
  for (const t of targets) {
    if (t.route === 'garment-dyed') continue;
    for (const id of t.yarnIds) {
      const yarn = yarns.get(id);
      if (!yarn || yarn.colour.state !== 'dyeable') continue;
      const state = t.route === 'yarn-dyed' ? 'yarn-dyed' : 'dope-dyed';
      coloured.set(id, { ...yarn, colour: { state, lab: t.colour } });
    }
  }
  const garmentYarns = [...yarns.values()].map((y) => coloured.get(y.id) ?? y);
  const garmentTargets: DyeTarget[] = targets
    .filter((t) => t.route === 'garment-dyed')
    .map((t) => ({ id: t.id, name: t.name, yarnIds: [...t.yarnIds], colour: t.colour }));
  // Tones that come coloured are named after their target in the garment plan's findings.
  const garmentPlan = planDyeing({
    yarns: garmentYarns.map((y) => {
      const t = targets.find((x) => x.route !== 'garment-dyed' && x.yarnIds.includes(y.id));
      return t && coloured.has(y.id) ? { ...y, name: `${y.name} (${t.name})` } : y;
    }),
    targets: garmentTargets,
    route: 'garment-dyed',
    options,
  });

  // The garment plan judges contrast over every tone; the yarn plan only over its own targets.
  findings.push(...yarnPlan.findings.filter((f) => f.kind !== 'low-contrast' && f.kind !== 'grin-through'));
  findings.push(...garmentPlan.findings.filter((f) => f.kind !== 'grin-through'));
  const grin = garmentPlan.findings.find((f) => f.kind === 'grin-through') ?? yarnPlan.findings.find((f) => f.kind === 'grin-through');
  if (grin) findings.push(grin);

  const baths: ColourwayBath[] = [
    ...yarnPlan.baths.map((b) => ({ ...b, stage: 'yarn' as const })),
    ...garmentPlan.baths.map((b) => ({ ...b, stage: 'garment' as const })),
  ].map((b, i) => ({ ...b, order: i + 1 }));

  return { route: colourwayRoute(targets.map((t) => t.route)), baths, findings };
}
