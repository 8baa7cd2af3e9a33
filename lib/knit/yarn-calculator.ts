/**
 * The yarn calculator of a style ("Yarns & content"): from the saved body map, per texture the
 * stitches inside and outside the cut lines and the metres and grams of each yarn; per size the grams
 * of each yarn per garment with the waste allowance; the order for a run; the fibre content and its
 * EU and US labels; the care-label draft. Everything comes from `summariseBodyMap` and the core's
 * consumption, content and care functions; nothing is computed twice.
 *
 * Sizes. The body map is drawn at the base size. Another size's stitches are the base size's scaled,
 * panel by panel, by that size's width ratio × length ratio to the base size, read from the graded
 * size spec (at the same density, stitches grow with the area: product design §5 and §10). The yarn
 * per stitch stays the base size's. Without a graded spec a size is given the base size's grams and
 * marked so.
 */
import type { PointKey } from '@/lib/fit/points';
import { careAdvice, type CareAdvice } from './care';
import { consumptionBySize, keptYarnGrams, orderQuantities, type GarmentConsumption, type PanelStitches, type YarnOrder } from './consumption';
import { fibreMasses, type ContentLabel, type ContentMethod, type FibreShares } from './content';
import type { FibreId } from './fibres';
import type { GarmentKind } from './outline';
import type { Panel, PanelKind } from './panel';
import { summariseBodyMap, type BodyMapSummary, type SummaryInput } from './summary';
import { stitchesPerRepeat, yarnPerRepeat, type Texture } from './texture';
import type { Yarn } from './yarn';

/** Graded values of the size spec: point of measure → size → cm (lib/fit `resolveValues`). */
export type GradedPoints = Readonly<Partial<Record<PointKey, Readonly<Record<string, number | null>>>>>;

/** The default waste allowance: 5 % on the knitted grams. Common practice, no published source. */
export const defaultWasteAllowance = 0.05;

// ---------------------------------------------------------------------------------------------
// Grading panels

type Candidates = readonly (readonly PointKey[])[];

const isBottom = (g: GarmentKind) => g === 'legging' || g === 'shorts';

/**
 * The points of measure that grade a panel's width and its length, best first; a candidate of
 * several points is their sum (a leg's length is inseam + rise). Tops: body panels by the chest
 * half-width (else bottom, else waist) and the body length from HPS; sleeves by the armhole (else the
 * chest) and the sleeve length. Bottoms: by the hip half-width (else thigh, else waist) and the
 * inseam + rise. The choice is common practice, no published source.
 */
export function gradePointsFor(garment: GarmentKind, kind: PanelKind): { width: Candidates; length: Candidates } {
  if (isBottom(garment) || kind === 'leg-left' || kind === 'leg-right') {
    return { width: [['hip-half'], ['thigh-half'], ['waist-half']], length: [['inseam', 'rise'], ['inseam'], ['rise']] };
  }
  if (kind === 'sleeve-left' || kind === 'sleeve-right') {
    return { width: [['armhole'], ['chest-half']], length: [['sleeve-length']] };
  }
  return { width: [['chest-half'], ['bottom-half'], ['waist-half']], length: [['body-length-hps']] };
}

export interface PanelGrade {
  panelId: string;
  kind: PanelKind;
  /** Points used for the width and the length ratios (empty when none had values). */
  widthPoints: PointKey[];
  lengthPoints: PointKey[];
  widthRatio: number | null;
  lengthRatio: number | null;
  /** Stitch factor: width ratio × length ratio (a missing one counts as 1); null when neither is known. */
  factor: number | null;
}

function ratioOf(values: GradedPoints, candidates: Candidates, base: string, size: string): { points: PointKey[]; ratio: number } | null {
  for (const points of candidates) {
    let b = 0;
    let s = 0;
    let ok = true;
    for (const p of points) {
      const vb = values[p]?.[base];
      const vs = values[p]?.[size];
      if (vb === null || vb === undefined || vs === null || vs === undefined || !(vb > 0) || !(vs > 0)) { ok = false; break; }
      b += vb;
      s += vs;
    }
    if (ok && b > 0) return { points: [...points], ratio: s / b };
  }
  return null;
}

/**
 * Per panel, the stitch factor of `size` against `baseSize`: width ratio × length ratio from the
 * graded values (stitches at one density scale with the area). The base size is 1 for every panel.
 */
export function panelGrades(input: {
  garment: GarmentKind;
  panels: readonly Pick<Panel, 'id' | 'kind'>[];
  baseSize: string;
  size: string;
  values: GradedPoints | null;
}): PanelGrade[] {
  return input.panels.map((p) => {
    if (input.size === input.baseSize) {
      return { panelId: p.id, kind: p.kind, widthPoints: [], lengthPoints: [], widthRatio: 1, lengthRatio: 1, factor: 1 };
    }
    const pts = gradePointsFor(input.garment, p.kind);
    const w = input.values ? ratioOf(input.values, pts.width, input.baseSize, input.size) : null;
    const l = input.values ? ratioOf(input.values, pts.length, input.baseSize, input.size) : null;
    const factor = w || l ? (w?.ratio ?? 1) * (l?.ratio ?? 1) : null;
    return {
      panelId: p.id, kind: p.kind, widthPoints: w?.points ?? [], lengthPoints: l?.points ?? [],
      widthRatio: w?.ratio ?? null, lengthRatio: l?.ratio ?? null, factor,
    };
  });
}

/** A panel's stitch counts scaled by a factor (graded stitches need not be whole). */
export function scaleStitches(stitches: PanelStitches, factor: number): PanelStitches {
  const out: Record<string, { inside: number; outside: number }> = {};
  for (const [id, c] of Object.entries(stitches.stitches)) out[id] = { inside: c.inside * factor, outside: c.outside * factor };
  return { stitches: out };
}

/**
 * One size's stitches per panel: the base size's rasters scaled panel by panel by `panelGrades`.
 * `basis` says how the size's grams are found: `drawn` (the base size: its rasters as they are),
 * `graded` (every panel has a factor: `panels` holds the scaled stitches) or `base-grams` (some
 * panel has none: the size takes the base size's grams, `panels` is null).
 */
export function gradedSizeStitches(input: {
  garment: GarmentKind;
  panels: readonly Pick<Panel, 'id' | 'kind'>[];
  rasters: ReadonlyMap<string, PanelStitches>;
  baseSize: string;
  size: string;
  graded: GradedPoints | null;
}): { basis: SizeBasis; grades: PanelGrade[]; panels: PanelStitches[] | null } {
  const grades = panelGrades({ garment: input.garment, panels: input.panels, baseSize: input.baseSize, size: input.size, values: input.graded });
  const empty: PanelStitches = { stitches: {} };
  if (input.size === input.baseSize) return { basis: 'drawn', grades, panels: input.panels.map((p) => input.rasters.get(p.id) ?? empty) };
  if (grades.length === 0 || grades.some((g) => g.factor === null)) return { basis: 'base-grams', grades, panels: null };
  return { basis: 'graded', grades, panels: input.panels.map((p, i) => scaleStitches(input.rasters.get(p.id) ?? empty, grades[i]?.factor ?? 1)) };
}

// ---------------------------------------------------------------------------------------------
// The calculator

export interface YarnCalculatorInput {
  panels: readonly Panel[];
  textures: ReadonlyMap<string, Texture>;
  yarns: readonly Yarn[];
  /** Needles per inch. */
  gauge: number;
  garment: GarmentKind;
  /** The style's sizes, in order, and the size the body map is drawn at. */
  sizes: readonly string[];
  baseSize: string;
  /** Graded size spec values, or null when there is no graded spec. */
  graded: GradedPoints | null;
  /** Fraction added to the knitted grams (0.05 = 5 %). */
  wasteAllowance: number;
  method: ContentMethod;
  /** Garments per size for the run. */
  garments: Readonly<Record<string, number>>;
  /** Price per kg by yarn id: given for studio accounts only. */
  pricesPerKg?: Readonly<Record<string, number>>;
  /** The style has a heat-applied trim (care: do not iron on it). */
  heatTransfer?: boolean;
  /** The previous calculation's rasters, reused for unchanged panels. */
  previous?: SummaryInput['previous'];
}

export interface TextureYarnFigures {
  yarnId: string;
  /** Yarn drawn off the package for every knitted stitch of the texture (cut-away waste included), m. */
  metres: number;
  /** Mass of that yarn, g. */
  grams: number;
  /** Grams in the stitches kept inside the cut lines. */
  keptGrams: number;
}

export interface TextureFigures {
  textureId: string;
  /** Stitches inside the cut lines (kept) and outside (cut away). */
  inside: number;
  outside: number;
  insideCm2: number;
  outsideCm2: number;
  yarns: TextureYarnFigures[];
}

/** How a size's grams were found. */
export type SizeBasis = 'drawn' | 'graded' | 'base-grams';

export interface SizeFigures {
  size: string;
  basis: SizeBasis;
  /** Per panel stitch factors (1 for the base size). */
  panels: PanelGrade[];
  consumption: GarmentConsumption | null;
  /** Price of the yarn per garment (studio accounts, when every yarn has a price). */
  costPerGarment?: number;
}

export interface OrderFigures {
  garments: Record<string, number>;
  totalGarments: number;
  yarns: Record<string, YarnOrder>;
  /** kg to order, all yarns (each rounded up to 0.1 kg). */
  kg: number;
  /** Yarn price of the order (studio accounts, when every yarn has a price). */
  cost?: number;
}

export interface ContentFigures {
  method: ContentMethod;
  shares: FibreShares;
  /** Grams of each fibre in one garment of the base size (inside the cut lines, as knitted). */
  fibreGrams: Partial<Record<FibreId, number>>;
  labels: { eu: ContentLabel; us: ContentLabel };
}

export interface YarnCalculatorFigures {
  baseSize: string;
  wasteAllowance: number;
  textures: TextureFigures[];
  sizes: SizeFigures[];
  /** In words: how sizes other than the base size were found. */
  grading: { mode: 'graded' | 'partly-graded' | 'base-only'; explanation: string };
  order: OrderFigures | null;
  content: ContentFigures | null;
  care: CareAdvice | null;
  /** Yarns without a price (studio accounts): costs are left out while any is missing. */
  unpricedYarnIds?: string[];
  problems: string[];
}

const pointWords: Record<PointKey, string> = {
  'chest-half': 'chest half-width', 'waist-half': 'waist half-width', 'bottom-half': 'bottom half-width',
  'body-length-hps': 'body length from HPS', 'sleeve-length': 'sleeve length', 'across-shoulder': 'across shoulder',
  armhole: 'armhole', 'hip-half': 'hip half-width', 'thigh-half': 'thigh half-width', 'knee-half': 'knee half-width',
  'calf-half': 'calf half-width', 'ankle-half': 'ankle half-width', inseam: 'inseam', rise: 'rise',
};

const panelWords = (kind: PanelKind) => (kind === 'sleeve-left' || kind === 'sleeve-right' ? 'sleeves' : kind === 'leg-left' || kind === 'leg-right' ? 'legs' : 'body panels');

function explainGrading(sizes: SizeFigures[], baseSize: string): YarnCalculatorFigures['grading'] {
  const others = sizes.filter((s) => s.size !== baseSize);
  if (others.length === 0) return { mode: 'graded', explanation: `The style has one size, ${baseSize}: the figures are the body map as drawn.` };
  const graded = others.filter((s) => s.basis === 'graded');
  if (graded.length === 0) {
    return {
      mode: 'base-only',
      explanation:
        `The body map is drawn at size ${baseSize}. There is no graded size spec yet (Fit section), so the other sizes are shown ` +
        `with size ${baseSize}'s grams and marked ≈. Grade the spec in Fit to scale them.`,
    };
  }
  // Describe the points used, per kind of panel, from the first graded size.
  const used = new Map<string, string>();
  for (const p of graded[0]!.panels) {
    const words = panelWords(p.kind);
    if (used.has(words)) continue;
    const w = p.widthPoints.map((k) => pointWords[k]).join(' + ');
    const l = p.lengthPoints.map((k) => pointWords[k]).join(' + ');
    used.set(words, `${words}: ${w || 'width not graded'} × ${l || 'length not graded'}`);
  }
  const explanation =
    `The body map is drawn at size ${baseSize}. Each other size scales every panel's stitches by its width ratio × length ratio ` +
    `to ${baseSize} from the graded size spec (${[...used.values()].join('; ')}), at the same density and yarn per stitch.` +
    (graded.length < others.length ? ` ${others.filter((s) => s.basis !== 'graded').map((s) => s.size).join(', ')}: no graded values, shown with size ${baseSize}'s grams (≈).` : '');
  return { mode: graded.length < others.length ? 'partly-graded' : 'graded', explanation };
}

/**
 * Computes the calculator's figures and returns them with the rasters (kept apart: the figures are
 * plain data for the API; the rasters can be passed back as `previous` to reuse unchanged panels).
 */
export function yarnCalculator(input: YarnCalculatorInput): { figures: YarnCalculatorFigures; summary: BodyMapSummary } {
  if (!(input.wasteAllowance >= 0 && input.wasteAllowance <= 1)) throw new RangeError('The waste allowance is a fraction between 0 and 1.');
  const summary = summariseBodyMap({
    panels: input.panels,
    textures: input.textures,
    yarns: input.yarns,
    gauge: input.gauge,
    wasteAllowance: input.wasteAllowance,
    method: input.method,
    ...(input.previous ? { previous: input.previous } : {}),
  });
  const problems = [...summary.problems];

  // Per texture: each yarn's metres and grams over all the texture's knitted stitches.
  const textures: TextureFigures[] = summary.textures.map((t) => {
    const texture = input.textures.get(t.textureId);
    const yarns: TextureYarnFigures[] = [];
    if (texture && problems.length === 0) {
      try {
        const perRepeat = yarnPerRepeat(texture, input.yarns, input.gauge);
        const cells = stitchesPerRepeat(texture);
        for (const [yarnId, use] of Object.entries(perRepeat)) {
          const knitted = t.inside + t.outside;
          yarns.push({
            yarnId,
            metres: (use.metres / cells) * knitted,
            grams: (use.grams / cells) * knitted,
            keptGrams: (use.grams / cells) * t.inside,
          });
        }
      } catch (err) {
        problems.push(err instanceof Error ? err.message : String(err));
      }
    }
    return { textureId: t.textureId, inside: t.inside, outside: t.outside, insideCm2: t.insideCm2, outsideCm2: t.outsideCm2, yarns };
  });

  // Per size.
  const base = summary.consumption;
  const sizes: SizeFigures[] = [];
  const scaledSizes: { size: string; panels: PanelStitches[] }[] = [];
  for (const size of input.sizes) {
    const g = gradedSizeStitches({ garment: input.garment, panels: input.panels, rasters: summary.rasters, baseSize: input.baseSize, size, graded: input.graded });
    sizes.push({ size, basis: g.basis, panels: g.grades, consumption: null });
    if (g.basis === 'graded' && g.panels) scaledSizes.push({ size, panels: g.panels });
  }
  if (base) {
    const graded = scaledSizes.length
      ? consumptionBySize({ sizes: scaledSizes, textures: input.textures, yarns: input.yarns, gauge: input.gauge, wasteAllowance: input.wasteAllowance })
      : {};
    for (const s of sizes) s.consumption = s.basis === 'graded' ? (graded[s.size] ?? null) : base;
  }

  // The run.
  let order: OrderFigures | null = null;
  if (base) {
    const bySize: Record<string, GarmentConsumption> = {};
    for (const s of sizes) if (s.consumption) bySize[s.size] = s.consumption;
    const garments: Record<string, number> = {};
    for (const s of input.sizes) garments[s] = input.garments[s] ?? 0;
    const q = orderQuantities({ bySize, garments });
    order = { garments, totalGarments: Object.values(garments).reduce((a, b) => a + b, 0), yarns: q.yarns, kg: q.kg };
  }

  // Costs, for studio accounts only (prices are not given to anyone else).
  let unpricedYarnIds: string[] | undefined;
  if (input.pricesPerKg && base) {
    const prices = input.pricesPerKg;
    unpricedYarnIds = Object.keys(base.yarns).filter((id) => !(prices[id] !== undefined && prices[id] >= 0));
    if (unpricedYarnIds.length === 0) {
      for (const s of sizes) {
        if (!s.consumption) continue;
        s.costPerGarment = Object.entries(s.consumption.yarns).reduce((sum, [id, y]) => sum + (y.grossGrams / 1000) * (prices[id] ?? 0), 0);
      }
      if (order) order.cost = Object.entries(order.yarns).reduce((sum, [id, y]) => sum + y.kg * (prices[id] ?? 0), 0);
    }
  }

  let content: ContentFigures | null = null;
  let care: CareAdvice | null = null;
  if (summary.content && summary.labels && base) {
    content = {
      method: input.method,
      shares: summary.content,
      fibreGrams: fibreMasses({ yarnGrams: keptYarnGrams(base), yarns: input.yarns }),
      labels: summary.labels,
    };
    care = careAdvice(summary.content, { heatTransfer: input.heatTransfer ?? false });
  }

  const figures: YarnCalculatorFigures = {
    baseSize: input.baseSize,
    wasteAllowance: input.wasteAllowance,
    textures,
    sizes,
    grading: explainGrading(sizes, input.baseSize),
    order,
    content,
    care,
    problems,
  };
  if (unpricedYarnIds) figures.unpricedYarnIds = unpricedYarnIds;
  return { figures, summary };
}

// ---------------------------------------------------------------------------------------------
// The order as a table (for the CSV)

export interface OrderYarnInfo {
  id: string;
  name: string;
  supplierRef: string;
  dtex: number;
  pricePerKg?: number | null;
}

/**
 * The order table, one row per yarn: grams per garment per size (waste allowance included), the
 * garments per size, kg for the run per size, the run's kg and the kg to order (rounded up to
 * 0.1 kg); with prices, the price per kg and the order's yarn cost. Header first.
 */
export function orderTable(figures: YarnCalculatorFigures, yarns: readonly OrderYarnInfo[], opts: { withPrices?: boolean } = {}): (string | number | null)[][] {
  const sizes = figures.sizes;
  const order = figures.order;
  const header: (string | number | null)[] = [
    'yarn', 'supplier_ref', 'dtex',
    ...sizes.map((s) => `g_per_garment_${s.size}${s.basis === 'base-grams' ? '_approx' : ''}`),
    ...sizes.map((s) => `garments_${s.size}`),
    ...sizes.map((s) => `kg_${s.size}`),
    'kg_run', 'kg_order', 'waste_allowance_pct',
    ...(opts.withPrices ? ['price_per_kg', 'order_cost'] : []),
  ];
  const used = new Set(sizes.flatMap((s) => Object.keys(s.consumption?.yarns ?? {})));
  const rows = yarns
    .filter((y) => used.has(y.id))
    .map((y) => {
      const o = order?.yarns[y.id];
      const price = y.pricePerKg ?? null;
      return [
        y.name, y.supplierRef, y.dtex,
        ...sizes.map((s) => round(s.consumption?.yarns[y.id]?.grossGrams, 2)),
        ...sizes.map((s) => order?.garments[s.size] ?? 0),
        ...sizes.map((s) => round(o?.gramsBySize[s.size] !== undefined ? (o.gramsBySize[s.size] as number) / 1000 : 0, 3)),
        round(o ? o.grams / 1000 : 0, 3),
        o?.kg ?? 0,
        round(figures.wasteAllowance * 100, 2),
        ...(opts.withPrices ? [price, price === null || !o ? null : round(o.kg * price, 2)] : []),
      ];
    });
  return [header, ...rows];
}

function round(v: number | undefined, digits: number): number | null {
  return v === undefined ? null : Number(v.toFixed(digits));
}
