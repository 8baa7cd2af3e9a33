import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { PNG } from 'pngjs';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, newStyleBody } from '../api/helpers';

const shots = 'tests/browser/.shots';

function photo(): Buffer {
  const p = new PNG({ width: 40, height: 30 });
  for (let i = 0; i < p.data.length; i += 4) p.data.set([70 + (i % 90), 110, 140, 255], i);
  return PNG.sync.write(p);
}

describe('the mill round in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('designer releases, the mill downloads the pack and sends a test knit, the designer approves', async () => {
    // A style with three textures, made through the API.
    const api = await as('designer');
    const style = (await api.post('/api/styles', newStyleBody())).json.style as { id: string; version: number; code: string };
    const lib = (await api.get('/api/library/textures')).json.textures as { id: string; name: string }[];
    const ids = ['Plain plated jersey', 'Eyelet ventilation mesh'].map((n) => lib.find((t) => t.name === n)!.id);
    expect((await api.put(`/api/styles/${style.id}/textures`, { version: style.version, textureIds: ids })).status).toBe(200);

    // The designer releases revision 1 to the demo mill.
    const designer = await signIn(browser, accounts.designer);
    await designer.goto(`${baseUrl()}/styles/${style.id}/mill-pack`);
    await designer.getByRole('checkbox', { name: /Brannock/ }).uncheck();
    await designer.getByRole('checkbox', { name: /Quellmoor/ }).check();
    await designer.getByLabel('Note to the mills (optional)').fill('Please knit the mesh first.');
    await designer.getByRole('button', { name: 'Release revision 1' }).click();
    await expect.poll(() => designer.getByText(/Revision 1 released/).count(), { timeout: 20_000 }).toBe(1);
    await designer.screenshot({ path: `${shots}/mill-pack-designer.png`, fullPage: true });
    await designer.getByRole('link', { name: 'Test knits' }).click();
    await designer.getByRole('button', { name: /Request test knits of every texture/ }).click();
    await expect.poll(() => designer.getByText(/Requested 2 test knits/).count(), { timeout: 20_000 }).toBe(1);

    // The mill signs in, builds and downloads the pack.
    const mill = await signIn(browser, accounts.mill);
    await mill.goto(`${baseUrl()}/styles/${style.id}/mill-pack`);
    await mill.getByRole('button', { name: 'Build the mill pack (PDF)' }).click();
    const download = mill.getByRole('link', { name: /Download the mill pack/ });
    await expect.poll(() => download.count(), { timeout: 90_000, interval: 500 }).toBe(1);
    await mill.screenshot({ path: `${shots}/mill-pack-mill.png`, fullPage: true });
    const href = await download.getAttribute('href');
    const pdf = await mill.request.get(`${baseUrl()}${href}`);
    expect(pdf.status()).toBe(200);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');

    // The mill sends the test knit of the jersey: photo and figures.
    await mill.goto(`${baseUrl()}/styles/${style.id}/test-knits`);
    const form = mill.getByRole('form', { name: 'Send the test knit of Plain plated jersey' });
    await form.locator('input[type=file]').setInputFiles({ name: 'jersey.png', mimeType: 'image/png', buffer: photo() });
    await form.getByLabel('Wales per cm').fill('21.4');
    await form.getByLabel('Courses per cm').fill('29.3');
    await form.getByLabel('g/m²').fill('150');
    await form.getByRole('button', { name: 'Send test knit' }).click();
    const item = mill.getByTestId('test-knit-Plain plated jersey');
    await expect.poll(() => item.textContent(), { timeout: 20_000 }).toContain('Knitted: waiting for the studio');
    await mill.screenshot({ path: `${shots}/test-knits-mill.png`, fullPage: true });

    // The designer sees the figures and approves.
    await designer.goto(`${baseUrl()}/styles/${style.id}/test-knits`);
    const row = designer.getByTestId('test-knit-Plain plated jersey');
    await expect.poll(() => row.textContent()).toContain('21.4');
    await row.getByLabel('Comment to the mill').fill('Good: knit the proto.');
    await row.getByRole('button', { name: 'Approve' }).click();
    await expect.poll(() => row.textContent(), { timeout: 20_000 }).toContain('Approved');
    await designer.screenshot({ path: `${shots}/test-knits-designer.png`, fullPage: true });
  }, 180_000);
});
