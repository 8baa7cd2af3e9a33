/**
 * Knit structures (textures): a stitch repeat, its feeders, relaxed density and loop lengths, and what
 * they spend in yarn.
 *
 * Repeat coordinates: `cells[course][needle]`, course 0 first knitted; the repeat tiles in both
 * directions, so floats and tuck stacks wrap around its edges.
 */
import { fibres } from './fibres';
import { requireYarn, yarnMap, type Yarn, type YarnLookup } from './yarn';

export const stitchActions = ['knit', 'tuck', 'miss'] as const;
export type StitchAction = (typeof stitchActions)[number];

/** What one feeder carries for one course of the repeat. */
export interface Feeder {
  /** Ground yarn id. */
  ground: string;
  /** A yarn plated with the ground (typically bare elastane), fed at a draft (e.g. 2.8). */
  plated?: { yarn: string; draft: number };
}

export interface StitchRepeat {
  /** Repeat width, needles. */
  needles: number;
  /** Repeat height, courses. */
  courses: number;
  /** `cells[course][needle]`. */
  cells: StitchAction[][];
}

/** One point of a fabric force–extension test: extension as a fraction, tension in N per cm width. */
export interface ForceExtensionPoint {
  extension: number;
  tensionNPerCm: number;
}

export interface Texture {
  id: string;
  name: string;
  repeat: StitchRepeat;
  /** One feeder per course of the repeat. */
  feeders: Feeder[];
  /** Relaxed fabric density. */
  density: { walesPerCm: number; coursesPerCm: number };
  /** Yarn length per loop by action, mm (a miss spends a float of about one needle pitch). */
  loopMm: { knit: number; tuck: number };
  /** Optional force–extension points from a fabric test, along the girth. */
  forceExtension?: readonly ForceExtensionPoint[];
  notes?: string;
}

/** Needle pitch, mm: 25.4 ÷ gauge (needles per inch). Source: references.md §7(b), "t = 25.4 / E". */
export function needlePitchMm(gauge: number): number {
  if (!(gauge > 0)) throw new RangeError(`Gauge must be positive (got ${gauge}).`);
  return 25.4 / gauge;
}

/** Problems with a texture record, as sentences; empty when valid. */
export function validateTexture(texture: Texture): string[] {
  const p: string[] = [];
  const { needles, courses, cells } = texture.repeat;
  if (!Number.isInteger(needles) || needles < 1) p.push(`Texture ${texture.name}: repeat width must be a whole number of needles ≥ 1.`);
  if (!Number.isInteger(courses) || courses < 1) p.push(`Texture ${texture.name}: repeat height must be a whole number of courses ≥ 1.`);
  if (cells.length !== courses) p.push(`Texture ${texture.name}: the chart has ${cells.length} courses, the repeat says ${courses}.`);
  cells.forEach((row, c) => {
    if (row.length !== needles) p.push(`Texture ${texture.name}: course ${c} has ${row.length} cells, the repeat says ${needles}.`);
  });
  if (texture.feeders.length !== courses) p.push(`Texture ${texture.name}: needs one feeder per course (${courses}), has ${texture.feeders.length}.`);
  texture.feeders.forEach((f, c) => {
    if (f.plated && !(f.plated.draft >= 1)) p.push(`Texture ${texture.name}: course ${c} plated draft must be ≥ 1.`);
  });
  if (!(texture.density.walesPerCm > 0) || !(texture.density.coursesPerCm > 0)) p.push(`Texture ${texture.name}: density must be positive.`);
  if (!(texture.loopMm.knit > 0) || !(texture.loopMm.tuck > 0)) p.push(`Texture ${texture.name}: loop lengths must be positive.`);
  return p;
}

function cell(texture: Texture, course: number, needle: number): StitchAction {
  const row = texture.repeat.cells[course];
  const a = row?.[needle];
  if (a === undefined) throw new RangeError(`Texture ${texture.name}: no cell at course ${course}, needle ${needle}.`);
  return a;
}

function feederOf(texture: Texture, course: number): Feeder {
  const f = texture.feeders[course];
  if (!f) throw new RangeError(`Texture ${texture.name}: no feeder for course ${course}.`);
  return f;
}

/** Yarn length spent by one needle's action, mm. */
export function actionLengthMm(texture: Texture, action: StitchAction, gauge: number): number {
  switch (action) {
    case 'knit':
      return texture.loopMm.knit;
    case 'tuck':
      return texture.loopMm.tuck;
    case 'miss':
      return needlePitchMm(gauge);
  }
}

export interface YarnUse {
  /** Length drawn off the package, m (fabric length ÷ draft for a drafted yarn). */
  metres: number;
  /** Length laid in the loops of the fabric, m. */
  loopMetres: number;
  /** Mass, g = metres × tex / 1000. */
  grams: number;
}

/**
 * Yarn per repeat, per yarn id. Each course's feeder yarns are spent on every needle by the length of
 * that needle's action (knit and tuck loop lengths; a miss spends a float of one needle pitch,
 * 25.4 / gauge mm). A plated yarn drafted by d lays the same length in the loops but draws only
 * 1/d of it off its package, so it contributes dtex ÷ d per unit of fabric yarn length.
 * grams = metres × tex / 1000. Source: product design §2–3; pitch from references.md §7(b).
 * @param gauge needles per inch.
 */
export function yarnPerRepeat(texture: Texture, yarns: YarnLookup, gauge: number): Record<string, YarnUse> {
  const byId = yarnMap(yarns);
  const pitch = needlePitchMm(gauge);
  const out: Record<string, YarnUse> = {};
  const add = (yarn: Yarn, loopMm: number, draft: number) => {
    const use = (out[yarn.id] ??= { metres: 0, loopMetres: 0, grams: 0 });
    const loopMetres = loopMm / 1000;
    const metres = loopMetres / draft;
    use.loopMetres += loopMetres;
    use.metres += metres;
    use.grams += (metres * yarn.dtex) / 10 / 1000;
  };
  for (let c = 0; c < texture.repeat.courses; c++) {
    const feeder = feederOf(texture, c);
    let courseMm = 0;
    for (let n = 0; n < texture.repeat.needles; n++) {
      const a = cell(texture, c, n);
      courseMm += a === 'knit' ? texture.loopMm.knit : a === 'tuck' ? texture.loopMm.tuck : pitch;
    }
    add(requireYarn(byId, feeder.ground), courseMm, 1);
    if (feeder.plated) add(requireYarn(byId, feeder.plated.yarn), courseMm, feeder.plated.draft);
  }
  return out;
}

/** Stitches (cells) in one repeat. */
export function stitchesPerRepeat(texture: Texture): number {
  return texture.repeat.needles * texture.repeat.courses;
}

/**
 * Grams per stitch per yarn id: yarn per repeat ÷ cells in the repeat (each cell a needle × course).
 * This is the factor raster stitch counts are multiplied by.
 */
export function gramsPerStitch(texture: Texture, yarns: YarnLookup, gauge: number): Record<string, number> {
  const perRepeat = yarnPerRepeat(texture, yarns, gauge);
  const cells = stitchesPerRepeat(texture);
  const out: Record<string, number> = {};
  for (const [id, use] of Object.entries(perRepeat)) out[id] = use.grams / cells;
  return out;
}

/** Stitches per cm² = wales/cm × courses/cm. Source: textile technical handbook (2023) p.147 (j). */
export function stitchesPerCm2(texture: Texture): number {
  return texture.density.walesPerCm * texture.density.coursesPerCm;
}

/**
 * Areal density, g/m²: stitches per cm² × (Σ over the repeat of loop length (mm) × tex) / cells / 100.
 * Source: product design formula 4; Textile Technical Handbook (2023), "Knitting – General formulae", p.147 (c):
 * "Stitch density (loops/sq.cm) x stitch length(mm) x Count (tex) / 100".
 */
export function arealDensity(texture: Texture, yarns: YarnLookup, gauge: number): number {
  const perStitch = gramsPerStitch(texture, yarns, gauge);
  let gramsPerCell = 0;
  for (const g of Object.values(perStitch)) gramsPerCell += g;
  return gramsPerCell * stitchesPerCm2(texture) * 10_000;
}

/** Areal density of plain fabric: S (loops/cm²) × l (mm) × tex / 100, g/m². Source: textile technical handbook (2023) p.147 (c). */
export function gsmFromStitchDensity(stitchesPerCm2: number, loopMm: number, tex: number): number {
  return (stitchesPerCm2 * loopMm * tex) / 100;
}

/**
 * Tightness (cover) factor K = √tex / l, with l the loop length in mm (tex^½ mm⁻¹).
 * Source: textile technical handbook (2023) p.147 (g): "Cover factor = √linear density (tex) / l".
 */
export function tightnessFactor(tex: number, loopMm: number): number {
  if (!(tex > 0) || !(loopMm > 0)) throw new RangeError('tex and loop length must be positive');
  return Math.sqrt(tex) / loopMm;
}

/**
 * Mean tightness factor of a texture over the courses of its repeat: for each course, √(tex of the
 * feeder's yarns together, a plated yarn at dtex ÷ draft) ÷ knit loop length (mm).
 */
export function textureTightness(texture: Texture, yarns: YarnLookup): number {
  const byId = yarnMap(yarns);
  let sum = 0;
  for (let c = 0; c < texture.repeat.courses; c++) {
    const f = feederOf(texture, c);
    let dtex = requireYarn(byId, f.ground).dtex;
    if (f.plated) dtex += requireYarn(byId, f.plated.yarn).dtex / f.plated.draft;
    sum += tightnessFactor(dtex / 10, texture.loopMm.knit);
  }
  return sum / texture.repeat.courses;
}

export interface FloatRun {
  /** Needles floated over in a row. */
  needles: number;
  /** Float length, mm (needles × pitch, when a gauge is given). */
  mm?: number;
  course: number;
  /** First missed needle of the run. */
  startNeedle: number;
  /** The whole course misses: the yarn would float across the full width of the fabric. */
  unbounded: boolean;
}

/**
 * The longest float: the most consecutive misses in one course, wrapping across the repeat edge
 * (the repeat tiles). Returns undefined when no course misses.
 * @param gauge optional, needles per inch, to give the float in mm.
 */
export function longestFloat(texture: Texture, gauge?: number): FloatRun | undefined {
  const W = texture.repeat.needles;
  let best: FloatRun | undefined;
  for (let c = 0; c < texture.repeat.courses; c++) {
    let misses = 0;
    for (let n = 0; n < W; n++) if (cell(texture, c, n) === 'miss') misses++;
    if (misses === 0) continue;
    let run: FloatRun;
    if (misses === W) {
      run = { needles: W, course: c, startNeedle: 0, unbounded: true };
    } else {
      // Start scanning just after a needle that does not miss, so a wrapping run is seen whole.
      let start = 0;
      while (cell(texture, c, start) === 'miss') start++;
      let len = 0;
      let runStart = 0;
      run = { needles: 0, course: c, startNeedle: 0, unbounded: false };
      for (let k = 1; k <= W; k++) {
        const n = (start + k) % W;
        if (cell(texture, c, n) === 'miss') {
          if (len === 0) runStart = n;
          len++;
          if (len > run.needles) run = { needles: len, course: c, startNeedle: runStart, unbounded: false };
        } else len = 0;
      }
    }
    if (!best || run.needles > best.needles || (run.unbounded && !best.unbounded)) best = run;
  }
  if (best && gauge !== undefined) best.mm = best.needles * needlePitchMm(gauge);
  return best;
}

export interface TuckStack {
  /** Tuck loops held on the needle at once. */
  tucks: number;
  needle: number;
  /** Course of the first tuck of the stack. */
  startCourse: number;
  /** The needle tucks but never knits in the repeat: the loops would pile up without end. */
  unbounded: boolean;
}

/**
 * The tallest tuck stack: tuck loops accumulated on one needle before it knits again, wrapping across
 * the repeat (consecutive tucks; a miss neither adds a loop nor clears the hook, so tucks either side
 * of a miss add up). Returns undefined when the texture has no tuck.
 */
export function tallestTuckStack(texture: Texture): TuckStack | undefined {
  const H = texture.repeat.courses;
  let best: TuckStack | undefined;
  for (let n = 0; n < texture.repeat.needles; n++) {
    let tucks = 0;
    let knits = 0;
    for (let c = 0; c < H; c++) {
      const a = cell(texture, c, n);
      if (a === 'tuck') tucks++;
      else if (a === 'knit') knits++;
    }
    if (tucks === 0) continue;
    let stack: TuckStack;
    if (knits === 0) {
      stack = { tucks, needle: n, startCourse: 0, unbounded: true };
    } else {
      let start = 0;
      while (cell(texture, start, n) !== 'knit') start++;
      stack = { tucks: 0, needle: n, startCourse: 0, unbounded: false };
      let held = 0;
      let first = 0;
      for (let k = 1; k <= H; k++) {
        const c = (start + k) % H;
        const a = cell(texture, c, n);
        if (a === 'knit') held = 0;
        else if (a === 'tuck') {
          if (held === 0) first = c;
          held++;
          if (held > stack.tucks) stack = { tucks: held, needle: n, startCourse: first, unbounded: false };
        }
      }
    }
    if (!best || (stack.unbounded && !best.unbounded) || (stack.unbounded === best.unbounded && stack.tucks > best.tucks)) {
      best = stack;
    }
  }
  return best;
}

/**
 * Courses of the repeat that lay in no elastane: neither the ground nor the plated yarn has an
 * elastane share, or the course's needles all miss (the yarn is not knitted in).
 * With `anyElastomeric`, elastomultiester and other elastomeric fibres count as well.
 */
export function coursesWithoutElastane(
  texture: Texture,
  yarns: YarnLookup,
  opts: { anyElastomeric?: boolean } = {},
): number[] {
  const byId = yarnMap(yarns);
  const stretchy = (fibre: keyof typeof fibres) =>
    fibre === 'elastane' || (opts.anyElastomeric === true && fibres[fibre].kind === 'elastomeric');
  const hasElastane = (id: string) => requireYarn(byId, id).fibres.some((f) => stretchy(f.fibre) && f.share > 0);
  const out: number[] = [];
  for (let c = 0; c < texture.repeat.courses; c++) {
    const f = feederOf(texture, c);
    const knitsIn = texture.repeat.cells[c]?.some((a) => a !== 'miss') ?? false;
    const elastic = hasElastane(f.ground) || (f.plated !== undefined && hasElastane(f.plated.yarn));
    if (!knitsIn || !elastic) out.push(c);
  }
  return out;
}

/** Distinct yarn ids a texture's feeders use. */
export function textureYarnIds(texture: Texture): string[] {
  const ids = new Set<string>();
  for (const f of texture.feeders) {
    ids.add(f.ground);
    if (f.plated) ids.add(f.plated.yarn);
  }
  return [...ids];
}

/** Repeat size in mm at the texture's relaxed density: needles ÷ wales/cm × 10, courses ÷ courses/cm × 10. */
export function repeatSizeMm(texture: Texture): { widthMm: number; heightMm: number } {
  return {
    widthMm: (texture.repeat.needles / texture.density.walesPerCm) * 10,
    heightMm: (texture.repeat.courses / texture.density.coursesPerCm) * 10,
  };
}
