/**
 * Costs in the seeded demo, on a desktop and a phone: the apricot trial's Compare page shows each
 * variant's cost per jar next to its liking; the product of the batch sheet shows its cost at
 * approval and today; a new sugar price moves every dependent figure (the frozen one stays). A
 * taster sees no price. Every stop fails on console errors, CSP violations and sideways scroll.
 */
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { BASE_URL, sharedBrowser, signIn, startWalk, watchCsp, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';
import { todayIso } from '@/lib/format/dates';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;
const head = DEMO_USERS.find((u) => u.role === 'head_of_product')!;
const taster = DEMO_USERS.find((u) => u.role === 'taster')!;
const APRICOT = 'Apricot spread: how low can the sugar go?';

const texts = async (page: Page, testId: string) => page.getByTestId(testId).allTextContents();

async function openCompare(page: Page) {
  await page.goto(`${BASE_URL}/trials`);
  await page.getByRole('link', { name: APRICOT }).first().click();
  await page.getByRole('link', { name: 'Compare variants' }).click();
  await page.getByRole('heading', { name: 'Cost against liking' }).waitFor();
}

async function openProductFromSheet(page: Page) {
  await page.goto(`${BASE_URL}/production`);
  await page.getByRole('link', { name: 'Blackcurrant jam', exact: true }).first().click();
  await page.getByTestId('versions').getByRole('link').first().click();
  await page.getByRole('link', { name: 'Batch sheet' }).click();
  await page.getByRole('link', { name: /^Back to Blackcurrant jam/ }).click();
  await page.getByRole('link', { name: 'All versions and trends' }).click();
  await page.getByTestId('product-cost').waitFor();
}

describe.each(WINDOWS)('costs (%s)', (size, viewport) => {
  it('compare shows cost beside liking, the product its cost at approval and today, and a sugar price moves them', { timeout: 300_000 }, async () => {
    const walk = await startWalk(browser(), `cost-${size}`, viewport);
    const { page } = walk;
    const csp = await watchCsp(page);
    await signIn(page, head.email);

    await openCompare(page);
    const costs = await texts(page, 'compare-cost');
    const liking = await texts(page, 'compare-liking');
    expect(costs.length).toBeGreaterThan(1);
    for (const c of costs) expect(c).toMatch(/^GBP \d+\.\d{2}$/);
    expect(liking.some((l) => /^\d+\.\d{2}$/.test(l))).toBe(true);
    if (size === 'desktop') await page.getByTestId('cost-liking-chart').waitFor();
    const variantCosts = await texts(page, 'variant-cost');
    expect(variantCosts).toEqual(costs);
    await walk.stop('compare');

    await openProductFromSheet(page);
    const atApproval = await texts(page, 'cost-at-approval');
    const today = await texts(page, 'cost-today');
    expect(atApproval[0]).toMatch(/^GBP \d+\.\d{2}/);
    expect(today[0]).toMatch(/^GBP \d+\.\d{2}$/);
    await walk.stop('product');

    // Sugar dearer from today (a later entry of the same day wins, so each window raises it again).
    const lead = await startWalk(browser(), `cost-sugar-${size}`, viewport);
    await signIn(lead.page, DEMO_USERS.find((u) => u.role === 'production')!.email);
    await lead.page.goto(`${BASE_URL}/prices`);
    const sugarLink = lead.page.getByTestId('price-table').getByRole('link', { name: 'Sucrose (white sugar)', exact: true });
    const ingredientId = (await sugarLink.getAttribute('href'))!.split('/').pop()!;
    await sugarLink.click();
    await lead.page.waitForURL(`${BASE_URL}/prices/${ingredientId}`);
    // The price goes in through the API with the lead's session (the price form has its own browser test).
    const added = await lead.page.request.post(`${BASE_URL}/api/v1/prices`, {
      headers: { origin: BASE_URL },
      data: { ingredientId, packPrice: size === 'desktop' ? '60.00' : '75.00', packSize: 25, packUnit: 'kg', supplier: 'Millbrook Sugar', validFrom: todayIso() },
    });
    expect(added.status(), await added.text()).toBe(201);
    await lead.page.reload();
    await lead.stop('sugar-price');
    await lead.close();

    await openProductFromSheet(page);
    expect(await texts(page, 'cost-at-approval')).toEqual(atApproval);
    const todayAfter = await texts(page, 'cost-today');
    expect(todayAfter[0]).not.toBe(today[0]);
    expect(Number(todayAfter[0].replace(/[^\d.]/g, ''))).toBeGreaterThan(Number(today[0].replace(/[^\d.]/g, '')));
    await page.getByText('Cost moved').waitFor();
    await walk.stop('product-after');

    await openCompare(page);
    const costsAfter = await texts(page, 'compare-cost');
    costsAfter.forEach((c, i) => expect(Number(c.replace(/[^\d.]/g, ''))).toBeGreaterThan(Number(costs[i].replace(/[^\d.]/g, ''))));
    await walk.stop('compare-after');

    expect(csp).toEqual([]);
    await walk.close();
  });

  it('shows the developer the live cost in the formula editor, and a taster no price', { timeout: 120_000 }, async () => {
    const walk = await startWalk(browser(), `cost-editor-${size}`, viewport);
    const { page } = walk;
    await signIn(page, developer.email);
    await page.goto(`${BASE_URL}/formulas`);
    // A demo formula by name: formulas other walks create have no pack format, and the list puts the newest first.
    await page.getByRole('main').getByRole('link', { name: /Hedgerow strawberry jam/ }).first().click();
    const panel = page.getByTestId('formula-cost');
    await panel.waitFor();
    await expect(panel.getByTestId('cost-summary-per-jar').textContent()).resolves.toMatch(/GBP \d+\.\d{2}/);
    await walk.stop('editor');
    await walk.close();

    const tasterWalk = await startWalk(browser(), `cost-taster-${size}`, viewport);
    await signIn(tasterWalk.page, taster.email);
    await tasterWalk.page.goto(`${BASE_URL}/home`);
    expect(await tasterWalk.page.getByText('GBP').count()).toBe(0);
    const res = await tasterWalk.page.request.get(`${BASE_URL}/api/v1/costs/basis`);
    expect(res.status()).toBe(403);
    await tasterWalk.close();
  });
});
