/**
 * The production lead's part of the job on the seeded demo, on a desktop and on a phone: from the
 * home page to the product in production, the batch sheet scaled to the kettle, a batch recorded
 * and checked against the spec, and the version's batch table. Every stop fails on a console
 * error, a CSP violation, an uncaught exception or a page wider than the window
 * (tests/e2e/browser.ts).
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, signIn, startWalk, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';
import { lotCodeFor } from '@/lib/production/vocabulary';

const browser = sharedBrowser();
const production = DEMO_USERS.find((u) => u.role === 'production')!;

describe.each(WINDOWS)('the production lead walks the loop (%s)', (size, viewport) => {
  it('batch sheet, record a batch, batch table', async () => {
    const walk = await startWalk(browser(), `production-${size}`, viewport);
    const { page } = walk;
    await signIn(page, production.email);
    await walk.stop('home');

    await walk.nav('Production');
    const product = page.getByTestId('products').locator('li', { hasText: 'Blackcurrant jam' }).first();
    await product.waitFor();
    await walk.stop('production');
    await product.getByRole('link', { name: 'Batch sheet' }).click();
    await page.getByLabel('Amount').fill('20');
    await page.getByLabel('Unit (kettle or finished mass)').selectOption('kg');
    await page.getByRole('button', { name: 'Scale' }).click();
    await page.getByTestId('sheet-ingredients').waitFor();
    await walk.stop('batch-sheet');

    await walk.nav('Production');
    await product.getByRole('link', { name: 'Record a batch' }).click();
    // A batch number of the day that no other browser test uses (they start at 1).
    const lot = lotCodeFor('BCJ', new Date().toISOString().slice(0, 10), size === 'desktop' ? 91 : 92);
    const readings: Record<string, string> = {
      'Lot code': lot, 'Batch size (kg)': '20', 'Refractometer (°Brix, as read)': '67', 'Sample temperature (°C)': '20',
      pH: '3.0', 'Fill temperature (°C)': '88', 'Jars filled': '55', 'Jars rejected': '0',
    };
    for (const [label, value] of Object.entries(readings)) await page.getByLabel(label, { exact: true }).fill(value);
    await expect.poll(() => page.getByTestId('live-checks').textContent(), { timeout: 15_000 }).toMatch(/Pass — Soluble solids/);
    await walk.stop('batch-form');
    await page.getByRole('button', { name: 'Record the batch' }).click();
    await page.waitForURL(/\/production\/versions\/[0-9a-f-]{36}#batches$/);
    await page.getByTestId('batch-table').getByText(lot).waitFor();
    await walk.stop('batch-recorded');
    await walk.close();
  });
});
