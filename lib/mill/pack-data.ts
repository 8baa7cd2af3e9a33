/**
 * What the exports are made from: one style's data as it stands (the working copy) or as it was
 * released (a release's frozen snapshot, stored as this JSON). Every export (swatch sheet, tile,
 * stitch map, yarn list, mill pack) is a pure function of a `PackData`, so a released revision
 * prints the same today as on the day it was released.
 *
 * The colour (colourways, dye plan) and fit (size spec, needle counts per size) parts are optional:
 * a style without them prints "not recorded" in their place.
 */
import { labToSrgbHex } from '@/lib/colour/convert';
import type { Lab } from '@/lib/colour/lab';
import { cylinderNeedles, tubeHalfWidthCm } from '@/lib/fit/needles';
import { formatCount, type CountUnit } from '@/lib/knit/count';
import { fibres as fibreRegistry } from '@/lib/knit/fibres';
import type { Panel, PanelKind } from '@/lib/knit/panel';
import type { ColourwayPlan } from '@/lib/colour/colourway';
import { flatColoursForTextures, yarnColourMap, yarnLooks, type Colourway, type PreviewPlan, type YarnLook, type YarnLookSource } from '@/lib/knit/render';
import { summariseBodyMap, type BodyMapSummary } from '@/lib/knit/summary';
import {
  arealDensity, repeatSizeMm, stitchesPerCm2, textureYarnIds, yarnPerRepeat, type Feeder, type Texture, type YarnUse,
} from '@/lib/knit/texture';
import type { Yarn, YarnColour, YarnFibre } from '@/lib/knit/yarn';

export const packFormat = 1 as const;

export type PaperSize = 'a4' | 'letter';
export const paperSizes: Record<PaperSize, { label: string; widthMm: number; heightMm: number }> = {
  a4: { label: 'A4', widthMm: 210, heightMm: 297 },
  letter: { label: 'US Letter', widthMm: 215.9, heightMm: 279.4 },
};

export interface PackMachine {
  kind: 'circular' | 'flat';
  gauge: number;
  maxYarns: number;
  diameterIn?: number;
  needleMultiple?: number;
  feeders?: number;
  bedNeedles?: number;
}

export interface PackStyle {
  id: string;
  code: string;
  name: string;
  season: string;
  clientName: string | null;
  garmentType: string;
  construction: 'seamless' | 'flat';
  machine: PackMachine;
  sizes: { labels: string[]; base: string };
  revision: number;
  status: string;
}

export interface PackYarn extends Yarn {
  supplierRef: string;
  countUnit: CountUnit;
  lustre: string | null;
}

export interface PackTexture extends Texture {
  family: string;
  function: string | null;
  /** Gauge the texture was developed on, needles per inch. */
  gauge: number;
}

export interface PackTrim {
  id: string;
  panelKind: PanelKind;
  name: string;
  kind: string;
  method: string;
  tempC: number | null;
  box: { x: number; y: number; width: number; height: number };
}

/** A colour standard: the target for a group of dyeable yarns, or the colour a yarn comes in. */
export interface PackColourStandard {
  name: string;
  lab: Lab;
  yarnIds: string[];
  /** Where the colour comes from. */
  source: 'colourway' | 'dope-dyed' | 'yarn-dyed';
}

export interface PackColour {
  colourwayName: string;
  route: string;
  standards: PackColourStandard[];
  /** Baths in order: dye class, °C, the yarns they colour. */
  baths: { dyeClass: string; temperatureC: number; yarnIds: string[] }[];
  /** Findings of the dye plan, in words. */
  findings: string[];
  /**
   * The parts of the dye plan that decide how each yarn comes out of it (`yarnLooks`): baths with
   * their stage, order, colour and fibres, findings with their kind and severity. Absent in
   * snapshots released before it was kept: those show dyeable yarns in their target colours.
   */
  plan?: PreviewPlan;
}

export interface PackFitSize {
  label: string;
  /** Points of measure, cm, with their tolerance ± cm when known. */
  points: { name: string; cm: number; toleranceCm?: number }[];
  /** Needles of the body tube (or panel) for this size, when the fit plan sets them. */
  needles?: number;
  /** Stitch-count factor against the base size for consumption (width × length ratio); 1 for the base. */
  consumptionFactor?: number;
}

export interface PackFit {
  sizes: PackFitSize[];
  notes: string[];
}

export interface PackRelease {
  id: string;
  revision: number;
  releasedAt: string;
  releasedBy: string;
  mills: { id: string; name: string }[];
  note: string;
}

/** An approval or decision shown on the cover (client review, test knits). Not frozen: read at print time. */
export interface PackApproval {
  what: string;
  decision: string;
  by: string;
  at: string;
  comment: string;
}

export interface PackData {
  format: typeof packFormat;
  style: PackStyle;
  panels: Panel[];
  textures: PackTexture[];
  yarns: PackYarn[];
  trims: PackTrim[];
  colour: PackColour | null;
  fit: PackFit | null;
  /** When the data was read, ISO time. */
  capturedAt: string;
  /** The release this is the snapshot of; null for the working copy. */
  release: PackRelease | null;
}

// ---------------------------------------------------------------------------------------------
// Derived facts

export interface FeederLine {
  /** Feeder set letter (A, B, …) and the courses of the repeat that use it (0-based). */
  letter: string;
  courses: number[];
  /** `hex` and `source`: how the yarn comes out of the colourway's dye plan (`packYarnLooks`); null for a yarn missing from the pack. */
  ground: { id: string; name: string; count: string; hex: string; source: YarnLookSource | null };
  plated: { id: string; name: string; count: string; hex: string; source: YarnLookSource | null; draft: number } | null;
}

export interface TextureFacts {
  texture: PackTexture;
  repeatMm: { widthMm: number; heightMm: number };
  stitchesPerCm2: number;
  /** Estimated areal density, g/m², on the style's gauge. */
  gsm: number | null;
  yarnPerRepeat: Record<string, YarnUse> | null;
  feeders: FeederLine[];
  /** The texture's index colour in stitch maps and panel drawings. */
  indexHex: string;
  problems: string[];
}

function sameFeeder(a: Feeder, b: Feeder): boolean {
  if (a.ground !== b.ground) return false;
  if (!a.plated || !b.plated) return !a.plated && !b.plated;
  return a.plated.yarn === b.plated.yarn && a.plated.draft === b.plated.draft;
}

/**
 * The pack's colour part from a colourway: its targets as colour standards, its baths and findings
 * in words, and the parts of its dye plan (`planColourway`) that `yarnLooks` reads. Without a plan
 * (none could be made) there are no baths or findings.
 */
export function packColourFrom(
  colourwayName: string,
  targets: readonly { name: string; yarnIds: readonly string[]; colour: Lab }[],
  plan: ColourwayPlan | null,
): PackColour {
  return {
    colourwayName,
    route: plan?.route ?? 'none',
    standards: targets.map((t) => ({ name: t.name, lab: t.colour, yarnIds: [...t.yarnIds], source: 'colourway' as const })),
    baths: (plan?.baths ?? []).map((b) => ({ dyeClass: `${b.dyeClass} (${b.stage})`, temperatureC: b.temperatureC, yarnIds: [...b.yarnIds] })),
    findings: (plan?.findings ?? []).map((f) => `${f.message}${f.instead ? ` ${f.instead}` : ''}`),
    ...(plan
      ? {
          plan: {
            baths: plan.baths.map((b) => ({ stage: b.stage, order: b.order, colour: b.colour, fibres: [...b.fibres], yarnIds: [...b.yarnIds] })),
            findings: plan.findings.map((f) => ({ kind: f.kind, severity: f.severity, yarnIds: [...f.yarnIds] })),
          },
        }
      : {}),
  };
}

/** The pack's colourway as the renderer takes it: its targets and, when kept, its dye plan. */
export function packColourway(data: PackData): Colourway | undefined {
  if (!data.colour) return undefined;
  const targets = data.colour.standards.filter((s) => s.source === 'colourway').map((s) => ({ yarnIds: s.yarnIds, colour: s.lab }));
  return data.colour.plan ? { targets, plan: data.colour.plan } : { targets };
}

/**
 * How each yarn of the pack shows, by id: `yarnLooks` over the pack's colourway, so the exports
 * show the dyed result as the Colour section's preview does (undyeable yarns undyed, untargeted
 * yarns in their garment bath's colour or undyed); without a colourway, every yarn undyed.
 */
export function packYarnLooks(data: PackData): Record<string, YarnLook> {
  return yarnLooks(data.yarns, packColourway(data));
}

/** Yarn colours (hex) by id: the `hex` of `packYarnLooks`. */
export function packYarnColours(data: PackData): Record<string, string> {
  return yarnColourMap(data.yarns, packColourway(data));
}

/** Index colours of the style's textures (stable for the set). */
export function packTextureColours(data: PackData): Record<string, string> {
  return flatColoursForTextures(data.textures.map((t) => t.id));
}

/** The count as the yarn was entered, e.g. "78 dtex" or "40 den". */
export function yarnCountText(y: PackYarn): string {
  return formatCount(y.dtex, y.countUnit, y.countUnit === 'dtex' || y.countUnit === 'den' ? 0 : 1) + (y.filaments ? ` f${y.filaments}` : '');
}

/** Fibre make-up in words: "polyamide 88 %, elastane 12 %". */
export function yarnFibreText(fs: readonly YarnFibre[]): string {
  return fs
    .map((f) => `${fibreRegistry[f.fibre]?.names.eu ?? f.fibre} ${Math.round(f.share * 1000) / 10} %`)
    .join(', ');
}

export function yarnColourText(c: YarnColour): string {
  if (c.state === 'dyeable') return 'dyeable';
  return `${c.state} L* ${c.lab.L.toFixed(1)} a* ${c.lab.a.toFixed(1)} b* ${c.lab.b.toFixed(1)}`;
}

/**
 * Repeat size, density, estimated g/m² (on the style's gauge), yarn per repeat and the feeder sets
 * of every texture of the pack.
 */
export function textureFacts(data: PackData): TextureFacts[] {
  const yarnById = new Map(data.yarns.map((y) => [y.id, y]));
  const looks = packYarnLooks(data);
  const index = packTextureColours(data);
  return data.textures.map((t) => {
    const problems: string[] = [];
    const missing = textureYarnIds(t).filter((id) => !yarnById.has(id));
    if (missing.length) problems.push(`Yarns missing from the pack: ${missing.join(', ')}`);
    let gsm: number | null = null;
    let perRepeat: Record<string, YarnUse> | null = null;
    if (!missing.length) {
      try {
        gsm = arealDensity(t, data.yarns, data.style.machine.gauge);
        perRepeat = yarnPerRepeat(t, data.yarns, data.style.machine.gauge);
      } catch (err) {
        problems.push(err instanceof Error ? err.message : String(err));
      }
    }
    const yarnLine = (id: string) => {
      const y = yarnById.get(id);
      const look = looks[id];
      return { id, name: y?.name ?? id, count: y ? yarnCountText(y) : '?', hex: look?.hex ?? '#9a9a96', source: look?.source ?? null };
    };
    const feeders: FeederLine[] = [];
    t.feeders.forEach((f, course) => {
      const hit = feeders.find((l, i) => sameFeeder(t.feeders[l.courses[0]!]!, f) && i >= 0);
      if (hit) {
        hit.courses.push(course);
        return;
      }
      feeders.push({
        letter: String.fromCharCode(65 + (feeders.length % 26)),
        courses: [course],
        ground: yarnLine(f.ground),
        plated: f.plated ? { ...yarnLine(f.plated.yarn), draft: f.plated.draft } : null,
      });
    });
    return {
      texture: t,
      repeatMm: repeatSizeMm(t),
      stitchesPerCm2: stitchesPerCm2(t),
      gsm,
      yarnPerRepeat: perRepeat,
      feeders,
      indexHex: index[t.id] ?? '#999999',
      problems,
    };
  });
}

/** The body-map summary of the pack's panels: stitches per texture, grams per yarn, content labels. */
export function packSummary(data: PackData): BodyMapSummary {
  return summariseBodyMap({
    panels: data.panels,
    textures: new Map(data.textures.map((t) => [t.id, t])),
    yarns: data.yarns,
    gauge: data.style.machine.gauge,
  });
}

export interface SizeConsumption {
  size: string;
  /** Stitch-count factor against the base size; null when the size is not graded. */
  factor: number | null;
  /** Grams per yarn id for one garment: knitted (waste included) and gross (with allowance). */
  yarns: Record<string, { knittedGrams: number; keptGrams: number; grossGrams: number }>;
}

/**
 * Consumption per size: the base size from the body map; other sizes scaled by the fit plan's
 * stitch-count factor when it gives one (stitches scale with width × length at the same density),
 * else left ungraded (factor null, no grams).
 */
export function consumptionPerSize(data: PackData, summary: BodyMapSummary): SizeConsumption[] {
  const base = summary.consumption;
  return data.style.sizes.labels.map((size) => {
    const fitSize = data.fit?.sizes.find((s) => s.label === size);
    const factor = size === data.style.sizes.base ? 1 : (fitSize?.consumptionFactor ?? null);
    const yarns: SizeConsumption['yarns'] = {};
    if (base && factor !== null) {
      for (const [id, c] of Object.entries(base.yarns)) {
        yarns[id] = { knittedGrams: c.knittedGrams * factor, keptGrams: c.keptGrams * factor, grossGrams: c.grossGrams * factor };
      }
    }
    return { size, factor, yarns };
  });
}

/** Needle facts of the machine: the cylinder's needles (circular) or the bed's (flat). */
export function machineNeedles(m: PackMachine): number | null {
  if (m.kind === 'circular' && m.diameterIn) return cylinderNeedles(m.diameterIn, m.gauge, m.needleMultiple ?? 1);
  if (m.kind === 'flat' && m.bedNeedles) return m.bedNeedles;
  return null;
}

/** Relaxed width of a panel, cm, at its base texture's wales per cm (a tube's half-width for body panels). */
export function panelWidthCm(panel: Panel, textures: readonly PackTexture[]): number | null {
  const t = textures.find((x) => x.id === panel.baseTextureId);
  if (!t) return null;
  return tubeHalfWidthCm(panel.widthNeedles * 2, t.density.walesPerCm);
}

/** Relaxed length of a panel, cm, at its base texture's courses per cm. */
export function panelLengthCm(panel: Panel, textures: readonly PackTexture[]): number | null {
  const t = textures.find((x) => x.id === panel.baseTextureId);
  return t ? panel.heightCourses / t.density.coursesPerCm : null;
}

/** A colour standard's preview hex (screen only, not a standard). */
export function standardHex(s: PackColourStandard): string {
  return labToSrgbHex(s.lab);
}

/** The standards the yarns themselves bring: dope-dyed and yarn-dyed yarns used by the pack. */
export function yarnColourStandards(data: PackData): PackColourStandard[] {
  return data.yarns.flatMap((y): PackColourStandard[] =>
    y.colour.state === 'dyeable' ? [] : [{ name: y.name, lab: y.colour.lab, yarnIds: [y.id], source: y.colour.state }],
  );
}
