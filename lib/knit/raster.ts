/**
 * The stitch raster: a panel drawn into a grid of needles × courses, one cell per stitch.
 *
 * Cell (i, j) — needle i, course j — is sampled at its centre (i + 0.5, j + 0.5). Polygons are filled
 * by the even-odd rule with a scanline fill: for each course the x-crossings of the polygon's edges
 * are found (an edge counts for a course when y0 ≤ j + 0.5 < y1, so a vertex is crossed once), sorted,
 * and paired into spans. A centre lying exactly on a left or right edge is inside (closed spans), which
 * makes mirroring across the centre line keep every count.
 *
 * Each course starts with the knitted area's spans free. Zones are taken from the top of the stack
 * down: each claims what is still free under its spans (so it is clipped to the knitted area and to
 * the zones above it); what is left goes to the base texture. Every claimed piece is written once
 * with `TypedArray.fill` and counted against the cut outline's spans on that course.
 */
import type { Panel, StitchPoint, StitchPolygon, Zone } from './panel';

export interface StitchCount {
  /** Stitches inside the cut outline (kept in the garment). */
  inside: number;
  /** Stitches knitted outside the cut outline (cut away). */
  outside: number;
}

export interface ZoneStitchCount extends StitchCount {
  zoneId: string;
}

export interface PanelRaster {
  /** Needles. */
  width: number;
  /** Courses. */
  height: number;
  /** Row-major, `cells[course * width + needle]`: 0 = not knitted, k ≥ 1 = texture `legend[k]`. */
  cells: Uint16Array;
  /** Index → texture id; `legend[0]` is '' (not knitted), `legend[1]` the base texture. */
  legend: string[];
  /** Knitted stitches per texture id, inside and outside the cut outline. */
  stitches: Record<string, StitchCount>;
  /** Visible stitches per zone (what no zone above it covers), in `panel.zones` order. */
  zoneStitches: ZoneStitchCount[];
  /** Stitches the machine knits. */
  knitted: number;
  /** Knitted stitches inside the cut outline. */
  inside: number;
  /** With `zoneMap`: 0 = base texture or not knitted, k = `panel.zones[k - 1]` drew the cell. */
  zoneCells?: Uint16Array;
}

export interface RasterOptions {
  /** Also return `zoneCells`, the zone that drew each cell. */
  zoneMap?: boolean;
  /** Count stitches (default true). With false, `stitches` and the totals are left empty/0. */
  counts?: boolean;
  /** Reuse these buffers when their size matches (saves allocation on every edit). */
  reuse?: { cells?: Uint16Array; zoneCells?: Uint16Array };
}

/**
 * The spans of one polygon, course by course: spans of course `row` are
 * `starts[k], ends[k]` (half-open needle ranges, clipped to [0, width), sorted, disjoint) for
 * k in [offsets[row − minRow], offsets[row − minRow + 1]).
 */
export interface SpanTable {
  minRow: number;
  /** One past the last course with a span. */
  maxRow: number;
  offsets: Int32Array;
  starts: Int32Array;
  ends: Int32Array;
}

const emptyTable: SpanTable = {
  minRow: 0,
  maxRow: 0,
  offsets: new Int32Array(1),
  starts: new Int32Array(0),
  ends: new Int32Array(0),
};

/**
 * Scanline fill of a polygon (even-odd) into a span table. Each edge is visited for the courses it
 * crosses only; an edge counts for course j when y0 ≤ j + 0.5 < y1 (so a vertex is crossed once);
 * the crossings of a course are sorted and paired, and a pair [a, b] covers the needles whose centre
 * i + 0.5 lies in it (closed, so the rule is the same on the left and the right edge).
 */
export function polygonSpans(polygon: readonly StitchPoint[], width: number, height: number): SpanTable {
  const n = polygon.length;
  if (n < 3) return emptyTable;
  // Edges, oriented downwards; horizontal (and NaN) edges dropped.
  const ex0 = new Float64Array(n);
  const ey0 = new Float64Array(n);
  const edx = new Float64Array(n);
  const edy = new Float64Array(n);
  const ers = new Int32Array(n);
  const ere = new Int32Array(n);
  let ne = 0;
  let minRow = height;
  let maxRow = 0;
  for (let k = 0; k < n; k++) {
    const p = polygon[k] as StitchPoint;
    const q = polygon[(k + 1) % n] as StitchPoint;
    if (!(p.y !== q.y) || !Number.isFinite(p.x) || !Number.isFinite(q.x)) continue;
    const lo = p.y < q.y ? p : q;
    const hi = p.y < q.y ? q : p;
    const rs = Math.max(0, Math.ceil(lo.y - 0.5));
    const re = Math.min(height, Math.ceil(hi.y - 0.5));
    if (!(re > rs)) continue;
    ex0[ne] = lo.x;
    ey0[ne] = lo.y;
    edx[ne] = hi.x - lo.x;
    edy[ne] = hi.y - lo.y;
    ers[ne] = rs;
    ere[ne] = re;
    ne++;
    if (rs < minRow) minRow = rs;
    if (re > maxRow) maxRow = re;
  }
  if (ne === 0) return emptyTable;
  const rows = maxRow - minRow;
  // Crossings per course by a difference array, then their offsets.
  const xoff = new Int32Array(rows + 1);
  const diff = new Int32Array(rows + 1);
  for (let e = 0; e < ne; e++) {
    diff[(ers[e] as number) - minRow] = (diff[(ers[e] as number) - minRow] as number) + 1;
    diff[(ere[e] as number) - minRow] = (diff[(ere[e] as number) - minRow] as number) - 1;
  }
  let running = 0;
  for (let r = 0; r < rows; r++) {
    running += diff[r] as number;
    xoff[r + 1] = (xoff[r] as number) + running;
  }
  const total = xoff[rows] as number;
  const xs = new Float64Array(total);
  const cursor = xoff.slice(0, rows);
  for (let e = 0; e < ne; e++) {
    const x0 = ex0[e] as number;
    const y0 = ey0[e] as number;
    const dx = edx[e] as number;
    const dy = edy[e] as number;
    const re = ere[e] as number;
    for (let row = ers[e] as number; row < re; row++) {
      const r = row - minRow;
      // Multiply before dividing: a crossing that falls exactly on a stitch centre is exact.
      xs[cursor[r] as number] = x0 + ((row + 0.5 - y0) * dx) / dy;
      cursor[r] = (cursor[r] as number) + 1;
    }
  }
  // Sort each course's crossings (few per course: insertion sort) and pair them into spans.
  const offsets = new Int32Array(rows + 1);
  const starts = new Int32Array(total >> 1);
  const ends = new Int32Array(total >> 1);
  let count = 0;
  for (let r = 0; r < rows; r++) {
    const lo = xoff[r] as number;
    const hi = xoff[r + 1] as number;
    for (let i = lo + 1; i < hi; i++) {
      const x = xs[i] as number;
      let k = i;
      while (k > lo && (xs[k - 1] as number) > x) {
        xs[k] = xs[k - 1] as number;
        k--;
      }
      xs[k] = x;
    }
    const first = count;
    for (let k = lo; k + 1 < hi; k += 2) {
      let start = Math.ceil((xs[k] as number) - 0.5);
      let end = Math.floor((xs[k + 1] as number) - 0.5) + 1;
      if (start < 0) start = 0;
      if (end > width) end = width;
      if (end <= start) continue;
      if (count > first && start <= (ends[count - 1] as number)) {
        if (end > (ends[count - 1] as number)) ends[count - 1] = end;
      } else {
        starts[count] = start;
        ends[count] = end;
        count++;
      }
    }
    offsets[r + 1] = count;
  }
  return { minRow, maxRow, offsets, starts, ends };
}

/**
 * The part of one course that no zone above has claimed yet: sorted, disjoint needle ranges,
 * double-buffered. Zones are taken from the top of the stack down; each takes what is still free
 * under its spans, so every stitch is decided once.
 */
class FreeSpans {
  s: Int32Array;
  e: Int32Array;
  n = 0;
  private s2: Int32Array;
  private e2: Int32Array;
  constructor(capacity: number) {
    this.s = new Int32Array(capacity);
    this.e = new Int32Array(capacity);
    this.s2 = new Int32Array(capacity);
    this.e2 = new Int32Array(capacity);
  }
  /** Starts the course with the spans of `table` on `row`. */
  reset(table: SpanTable, row: number): void {
    this.n = 0;
    if (row < table.minRow || row >= table.maxRow) return;
    const r = row - table.minRow;
    const lo = table.offsets[r] as number;
    const hi = table.offsets[r + 1] as number;
    if (this.s.length < hi - lo + 2) this.grow(hi - lo + 2);
    for (let k = lo; k < hi; k++) {
      this.s[k - lo] = table.starts[k] as number;
      this.e[k - lo] = table.ends[k] as number;
    }
    this.n = hi - lo;
  }
  private grow(min: number): void {
    const cap = Math.max(min, this.s.length * 2);
    const s = new Int32Array(cap);
    const e = new Int32Array(cap);
    s.set(this.s);
    e.set(this.e);
    this.s = s;
    this.e = e;
    this.s2 = new Int32Array(cap);
    this.e2 = new Int32Array(cap);
  }
  /**
   * Takes [a, b) out of the free spans; `claim.piece(start, end)` is called for each free piece
   * under it.
   */
  take(a: number, b: number, claim: Claim): void {
    const n = this.n;
    const s = this.s;
    const e = this.e;
    let k = 0;
    while (k < n && (e[k] as number) <= a) k++;
    if (k === n || (s[k] as number) >= b) return;
    if (this.s2.length < n + 2) this.grow(n + 2);
    const s2 = this.s2;
    const e2 = this.e2;
    let m = 0;
    for (let r = 0; r < k; r++) {
      s2[m] = s[r] as number;
      e2[m] = e[r] as number;
      m++;
    }
    for (let r = k; r < n; r++) {
      const rs = s[r] as number;
      const re = e[r] as number;
      if (rs >= b) {
        s2[m] = rs;
        e2[m] = re;
        m++;
        continue;
      }
      if (rs < a) {
        s2[m] = rs;
        e2[m] = a;
        m++;
      }
      claim.piece(rs > a ? rs : a, re < b ? re : b);
      if (re > b) {
        s2[m] = b;
        e2[m] = re;
        m++;
      }
    }
    this.s = s2;
    this.e = e2;
    this.s2 = s;
    this.e2 = e;
    this.n = m;
  }
}

/** Writes and counts the pieces of one course as they are decided. */
class Claim {
  v = 0;
  z = 0;
  off = 0;
  cutLo = 0;
  cutHi = 0;
  counting = true;
  constructor(
    readonly cells: Uint16Array,
    readonly zoneCells: Uint16Array | undefined,
    readonly cut: SpanTable,
    readonly total: Float64Array,
    readonly inside: Float64Array,
    readonly zoneTotal: Float64Array,
    readonly zoneInside: Float64Array,
  ) {}
  piece(start: number, end: number): void {
    const v = this.v;
    const z = this.z;
    this.cells.fill(v, this.off + start, this.off + end);
    if (this.zoneCells) this.zoneCells.fill(z, this.off + start, this.off + end);
    if (!this.counting) return;
    const len = end - start;
    this.total[v] = (this.total[v] as number) + len;
    this.zoneTotal[z] = (this.zoneTotal[z] as number) + len;
    const starts = this.cut.starts;
    const ends = this.cut.ends;
    let inside = 0;
    for (let c = this.cutLo; c < this.cutHi; c++) {
      const cs = starts[c] as number;
      if (cs >= end) break;
      const ce = ends[c] as number;
      const overlap = (ce < end ? ce : end) - (cs > start ? cs : start);
      if (overlap > 0) inside += overlap;
    }
    if (inside > 0) {
      this.inside[v] = (this.inside[v] as number) + inside;
      this.zoneInside[z] = (this.zoneInside[z] as number) + inside;
    }
  }
}

interface CourseJob {
  width: number;
  cells: Uint16Array;
  zoneCells: Uint16Array | undefined;
  knittedSpans: SpanTable;
  cutSpans: SpanTable;
  zoneSpans: SpanTable[];
  drawIndex: Int32Array;
  zoneTexture: Uint16Array;
  free: FreeSpans;
  claim: Claim;
}

/** Decides, writes and counts one course of the raster. */
function drawCourse(job: CourseJob, row: number): void {
  const { width, cells, zoneCells, knittedSpans, cutSpans, zoneSpans, drawIndex, zoneTexture, free, claim } = job;
  const off = row * width;
  claim.off = off;
  if (row >= cutSpans.minRow && row < cutSpans.maxRow) {
    claim.cutLo = cutSpans.offsets[row - cutSpans.minRow] as number;
    claim.cutHi = cutSpans.offsets[row - cutSpans.minRow + 1] as number;
  } else {
    claim.cutLo = 0;
    claim.cutHi = 0;
  }
  // Not knitted: the gaps between the knitted area's spans are 0.
  free.reset(knittedSpans, row);
  let x = 0;
  for (let k = 0; k < free.n; k++) {
    const s = free.s[k] as number;
    if (s > x) {
      cells.fill(0, off + x, off + s);
      zoneCells?.fill(0, off + x, off + s);
    }
    x = free.e[k] as number;
  }
  if (x < width) {
    cells.fill(0, off + x, off + width);
    zoneCells?.fill(0, off + x, off + width);
  }
  // Zones from the top of the stack down, each taking what is still free under it.
  for (let d = zoneSpans.length - 1; d >= 0 && free.n > 0; d--) {
    const t = zoneSpans[d] as SpanTable;
    if (row < t.minRow || row >= t.maxRow) continue;
    const r = row - t.minRow;
    const hi = t.offsets[r + 1] as number;
    const k = drawIndex[d] as number;
    claim.v = zoneTexture[k] as number;
    claim.z = k + 1;
    for (let sp = t.offsets[r] as number; sp < hi && free.n > 0; sp++) {
      free.take(t.starts[sp] as number, t.ends[sp] as number, claim);
    }
  }
  // What is left is the base texture.
  claim.v = 1;
  claim.z = 0;
  for (let k = 0; k < free.n; k++) claim.piece(free.s[k] as number, free.e[k] as number);
}

function assertDimension(value: number, what: string): void {
  if (!Number.isInteger(value) || value < 1 || value > 1_000_000) {
    throw new RangeError(`Panel ${what} must be a whole number of stitches ≥ 1 (got ${value}).`);
  }
}

/**
 * Draws a panel into its stitch raster and counts stitches per texture inside and outside the cut
 * outline. Zones are applied by stacking order (`order`, ties by their place in `panel.zones`) and
 * clipped to the knitted area; the base texture fills the rest of the knitted area; cells outside
 * the knitted area are 0. Product design §5.
 */
export function rasterizePanel(panel: Panel, opts: RasterOptions = {}): PanelRaster {
  const width = panel.widthNeedles;
  const height = panel.heightCourses;
  assertDimension(width, 'width');
  assertDimension(height, 'height');
  const size = width * height;
  const cells = opts.reuse?.cells?.length === size ? opts.reuse.cells : new Uint16Array(size);
  const zoneCells = opts.zoneMap
    ? opts.reuse?.zoneCells?.length === size
      ? opts.reuse.zoneCells
      : new Uint16Array(size)
    : undefined;

  // Legend: texture ids by index.
  const legend = ['', panel.baseTextureId];
  const indexOf = new Map<string, number>([[panel.baseTextureId, 1]]);
  const drawOrder = panel.zones
    .map((zone, k) => ({ zone, k }))
    .sort((p, q) => p.zone.order - q.zone.order || p.k - q.k);
  const zoneTexture = new Uint16Array(panel.zones.length);
  for (const { zone, k } of drawOrder) {
    let idx = indexOf.get(zone.textureId);
    if (idx === undefined) {
      idx = legend.length;
      if (idx > 0xffff) throw new RangeError('A panel cannot hold more than 65 535 textures.');
      legend.push(zone.textureId);
      indexOf.set(zone.textureId, idx);
    }
    zoneTexture[k] = idx;
  }

  const knittedSpans = polygonSpans(panel.knittedArea, width, height);
  const cutSpans = polygonSpans(panel.cutOutline, width, height);
  const zoneSpans = drawOrder.map(({ zone }) => polygonSpans(zone.polygon, width, height));
  const drawIndex = Int32Array.from(drawOrder, (d) => d.k);

  const inside = new Float64Array(legend.length);
  const total = new Float64Array(legend.length);
  const zoneInside = new Float64Array(panel.zones.length + 1);
  const zoneTotal = new Float64Array(panel.zones.length + 1);
  const counting = opts.counts !== false;
  const free = new FreeSpans(64);
  const claim = new Claim(cells, zoneCells, cutSpans, total, inside, zoneTotal, zoneInside);
  claim.counting = counting;

  const job: CourseJob = { width, cells, zoneCells, knittedSpans, cutSpans, zoneSpans, drawIndex, zoneTexture, free, claim };
  // One call per course: a small function the engine optimises once, instead of a long loop in a
  // function that is entered once per panel.
  for (let row = 0; row < height; row++) drawCourse(job, row);

  const stitches: Record<string, StitchCount> = {};
  let knitted = 0;
  let insideTotal = 0;
  for (let k = 1; k < legend.length && counting; k++) {
    const t = total[k] as number;
    const i = inside[k] as number;
    stitches[legend[k] as string] = { inside: i, outside: t - i };
    knitted += t;
    insideTotal += i;
  }
  const zoneStitches = panel.zones.map((zone, k) => {
    const t = zoneTotal[k + 1] as number;
    const i = zoneInside[k + 1] as number;
    return { zoneId: zone.id, inside: i, outside: t - i };
  });
  const result: PanelRaster = { width, height, cells, legend, stitches, zoneStitches, knitted, inside: insideTotal };
  if (zoneCells) result.zoneCells = zoneCells;
  return result;
}

/**
 * Recounts stitches per texture from a raster's cells against a cut outline, cell by cell. Slower
 * than the counts `rasterizePanel` returns; useful after only the cut outline changed, and as a check.
 */
export function countStitches(raster: Pick<PanelRaster, 'width' | 'height' | 'cells' | 'legend'>, cutOutline: StitchPolygon): Record<string, StitchCount> {
  const { width, height, cells, legend } = raster;
  const table = polygonSpans(cutOutline, width, height);
  const inside = new Float64Array(legend.length);
  const total = new Float64Array(legend.length);
  for (let row = 0; row < height; row++) {
    const off = row * width;
    for (let i = off; i < off + width; i++) {
      const v = cells[i] as number;
      total[v] = (total[v] as number) + 1;
    }
    if (row < table.minRow || row >= table.maxRow) continue;
    const r = row - table.minRow;
    for (let s = table.offsets[r] as number; s < (table.offsets[r + 1] as number); s++) {
      for (let i = off + (table.starts[s] as number); i < off + (table.ends[s] as number); i++) {
        const v = cells[i] as number;
        inside[v] = (inside[v] as number) + 1;
      }
    }
  }
  const out: Record<string, StitchCount> = {};
  for (let k = 1; k < legend.length; k++) {
    const prev = out[legend[k] as string];
    const i = inside[k] as number;
    const o = (total[k] as number) - i;
    out[legend[k] as string] = prev ? { inside: prev.inside + i, outside: prev.outside + o } : { inside: i, outside: o };
  }
  return out;
}

/** Signed area by the shoelace formula, stitches² (needles × courses); sign follows vertex order. */
export function signedPolygonArea(polygon: readonly StitchPoint[]): number {
  const n = polygon.length;
  if (n < 3) return 0;
  let sum = 0;
  for (let k = 0; k < n; k++) {
    const p = polygon[k] as StitchPoint;
    const q = polygon[(k + 1) % n] as StitchPoint;
    sum += p.x * q.y - q.x * p.y;
  }
  return sum / 2;
}

/** Area of a simple polygon, stitches² (needles × courses), by the shoelace formula. */
export function polygonArea(polygon: readonly StitchPoint[]): number {
  return Math.abs(signedPolygonArea(polygon));
}

/** Perimeter, in stitch units (needle and course steps weighted alike). */
export function polygonPerimeter(polygon: readonly StitchPoint[]): number {
  const n = polygon.length;
  if (n < 2) return 0;
  let sum = 0;
  for (let k = 0; k < n; k++) {
    const p = polygon[k] as StitchPoint;
    const q = polygon[(k + 1) % n] as StitchPoint;
    sum += Math.hypot(q.x - p.x, q.y - p.y);
  }
  return sum;
}

function orient(a: StitchPoint, b: StitchPoint, c: StitchPoint): number {
  const v = (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
  return v > 0 ? 1 : v < 0 ? -1 : 0;
}

function onSegment(a: StitchPoint, b: StitchPoint, p: StitchPoint): boolean {
  return (
    Math.min(a.x, b.x) <= p.x && p.x <= Math.max(a.x, b.x) && Math.min(a.y, b.y) <= p.y && p.y <= Math.max(a.y, b.y)
  );
}

function segmentsTouch(a: StitchPoint, b: StitchPoint, c: StitchPoint, d: StitchPoint): boolean {
  const o1 = orient(a, b, c);
  const o2 = orient(a, b, d);
  const o3 = orient(c, d, a);
  const o4 = orient(c, d, b);
  if (o1 !== o2 && o3 !== o4) return true;
  if (o1 === 0 && onSegment(a, b, c)) return true;
  if (o2 === 0 && onSegment(a, b, d)) return true;
  if (o3 === 0 && onSegment(c, d, a)) return true;
  if (o4 === 0 && onSegment(c, d, b)) return true;
  return false;
}

/**
 * Whether a polygon is simple: at least 3 finite vertices, no zero-length edge, non-zero area, no two
 * edges meeting except neighbours at their shared vertex (and neighbours not folding back on each
 * other). O(n²) — meant for validating a zone or outline on save.
 */
export function isSimplePolygon(polygon: readonly StitchPoint[]): boolean {
  const n = polygon.length;
  if (n < 3) return false;
  for (const p of polygon) if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) return false;
  for (let k = 0; k < n; k++) {
    const p = polygon[k] as StitchPoint;
    const q = polygon[(k + 1) % n] as StitchPoint;
    if (p.x === q.x && p.y === q.y) return false;
  }
  if (signedPolygonArea(polygon) === 0) return false;
  for (let i = 0; i < n; i++) {
    const a = polygon[i] as StitchPoint;
    const b = polygon[(i + 1) % n] as StitchPoint;
    for (let j = i + 1; j < n; j++) {
      const c = polygon[j] as StitchPoint;
      const d = polygon[(j + 1) % n] as StitchPoint;
      const adjacentAfter = j === i + 1; // b === c
      const adjacentBefore = i === 0 && j === n - 1; // d === a
      if (adjacentAfter || adjacentBefore) {
        // Neighbours share one vertex; they must not overlap along a line.
        const shared = adjacentAfter ? b : a;
        const otherOfFirst = adjacentAfter ? a : b;
        const otherOfSecond = adjacentAfter ? d : c;
        if (n === 3) continue;
        if (orient(otherOfFirst, shared, otherOfSecond) === 0) {
          // Collinear: fine if they go on in the same direction, a fold if they turn back.
          const dot =
            (otherOfFirst.x - shared.x) * (otherOfSecond.x - shared.x) +
            (otherOfFirst.y - shared.y) * (otherOfSecond.y - shared.y);
          if (dot > 0) return false;
        }
        continue;
      }
      if (segmentsTouch(a, b, c, d)) return false;
    }
  }
  return true;
}

/**
 * A zone reflected across the panel's centre line, x → panelWidth − x. The vertex order is reversed
 * so the polygon keeps its orientation. Id, name and everything else are kept: give a copy a new id.
 */
export function mirrorZone(zone: Zone, panelWidth: number): Zone {
  const polygon: StitchPolygon = [];
  for (let k = zone.polygon.length - 1; k >= 0; k--) {
    const p = zone.polygon[k] as StitchPoint;
    polygon.push({ x: panelWidth - p.x, y: p.y });
  }
  return { ...zone, polygon };
}

/** Clips a polygon to the rectangle [0, width] × [0, height] (Sutherland–Hodgman). */
export function clipPolygonToRect(polygon: readonly StitchPoint[], width: number, height: number): StitchPolygon {
  type Inside = (p: StitchPoint) => boolean;
  type Cross = (p: StitchPoint, q: StitchPoint) => StitchPoint;
  const atX = (x: number): Cross => (p, q) => ({ x, y: p.y + ((x - p.x) * (q.y - p.y)) / (q.x - p.x) });
  const atY = (y: number): Cross => (p, q) => ({ x: p.x + ((y - p.y) * (q.x - p.x)) / (q.y - p.y), y });
  const planes: [Inside, Cross][] = [
    [(p) => p.x >= 0, atX(0)],
    [(p) => p.x <= width, atX(width)],
    [(p) => p.y >= 0, atY(0)],
    [(p) => p.y <= height, atY(height)],
  ];
  let out: StitchPoint[] = [...polygon];
  for (const [inside, cross] of planes) {
    const input = out;
    out = [];
    for (let k = 0; k < input.length; k++) {
      const p = input[k] as StitchPoint;
      const q = input[(k + 1) % input.length] as StitchPoint;
      const pin = inside(p);
      const qin = inside(q);
      if (pin) out.push(p);
      if (pin !== qin) out.push(cross(p, q));
    }
    if (out.length === 0) break;
  }
  // Drop repeated vertices the clip may leave.
  const clean: StitchPolygon = [];
  for (const p of out) {
    const last = clean[clean.length - 1];
    if (!last || last.x !== p.x || last.y !== p.y) clean.push({ x: p.x, y: p.y });
  }
  const first = clean[0];
  const last = clean[clean.length - 1];
  if (clean.length > 1 && first && last && first.x === last.x && first.y === last.y) clean.pop();
  return clean;
}

export type ZoneCopyMode = 'scale' | 'centre' | 'keep';

/**
 * A zone copied from one panel to another (front to back, left sleeve to right).
 * - 'scale' (the default when widths differ): needles scaled by the width ratio, so the zone keeps
 *   its place relative to the panel's edges and centre line; courses kept.
 * - 'centre': same size, same distance from the centre line.
 * - 'keep': same coordinates.
 * The result is clipped to the target panel's rectangle; null when nothing of the zone is left.
 * Id and name are kept unless `opts.id` / `opts.name` are given.
 */
export function copyZoneToPanel(
  zone: Zone,
  from: Pick<Panel, 'widthNeedles' | 'heightCourses'>,
  to: Pick<Panel, 'widthNeedles' | 'heightCourses'>,
  opts: { mode?: ZoneCopyMode; id?: string; name?: string } = {},
): Zone | null {
  const mode: ZoneCopyMode = opts.mode ?? (from.widthNeedles === to.widthNeedles ? 'keep' : 'scale');
  const sx = to.widthNeedles / from.widthNeedles;
  const shift = to.widthNeedles / 2 - from.widthNeedles / 2;
  const moved = zone.polygon.map((p): StitchPoint => {
    switch (mode) {
      case 'scale':
        return { x: p.x * sx, y: p.y };
      case 'centre':
        return { x: p.x + shift, y: p.y };
      case 'keep':
        return { x: p.x, y: p.y };
    }
  });
  const polygon = clipPolygonToRect(moved, to.widthNeedles, to.heightCourses);
  if (polygon.length < 3 || polygonArea(polygon) === 0) return null;
  return { ...zone, id: opts.id ?? zone.id, name: opts.name ?? zone.name, polygon };
}
