import { describe, expect, it } from 'vitest';
import { swatchSheetPdf } from '@/lib/mill/swatch-sheet';
import { actualSizeNotice } from '@/lib/mill/pdf';
import { readPdf } from '../../support/pdf-reader';
import { testPack } from '../../fixtures/pack-data';

// Paper sizes: ISO 216 (A4 = 210 × 297 mm) and ANSI/ASME Y14.1 (US Letter = 8.5 × 11 in = 215.9 × 279.4 mm).
// 1 in = 25.4 mm exactly (the international inch, 1959), so the 2 in bar is 50.8 mm.
describe('swatch sheet PDF', () => {
  for (const [paper, w, h] of [['a4', 210, 297], ['letter', 215.9, 279.4]] as const) {
    it(`is ${paper} with every tile at its true physical size`, async () => {
      const data = testPack();
      const out = swatchSheetPdf(data, paper);
      const pages = await readPdf(out.bytes);
      expect(pages.length).toBe(out.pages);
      expect(pages.length).toBe(Math.ceil(data.textures.length / 2));
      for (const p of pages) {
        expect(p.widthMm).toBeCloseTo(w, 1);
        expect(p.heightMm).toBeCloseTo(h, 1);
        expect(p.text).toContain('Print at 100 % / actual size');
        expect(p.text).toContain(actualSizeNotice.slice(0, 40));
        // Scale bars: filled rectangles of exactly 50.0 mm and 50.8 mm on every page.
        const fills = p.rects.filter((r) => r.paint === 'fill');
        expect(fills.some((r) => Math.abs(r.widthMm - 50) < 0.05)).toBe(true);
        expect(fills.some((r) => Math.abs(r.widthMm - 50.8) < 0.05)).toBe(true);
        expect(p.text).toContain('5 cm');
        expect(p.text).toContain('2 in');
        expect(p.text).toContain('TST-001');
        expect(p.text).toContain('Revision 2');
      }
      expect(out.placements).toHaveLength(data.textures.length);
      for (const pl of out.placements) {
        const t = data.textures.find((x) => x.id === pl.textureId)!;
        // Width = repeats × needles ÷ wales per cm; height = repeats × courses ÷ courses per cm (cm → mm × 10).
        const widthMm = ((pl.repeatsX * t.repeat.needles) / t.density.walesPerCm) * 10;
        const heightMm = ((pl.repeatsY * t.repeat.courses) / t.density.coursesPerCm) * 10;
        const page = pages[pl.page - 1]!;
        const frame = page.rects.find((r) => r.paint === 'stroke' && Math.abs(r.widthMm - widthMm) <= 0.2 && Math.abs(r.heightMm - heightMm) <= 0.2);
        expect(frame, `${t.name}: a ${widthMm.toFixed(2)} × ${heightMm.toFixed(2)} mm swatch`).toBeDefined();
        // The tiles: the same rectangle filled with the tile pattern.
        const filled = page.rects.find((r) => r.paint === 'fill' && Math.abs(r.widthMm - widthMm) <= 0.2 && Math.abs(r.heightMm - heightMm) <= 0.2 && Math.abs(r.xMm - frame!.xMm) <= 0.2);
        expect(filled, `${t.name}: the swatch is filled with the tile`).toBeDefined();
        expect(page.text).toContain(t.name);
        expect(page.text).toContain(`${t.repeat.needles} needles × ${t.repeat.courses} courses`);
        expect(page.text).toContain(`${pl.repeatsX} × ${pl.repeatsY} repeats`);
        expect(page.text).toContain('g/m²');
        expect(page.text).toContain('Test polyamide 78/68');
        expect(page.text).toContain('Stitch chart');
      }
    });
  }

  it('embeds its fonts', () => {
    const { bytes } = swatchSheetPdf(testPack(), 'a4');
    const raw = Buffer.from(bytes).toString('latin1');
    expect(raw).toMatch(/\/FontFile2/);
    expect(raw).not.toMatch(/\/BaseFont\s*\/Helvetica/);
  });
});
