/**
 * The body-map editor during a database outage, in Debian's Chromium against the fault project's
 * own server: a zone drawn while PostgreSQL is down shows "Not saved — retrying", a page opened
 * meanwhile shows the friendly error page, and once the database is back the same save lands by
 * itself (no reload, no click) and is there for everyone.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, signIn } from '../browser/browser';
import { accounts, as, baseUrl, newStyleBody } from '../api/helpers';
import { startDatabase, stopDatabase } from './control';

type PanelBox = { id: string; x: number; y: number; w: number; h: number };

async function drawZone(page: Page, pts: [number, number][]) {
  const canvas = page.getByTestId('body-map-canvas');
  await canvas.waitFor();
  const box = (await canvas.boundingBox())!;
  const front = (JSON.parse((await canvas.getAttribute('data-panels'))!) as PanelBox[])[0]!;
  await page.keyboard.press('d');
  for (const [fx, fy] of pts) await page.mouse.click(box.x + front.x + front.w * fx, box.y + front.y + front.h * fy);
  await page.keyboard.press('Enter');
}

const saveState = (page: Page) => page.getByTestId('save-state').getAttribute('data-state');

describe('body-map editor while the database is down', () => {
  let browser: Browser;
  let styleId: string;
  beforeAll(async () => {
    browser = await launch();
    const designer = await as('designer');
    styleId = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Outage browser test' })).json.style.id;
  });
  afterAll(async () => {
    await startDatabase().catch(() => {});
    await browser?.close();
  });

  it('a save made during the outage says it is not saved, retries, and lands after recovery', { timeout: 120_000 }, async () => {
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${styleId}/body-map`);
    await page.getByTestId('body-map-canvas').waitFor();
    const zonesOf = (map: { panels: { zones: unknown[] }[] }) => map.panels.flatMap((p) => p.zones).length;
    const zonesBefore = zonesOf((await (await as('admin')).get(`/api/styles/${styleId}/body-map`)).json);

    await stopDatabase('fast');
    try {
      await drawZone(page, [[0.2, 0.3], [0.6, 0.3], [0.6, 0.5], [0.2, 0.5]]);
      await expect.poll(() => saveState(page), { timeout: 20_000 }).toBe('retrying');
      const notice = await page.getByTestId('save-state').textContent();
      expect(notice).toMatch(/Not saved/);
      expect(notice).toMatch(/database is unavailable/i);

      // Another page opened now: the friendly error page, not a crash.
      const other = await page.context().newPage();
      await other.goto(`${baseUrl()}/styles`);
      await expect.poll(() => other.locator('body').innerText(), { timeout: 15_000 }).toMatch(/unavailable for a moment|could not be loaded/i);
      expect(await other.locator('body').innerText()).toMatch(/Nothing that was saved is lost/);
      await other.close();
    } finally {
      await startDatabase();
    }

    // The editor's own retry lands the save: no reload, no click.
    await expect.poll(() => saveState(page), { timeout: 60_000, interval: 500 }).toBe('saved');
    const map = (await (await as('admin')).get(`/api/styles/${styleId}/body-map`)).json;
    expect(map.generated).toBe(false);
    expect(zonesOf(map)).toBe(zonesBefore + 1);
  });
});
