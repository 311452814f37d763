/**
 * From trial to shelf as three people: the developer requests promotion, the head of product
 * approves it (the e-mail arrives in the SMTP fake), and production prints the batch sheet,
 * records a batch that passes and one that fails, and sees the trend.
 */
import { describe, it, expect, onTestFailed } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, newContext, signIn, screenshot, mailTo } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';
import { lotCodeFor } from '@/lib/production/vocabulary';

const browser = sharedBrowser();
const person = (role: string) => DEMO_USERS.find((u) => u.role === role)!;

async function asRole(role: string, name: string): Promise<Page> {
  const ctx = await newContext(browser());
  const page = await ctx.newPage();
  onTestFailed(async () => {
    await screenshot(page, `production-${name}-failure`);
  });
  await signIn(page, person(role).email);
  return page;
}

describe('promotion to production, three roles', () => {
  let reviewUrl = '';
  let requestCode = '';
  let versionUrl = '';

  it('the developer requests promotion of a variant with its evidence', async () => {
    const page = await asRole('developer', 'developer');
    await page.goto('/trials');
    await page.getByTestId('trial-list').getByText('Blackcurrant jam: firmer set with less pectin?').click();
    await page.getByRole('link', { name: /Compare/ }).first().click();
    await page.getByRole('link', { name: 'Request promotion to production' }).click();
    await page.getByRole('heading', { level: 1, name: /Promote from T-\d{3}/ }).waitFor();
    const variant = page.getByLabel('Variant', { exact: true });
    const options = await variant.locator('option').allTextContents();
    await variant.selectOption({ label: options.find((o) => o.startsWith('C — '))! });
    // Nothing is chosen for the developer: they file it as a new version of the blackcurrant jam in production.
    expect(await page.getByLabel('Product', { exact: true }).count()).toBe(0);
    await page.getByLabel('A new version of an existing product').check();
    await page.getByLabel('Product', { exact: true }).selectOption({ label: 'Blackcurrant jam (BCJ)' });
    await page.getByTestId('target-comparison').getByText('supersedes version 1 now in production', { exact: false }).waitFor();
    expect(await page.getByTestId('target-comparison').getByText('Different fruit', { exact: false }).count()).toBe(0);
    await page.getByLabel('Why this variant').fill('Variant C set as firmly as the base with the higher sugar ratio, and tasters preferred it.');
    expect(await page.getByLabel('pH max').inputValue()).not.toBe('');
    await page.getByRole('button', { name: 'Request promotion' }).click();
    await page.waitForURL(/\/production\/reviews\/[0-9a-f-]{36}$/);
    reviewUrl = page.url();
    requestCode = (await page.getByRole('heading', { level: 1 }).textContent())!.match(/PR-\d{3}/)![0];
    await page.getByText('Awaiting review').first().waitFor();
    await page.getByRole('button', { name: 'Withdraw the request' }).waitFor();
    // The developer cannot decide.
    expect(await page.getByRole('button', { name: 'Approve for production' }).count()).toBe(0);
    await page.context().close();
  });

  it('the head of product gets the e-mail, reviews the evidence and approves', async () => {
    const head = person('head_of_product');
    const mail = await mailTo(head.email, 10_000, new RegExp(`^Promotion ${requestCode} awaits your review$`));
    expect(mail.text).toContain(new URL(reviewUrl).pathname);
    const page = await asRole('head_of_product', 'head');
    await page.goto('/production/reviews');
    await page.getByTestId('review-queue').getByRole('link', { name: new RegExp(`^${requestCode}:`) }).click();
    await page.getByRole('heading', { name: 'Compliance and predicted chemistry' }).waitFor();
    await page.getByRole('heading', { name: 'Proposed QC specification' }).waitFor();
    await page.getByTestId('promotion-lines').waitFor();
    await page.getByRole('region', { name: 'Against Blackcurrant jam v1, line by line' }).waitFor();
    await page.getByRole('button', { name: 'Approve for production' }).click();
    await page.getByRole('dialog').getByText('supersedes version 1 now in production', { exact: false }).waitFor();
    await page.getByRole('dialog').getByRole('button', { name: 'Approve' }).click();
    await page.waitForURL(/\/production\/versions\/[0-9a-f-]{36}$/);
    versionUrl = page.url();
    await page.getByRole('heading', { level: 1, name: 'Blackcurrant jam v2' }).waitFor();
    await page.getByText('In production').first().waitFor();
    await page.context().close();
  });

  it('production prints the batch sheet, records a passing and a failing batch, and sees the trend', async () => {
    const page = await asRole('production', 'production');
    await page.goto(versionUrl);
    await page.getByRole('link', { name: 'Batch sheet' }).click();
    await page.getByLabel('Amount').fill('50');
    await page.getByLabel('Unit (kettle or finished mass)').selectOption('kg');
    await page.getByLabel('Scale reads to').fill('10');
    await page.getByLabel('Kitchen altitude (m)').fill('300');
    await page.getByRole('button', { name: 'Scale' }).click();
    const sheet = page.getByTestId('batch-sheet');
    await sheet.waitFor();
    await expect.poll(() => sheet.getByTestId('rounding-effect').textContent()).toMatch(/Effect of rounding/);
    // 50 kg on a scale reading to 10 g: every weight is a whole number of its line's step (10 g, or finer for a small addition).
    const rows = sheet.getByTestId('sheet-ingredients').locator('tbody tr:has([data-testid="line-step"])');
    const weights = await rows.locator('td:nth-child(3)').allTextContents();
    const steps = await rows.getByTestId('line-step').allTextContents();
    expect(weights.length).toBeGreaterThanOrEqual(4);
    expect(steps).toContain('10 g');
    weights.forEach((w, i) => {
      const step = Number.parseFloat(steps[i]);
      const n = Number(w.replace(/[^\d.]/g, '')) / step;
      expect(Math.abs(n - Math.round(n))).toBeLessThan(1e-6);
    });
    // Print view: the navigation and the scale form are left off the paper.
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('form', { name: 'Scale the batch sheet' }).isVisible()).toBe(false);
    expect(await sheet.isVisible()).toBe(true);
    await page.emulateMedia({ media: 'screen' });

    const today = new Date().toISOString().slice(0, 10);
    await page.goto(`${versionUrl}/batches/new`);
    const fill = async (readings: Record<string, string>) => {
      for (const [label, value] of Object.entries(readings)) await page.getByLabel(label, { exact: true }).fill(value);
    };
    // The form proposes the next free lot of the day (other tests may have recorded some today).
    const firstLot = await page.getByLabel('Lot code', { exact: true }).inputValue();
    expect(firstLot).toMatch(new RegExp(`^${lotCodeFor('BCJ', today, 1).replace(/-1$/, '')}-\\d+$`));
    await fill({ 'Batch size (kg)': '50', 'Refractometer (°Brix, as read)': '67', 'Sample temperature (°C)': '20', 'pH': '3.0', 'Fill temperature (°C)': '88', 'Jars filled': '118', 'Jars rejected': '1' });
    await expect.poll(() => page.getByTestId('live-checks').textContent()).toMatch(/Pass — Soluble solids/);
    await page.getByRole('button', { name: 'Record the batch' }).click();
    await page.waitForURL(/\/production\/versions\/[0-9a-f-]{36}#batches$/);
    await page.getByTestId('batch-table').getByText(firstLot).waitFor();

    await page.goto(`${versionUrl}/batches/new`);
    const secondLot = await page.getByLabel('Lot code', { exact: true }).inputValue();
    expect(secondLot).not.toBe(firstLot);
    await fill({ 'Batch size (kg)': '50', 'Refractometer (°Brix, as read)': '67', 'Sample temperature (°C)': '20', 'pH': '3.0', 'Fill temperature (°C)': '80', 'Jars filled': '120', 'Jars rejected': '0' });
    await expect.poll(() => page.getByTestId('live-checks').textContent()).toMatch(/Fail — Fill temperature/);
    await page.getByRole('button', { name: 'Record the batch' }).click();
    await page.getByText('A failed batch needs a disposition with a comment.').waitFor();
    await page.getByLabel('Disposition').selectOption('hold');
    await page.getByLabel('What was done').fill('Held for a water-bath re-process.');
    await page.getByRole('button', { name: 'Record the batch' }).click();
    await page.waitForURL(/#batches$/);
    const row = page.getByTestId('batch-table').locator('tr', { hasText: secondLot });
    await row.getByText('Fail').waitFor();
    expect(await row.textContent()).toMatch(/Hold/);

    await page.getByRole('link', { name: 'All versions and trends' }).click();
    await page.waitForURL(/\/production\/products\/[0-9a-f-]{36}$/);
    await page.getByTestId('versions').waitFor();
    await expect.poll(() => page.getByTestId('trend-chart').count()).toBe(2);
    expect(await page.getByTestId('trend-chart').first().locator('canvas').count()).toBe(1);
    const versions = await page.getByTestId('versions').textContent();
    expect(versions).toMatch(/v2.*In production/s);
    expect(versions).toMatch(/v1.*Superseded/s);
    await page.context().close();
  });
});
