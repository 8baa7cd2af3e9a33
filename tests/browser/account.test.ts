import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, signIn } from './browser';
import { as, baseUrl } from '../api/helpers';

describe('the account page', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('changes the password from the form; another browser signed in to the account is signed out', { timeout: 60_000 }, async () => {
    // An account of its own: the demo accounts keep the demo password other tests sign in with.
    const email = `account-${randomUUID().slice(0, 8)}@hollowfell.example`;
    const made = await (await as('admin')).post('/api/members', { email, name: 'Account Tester', role: 'designer', password: 'browser-pass-1' });
    expect(made.status).toBe(201);
    const elsewhere = await signIn(browser, email, 'browser-pass-1');
    const page = await signIn(browser, email, 'browser-pass-1');

    await page.getByRole('link', { name: /Account Tester/ }).click();
    await page.waitForURL(/\/account$/);
    // Within the form: the page also has the router's announcer, which is an alert too.
    const form = page.locator('form');
    await page.getByLabel('Current password').fill('not-my-password');
    await page.getByLabel('New password', { exact: true }).fill('browser-pass-2');
    await page.getByLabel('New password again').fill('browser-pass-3');
    await page.getByRole('button', { name: 'Change password' }).click();
    await expect.poll(() => form.getByRole('alert').allTextContents()).toEqual(['The two new passwords differ']);

    await page.getByLabel('New password again').fill('browser-pass-2');
    await page.getByRole('button', { name: 'Change password' }).click();
    await expect.poll(() => form.getByRole('alert').allTextContents()).toEqual(['This is not your current password']);

    await page.getByLabel('Current password').fill('browser-pass-1');
    await page.getByRole('button', { name: 'Change password' }).click();
    await expect.poll(() => form.getByRole('status').allTextContents()).toEqual([expect.stringMatching(/Password changed\. 1 other session was signed out/)]);

    // This browser stays signed in; the other one is sent to sign-in on its next page.
    await page.goto(`${baseUrl()}/styles`);
    expect(new URL(page.url()).pathname).toBe('/styles');
    await elsewhere.goto(`${baseUrl()}/styles`);
    expect(new URL(elsewhere.url()).pathname).toBe('/sign-in');
    await (await signIn(browser, email, 'browser-pass-2')).close();
  });
});
