import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { crc32, encodePng, readPhys, readPngChunks } from '@/lib/mill/png';
import { tilePng } from '@/lib/mill/tile-png';
import { stitchMap, stitchMapLegendCsv, stitchMapLegendJson } from '@/lib/mill/stitch-map';
import { yarnListCsv } from '@/lib/mill/yarn-list';
import { csvField } from '@/lib/mill/csv';
import { millPackPdf } from '@/lib/mill/mill-pack-pdf';
import { rasterizePanel } from '@/lib/knit/raster';
import { readPdf } from '../../support/pdf-reader';
import { testPack } from '../../fixtures/pack-data';

describe('PNG with physical size', () => {
  // CRC-32 check value of "123456789" is 0xCBF43926 (the CRC catalogue's check value for CRC-32/ISO-HDLC).
  it('computes the PNG CRC', () => expect(crc32(new TextEncoder().encode('123456789'))).toBe(0xcbf43926));

  it('writes pHYs right after IHDR, in px per metre', () => {
    const png = encodePng(new Uint8Array(4 * 4 * 4).fill(200), 4, 4, { pxPerMetre: { x: 10000, y: 12000 } });
    const chunks = readPngChunks(png).map((c) => c.type);
    expect(chunks.slice(0, 2)).toEqual(['IHDR', 'pHYs']);
    expect(readPhys(png)).toEqual({ pxPerMetreX: 10000, pxPerMetreY: 12000, unit: 'metre' });
    expect(PNG.sync.read(png).width).toBe(4);
  });

  it('gives a tile of whole repeats whose px ÷ pHYs is its true size', () => {
    const data = testPack();
    for (const t of data.textures) {
      const tile = tilePng(data, t.id, { pxPerCm: 150 });
      const phys = readPhys(tile.png)!;
      const img = PNG.sync.read(tile.png);
      expect(img.width).toBe(tile.widthPx);
      // Whole repeats: the tile's width is repeats × needles ÷ wales per cm.
      expect(tile.widthCm).toBeCloseTo((tile.repeatsX * t.repeat.needles) / t.density.walesPerCm, 9);
      expect(tile.heightCm).toBeCloseTo((tile.repeatsY * t.repeat.courses) / t.density.coursesPerCm, 9);
      // Physical size from the file: px ÷ px per metre, within a tenth of a millimetre.
      expect((img.width / phys.pxPerMetreX) * 1000).toBeCloseTo(tile.widthCm * 10, 1);
      expect((img.height / phys.pxPerMetreY) * 1000).toBeCloseTo(tile.heightCm * 10, 1);
      // Seamless: the leftmost and rightmost columns are the same kind of pixels (opaque, drawn).
      let opaque = 0;
      for (let y = 0; y < img.height; y++) opaque += img.data[(y * img.width) * 4 + 3]! > 0 ? 1 : 0;
      expect(opaque).toBe(img.height);
    }
  });

  it('refuses a tile larger than the limit', () => {
    expect(() => tilePng(testPack(), 't-jersey', { pxPerCm: 400, repeatsX: 200, repeatsY: 1 })).toThrow(RangeError);
  });
});

describe('stitch map', () => {
  it('is one pixel per stitch with a legend that adds up to the raster', () => {
    const data = testPack();
    const panel = data.panels.find((p) => p.kind === 'front')!;
    const map = stitchMap(data, panel.id);
    const img = PNG.sync.read(map.png);
    expect([img.width, img.height]).toEqual([panel.widthNeedles, panel.heightCourses]);
    const raster = rasterizePanel(panel);
    // Every pixel's colour is its stitch's legend colour.
    for (const i of [0, 1234, Math.floor(raster.cells.length / 2), raster.cells.length - 1]) {
      const e = map.legend[raster.cells[i]!]!;
      expect([img.data[i * 4], img.data[i * 4 + 1], img.data[i * 4 + 2]]).toEqual(e.rgb);
    }
    expect(new Set(map.legend.map((e) => e.hex)).size).toBe(map.legend.length);
    const csv = stitchMapLegendCsv(map);
    expect(csv.split('\r\n')[0]).toContain('index,hex,r,g,b,texture_id');
    expect(csv).toContain('Test eyelet mesh');
    const json = JSON.parse(stitchMapLegendJson(data, map));
    expect(json.panel.widthNeedles).toBe(panel.widthNeedles);
    expect(json.legend.reduce((s: number, e: { inside: number; outside: number }) => s + e.inside + e.outside, 0)).toBe(raster.knitted);
  });
});

describe('yarn list', () => {
  it('lists every yarn with its count and grams for the base size', () => {
    const rows = yarnListCsv(testPack()).trim().split('\r\n');
    expect(rows[0]).toContain('M_knitted_g');
    expect(rows).toHaveLength(4);
    expect(rows[1]).toContain('78 dtex f68');
  });
  // RFC 4180 §2: fields with commas, quotes or line breaks are quoted, quotes doubled.
  it('quotes CSV fields and defuses formulas', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('=SUM(A1)')).toBe("'=SUM(A1)");
  });
});

describe('mill pack PDF', () => {
  it('has a cover, contents with page numbers, every section, swatches at true size, and reports progress', async () => {
    const steps: number[] = [];
    const out = await millPackPdf(testPack(), { paper: 'a4', approvals: [{ what: 'Client review', decision: 'approved', by: 'Test client', at: '2027-01-16T00:00:00Z', comment: 'Fine' }] }, (p) => {
      steps.push(p);
    });
    expect(steps[0]).toBeLessThan(10);
    expect(steps.at(-1)).toBeGreaterThanOrEqual(95);
    expect([...steps].sort((a, b) => a - b)).toEqual(steps);
    const pages = await readPdf(out.bytes);
    expect(pages).toHaveLength(out.pages);
    pages.forEach((p, i) => expect(p.text).toContain(`Page ${i + 1} of ${pages.length}`));
    expect(pages[0]!.text).toContain('Mill pack');
    expect(pages[0]!.text).toContain('Approvals');
    expect(pages[1]!.text).toContain('Contents');
    for (const title of ['Panels', 'Swatch sheets (true size)', 'Yarn list and consumption per size', 'Fibre content label', 'Colour standards and dye plan', 'Size spec and needle counts', 'Trims']) {
      const sec = out.sections.find((s) => s.title === title)!;
      expect(sec, title).toBeDefined();
      expect(pages[1]!.text).toContain(title);
      expect(pages[sec.page - 1]!.text.replace(/\s+/g, ' ')).toContain(title.replace(' (true size)', '').replace('Swatch sheets', 'Swatch sheet'));
    }
    const all = pages.map((p) => p.text).join(' ');
    expect(all).toMatch(/polyamide \d+ %/);
    expect(all).toContain('Neck label');
    expect(all).toContain('No size spec recorded');
    for (const pl of out.placements) {
      const page = pages[pl.page - 1]!;
      expect(page.text).toContain('Print at 100 % / actual size');
      expect(page.rects.some((r) => r.paint === 'stroke' && Math.abs(r.widthMm - pl.widthMm) <= 0.2)).toBe(true);
    }
  });
});
