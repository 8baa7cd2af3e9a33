import { describe, expect, it } from 'vitest';
import { BitmapContext } from '@/lib/knit/render-bitmap';
import { drawTile } from '@/lib/knit/render-canvas';
import { drawTileToPdf, type PdfPathTarget } from '@/lib/knit/render-pdf';
import { renderTile } from '@/lib/knit/render';
import { jersey, yarnEl, yarnPa } from '../../fixtures/pack-data';

describe('bitmap context', () => {
  it('fills a rectangle exactly and composites alpha over it', () => {
    const c = new BitmapContext(4, 4);
    c.fillStyle = '#ff0000';
    c.beginPath();
    c.rect(1, 1, 2, 2);
    c.fill();
    const at = (x: number, y: number) => Array.from(c.data.slice((y * 4 + x) * 4, (y * 4 + x) * 4 + 4));
    expect(at(0, 0)).toEqual([0, 0, 0, 0]);
    expect(at(1, 1)).toEqual([255, 0, 0, 255]);
    c.globalAlpha = 0.5;
    c.fillStyle = '#0000ff';
    c.beginPath();
    c.rect(0, 0, 4, 4);
    c.fill();
    expect(at(1, 1)).toEqual([128, 0, 128, 255]);
  });
  it('strokes with round caps: a dot of the line width', () => {
    const c = new BitmapContext(9, 9);
    c.strokeStyle = '#000000';
    c.lineWidth = 4;
    c.beginPath();
    c.moveTo(4.5, 4.5);
    c.lineTo(4.5, 4.5);
    c.stroke();
    expect(c.data[(4 * 9 + 4) * 4 + 3]).toBe(255);
    expect(c.data[(0 * 9 + 0) * 4 + 3]).toBe(0);
  });
  it('clips to rectangles only', () => {
    const c = new BitmapContext(4, 4);
    c.beginPath();
    c.moveTo(0, 0);
    c.lineTo(3, 1);
    c.lineTo(1, 3);
    c.closePath();
    expect(() => c.clip()).toThrow();
  });
  it('paints a whole tile from the renderer without gaps', () => {
    const d = renderTile(jersey, [yarnPa, yarnEl], { repeatsX: 2, repeatsY: 2, pxPerCm: 200 });
    const w = Math.round(d.widthPx);
    const h = Math.round(d.heightPx);
    const c = new BitmapContext(w, h);
    drawTile(c, d, { scaleX: w / d.widthPx, scaleY: h / d.heightPx });
    let opaque = 0;
    for (let i = 3; i < c.data.length; i += 4) if (c.data[i]! > 250) opaque++;
    expect(opaque / (w * h)).toBeGreaterThan(0.98);
  });
});

describe('PDF path adapter', () => {
  it('writes every paint pass of the drawing list, colours and widths only when they change', () => {
    const d = renderTile(jersey, [yarnPa, yarnEl], { repeatsX: 1, repeatsY: 1, pxPerCm: 100 });
    const calls: string[] = [];
    const rec = (name: string) => () => {
      calls.push(name);
    };
    const target: PdfPathTarget = {
      moveTo: rec('m'), lineTo: rec('l'), curveTo: rec('c'), close: rec('h'), stroke: rec('S'), fill: rec('f'),
      setDrawColor: rec('RG'), setFillColor: rec('rg'), setLineWidth: rec('w'), setLineCap: rec('J'), setLineJoin: rec('j'), setOpacity: rec('gs'),
    };
    const passes = drawTileToPdf(target, d);
    const expected = d.items.reduce((s, it) => s + it.paints.filter((p) => p.stroke).length + it.paints.filter((p) => p.fill).length, 0);
    expect(passes).toBe(expected);
    expect(calls.filter((c) => c === 'S' || c === 'f')).toHaveLength(expected);
    expect(calls.filter((c) => c === 'RG').length).toBeLessThan(expected);
  });
});
