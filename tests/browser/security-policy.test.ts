/**
 * The pages work under their Content-Security-Policy: the browser reports no violation (scripts
 * without the nonce, eval, images or fonts from elsewhere) and no complaint about the headers, on
 * the pages with the most moving parts (the body-map canvas, the mill pack, tiles and previews).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, baseUrl, styleByCode } from '../api/helpers';

/** Collects policy violations and header complaints the page reports, labelled with the page open at the time. */
async function watch(page: Page) {
  const found: string[] = [];
  let where = '';
  await page.exposeFunction('reportPolicyViolation', (v: string) => found.push(`${where}: ${v}`));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { reportPolicyViolation: (v: string) => void }).reportPolicyViolation(
        `${e.effectiveDirective} refused ${e.blockedURI || 'inline'} (${e.sourceFile}:${e.lineNumber})`,
      );
    });
  });
  page.on('console', (m) => {
    if (/Content[- ]Security[- ]Policy|Permissions-Policy|Refused to/i.test(m.text())) found.push(`${where}: ${m.text()}`);
  });
  page.on('pageerror', (e) => found.push(`${where}: ${String(e)}`));
  return { found, at: (p: string) => { where = p; } };
}

describe('pages under the security policy', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('the sign-in page, the styles list, a body map and the mill pack run without a violation', { timeout: 90_000 }, async () => {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const first = await context.newPage();
    const w = await watch(first);
    w.at('/sign-in');
    await first.goto(`${baseUrl()}/sign-in`);
    await first.close();

    const page = await signIn(browser, accounts.designer);
    const v = await watch(page);
    const style = await styleByCode('HF27-101');
    for (const path of ['/styles', `/styles/${style.id}/body-map`, `/styles/${style.id}/mill-pack`, `/styles/${style.id}/textures`, `/styles/${style.id}/trims`, '/library', '/account']) {
      v.at(path);
      await page.goto(`${baseUrl()}${path}`);
      await page.waitForLoadState('networkidle');
    }
    // The body map drew on its canvas, the page's scripts ran (a client-side navigation works).
    v.at('body map');
    await page.goto(`${baseUrl()}/styles/${style.id}/body-map`);
    await page.locator('canvas').first().waitFor();
    v.at('client navigation');
    await page.getByRole('link', { name: 'Library' }).first().click();
    await page.waitForURL(/\/library$/);
    expect([...w.found, ...v.found]).toEqual([]);
  });

  it('the check above sees a violation when there is one', async () => {
    const page = await signIn(browser, accounts.designer);
    const v = await watch(page);
    v.at('/styles');
    await page.goto(`${baseUrl()}/styles`);
    await page.waitForLoadState('networkidle');
    // Markup injected into the page: an image from another site.
    await page.evaluate(() => {
      const img = document.createElement('img');
      img.src = 'http://elsewhere.invalid/pixel.png';
      document.body.append(img);
    });
    await expect.poll(() => v.found.join('\n')).toMatch(/img-src refused http:\/\/elsewhere\.invalid/);
  });
});
