/**
 * The dye plan of a colourway: which baths a garment (or its yarns) goes through, and what can go
 * wrong with the intended colours.
 *
 * Semantics (product design §8, colour issue): every fibre has its dye classes (lib/knit/fibres).
 * In one garment-dyeing run each bath of a dye class colours every fibre of that class in the
 * garment with one colour, so two target colours on the same class clash unless one of the yarns
 * comes coloured (dope-dyed or yarn-dyed). Every yarn in the garment goes through every bath, so a
 * bath also stains the fibres it stains and heats every fibre to its temperature.
 */
import { fibres as registry, type DyeClass, type Fibre, type FibreId } from '@/lib/knit/fibres';
import { yarnMap, type Yarn, type YarnLookup } from '@/lib/knit/yarn';
import { deltaE2000 } from './difference';
import type { Lab } from './lab';

/**
 * How the colourway is coloured. `garment-dyed`: the knitted garment goes through the baths (the
 * usual route for seamless); `yarn-dyed`: each dyeable yarn is dyed on its own before knitting.
 * Yarns whose colour state is dope-dyed or yarn-dyed come coloured on either route.
 */
export type DyeRoute = 'garment-dyed' | 'yarn-dyed';

/** A target colour for a group of yarns (CIELAB, D65 / 10°). */
export interface DyeTarget {
  id: string;
  name?: string;
  yarnIds: string[];
  colour: Lab;
}

export type DurationClass = 'short' | 'standard' | 'long';

export interface BathProfile {
  temperatureC: number;
  durationClass: DurationClass;
  /** Where the temperature comes from, in the terms of references.md (or common practice). */
  status: 'verified-2nd' | 'common-practice' | 'memory';
}

/**
 * Usual top temperature and length of an exhaust bath per dye class.
 * - disperse 130 °C: "a dyeing temperature of 130 °C (266 °F) is required, and a pressurized
 *   dyebath is used" (an encyclopedia article on dyes, read in a secondary copy; references.md §8,
 *   verified-2nd).
 * - acid 98 °C: common practice, no published source — polyamide is dyed with acid dyes at or near
 *   the boil (references.md §8 gives ~98–100 °C, pH 4.5–6, from memory).
 * - cationic at the boil, reactive 60 °C, direct 90 °C, vat 60 °C: from memory.
 * Duration classes: common practice, no published source (pressure dyeing and wash-off make a bath
 * long).
 */
export const bathProfiles: Readonly<Record<DyeClass, BathProfile>> = {
  disperse: { temperatureC: 130, durationClass: 'long', status: 'verified-2nd' },
  cationic: { temperatureC: 100, durationClass: 'standard', status: 'memory' },
  acid: { temperatureC: 98, durationClass: 'standard', status: 'common-practice' },
  direct: { temperatureC: 90, durationClass: 'short', status: 'memory' },
  reactive: { temperatureC: 60, durationClass: 'long', status: 'memory' },
  vat: { temperatureC: 60, durationClass: 'long', status: 'memory' },
};

export interface DyeBath {
  /** 1 for the first bath. Hottest first, so a cooler class is not stripped or shifted by a hotter one. */
  order: number;
  dyeClass: DyeClass;
  /** The target this bath dyes to. */
  targetId: string;
  colour: Lab;
  /** Fibres the bath colours (in the yarns it dyes), in registry order. */
  fibres: FibreId[];
  /** Yarns the bath colours. On the yarn-dyed route a bath serves one yarn. */
  yarnIds: string[];
  temperatureC: number;
  durationClass: DurationClass;
}

export const dyeFindingKinds = [
  'clash',
  'stain-risk',
  'heat-limit',
  'undyeable',
  'low-contrast',
  'grin-through',
] as const;
export type DyeFindingKind = (typeof dyeFindingKinds)[number];

export interface DyeFinding {
  kind: DyeFindingKind;
  severity: 'error' | 'warning' | 'info';
  yarnIds: string[];
  /** Target ids concerned, where the finding is about targets. */
  targetIds: string[];
  /** What is wrong, in plain words. */
  message: string;
  /** What to do instead. */
  instead: string;
}

export interface DyePlan {
  route: DyeRoute;
  baths: DyeBath[];
  findings: DyeFinding[];
}

export interface DyePlanOptions {
  /** Studio override of a class's bath temperature, °C (e.g. a low-temperature disperse bath). */
  bathTemperatureC?: Partial<Record<DyeClass, number>>;
  /**
   * Two tones closer than this ΔE00 will not read as two. Studio setting; the default 5 is a
   * starting value, common practice, no published source.
   */
  lowContrastDeltaE?: number;
  /**
   * Two targets within this ΔE00 can come from one bath (they are one shade). Default 1.0, about
   * one lab-dip tolerance; common practice, no published source.
   */
  sameShadeDeltaE?: number;
  /**
   * A yarn at least this share of fibres that take little dye (bare elastane) shows pale where it
   * shows. Default 0.5.
   */
  grinThroughShare?: number;
}

export const defaultLowContrastDeltaE = 5;
export const defaultSameShadeDeltaE = 1.0;

/** A fibre of a yarn that a bath could colour. */
interface Component {
  yarn: Yarn;
  fibre: FibreId;
}

function listOf(ids: Iterable<string>): string[] {
  return [...new Set(ids)];
}

function names(yarns: readonly Yarn[]): string {
  return yarns.map((y) => y.name).join(', ');
}

function targetLabel(t: DyeTarget): string {
  return t.name ?? t.id;
}

/** Fibres of a yarn with a real share, in the yarn's order. */
function fibresOf(yarn: Yarn): FibreId[] {
  return yarn.fibres.filter((f) => f.share > 0).map((f) => f.fibre);
}

function isPrecoloured(yarn: Yarn): boolean {
  return yarn.colour.state !== 'dyeable';
}

const registryOrder = Object.keys(registry) as FibreId[];

/** The registry entry of a fibre, as the common `Fibre` shape. */
function fibre(id: FibreId): Fibre {
  return registry[id];
}

/**
 * Plan the dyeing of a colourway: the baths (dye class, the fibres and yarns they colour,
 * temperature °C, duration class, order) and the findings — `clash`, `stain-risk`, `heat-limit`,
 * `undyeable`, `low-contrast`, `grin-through` — each with the yarns it concerns, what is wrong and
 * what to do instead. Dye classes, staining and wet-processing limits from lib/knit/fibres; bath
 * temperatures from `bathProfiles` (references.md §8); tone difference by CIEDE2000.
 */
export function planDyeing(input: {
  yarns: YarnLookup;
  targets: readonly DyeTarget[];
  route: DyeRoute;
  options?: DyePlanOptions;
}): DyePlan {
  const { targets, route, options = {} } = input;
  const yarns = yarnMap(input.yarns);
  const lowContrast = options.lowContrastDeltaE ?? defaultLowContrastDeltaE;
  const sameShade = options.sameShadeDeltaE ?? defaultSameShadeDeltaE;
  const grinShare = options.grinThroughShare ?? 0.5;
  const temperatureOf = (c: DyeClass) => options.bathTemperatureC?.[c] ?? bathProfiles[c].temperatureC;

  const findings: DyeFinding[] = [];
  const targetOf = new Map<string, DyeTarget>();
  for (const t of targets) {
    for (const id of t.yarnIds) {
      if (!yarns.has(id)) throw new Error(`Target ${targetLabel(t)} names unknown yarn "${id}".`);
      const before = targetOf.get(id);
      if (before && before.id !== t.id) {
        throw new Error(`Yarn "${id}" has two targets: ${targetLabel(before)} and ${targetLabel(t)}.`);
      }
      targetOf.set(id, t);
    }
  }

  // Undyeable: a target on a dyeable yarn that no dye class colours. Bare elastane, which takes a
  // little dye, is left to the grin-through check.
  const dyedYarns: Yarn[] = [];
  for (const [id, target] of targetOf) {
    const yarn = yarns.get(id);
    if (!yarn || isPrecoloured(yarn)) continue;
    const fs = fibresOf(yarn);
    const noClass = fs.filter((f) => fibre(f).dyeClasses.length === 0);
    const dopeOnly = noClass.filter((f) => fibre(f).dopeDyedOnly);
    if (noClass.length === fs.length && noClass.every((f) => fibre(f).takesLittleDye)) continue;
    if (noClass.length === fs.length) {
      findings.push({
        kind: 'undyeable',
        severity: 'error',
        yarnIds: [id],
        targetIds: [target.id],
        message: `${yarn.name} is ${fs.join('/')}, which takes no dye: it cannot be dyed to ${targetLabel(target)}.`,
        instead: 'Use a dope-dyed yarn spun in the target colour, or a fibre with a dye class.',
      });
      continue;
    }
    if (dopeOnly.length > 0) {
      findings.push({
        kind: 'undyeable',
        severity: 'warning',
        yarnIds: [id],
        targetIds: [target.id],
        message: `The ${dopeOnly.join(' and ')} in ${yarn.name} takes no dye and will stay undyed beside the ${targetLabel(target)} fibres.`,
        instead: 'Use the yarn without it, or with that fibre dope-dyed near the target colour.',
      });
    }
    dyedYarns.push(yarn);
  }

  const baths =
    route === 'garment-dyed'
      ? garmentBaths(dyedYarns, [...yarns.values()], targetOf, temperatureOf, sameShade, findings)
      : yarnBaths(dyedYarns, targetOf, temperatureOf);

  // Every yarn in the garment goes through every garment bath; on the yarn route only its own.
  const exposedTo = (bath: DyeBath): Yarn[] =>
    route === 'garment-dyed'
      ? [...yarns.values()]
      : bath.yarnIds.map((id) => yarns.get(id)).filter((y): y is Yarn => y !== undefined);

  for (const bath of baths) {
    stainFindings(bath, exposedTo(bath), findings);
    heatFindings(bath, exposedTo(bath), findings);
  }
  if (route === 'garment-dyed') overdyeFindings(baths, [...yarns.values()], targetOf, findings);
  grinThroughFindings(baths, [...yarns.values()], grinShare, findings);
  lowContrastFindings(targets, [...yarns.values()], lowContrast, findings);

  return { route, baths, findings };
}

/** One bath per dye class the targets need; a clash where a class would need two colours. */
function garmentBaths(
  dyed: readonly Yarn[],
  all: readonly Yarn[],
  targetOf: ReadonlyMap<string, DyeTarget>,
  temperatureOf: (c: DyeClass) => number,
  sameShade: number,
  findings: DyeFinding[],
): DyeBath[] {
  // Choose a class for each dyeable fibre: fibres with fewer classes first, preferring a class
  // already chosen for the same target, then one not yet taken.
  const components: Component[] = dyed.flatMap((yarn) =>
    fibresOf(yarn)
      .filter((f) => fibre(f).dyeClasses.length > 0)
      .map((f) => ({ yarn, fibre: f })),
  );
  components.sort((p, q) => fibre(p.fibre).dyeClasses.length - fibre(q.fibre).dyeClasses.length);
  const bathTarget = new Map<DyeClass, DyeTarget>();
  for (const c of components) {
    const target = targetOf.get(c.yarn.id);
    if (!target) continue;
    const classes = fibre(c.fibre).dyeClasses;
    const same = classes.find((k) => bathTarget.get(k)?.id === target.id);
    const free = classes.find((k) => !bathTarget.has(k));
    const chosen = same ?? free;
    if (chosen !== undefined && !bathTarget.has(chosen)) bathTarget.set(chosen, target);
  }

  // A bath colours every fibre of its class in the garment's dyeable yarns, whichever class was
  // chosen for it; collect which targets each bath would have to reach.
  const baths: DyeBath[] = [];
  const clashes: DyeFinding[] = [];
  for (const [dyeClass, target] of bathTarget) {
    // Dyeable yarns without a target take the bath's colour too.
    const coloured = all.filter(
      (y) => !isPrecoloured(y) && fibresOf(y).some((f) => fibre(f).dyeClasses.includes(dyeClass)),
    );
    const wanted = new Map<string, { target: DyeTarget; yarns: Yarn[] }>();
    for (const y of coloured) {
      const t = targetOf.get(y.id);
      if (!t) continue;
      const entry = wanted.get(t.id) ?? { target: t, yarns: [] };
      entry.yarns.push(y);
      wanted.set(t.id, entry);
    }
    const others = [...wanted.values()].filter(
      (w) => w.target.id !== target.id && deltaE2000(w.target.colour, target.colour) > sameShade,
    );
    if (others.length > 0) {
      const mine = wanted.get(target.id)?.yarns ?? [];
      const all = [...mine, ...others.flatMap((o) => o.yarns)];
      clashes.push({
        kind: 'clash',
        severity: 'error',
        yarnIds: listOf(all.map((y) => y.id)),
        targetIds: [target.id, ...others.map((o) => o.target.id)],
        message:
          `The ${dyeClass} bath colours ${names(all)} alike, but they are meant to be ` +
          `${[target, ...others.map((o) => o.target)].map(targetLabel).join(' and ')}: ` +
          'one bath gives one colour.',
        instead:
          'Make all but one of these yarns dope-dyed or yarn-dyed in its colour, or change one to a ' +
          `fibre that ${dyeClass} dyes do not colour.`,
      });
    }
    baths.push({
      order: 0,
      dyeClass,
      targetId: target.id,
      colour: target.colour,
      fibres: registryOrder.filter((f) =>
        coloured.some((y) => fibresOf(y).includes(f)) && fibre(f).dyeClasses.includes(dyeClass),
      ),
      yarnIds: coloured.map((y) => y.id),
      temperatureC: temperatureOf(dyeClass),
      durationClass: bathProfiles[dyeClass].durationClass,
    });
  }
  findings.push(...clashes);
  return ordered(baths);
}

/** Yarn-dyed route: each dyeable yarn with a target is dyed on its own, one bath per class. */
function yarnBaths(
  dyed: readonly Yarn[],
  targetOf: ReadonlyMap<string, DyeTarget>,
  temperatureOf: (c: DyeClass) => number,
): DyeBath[] {
  const baths: DyeBath[] = [];
  for (const yarn of dyed) {
    const target = targetOf.get(yarn.id);
    if (!target) continue;
    const chosen = new Map<DyeClass, FibreId[]>();
    for (const f of fibresOf(yarn)) {
      const classes = fibre(f).dyeClasses;
      const k = classes.find((c) => chosen.has(c)) ?? classes[0];
      if (k === undefined) continue;
      chosen.set(k, [...(chosen.get(k) ?? []), f]);
    }
    for (const [dyeClass, fs] of chosen) {
      baths.push({
        order: 0,
        dyeClass,
        targetId: target.id,
        colour: target.colour,
        fibres: fs,
        yarnIds: [yarn.id],
        temperatureC: temperatureOf(dyeClass),
        durationClass: bathProfiles[dyeClass].durationClass,
      });
    }
  }
  return ordered(baths);
}

/**
 * Hottest bath first: the hot disperse bath (and its clearing) would strip or shift dyes already on
 * the other fibres, so those follow (from memory: union dyeing of polyester blends).
 */
function ordered(baths: DyeBath[]): DyeBath[] {
  return baths
    .sort((p, q) => q.temperatureC - p.temperatureC || p.dyeClass.localeCompare(q.dyeClass))
    .map((b, i) => ({ ...b, order: i + 1 }));
}

/** Stain risk: a bath's dyes stain fibres the registry says they stain (disperse on polyamide, elastane). */
function stainFindings(bath: DyeBath, exposed: readonly Yarn[], findings: DyeFinding[]): void {
  const stained = exposed.filter((y) => fibresOf(y).some((f) => fibre(f).stainedBy.includes(bath.dyeClass)));
  if (stained.length === 0) return;
  const which = registryOrder.filter(
    (f) => fibre(f).stainedBy.includes(bath.dyeClass) && stained.some((y) => fibresOf(y).includes(f)),
  );
  findings.push({
    kind: 'stain-risk',
    severity: 'warning',
    yarnIds: stained.map((y) => y.id),
    targetIds: [bath.targetId],
    message:
      `The ${bath.dyeClass} bath stains the ${which.join(' and ')} in ${names(stained)}: the stain ` +
      'shifts their shade and washes out poorly.',
    instead:
      bath.dyeClass === 'disperse'
        ? 'Clear the disperse dye off after dyeing (reduction clearing) and choose low-staining disperse dyes.' +
          // From memory: an alkaline reduction clear damages wool.
          (which.includes('wool') ? ' Clear wool blends mildly, not in a hot alkaline reduction bath.' : '')
        : bath.dyeClass === 'cationic'
          ? 'Add a reserving agent for the polyamide to the cationic bath, choose cationic dyes that stain polyamide little, and clear after dyeing.'
          : `Choose ${bath.dyeClass} dyes of low staining and clear after dyeing.`,
  });
}

/** Heat limit: a bath hotter than a fibre's wet-processing limit. */
function heatFindings(bath: DyeBath, exposed: readonly Yarn[], findings: DyeFinding[]): void {
  const hurt = registryOrder.filter((f) => {
    const limit = fibre(f).wetLimitC;
    return limit !== undefined && bath.temperatureC > limit && exposed.some((y) => fibresOf(y).includes(f));
  });
  if (hurt.length === 0) return;
  const hurtYarns = exposed.filter((y) => fibresOf(y).some((f) => hurt.includes(f)));
  const limits = hurt.map((f) => `${f} ${fibre(f).wetLimitC} °C`).join(', ');
  const harm = hurt.map((f) => `the ${f} ${fibre(f).wetLimitHarm ?? 'is damaged'}`).join('; ');
  findings.push({
    kind: 'heat-limit',
    severity: 'error',
    yarnIds: hurtYarns.map((y) => y.id),
    targetIds: [bath.targetId],
    message:
      `The ${bath.dyeClass} bath runs at ${bath.temperatureC} °C, above the wet limit of ` +
      `${limits} in ${names(hurtYarns)}: ${harm}.`,
    instead:
      bath.dyeClass === 'disperse'
        ? 'Dye at a lower temperature with disperse dyes made for it, or use a dope-dyed or yarn-dyed polyester so the garment needs no hot bath.'
        : `Keep the ${bath.dyeClass} bath at or below the limit, or colour this yarn before knitting.`,
  });
}

/** A yarn that comes coloured still takes up a garment bath of a class its fibres take. */
function overdyeFindings(
  baths: readonly DyeBath[],
  all: readonly Yarn[],
  targetOf: ReadonlyMap<string, DyeTarget>,
  findings: DyeFinding[],
): void {
  for (const bath of baths) {
    const over = all.filter(
      (y) =>
        isPrecoloured(y) &&
        targetOf.get(y.id)?.id !== bath.targetId &&
        fibresOf(y).some((f) => fibre(f).dyeClasses.includes(bath.dyeClass)),
    );
    if (over.length === 0) continue;
    findings.push({
      kind: 'stain-risk',
      severity: 'warning',
      yarnIds: over.map((y) => y.id),
      targetIds: [bath.targetId],
      message: `${names(over)} come${over.length === 1 ? 's' : ''} coloured, but the ${bath.dyeClass} bath also dyes their fibre: their colour will shift toward the bath's.`,
      instead: 'Choose the coloured yarn darker than the bath shade, use a dye-resist treated yarn, or a fibre the bath does not colour.',
    });
  }
}

/**
 * Grin-through: bare elastane (or another fibre that takes little dye) stays pale where it shows.
 * Judged whenever the garment shows a coloured tone — a bath's colour or a yarn that comes coloured
 * (a dope-dyed black ground with raw-white elastane grins through worst, with no bath at all).
 */
function grinThroughFindings(
  baths: readonly DyeBath[],
  all: readonly Yarn[],
  share: number,
  findings: DyeFinding[],
): void {
  if (baths.length === 0 && !all.some(isPrecoloured)) return;
  const pale = all.filter(
    (y) =>
      y.colour.state === 'dyeable' &&
      y.fibres.reduce((s, f) => s + (fibre(f.fibre).takesLittleDye ? f.share : 0), 0) >= share,
  );
  if (pale.length === 0) return;
  findings.push({
    kind: 'grin-through',
    severity: 'warning',
    yarnIds: pale.map((y) => y.id),
    targetIds: [],
    message: `${names(pale)} take${pale.length === 1 ? 's' : ''} little dye and will stay pale where the fabric stretches open, most visibly under dark shades.`,
    instead: 'Use a dope-dyed elastane in a shade near the ground colour, or a covered elastane.',
  });
}

/** Low contrast: two tones on the garment (targets and coloured yarns) too close to read as two. */
function lowContrastFindings(
  targets: readonly DyeTarget[],
  all: readonly Yarn[],
  threshold: number,
  findings: DyeFinding[],
): void {
  const targeted = new Set(targets.flatMap((t) => t.yarnIds));
  const tones: { label: string; colour: Lab; yarnIds: string[]; targetIds: string[] }[] = [
    ...targets.map((t) => ({ label: targetLabel(t), colour: t.colour, yarnIds: t.yarnIds, targetIds: [t.id] })),
    ...all.flatMap((y) =>
      y.colour.state === 'dyeable' || targeted.has(y.id)
        ? []
        : [{ label: y.name, colour: y.colour.lab, yarnIds: [y.id], targetIds: [] }],
    ),
  ];
  for (let i = 0; i < tones.length; i++) {
    for (let j = i + 1; j < tones.length; j++) {
      const p = tones[i];
      const q = tones[j];
      if (!p || !q) continue;
      const d = deltaE2000(p.colour, q.colour);
      if (d >= threshold) continue;
      findings.push({
        kind: 'low-contrast',
        severity: 'warning',
        yarnIds: listOf([...p.yarnIds, ...q.yarnIds]),
        targetIds: [...p.targetIds, ...q.targetIds],
        message: `${p.label} and ${q.label} differ by ΔE00 ${d.toFixed(1)}, below ${threshold}: they will read as one colour.`,
        instead: 'Move the two tones further apart in lightness or hue, or make them one colour.',
      });
    }
  }
}
