/**
 * The product developer's part of the job on the seeded demo, on a desktop and on a phone: open a
 * formula, change a line and watch the results follow, open a trial and record a cook, then read a
 * tasting's results and the trial's comparison. Every stop fails on a console error, a CSP
 * violation, an uncaught exception or a page wider than the window (tests/e2e/browser.ts).
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, signIn, screenshot, startWalk, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

describe.each(WINDOWS)('the developer walks the loop (%s)', (size, viewport) => {
  it('formula, live results, trial, cook, tasting results, comparison', async () => {
    const walk = await startWalk(browser(), `developer-${size}`, viewport);
    const { page } = walk;
    await signIn(page, developer.email);
    await walk.stop('home');

    // A formula: change a line and the batch results follow the typing.
    await walk.nav('Formulas');
    await walk.stop('formulas');
    await page.getByRole('link', { name: /Hedgerow strawberry jam/ }).first().click();
    await page.getByText(/Revision \d+, saved by/).waitFor();
    const finished = page.getByTestId('result-finished-mass');
    const before = await finished.textContent();
    const quantity = page.getByLabel('Line 1: quantity');
    await quantity.fill(String(Number(await quantity.inputValue()) + 250));
    await expect.poll(() => finished.textContent(), { timeout: 15_000 }).not.toBe(before);
    if (size === 'phone') {
      // The key results sit on screen next to the line being typed, not below the whole form, and
      // a field focused for typing stops above them.
      await quantity.blur();
      await page.evaluate(() => window.scrollTo(0, 0));
      await quantity.focus();
      const bar = page.getByTestId('key-results');
      const box = (await bar.boundingBox())!;
      const field = (await quantity.boundingBox())!;
      expect(box.y).toBeGreaterThanOrEqual(0);
      expect(box.y + box.height).toBeLessThanOrEqual(viewport.height + 1);
      expect(field.y).toBeGreaterThanOrEqual(0);
      expect(field.y + field.height).toBeLessThanOrEqual(box.y);
      expect(await bar.textContent()).toMatch(/Batch.*Solids.*pH.*End point.*Rules/);
      await screenshot(page, `walk-developer-${size}-key-results-beside-the-line`, false);
    }
    await walk.stop('formula-changed');

    // A trial at the stove: record a cook of variant A.
    await walk.nav('Trials');
    await walk.stop('trials');
    await page.getByRole('link', { name: /Blackcurrant jam: firmer set with less pectin\?/ }).first().click();
    await page.getByRole('heading', { level: 1, name: /Blackcurrant jam/ }).waitFor();
    await walk.stop('trial');
    await page.getByTestId('variants-table').getByRole('link', { name: 'A', exact: true }).click();
    await page.getByRole('heading', { level: 2, name: /^Variant A\b/ }).waitFor();
    const cooks = page.getByTestId('cook-list').locator(':scope > li');
    const cooksBefore = await cooks.count();
    await page.getByLabel(/Batch size, total charge/).fill('1800');
    await page.getByLabel('Refractometer reading (°Brix, as read)').fill('65.2');
    await page.getByLabel(/Sample temperature/).fill('20');
    await page.getByRole('textbox', { name: 'pH', exact: true }).fill('3.1');
    await page.getByLabel(/End-point temperature/).fill('104.5');
    await page.getByRole('button', { name: 'Save the cook' }).click();
    await expect.poll(() => cooks.count(), { timeout: 15_000 }).toBe(cooksBefore + 1);
    await walk.stop('cook-recorded');

    // A closed tasting's results, then the comparison of the variants.
    await walk.nav('Trials');
    await page.getByRole('link', { name: /Apricot spread: how low can the sugar go\?/ }).first().click();
    await page.getByTestId('tasting-list').getByRole('link', { name: 'Spread tasting, 19 November' }).click();
    await page.getByRole('link', { name: 'Results' }).click();
    await page.getByTestId('verdict').first().waitFor();
    await page.getByTestId('means-chart').first().locator('canvas').waitFor();
    // Each sample's group letters are read beside the sample, on the first screen width of its table
    // (a walk found the Group column off-screen inside the table's scroll box at 390 px).
    // The box is not scrolled: each bounding box is where the reader first sees it.
    const summary = page.getByTestId('summary-table').first();
    for (const cell of [summary.getByRole('columnheader', { name: 'Sample' }), summary.getByRole('columnheader', { name: 'Group' }), summary.locator('tbody tr').first().locator('td.font-mono')]) {
      const box = (await cell.boundingBox())!;
      expect(box.x).toBeGreaterThanOrEqual(0);
      expect(box.x + box.width).toBeLessThanOrEqual(viewport.width);
    }
    await walk.stop('tasting-results');
    await page.goBack();
    await page.goBack();
    await page.getByRole('link', { name: 'Compare variants' }).click();
    await page.getByTestId('comparison-verdicts').first().waitFor();
    await walk.stop('compare');
    await walk.close();
  });
});
