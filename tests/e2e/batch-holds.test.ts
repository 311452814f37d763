/**
 * Production on desktop (1366 px) and phone (390 px): the trend names its run rules, a batch without
 * its set test is recorded incomplete and on hold, is re-tested and released; and the unmarked
 * tasting slider shows no thumb. Screenshots land in test-results/.
 */
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, newContext, signIn, screenshot, openApricotTasting } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const person = (role: string) => DEMO_USERS.find((u) => u.role === role)!;

async function watched(width: number, height: number): Promise<{ page: Page; problems: string[] }> {
  const ctx = await newContext(browser(), { width, height });
  const page = await ctx.newPage();
  const problems: string[] = [];
  page.on('console', (m) => { if (m.type() === 'error') problems.push(`console: ${m.text()}`); });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  return { page, problems };
}

const overflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

describe('held batches, as production', () => {
  for (const [label, width, height] of [['desktop', 1366, 900], ['phone', 390, 844]] as const) {
    it(`records an incomplete batch, re-tests and releases it (${label})`, async () => {
      const { page, problems } = await watched(width, height);
      await signIn(page, person('production').email);
      await page.goto('/production');
      await page.getByRole('link', { name: /Blackcurrant/ }).first().click();
      await page.waitForURL(/\/production\/products\//);
      await expect.poll(() => page.getByTestId('run-rule-signals').count()).toBe(2);
      expect(await page.getByTestId('run-rule-signals').first().textContent()).toMatch(/Western Electric rules 1 and 4/);
      await screenshot(page, `h7-product-${label}`);
      expect(await overflow(page)).toBeLessThanOrEqual(0);

      const recordHref = (await page.getByRole('link', { name: 'Record a batch' }).first().getAttribute('href'))!;
      const versionId = recordHref.split('/')[3];
      const { version } = await (await page.request.get(`/api/v1/production-versions/${versionId}`)).json();
      const spec = version.spec;
      await page.getByRole('link', { name: 'Record a batch' }).first().click();
      await page.getByLabel('Lot code', { exact: true }).waitFor();
      // The lot code is the next free batch of the day.
      const lot = await page.getByLabel('Lot code', { exact: true }).inputValue();
      expect(lot).toMatch(/^BCJ-\d{5}-\d+$/);
      for (const [field, value] of Object.entries({
        'Batch size (kg)': '50', 'Refractometer (°Brix, as read)': ((spec.solidsMinBrix + spec.solidsMaxBrix) / 2).toFixed(1), 'Sample temperature (°C)': '20',
        'pH': ((spec.phMin + spec.phMax) / 2).toFixed(2), 'Fill temperature (°C)': '88', 'Jars filled': '118',
      })) {
        await page.getByLabel(field, { exact: true }).fill(value);
      }
      await page.getByTestId('live-outcome').waitFor();
      expect(await page.getByTestId('live-outcome').textContent()).toMatch(/^Incomplete/);
      await screenshot(page, `h7-batch-form-${label}`);
      expect(await overflow(page)).toBeLessThanOrEqual(0);
      await page.getByRole('button', { name: 'Record the batch' }).click();
      await page.waitForURL(/#batches$/);
      const row = page.getByTestId('batch-table').locator('tr', { hasText: lot });
      await row.getByText('On hold').waitFor();
      expect(await row.textContent()).toMatch(/Incomplete/);

      await row.getByRole('link', { name: lot }).click();
      await page.waitForURL(/\/production\/batches\//);
      await page.getByText('A check the spec requires was not measured').waitFor();
      expect(await page.getByRole('button', { name: 'Release the batch' }).isDisabled()).toBe(true);
      await screenshot(page, `h7-batch-held-${label}`);
      expect(await overflow(page)).toBeLessThanOrEqual(0);

      const retest = page.getByRole('form', { name: 'Re-test the batch' });
      await retest.getByLabel('Set test score (1–5)').fill('4');
      await retest.getByLabel('Mean net fill (g)').fill(String(spec.netFillG + 3));
      await retest.getByLabel('Lightest jar (g)').fill(String(spec.netFillG - 1));
      await retest.getByLabel('What was done before the re-test').fill('Set read at 24 hours; six jars weighed.');
      await retest.getByRole('button', { name: 'Record the re-test' }).click();
      await page.getByTestId('batch-decisions').waitFor();
      await page.getByText('The latest re-test passed every check').waitFor();
      await page.getByLabel('Reason').fill('Every check passes after the re-test.');
      await page.getByRole('button', { name: 'Release the batch' }).click();
      await page.getByRole('dialog').getByRole('button', { name: 'Release' }).click();
      await expect.poll(async () => (await page.getByTestId('audit-trail').textContent()) ?? '', { timeout: 15_000 }).toMatch(/Re-tested held batch.*Released held batch/s);
      expect(await page.getByRole('form', { name: 'Re-test the batch' }).count()).toBe(0);
      await screenshot(page, `h7-batch-decided-${label}`);
      expect(await overflow(page)).toBeLessThanOrEqual(0);
      expect(problems).toEqual([]);
      await page.context().close();
    });
  }
});

describe('the tasting slider on a phone', () => {
  it('shows no thumb until it is touched', async () => {
    const { joinCode } = await openApricotTasting(browser(), { organiserEmail: person('developer').email, title: `Slider check ${Date.now()}`, attribute: 'Set firmness' });
    const { page: phone, problems } = await watched(390, 844);
    await phone.goto('/join');
    await phone.getByLabel('Tasting code').fill(joinCode);
    await phone.getByLabel('Your name').fill('Slider guest');
    await phone.getByRole('button', { name: 'Join the tasting' }).click();
    await phone.waitForURL(/\/t\/sws_/);
    await phone.getByRole('button', { name: 'I agree, start' }).click();
    const slider = phone.getByRole('slider');
    await slider.waitFor();
    expect(await slider.getAttribute('data-marked')).toBe('no');
    await screenshot(phone, 'h7-slider-unmarked-phone');
    // The unmarked rules apply (the thumb itself is a pseudo-element: see the screenshot).
    expect(await slider.evaluate((el) => getComputedStyle(el).appearance)).toBe('none');
    await slider.focus();
    await phone.keyboard.press('ArrowRight');
    expect(await slider.getAttribute('data-marked')).toBe('yes');
    await screenshot(phone, 'h7-slider-marked-phone');
    expect(problems).toEqual([]);
    await phone.context().close();
  });
});
