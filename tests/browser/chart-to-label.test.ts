import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, newStyleBody } from '../api/helpers';

const cell = (page: Page, course: number, needle: number) => page.locator(`[data-testid="stitch-chart"] [data-course="${course}"][data-needle="${needle}"]`);

/** The elastane percentage of a label text ("88 % polyamide, 12 % elastane"), 0 when absent. */
const elastanePct = (text: string | null) => Number(/(\d+) % elastane/.exec(text ?? '')?.[1] ?? 0);

describe('from a painted chart to the content label', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('paints a chart, saves it, uses it in a zone, and sees the label change', { timeout: 120_000 }, async () => {
    // A texture with a heavily plated elastane feeder, so the zone moves the garment's elastane share.
    const designer = await as('designer');
    const yarns = (await designer.get('/api/library/yarns')).json.yarns as { id: string; name: string }[];
    const pa = yarns.find((y) => y.name === 'Polyamide 6.6 78/68 semi-dull')!;
    const el = yarns.find((y) => y.name === 'Bare elastane 44 dtex')!;
    const name = `Browser power rib ${Date.now().toString(36)}`;
    const feeder = { ground: pa.id, plated: { yarn: el.id, draft: 2 } };
    const created = await designer.post('/api/library/textures', {
      name, family: 'mock-rib', function: 'support', repeat: { needles: 4, courses: 2, cells: ['kkkk', 'kkkk'] },
      feeders: [feeder, feeder], density: { walesPerCm: 22, coursesPerCm: 30 }, loopMm: { knit: 2.3, tuck: 1.7 },
    });
    expect(created.status).toBe(201);
    const style = (await designer.post('/api/styles', { ...newStyleBody(), name: 'Chart to label test' })).json.style as { id: string };

    // Paint: a tuck on course 1, needle 2, and save.
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/library/textures/${created.json.texture.id}`);
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Saved · version 1');
    await page.getByRole('radio', { name: /Tuck/ }).click();
    await cell(page, 0, 1).click();
    expect(await cell(page, 0, 1).getAttribute('data-action')).toBe('tuck');
    await page.getByRole('button', { name: 'Save texture' }).click();
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Saved · version 2');

    // Use it: draw a zone over most of the front panel and give it the new texture in the inspector.
    await page.goto(`${baseUrl()}/styles/${style.id}/body-map`);
    const canvas = page.getByTestId('body-map-canvas');
    await canvas.waitFor();
    await expect.poll(() => page.getByTestId('content-label').textContent()).toMatch(/%/);
    const labelBefore = await page.getByTestId('content-label').textContent();
    const box = (await canvas.boundingBox())!;
    const front = (JSON.parse((await canvas.getAttribute('data-panels'))!) as { x: number; y: number; w: number; h: number }[])[0]!;
    await page.keyboard.press('d');
    for (const [fx, fy] of [[0.05, 0.3], [0.95, 0.3], [0.95, 0.9], [0.05, 0.9]] as const) {
      await page.mouse.click(box.x + front.x + front.w * fx, box.y + front.y + front.h * fy);
    }
    await page.keyboard.press('Enter');
    await page.getByLabel('Selected zone').waitFor();
    await page.getByLabel('Texture', { exact: true }).selectOption({ label: name });

    await expect.poll(() => page.getByTestId('content-label').textContent()).not.toBe(labelBefore);
    const labelAfter = await page.getByTestId('content-label').textContent();
    expect(elastanePct(labelAfter)).toBeGreaterThan(elastanePct(labelBefore));
    await expect.poll(() => page.getByTestId('save-state').getAttribute('data-state'), { timeout: 10_000 }).toBe('saved');

    // The yarn calculator reads the saved map: the texture is there and the label is the same.
    await page.goto(`${baseUrl()}/styles/${style.id}/yarns`);
    await page.getByTestId('texture-yarns').waitFor();
    expect(await page.getByTestId('texture-yarns').textContent()).toContain(name);
    expect(await page.getByTestId('label-text-eu').textContent()).toBe(labelAfter);
  });
});
