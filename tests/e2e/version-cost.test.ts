/**
 * A production version of the test's own making, on a desktop and a phone: the developer starts a
 * trial and asks to promote its base variant as a new product, the head of product approves it, and
 * the production lead (1) picks another pack format on the version page — the product's cost per
 * jar today moves with it — and (2) records two batches, whose pages set the measured Brix against the
 * total sugar the label states (± 3 degrees, Directive 2001/113/EC): one within, one outside.
 * Its own trial, product and pack format, so no demo record changes. Every stop fails on console
 * errors, CSP violations and sideways scroll.
 */
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, signIn, startOwnTrial, startWalk, WINDOWS, type Walk } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const person = (role: string) => DEMO_USERS.find((u) => u.role === role)!;

/** Five capital letters no demo product uses (the demo's codes are three letters). */
function productCode(): string {
  return Array.from({ length: 5 }, () => String.fromCharCode(65 + Math.floor(Math.random() * 26))).join('');
}

async function costToday(page: Page): Promise<string> {
  const cell = page.getByTestId('product-cost').getByTestId('cost-today').first();
  await cell.waitFor();
  return (await cell.textContent())!.trim();
}

/** The figure of a money text such as "GBP 1.23" (the currency code or sign left off). */
const amountOf = (text: string) => Number(text.replace(/[^\d.]/g, ''));

async function recordBatch(walk: Walk, versionUrl: string, brix: string, fail: boolean): Promise<string> {
  const { page } = walk;
  await page.goto(`${versionUrl}/batches/new`);
  const lot = await page.getByLabel('Lot code', { exact: true }).inputValue();
  const readings: Record<string, string> = {
    'Batch size (kg)': '20', 'Refractometer (°Brix, as read)': brix, 'Sample temperature (°C)': '20', 'pH': '3.1', 'Fill temperature (°C)': '88',
    'Mean net fill (g)': '345', 'Lightest jar (g)': '341', 'Set test score (1–5)': '4', 'Jars filled': '55', 'Jars rejected': '0',
  };
  for (const [label, value] of Object.entries(readings)) {
    const field = page.getByLabel(label, { exact: true });
    if (await field.count()) await field.fill(value);
  }
  await page.getByRole('button', { name: 'Record the batch' }).click();
  if (fail) {
    await page.getByText('A failed batch needs a disposition with a comment.').waitFor();
    await page.getByLabel('Disposition').selectOption('hold');
    await page.getByLabel('What was done').fill('Held: the Brix is far below the label, re-boil and re-test.');
    await page.getByRole('button', { name: 'Record the batch' }).click();
  }
  await page.waitForURL(/#batches$/);
  await page.getByTestId('batch-table').getByRole('link', { name: lot }).click();
  await page.getByRole('heading', { level: 1, name: `Batch ${lot}` }).waitFor();
  return lot;
}

/** "Measured 65 °Brix is 0.4 below the stated 65.4 g per 100 g: within the ± 3 tolerance." → its parts. */
function sugarLine(text: string) {
  const m = text.match(/Measured ([\d.]+) °Brix (?:equals|is ([\d.]+) (above|below)) the stated ([\d.]+) g per 100 g(?:: (within|outside) the ± 3 tolerance)?\./);
  expect(m, text).not.toBeNull();
  const [, measured, difference, direction, stated, verdict] = m!;
  return { measured: Number(measured), difference: difference ? Number(difference) * (direction === 'below' ? -1 : 1) : 0, stated: Number(stated), verdict: verdict ?? 'within' };
}

describe.each(WINDOWS)('a version of our own (%s)', (size, viewport) => {
  const stamp = `${size} ${Date.now()}`;
  const code = productCode();
  const packName = `E2E 227 g jar ${stamp}`;
  let reviewUrl = '';
  let versionUrl = '';

  it('is promoted by the developer and approved by the head of product', { timeout: 180_000 }, async () => {
    const dev = await startWalk(browser(), `version-cost-developer-${size}`, viewport);
    await signIn(dev.page, person('developer').email);
    await startOwnTrial(dev.page, { title: `E2E version cost ${stamp}`, question: 'Does the base formula go to production as it stands?', formula: 'Hedgerow strawberry jam' });
    await dev.page.goto(`${dev.page.url().replace(/\/$/, '')}/promote`);
    await dev.page.getByRole('heading', { level: 1, name: /Promote from T-\d{3}/ }).waitFor();
    const variant = dev.page.getByLabel('Variant', { exact: true });
    const options = await variant.locator('option').allTextContents();
    await variant.selectOption({ label: options.find((o) => o.startsWith('A — '))! });
    await dev.page.getByLabel('A new product').check();
    await dev.page.getByLabel('Product name').fill(`E2E strawberry ${stamp}`);
    await dev.page.getByLabel('Product code').fill(code);
    await dev.page.getByLabel('Why this variant').fill('The base formula, promoted by the browser test as a product of its own.');
    await dev.stop('request');
    await dev.page.getByRole('button', { name: 'Request promotion' }).click();
    await dev.page.waitForURL(/\/production\/reviews\/[0-9a-f-]{36}$/);
    reviewUrl = dev.page.url();
    await dev.close();

    const head = await startWalk(browser(), `version-cost-head-${size}`, viewport);
    await signIn(head.page, person('head_of_product').email);
    await head.page.goto(reviewUrl);
    await head.page.getByRole('button', { name: 'Approve for production' }).click();
    await head.page.getByRole('dialog').getByRole('button', { name: 'Approve' }).click();
    await head.page.waitForURL(/\/production\/versions\/[0-9a-f-]{36}$/);
    versionUrl = head.page.url();
    await head.page.getByRole('heading', { level: 1, name: new RegExp(`v1$`) }).waitFor();
    await head.stop('approved');
    await head.close();
  });

  it('costs its jar in the pack format picked on the version page', { timeout: 120_000 }, async () => {
    expect(versionUrl).not.toBe('');
    const lead = await startWalk(browser(), `version-cost-pack-${size}`, viewport);
    const { page } = lead;
    await signIn(page, person('production').email);
    // A pack format of our own: a smaller jar with a lid only.
    await page.goto('/prices/packaging');
    const add = page.getByRole('form', { name: 'Add a pack format' });
    await add.getByLabel('Name').fill(packName);
    await add.getByLabel('Net fill per jar (g)').fill('227');
    await add.getByRole('button', { name: 'Add packaging line' }).click();
    await add.getByLabel('Packaging item').selectOption({ label: 'Twist-off lid 63 mm, gold' });
    await add.getByRole('button', { name: 'Add pack format' }).click();
    await page.getByText('Pack format saved.').waitFor();

    await page.goto(versionUrl);
    const picker = page.getByLabel('Pack format', { exact: true });
    const before = await picker.inputValue();
    expect(before, 'the version takes the pack format of its trial’s base formula').not.toBe('');
    await page.getByRole('link', { name: 'All versions and trends' }).click();
    const costBefore = await costToday(page);
    expect(costBefore).toMatch(/\d/);
    await lead.stop('cost-before');

    await page.goto(versionUrl);
    await picker.selectOption({ label: packName });
    // Saved on change; the page refreshes with the new choice.
    await expect.poll(async () => { await page.reload(); return page.getByLabel('Pack format', { exact: true }).inputValue(); }, { timeout: 15_000 }).not.toBe(before);
    await lead.stop('picked');
    await page.getByRole('link', { name: 'All versions and trends' }).click();
    const costAfter = await costToday(page);
    expect(costAfter).not.toBe(costBefore);
    // Less jam (227 g instead of 340 g) and a lid alone instead of jar, lid, label and case share.
    expect(amountOf(costAfter)).toBeLessThan(amountOf(costBefore));
    await lead.stop('cost-after');
    await lead.close();
  });

  it('sets each batch’s Brix against the total sugar on the label', { timeout: 120_000 }, async () => {
    expect(versionUrl).not.toBe('');
    const lead = await startWalk(browser(), `version-cost-sugar-${size}`, viewport);
    const { page } = lead;
    await signIn(page, person('production').email);
    await page.goto(versionUrl);
    const target = Number((await page.getByText(/Target [\d.]+ % solids/).textContent())!.match(/Target ([\d.]+) % solids/)![1]);

    await recordBatch(lead, versionUrl, String(target), false);
    const within = page.getByTestId('label-sugar-check');
    const first = sugarLine((await within.textContent())!);
    expect(first.measured).toBe(target);
    expect(first.difference).toBeCloseTo(first.measured - first.stated, 5);
    expect(first.verdict).toBe(Math.abs(first.difference) <= 3 ? 'within' : 'outside');
    await lead.stop('within');

    // Five degrees under what the label states: outside the tolerance, and the line says so in warning colour.
    const low = Math.round((first.stated - 5) * 10) / 10;
    await recordBatch(lead, versionUrl, String(low), true);
    const second = sugarLine((await page.getByTestId('label-sugar-check').textContent())!);
    expect(second.measured).toBe(low);
    expect(second.stated).toBe(first.stated);
    expect(second.verdict).toBe('outside');
    expect(await page.getByTestId('label-sugar-check').getAttribute('class')).toMatch(/text-ember-700/);
    await lead.stop('outside');
    await lead.close();
  });
});
