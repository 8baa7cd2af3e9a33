/**
 * A small software 2D context: the part of the canvas API that `drawTile` (render-canvas.ts) uses,
 * painting into an RGBA pixel buffer, so a server with no browser canvas can rasterise the same
 * drawing list (the tile PNG export).
 *
 * What it supports, and how:
 * - Affine transforms through `translate` and `scale`, `save` / `restore` of transform, clip and styles.
 * - Paths of `moveTo`, `lineTo`, `bezierCurveTo` (flattened in device px), `closePath` and `rect`.
 * - `stroke()` with round caps and joins only (the renderer's own style): the stroke is the set of
 *   points within half the line width of the path, so each flattened segment is a capsule, and the
 *   coverage of a pixel is the largest over the capsules (no seams or double-darkening where
 *   segments meet), antialiased over one px by distance.
 * - `fill()` by the nonzero rule, 4 sub-scanlines per px with exact horizontal coverage.
 * - `clip()` of an axis-aligned rectangle in device space (what `drawTile` asks for); anything else
 *   throws, rather than drawing something other than what was asked.
 * - Source-over compositing of straight (not premultiplied) RGBA, with `globalAlpha`.
 */
import type { Canvas2DLike } from './render-canvas';

type Matrix = [number, number, number, number, number, number];

interface State {
  m: Matrix;
  clip: { x0: number; y0: number; x1: number; y1: number };
  fillStyle: unknown;
  strokeStyle: unknown;
  lineWidth: number;
  lineCap: string;
  lineJoin: string;
  globalAlpha: number;
}

interface Subpath {
  /** Device px, x0, y0, x1, y1, … */
  pts: number[];
  closed: boolean;
}

/** `#rrggbb` or `#rgb` to [r, g, b]; anything else is black. */
export function parseHexColour(style: unknown): [number, number, number] {
  if (typeof style !== 'string') return [0, 0, 0];
  const s = style.trim();
  const long = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(s);
  if (long) return [parseInt(long[1]!, 16), parseInt(long[2]!, 16), parseInt(long[3]!, 16)];
  const short = /^#([0-9a-f])([0-9a-f])([0-9a-f])$/i.exec(s);
  if (short) return [parseInt(short[1]! + short[1]!, 16), parseInt(short[2]! + short[2]!, 16), parseInt(short[3]! + short[3]!, 16)];
  return [0, 0, 0];
}

export class BitmapContext implements Canvas2DLike {
  /** RGBA, row-major, straight alpha; transparent at start. */
  readonly data: Uint8ClampedArray;
  private s: State;
  private stack: State[] = [];
  private path: Subpath[] = [];
  private current: Subpath | null = null;

  constructor(
    readonly width: number,
    readonly height: number,
  ) {
    if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
      throw new RangeError(`A bitmap needs whole positive px sizes (got ${width} × ${height}).`);
    }
    this.data = new Uint8ClampedArray(width * height * 4);
    this.s = {
      m: [1, 0, 0, 1, 0, 0],
      clip: { x0: 0, y0: 0, x1: width, y1: height },
      fillStyle: '#000000',
      strokeStyle: '#000000',
      lineWidth: 1,
      lineCap: 'butt',
      lineJoin: 'miter',
      globalAlpha: 1,
    };
  }

  get fillStyle() { return this.s.fillStyle; }
  set fillStyle(v: unknown) { this.s.fillStyle = v; }
  get strokeStyle() { return this.s.strokeStyle; }
  set strokeStyle(v: unknown) { this.s.strokeStyle = v; }
  get lineWidth() { return this.s.lineWidth; }
  set lineWidth(v: number) { if (v > 0 && Number.isFinite(v)) this.s.lineWidth = v; }
  get lineCap() { return this.s.lineCap; }
  set lineCap(v: string) { this.s.lineCap = v; }
  get lineJoin() { return this.s.lineJoin; }
  set lineJoin(v: string) { this.s.lineJoin = v; }
  get globalAlpha() { return this.s.globalAlpha; }
  set globalAlpha(v: number) { if (v >= 0 && v <= 1) this.s.globalAlpha = v; }

  save(): void {
    this.stack.push({ ...this.s, m: [...this.s.m] as Matrix, clip: { ...this.s.clip } });
  }
  restore(): void {
    const prev = this.stack.pop();
    if (prev) this.s = prev;
  }
  translate(x: number, y: number): void {
    const m = this.s.m;
    m[4] += m[0] * x + m[2] * y;
    m[5] += m[1] * x + m[3] * y;
  }
  scale(x: number, y: number): void {
    const m = this.s.m;
    m[0] *= x;
    m[1] *= x;
    m[2] *= y;
    m[3] *= y;
  }

  private tx(x: number, y: number): [number, number] {
    const m = this.s.m;
    return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
  }

  beginPath(): void {
    this.path = [];
    this.current = null;
  }
  moveTo(x: number, y: number): void {
    const [dx, dy] = this.tx(x, y);
    this.current = { pts: [dx, dy], closed: false };
    this.path.push(this.current);
  }
  lineTo(x: number, y: number): void {
    if (!this.current) return this.moveTo(x, y);
    const [dx, dy] = this.tx(x, y);
    this.current.pts.push(dx, dy);
  }
  bezierCurveTo(cp1x: number, cp1y: number, cp2x: number, cp2y: number, x: number, y: number): void {
    if (!this.current) this.moveTo(cp1x, cp1y);
    const cur = this.current!;
    const n = cur.pts.length;
    const x0 = cur.pts[n - 2]!;
    const y0 = cur.pts[n - 1]!;
    const [x1, y1] = this.tx(cp1x, cp1y);
    const [x2, y2] = this.tx(cp2x, cp2y);
    const [x3, y3] = this.tx(x, y);
    // Segments by the control polygon's length: about one per 1.5 device px, 2 to 64.
    const len = Math.hypot(x1 - x0, y1 - y0) + Math.hypot(x2 - x1, y2 - y1) + Math.hypot(x3 - x2, y3 - y2);
    const steps = Math.min(64, Math.max(2, Math.ceil(len / 1.5)));
    for (let i = 1; i <= steps; i++) {
      const t = i / steps;
      const u = 1 - t;
      const a = u * u * u;
      const b = 3 * u * u * t;
      const c = 3 * u * t * t;
      const d = t * t * t;
      cur.pts.push(a * x0 + b * x1 + c * x2 + d * x3, a * y0 + b * y1 + c * y2 + d * y3);
    }
  }
  closePath(): void {
    if (!this.current) return;
    const p = this.current.pts;
    this.current.closed = true;
    if (p.length >= 2) this.current = { pts: [p[0]!, p[1]!], closed: false };
  }
  rect(x: number, y: number, w: number, h: number): void {
    this.moveTo(x, y);
    this.lineTo(x + w, y);
    this.lineTo(x + w, y + h);
    this.lineTo(x, y + h);
    this.closePath();
  }

  clip(): void {
    const sub = this.path.filter((p) => p.pts.length >= 4);
    const p = sub[0]?.pts;
    const axisRect =
      sub.length === 1 &&
      p &&
      p.length === 8 &&
      ((p[1] === p[3] && p[2] === p[4] && p[5] === p[7] && p[6] === p[0]) || (p[0] === p[2] && p[3] === p[5] && p[4] === p[6] && p[7] === p[1]));
    if (!axisRect || !p) throw new Error('This bitmap context clips to axis-aligned rectangles only.');
    const xs = [p[0]!, p[2]!, p[4]!, p[6]!];
    const ys = [p[1]!, p[3]!, p[5]!, p[7]!];
    const c = this.s.clip;
    this.s.clip = {
      x0: Math.max(c.x0, Math.min(...xs)),
      y0: Math.max(c.y0, Math.min(...ys)),
      x1: Math.min(c.x1, Math.max(...xs)),
      y1: Math.min(c.y1, Math.max(...ys)),
    };
  }

  /** Composites `cov` (coverage 0–1 of the px box x0..x0+w, y0..) in `rgb` at the global alpha. */
  private composite(cov: Float32Array, x0: number, y0: number, w: number, h: number, rgb: [number, number, number]): void {
    const ga = this.s.globalAlpha;
    const c = this.s.clip;
    // Fractional clip edges: a px half inside the clip gets half the coverage.
    for (let j = 0; j < h; j++) {
      const py = y0 + j;
      const fy = Math.min(py + 1, c.y1) - Math.max(py, c.y0);
      if (fy <= 0) continue;
      for (let i = 0; i < w; i++) {
        let a = cov[j * w + i]!;
        if (a <= 0) continue;
        const px = x0 + i;
        const fx = Math.min(px + 1, c.x1) - Math.max(px, c.x0);
        if (fx <= 0) continue;
        a *= ga * Math.min(1, fx) * Math.min(1, fy);
        if (a > 1) a = 1;
        const k = (py * this.width + px) * 4;
        const d = this.data;
        const da = d[k + 3]! / 255;
        const oa = a + da * (1 - a);
        if (oa <= 0) continue;
        const keep = (da * (1 - a)) / oa;
        const take = a / oa;
        d[k] = rgb[0] * take + d[k]! * keep;
        d[k + 1] = rgb[1] * take + d[k + 1]! * keep;
        d[k + 2] = rgb[2] * take + d[k + 2]! * keep;
        d[k + 3] = oa * 255;
      }
    }
  }

  /** The px box of [x0, x1) × [y0, y1) within the canvas and the clip, or null when empty. */
  private box(x0: number, y0: number, x1: number, y1: number) {
    const c = this.s.clip;
    const bx0 = Math.max(0, Math.floor(Math.max(x0, c.x0)));
    const by0 = Math.max(0, Math.floor(Math.max(y0, c.y0)));
    const bx1 = Math.min(this.width, Math.ceil(Math.min(x1, c.x1)));
    const by1 = Math.min(this.height, Math.ceil(Math.min(y1, c.y1)));
    if (bx1 <= bx0 || by1 <= by0) return null;
    return { x0: bx0, y0: by0, w: bx1 - bx0, h: by1 - by0 };
  }

  stroke(): void {
    const m = this.s.m;
    const hw = (this.s.lineWidth * Math.sqrt(Math.abs(m[0] * m[3] - m[1] * m[2]))) / 2;
    let minX = Infinity;
    let minY = Infinity;
    let maxX = -Infinity;
    let maxY = -Infinity;
    for (const sp of this.path) {
      for (let i = 0; i < sp.pts.length; i += 2) {
        const x = sp.pts[i]!;
        const y = sp.pts[i + 1]!;
        if (x < minX) minX = x;
        if (x > maxX) maxX = x;
        if (y < minY) minY = y;
        if (y > maxY) maxY = y;
      }
    }
    const r = hw + 1;
    const b = this.box(minX - r, minY - r, maxX + r, maxY + r);
    if (!b) return;
    const cov = new Float32Array(b.w * b.h);
    const capsule = (ax: number, ay: number, bx: number, by: number) => {
      const sx0 = Math.max(b.x0, Math.floor(Math.min(ax, bx) - r));
      const sx1 = Math.min(b.x0 + b.w, Math.ceil(Math.max(ax, bx) + r));
      const sy0 = Math.max(b.y0, Math.floor(Math.min(ay, by) - r));
      const sy1 = Math.min(b.y0 + b.h, Math.ceil(Math.max(ay, by) + r));
      const vx = bx - ax;
      const vy = by - ay;
      const vv = vx * vx + vy * vy;
      for (let py = sy0; py < sy1; py++) {
        const cy = py + 0.5;
        for (let px = sx0; px < sx1; px++) {
          const cx = px + 0.5;
          let t = vv > 0 ? ((cx - ax) * vx + (cy - ay) * vy) / vv : 0;
          if (t < 0) t = 0;
          else if (t > 1) t = 1;
          const dx = cx - (ax + t * vx);
          const dy = cy - (ay + t * vy);
          const dist = Math.sqrt(dx * dx + dy * dy);
          // A thin line keeps its ink: coverage never above its width when that is under one px.
          const a = Math.min(Math.min(1, 2 * hw), hw + 0.5 - dist);
          if (a <= 0) continue;
          const k = (py - b.y0) * b.w + (px - b.x0);
          if (a > cov[k]!) cov[k] = a;
        }
      }
    };
    for (const sp of this.path) {
      const p = sp.pts;
      if (p.length === 2) capsule(p[0]!, p[1]!, p[0]!, p[1]!);
      for (let i = 2; i < p.length; i += 2) capsule(p[i - 2]!, p[i - 1]!, p[i]!, p[i + 1]!);
      if (sp.closed && p.length > 4) capsule(p[p.length - 2]!, p[p.length - 1]!, p[0]!, p[1]!);
    }
    this.composite(cov, b.x0, b.y0, b.w, b.h, parseHexColour(this.s.strokeStyle));
  }

  fill(): void {
    const edges: number[] = [];
    let minX = Infinity;
    let minY = Infinity;
    let maxX = -Infinity;
    let maxY = -Infinity;
    for (const sp of this.path) {
      const p = sp.pts;
      const n = p.length / 2;
      if (n < 2) continue;
      for (let i = 0; i < n; i++) {
        const x0 = p[2 * i]!;
        const y0 = p[2 * i + 1]!;
        const x1 = p[(2 * ((i + 1) % n))]!;
        const y1 = p[(2 * ((i + 1) % n)) + 1]!;
        if (x0 < minX) minX = x0;
        if (x0 > maxX) maxX = x0;
        if (y0 < minY) minY = y0;
        if (y0 > maxY) maxY = y0;
        if (y0 !== y1) edges.push(x0, y0, x1, y1);
      }
    }
    const b = this.box(minX, minY, maxX, maxY);
    if (!b || edges.length === 0) return;
    const cov = new Float32Array(b.w * b.h);
    const SUB = 4;
    const xs: { x: number; w: number }[] = [];
    for (let j = 0; j < b.h; j++) {
      for (let s = 0; s < SUB; s++) {
        const y = b.y0 + j + (s + 0.5) / SUB;
        xs.length = 0;
        for (let e = 0; e < edges.length; e += 4) {
          const x0 = edges[e]!;
          const y0 = edges[e + 1]!;
          const x1 = edges[e + 2]!;
          const y1 = edges[e + 3]!;
          const up = y1 > y0;
          const lo = up ? y0 : y1;
          const hi = up ? y1 : y0;
          if (y < lo || y >= hi) continue;
          xs.push({ x: x0 + ((y - y0) / (y1 - y0)) * (x1 - x0), w: up ? 1 : -1 });
        }
        if (xs.length < 2) continue;
        xs.sort((a, c) => a.x - c.x);
        let wind = 0;
        for (let k = 0; k < xs.length - 1; k++) {
          wind += xs[k]!.w;
          if (wind === 0) continue;
          const xa = Math.max(b.x0, xs[k]!.x);
          const xb = Math.min(b.x0 + b.w, xs[k + 1]!.x);
          if (xb <= xa) continue;
          for (let px = Math.floor(xa); px < Math.ceil(xb); px++) {
            const overlap = Math.min(xb, px + 1) - Math.max(xa, px);
            if (overlap > 0) cov[j * b.w + (px - b.x0)]! += overlap / SUB;
          }
        }
      }
    }
    this.composite(cov, b.x0, b.y0, b.w, b.h, parseHexColour(this.s.fillStyle));
  }
}
