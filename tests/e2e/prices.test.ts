/**
 * Prices on a desktop and a phone: the production lead enters a price of honey (dated far ahead, so
 * no seeded cost moves), withdraws it after the confirmation, and adds a pack format; a taster is
 * refused the page. Every stop fails on console errors, CSP violations and sideways scroll.
 */
import { describe, it, expect } from 'vitest';
import { BASE_URL, sharedBrowser, signIn, startWalk, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const lead = DEMO_USERS.find((u) => u.role === 'production')!;
const taster = DEMO_USERS.find((u) => u.role === 'taster')!;

describe.each(WINDOWS)('prices (%s)', (size, viewport) => {
  it('enters and withdraws a price, and adds a pack format', async () => {
    const walk = await startWalk(browser(), `prices-${size}`, viewport);
    const { page } = walk;
    await signIn(page, lead.email);
    await walk.nav('Prices');
    await page.getByRole('heading', { level: 1, name: 'Prices' }).waitFor();
    // The demo states its currency and prices sugar.
    await expect(page.getByTestId('price-table').getByText(/GBP/).first().isVisible()).resolves.toBe(true);
    await walk.stop('list');

    await page.getByTestId('price-table').getByRole('link', { name: 'Honey', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Honey' }).waitFor();
    const day = size === 'desktop' ? '2199-01-01' : '2199-01-02';
    const form = page.getByRole('form', { name: 'Add a price' });
    await form.getByLabel('Price of one pack (GBP)').fill('-4');
    await form.getByRole('button', { name: 'Add price' }).click();
    await page.getByText('A price cannot be negative.').waitFor();
    await form.getByLabel('Price of one pack (GBP)').fill('41.20');
    await form.getByLabel('Pack size').fill('6');
    await form.getByLabel('Unit').selectOption('kg');
    await form.getByLabel('Valid from').fill(day);
    await form.getByRole('button', { name: 'Add price' }).click();
    await page.getByText('Price added. Earlier prices are kept.').waitFor();
    const row = page.getByRole('row').filter({ hasText: day === '2199-01-01' ? '1 Jan 2199' : '2 Jan 2199' });
    await row.getByText('GBP 41.20').waitFor();
    await walk.stop('price-added');

    await row.getByRole('button', { name: /^Withdraw/ }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Why is it withdrawn?').fill('Entered by the browser test.');
    await walk.stop('confirm-withdraw');
    await dialog.getByRole('button', { name: 'Withdraw price' }).click();
    await page.getByText(/Withdrawn .*: Entered by the browser test\./).first().waitFor();
    await walk.stop('withdrawn');

    await page.getByRole('navigation', { name: 'Prices' }).getByRole('link', { name: 'Packaging and pack formats' }).click();
    await page.getByRole('heading', { level: 1, name: 'Packaging and pack formats' }).waitFor();
    const name = `Browser test 227 g jar ${size} ${Date.now()}`;
    const add = page.getByRole('form', { name: 'Add a pack format' });
    await add.getByLabel('Name').fill(name);
    await add.getByLabel('Net fill per jar (g)').fill('227');
    await add.getByRole('button', { name: 'Add packaging line' }).click();
    await add.getByLabel('Packaging item').selectOption({ label: 'Twist-off lid 63 mm, gold' });
    await add.getByRole('button', { name: 'Add pack format' }).click();
    await page.getByText('Pack format saved.').waitFor();
    await page.getByRole('heading', { level: 3, name }).waitFor();
    await walk.stop('pack-format');
    await walk.close();
  });

  it('is refused to a taster', async () => {
    const walk = await startWalk(browser(), `prices-taster-${size}`, viewport);
    await signIn(walk.page, taster.email);
    const res = await walk.page.goto(`${BASE_URL}/prices`);
    expect(res?.status()).toBe(403);
    expect(await walk.page.getByText('GBP').count()).toBe(0);
    await walk.close();
  });
});
