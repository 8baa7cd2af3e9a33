/**
 * The texture renderer: a stitch repeat drawn as knitted loops seen on the technical face, at true
 * relative scale, as a device-independent drawing list. The body map, the tile PNG and the PDF swatch
 * sheet all draw the same list through their own adapters (`render-canvas.ts`, `render-svg.ts`).
 *
 * Tile space: pixels, x to the right, y down. Tile needle 0 is the left column; tile course 0 is the
 * bottom row (course 0 of the repeat is knitted first and the fabric grows upwards, so the loops'
 * heads point up and their legs close into a V at the bottom). A needle is `pxPerCm / walesPerCm`
 * px wide and a course `pxPerCm / coursesPerCm` px tall.
 *
 * How a stitch is drawn (the yarn path of each course, in three depths):
 * - knit: a loop whose legs pass in front of the head of the loop below and close into a V inside
 *   it; its head is held by the legs of the next loop knitted on the needle. When the needle tucks
 *   or misses in the courses above, the loop is held and drawn elongated (and narrower) up to the
 *   course where the needle knits again.
 * - tuck: an open arc, wider than a loop and without legs through the loop below, around the head of
 *   the held loop (which it shares); the next loop on the needle is drawn through both.
 * - miss: a float, a flat run of yarn at the sinker level passing behind the held loop, muted.
 * Sinker loops and floats are drawn first (the back), then course by course upwards the tuck arcs and
 * the loops, so each loop's legs lie over the heads of the loop and the tucks below.
 *
 * Whole repeats only, and every stitch whose yarn reaches into the tile is drawn from its wrapped
 * repeat position (the adapters clip to the tile), so the tile repeats with no seam.
 */
import { labToSrgbHex, srgbHexToLab } from '@/lib/colour/convert';
import type { Lab } from '@/lib/colour/lab';
import { fibres } from './fibres';
import type { StitchAction, Texture } from './texture';
import { yarnMap, type Yarn, type YarnLookup } from './yarn';

// ---------------------------------------------------------------------------------------------
// The drawing list

/** One command of a path, in the item's local pixels (the canvas path API's names and arguments). */
export type PathCommand =
  | { op: 'moveTo'; x: number; y: number }
  | { op: 'lineTo'; x: number; y: number }
  | { op: 'bezierCurveTo'; cp1x: number; cp1y: number; cp2x: number; cp2y: number; x: number; y: number }
  | { op: 'closePath' };

/** A path; items with the same geometry share one array (compare by reference). */
export type Path = readonly PathCommand[];

/**
 * One pass of paint over an item's path. A stroke is drawn with round caps and joins. Passes are
 * applied in order (shadow, outline, body, highlight).
 */
export interface Paint {
  /** Stroke colour, `#rrggbb`. */
  stroke?: string;
  /** Fill colour, `#rrggbb`. */
  fill?: string;
  /** Stroke width, tile px. */
  width?: number;
  /** Opacity, 0–1; 1 when absent. */
  alpha?: number;
  /** Offset of this pass from the item's position, tile px (a shadow or a highlight). */
  dx?: number;
  dy?: number;
}

export const drawItemKinds = [
  'background',
  /** A knitted loop, one course tall. */
  'knit-loop',
  /** A knitted loop held over tucks or misses above it: elongated to the needle's next knit. */
  'held-loop',
  /** The open arc of a tuck, behind the held loop. */
  'tuck-arc',
  /** A missed needle: the yarn floats behind it. */
  'float',
  /** The feet of a loop and the sinker loops between wales, at the back. */
  'sinker',
  /** A plated yarn along the inner edge of a loop, arc, float or sinker. */
  'plating',
] as const;
export type DrawItemKind = (typeof drawItemKinds)[number];

export interface DrawItem {
  kind: DrawItemKind;
  /** Geometry in local px; shared between items of the same shape. */
  path: Path;
  /** Tile px of the path's local origin (the top-left corner of the stitch's cell). */
  x: number;
  y: number;
  paints: readonly Paint[];
  /** Tile needle of the stitch (−1 or the tile width for the wrapped neighbours drawn at the edges). */
  needle: number;
  /** Tile course of the stitch, 0 at the bottom row (negative below the tile). */
  course: number;
}

export interface TileDrawing {
  /** Tile size, px: repeatsX × needles ÷ walesPerCm × pxPerCm, and likewise by courses. */
  widthPx: number;
  heightPx: number;
  /** Tile size at the texture's relaxed density, cm. */
  widthCm: number;
  heightCm: number;
  repeatsX: number;
  repeatsY: number;
  /** Tile size in stitches. */
  needles: number;
  courses: number;
  /** Width of one needle (wale) and height of one course, px. */
  pxPerNeedle: number;
  pxPerCourse: number;
  /** Yarn width drawn, px. */
  yarnPx: number;
  /** In drawing order. The first is the background rectangle unless `background: null`. */
  items: DrawItem[];
}

// ---------------------------------------------------------------------------------------------
// Colours

/** A target colour for a group of yarns (CIELAB D65/10°), as a colourway's dye targets give it. */
export interface ColourTarget {
  yarnIds: readonly string[];
  colour: Lab;
}

/** The colourway's targets for dyeable yarns; the dye plan's `DyeTarget`s fit. */
export interface Colourway {
  targets: readonly ColourTarget[];
  /**
   * The colourway's dye plan (`planDyeing` / `planColourway` output fits). With it the preview shows
   * the dyed result rather than the intent: a yarn the plan finds undyeable stays undyed, and a
   * dyeable yarn without a target takes the colour of the garment bath that dyes it.
   */
  plan?: PreviewPlan;
}

/** The parts of a dye plan the preview reads. */
export interface PreviewPlan {
  baths: readonly {
    /** `yarn`: dyed as yarn before knitting (targeted yarns only); absent or `garment`: a garment bath. */
    stage?: 'yarn' | 'garment';
    order: number;
    colour: Lab;
    /** Fibres the bath colours, and the yarns it colours (in a garment bath, untargeted ones too). */
    fibres: readonly string[];
    yarnIds: readonly string[];
  }[];
  findings: readonly { kind: string; severity: string; yarnIds: readonly string[] }[];
}

/**
 * How a yarn shows in a colourway preview. `own`: it comes coloured; `target`: its target colour;
 * `bath`: no target of its own, it takes a garment bath's colour; `undyeable`: it has a target the
 * plan finds no dye for, so it stays undyed; `no-target`: dyeable, no target, no bath dyes it, so
 * it stays undyed; `pale`: mostly a fibre that takes little dye (bare elastane), pale whatever the
 * bath; `undyed`: no colourway.
 */
export type YarnLookSource = 'own' | 'target' | 'bath' | 'undyeable' | 'no-target' | 'pale' | 'undyed';

export interface YarnLook {
  /** sRGB hex for the screen. */
  hex: string;
  lab: Lab;
  source: YarnLookSource;
}

/** Undyed synthetic filament (raw white), CIELAB D65; this product's own preview value. */
const rawWhiteLab: Lab = { L: 91, a: 0, b: 3.5 };
/** Undyed natural and regenerated fibres (greige / ecru), CIELAB D65; this product's own value. */
const greigeLab: Lab = { L: 85, a: 1.5, b: 10 };
/** Bare elastane: a pale grey; it takes little dye, so it stays pale in a dyed garment. */
const elastaneLab: Lab = { L: 84, a: -0.3, b: 1.5 };

/** Shares of a yarn in fibres that take little dye, and in natural or regenerated fibres. */
function undyedLook(yarn: Yarn): 'elastane' | 'greige' | 'raw-white' {
  let littleDye = 0;
  let natural = 0;
  for (const f of yarn.fibres) {
    const fibre = fibres[f.fibre];
    if (!fibre) continue;
    if (fibre.takesLittleDye) littleDye += f.share;
    if (fibre.kind === 'cellulosic' || fibre.kind === 'animal') natural += f.share;
  }
  if (littleDye >= 0.5) return 'elastane';
  return natural >= 0.5 ? 'greige' : 'raw-white';
}

const undyedLab = { elastane: elastaneLab, greige: greigeLab, 'raw-white': rawWhiteLab } as const;

/** The share of a yarn's fibres that a bath colours. */
function bathShare(yarn: Yarn, bathFibres: readonly string[]): number {
  return yarn.fibres.reduce((sum, f) => sum + (bathFibres.includes(f.fibre) ? f.share : 0), 0);
}

/**
 * How each yarn shows in a colourway, by yarn id (see `YarnLookSource`): a dope-dyed or yarn-dyed
 * yarn shows its own CIELAB colour; a dyeable yarn its target, if any, else its undyed look (raw
 * white for synthetics, greige for natural and regenerated fibres). A yarn mostly of a fibre that
 * takes little dye (bare elastane) is a pale grey whatever the target, as it comes out of the bath.
 * With the colourway's dye plan, a targeted yarn the plan finds undyeable (an error finding: it
 * takes no dye) keeps its undyed look, and an untargeted dyeable yarn takes the colour of the garment
 * bath that colours most of its fibres (the earlier bath on a tie), as the plan's baths list it.
 * Colours are screen previews through `labToSrgbHex` (chroma clipped into sRGB), not standards.
 */
export function yarnLooks(yarns: YarnLookup, colourway?: Colourway): Record<string, YarnLook> {
  const out: Record<string, YarnLook> = {};
  const look = (lab: Lab, source: YarnLookSource): YarnLook => ({ hex: labToSrgbHex(lab), lab, source });
  const plan = colourway?.plan;
  const undyeable = new Set(
    (plan?.findings ?? []).filter((f) => f.kind === 'undyeable' && f.severity === 'error').flatMap((f) => f.yarnIds),
  );
  const garmentBaths = [...(plan?.baths ?? [])].filter((b) => b.stage !== 'yarn').sort((p, q) => p.order - q.order);
  for (const yarn of yarnMap(yarns).values()) {
    if (yarn.colour.state !== 'dyeable') {
      out[yarn.id] = look(yarn.colour.lab, 'own');
      continue;
    }
    const kind = undyedLook(yarn);
    const undyed = undyedLab[kind];
    if (kind === 'elastane') {
      out[yarn.id] = look(undyed, colourway ? 'pale' : 'undyed');
      continue;
    }
    const target = colourway?.targets.find((t) => t.yarnIds.includes(yarn.id));
    if (target) {
      out[yarn.id] = undyeable.has(yarn.id) ? look(undyed, 'undyeable') : look(target.colour, 'target');
      continue;
    }
    if (!colourway) {
      out[yarn.id] = look(undyed, 'undyed');
      continue;
    }
    let best: { colour: Lab; share: number } | undefined;
    for (const b of garmentBaths) {
      if (!b.yarnIds.includes(yarn.id)) continue;
      const share = bathShare(yarn, b.fibres);
      if (share > (best?.share ?? 0)) best = { colour: b.colour, share };
    }
    out[yarn.id] = best ? look(best.colour, 'bath') : look(undyed, 'no-target');
  }
  return out;
}

/**
 * Why a yarn's colourway colour is not simply its target or its own colour, by look source: the
 * short legend line the preview and the exports print beside such a yarn. Sources without a note
 * show what they say (own colour, target, pale elastane, no colourway).
 */
export const yarnLookNotes: Readonly<Partial<Record<YarnLookSource, string>>> = {
  undyeable: 'has a target but takes no dye: shown undyed',
  bath: 'no target of its own: shown in the colour of the garment bath that dyes it',
  'no-target': 'no target, and no bath dyes it: shown undyed',
};

/** Preview colour (sRGB hex) of each yarn, by yarn id: the `hex` of `yarnLooks`. */
export function yarnColourMap(yarns: YarnLookup, colourway?: Colourway): Record<string, string> {
  return Object.fromEntries(Object.entries(yarnLooks(yarns, colourway)).map(([id, l]) => [id, l.hex]));
}

/** Yarn colours by id (hex), as `yarnColourMap` gives them. */
export type YarnColours = Readonly<Record<string, string>> | ReadonlyMap<string, string>;

/**
 * The index colours of the flat colour-by-texture view and the stitch-map legend: 16 calm, mutually
 * distinct tones of similar lightness (this product's own palette).
 */
export const textureIndexPalette: readonly string[] = [
  '#6f9fc8', // slate blue
  '#e0a060', // apricot
  '#7fb98f', // sage
  '#d47f86', // dusty rose
  '#a993d6', // lavender
  '#c8b24e', // mustard
  '#4fb0ad', // teal
  '#b9789f', // mauve
  '#96a457', // olive
  '#e6c9a2', // sand
  '#c0c0b8', // warm grey
  '#b6804f', // tan
  '#9fd0e6', // sky
  '#8c6d8c', // plum
  '#5f8f6a', // moss
  '#9c8f7a', // taupe
];

function hashString(s: string): number {
  // FNV-1a, 32 bit.
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/**
 * A stable index colour (hex) for a texture id, from `textureIndexPalette` by a hash of the id: the
 * same id always gets the same colour. Two ids can share a colour; use `flatColoursForTextures` to
 * colour a known set with distinct colours.
 */
export function flatColourForTexture(textureId: string): string {
  return textureIndexPalette[hashString(textureId) % textureIndexPalette.length] ?? '#999999';
}

/**
 * Distinct index colours for a set of textures: each id takes its `flatColourForTexture` colour
 * unless an id before it (in sorted order) has it, then the next free palette entry. Stable for the
 * same set; distinct for up to 16 textures (beyond that the palette repeats).
 */
export function flatColoursForTextures(textureIds: Iterable<string>): Record<string, string> {
  const ids = [...new Set(textureIds)].sort();
  const n = textureIndexPalette.length;
  const taken = new Set<number>();
  const out: Record<string, string> = {};
  for (const id of ids) {
    let slot = hashString(id) % n;
    if (taken.size < n) while (taken.has(slot)) slot = (slot + 1) % n;
    taken.add(slot);
    out[id] = textureIndexPalette[slot] ?? '#999999';
  }
  return out;
}

/**
 * Backdrops seen through open structures (this product's own): dark behind pale and mid-tone yarns,
 * light behind dark yarns, so the openings read either way.
 */
export const tileBackgrounds = { dark: '#2e3034', light: '#8a8d91' } as const;

/** The backdrop that contrasts with a texture's ground yarns: light when their mean L* is below 35. */
function backdropFor(groundHexes: readonly string[]): string {
  let sum = 0;
  for (const hex of groundHexes) sum += srgbHexToLab(hex)?.L ?? 50;
  return groundHexes.length > 0 && sum / groundHexes.length < 35 ? tileBackgrounds.light : tileBackgrounds.dark;
}

/** Light and shade of one yarn colour; through CIELAB lightness steps (`lib/colour/convert`). */
interface YarnShades {
  body: string;
  outline: string;
  highlight: string;
  back: string;
  backOutline: string;
  float: string;
}

const shadeCache = new Map<string, YarnShades>();

function lighten(lab: Lab, dL: number): string {
  return labToSrgbHex({ L: Math.min(100, Math.max(0, lab.L + dL)), a: lab.a, b: lab.b });
}

function shadesOf(hex: string): YarnShades {
  const hit = shadeCache.get(hex);
  if (hit) return hit;
  const lab = srgbHexToLab(hex) ?? { L: 50, a: 0, b: 0 };
  // Very dark yarns get a stronger highlight and a lifted body so their loops still read.
  const dark = lab.L < 30;
  const shades: YarnShades = {
    body: dark ? lighten(lab, 6) : hex,
    outline: lighten(lab, dark ? -12 : -30),
    highlight: lighten(lab, dark ? 20 : 16),
    back: lighten(lab, dark ? -2 : -14),
    backOutline: lighten(lab, dark ? -14 : -36),
    float: lighten(lab, dark ? -4 : -22),
  };
  if (shadeCache.size > 512) shadeCache.clear();
  shadeCache.set(hex, shades);
  return shades;
}

// ---------------------------------------------------------------------------------------------
// Geometry

/** Cell size and yarn width, px. */
interface Cell {
  w: number;
  h: number;
  d: number;
}

/**
 * Fractions that shape the loop (of the wale width w, the course height h, the yarn width d). The
 * loop of a stitch spans its own course plus overlaps: its V closes just below its cell, inside the
 * loop below; its head rises into the course above, where the next loop's legs cover it.
 */
const shape = {
  /** V point of the legs, below the top of the stitch's cell, × h. */
  vY: 1.06,
  /** Legs' half-spacing at the V, × d (0.5 would have them just touch). */
  vHalf: 0.46,
  /** Apex of the head above the top of the loop's top cell, × h. */
  apexRise: 0.2,
  /** Half-width of the loop at the head, × w; a held loop is narrower. */
  headHalf: 0.355,
  heldHeadHalf: 0.24,
  /** Sinker loop bottom below the V, × h. */
  sinkerDrop: 0.32,
  /** Half-width of a tuck's open arc, × w. */
  tuckHalf: 0.47,
} as const;

function M(x: number, y: number): PathCommand {
  return { op: 'moveTo', x, y };
}
function C(cp1x: number, cp1y: number, cp2x: number, cp2y: number, x: number, y: number): PathCommand {
  return { op: 'bezierCurveTo', cp1x, cp1y, cp2x, cp2y, x, y };
}

/**
 * A knitted loop held for `k` courses (1 = knitted again in the next course), local to the top-left
 * of its cell. `inset` > 0 gives the line along its inner edge (for a plated yarn).
 */
function loopPath(g: Cell, k: number, inset: number): Path {
  const { w, h, d } = g;
  const cx = w / 2;
  const bx = Math.max(shape.vHalf * d - inset, 0.06 * d);
  const tx = (k > 1 ? shape.heldHeadHalf : shape.headHalf) * w - inset;
  const yV = shape.vY * h - inset * 0.3;
  const apex = -(k - 1) * h - shape.apexRise * h + inset;
  const rise = Math.min(tx * 0.95, 0.55 * h + (k - 1) * 0.1 * h);
  const y0 = apex + rise;
  const leg = yV - y0;
  const bulge = 0.07 * w;
  const lift = (4 / 3) * rise;
  return [
    M(cx - bx, yV),
    C(cx - bx - 0.12 * w, yV - 0.35 * leg, cx - tx - bulge, y0 + 0.5 * leg, cx - tx, y0),
    C(cx - tx, y0 - lift, cx + tx, y0 - lift, cx + tx, y0),
    C(cx + tx + bulge, y0 + 0.5 * leg, cx + bx + 0.12 * w, yV - 0.35 * leg, cx + bx, yV),
  ];
}

/** The feet of a knitted loop: from the sinker at each cell edge up into the V. */
function sinkerPath(g: Cell, inset: number): Path {
  const { w, h, d } = g;
  const cx = w / 2;
  const bx = shape.vHalf * d;
  const yV = shape.vY * h;
  const yS = yV + shape.sinkerDrop * h + inset;
  return [
    M(0, yS),
    C(0.22 * w, yS, cx - bx - 0.1 * w, yV + 0.2 * h, cx - bx, yV),
    M(cx + bx, yV),
    C(cx + bx + 0.1 * w, yV + 0.2 * h, 0.78 * w, yS, w, yS),
  ];
}

/**
 * The open arc of a tuck held with the loop on its needle until the needle knits `j` courses above:
 * from the sinker at the left edge up around the held head and down to the right edge.
 */
function tuckPath(g: Cell, j: number, inset: number): Path {
  const { w, h } = g;
  const cx = w / 2;
  const yS = shape.vY * h + shape.sinkerDrop * h - inset * 0.5;
  const tx = shape.tuckHalf * w - inset;
  const apex = -(j - 1) * h - shape.apexRise * h + inset + 0.05 * h;
  const rise = Math.min(tx * 0.9, 0.6 * h);
  const y0 = apex + rise;
  const leg = yS - y0;
  const lift = (4 / 3) * rise;
  return [
    M(0, yS),
    C(0.5 * (cx - tx), yS, cx - tx - 0.04 * w, y0 + 0.45 * leg, cx - tx, y0),
    C(cx - tx, y0 - lift, cx + tx, y0 - lift, cx + tx, y0),
    C(cx + tx + 0.04 * w, y0 + 0.45 * leg, w - 0.5 * (cx - tx), yS, w, yS),
  ];
}

/** A float across a missed needle at the sinker level, bowed up a little by the held loop. */
function floatPath(g: Cell, inset: number): Path {
  const { w, h } = g;
  const yS = shape.vY * h + shape.sinkerDrop * h + inset;
  return [M(0, yS), C(0.3 * w, yS - 0.12 * h, 0.7 * w, yS - 0.12 * h, w, yS)];
}

// ---------------------------------------------------------------------------------------------
// The tile

export interface RenderTileOptions {
  /** Whole repeats across and up the tile, ≥ 1. */
  repeatsX: number;
  repeatsY: number;
  /** Scale, tile px per cm of relaxed fabric. */
  pxPerCm: number;
  /** Targets for dyeable yarns when the second argument is the yarns themselves. */
  colourway?: Colourway;
  /**
   * Backdrop seen through the fabric, hex; `null` for none (transparent). Default: dark behind
   * pale and mid-tone yarns, light behind dark ones (`tileBackgrounds`).
   */
  background?: string | null;
  /**
   * The yarns, for the drawn yarn width when `colours` is a colour map (when `colours` is the yarns,
   * they are used). Without yarns the width follows the stitch size (`yarnWidth`).
   */
  yarns?: YarnLookup;
  /**
   * Yarn width drawn, as a fraction of the smaller of the wale width and 1.45 × the course height.
   * Overrides the width from the yarns' counts. Default, without yarns: 0.32.
   */
  yarnWidth?: number;
}

const codeOf: Record<StitchAction, number> = { knit: 0, tuck: 1, miss: 2 };

/**
 * Drawn yarn width, mm, from a linear density: the diameter of a round yarn of that mass per length,
 * d = √(4 · tex / (π · ρ · φ · 1000)) mm, taking a fibre density ρ of 1.2 g/cm³ and a packing
 * fraction φ of 0.6 (typical of filament yarns), widened by 1.4 because a yarn flattens in the loop
 * (ρ, φ and the widening are this renderer's display assumptions, not measurements).
 */
export function drawnYarnWidthMm(tex: number): number {
  if (!(tex > 0)) return 0;
  return 1.4 * Math.sqrt((4 * tex) / (Math.PI * 1.2 * 0.6 * 1000));
}

/** Mean drawn yarn width over the courses of a repeat, mm: each feeder's ground plus its plated yarn at dtex ÷ draft. */
function feederYarnWidthMm(texture: Texture, yarns: YarnLookup): number | undefined {
  const byId = yarnMap(yarns);
  let sum = 0;
  let count = 0;
  for (const f of texture.feeders) {
    const ground = byId.get(f.ground);
    if (!ground) continue;
    let dtex = ground.dtex;
    const plated = f.plated ? byId.get(f.plated.yarn) : undefined;
    if (f.plated && plated) dtex += plated.dtex / f.plated.draft;
    sum += drawnYarnWidthMm(dtex / 10);
    count++;
  }
  return count > 0 ? sum / count : undefined;
}

function isColourMap(src: YarnColours | YarnLookup): src is YarnColours {
  if (src instanceof Map) {
    for (const v of src.values()) return typeof v === 'string';
    return true;
  }
  if (Array.isArray(src)) return false;
  for (const v of Object.values(src)) return typeof v === 'string';
  return true;
}

function mod(a: number, n: number): number {
  const r = a % n;
  return r < 0 ? r + n : r;
}

/**
 * Draw `repeatsX × repeatsY` whole repeats of a texture as knitted loops, at true relative scale:
 * a needle is 1 / walesPerCm cm wide and a course 1 / coursesPerCm cm tall, so the tile is
 * repeatsX × needles ÷ walesPerCm × pxPerCm px wide and repeatsY × courses ÷ coursesPerCm × pxPerCm
 * px tall. Each course is drawn in its feeder's ground-yarn colour, a plated yarn as a thin line on
 * the inner edge.
 *
 * @param colours yarn colours by id (`yarnColourMap`), or the yarns themselves (coloured with
 *   `options.colourway`). A yarn without a colour is drawn in a neutral grey.
 * @throws RangeError when the repeats are not whole numbers ≥ 1, the scale or density is not
 *   positive, or the chart or the feeders do not match the repeat size.
 */
export function renderTile(
  texture: Texture,
  colours: YarnColours | YarnLookup,
  options: RenderTileOptions,
): TileDrawing {
  const { repeatsX, repeatsY, pxPerCm } = options;
  if (!Number.isInteger(repeatsX) || repeatsX < 1 || !Number.isInteger(repeatsY) || repeatsY < 1) {
    throw new RangeError(`Repeats must be whole numbers ≥ 1 (got ${repeatsX} × ${repeatsY}).`);
  }
  if (!(pxPerCm > 0)) throw new RangeError(`Scale must be positive px per cm (got ${pxPerCm}).`);
  const { walesPerCm, coursesPerCm } = texture.density;
  if (!(walesPerCm > 0) || !(coursesPerCm > 0)) throw new RangeError(`Texture ${texture.name}: density must be positive.`);
  const W = texture.repeat.needles;
  const H = texture.repeat.courses;
  if (!(W >= 1) || !(H >= 1) || texture.repeat.cells.length !== H || texture.feeders.length !== H) {
    throw new RangeError(`Texture ${texture.name}: the chart and feeders must match the ${W} × ${H} repeat.`);
  }

  // The repeat as action codes and, per cell, how far up the needle next knits.
  const act = new Uint8Array(W * H);
  for (let c = 0; c < H; c++) {
    const row = texture.repeat.cells[c];
    if (!row || row.length !== W) throw new RangeError(`Texture ${texture.name}: course ${c} is not ${W} needles.`);
    for (let n = 0; n < W; n++) act[c * W + n] = codeOf[row[n] ?? 'knit'];
  }
  const reach = new Uint16Array(W * H);
  for (let n = 0; n < W; n++) {
    for (let c = 0; c < H; c++) {
      let j = 1;
      while (j < H && act[((c + j) % H) * W + n] !== 0) j++;
      // A needle that never knits holds no loop: its tucks are drawn closing at the next course.
      reach[c * W + n] = j === H && act[c * W + n] !== 0 ? 1 : j;
    }
  }

  const resolved: YarnColours = isColourMap(colours) ? colours : yarnColourMap(colours, options.colourway);
  const colourOf = (id: string): string =>
    (resolved instanceof Map ? resolved.get(id) : (resolved as Readonly<Record<string, string>>)[id]) ?? '#9a9a96';

  const w = pxPerCm / walesPerCm;
  const h = pxPerCm / coursesPerCm;
  const cellSize = Math.min(w, 1.45 * h);
  const yarnsForWidth = isColourMap(colours) ? options.yarns : colours;
  const widthMm = options.yarnWidth === undefined && yarnsForWidth ? feederYarnWidthMm(texture, yarnsForWidth) : undefined;
  const d =
    widthMm === undefined
      ? (options.yarnWidth ?? 0.32) * cellSize
      : Math.min(Math.max((widthMm / 10) * pxPerCm, 0.16 * cellSize), 0.45 * cellSize);
  const g: Cell = { w, h, d };
  const cols = W * repeatsX;
  const rows = H * repeatsY;
  const widthPx = cols * w;
  const heightPx = rows * h;

  // Paint passes, shared per yarn colour.
  const frontPaints = new Map<string, Paint[]>();
  const loopPaints = (hex: string): Paint[] => {
    let p = frontPaints.get(hex);
    if (!p) {
      const s = shadesOf(hex);
      p = [
        { stroke: '#000000', width: d * 1.08, alpha: 0.3, dx: 0.1 * d, dy: 0.16 * d },
        { stroke: s.outline, width: d },
        { stroke: s.body, width: d * 0.78 },
        { stroke: s.highlight, width: d * 0.24, alpha: 0.75, dx: -0.13 * d, dy: -0.1 * d },
      ];
      frontPaints.set(hex, p);
    }
    return p;
  };
  const backPaints = new Map<string, Paint[]>();
  const paintsBack = (hex: string, kind: 'sinker' | 'tuck-arc' | 'float'): Paint[] => {
    const key = `${kind}${hex}`;
    let p = backPaints.get(key);
    if (!p) {
      const s = shadesOf(hex);
      if (kind === 'float') {
        p = [
          { stroke: s.backOutline, width: d * 0.62, alpha: 0.85 },
          { stroke: s.float, width: d * 0.42, alpha: 0.85 },
        ];
      } else if (kind === 'tuck-arc') {
        p = [
          { stroke: '#000000', width: d * 0.9, alpha: 0.22, dx: 0.08 * d, dy: 0.12 * d },
          { stroke: s.backOutline, width: d * 0.82 },
          { stroke: s.back, width: d * 0.6 },
          { stroke: s.highlight, width: d * 0.16, alpha: 0.45, dx: -0.1 * d, dy: -0.08 * d },
        ];
      } else {
        p = [
          { stroke: s.backOutline, width: d * 0.8 },
          { stroke: s.back, width: d * 0.6 },
        ];
      }
      backPaints.set(key, p);
    }
    return p;
  };
  const platePaints = new Map<string, Paint[]>();
  const paintsPlated = (hex: string): Paint[] => {
    let p = platePaints.get(hex);
    if (!p) {
      p = [{ stroke: hex, width: Math.max(d * 0.17, 0.3), alpha: 0.75 }];
      platePaints.set(hex, p);
    }
    return p;
  };

  // Shared geometry.
  const paths = new Map<string, Path>();
  const pathOf = (key: string, make: () => Path): Path => {
    let p = paths.get(key);
    if (!p) {
      p = make();
      paths.set(key, p);
    }
    return p;
  };
  const inset = 0.3 * d;

  const items: DrawItem[] = [];
  if (options.background !== null) {
    const bg = options.background ?? backdropFor(texture.feeders.map((f) => colourOf(f.ground)));
    items.push({
      kind: 'background',
      path: [M(0, 0), { op: 'lineTo', x: widthPx, y: 0 }, { op: 'lineTo', x: widthPx, y: heightPx }, { op: 'lineTo', x: 0, y: heightPx }, { op: 'closePath' }],
      x: 0,
      y: 0,
      paints: [{ fill: bg }],
      needle: 0,
      course: 0,
    });
  }
  const back: DrawItem[] = [];
  const front: DrawItem[] = [];

  // A stitch at tile course c reaches from course c − 1 (its feet) to c + reach (its head).
  for (let c = -H - 1; c <= rows; c++) {
    const rc = mod(c, H);
    const feeder = texture.feeders[rc];
    if (!feeder) continue;
    const ground = colourOf(feeder.ground);
    const plated = feeder.plated ? colourOf(feeder.plated.yarn) : undefined;
    const y = (rows - 1 - c) * h;
    // A course's tuck arcs lie under its loops (and over the held loops from the courses below).
    const tucks: DrawItem[] = [];
    const loops: DrawItem[] = [];
    for (let n = -1; n <= cols; n++) {
      const i = rc * W + mod(n, W);
      const r = reach[i] ?? 1;
      if (c + r < 0) continue;
      const x = n * w;
      const a = act[i];
      if (a === 0) {
        const kind: DrawItemKind = r > 1 ? 'held-loop' : 'knit-loop';
        loops.push({ kind, path: pathOf(`L${r}`, () => loopPath(g, r, 0)), x, y, paints: loopPaints(ground), needle: n, course: c });
        if (plated) {
          loops.push({ kind: 'plating', path: pathOf(`l${r}`, () => loopPath(g, r, inset)), x, y, paints: paintsPlated(plated), needle: n, course: c });
        }
        back.push({ kind: 'sinker', path: pathOf('S', () => sinkerPath(g, 0)), x, y, paints: paintsBack(ground, 'sinker'), needle: n, course: c });
        if (plated) {
          back.push({ kind: 'plating', path: pathOf('s', () => sinkerPath(g, inset)), x, y, paints: paintsPlated(plated), needle: n, course: c });
        }
      } else if (a === 1) {
        tucks.push({ kind: 'tuck-arc', path: pathOf(`T${r}`, () => tuckPath(g, r, 0)), x, y, paints: paintsBack(ground, 'tuck-arc'), needle: n, course: c });
        if (plated) {
          tucks.push({ kind: 'plating', path: pathOf(`t${r}`, () => tuckPath(g, r, inset)), x, y, paints: paintsPlated(plated), needle: n, course: c });
        }
      } else {
        back.push({ kind: 'float', path: pathOf('F', () => floatPath(g, 0)), x, y, paints: paintsBack(ground, 'float'), needle: n, course: c });
        if (plated) {
          back.push({ kind: 'plating', path: pathOf('f', () => floatPath(g, inset)), x, y, paints: paintsPlated(plated), needle: n, course: c });
        }
      }
    }
    for (const it of tucks) front.push(it);
    for (const it of loops) front.push(it);
  }
  for (const it of back) items.push(it);
  for (const it of front) items.push(it);

  return {
    widthPx,
    heightPx,
    widthCm: cols / walesPerCm,
    heightCm: rows / coursesPerCm,
    repeatsX,
    repeatsY,
    needles: cols,
    courses: rows,
    pxPerNeedle: w,
    pxPerCourse: h,
    yarnPx: d,
    items,
  };
}

/**
 * Fewest whole repeats that make a tile at least `minPx` px wide and tall at `pxPerCm` (for
 * patterns, where a one-stitch repeat would round to a few pixels).
 */
export function repeatsForMinSize(texture: Texture, pxPerCm: number, minPx: number): { repeatsX: number; repeatsY: number } {
  const repeatW = (texture.repeat.needles / texture.density.walesPerCm) * pxPerCm;
  const repeatH = (texture.repeat.courses / texture.density.coursesPerCm) * pxPerCm;
  return {
    repeatsX: Math.max(1, Math.ceil(minPx / repeatW)),
    repeatsY: Math.max(1, Math.ceil(minPx / repeatH)),
  };
}

/**
 * The scale that maps a pattern image of a tile onto a shape in another space: image px per needle
 * and per course → target units per needle and per course. For a Konva shape drawn in screen px,
 * pass the panel's screen px per needle and per course; for a shape in stitch units (a group scaled
 * by the camera), pass 1 and 1.
 * @param image the pattern's actual image px per needle and per course (after rounding to whole px).
 */
export function patternScale(
  image: { pxPerNeedle: number; pxPerCourse: number },
  target: { pxPerNeedle: number; pxPerCourse: number },
): { x: number; y: number } {
  return { x: target.pxPerNeedle / image.pxPerNeedle, y: target.pxPerCourse / image.pxPerCourse };
}
