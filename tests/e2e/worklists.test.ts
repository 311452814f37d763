/**
 * Every role's home page is a worklist whose items lead to the work, at desktop and phone widths;
 * a staff taster gets back to the seat from My tastings; a cook without readings is refused, and a
 * cook is corrected and withdrawn with a reason. Screenshots land in test-results/.
 */
import { describe, it, expect, onTestFailed } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, newContext, signIn, screenshot } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const VIEWPORTS = { desktop: { width: 1366, height: 900 }, phone: { width: 390, height: 844 } };
const user = (role: string) => DEMO_USERS.find((u) => u.role === role)!;

/** What each role's home page must show, with the worklist part that has work in the demo. */
const HOMES: Array<{ role: string; parts: string[]; item: RegExp }> = [
  { role: 'developer', parts: ['At the stove', 'Tastings being set up or taking answers', 'Tastings waiting for your answers'], item: /T-\d{3}: Strawberry jam: less acid/ },
  { role: 'head_of_product', parts: ['Promotions waiting for your decision'], item: /PR-\d+|P-\d+|variant E/ },
  { role: 'production', parts: ['Batches on hold', 'Today’s batches'], item: /BCJ/ },
  { role: 'taster', parts: ['Tastings waiting for your answers'], item: /Second look: two spreads/ },
  { role: 'admin', parts: ['Invitations not yet accepted'], item: /pip\.taster@hollowmere\.example/ },
];

async function watch(page: Page): Promise<string[]> {
  const problems: string[] = [];
  page.on('console', (m) => { if (m.type() === 'error') problems.push(m.text()); });
  page.on('pageerror', (e) => problems.push(e.message));
  return problems;
}

async function noSidewaysScroll(page: Page) {
  const over = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(over, 'the page scrolls sideways').toBeLessThanOrEqual(0);
}

describe.each(Object.entries(VIEWPORTS))('home worklists at %s width', (size, viewport) => {
  it.each(HOMES)('$role', async ({ role, parts, item }) => {
    const ctx = await newContext(browser(), viewport);
    const page = await ctx.newPage();
    const problems = await watch(page);
    await signIn(page, user(role).email);
    for (const part of parts) await page.getByRole('region', { name: part }).waitFor();
    const link = page.getByRole('link', { name: item }).first();
    await link.waitFor();
    await noSidewaysScroll(page);
    await screenshot(page, `home-${role}-${size}`);
    await link.click();
    await page.waitForLoadState('networkidle');
    expect(await page.locator('h1').count()).toBeGreaterThan(0);
    expect(problems).toEqual([]);
    await ctx.close();
  });
});

describe('tastings', () => {
  it('the developer sees the workspace list and filters it in the URL', async () => {
    const ctx = await newContext(browser(), VIEWPORTS.phone);
    const page = await ctx.newPage();
    const problems = await watch(page);
    await signIn(page, user('developer').email);
    await page.goto('/tastings');
    await page.getByTestId('tasting-list').waitFor();
    await page.getByLabel('State').selectOption({ label: 'Taking answers' });
    await page.getByRole('button', { name: 'Show' }).click();
    await page.waitForURL(/state=open/);
    await expect(page.getByTestId('tasting-list').getByRole('link', { name: 'Second look: two spreads' }).count()).resolves.toBe(1);
    await noSidewaysScroll(page);
    await screenshot(page, 'tastings-list-phone');
    expect(problems).toEqual([]);
    await ctx.close();
  });

  it('a staff taster who lost the e-mail gets back to the seat from My tastings', async () => {
    const ctx = await newContext(browser(), VIEWPORTS.phone);
    const page = await ctx.newPage();
    const problems = await watch(page);
    await signIn(page, user('taster').email);
    await page.goto('/tastings/mine');
    await page.getByTestId('my-seats').getByText('Second look: two spreads').waitFor();
    await noSidewaysScroll(page);
    await screenshot(page, 'my-tastings-phone');
    await page.getByRole('button', { name: 'Open my seat' }).click();
    await page.waitForURL(/\/t\/sws_/);
    await page.getByText('Second look: two spreads').first().waitFor();
    await screenshot(page, 'my-seat-phone');
    expect(problems).toEqual([]);
    await ctx.close();
  });
});

describe('cooks', () => {
  it('refuses a cook without readings, then corrects and withdraws one with a reason', async () => {
    const ctx = await newContext(browser(), VIEWPORTS.desktop);
    const page = await ctx.newPage();
    const problems = await watch(page);
    onTestFailed(async () => {
      await screenshot(page, 'cooks-failure');
    });
    await signIn(page, user('developer').email);
    await page.goto('/trials');
    await page.getByRole('link', { name: /Strawberry jam: less acid/ }).first().click();
    await page.getByRole('link', { name: 'B', exact: true }).first().click();
    await page.getByRole('form', { name: 'Record a cook' }).waitFor();
    const form = page.getByRole('form', { name: 'Record a cook' });
    await form.getByLabel(/Batch size/).fill('3000');
    await form.getByRole('button', { name: 'Save the cook' }).click();
    await form.getByText(/Record at least one reading/).waitFor();
    const cooks = page.getByTestId('cook-list');
    // Cooks are in date order; nested history items are not cooks.
    const before = await cooks.locator(':scope > li').count();
    await form.getByRole('textbox', { name: 'pH', exact: true }).fill('3.9');
    await form.getByRole('button', { name: 'Save the cook' }).click();
    await form.getByText('Cook recorded.').waitFor();
    await cooks.locator(':scope > li').nth(before).waitFor();
    const newest = () => cooks.locator(':scope > li').last();
    await newest().getByRole('button', { name: 'Correct' }).click();
    const fix = page.getByRole('form', { name: 'Correct this cook' });
    await fix.getByRole('textbox', { name: 'pH', exact: true }).fill('3.09');
    await fix.getByLabel('Why is it corrected?').fill('Meter not calibrated; re-read.');
    await fix.getByRole('button', { name: 'Save the correction' }).click();
    await newest().getByText(/Corrected once/).waitFor();
    await screenshot(page, 'cook-corrected-desktop');

    await newest().getByRole('button', { name: 'Withdraw' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Why is it withdrawn?').fill('Sample taken from the wrong pan.');
    await dialog.getByRole('button', { name: 'Withdraw the cook' }).click();
    await page.getByTestId('withdrawn-cook-list').getByText(/Sample taken from the wrong pan/).waitFor();
    await screenshot(page, 'cook-withdrawn-desktop');
    expect(problems).toEqual([]);
    await ctx.close();
  });
});
