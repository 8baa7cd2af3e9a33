/**
 * Benchmark (prints figures, asserts no timing): dragging a vertex on a body map with 60 zones —
 * the work per frame to redraw the canvas and recompute the summary — and the body-map page's
 * first-load JavaScript size.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { randomUUID } from 'node:crypto';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, newStyleBody } from '../api/helpers';

describe('body-map benchmark', () => {
  let browser: Browser;
  let styleId: string;

  beforeAll(async () => {
    browser = await launch();
    const designer = await as('designer');
    styleId = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Benchmark: 60 zones' })).json.style.id;
    const map = (await designer.get(`/api/styles/${styleId}/body-map`)).json;
    const textures = (await designer.get('/api/library/textures')).json.textures.map((t: { id: string }) => t.id);
    // 30 zones on each body panel: a grid of hexagons.
    for (const panel of map.panels.slice(0, 2)) {
      const w = panel.widthNeedles;
      const h = panel.heightCourses;
      for (let i = 0; i < 30; i++) {
        const cx = Math.round(((i % 5) + 0.5) * (w / 5));
        const cy = Math.round((Math.floor(i / 5) + 0.5) * (h / 6));
        const rx = Math.round(w / 12);
        const ry = Math.round(h / 14);
        panel.zones.push({
          id: randomUUID(), name: `Bench ${i + 1}`, textureId: textures[i % textures.length], fn: 'support', order: i + 1,
          polygon: [[-1, 0], [-0.5, -1], [0.5, -1], [1, 0], [0.5, 1], [-0.5, 1]].map(([fx, fy]) => ({ x: cx + Math.round(fx! * rx), y: cy + Math.round(fy! * ry) })),
        });
      }
    }
    const saved = await designer.put(`/api/styles/${styleId}/body-map`, { version: map.version, panels: map.panels });
    expect(saved.status).toBe(200);
  });
  afterAll(async () => { await browser?.close(); });

  it('prints the frame work of a vertex drag with 60 zones and the first-load JS size', { timeout: 240_000 }, async () => {
    const page = await signIn(browser, accounts.designer);
    let jsBytes = 0;
    page.on('response', async (res) => {
      if (res.url().endsWith('.js') && res.request().resourceType() === 'script') {
        try { jsBytes += (await res.body()).length; } catch { /* navigation may cancel */ }
      }
    });
    jsBytes = 0;
    await page.goto(`${baseUrl()}/styles/${styleId}/body-map`, { waitUntil: 'load' });
    await page.waitForTimeout(1500);
    const firstLoadKb = jsBytes / 1024;
    const canvas = page.getByTestId('body-map-canvas');
    await canvas.waitFor({ timeout: 90_000 });

    // Select the first zone from the list, then find its first vertex on screen.
    await page.getByLabel('Zones').getByRole('button', { name: /^Bench 1(?!\d)/ }).first().click();
    const box = (await canvas.boundingBox())!;
    const panels = JSON.parse((await canvas.getAttribute('data-panels'))!) as { x: number; y: number; w: number; h: number }[];
    const front = panels[0]!;
    const map = (await (await as('designer')).get(`/api/styles/${styleId}/body-map`)).json;
    const zone = map.panels[0].zones.find((z: { name: string }) => z.name === 'Bench 1');
    const v = zone.polygon[0];
    const sx = box.x + front.x + (v.x / map.panels[0].widthNeedles) * front.w;
    const sy = box.y + front.y + (v.y / map.panels[0].heightCourses) * front.h;

    // Per pointer move: time from the event to the end of the next frame (editor update, summary, canvas draw).
    await page.evaluate(() => {
      const w = window as unknown as { __frames: number[] };
      w.__frames = [];
      document.querySelector('[data-testid="body-map-canvas"]')!.addEventListener('pointermove', () => {
        const t0 = performance.now();
        requestAnimationFrame(() => setTimeout(() => w.__frames.push(performance.now() - t0), 0));
      }, { capture: true });
    });
    await page.mouse.move(sx, sy);
    await page.mouse.down();
    for (let i = 1; i <= 60; i++) {
      await page.mouse.move(sx + i * 2, sy + i);
    }
    await page.mouse.up();
    await page.waitForTimeout(300);
    const frames = await page.evaluate(() => (window as unknown as { __frames: number[] }).__frames);
    const sorted = [...frames].sort((a, b) => a - b);
    const median = sorted[Math.floor(sorted.length / 2)] ?? NaN;
    const p95 = sorted[Math.floor(sorted.length * 0.95)] ?? NaN;
    console.log(`[bench] body map, 60 zones, vertex drag: ${frames.length} frames, median frame work ${median.toFixed(1)} ms, p95 ${p95.toFixed(1)} ms`);
    console.log(`[bench] body-map page first-load JavaScript: ${firstLoadKb.toFixed(0)} KiB (uncompressed)`);
    expect(frames.length).toBeGreaterThan(30);
    expect(firstLoadKb).toBeGreaterThan(0);
    // The drag moved the vertex: the saved map changes after autosave.
    await page.waitForFunction(() => document.querySelector('[data-testid="save-state"]')?.getAttribute('data-state') === 'saved', null, { timeout: 20_000 });
    const after = (await (await as('designer')).get(`/api/styles/${styleId}/body-map`)).json;
    expect(after.panels[0].zones.find((z: { name: string }) => z.name === 'Bench 1').polygon[0]).not.toEqual(v);
  });
});
