import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, baseUrl, newStyleBody, as } from '../api/helpers';

type PanelBox = { id: string; x: number; y: number; w: number; h: number };

async function panels(page: Page): Promise<{ box: { x: number; y: number }; panels: PanelBox[] }> {
  const canvas = page.getByTestId('body-map-canvas');
  await canvas.waitFor();
  const box = (await canvas.boundingBox())!;
  const panels = JSON.parse((await canvas.getAttribute('data-panels'))!) as PanelBox[];
  return { box, panels };
}

/** Clicks a polygon on the front panel at fractions of its size, then presses Enter to close it. */
async function drawZone(page: Page, pts: [number, number][]) {
  const { box, panels: ps } = await panels(page);
  const front = ps[0]!;
  await page.keyboard.press('d');
  for (const [fx, fy] of pts) {
    await page.mouse.click(box.x + front.x + front.w * fx, box.y + front.y + front.h * fy);
  }
  await page.keyboard.press('Enter');
}

async function nameSelectedZone(page: Page, name: string) {
  await page.getByLabel('Selected zone').waitFor();
  await page.getByLabel('Name', { exact: true }).fill(name);
  await page.getByLabel('Name', { exact: true }).press('Enter');
}

async function savedState(page: Page) {
  return page.getByTestId('save-state').getAttribute('data-state');
}

describe('body map in the browser', () => {
  let browser: Browser;
  let styleId: string;
  beforeAll(async () => {
    browser = await launch();
    const designer = await as('designer');
    styleId = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Body-map browser test' })).json.style.id;
  });
  afterAll(async () => { await browser?.close(); });

  it('the designer draws a zone, assigns a texture, sees the summary change, and finds it after reload', { timeout: 90_000 }, async () => {
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${styleId}/body-map`);
    await page.getByTestId('body-map-canvas').waitFor();
    const totalsBefore = await page.getByTestId('texture-totals').textContent();

    await drawZone(page, [[0.1, 0.45], [0.4, 0.45], [0.4, 0.7], [0.1, 0.7]]);
    const inspector = page.getByLabel('Selected zone');
    await inspector.waitFor();
    const textureSelect = page.getByLabel('Texture', { exact: true });
    const options = await textureSelect.locator('option').allTextContents();
    const pick = options.find((o) => /mesh/i.test(o)) ?? options[options.length - 1]!;
    await textureSelect.selectOption({ label: pick });
    await page.getByLabel('Name', { exact: true }).fill('Underarm vent');
    await page.getByLabel('Name', { exact: true }).press('Enter');

    await expect.poll(() => page.getByTestId('texture-totals').textContent()).not.toBe(totalsBefore);
    expect(await page.getByTestId('texture-totals').textContent()).toContain(pick);
    await expect.poll(() => savedState(page), { timeout: 10_000 }).toBe('saved');
    // The cut-away area stands beside the kept one.
    expect(await page.getByTestId('texture-totals').locator('thead').textContent()).toContain('cut away');
    // Another size: this style has no size spec yet, so it says it shows the base size's grams.
    await page.getByLabel('Size for the yarn grams').selectOption('S');
    expect(await page.getByTestId('yarn-grams').getAttribute('data-size')).toBe('S');
    expect(await page.getByTestId('size-basis').textContent()).toMatch(/No graded size spec for S/);

    await page.reload();
    await page.getByTestId('body-map-canvas').waitFor();
    await expect.poll(() => page.getByLabel('Zones').getByRole('button', { name: /^Underarm vent/ }).count()).toBe(1);
  });

  it('the client reviewer sees the body map read-only', { timeout: 90_000 }, async () => {
    const page = await signIn(browser, accounts.client);
    const shared = (await (await as('client')).get('/api/styles')).json.styles[0];
    await page.goto(`${baseUrl()}/styles/${shared.id}/body-map`);
    await page.getByTestId('body-map-canvas').waitFor();
    expect(await savedState(page)).toBe('read-only');
    expect(await page.getByRole('button', { name: 'Draw zone' }).isDisabled()).toBe(true);
  });

  it('a stale second tab gets the conflict state instead of overwriting', { timeout: 90_000 }, async () => {
    const a = await signIn(browser, accounts.designer);
    const b = await a.context().newPage();
    await a.goto(`${baseUrl()}/styles/${styleId}/body-map`);
    await b.goto(`${baseUrl()}/styles/${styleId}/body-map`);
    await a.getByTestId('body-map-canvas').waitFor();
    await b.getByTestId('body-map-canvas').waitFor();

    await a.bringToFront();
    await drawZone(a, [[0.5, 0.2], [0.8, 0.2], [0.8, 0.3]]);
    await nameSelectedZone(a, 'Saved in tab A');
    await expect.poll(() => savedState(a), { timeout: 10_000 }).toBe('saved');

    await b.bringToFront();
    await drawZone(b, [[0.5, 0.8], [0.8, 0.8], [0.8, 0.9]]);
    await nameSelectedZone(b, 'Unsaved in tab B');
    await expect.poll(() => savedState(b), { timeout: 10_000 }).toBe('conflict');
    expect(await b.getByRole('button', { name: 'Reload latest' }).count()).toBe(1);
    const zone = (page: Page, name: string) => page.getByLabel('Zones').getByRole('button', { name: new RegExp(`^${name}`) });
    expect(await zone(b, 'Unsaved in tab B').count()).toBe(1);
    expect(await zone(b, 'Saved in tab A').count()).toBe(0);
    // Reloading brings in the other tab's zone and drops this tab's unsaved one.
    await b.getByRole('button', { name: 'Reload latest' }).click();
    await expect.poll(() => savedState(b)).toBe('saved');
    await expect.poll(() => zone(b, 'Saved in tab A').count()).toBe(1);
    expect(await zone(b, 'Unsaved in tab B').count()).toBe(0);
  });

  it('a cut-line drag released off the canvas ends there, and the map saves', { timeout: 90_000 }, async () => {
    const designer = await as('designer');
    const id = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Body-map drag-off test' })).json.style.id;
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${id}/body-map`);
    const { box, panels: ps } = await panels(page);
    const front = ps[0]!;
    const canvas = (await page.getByTestId('body-map-canvas').boundingBox())!;
    await page.keyboard.press('l');
    // The knitted tube's bottom-left corner is a point of the cut outline.
    await page.mouse.move(box.x + front.x, box.y + front.y + front.h);
    await page.mouse.down();
    await page.mouse.move(box.x + front.x + front.w * 0.1, box.y + front.y + front.h * 0.95, { steps: 4 });
    // Out past the canvas's right edge, over the side panel, and let go there.
    await page.mouse.move(canvas.x + canvas.width + 40, canvas.y + canvas.height / 2, { steps: 4 });
    await page.mouse.up();
    // The gesture ended, so autosave ran: the map is stored now (before, the drag stayed live and nothing saved).
    await expect.poll(async () => (await designer.get(`/api/styles/${id}/body-map`)).json.generated, { timeout: 15_000 }).toBe(false);
    await expect.poll(() => savedState(page)).toBe('saved');
  });

  it('offers work kept in this browser back on opening; restoring it puts it in the map and saves it', { timeout: 90_000 }, async () => {
    const designer = await as('designer');
    const id = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Body-map restore test' })).json.style.id;
    const map = (await designer.get(`/api/styles/${id}/body-map`)).json;
    const panels = structuredClone(map.panels);
    panels[0].zones.push({
      id: randomUUID(), name: 'Kept in the browser', textureId: panels[0].baseTextureId, fn: 'compression', order: 1,
      polygon: [{ x: 10, y: 100 }, { x: 120, y: 100 }, { x: 120, y: 600 }, { x: 10, y: 600 }],
    });
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${id}/body-map`);
    await page.getByTestId('body-map-canvas').waitFor();
    await page.evaluate(([key, value]) => window.localStorage.setItem(key!, value!), [`needlemap:body-map-backup:${id}`, JSON.stringify({ savedAt: Date.now(), version: map.version, panels })]);
    await page.reload();
    await page.getByRole('button', { name: 'Restore unsaved work' }).click();
    await expect.poll(() => page.getByLabel('Zones').getByRole('button', { name: /^Kept in the browser/ }).count()).toBe(1);
    await expect.poll(async () => (await designer.get(`/api/styles/${id}/body-map`)).json.panels[0].zones.map((z: { name: string }) => z.name), { timeout: 15_000 })
      .toEqual(['Kept in the browser']);
    expect(await page.getByTestId('restore-offer').count()).toBe(0);
  });
});
