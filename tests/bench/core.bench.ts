/**
 * Benchmark of the computation core on a seamless body: two panels (front, back) of 576 × 2600
 * stitches with 40 zones in all. Prints the median time of each step over several runs, the ratio of
 * the raster to a plain typed-array fill of the same cells, and the bytes the cell grids take, then
 * each aim with MET or MISSED. It prints figures; it asserts nothing about time and never fails.
 *
 * Run: npm run bench
 */
import { garmentConsumption, keptYarnGrams } from '../../lib/knit/consumption';
import { contentLabel, fibreContent } from '../../lib/knit/content';
import type { Panel, StitchPoint, Zone, ZoneFunction } from '../../lib/knit/panel';
import { rectanglePolygon } from '../../lib/knit/panel';
import { countStitches, mirrorZone, rasterizePanel, type PanelRaster } from '../../lib/knit/raster';
import type { StitchAction, Texture } from '../../lib/knit/texture';
import type { Yarn } from '../../lib/knit/yarn';

const WIDTH = 576; // half of a 1152-needle cylinder
const HEIGHT = 2600;
const GAUGE = 28;
const RUNS = 25;
const WARM_UP = 5;

// The aims (product design: the live summary follows every edit).
/** Whole recomputation after an edit (raster → counts → grams → label), median ms. */
const AIM_WHOLE_MS = 50;
/** The raster (cells only) at most this many times a plain fill of the same cells. */
const AIM_RASTER_OVER_FILL = 10;
/** The texture renderer's 2 × 2 tile, median ms. */
const AIM_RENDER_MS = 5;

const verdict = (met: boolean) => (met ? 'MET' : 'MISSED');

// Deterministic pseudo-random numbers, so every run draws the same body map.
let seed = 20240601;
function random(): number {
  seed = (seed * 1664525 + 1013904223) >>> 0;
  return seed / 2 ** 32;
}

const yarns: Yarn[] = [
  { id: 'pa78', name: 'PA 78 dtex f68', dtex: 78, fibres: [{ fibre: 'polyamide', share: 1 }], colour: { state: 'dyeable' } },
  { id: 'pes56', name: 'PES 56 dtex f48', dtex: 56, fibres: [{ fibre: 'polyester', share: 1 }], colour: { state: 'dyeable' } },
  { id: 'el44', name: 'EL 44 dtex', dtex: 44, fibres: [{ fibre: 'elastane', share: 1 }], colour: { state: 'dyeable' } },
];

function chart(rows: string[]): StitchAction[][] {
  const map: Record<string, StitchAction> = { K: 'knit', T: 'tuck', M: 'miss' };
  return rows.map((r) => [...r].map((c) => map[c] ?? 'knit'));
}

function texture(id: string, rows: string[], ground: string, plated: boolean, loopKnit: number): Texture {
  const cells = chart(rows);
  return {
    id,
    name: id,
    repeat: { needles: cells[0]?.length ?? 1, courses: cells.length, cells },
    feeders: cells.map(() => (plated ? { ground, plated: { yarn: 'el44', draft: 2.8 } } : { ground })),
    density: { walesPerCm: 16, coursesPerCm: 22 },
    loopMm: { knit: loopKnit, tuck: loopKnit * 0.7 },
  };
}

const textures: Texture[] = [
  texture('jersey', ['K'], 'pa78', true, 2.6),
  texture('rib-compression', ['KKMM', 'KKMM'], 'pa78', true, 2.4),
  texture('mesh', ['KTKK', 'KKKT', 'KTKK', 'KKKT'], 'pes56', false, 2.9),
  texture('support', ['KM', 'MK'], 'pa78', true, 2.2),
  texture('colour-block', ['KKKK', 'TKTK'], 'pes56', true, 2.7),
  texture('hem', ['KKMM'], 'pa78', true, 2.5),
];

function blob(cx: number, cy: number, rx: number, ry: number, vertices: number): StitchPoint[] {
  const out: StitchPoint[] = [];
  for (let k = 0; k < vertices; k++) {
    const a = (k / vertices) * Math.PI * 2;
    const r = 0.75 + 0.25 * random();
    out.push({ x: Math.round(cx + Math.cos(a) * rx * r), y: Math.round(cy + Math.sin(a) * ry * r) });
  }
  return out;
}

function zone(id: string, textureId: string, fn: ZoneFunction, order: number, polygon: StitchPoint[]): Zone {
  return { id, name: id, textureId, fn, order, polygon };
}

/** 20 zones: hem and waist bands, 6 mirrored pairs of side and princess panels, 4 meshes, 2 blocks. */
function bodyZones(prefix: string): Zone[] {
  const zones: Zone[] = [
    zone(`${prefix}-hem`, 'hem', 'hem', 1, [
      { x: -4, y: 2450 },
      { x: WIDTH + 4, y: 2450 },
      { x: WIDTH + 4, y: HEIGHT + 4 },
      { x: -4, y: HEIGHT + 4 },
    ]),
    zone(`${prefix}-waist`, 'support', 'support', 2, [
      { x: 0, y: 1500 },
      { x: WIDTH, y: 1470 },
      { x: WIDTH, y: 1650 },
      { x: 0, y: 1680 },
    ]),
  ];
  for (let k = 0; k < 6; k++) {
    const top = 300 + k * 300;
    const left = 10 + k * 30;
    const side = zone(`${prefix}-side-${k}`, k % 2 ? 'rib-compression' : 'support', 'compression', 3 + (k % 3), [
      { x: left, y: top },
      { x: left + 60 + 5 * k, y: top + 40 },
      { x: left + 90, y: top + 400 },
      { x: left + 70, y: top + 700 },
      { x: left + 20, y: top + 760 },
      { x: left - 8, y: top + 380 },
    ]);
    zones.push(side, { ...mirrorZone(side, WIDTH), id: `${side.id}-mirror` });
  }
  for (let k = 0; k < 4; k++) {
    zones.push(zone(`${prefix}-mesh-${k}`, 'mesh', 'ventilation', 6, blob(WIDTH / 2 + (k - 1.5) * 90, 500 + k * 420, 70, 180, 24)));
  }
  zones.push(
    zone(`${prefix}-block-a`, 'colour-block', 'colour-block', 4, blob(WIDTH * 0.35, 900, 160, 500, 32)),
    zone(`${prefix}-block-b`, 'colour-block', 'colour-block', 5, blob(WIDTH * 0.7, 1900, 150, 420, 32)),
  );
  return zones;
}

/** Cut outline with a scooped neckline and two armholes (about 40 vertices). */
function cutOutline(neckDepth: number): StitchPoint[] {
  const pts: StitchPoint[] = [{ x: 0, y: 520 }];
  // Left armhole, a quarter curve from the side seam up to the shoulder.
  for (let k = 0; k <= 8; k++) {
    const a = (k / 8) * (Math.PI / 2);
    pts.push({ x: Math.round(70 - Math.cos(a) * 70), y: Math.round(520 - Math.sin(a) * 400) });
  }
  pts.push({ x: 170, y: 80 });
  // Neckline.
  for (let k = 0; k <= 16; k++) {
    const a = Math.PI - (k / 16) * Math.PI;
    pts.push({ x: Math.round(WIDTH / 2 + Math.cos(a) * 118), y: Math.round(80 + Math.sin(a) * neckDepth) });
  }
  pts.push({ x: WIDTH - 170, y: 80 });
  for (let k = 8; k >= 0; k--) {
    const a = (k / 8) * (Math.PI / 2);
    pts.push({ x: Math.round(WIDTH - 70 + Math.cos(a) * 70), y: Math.round(520 - Math.sin(a) * 400) });
  }
  pts.push({ x: WIDTH, y: HEIGHT }, { x: 0, y: HEIGHT });
  return pts;
}

function bodyPanel(id: 'front' | 'back', neckDepth: number): Panel {
  return {
    id,
    name: id,
    kind: id,
    widthNeedles: WIDTH,
    heightCourses: HEIGHT,
    knittedArea: rectanglePolygon(WIDTH, HEIGHT),
    cutOutline: cutOutline(neckDepth),
    baseTextureId: 'jersey',
    zones: bodyZones(id),
  };
}

const panels = [bodyPanel('front', 260), bodyPanel('back', 70)];

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? (s[m] as number) : ((s[m - 1] as number) + (s[m] as number)) / 2;
}

/** Fastest run of each timed step, to show beside the medians (on a busy machine they differ). */
const fastest = new Map<string, number>();

function time(label: string, fn: () => void): number {
  for (let i = 0; i < WARM_UP; i++) fn();
  const ts: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    fn();
    ts.push(performance.now() - t0);
  }
  const m = median(ts);
  fastest.set(label, Math.min(...ts));
  console.log(`${label.padEnd(52)} ${m.toFixed(3).padStart(9)} ms   (min ${Math.min(...ts).toFixed(3)})`);
  return m;
}

const reuse = panels.map(() => ({ cells: new Uint16Array(WIDTH * HEIGHT) }));
let rasters: PanelRaster[] = panels.map((p, i) => rasterizePanel(p, { reuse: reuse[i] as { cells: Uint16Array } }));

console.log(`Needlemap core benchmark: ${panels.length} panels of ${WIDTH} × ${HEIGHT} stitches, ` + `${panels.reduce((s, p) => s + p.zones.length, 0)} zones, median of ${RUNS} runs after ${WARM_UP} warm-up runs`);
console.log(`node ${process.version}`);
console.log('');

const fillTargets = panels.map(() => new Uint16Array(WIDTH * HEIGHT));
const FILL = 'plain fill of the same cells (TypedArray.fill)';
const RASTER = 'raster, cells only (rasterizePanel, counts: false)';
const tFill = time(FILL, () => {
  for (const [i, a] of fillTargets.entries()) a.fill(i + 1);
});
const tRowFill = time('per-course fill (one fill call per course)', () => {
  for (const [i, a] of fillTargets.entries()) {
    for (let row = 0; row < HEIGHT; row++) a.fill(i + 1, row * WIDTH, (row + 1) * WIDTH);
  }
});
const tRaster = time(RASTER, () => {
  panels.forEach((p, i) => rasterizePanel(p, { reuse: reuse[i] as { cells: Uint16Array }, counts: false }));
});
const tRasterCounts = time('raster + counts (rasterizePanel)', () => {
  rasters = panels.map((p, i) => rasterizePanel(p, { reuse: reuse[i] as { cells: Uint16Array } }));
});
const tRasterFresh = time('raster + counts, fresh buffers', () => {
  panels.map((p) => rasterizePanel(p));
});
time('  for comparison: cell-by-cell recount (countStitches)', () => {
  rasters.forEach((r, i) => countStitches(r, (panels[i] as Panel).cutOutline));
});
const tConsumption = time('consumption (garmentConsumption)', () => {
  garmentConsumption({ panels: rasters, textures, yarns, gauge: GAUGE, wasteAllowance: 0.05 });
});
const consumption = garmentConsumption({ panels: rasters, textures, yarns, gauge: GAUGE, wasteAllowance: 0.05 });
const tLabel = time('content + labels (fibreContent, contentLabel eu + us)', () => {
  const grams = keptYarnGrams(consumption);
  contentLabel(fibreContent({ yarnGrams: grams, yarns, method: 'nominal' }), 'us');
  contentLabel(fibreContent({ yarnGrams: grams, yarns, method: 'eu-allowance' }), 'eu');
});
const tWhole = time('whole recomputation (raster → counts → grams → label)', () => {
  const rs = panels.map((p, i) => rasterizePanel(p, { reuse: reuse[i] as { cells: Uint16Array } }));
  const c = garmentConsumption({ panels: rs, textures, yarns, gauge: GAUGE, wasteAllowance: 0.05 });
  const grams = keptYarnGrams(c);
  contentLabel(fibreContent({ yarnGrams: grams, yarns, method: 'nominal' }), 'us');
  contentLabel(fibreContent({ yarnGrams: grams, yarns, method: 'eu-allowance' }), 'eu');
});

const bytes = rasters.reduce((s, r) => s + r.cells.byteLength, 0);
const eu = contentLabel(fibreContent({ yarnGrams: keptYarnGrams(consumption), yarns, method: 'eu-allowance' }), 'eu');
console.log('');
// The counts are taken while the raster is drawn (each claimed piece is counted as it is written),
// so their own cost is the small difference of two medians and may read as noise.
console.log(`counts (raster + counts − cells only)                 ${Math.max(0, tRasterCounts - tRaster).toFixed(3).padStart(9)} ms  (counted while drawing; within run-to-run noise)`);
console.log(`raster ÷ plain fill of the same cells                 ${(tRaster / tFill).toFixed(1).padStart(9)} ×`);
console.log(`raster + counts ÷ plain fill                          ${(tRasterCounts / tFill).toFixed(1).padStart(9)} ×`);
console.log(`raster ÷ per-course fill                              ${(tRaster / tRowFill).toFixed(1).padStart(9)} ×`);
console.log(`fresh buffers ÷ reused                                ${(tRasterFresh / tRasterCounts).toFixed(1).padStart(9)} ×`);
console.log(`cell grids: ${rasters.length} × Uint16Array(${WIDTH * HEIGHT}) = ${bytes.toLocaleString('en')} bytes (${(bytes / 2 ** 20).toFixed(2)} MiB)`);
console.log(`consumption ${tConsumption.toFixed(3)} ms, label ${tLabel.toFixed(3)} ms`);
console.log('');
const rasterOverFill = tRaster / tFill;
const rasterOverFillFastest = (fastest.get(RASTER) as number) / (fastest.get(FILL) as number);
console.log(`aim: whole recomputation under ${AIM_WHOLE_MS} ms: median ${tWhole.toFixed(1)} ms — ${verdict(tWhole < AIM_WHOLE_MS)}`);
console.log(
  `aim: raster within ${AIM_RASTER_OVER_FILL}× of the plain fill: median ${rasterOverFill.toFixed(1)} × — ${verdict(rasterOverFill <= AIM_RASTER_OVER_FILL)}` +
    ` (fastest runs: ${rasterOverFillFastest.toFixed(1)} ×)`,
);
console.log('');
console.log(`stitches knitted ${rasters.reduce((s, r) => s + r.knitted, 0).toLocaleString('en')}, kept ${rasters.reduce((s, r) => s + r.inside, 0).toLocaleString('en')}; yarn per garment ${consumption.grossGrams.toFixed(1)} g incl. 5 % allowance`);
console.log(`EU label: ${eu.text}`);

// The texture renderer: a 2 × 2 tile of a 24 × 24 repeat (the size the body map asks for when zoomed in).
{
  const { renderTile, yarnColourMap } = await import('../../lib/knit/render');
  const rows = Array.from({ length: 24 }, (_, c) => Array.from({ length: 24 }, (_, n) => (['knit', 'knit', 'tuck', 'knit', 'miss'] as const)[(c * 7 + n * 3) % 5]!));
  const tex = { ...textures[0]!, id: 'bench-render', repeat: { needles: 24, courses: 24, cells: rows }, feeders: rows.map(() => textures[0]!.feeders[0]!) };
  const colours = yarnColourMap(yarns);
  const times: number[] = [];
  for (let i = 0; i < 40; i++) {
    const t0 = performance.now();
    renderTile(tex, colours, { repeatsX: 2, repeatsY: 2, pxPerCm: 100 });
    times.push(performance.now() - t0);
  }
  const renderMs = median(times);
  console.log(`aim: render a 2 × 2 tile of a 24 × 24 repeat well under ${AIM_RENDER_MS} ms: median ${renderMs.toFixed(2)} ms — ${verdict(renderMs < AIM_RENDER_MS)}`);
}
