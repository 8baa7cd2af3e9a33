import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl } from '../api/helpers';

describe('the members page', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('making someone a mill account asks which mill first, offering only mills', async () => {
    const admin = await as('admin');
    const name = `Member ${randomUUID().slice(0, 6)}`;
    const made = await admin.post('/api/members', { email: `${name.replace(' ', '-').toLowerCase()}@hollowfell.example`, name, role: 'designer', password: 'browser-pass-1' });
    expect(made.status).toBe(201);
    const page = await signIn(browser, accounts.admin);
    await page.goto(`${baseUrl()}/members`);

    await page.getByLabel(`Role of ${name}`).selectOption('mill');
    const picker = page.getByLabel(`The mill ${name} belongs to`);
    await expect.poll(() => picker.locator('option').allTextContents()).toEqual(expect.arrayContaining(['Choose the mill…', 'Brannock Flat Knitting', 'Quellmoor Knitworks']));
    const offered = await picker.locator('option').allTextContents();
    for (const client of ['Varrow Sport', 'Kestenholm Outdoor']) expect(offered).not.toContain(client);
    // Nothing is sent until a mill is chosen.
    expect((await admin.get('/api/members')).json.members.find((m: { id: string }) => m.id === made.json.member.id).role).toBe('designer');
    await picker.selectOption({ label: 'Quellmoor Knitworks' });
    await page.getByRole('button', { name: 'Change', exact: true }).click();
    await expect.poll(async () => (await admin.get('/api/members')).json.members.find((m: { id: string }) => m.id === made.json.member.id))
      .toMatchObject({ role: 'mill', organisationName: 'Quellmoor Knitworks' });
    await expect.poll(() => page.locator('tr', { hasText: name }).textContent()).toContain('Quellmoor Knitworks');
    expect(await page.getByRole('alert').allTextContents()).toEqual(expect.not.arrayContaining([expect.stringMatching(/attention/)]));
    await page.context().close();
  });
});
