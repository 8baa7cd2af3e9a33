import { chromium, type Browser, type Page } from 'playwright-core';
import { baseUrl, demoPassword } from '../api/helpers';

/** Debian's Chromium, headless; Playwright gives each launch a new empty profile. Never downloads a browser. */
export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync',
    ],
  });
}

/** Signs in through the sign-in page, as a person would. */
export async function signIn(browser: Browser, email: string, password = demoPassword): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/styles/);
  return page;
}
