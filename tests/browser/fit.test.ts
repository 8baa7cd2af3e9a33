import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, newStyleBody, styleByCode } from '../api/helpers';

/** A fresh top with the plain plated jersey (21 wales/cm) as base and the mock rib compression texture. */
async function freshStyleWithTextures() {
  const designer = await as('designer');
  const style = (await designer.post('/api/styles', newStyleBody())).json.style;
  const lib = (await designer.get('/api/library/textures')).json.textures as { id: string; name: string }[];
  const id = (name: string) => lib.find((t) => t.name === name)!.id;
  const res = await designer.put(`/api/styles/${style.id}/textures`, {
    version: style.version, textureIds: [id('Plain plated jersey'), id('2×1 mock rib compression')],
  });
  if (res.status !== 200) throw new Error(`textures: ${res.status} ${res.text}`);
  return style as { id: string };
}

const cell = (page: Page, label: string) => page.getByRole('gridcell', { name: label, exact: true });

async function paste(page: Page, text: string) {
  await page.evaluate((t) => {
    const dt = new DataTransfer();
    dt.setData('text/plain', t);
    document.activeElement?.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
  }, text);
}

describe('the Fit section in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('enter the base size, grade, see needles and a compression finding, record a round and accept a correction', async () => {
    const style = await freshStyleWithTextures();
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${style.id}/fit`);
    await page.getByTestId('fit-workspace').waitFor();

    // Base size values by keyboard: type into the M cell, Enter moves down to the next point.
    await cell(page, 'Chest half-width, M').click();
    await page.keyboard.type('31');
    await page.keyboard.press('Enter');
    await page.keyboard.type('27');
    await page.keyboard.press('Enter');
    // Grade: 2.5 cm per size step on the chest.
    await cell(page, 'Chest half-width grade').click();
    await page.keyboard.type('2.5');
    await page.keyboard.press('Enter');
    await expect.poll(() => cell(page, 'Chest half-width, L').textContent()).toBe('33.5');
    await expect.poll(() => cell(page, 'Chest half-width, S').textContent()).toBe('28.5');
    await expect.poll(() => cell(page, 'Waist half-width, S').textContent()).toBe('25.0');

    // Body girths pasted from a spreadsheet row.
    await cell(page, 'Chest body girth, S').click();
    await paste(page, '88\t96\t104\n');
    await expect.poll(() => cell(page, 'Chest body girth, L').textContent()).toBe('104.0');

    // Needles: 31 cm × 21 wales/cm = 651 across the half-width; 15″ at E28 = 1320 needles is nearest.
    await expect.poll(() => page.getByTestId('needles-M-chest-half').getByTestId('needles-across').textContent()).toBe('651');
    await expect.poll(() => page.getByTestId('cylinder-M').textContent()).toContain('15″');

    // Compression: inside the moderate band (14.3 mmHg at M); the firm band makes it too loose.
    await expect.poll(() => page.getByTestId('pressure-M-chest').textContent()).toContain('14.3');
    await page.getByRole('radio', { name: 'Firm', exact: true }).check();
    const finding = page.getByTestId('compression-finding').filter({ hasText: 'Size M, chest' });
    await expect.poll(() => finding.textContent()).toMatch(/too loose for the firm band.*Reduce the chest half-width of size M by/);
    expect(await page.getByTestId('compression-caution').count()).toBeGreaterThan(3);
    await page.getByRole('radio', { name: 'Moderate', exact: true }).check();

    // Inches are a view: 31 cm shows as 12.20 in.
    await page.getByRole('radio', { name: 'in', exact: true }).click();
    await expect.poll(() => cell(page, 'Chest half-width, M').textContent()).toBe('12.20');
    await page.getByRole('radio', { name: 'cm', exact: true }).click();

    await page.getByRole('button', { name: 'Save spec' }).click();
    await expect.poll(() => page.getByTestId('fit-save-state').getAttribute('data-state')).toBe('saved');

    // A proto round that came back wide at the chest.
    await page.getByRole('tab', { name: 'Record a round' }).click();
    const form = page.getByRole('form', { name: 'Record a sample round' });
    await form.getByLabel('Chest half-width', { exact: true }).fill('32.6');
    await form.getByLabel('Waist half-width', { exact: true }).fill('27.4');
    await form.getByRole('button', { name: 'Record round' }).click();
    const chestRow = page.getByTestId('deviation-chest-half');
    await expect.poll(() => chestRow.getAttribute('data-status')).toBe('outside');
    expect(await chestRow.textContent()).toContain('+1.6');
    expect(await page.getByTestId('deviation-waist-half').getAttribute('data-status')).toBe('within');

    // Correct the chest for every size, then accept: the spec follows.
    await page.getByRole('button', { name: 'Correct chest half-width' }).click();
    const correction = page.getByRole('form', { name: 'Correct chest half-width' });
    await correction.getByLabel('New chest half-width, M (cm)').fill('30.5');
    await correction.getByLabel('Reason').fill('Fit model: too loose at the chest.');
    await correction.getByRole('button', { name: 'Propose' }).click();
    await expect.poll(() => page.getByTestId('correction').getAttribute('data-status')).toBe('proposed');
    await page.getByRole('button', { name: 'Accept' }).click();
    await expect.poll(() => page.getByTestId('correction').getAttribute('data-status')).toBe('accepted');
    await expect.poll(() => cell(page, 'Chest half-width, M').textContent()).toBe('30.5');
    await expect.poll(() => cell(page, 'Chest half-width, L').textContent()).toBe('33.0');

    // The change stands in the style's history.
    await page.goto(`${baseUrl()}/styles/${style.id}/history`);
    await expect.poll(() => page.locator('ol').textContent()).toContain('Accepted a correction from round 1: chest half-width of M 31.0 → 30.5 cm, every size');
  });

  it('the mill reads the shared top: needle counts and rounds, nothing to edit', async () => {
    const s = await styleByCode('HF27-101');
    const page = await signIn(browser, accounts.mill);
    await page.goto(`${baseUrl()}/styles/${s.id}/fit`);
    await expect.poll(() => page.getByTestId('fit-save-state').getAttribute('data-state')).toBe('read-only');
    await expect.poll(() => page.getByTestId('needles-M-chest-half').getByTestId('needles-across').textContent()).toBe('651');
    expect(await page.getByRole('button', { name: 'Save spec' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Accept' }).count()).toBe(0);
    await cell(page, 'Chest half-width, M').click();
    await page.keyboard.type('40');
    expect(await cell(page, 'Chest half-width, M').textContent()).toBe('31.0');
  });
});
