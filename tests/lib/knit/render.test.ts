import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { labToSrgbHex } from '@/lib/colour/convert';
import { deltaE2000 } from '@/lib/colour/difference';
import { srgbHexToLab } from '@/lib/colour/convert';
import {
  flatColourForTexture,
  flatColoursForTextures,
  patternScale,
  renderTile,
  repeatsForMinSize,
  textureIndexPalette,
  yarnColourMap,
  yarnLooks,
  type DrawItem,
  type Path,
  type TileDrawing,
} from '@/lib/knit/render';
import { drawTile, type Canvas2DLike } from '@/lib/knit/render-canvas';
import { planColourway } from '@/lib/colour/colourway';
import { drawingToSvg } from '@/lib/knit/render-svg';
import type { Feeder, StitchAction, Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';

// ---------------------------------------------------------------------------------------------
// Fixtures

const pa: Yarn = { id: 'pa', name: 'PA 78 f68', dtex: 78, fibres: [{ fibre: 'polyamide', share: 1 }], colour: { state: 'dyeable' } };
const co: Yarn = { id: 'co', name: 'CO Ne 40', dtex: 148, fibres: [{ fibre: 'cotton', share: 1 }], colour: { state: 'dyeable' } };
const el: Yarn = { id: 'el', name: 'EL 22', dtex: 22, fibres: [{ fibre: 'elastane', share: 1 }], colour: { state: 'dyeable' } };
const navyLab = { L: 22, a: 4, b: -28 };
const paNavy: Yarn = { id: 'pa-navy', name: 'PA navy', dtex: 78, fibres: [{ fibre: 'polyamide', share: 1 }], colour: { state: 'dope-dyed', lab: navyLab } };
const redLab = { L: 45, a: 58, b: 35 };
const pesRed: Yarn = { id: 'pes-red', name: 'PES red', dtex: 78, fibres: [{ fibre: 'polyester', share: 1 }], colour: { state: 'yarn-dyed', lab: redLab } };
const yarns = [pa, co, el, paNavy, pesRed];

const letters: Record<string, StitchAction> = { K: 'knit', T: 'tuck', M: 'miss' };

/** A texture from chart rows written top (last knitted course) first, as a chart is read. */
function texture(id: string, rowsTopFirst: string[], feeder: Feeder | ((course: number) => Feeder), density = { walesPerCm: 20, coursesPerCm: 28 }): Texture {
  const cells = [...rowsTopFirst].reverse().map((r) => [...r].map((ch) => letters[ch] as StitchAction));
  return {
    id,
    name: id,
    repeat: { needles: cells[0]?.length ?? 0, courses: cells.length, cells },
    feeders: cells.map((_, c) => (typeof feeder === 'function' ? feeder(c) : feeder)),
    density,
    loopMm: { knit: 2.6, tuck: 2.0 },
  };
}

const jersey = texture('jersey', ['K'], { ground: 'pa-navy' });
const platedJersey = texture('plated-jersey', ['K'], { ground: 'pa', plated: { yarn: 'el', draft: 2.8 } });
/** A tuck-miss micro-mesh. */
const mesh = texture('mesh', ['KKKK', 'MKTK', 'KKKK', 'TKMK'], { ground: 'pa' }, { walesPerCm: 17, coursesPerCm: 24 });
/** Two-colour float jacquard: each design row is a red course over a navy course. */
const jacquard = texture(
  'jacquard',
  ['KKMM', 'MMKK', 'KKMM', 'MMKK', 'MMKK', 'KKMM', 'MMKK', 'KKMM'],
  (c) => ({ ground: c % 2 === 0 ? 'pa-navy' : 'pes-red' }),
  { walesPerCm: 20, coursesPerCm: 36 },
);
const pique = texture('pique', ['KK', 'TK', 'KK', 'KT'], { ground: 'co' }, { walesPerCm: 19, coursesPerCm: 30 });

// ---------------------------------------------------------------------------------------------
// A coarse software rasteriser: which colour ends up on top at each pixel centre. Strokes only
// (and the background fill); passes fainter than alpha 0.5 (shadows, highlights) are skipped, so
// the result is where yarn lies, in the yarn's body or outline colour.

interface Raster {
  width: number;
  height: number;
  /** Colour on top per pixel, '' where nothing was drawn. */
  px: string[];
}

function flatten(path: Path, ox: number, oy: number): [number, number][][] {
  const lines: [number, number][][] = [];
  let cur: [number, number][] = [];
  let x = 0;
  let y = 0;
  for (const c of path) {
    if (c.op === 'moveTo') {
      if (cur.length > 1) lines.push(cur);
      x = c.x + ox;
      y = c.y + oy;
      cur = [[x, y]];
    } else if (c.op === 'lineTo') {
      x = c.x + ox;
      y = c.y + oy;
      cur.push([x, y]);
    } else if (c.op === 'bezierCurveTo') {
      const [x0, y0] = [x, y];
      for (let i = 1; i <= 12; i++) {
        const t = i / 12;
        const u = 1 - t;
        cur.push([
          u * u * u * x0 + 3 * u * u * t * (c.cp1x + ox) + 3 * u * t * t * (c.cp2x + ox) + t * t * t * (c.x + ox),
          u * u * u * y0 + 3 * u * u * t * (c.cp1y + oy) + 3 * u * t * t * (c.cp2y + oy) + t * t * t * (c.y + oy),
        ]);
      }
      x = c.x + ox;
      y = c.y + oy;
    } else if (cur.length > 0 && cur[0]) {
      cur.push(cur[0]);
    }
  }
  if (cur.length > 1) lines.push(cur);
  return lines;
}

function rasterize(drawing: TileDrawing, opts: { skip?: (item: DrawItem) => boolean } = {}): Raster {
  const width = Math.round(drawing.widthPx);
  const height = Math.round(drawing.heightPx);
  const px: string[] = new Array<string>(width * height).fill('');
  for (const item of drawing.items) {
    if (opts.skip?.(item)) continue;
    for (const p of item.paints) {
      if ((p.alpha ?? 1) < 0.5) continue;
      if (p.fill !== undefined && item.kind === 'background') px.fill(p.fill);
      if (p.stroke === undefined) continue;
      const r = (p.width ?? 1) / 2;
      for (const line of flatten(item.path, item.x + (p.dx ?? 0), item.y + (p.dy ?? 0))) {
        for (let i = 1; i < line.length; i++) {
          const a = line[i - 1];
          const b = line[i];
          if (!a || !b) continue;
          const [ax, ay] = a;
          const [bx, by] = b;
          const x0 = Math.max(0, Math.floor(Math.min(ax, bx) - r));
          const x1 = Math.min(width - 1, Math.ceil(Math.max(ax, bx) + r));
          const y0 = Math.max(0, Math.floor(Math.min(ay, by) - r));
          const y1 = Math.min(height - 1, Math.ceil(Math.max(ay, by) + r));
          const dx = bx - ax;
          const dy = by - ay;
          const len2 = dx * dx + dy * dy || 1;
          for (let yy = y0; yy <= y1; yy++) {
            for (let xx = x0; xx <= x1; xx++) {
              const cx = xx + 0.5;
              const cy = yy + 0.5;
              const t = Math.max(0, Math.min(1, ((cx - ax) * dx + (cy - ay) * dy) / len2));
              const ex = ax + t * dx - cx;
              const ey = ay + t * dy - cy;
              if (ex * ex + ey * ey <= r * r) px[yy * width + xx] = p.stroke;
            }
          }
        }
      }
    }
  }
  return { width, height, px };
}

function backgroundOf(drawing: TileDrawing): string {
  const bg = drawing.items[0];
  if (!bg || bg.kind !== 'background' || !bg.paints[0]?.fill) throw new Error('no background');
  return bg.paints[0].fill;
}

/** Fraction of the tile where the background shows through. */
function openFraction(drawing: TileDrawing): number {
  const bg = backgroundOf(drawing);
  const r = rasterize(drawing);
  return r.px.filter((c) => c === bg).length / r.px.length;
}

function window(r: Raster, x0: number, y0: number, w: number, h: number): string[] {
  const out: string[] = [];
  for (let y = y0; y < y0 + h; y++) for (let x = x0; x < x0 + w; x++) out.push(r.px[y * r.width + x] ?? '?');
  return out;
}

function bbox(path: Path): { width: number; height: number } {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const line of flatten(path, 0, 0)) {
    for (const [x, y] of line) {
      xs.push(x);
      ys.push(y);
    }
  }
  return { width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) };
}

const opts = (repeatsX: number, repeatsY: number, pxPerCm = 100) => ({ repeatsX, repeatsY, pxPerCm });

// ---------------------------------------------------------------------------------------------

describe('renderTile: true relative scale', () => {
  it('24 needles at 20 wales/cm, 2 repeats = 2.4 cm = 240 px at 100 px/cm; courses likewise', () => {
    const rows = Array.from({ length: 24 }, () => 'K'.repeat(24));
    const t = texture('t24', rows, { ground: 'pa' }, { walesPerCm: 20, coursesPerCm: 30 });
    const d = renderTile(t, yarns, opts(2, 1));
    expect(d.widthCm).toBeCloseTo(2.4, 12);
    expect(d.widthPx).toBeCloseTo(240, 9);
    // 24 courses ÷ 30 courses/cm = 0.8 cm → 80 px.
    expect(d.heightCm).toBeCloseTo(0.8, 12);
    expect(d.heightPx).toBeCloseTo(80, 9);
    expect(d.needles).toBe(48);
    expect(d.courses).toBe(24);
    expect(d.pxPerNeedle).toBeCloseTo(5, 12);
    expect(d.pxPerCourse).toBeCloseTo(100 / 30, 12);
  });

  it('for any density, repeat and scale: size = repeats × stitches ÷ density × px/cm', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 8 }),
        fc.integer({ min: 1, max: 8 }),
        fc.integer({ min: 1, max: 4 }),
        fc.integer({ min: 1, max: 4 }),
        fc.double({ min: 5, max: 40, noNaN: true }),
        fc.double({ min: 5, max: 50, noNaN: true }),
        fc.double({ min: 10, max: 800, noNaN: true }),
        (W, H, rx, ry, wpc, cpc, pxPerCm) => {
          const t = texture('p', Array.from({ length: H }, () => 'K'.repeat(W)), { ground: 'pa' }, { walesPerCm: wpc, coursesPerCm: cpc });
          const d = renderTile(t, yarns, { repeatsX: rx, repeatsY: ry, pxPerCm });
          expect(d.widthPx).toBeCloseTo(((rx * W) / wpc) * pxPerCm, 6);
          expect(d.heightPx).toBeCloseTo(((ry * H) / cpc) * pxPerCm, 6);
          expect(d.widthCm * pxPerCm).toBeCloseTo(d.widthPx, 6);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('the background rectangle covers exactly the tile', () => {
    const d = renderTile(mesh, yarns, opts(2, 3));
    const bg = d.items[0];
    expect(bg?.kind).toBe('background');
    expect(bbox(bg?.path ?? [])).toEqual({ width: d.widthPx, height: d.heightPx });
    expect(d.items.filter((i) => i.kind === 'background')).toHaveLength(1);
    expect(renderTile(mesh, yarns, { ...opts(1, 1), background: null }).items.some((i) => i.kind === 'background')).toBe(false);
  });

  it('refuses partial repeats and a non-positive scale', () => {
    expect(() => renderTile(jersey, yarns, opts(1.5, 1))).toThrow(RangeError);
    expect(() => renderTile(jersey, yarns, opts(1, 0))).toThrow(RangeError);
    expect(() => renderTile(jersey, yarns, opts(1, 1, 0))).toThrow(RangeError);
  });
});

describe('renderTile: whole repeats, no seam', () => {
  // 4 needles at 20 wales/cm and 100 px/cm = 20 px per repeat; 4 courses at 20 courses/cm = 20 px.
  const t = texture('seam', ['KKKK', 'MKTK', 'KKKK', 'TKMK'], { ground: 'pa', plated: { yarn: 'el', draft: 3 } }, { walesPerCm: 20, coursesPerCm: 20 });
  const one = renderTile(t, yarns, opts(1, 1));
  const key = (i: DrawItem, dn = 0, dc = 0, dx = 0, dy = 0) =>
    `${i.kind}|${i.needle + dn}|${i.course + dc}|${(i.x + dx).toFixed(6)}|${(i.y + dy).toFixed(6)}|${JSON.stringify(i.path)}|${JSON.stringify(i.paints)}`;

  it('2 × 1 repeats hold the 1 × 1 drawing and the same drawing shifted by one repeat width', () => {
    const two = renderTile(t, yarns, opts(2, 1));
    const keys = new Set(two.items.map((i) => key(i)));
    for (const i of one.items) {
      if (i.kind === 'background') continue;
      expect(keys.has(key(i))).toBe(true);
      expect(keys.has(key(i, 4, 0, 20, 0))).toBe(true);
    }
  });

  it('pixel for pixel, each half of a 2 × 1 tile and each half of a 1 × 2 tile is the 1 × 1 tile', () => {
    const r1 = rasterize(one);
    const all1 = window(r1, 0, 0, 20, 20);
    expect(new Set(all1).size).toBeGreaterThan(2);
    const r2 = rasterize(renderTile(t, yarns, opts(2, 1)));
    expect(window(r2, 0, 0, 20, 20)).toEqual(all1);
    expect(window(r2, 20, 0, 20, 20)).toEqual(all1);
    const r3 = rasterize(renderTile(t, yarns, opts(1, 2)));
    expect(window(r3, 0, 0, 20, 20)).toEqual(all1);
    expect(window(r3, 0, 20, 20, 20)).toEqual(all1);
  });

  it('a tile drawn without its wrapped edge stitches would show a seam (the check above can fail)', () => {
    const r1 = rasterize(one);
    const cut = rasterize(one, { skip: (i) => i.needle < 0 || i.needle >= 4 || i.course < 0 || i.course >= 4 });
    expect(cut.px).not.toEqual(r1.px);
  });
});

describe('renderTile: knit, tuck and miss draw differently', () => {
  it('plain jersey draws only knitted loops and their sinkers', () => {
    const d = renderTile(jersey, yarns, opts(4, 4));
    expect(new Set(d.items.map((i) => i.kind))).toEqual(new Set(['background', 'knit-loop', 'sinker']));
  });

  it('a tuck is an open arc over the needle, and the loop below it is held, elongated, to the next knit', () => {
    const t = texture('one-tuck', ['KKKK', 'KTKK', 'KKKK'], { ground: 'pa' });
    const d = renderTile(t, yarns, opts(1, 1));
    // Chart course 1 (middle row, counted from the bottom), needle 1.
    const arcs = d.items.filter((i) => i.kind === 'tuck-arc' && i.needle === 1 && i.course === 1);
    expect(arcs).toHaveLength(1);
    const held = d.items.find((i) => i.kind === 'held-loop' && i.needle === 1 && i.course === 0);
    const plain = d.items.find((i) => i.kind === 'knit-loop' && i.needle === 0 && i.course === 0);
    expect(held && plain).toBeTruthy();
    if (!held || !plain || !arcs[0]) return;
    // The held loop spans about a course more than a plain loop, and is narrower.
    expect(bbox(held.path).height - bbox(plain.path).height).toBeCloseTo(d.pxPerCourse, 0);
    expect(bbox(held.path).width).toBeLessThan(bbox(plain.path).width);
    // The arc spans the whole needle width (its feet are the sinkers) and rises like a loop.
    expect(bbox(arcs[0].path).width).toBeCloseTo(d.pxPerNeedle, 6);
    expect(bbox(arcs[0].path).height).toBeGreaterThan(d.pxPerCourse);
    expect(arcs[0].path).not.toEqual(plain.path);
    // The course above knits through the held loop and the tuck: no more held loops on needle 1.
    expect(d.items.some((i) => i.kind === 'tuck-arc' && i.needle !== 1)).toBe(false);
  });

  it('a miss is a flat float across the needle, drawn behind (before) every loop', () => {
    const t = texture('one-miss', ['KKKK', 'KMKK', 'KKKK'], { ground: 'pa' });
    const d = renderTile(t, yarns, opts(1, 1));
    const floats = d.items.filter((i) => i.kind === 'float');
    expect(floats.map((f) => [f.needle, f.course])).toEqual([[1, 1]]);
    const f = floats[0];
    if (!f) return;
    expect(bbox(f.path).width).toBeCloseTo(d.pxPerNeedle, 6);
    expect(bbox(f.path).height).toBeLessThan(0.2 * d.pxPerCourse);
    const firstLoop = d.items.findIndex((i) => i.kind === 'knit-loop' || i.kind === 'held-loop');
    expect(d.items.indexOf(f)).toBeLessThan(firstLoop);
    // Muted: the float is drawn darker than the loops of the same yarn.
    const loop = d.items.find((i) => i.kind === 'knit-loop');
    const L = (hex: string | undefined) => srgbHexToLab(hex ?? '#000000')?.L ?? 0;
    expect(L(f.paints.at(-1)?.stroke)).toBeLessThan(L(loop?.paints[2]?.stroke) - 10);
    expect(d.items.some((i) => i.kind === 'held-loop' && i.needle === 1 && i.course === 0)).toBe(true);
    expect(d.items.some((i) => i.kind === 'tuck-arc')).toBe(false);
  });

  it('a plated yarn draws a thin line in its own colour along each loop', () => {
    const colours = yarnColourMap(yarns);
    const d = renderTile(platedJersey, colours, opts(2, 2));
    const plating = d.items.filter((i) => i.kind === 'plating');
    const loops = d.items.filter((i) => i.kind === 'knit-loop');
    expect(plating.length).toBeGreaterThanOrEqual(loops.length);
    expect(plating.every((p) => p.paints.every((q) => q.stroke === colours.el))).toBe(true);
    const loopWidth = loops[0]?.paints.map((p) => p.width ?? 0) ?? [];
    expect(plating[0]?.paints[0]?.width ?? 99).toBeLessThan(0.3 * Math.max(...loopWidth));
  });

  it('identical cells share their path data', () => {
    const d = renderTile(jersey, yarns, opts(24, 24));
    const loops = d.items.filter((i) => i.kind === 'knit-loop');
    expect(loops.length).toBeGreaterThan(500);
    expect(new Set(loops.map((i) => i.path)).size).toBe(1);
    expect(new Set(d.items.map((i) => i.path)).size).toBeLessThanOrEqual(3);
  });
});

describe('renderTile: open structures show the background', () => {
  it('a looser tuck-miss mesh leaves clearly more background uncovered than plain jersey of the same yarn', () => {
    const j = openFraction(renderTile(texture('j', ['K'], { ground: 'pa' }), yarns, opts(12, 12, 200)));
    const m = openFraction(renderTile(mesh, yarns, opts(3, 3, 200)));
    // Coarse coverage counts at pixel centres.
    expect(j).toBeLessThan(0.18);
    expect(m).toBeGreaterThan(0.18);
    expect(m).toBeGreaterThan(j + 0.05);
  });
});

describe('colours', () => {
  it('a dope-dyed yarn is drawn in its own colour, a yarn-dyed one too', () => {
    const colours = yarnColourMap(yarns);
    expect(colours['pa-navy']).toBe(labToSrgbHex(navyLab));
    expect(colours['pes-red']).toBe(labToSrgbHex(redLab));
    const d = renderTile(jacquard, yarns, opts(1, 1));
    const bodies = new Set(d.items.filter((i) => i.kind === 'knit-loop' || i.kind === 'held-loop').map((i) => i.paints[2]?.stroke));
    expect(bodies.has(labToSrgbHex(redLab))).toBe(true);
    // The navy is dark: its loops are lifted a little for legibility, and stay within a few ΔE of it.
    const navyBody = [...bodies].find((b) => b !== labToSrgbHex(redLab));
    expect(deltaE2000(srgbHexToLab(navyBody ?? '#ffffff') ?? navyLab, navyLab)).toBeLessThan(6);
  });

  it('dyeable yarns take the colourway target, else an undyed neutral; bare elastane stays pale grey', () => {
    const target = { L: 55, a: -30, b: -10 };
    const colourway = { targets: [{ yarnIds: ['pa', 'el'], colour: target }] };
    const withTargets = yarnColourMap(yarns, colourway);
    expect(withTargets.pa).toBe(labToSrgbHex(target));
    const undyed = yarnColourMap(yarns);
    const paLab = srgbHexToLab(undyed.pa ?? '') ?? target;
    const coLab = srgbHexToLab(undyed.co ?? '') ?? target;
    const elLab = srgbHexToLab(withTargets.el ?? '') ?? target;
    // Raw white for the synthetic, greige (yellower) for the cotton, pale neutral grey for elastane.
    expect(paLab.L).toBeGreaterThan(85);
    expect(coLab.b).toBeGreaterThan(paLab.b + 3);
    expect(Math.hypot(elLab.a, elLab.b)).toBeLessThan(3);
    expect(elLab.L).toBeGreaterThan(75);
    expect(elLab.L).toBeLessThan(paLab.L);
    expect(withTargets.el).toBe(undyed.el);
  });

  it('renderTile colours yarns given as records with the colourway from its options', () => {
    const target = { L: 55, a: -30, b: -10 };
    const d = renderTile(pique, yarns, { ...opts(1, 1), colourway: { targets: [{ yarnIds: ['co'], colour: target }] } });
    expect(d.items.find((i) => i.kind === 'knit-loop')?.paints[2]?.stroke).toBe(labToSrgbHex(target));
  });

  it('the backdrop contrasts with the yarns: dark behind pale yarns, light behind dark ones', () => {
    const pale = backgroundOf(renderTile(mesh, yarns, opts(1, 1)));
    const dark = backgroundOf(renderTile(jersey, yarns, opts(1, 1)));
    expect(srgbHexToLab(pale)?.L ?? 100).toBeLessThan(30);
    expect(srgbHexToLab(dark)?.L ?? 0).toBeGreaterThan(45);
  });
});

// Product design §8 for the dye classes: acid dyes colour polyamide, polypropylene takes no dye
// (dope-dyed only), elastane takes little; the preview follows the dye plan of lib/colour.
describe('yarnLooks: the dyed result of a colourway with its dye plan', () => {
  const mk = (id: string, fibre: Yarn['fibres'][number]['fibre']): Yarn => ({ id, name: id, dtex: 78, fibres: [{ fibre, share: 1 }], colour: { state: 'dyeable' } });
  const styleYarns = [mk('pa', 'polyamide'), mk('pa2', 'polyamide'), mk('pp', 'polypropylene'), mk('pes', 'polyester'), el];
  const navy = { L: 22, a: 3, b: -25 };
  const red = { L: 45, a: 60, b: 35 };
  const targets = [
    { id: 'ground', name: 'Ground', yarnIds: ['pa'], colour: navy, route: 'garment-dyed' as const },
    { id: 'flash', name: 'Flash', yarnIds: ['pp'], colour: red, route: 'garment-dyed' as const },
  ];
  const plan = planColourway({ yarns: styleYarns, targets });
  const looks = yarnLooks(styleYarns, { targets, plan });
  const rawWhite = yarnLooks(styleYarns).pes;

  it('shows an undyeable polypropylene with a target undyed, and marks it, as the plan finds it', () => {
    expect(plan.findings.find((f) => f.kind === 'undyeable')?.yarnIds).toEqual(['pp']);
    expect(looks.pp?.source).toBe('undyeable');
    expect(looks.pp?.hex).toBe(rawWhite?.hex);
    // Without the plan the preview still shows the intent.
    expect(yarnLooks(styleYarns, { targets }).pp?.hex).toBe(labToSrgbHex(red));
  });

  it('shows an untargeted polyamide in the acid bath colour, and an untargeted polyester undyed with no target', () => {
    expect(plan.baths.find((b) => b.dyeClass === 'acid')?.yarnIds).toContain('pa2');
    expect(looks.pa?.source).toBe('target');
    expect(looks.pa2).toMatchObject({ source: 'bath', hex: labToSrgbHex(navy) });
    expect(looks.pes).toMatchObject({ source: 'no-target', hex: rawWhite?.hex });
    expect(looks.el?.source).toBe('pale');
    expect(yarnColourMap(styleYarns, { targets, plan })).toEqual(Object.fromEntries(Object.entries(looks).map(([id, l]) => [id, l.hex])));
  });

  it('a yarn-dyed target does not colour untargeted yarns: only garment baths do', () => {
    const yarnRoute = [{ ...targets[0]!, route: 'yarn-dyed' as const }];
    const p = planColourway({ yarns: styleYarns, targets: yarnRoute });
    expect(p.baths.map((b) => b.stage)).toEqual(['yarn']);
    expect(yarnLooks(styleYarns, { targets: yarnRoute, plan: p }).pa2?.source).toBe('no-target');
  });
});

describe('flat index colours per texture', () => {
  it('a palette of at least 12 colours, every pair clearly distinct (ΔE00 ≥ 10)', () => {
    expect(textureIndexPalette.length).toBeGreaterThanOrEqual(12);
    const labs = textureIndexPalette.map((h) => srgbHexToLab(h));
    for (let i = 0; i < labs.length; i++) {
      for (let j = i + 1; j < labs.length; j++) {
        const a = labs[i];
        const b = labs[j];
        if (!a || !b) throw new Error('palette entry does not parse');
        expect(deltaE2000(a, b), `${textureIndexPalette[i]} vs ${textureIndexPalette[j]}`).toBeGreaterThanOrEqual(10);
      }
    }
  });

  it('the same id always gets the same colour; a set of 16 ids gets 16 distinct colours', () => {
    expect(flatColourForTexture('tex-mesh-01')).toBe(flatColourForTexture('tex-mesh-01'));
    expect(textureIndexPalette).toContain(flatColourForTexture('anything'));
    const ids = Array.from({ length: 16 }, (_, i) => `texture-${i}`);
    const map = flatColoursForTextures(ids);
    expect(new Set(Object.values(map)).size).toBe(16);
    expect(flatColoursForTextures([...ids].reverse())).toEqual(map);
  });
});

describe('performance', () => {
  // The fourth-fastest of 30 runs: what the build costs, less the noise of a busy test machine.
  it('identical cells share one path array, so a tile of many repeats builds little geometry (speed figures: npm run bench)', () => {
    const rows = Array.from({ length: 24 }, (_, c) =>
      Array.from({ length: 24 }, (_, n) => 'KKKTKMKK'[(c * 7 + n * 3 + ((c * n) % 5)) % 8]).join(''),
    );
    const t = texture('big', rows, (c) => (c % 2 ? { ground: 'pa', plated: { yarn: 'el', draft: 3 } } : { ground: 'pes-red' }));
    const drawing = renderTile(t, yarnColourMap(yarns), opts(2, 2));
    const distinct = new Set(drawing.items.map((i) => i.path));
    expect(drawing.items.length).toBeGreaterThan(1000);
    expect(distinct.size).toBeLessThan(drawing.items.length / 10);
  });
});

describe('pattern helpers', () => {
  it('repeatsForMinSize: fewest whole repeats reaching the size', () => {
    // 1 needle at 20 wales/cm at 100 px/cm = 5 px: 13 repeats reach 64 px; 1 course at 28/cm = 3.57 px: 18.
    expect(repeatsForMinSize(jersey, 100, 64)).toEqual({ repeatsX: 13, repeatsY: 18 });
    expect(repeatsForMinSize(mesh, 1000, 64)).toEqual({ repeatsX: 1, repeatsY: 1 });
  });

  it('patternScale maps image px per stitch onto the target px per stitch', () => {
    expect(patternScale({ pxPerNeedle: 5, pxPerCourse: 4 }, { pxPerNeedle: 2.5, pxPerCourse: 8 })).toEqual({ x: 0.5, y: 2 });
    expect(patternScale({ pxPerNeedle: 5, pxPerCourse: 4 }, { pxPerNeedle: 1, pxPerCourse: 1 })).toEqual({ x: 0.2, y: 0.25 });
  });
});

describe('drawTile (canvas adapter) against a recording context', () => {
  type Call = [string, ...unknown[]];

  /** Records every method call and every style assignment. */
  class RecordingContext implements Canvas2DLike {
    calls: Call[] = [];
    sets: Call[] = [];
    private state: Record<string, unknown> = { fillStyle: '', strokeStyle: '', lineWidth: 1, lineCap: 'butt', lineJoin: 'miter', globalAlpha: 1 };
    private set(name: string, v: unknown) {
      this.sets.push([name, v]);
      this.state[name] = v;
    }
    get fillStyle() { return this.state.fillStyle; }
    set fillStyle(v: unknown) { this.set('fillStyle', v); }
    get strokeStyle() { return this.state.strokeStyle; }
    set strokeStyle(v: unknown) { this.set('strokeStyle', v); }
    get lineWidth() { return this.state.lineWidth as number; }
    set lineWidth(v: number) { this.set('lineWidth', v); }
    get lineCap() { return this.state.lineCap as string; }
    set lineCap(v: string) { this.set('lineCap', v); }
    get lineJoin() { return this.state.lineJoin as string; }
    set lineJoin(v: string) { this.set('lineJoin', v); }
    get globalAlpha() { return this.state.globalAlpha as number; }
    set globalAlpha(v: number) { this.set('globalAlpha', v); }
    save() { this.calls.push(['save']); }
    restore() { this.calls.push(['restore']); }
    translate(x: number, y: number) { this.calls.push(['translate', x, y]); }
    scale(x: number, y: number) { this.calls.push(['scale', x, y]); }
    beginPath() { this.calls.push(['beginPath']); }
    moveTo(x: number, y: number) { this.calls.push(['moveTo', x, y]); }
    lineTo(x: number, y: number) { this.calls.push(['lineTo', x, y]); }
    bezierCurveTo(a: number, b: number, c: number, d: number, x: number, y: number) { this.calls.push(['bezierCurveTo', a, b, c, d, x, y]); }
    closePath() { this.calls.push(['closePath']); }
    rect(x: number, y: number, w: number, h: number) { this.calls.push(['rect', x, y, w, h]); }
    clip() { this.calls.push(['clip']); }
    fill() { this.calls.push(['fill']); }
    stroke() { this.calls.push(['stroke']); }
  }
  const recorder = () => new RecordingContext();

  it('replays every paint pass of every item, offset to the item, clipped to the tile, state restored', () => {
    const d = renderTile(pique, yarns, opts(2, 1));
    const ctx = recorder();
    drawTile(ctx, d, { x: 10, y: 20, scaleX: 2, scaleY: 3 });
    const names = ctx.calls.map((c) => c[0]);
    expect(names.slice(0, 3)).toEqual(['save', 'translate', 'scale']);
    expect(ctx.calls[1]).toEqual(['translate', 10, 20]);
    expect(ctx.calls[2]).toEqual(['scale', 2, 3]);
    expect(ctx.calls[4]).toEqual(['rect', 0, 0, d.widthPx, d.heightPx]);
    expect(names[5]).toBe('clip');
    expect(names.at(-1)).toBe('restore');
    expect(names.filter((n) => n === 'save')).toHaveLength(1);
    expect(names.filter((n) => n === 'restore')).toHaveLength(1);
    const strokes = d.items.reduce((s, i) => s + i.paints.filter((p) => p.stroke !== undefined).length, 0);
    const fills = d.items.reduce((s, i) => s + i.paints.filter((p) => p.fill !== undefined).length, 0);
    expect(names.filter((n) => n === 'stroke')).toHaveLength(strokes);
    expect(names.filter((n) => n === 'fill')).toHaveLength(fills);
    expect(ctx.sets).toContainEqual(['lineCap', 'round']);
    expect(ctx.sets).toContainEqual(['fillStyle', backgroundOf(d)]);
    // The first loop's outline pass: its path's first curve, moved to the item's position.
    const loop = d.items.find((i) => i.kind === 'knit-loop');
    const curve = loop?.path.find((c) => c.op === 'bezierCurveTo');
    if (!loop || !curve || curve.op !== 'bezierCurveTo') throw new Error('no loop');
    const outline = loop.paints[1];
    expect(ctx.calls).toContainEqual(['bezierCurveTo', curve.cp1x + loop.x, curve.cp1y + loop.y, curve.cp2x + loop.x, curve.cp2y + loop.y, curve.x + loop.x, curve.y + loop.y]);
    expect(ctx.sets).toContainEqual(['strokeStyle', outline?.stroke]);
  });

  it('sets a style only when it changes', () => {
    const d = renderTile(jersey, yarns, opts(1, 1));
    const line: Path = [{ op: 'moveTo', x: 0, y: 0 }, { op: 'lineTo', x: 1, y: 1 }];
    const item = (stroke: string, width: number): DrawItem => ({ kind: 'float', path: line, x: 0, y: 0, paints: [{ stroke, width }], needle: 0, course: 0 });
    const ctx = recorder();
    drawTile(ctx, { ...d, items: [item('#112233', 1), item('#112233', 1), item('#445566', 1), item('#445566', 2)] });
    expect(ctx.calls.filter((c) => c[0] === 'stroke')).toHaveLength(4);
    expect(ctx.sets.filter((s) => s[0] === 'strokeStyle')).toEqual([['strokeStyle', '#112233'], ['strokeStyle', '#445566']]);
    expect(ctx.sets.filter((s) => s[0] === 'lineWidth')).toEqual([['lineWidth', 1], ['lineWidth', 2]]);
  });

  it('can leave the clip off', () => {
    const ctx = recorder();
    drawTile(ctx, renderTile(jersey, yarns, opts(1, 1)), { clip: false });
    expect(ctx.calls.some((c) => c[0] === 'clip')).toBe(false);
  });
});

describe('drawingToSvg', () => {
  it('writes each shared path once and one <use> per paint pass, at the tile size', () => {
    const d = renderTile(mesh, yarns, opts(2, 2));
    const svg = drawingToSvg(d, { width: `${d.widthCm * 10}mm`, height: `${d.heightCm * 10}mm` });
    const distinct = new Set(d.items.map((i) => i.path)).size;
    expect(svg.match(/<path /g)).toHaveLength(distinct);
    const passes = d.items.reduce((s, i) => s + i.paints.length, 0);
    expect(svg.match(/<use /g)).toHaveLength(passes);
    expect(svg).toContain(`width="${d.widthCm * 10}mm"`);
    expect(svg).toContain(`viewBox="0 0 ${d.widthPx.toFixed(3).replace(/0+$/, '').replace(/\.$/, '')}`);
    expect(svg).toContain('clip-path="url(#tile)"');
  });
});
