import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, styleByCode } from '../api/helpers';

type PanelBox = { id: string; x: number; y: number; w: number; h: number; pxPerNeedle: number; pxPerCourse: number };

describe('trims in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('the designer places a knitted logo over a vent, sees the findings, and drags it on whole stitches', { timeout: 90_000 }, async () => {
    const ridge = await styleByCode('HF27-101');
    const designer = await as('designer');
    const name = `Vent mark ${Date.now().toString(36)}`;
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${ridge.id}/trims`);
    const canvas = page.getByTestId('trim-canvas');
    await canvas.waitFor();
    await page.getByRole('button', { name: 'Add a trim' }).click();
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByLabel('Kind').selectOption('knitted-logo');
    await page.getByLabel('Finest line or gap of the artwork, mm').fill('0.2');
    await page.getByLabel('Width, mm').fill('20');
    await page.getByLabel('Height, mm').fill('20');
    // The demo map has an underarm vent at the side of the front, about 0–13 % across and 30–50 % down.
    const box = (await canvas.boundingBox())!;
    const front = (JSON.parse((await canvas.getAttribute('data-panels'))!) as PanelBox[])[0]!;
    await page.mouse.click(box.x + front.x + front.w * 0.05, box.y + front.y + front.h * 0.4);
    await expect.poll(() => page.getByTestId('trim-findings').textContent()).toMatch(/ventilation zone/);
    expect(await page.getByTestId('trim-findings').textContent()).toMatch(/finer than the knit can draw/);
    await page.getByRole('button', { name: 'Add trim' }).click();
    await expect.poll(() => page.getByLabel('Trims').textContent()).toContain(name);

    const saved = async () => ((await designer.get(`/api/styles/${ridge.id}/trims`)).json.trims as { id: string; name: string; box: { x: number; y: number } }[]).find((t) => t.name === name)!;
    const first = await saved();
    expect(first).toBeDefined();
    // Drag it 30 px to the right and 20 px down: it lands on whole needles and courses.
    const cx = box.x + front.x + (first.box.x + 5) * front.pxPerNeedle;
    const cy = box.y + front.y + (first.box.y + 5) * front.pxPerCourse;
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    await page.mouse.move(cx + 15, cy + 10, { steps: 3 });
    await page.mouse.move(cx + 30, cy + 20, { steps: 3 });
    await page.mouse.up();
    await expect.poll(async () => (await saved()).box.x, { timeout: 10_000 }).toBeGreaterThan(first.box.x);
    const moved = await saved();
    expect(Number.isInteger(moved.box.x) && Number.isInteger(moved.box.y)).toBe(true);
    expect(moved.box.y).toBeGreaterThan(first.box.y);

    await designer.delete(`/api/styles/${ridge.id}/trims/${moved.id}`);
  });

  it('the client sees the trims read-only', { timeout: 60_000 }, async () => {
    const ridge = await styleByCode('HF27-101');
    const page = await signIn(browser, accounts.client);
    await page.goto(`${baseUrl()}/styles/${ridge.id}/trims`);
    await page.getByTestId('trim-canvas').waitFor();
    expect(await page.getByTestId('trims-state').textContent()).toBe('Read only.');
    expect(await page.getByRole('button', { name: 'Add a trim' }).count()).toBe(0);
    expect(await page.getByLabel('Trims').textContent()).toContain('Chest logo');
  });
});
