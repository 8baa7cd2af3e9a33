import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl } from '../api/helpers';

const cell = (page: Page, course: number, needle: number) => page.locator(`[data-testid="stitch-chart"] [data-course="${course}"][data-needle="${needle}"]`);

describe('the studio library in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('the designer opens a texture, paints a chart cell, saves, reloads and sees it', async () => {
    // A texture of its own, so the demo library stays as seeded for the other tests.
    const designer = await as('designer');
    const yarns = (await designer.get('/api/library/yarns')).json.yarns as { id: string; name: string }[];
    const pa = yarns.find((y) => y.name === 'Polyamide 6.6 78/68 semi-dull')!;
    const el = yarns.find((y) => y.name === 'Bare elastane 22 dtex')!;
    const name = `Browser jersey ${Date.now().toString(36)}`;
    const feeder = { ground: pa.id, plated: { yarn: el.id, draft: 2.6 } };
    const created = await designer.post('/api/library/textures', {
      name, family: 'jersey', function: 'support', repeat: { needles: 4, courses: 2, cells: ['kkkk', 'kkkk'] },
      feeders: [feeder, feeder], density: { walesPerCm: 20, coursesPerCm: 28 }, loopMm: { knit: 2.4, tuck: 1.8 },
    });
    expect(created.status).toBe(201);

    const page = await signIn(browser, accounts.designer);
    await page.getByRole('link', { name: 'Library' }).click();
    await page.waitForURL(/\/library$/);
    await page.getByLabel('Search textures').fill(name);
    await page.getByRole('link', { name }).click();
    await page.waitForURL(/\/library\/textures\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Saved · version 1');
    await expect.poll(() => page.getByTestId('check-float').textContent()).toContain('No floats');

    // Course 1 (bottom row), needle 2: paint a tuck with the tool, then drag misses over needles 3–4 of course 2.
    await page.getByRole('radio', { name: /Tuck/ }).click();
    await cell(page, 0, 1).click();
    expect(await cell(page, 0, 1).getAttribute('data-action')).toBe('tuck');
    await page.keyboard.press('m');
    const from = await cell(page, 1, 2).boundingBox();
    const to = await cell(page, 1, 3).boundingBox();
    await page.mouse.move(from!.x + from!.width / 2, from!.y + from!.height / 2);
    await page.mouse.down();
    await page.mouse.move(to!.x + to!.width / 2, to!.y + to!.height / 2, { steps: 4 });
    await page.mouse.up();
    expect(await cell(page, 1, 2).getAttribute('data-action')).toBe('miss');
    expect(await cell(page, 1, 3).getAttribute('data-action')).toBe('miss');
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Unsaved changes');
    // Computed at once: a float of two needles (2 × 25.4 / 28 = 1.8 mm).
    await expect.poll(() => page.getByTestId('check-float').textContent()).toContain('Longest float 1.8 mm');

    await page.getByRole('button', { name: 'Save texture' }).click();
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Saved · version 2');

    await page.reload();
    await expect.poll(() => cell(page, 0, 1).getAttribute('data-action')).toBe('tuck');
    expect(await cell(page, 1, 2).getAttribute('data-action')).toBe('miss');
    expect(await cell(page, 0, 0).getAttribute('data-action')).toBe('knit');
    const stored = (await designer.get(`/api/library/textures/${created.json.texture.id}`)).json.texture;
    expect(stored.repeat.cells).toEqual([['knit', 'tuck', 'knit', 'knit'], ['knit', 'knit', 'miss', 'miss']]);
  });

  it('fills a course and a needle, shifts, resizes keeping the content, picks a feeder set per course, and saves', async () => {
    const designer = await as('designer');
    const yarns = (await designer.get('/api/library/yarns')).json.yarns as { id: string; name: string }[];
    const pa = yarns.find((y) => y.name === 'Polyamide 6.6 78/68 semi-dull')!;
    const el = yarns.find((y) => y.name === 'Bare elastane 22 dtex')!;
    const name = `Browser tools ${Date.now().toString(36)}`;
    // Two feeder sets: A plates elastane (course 1), B knits the ground alone (course 2).
    const plated = { ground: pa.id, plated: { yarn: el.id, draft: 2.6 } };
    const bare = { ground: pa.id };
    const created = await designer.post('/api/library/textures', {
      name, family: 'jersey', function: 'support', repeat: { needles: 4, courses: 2, cells: ['kkkk', 'kkkk'] },
      feeders: [plated, bare], density: { walesPerCm: 20, coursesPerCm: 28 }, loopMm: { knit: 2.4, tuck: 1.8 },
    });
    expect(created.status).toBe(201);

    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/library/textures/${created.json.texture.id}`);
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Saved · version 1');
    // The limits say where they come from (no studio setting in the demo data).
    expect(await page.getByTestId('rule-limits').textContent()).toContain('(default)');

    // Tuck: fill course 1 → course 1 tttt, course 2 kkkk.
    await page.getByRole('radio', { name: /Tuck/ }).click();
    await page.getByRole('button', { name: 'Fill course 1 with tuck' }).click();
    // Miss: fill needle 2 in every course → tmtt / kmkk.
    await page.getByRole('radio', { name: /Miss/ }).click();
    await page.getByRole('button', { name: 'Fill needle 2 with miss' }).click();
    expect(await cell(page, 0, 1).getAttribute('data-action')).toBe('miss');
    expect(await cell(page, 1, 1).getAttribute('data-action')).toBe('miss');
    expect(await cell(page, 0, 0).getAttribute('data-action')).toBe('tuck');
    // Shift right, wrapping: every needle moves to the next one → ttmt / kkmk.
    await page.getByRole('button', { name: 'Shift the repeat right' }).click();
    expect(await cell(page, 0, 2).getAttribute('data-action')).toBe('miss');
    expect(await cell(page, 0, 1).getAttribute('data-action')).toBe('tuck');

    // Resize 4 × 2 → 5 × 3: the content stays anchored at needle 1, course 1; new cells knit,
    // the new course takes the feeder set of the last one (B).
    await page.getByLabel('Repeat width in needles').fill('5');
    await page.getByLabel('Repeat height in courses').fill('3');
    await page.getByRole('button', { name: 'Resize', exact: true }).click();
    await expect.poll(() => page.getByTestId('stitch-chart').getAttribute('aria-label')).toBe('Stitch chart, 5 needles by 3 courses');
    expect(await page.getByLabel('Feeder of course 3').inputValue()).toBe('1');
    // Course 3 on feeder set A instead.
    await page.getByLabel('Feeder of course 3').selectOption('0');
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Unsaved changes');

    await page.getByRole('button', { name: 'Save texture' }).click();
    await expect.poll(() => page.getByTestId('save-state').textContent()).toContain('Saved · version 2');

    const stored = (await designer.get(`/api/library/textures/${created.json.texture.id}`)).json.texture;
    expect(stored.repeat).toMatchObject({ needles: 5, courses: 3 });
    expect(stored.repeat.cells).toEqual([
      ['tuck', 'tuck', 'miss', 'tuck', 'knit'],
      ['knit', 'knit', 'miss', 'knit', 'knit'],
      ['knit', 'knit', 'knit', 'knit', 'knit'],
    ]);
    expect(stored.feeders).toEqual([plated, bare, plated]);
  });

  it('the yarn form reads a count in denier and shows its dtex at once', async () => {
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/library/yarns/new`);
    const name = `Browser polyamide ${Date.now().toString(36)}`;
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByLabel('Count', { exact: true }).fill('40');
    await page.getByLabel('Count unit').selectOption('den');
    // 40 den = 40 / 9 tex = 44.4 dtex.
    await expect.poll(() => page.getByTestId('yarn-dtex').textContent()).toBe('44.4 dtex');
    await page.getByRole('button', { name: 'Add yarn' }).click();
    await page.waitForURL(/\/library\/yarns\/[0-9a-f-]{36}$/);
    await page.goto(`${baseUrl()}/library?tab=yarns`);
    await page.getByLabel('Search yarns').fill(name);
    await expect.poll(() => page.locator('tbody tr').count()).toBe(1);
    expect(await page.locator('tbody tr').first().textContent()).toContain('44.4');
  });

  it('shows the yarn form field errors beside the fields', async () => {
    const page = await signIn(browser, accounts.designer);
    await page.goto(`${baseUrl()}/library/yarns/new`);
    await page.getByRole('button', { name: 'Add yarn' }).click();
    await expect.poll(() => page.getByRole('alert').allTextContents()).toEqual(
      expect.arrayContaining([expect.stringMatching(/Name needs/), expect.stringMatching(/count/i)]),
    );
  });
});
