import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Locator } from 'playwright-core';
import { launch, signIn } from './browser';
import { accounts, as, baseUrl, styleByCode } from '../api/helpers';

async function fillLab(target: Locator, lab: { L: string; a: string; b: string }) {
  await target.getByLabel('L*', { exact: true }).fill(lab.L);
  await target.getByLabel('a*', { exact: true }).fill(lab.a);
  await target.getByLabel('b*', { exact: true }).fill(lab.b);
}

describe('colour in the browser', () => {
  let browser: Browser;
  beforeAll(async () => { browser = await launch(); });
  afterAll(async () => { await browser?.close(); });

  it('the colour lead sets two targets, sees the findings, and approves a submitted lab dip', async () => {
    const ridge = await styleByCode('HF27-101');
    const page = await signIn(browser, accounts['colour-lead']);
    await page.goto(`${baseUrl()}/styles/${ridge.id}/colour`);

    const name = `Browser two-tone ${Date.now().toString(36)}`;
    await page.getByRole('button', { name: 'New colourway' }).click();
    await page.getByLabel('New colourway name').fill(name);
    await page.getByRole('button', { name: 'Create', exact: true }).click();
    await expect.poll(() => page.getByRole('button', { name, pressed: true }).count()).toBe(1);

    await page.getByRole('button', { name: 'Add target' }).click();
    await page.getByRole('button', { name: 'Add target' }).click();
    const ground = page.getByTestId('target-0');
    const accent = page.getByTestId('target-1');
    await ground.getByLabel('Target name').fill('Ground');
    await fillLab(ground, { L: '24.5', a: '1.8', b: '-21.6' });
    await ground.getByLabel('Polyamide 6.6 78/68 semi-dull').check();
    await ground.getByLabel('Polyamide 44/34 full-dull').check();
    await accent.getByLabel('Target name').fill('Accent');
    await fillLab(accent, { L: '58.2', a: '-24.5', b: '-4.8' });
    await accent.getByLabel('Cationic-dyeable polyester 84/72').check();
    await page.getByRole('button', { name: 'Save colourway' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved' }).count()).toBe(1);

    // The dye plan: a cationic bath, then an acid bath, and the stain it leaves on the polyamide.
    const findings = page.getByTestId('dye-findings');
    await expect.poll(() => findings.locator('[data-kind="stain-risk"]').textContent()).toMatch(/cationic bath stains the polyamide/);
    expect(await findings.locator('[data-kind="stain-risk"]').textContent()).toMatch(/Instead: Add a reserving agent/);
    expect(await findings.locator('[data-kind="grin-through"]').count()).toBe(1);
    expect(await page.getByRole('region', { name: 'Baths' }).textContent()).toMatch(/1Cationic dyes → Accent.*2Acid dyes → Ground/s);

    // The dye house sends a lab dip for the ground.
    const lead = await as('colour-lead');
    const cw = (await lead.get(`/api/styles/${ridge.id}/colourways`)).json.colourways.find((c: { name: string }) => c.name === name);
    const groundId = cw.targets.find((t: { name: string }) => t.name === 'Ground').id;
    const mill = await as('mill');
    const sent = await mill.post(`/api/styles/${ridge.id}/lab-dips`, { targetId: groundId, measured: { L: 24.8, a: 2.1, b: -21.2 }, comment: 'Dip A' });
    expect(sent.status).toBe(201);

    await page.reload();
    await page.getByRole('button', { name }).click();
    const row = page.getByTestId('lab-dip-row').filter({ hasText: 'Ground' });
    await expect.poll(() => row.getAttribute('data-status')).toBe('submitted');
    expect(await row.textContent()).toMatch(/Within tolerance: CMC\(2:1\)/);
    await row.getByRole('button', { name: 'Approve' }).click();
    await expect.poll(() => row.getAttribute('data-status')).toBe('approved');
    expect(await row.textContent()).toContain('Iona Vesk');

    const dip = (await mill.get(`/api/styles/${ridge.id}/lab-dips/${sent.json.labDip.id}`)).json.labDip;
    expect(dip.status).toBe('approved');
  });

  it('a dip judged by a ΔE00 tolerance shows its ΔE00 beside the verdict, and CMC(2:1) as the other formula', async () => {
    const ridge = await styleByCode('HF27-101');
    const lead = await as('colour-lead');
    const stamp = Date.now().toString(36);
    const standard = (await lead.post('/api/library/colour-standards', {
      name: `Tight navy ${stamp}`, lab: { L: 24.5, a: 1.8, b: -21.6 }, source: 'measured', tolerance: { formula: 'de2000', max: 0.5 },
    })).json.standard;
    const yarnId = (await lead.get(`/api/styles/${ridge.id}/colourways`)).json.yarns.find((y: { name: string }) => y.name === 'Polyamide 6.6 78/68 semi-dull').id;
    const name = `Browser ΔE00 ${stamp}`;
    const cw = (await lead.post(`/api/styles/${ridge.id}/colourways`, {
      name, targets: [{ name: 'Ground', yarnIds: [yarnId], route: 'garment-dyed', colour: { source: 'standard', standardId: standard.id } }],
    })).json.colourway;
    const mill = await as('mill');
    // This dip is 0.89 ΔE00 off (outside ΔE00 ≤ 0.5) but 0.78 by CMC(2:1): the verdict must follow ΔE00.
    const sent = await mill.post(`/api/styles/${ridge.id}/lab-dips`, { targetId: cw.targets[0].id, measured: { L: 24.9, a: 2.4, b: -21.0 } });
    expect(sent.status).toBe(201);
    const reading = sent.json.labDip.reading as { deltaE: number; deltaE2000: number; deltaECMC21: number; pass: boolean };
    expect(reading.deltaE).toBe(reading.deltaE2000);
    expect(reading.pass).toBe(false);

    const page = await signIn(browser, accounts['colour-lead']);
    await page.goto(`${baseUrl()}/styles/${ridge.id}/colour`);
    await page.getByRole('button', { name }).click();
    const cell = page.getByTestId('lab-dip-row').filter({ hasText: 'Ground' }).locator('[data-formula="de2000"]');
    await expect.poll(() => cell.textContent()).toContain(`ΔE00 ${reading.deltaE2000.toFixed(2)}`);
    expect(await cell.textContent()).toContain(`${reading.pass ? 'within' : 'outside'} ΔE00 ≤ 0.50`);
    const row = page.getByTestId('lab-dip-row').filter({ hasText: 'Ground' });
    expect(await row.textContent()).toContain(`CMC(2:1) ${reading.deltaECMC21.toFixed(2)}`);
  });

  it('the mill sends a lab dip from its style page with pasted readings', async () => {
    const ridge = await styleByCode('HF27-101');
    const page = await signIn(browser, accounts.mill);
    await page.goto(`${baseUrl()}/styles/${ridge.id}/colour`);
    const form = page.getByRole('form', { name: 'Submit a lab dip' });
    await form.getByRole('radio', { name: 'Readings (CSV)' }).click();
    await form.getByLabel('Readings').fill('L*,a*,b*\n24.6,2.0,-21.3\n24.8,2.2,-21.1');
    await expect.poll(() => form.textContent()).toMatch(/2 readings, mean 24\.7/);
    await form.getByLabel('Comment').fill('Dip C, browser');
    await form.getByRole('button', { name: 'Send lab dip' }).click();
    await expect.poll(() => form.getByRole('status').textContent()).toMatch(/^Sent Ground #\d+/);
    await expect.poll(() => page.getByTestId('lab-dip-row').filter({ hasText: 'mean of 2 readings' }).count()).toBeGreaterThan(0);
  });
});
