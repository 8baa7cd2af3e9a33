import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, newStyleBody } from '../api/helpers';

const png = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAIAAAACCAIAAAD91JpzAAAAFklEQVR4nGP8z8DAwMDAxMDAwMDAAAANHQEDasKb6QAAAABJRU5ErkJggg==',
  'base64',
);

/** A fresh top knitted in the plain plated jersey (polyamide plated with elastane). */
async function freshStyle() {
  const designer = await as('designer');
  const style = (await designer.post('/api/styles', newStyleBody())).json.style;
  const lib = (await designer.get('/api/library/textures')).json.textures as { id: string; name: string }[];
  const res = await designer.put(`/api/styles/${style.id}/textures`, { version: style.version, textureIds: [lib.find((t) => t.name === 'Plain plated jersey')!.id] });
  if (res.status !== 200) throw new Error(`textures: ${res.status} ${res.text}`);
  return style as { id: string };
}

describe('the brief and the quote in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('fill a brief, upload a reference, see a Brief vs plan finding, produce a quote and download its PDF', async () => {
    const style = await freshStyle();
    const page = await signIn(browser, accounts.designer);
    page.setDefaultTimeout(25_000);
    await page.goto(`${baseUrl()}/styles/${style.id}`);
    const form = page.getByRole('form', { name: 'Brief questionnaire' });
    await form.waitFor();
    await form.getByLabel('Sport').fill('Trail running');
    await form.getByLabel('Compression level').selectOption('moderate');
    await form.getByLabel('Number of tones').fill('2');
    await form.getByLabel('Target price per garment').fill('39.90');
    await form.getByLabel('Garments, S').fill('100');
    await form.getByLabel('Garments, M').fill('200');
    await form.getByLabel('Garments, L').fill('150');
    await form.getByLabel('European Union').check();
    await form.getByLabel('elastane', { exact: true }).check();
    await form.getByRole('button', { name: 'Save brief' }).click();
    await page.getByRole('status').filter({ hasText: 'Saved at' }).waitFor();

    // Brief vs plan: the jersey is plated with elastane, which the brief rules out.
    const finding = page.locator('[data-check="fibres-to-avoid"]');
    await expect.poll(() => finding.getAttribute('data-status'), { timeout: 20_000 }).toBe('error');
    expect(await finding.textContent()).toMatch(/elastane/);

    // A reference on the board.
    const board = page.getByTestId('reference-board');
    await board.getByLabel('Reference image').setInputFiles({ name: 'palette.png', mimeType: 'image/png', buffer: png });
    await board.getByLabel('Caption', { exact: true }).fill('Navy and ember palette');
    await board.getByLabel('Tag', { exact: true }).selectOption('colour');
    await board.getByRole('button', { name: 'Add to board' }).click();
    await expect.poll(() => board.getByTestId('reference').count()).toBe(1);
    await expect.poll(() => board.getByRole('img', { name: 'Navy and ember palette' }).evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(2);

    // The quote: per size, with how each figure was computed.
    await page.goto(`${baseUrl()}/styles/${style.id}/quote`);
    const table = page.getByTestId('quote-table');
    await table.waitFor();
    expect(await table.textContent()).toMatch(/39\.90 EUR/);
    await table.getByRole('button', { name: 'How' }).first().click();
    expect(await page.getByRole('table', { name: 'How size S was computed' }).textContent()).toMatch(/courses ÷ \(/);
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
    expect(download.suggestedFilename()).toMatch(/-quote\.pdf$/);
    const file = await download.path();
    expect(readFileSync(file).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    await page.context().close();
  }, 120_000);
});
