import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { PNG } from 'pngjs';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, newStyleBody, styleByCode } from '../api/helpers';

const shots = 'tests/browser/.shots';

/** A stand-in for a photo of a sample: 640 × 480, a light ground with a darker garment shape. */
function samplePhoto(): Buffer {
  const w = 640;
  const h = 480;
  const p = new PNG({ width: w, height: h });
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const inBody = Math.abs(x - w / 2) < 120 + (y > 120 ? 0 : (120 - y) * 0.8) && y > 60 && y < 440;
      const inSleeve = y > 70 && y < 300 && Math.abs(x - w / 2) > 120 && Math.abs(x - w / 2) < 120 + (y - 40) * 0.6;
      const i = (y * w + x) * 4;
      const shade = inBody || inSleeve ? 60 + ((x + y) % 7) * 3 : 225 - Math.round(y / 12);
      p.data.set(inBody || inSleeve ? [shade, shade + 25, shade + 40, 255] : [shade, shade - 4, shade - 12, 255], i);
    }
  }
  return PNG.sync.write(p);
}

const image = (page: Page, testId: string) =>
  page.getByTestId(testId).locator('img').first().evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : 0));

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

    // Photos of the sample: checked by content on the server, shown as thumbnails, opened full size.
    const addPhotos = page.getByLabel('Add photos to Round 1 · Proto · M');
    await addPhotos.setInputFiles([{ name: 'notes.png', mimeType: 'image/png', buffer: Buffer.from('not a picture at all') }]);
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'notes.png' }).textContent()).toMatch(/not one of the accepted types/);
    await addPhotos.setInputFiles([{ name: 'front on form.png', mimeType: 'image/png', buffer: samplePhoto() }]);
    await expect.poll(() => page.getByTestId('round-photo').count()).toBe(1);
    await expect.poll(() => image(page, 'round-photo')).toBe(640);
    await page.screenshot({ path: `${shots}/fit-round.png`, fullPage: true });
    await page.getByRole('button', { name: 'Open photo 1, front on form.png' }).click();
    const viewer = page.getByRole('dialog', { name: /^Photo 1 of 1/ });
    await expect.poll(() => viewer.getByTestId('photo-full').evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : 0))).toBe(640);
    await page.screenshot({ path: `${shots}/fit-round-photo.png` });
    await page.keyboard.press('Escape');
    await expect.poll(() => viewer.count()).toBe(0);
    await page.getByRole('tab', { name: 'Compare' }).click();
    await expect.poll(() => image(page, 'compare-photos')).toBe(640);
    await page.screenshot({ path: `${shots}/fit-compare.png`, fullPage: true });
    await page.getByRole('tab', { name: 'R1 Proto' }).click();

    // A mistyped value is fixed in place: the form shows the spec each point is held against; the photo stays.
    await page.getByRole('button', { name: 'Edit round' }).click();
    const edit = page.getByRole('form', { name: 'Edit round 1' });
    expect(await edit.getByTestId('held-waist-half').textContent()).toContain('spec 27.0 ± 1.0');
    await edit.getByLabel('Waist half-width', { exact: true }).fill('27.6');
    await expect.poll(() => edit.getByTestId('held-waist-half').textContent()).toContain('+0.6');
    await page.screenshot({ path: `${shots}/fit-edit-round.png`, fullPage: true });
    await edit.getByRole('button', { name: 'Save round' }).click();
    await expect.poll(() => page.getByTestId('deviation-waist-half').textContent()).toContain('+0.6');
    expect(await page.getByTestId('deviation-chest-half').textContent()).toContain('+1.6');
    expect(await page.getByTestId('round-photo').count()).toBe(1);

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

  it('deletes a round after saying what goes and that the spec keeps its accepted correction', async () => {
    const designer = await as('designer');
    const style = await freshStyleWithTextures();
    let fit = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
    const points = fit.spec.points.map((p: any) => (p.point === 'chest-half' ? { ...p, baseCm: 31 } : p));
    const { baseSize, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target } = fit.spec;
    fit = (await designer.put(`/api/styles/${style.id}/fit`, { version: fit.version, baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target })).json.fit;
    const first = (await designer.post(`/api/styles/${style.id}/fit/rounds`, { version: fit.version, kind: 'proto', size: 'M', measurements: { 'chest-half': 32.5 } })).json;
    fit = (await designer.post(`/api/styles/${style.id}/fit/rounds/${first.round.id}/corrections`, { version: first.fit.version, point: 'chest-half', size: 'M', toCm: 30.5, scope: 'point' })).json.fit;
    fit = (await designer.patch(`/api/styles/${style.id}/fit/rounds/${first.round.id}/corrections/${fit.rounds[0].corrections[0].id}`, { version: fit.version, decision: 'accept' })).json.fit;
    await designer.post(`/api/styles/${style.id}/fit/rounds`, { version: fit.version, kind: 'fit', size: 'M', measurements: { 'chest-half': 30.7 } });

    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/${style.id}/fit`);
    await page.getByRole('tab', { name: 'R1 Proto' }).click();
    await page.getByRole('button', { name: 'Delete round…' }).click();
    const confirm = page.getByRole('alertdialog', { name: 'Delete Round 1 · Proto · M' });
    await expect.poll(() => confirm.textContent()).toMatch(/The spec keeps what its accepted correction changed.*Chest half-width M: 31\.0 → 30\.5 cm/);
    await page.screenshot({ path: `${shots}/fit-delete-round.png`, fullPage: true });
    await confirm.getByRole('button', { name: 'Delete round 1' }).click();
    await expect.poll(() => page.getByRole('tab', { name: 'R1 Proto' }).count()).toBe(0);
    // The remaining round shows, and the spec still holds the accepted value.
    await expect.poll(() => page.getByTestId('sample-round').locator('h3').textContent()).toBe('Round 2 · Fit · M');
    expect(await cell(page, 'Chest half-width, M').textContent()).toBe('30.5');
    await page.goto(`${baseUrl()}/styles/${style.id}/history`);
    await expect.poll(() => page.locator('ol').textContent()).toContain('Deleted sample round 1 (proto, size M); the spec keeps its 1 accepted correction');
  });

  it('the mill reads the shared top: needle counts and rounds, nothing to edit', async () => {
    const s = await styleByCode('HF27-101');
    const page = await signIn(browser, accounts.mill);
    await page.goto(`${baseUrl()}/styles/${s.id}/fit`);
    await expect.poll(() => page.getByTestId('fit-save-state').getAttribute('data-state')).toBe('read-only');
    await expect.poll(() => page.getByTestId('needles-M-chest-half').getByTestId('needles-across').textContent()).toBe('651');
    expect(await page.getByRole('button', { name: 'Save spec' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Accept' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Delete round…' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: '+ Add photos' }).count()).toBe(0);
    await page.screenshot({ path: `${shots}/fit-mill.png`, fullPage: true });
    await cell(page, 'Chest half-width, M').click();
    await page.keyboard.type('40');
    expect(await cell(page, 'Chest half-width, M').textContent()).toBe('31.0');
  });
});
