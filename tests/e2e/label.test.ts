/**
 * The label follows the formula: a developer opens the demo's reduced-sugar strawberry spread and
 * changes the sugar, and the live label's declaration, statements, claim and preservative check
 * change with it; the head of product reads the label frozen with a production version. On a
 * desktop and a phone; every stop fails on console errors, CSP violations, uncaught exceptions and
 * sideways scroll (tests/e2e/browser.ts) and saves a screenshot.
 */
import { describe, expect, it } from 'vitest';
import type { Locator } from 'playwright-core';
import { sharedBrowser, signIn, startWalk, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;
const head = DEMO_USERS.find((u) => u.role === 'head_of_product')!;

/** The text of a row of a labelled table, found by its row header. */
const rowText = (region: Locator, header: string | RegExp) => region.getByRole('row').filter({ has: region.page().getByRole('rowheader', { name: header }) }).first().innerText();

async function waitForChange(read: () => Promise<string>, before: string): Promise<string> {
  await expect.poll(read, { timeout: 10_000 }).not.toBe(before);
  return read();
}

describe.each(WINDOWS)('the live label (%s)', (size, viewport) => {
  it('changes with the sugar of the reduced-sugar spread', async () => {
    const walk = await startWalk(browser(), `label-developer-${size}`, viewport);
    const { page } = walk;
    await signIn(page, developer.email);
    await walk.nav('Formulas');
    await page.getByRole('link', { name: /Strawberry spread, less sugar/ }).first().click();
    const live = page.locator('#live-label');
    await live.getByRole('region', { name: 'EU nutrition declaration' }).waitFor();
    await live.scrollIntoViewIfNeeded();
    await walk.stop('live-label');
    // Cholesterol comes from the ingredients: every line of the spread is a plant food or an additive.
    const us = live.getByRole('region', { name: 'US nutrition facts' });
    expect(await rowText(us, 'Cholesterol')).toMatch(/^Cholesterol\s+0 mg\s/);

    const eu = live.getByRole('region', { name: 'EU nutrition declaration' });
    const additives = live.getByRole('region', { name: 'Additive limits' });
    const claims = live.getByRole('region', { name: 'Claims' });
    const sugars = () => rowText(eu, 'of which sugars');
    const fruit = () => live.getByText(/^Prepared with \d+ g of fruit per 100 g$/).innerText();
    const totalSugar = () => live.getByText(/^Total sugar content \d+ g per 100 g$/).innerText();
    const sorbate = () => rowText(additives, 'Sorbates and benzoates');
    const reduced = () => rowText(claims, /^Reduced sugars/);

    const before = { sugars: await sugars(), fruit: await fruit(), totalSugar: await totalSugar(), sorbate: await sorbate(), reduced: await reduced() };
    expect(before.sorbate).toContain('Within the limit');
    expect(before.reduced).toContain('May not be made');

    // Less sugar in the kettle: less to boil down to, so more fruit per 100 g and more sorbate per kg.
    await page.getByLabel('Line 2: quantity').fill('250');
    expect(await waitForChange(fruit, before.fruit)).not.toBe(before.fruit);
    expect(await waitForChange(sorbate, before.sorbate)).toContain('Over the limit');
    expect(await sugars()).not.toBe(before.sugars);
    await walk.stop('less-sugar');

    // A lower Brix: the total-sugar statement and the reduced-sugars claim move with it.
    await page.getByLabel('Target final soluble solids (%)').fill('32');
    expect(await waitForChange(totalSugar, before.totalSugar)).toBe('Total sugar content 32 g per 100 g');
    expect(await waitForChange(reduced, before.reduced)).not.toContain('May not be made');
    await walk.stop('lower-brix');
    await walk.close();
  });

  it('is frozen with the production version the head of product reads', async () => {
    const walk = await startWalk(browser(), `label-head-${size}`, viewport);
    const { page } = walk;
    await signIn(page, head.email);
    await walk.nav('Production');
    await page.getByTestId('products').getByRole('link', { name: 'Blackcurrant jam' }).first().click();
    await page.getByRole('link', { name: /^v\d+$/ }).first().click();
    await page.waitForURL(/\/production\/versions\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: 'Label, frozen at approval' }).waitFor();
    await page.locator('#label').getByRole('region', { name: 'EU nutrition declaration' }).waitFor();
    await walk.stop('version-label');
    await page.getByRole('link', { name: 'Print view' }).click();
    await page.waitForURL(/\/label$/);
    await page.getByRole('button', { name: 'Print the label' }).waitFor();
    await walk.stop('version-label-print');
    await walk.close();
  });
});
