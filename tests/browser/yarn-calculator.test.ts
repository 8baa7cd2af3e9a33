import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, baseUrl, styleByCode } from '../api/helpers';

describe('the yarn calculator in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('the designer sees grams per yarn, the EU and US labels, changes the run and downloads the CSV', { timeout: 90_000 }, async () => {
    const ridge = await styleByCode('HF27-101');
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${ridge.id}`);
    await page.getByRole('link', { name: 'Yarns & content' }).click();
    await page.waitForURL(/\/yarns$/);

    const sizes = page.getByTestId('size-grams');
    await sizes.waitFor();
    const polyamide = sizes.locator('tbody tr', { hasText: 'Polyamide 6.6 78/68 semi-dull' });
    expect(await polyamide.count()).toBe(1);
    // Grams per garment, one decimal, in every size column.
    const cells = await polyamide.locator('td').allTextContents();
    expect(cells.slice(1).every((c) => /^\D*\d+\.\d$/.test(c.trim()))).toBe(true);

    expect(await page.getByTestId('label-text-eu').textContent()).toMatch(/^\d+ % polyamide, \d+ % elastane/);
    expect(await page.getByTestId('label-text-us').textContent()).toMatch(/^\d+% nylon, \d+% spandex/);
    expect(await page.getByTestId('label-caution').textContent()).toMatch(/fibre analysis/);
    expect(await page.getByTestId('care-label').textContent()).toMatch(/Do not tumble dry/);

    // A bigger run orders more yarn.
    const before = await page.getByTestId('order-kg').textContent();
    const m = page.getByLabel('Garments in size M');
    await m.fill('500');
    await expect.poll(() => page.getByTestId('order-kg').textContent()).not.toBe(before);

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
    expect(download.suggestedFilename()).toBe('HF27-101-yarn-order.csv');
    const text = readFileSync((await download.path())!, 'utf8');
    const [header, ...rows] = text.trim().split('\r\n');
    expect(header).toMatch(/^yarn,supplier_ref,dtex,g_per_garment_XS/);
    const col = header!.split(',').indexOf('garments_M');
    expect(rows.length).toBeGreaterThan(1);
    expect(rows.find((r) => r.startsWith('Polyamide 6.6 78/68 semi-dull'))!.split(',')[col]).toBe('500');
  });

  it('the mill is sent from the working copy to the released revision it was given', { timeout: 60_000 }, async () => {
    const ridge = await styleByCode('HF27-101');
    const page = await signIn(browser, accounts.mill);
    for (const section of ['', '/body-map', '/textures', '/yarns', '/trims']) {
      await page.goto(`${baseUrl()}/styles/${ridge.id}${section}`);
      await page.waitForURL(`**/styles/${ridge.id}/mill-pack`);
    }
    const tabs = await page.getByRole('navigation', { name: 'Style sections' }).getByRole('link').allTextContents();
    expect(tabs).toEqual(['Colour', 'Fit', 'Mill pack', 'Test knits']);
    // The released revision shows the yarns as they were released, without prices.
    await page.getByRole('link', { name: /^Revision \d+$/ }).first().click();
    await page.waitForURL('**/releases/**');
    await page.getByRole('heading', { name: 'Body map' }).waitFor();
    expect(await page.locator('main').textContent()).not.toMatch(/€|\$|per kg|Cost/);
  });

});
