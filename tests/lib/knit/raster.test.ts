import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rectanglePolygon, type Panel, type StitchPoint, type Zone } from '@/lib/knit/panel';
import {
  clipPolygonToRect,
  copyZoneToPanel,
  countStitches,
  isSimplePolygon,
  mirrorZone,
  polygonArea,
  polygonPerimeter,
  rasterizePanel,
  signedPolygonArea,
} from '@/lib/knit/raster';

const rect = (x0: number, y0: number, x1: number, y1: number): StitchPoint[] => [
  { x: x0, y: y0 },
  { x: x1, y: y0 },
  { x: x1, y: y1 },
  { x: x0, y: y1 },
];

function zone(id: string, textureId: string, order: number, polygon: StitchPoint[]): Zone {
  return { id, name: id, textureId, fn: 'compression', order, polygon };
}

function panel(width: number, height: number, partial: Partial<Panel> = {}): Panel {
  return {
    id: 'p',
    name: 'front',
    kind: 'front',
    widthNeedles: width,
    heightCourses: height,
    knittedArea: rectanglePolygon(width, height),
    cutOutline: rectanglePolygon(width, height),
    baseTextureId: 'base',
    zones: [],
    ...partial,
  };
}

/** Independent even-odd point-in-polygon test (crossing number), for checking the scanline fill. */
function pointInPolygon(poly: readonly StitchPoint[], x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const a = poly[i] as StitchPoint;
    const b = poly[j] as StitchPoint;
    if (a.y > y !== b.y > y && x < ((b.x - a.x) * (y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}

/** A star-shaped (hence simple) polygon: vertices at increasing angles round a centre. */
const starPolygon = (opts: { cx: [number, number]; cy: [number, number]; r: [number, number]; integer?: boolean }) =>
  fc
    .record({
      cx: fc.double({ min: opts.cx[0], max: opts.cx[1], noNaN: true }),
      cy: fc.double({ min: opts.cy[0], max: opts.cy[1], noNaN: true }),
      radii: fc.array(fc.double({ min: opts.r[0], max: opts.r[1], noNaN: true }), { minLength: 3, maxLength: 12 }),
      phase: fc.double({ min: 0, max: Math.PI * 2, noNaN: true }),
    })
    .map(({ cx, cy, radii, phase }) =>
      radii.map((r, k) => {
        const a = phase + (k / radii.length) * Math.PI * 2;
        const x = cx + Math.cos(a) * r;
        const y = cy + Math.sin(a) * r;
        return opts.integer ? { x: Math.round(x), y: Math.round(y) } : { x, y };
      }),
    );

describe('rasterizePanel: basics', () => {
  it('fills the knitted area with the base texture; counts split by the cut outline', () => {
    // 10 × 10 panel, cut outline the left 6 needles: 60 inside, 40 outside.
    const r = rasterizePanel(panel(10, 10, { cutOutline: rect(0, 0, 6, 10) }));
    expect(r.width).toBe(10);
    expect(r.height).toBe(10);
    expect(r.cells).toBeInstanceOf(Uint16Array);
    expect(r.legend).toEqual(['', 'base']);
    expect([...r.cells].every((v) => v === 1)).toBe(true);
    expect(r.stitches).toEqual({ base: { inside: 60, outside: 40 } });
    expect(r.knitted).toBe(100);
    expect(r.inside).toBe(60);
  });

  it('zones apply by stacking order, not by list order', () => {
    const low = zone('low', 'mesh', 1, rect(0, 0, 6, 6));
    const high = zone('high', 'rib', 2, rect(4, 4, 10, 10));
    const a = rasterizePanel(panel(10, 10, { zones: [high, low] }));
    const b = rasterizePanel(panel(10, 10, { zones: [low, high] }));
    expect(a.stitches).toEqual(b.stitches);
    // The overlap 4..6 × 4..6 (4 stitches) belongs to 'rib'.
    expect(a.stitches.rib).toEqual({ inside: 36, outside: 0 });
    expect(a.stitches.mesh).toEqual({ inside: 32, outside: 0 });
    expect(a.stitches.base).toEqual({ inside: 100 - 36 - 32, outside: 0 });
    const at = (r: typeof a, i: number, j: number) => r.legend[r.cells[j * 10 + i] as number];
    expect(at(a, 5, 5)).toBe('rib');
    expect(at(b, 5, 5)).toBe('rib');
    expect(at(a, 1, 1)).toBe('mesh');
  });

  it('zones are clipped to the knitted area; cells outside it are 0', () => {
    // Fashioned knitted area: a trapezoid 2.25..7.75 at the top, 0..10 at the bottom (no edge passes
    // exactly through a stitch centre, so the independent test has no ties to break).
    const knittedArea = [
      { x: 2.25, y: 0 },
      { x: 7.75, y: 0 },
      { x: 10, y: 10 },
      { x: 0, y: 10 },
    ];
    const big = zone('big', 'rib', 1, rect(-5, -5, 15, 3));
    const r = rasterizePanel(panel(10, 10, { knittedArea, cutOutline: knittedArea, zones: [big] }));
    for (let j = 0; j < 10; j++) {
      for (let i = 0; i < 10; i++) {
        const knitted = pointInPolygon(knittedArea, i + 0.5, j + 0.5);
        expect((r.cells[j * 10 + i] as number) > 0).toBe(knitted);
      }
    }
    // No stitch of any texture outside the knitted area.
    const total = Object.values(r.stitches).reduce((s, c) => s + c.inside + c.outside, 0);
    expect(total).toBe(r.knitted);
  });

  it('a texture used by the base and a zone has one legend entry; zone stitches are what shows', () => {
    const z1 = zone('z1', 'base', 1, rect(0, 0, 5, 5));
    const z2 = zone('z2', 'rib', 2, rect(0, 0, 2, 2));
    const r = rasterizePanel(panel(10, 10, { zones: [z1, z2] }), { zoneMap: true });
    expect(r.legend).toEqual(['', 'base', 'rib']);
    expect(r.zoneStitches).toEqual([
      { zoneId: 'z1', inside: 21, outside: 0 },
      { zoneId: 'z2', inside: 4, outside: 0 },
    ]);
    expect(r.zoneCells?.[0]).toBe(2); // panel.zones[1] drew cell (0, 0)
    expect(r.zoneCells?.[3]).toBe(1);
    expect(r.zoneCells?.[99]).toBe(0);
  });

  it('reused buffers give the same result even when they hold an older raster', () => {
    const p = panel(20, 20, { zones: [zone('a', 'rib', 1, rect(2, 2, 9, 18))] });
    const first = rasterizePanel(p);
    const dirty = first.cells.slice().fill(7);
    const again = rasterizePanel(p, { reuse: { cells: dirty } });
    expect(again.cells).toBe(dirty);
    expect([...again.cells]).toEqual([...first.cells]);
  });

  it('rejects a panel whose size is not a whole number of stitches', () => {
    expect(() => rasterizePanel(panel(10.5, 10))).toThrow(RangeError);
    expect(() => rasterizePanel(panel(10, 0))).toThrow(RangeError);
  });
});

/** Whether (x, y) lies within `eps` of an edge of the polygon. */
function nearEdge(poly: readonly { x: number; y: number }[], x: number, y: number, eps: number): boolean {
  for (let k = 0; k < poly.length; k++) {
    const a = poly[k]!;
    const b = poly[(k + 1) % poly.length]!;
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const len2 = dx * dx + dy * dy;
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((x - a.x) * dx + (y - a.y) * dy) / len2));
    if (Math.hypot(x - (a.x + t * dx), y - (a.y + t * dy)) <= eps) return true;
  }
  return false;
}

describe('rasterizePanel: properties (fast-check)', () => {
  it('matches an independent point-in-polygon test at every stitch centre', () => {
    fc.assert(
      fc.property(starPolygon({ cx: [10, 30], cy: [10, 30], r: [1, 25] }), (poly) => {
        const r = rasterizePanel(panel(40, 40, { knittedArea: poly, cutOutline: poly }));
        let count = 0;
        let mismatches = 0;
        let ties = 0;
        for (let j = 0; j < 40; j++) {
          for (let i = 0; i < 40; i++) {
            // A stitch centre on an edge (within float noise) is a tie that either rule may break
            // either way: it is left out of the comparison, and allowed for in the total.
            if (nearEdge(poly, i + 0.5, j + 0.5, 1e-9)) { ties++; continue; }
            const inside = pointInPolygon(poly, i + 0.5, j + 0.5);
            if (inside) count++;
            if (((r.cells[j * 40 + i] as number) === 1) !== inside) mismatches++;
          }
        }
        expect(mismatches).toBe(0);
        expect(r.knitted).toBeGreaterThanOrEqual(count);
        expect(r.knitted).toBeLessThanOrEqual(count + ties);
      }),
    );
  });

  it('the stitch count of a polygon agrees with its area within its perimeter', () => {
    fc.assert(
      fc.property(starPolygon({ cx: [30, 50], cy: [30, 50], r: [3, 28] }), (poly) => {
        const r = rasterizePanel(panel(80, 80, { knittedArea: poly, cutOutline: poly }));
        expect(Math.abs(r.knitted - polygonArea(poly))).toBeLessThanOrEqual(polygonPerimeter(poly));
        expect(r.inside).toBe(r.knitted);
      }),
    );
  });

  it('a rectangle on whole needles and courses counts exactly its area', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 30 }), fc.integer({ min: 0, max: 30 }), fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 30 }), (x, y, w, h) => {
        const r = rasterizePanel(panel(64, 64, { zones: [zone('z', 'rib', 1, rect(x, y, x + w, y + h))] }));
        expect(r.stitches.rib?.inside).toBe(w * h);
      }),
    );
  });

  it('mirroring knitted area, cut outline and zones keeps every count and mirrors every cell', () => {
    const W = 48;
    const H = 40;
    const zonePoly = starPolygon({ cx: [-5, 53], cy: [-5, 45], r: [1, 20], integer: true });
    fc.assert(
      fc.property(
        starPolygon({ cx: [20, 28], cy: [18, 22], r: [12, 30], integer: true }),
        starPolygon({ cx: [20, 28], cy: [18, 22], r: [8, 25], integer: true }),
        fc.array(fc.tuple(zonePoly, fc.integer({ min: 0, max: 3 }), fc.integer({ min: 0, max: 4 })), { maxLength: 6 }),
        (knitted, cut, zs) => {
          const zones = zs.map(([poly, tex, order], k) => zone(`z${k}`, `t${tex}`, order, poly));
          const p = panel(W, H, { knittedArea: knitted, cutOutline: cut, zones });
          const mirrorPoly = (poly: StitchPoint[]) => mirrorZone(zone('m', 'm', 0, poly), W).polygon;
          const m = panel(W, H, {
            knittedArea: mirrorPoly(knitted),
            cutOutline: mirrorPoly(cut),
            zones: zones.map((z) => mirrorZone(z, W)),
          });
          const a = rasterizePanel(p);
          const b = rasterizePanel(m);
          expect(b.stitches).toEqual(a.stitches);
          let mismatches = 0;
          for (let j = 0; j < H; j++) {
            for (let i = 0; i < W; i++) {
              if (b.legend[b.cells[j * W + (W - 1 - i)] as number] !== a.legend[a.cells[j * W + i] as number]) mismatches++;
            }
          }
          expect(mismatches).toBe(0);
        },
      ),
    );
  });

  it('no zone ever counts outside the knitted area', () => {
    const W = 50;
    const H = 60;
    fc.assert(
      fc.property(
        starPolygon({ cx: [20, 30], cy: [25, 35], r: [5, 30] }),
        fc.array(starPolygon({ cx: [-10, 60], cy: [-10, 70], r: [1, 40] }), { minLength: 1, maxLength: 8 }),
        (knitted, polys) => {
          const zones = polys.map((poly, k) => zone(`z${k}`, `t${k % 3}`, k % 4, poly));
          const r = rasterizePanel(panel(W, H, { knittedArea: knitted, cutOutline: rect(0, 0, W, H / 2), zones }));
          let knittedCells = 0;
          let outsideButDrawn = 0;
          for (let j = 0; j < H; j++) {
            for (let i = 0; i < W; i++) {
              const inside = pointInPolygon(knitted, i + 0.5, j + 0.5);
              if (inside) knittedCells++;
              else if (r.cells[j * W + i] !== 0) outsideButDrawn++;
            }
          }
          expect(outsideButDrawn).toBe(0);
          const counted = Object.values(r.stitches).reduce((s, c) => s + c.inside + c.outside, 0);
          expect(counted).toBe(knittedCells);
          const zoneCounted = r.zoneStitches.reduce((s, c) => s + c.inside + c.outside, 0);
          expect(zoneCounted).toBeLessThanOrEqual(knittedCells);
        },
      ),
    );
  });

  it('the counts agree with a cell-by-cell recount (countStitches)', () => {
    fc.assert(
      fc.property(
        starPolygon({ cx: [25, 35], cy: [25, 35], r: [10, 40] }),
        fc.array(starPolygon({ cx: [0, 60], cy: [0, 60], r: [1, 25] }), { maxLength: 6 }),
        (cut, polys) => {
          const p = panel(60, 60, { cutOutline: cut, zones: polys.map((poly, k) => zone(`z${k}`, `t${k % 2}`, k, poly)) });
          const r = rasterizePanel(p);
          expect(countStitches(r, cut)).toEqual(r.stitches);
        },
      ),
    );
  });
});

describe('polygon helpers', () => {
  it('area and perimeter of a 3-4-5 right triangle: 6 and 12', () => {
    const tri = [
      { x: 0, y: 0 },
      { x: 4, y: 0 },
      { x: 0, y: 3 },
    ];
    expect(polygonArea(tri)).toBe(6);
    expect(polygonPerimeter(tri)).toBe(12);
    expect(signedPolygonArea([...tri].reverse())).toBe(-signedPolygonArea(tri));
  });

  it('isSimplePolygon tells simple outlines from self-intersecting and degenerate ones', () => {
    expect(isSimplePolygon(rect(0, 0, 10, 10))).toBe(true);
    // Bow tie: edges cross.
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: 10, y: 10 }, { x: 10, y: 0 }, { x: 0, y: 10 }])).toBe(false);
    // A repeated vertex (zero-length edge).
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 0 }, { x: 0, y: 10 }])).toBe(false);
    // An edge folding back along its neighbour.
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 5, y: 0 }, { x: 0, y: 10 }])).toBe(false);
    // A vertex touching another edge.
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 5, y: 0 }, { x: 0, y: 10 }])).toBe(false);
    // Too few vertices, collinear, not finite.
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: 1, y: 1 }])).toBe(false);
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }])).toBe(false);
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: Number.NaN, y: 1 }, { x: 2, y: 0 }])).toBe(false);
    // A collinear vertex in the middle of a straight edge is fine.
    expect(isSimplePolygon([{ x: 0, y: 0 }, { x: 5, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }])).toBe(true);
  });

  it('property: star-shaped polygons are simple; swapping two non-neighbouring vertices of a convex one is not', () => {
    fc.assert(
      fc.property(starPolygon({ cx: [0, 100], cy: [0, 100], r: [5, 50] }), (poly) => {
        expect(isSimplePolygon(poly)).toBe(true);
      }),
    );
    fc.assert(
      fc.property(fc.integer({ min: 5, max: 12 }), fc.double({ min: 5, max: 50, noNaN: true }), (n, r) => {
        const convex = Array.from({ length: n }, (_, k) => ({
          x: Math.cos((k / n) * 2 * Math.PI) * r,
          y: Math.sin((k / n) * 2 * Math.PI) * r,
        }));
        const swapped = [...convex];
        [swapped[0], swapped[2]] = [swapped[2] as StitchPoint, swapped[0] as StitchPoint];
        expect(isSimplePolygon(swapped)).toBe(false);
      }),
    );
  });
});

describe('mirrorZone and copyZoneToPanel', () => {
  const z = zone('hip', 'rib', 3, [
    { x: 10, y: 100 },
    { x: 60, y: 120 },
    { x: 20, y: 300 },
  ]);

  it('mirrors across the centre line and keeps the orientation', () => {
    const m = mirrorZone(z, 576);
    expect(m.polygon).toEqual([
      { x: 556, y: 300 },
      { x: 516, y: 120 },
      { x: 566, y: 100 },
    ]);
    expect(Math.sign(signedPolygonArea(m.polygon))).toBe(Math.sign(signedPolygonArea(z.polygon)));
    expect(polygonArea(m.polygon)).toBe(polygonArea(z.polygon));
    expect(mirrorZone(m, 576).polygon).toEqual([...z.polygon].map((p) => ({ x: p.x, y: p.y })));
  });

  it('copies front to back unchanged when the widths agree', () => {
    const c = copyZoneToPanel(z, { widthNeedles: 576, heightCourses: 2600 }, { widthNeedles: 576, heightCourses: 2600 }, { id: 'hip-back' });
    expect(c?.id).toBe('hip-back');
    expect(c?.polygon).toEqual(z.polygon);
  });

  it('scales needles by the width ratio when the widths differ, and clips to the target', () => {
    const c = copyZoneToPanel(z, { widthNeedles: 576, heightCourses: 2600 }, { widthNeedles: 288, heightCourses: 200 });
    // x halves; the part below course 200 is cut off.
    expect(c).not.toBeNull();
    for (const p of c?.polygon ?? []) {
      expect(p.x).toBeGreaterThanOrEqual(0);
      expect(p.x).toBeLessThanOrEqual(288);
      expect(p.y).toBeLessThanOrEqual(200);
    }
    expect(c?.polygon[0]).toEqual({ x: 5, y: 100 });
  });

  it("'centre' keeps the distance from the centre line; a zone left entirely off the target is null", () => {
    const from = { widthNeedles: 576, heightCourses: 2600 };
    const to = { widthNeedles: 376, heightCourses: 2600 };
    // Centre 288 → 188: every x moves by −100.
    const middle = zone('mid', 'rib', 1, rect(250, 10, 320, 50));
    expect(copyZoneToPanel(middle, from, to, { mode: 'centre' })?.polygon).toEqual(rect(150, 10, 220, 50));
    // A zone reaching within 100 needles of the left edge is clipped at x = 0.
    const edge = zone('edge', 'rib', 1, rect(50, 10, 150, 50));
    expect(copyZoneToPanel(edge, from, to, { mode: 'centre' })?.polygon).toEqual(rect(0, 10, 50, 50));
    // The hip zone (x 10..60) would land at x −90..−40: nothing is left.
    expect(copyZoneToPanel(z, from, to, { mode: 'centre' })).toBeNull();
    const far = zone('far', 'rib', 1, rect(500, 0, 570, 10));
    expect(copyZoneToPanel(far, { widthNeedles: 576, heightCourses: 10 }, { widthNeedles: 400, heightCourses: 10 }, { mode: 'keep' })).toBeNull();
  });

  it('clipPolygonToRect keeps a polygon that lies inside and cuts one that crosses', () => {
    expect(clipPolygonToRect(rect(1, 1, 5, 5), 10, 10)).toEqual(rect(1, 1, 5, 5));
    expect(polygonArea(clipPolygonToRect(rect(-5, -5, 5, 5), 10, 10))).toBe(25);
  });
});
