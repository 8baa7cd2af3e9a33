import { describe, expect, it } from 'vitest';
import { flattenPathData, outlineFromSvg, OutlineError } from '@/lib/knit/svg-outline';
import { isSimplePolygon } from '@/lib/knit/raster';

const panel = { widthNeedles: 600, heightCourses: 1200 };

describe('outlineFromSvg', () => {
  it('scales a polygon so its bounding box fills the panel, on whole stitches', () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 60 120"><polygon points="10,10 70,10 70,130 10,130"/></svg>';
    expect(outlineFromSvg(svg, panel)).toEqual([{ x: 0, y: 0 }, { x: 600, y: 0 }, { x: 600, y: 1200 }, { x: 0, y: 1200 }]);
  });

  it('flattens curves of a path (relative and absolute commands) into a simple polygon', () => {
    const svg = `<?xml version="1.0"?><svg viewBox="0 0 100 200"><path d="M 0 20 C 20 0, 80 0, 100 20 L 100 200 h -100 z"/></svg>`;
    const poly = outlineFromSvg(svg, panel);
    expect(isSimplePolygon(poly)).toBe(true);
    expect(poly.length).toBeGreaterThan(10);
    expect(Math.max(...poly.map((p) => p.x))).toBe(600);
    expect(Math.min(...poly.map((p) => p.y))).toBe(0);
  });

  it('keeps only geometry: scripts and handlers in the file have no effect on the result', () => {
    const svg = '<svg viewBox="0 0 10 10" onload="alert(1)"><script>alert(1)</script><polygon points="0,0 10,0 10,10 0,10" onclick="x()"/></svg>';
    const poly = outlineFromSvg(svg, panel);
    expect(JSON.stringify(poly)).not.toMatch(/alert|script|onclick/);
    expect(poly).toHaveLength(4);
  });

  it('refuses what is not an outline with a clear error', () => {
    expect(() => outlineFromSvg('<html><body/></html>', panel)).toThrow(/not an SVG/);
    expect(() => outlineFromSvg('<svg><circle r="4"/></svg>', panel)).toThrow(/no path, polygon/);
    expect(() => outlineFromSvg('<!DOCTYPE svg [<!ENTITY x "y">]><svg/>', panel)).toThrow(OutlineError);
    expect(() => outlineFromSvg('<svg><polygon points="0,0 10,10 10,0 0,10"/></svg>', panel)).toThrow(/crosses itself/);
    expect(() => outlineFromSvg(`<svg>${' '.repeat(1_000_001)}</svg>`, panel)).toThrow(/1 MB/);
  });

  it('reads H and V commands and stops at the first subpath', () => {
    expect(flattenPathData('M0 0 H10 V10 H0 Z M50 50 L60 60')).toEqual([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 0, y: 10 }]);
  });
});
