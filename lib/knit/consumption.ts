/**
 * Yarn consumption: grams per yarn per garment from the stitch raster, per size, and the order
 * quantity for a run.
 *
 * Yarn is spent on every knitted stitch, cut-away waste included; the garment keeps the stitches
 * inside its cut outline (product design, "Panel", and §6).
 */
import type { StitchCount } from './raster';
import { gramsPerStitch, type Texture } from './texture';
import type { YarnLookup } from './yarn';

export type TextureCollection = Readonly<Record<string, Texture>> | readonly Texture[] | ReadonlyMap<string, Texture>;

function textureMap(textures: TextureCollection): ReadonlyMap<string, Texture> {
  if (textures instanceof Map) return textures as ReadonlyMap<string, Texture>;
  if (Array.isArray(textures)) return new Map((textures as readonly Texture[]).map((t) => [t.id, t]));
  return new Map(Object.entries(textures as Readonly<Record<string, Texture>>));
}

/** What consumption needs of a panel raster (a `PanelRaster` is one). */
export interface PanelStitches {
  stitches: Readonly<Record<string, StitchCount>>;
}

export interface YarnConsumption {
  /** Yarn in every knitted stitch, cut-away waste included, g. */
  knittedGrams: number;
  /** Yarn in the stitches kept inside the cut outline, g (the garment's own mass of this yarn). */
  keptGrams: number;
  /** Yarn knitted and cut away, g. */
  cutAwayGrams: number;
  /** Knitted grams with the waste allowance added, g: what to buy per garment. */
  grossGrams: number;
}

export interface GarmentConsumption {
  yarns: Record<string, YarnConsumption>;
  knittedGrams: number;
  keptGrams: number;
  grossGrams: number;
  /** Allowance used, as a fraction of the knitted grams. */
  wasteAllowance: number;
}

/**
 * The waste allowance (fraction added on top of the net yarn) that covers a process loss given as a
 * fraction of the yarn put in: a = p / (1 − p). Then net × (1 + a) = net / (1 − p), the form of
 * references.md §7(f) ("yarn mass = fabric mass / (1 − process loss fraction)").
 */
export function allowanceForLoss(lossFraction: number): number {
  if (!(lossFraction >= 0 && lossFraction < 1)) throw new RangeError('A loss fraction lies in [0, 1).');
  return lossFraction / (1 - lossFraction);
}

/**
 * Grams per yarn for one garment: for each panel and texture, stitches × grams per stitch of each of
 * the texture's yarns (`gramsPerStitch`, product design §3 and §6). Knitted grams count every
 * knitted stitch (inside + outside the cut outline); kept grams only those inside. Gross grams =
 * knitted × (1 + wasteAllowance).
 * @param gauge needles per inch (sets the float length of a miss).
 * @param wasteAllowance fraction added on top of the knitted grams (0.05 = 5 %); see `allowanceForLoss`.
 */
export function garmentConsumption(input: {
  panels: readonly PanelStitches[];
  textures: TextureCollection;
  yarns: YarnLookup;
  gauge: number;
  wasteAllowance?: number;
}): GarmentConsumption {
  const wasteAllowance = input.wasteAllowance ?? 0;
  if (!(wasteAllowance >= 0) || !Number.isFinite(wasteAllowance)) {
    throw new RangeError(`The waste allowance must be a fraction ≥ 0 (got ${wasteAllowance}).`);
  }
  const textures = textureMap(input.textures);
  const perStitchCache = new Map<string, Record<string, number>>();
  const perStitch = (id: string): Record<string, number> => {
    let g = perStitchCache.get(id);
    if (!g) {
      const texture = textures.get(id);
      if (!texture) throw new Error(`Unknown texture "${id}".`);
      g = gramsPerStitch(texture, input.yarns, input.gauge);
      perStitchCache.set(id, g);
    }
    return g;
  };
  const yarns: Record<string, YarnConsumption> = {};
  for (const panel of input.panels) {
    for (const [textureId, count] of Object.entries(panel.stitches)) {
      if (count.inside + count.outside === 0) continue;
      for (const [yarnId, grams] of Object.entries(perStitch(textureId))) {
        const y = (yarns[yarnId] ??= { knittedGrams: 0, keptGrams: 0, cutAwayGrams: 0, grossGrams: 0 });
        y.keptGrams += count.inside * grams;
        y.cutAwayGrams += count.outside * grams;
      }
    }
  }
  let knittedGrams = 0;
  let keptGrams = 0;
  for (const y of Object.values(yarns)) {
    y.knittedGrams = y.keptGrams + y.cutAwayGrams;
    y.grossGrams = y.knittedGrams * (1 + wasteAllowance);
    knittedGrams += y.knittedGrams;
    keptGrams += y.keptGrams;
  }
  return { yarns, knittedGrams, keptGrams, grossGrams: knittedGrams * (1 + wasteAllowance), wasteAllowance };
}

/** The garment's kept grams per yarn (inside the cut outline): the input of the content calculation. */
export function keptYarnGrams(consumption: GarmentConsumption): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [id, y] of Object.entries(consumption.yarns)) out[id] = y.keptGrams;
  return out;
}

/** `garmentConsumption` for each size, each with its own panels (their rasters). */
export function consumptionBySize(input: {
  sizes: readonly { size: string; panels: readonly PanelStitches[] }[];
  textures: TextureCollection;
  yarns: YarnLookup;
  gauge: number;
  wasteAllowance?: number;
}): Record<string, GarmentConsumption> {
  const out: Record<string, GarmentConsumption> = {};
  for (const { size, panels } of input.sizes) {
    if (out[size]) throw new Error(`Size "${size}" is given twice.`);
    const c: Parameters<typeof garmentConsumption>[0] = {
      panels,
      textures: input.textures,
      yarns: input.yarns,
      gauge: input.gauge,
    };
    if (input.wasteAllowance !== undefined) c.wasteAllowance = input.wasteAllowance;
    out[size] = garmentConsumption(c);
  }
  return out;
}

export interface YarnOrder {
  /** Gross grams per size for the whole run of that size. */
  gramsBySize: Record<string, number>;
  /** Gross grams for the run, all sizes. */
  grams: number;
  /** What to order, kg: grams ÷ 1000 rounded up to `roundUpToKg`. */
  kg: number;
}

/**
 * Order quantity per yarn for a run of N garments per size: Σ over sizes of gross grams per garment ×
 * garments, in kg rounded up to a whole `roundUpToKg` (default 0.1 kg; use the cone or bag weight to
 * order whole packages).
 */
export function orderQuantities(input: {
  bySize: Readonly<Record<string, GarmentConsumption>>;
  garments: Readonly<Record<string, number>>;
  roundUpToKg?: number;
}): { yarns: Record<string, YarnOrder>; kg: number } {
  const step = input.roundUpToKg ?? 0.1;
  if (!(step > 0)) throw new RangeError('roundUpToKg must be positive.');
  const yarns: Record<string, YarnOrder> = {};
  for (const [size, n] of Object.entries(input.garments)) {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`Garments for size ${size} must be a whole number ≥ 0 (got ${n}).`);
    if (n === 0) continue;
    const c = input.bySize[size];
    if (!c) throw new Error(`No consumption for size "${size}".`);
    for (const [yarnId, y] of Object.entries(c.yarns)) {
      const o = (yarns[yarnId] ??= { gramsBySize: {}, grams: 0, kg: 0 });
      const g = y.grossGrams * n;
      o.gramsBySize[size] = (o.gramsBySize[size] ?? 0) + g;
      o.grams += g;
    }
  }
  let kg = 0;
  for (const o of Object.values(yarns)) {
    o.kg = roundUpTo(o.grams / 1000, step);
    kg += o.kg;
  }
  return { yarns, kg: Number(kg.toFixed(9)) };
}

/** Rounds up to a multiple of `step`, ignoring floating-point dust just above a multiple. */
function roundUpTo(value: number, step: number): number {
  const q = value / step;
  const n = Math.ceil(q - 1e-9);
  return Number((n * step).toFixed(9));
}
