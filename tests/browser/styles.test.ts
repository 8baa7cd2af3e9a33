import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, demoPassword, newStyleBody } from '../api/helpers';

describe('styles in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('signed-out page views are sent to sign-in', async () => {
    const page = await (await browser.newContext()).newPage();
    await page.goto(`${baseUrl()}/styles`);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
  });

  it('the designer creates a style and finds it in the table', async () => {
    const page = await signIn(browser, accounts.designer);
    await page.getByRole('link', { name: 'New style' }).click();
    await page.waitForURL(/\/styles\/new/);
    const code = `BR-${Date.now().toString(36).toUpperCase()}`;
    await page.getByLabel('Style code').fill(code);
    await page.getByLabel('Name', { exact: true }).fill('Browser-made compression top');
    await page.getByLabel('Season').fill('AW28');
    // The needle count follows the cylinder: π × 15 in × 28 npi = 1319.5 → 1320 at a multiple of 4.
    await page.getByLabel('Cylinder diameter (in)').fill('15');
    await expect.poll(() => page.getByTestId('needle-count').textContent()).toBe('1320');
    await page.getByRole('button', { name: 'Create style' }).click();
    await page.waitForURL(/\/styles\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Browser-made compression top');

    await page.goto(`${baseUrl()}/styles`);
    await page.getByLabel('Search styles').fill(code);
    const rows = page.locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain(code);
  });

  it('shows field errors beside the fields', async () => {
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/styles/new`);
    await page.getByRole('button', { name: 'Create style' }).click();
    await expect.poll(() => page.getByRole('alert').allTextContents()).toEqual(
      expect.arrayContaining([expect.stringMatching(/Style code needs/), expect.stringMatching(/Name needs/)]),
    );
  });

  it('after signing in, a next that leads to another site is not followed', async () => {
    for (const next of ['/\\evil.example/styles', '/\t/evil.example/styles', '//evil.example/styles']) {
      const page = await (await browser.newContext()).newPage();
      await page.goto(`${baseUrl()}/sign-in?next=${encodeURIComponent(next)}`);
      await page.getByLabel('Email').fill(accounts.designer);
      await page.getByLabel('Password').fill(demoPassword);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL(/\/styles$/);
      expect(new URL(page.url()).origin).toBe(new URL(baseUrl()).origin);
      await page.context().close();
    }
  });

  it('a second save right after the first uses the version the first one answered, not a 409', async () => {
    const style = (await (await as('designer')).post('/api/styles', newStyleBody())).json.style;
    const page = await signIn(browser, accounts.designer);
    // Hold back the page refresh the first save starts, so the form cannot learn the new version from it.
    let held = 0;
    await page.route(/[?&]_rsc=/, () => { held++; /* never answered */ });
    await page.goto(`${baseUrl()}/styles/${style.id}`);
    const form = page.locator('form', { has: page.getByRole('button', { name: 'Save changes' }) });
    await form.getByLabel('Name', { exact: true }).fill('Saved once');
    await form.getByRole('button', { name: 'Save changes' }).click();
    await expect.poll(() => form.getByRole('status').allTextContents()).toEqual(['Saved.']);
    await expect.poll(() => held).toBeGreaterThan(0);
    await form.getByLabel('Name', { exact: true }).fill('Saved twice');
    await form.getByRole('button', { name: 'Save changes' }).click();
    await expect.poll(async () => (await (await as('designer')).get(`/api/styles/${style.id}`)).json.style.name).toBe('Saved twice');
    expect(await form.getByRole('alert').allTextContents()).toEqual([]);
    await page.context().close();
  });

  it('the mill sees only what was released to it', async () => {
    const page = await signIn(browser, accounts.mill);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Released to your mill');
    await expect.poll(() => page.locator('tbody tr td:first-child').allTextContents()).toEqual(expect.arrayContaining(['HF26-118', 'HF27-101', 'HF27-105']));
    // What the page lists is exactly what the API shares with the mill (other tests may release more styles to it).
    const api = (await (await as('mill')).get('/api/styles')).json.styles.map((s: { code: string }) => s.code).sort();
    const codes = (await page.locator('tbody tr td:first-child').allTextContents()).sort();
    expect(codes).toEqual(api);
    for (const hidden of ['HF27-102', 'HF27-103', 'HF27-104', 'HF27-106', 'OX-001']) expect(codes).not.toContain(hidden);
    expect(await page.getByRole('link', { name: 'New style' }).count()).toBe(0);
  });
});
