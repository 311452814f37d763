/**
 * A product developer enters an ingredient's label data (nutrients per 100 g, allergens, additive)
 * on a desktop and on a phone: no console errors, no CSP violations, no sideways scroll.
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, newContext, signIn, watchPage, checkpoint, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

describe('ingredient label data', () => {
  it.each(WINDOWS)('is entered and shown as complete or unknown (%s)', async (window, viewport) => {
    const ctx = await newContext(browser(), viewport);
    const page = await ctx.newPage();
    const watch = await watchPage(page);
    await signIn(page, developer.email);

    // The library says which entries lack values: SR28 gives no sugars for quinces.
    await page.goto('/ingredients?q=quince');
    const quinceRow = page.getByTestId('ingredient-table').getByRole('row', { name: /Quince/ });
    await expect(quinceRow.getByText('Unknown: sugars (g)').count()).resolves.toBe(1);
    await checkpoint(page, watch, `ingredients-label-${window}-list`);

    await page.goto('/ingredients/new');
    const name = `E2E almond paste ${window} ${Date.now()}`;
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByLabel('Kind').selectOption('other');
    await page.getByLabel('Soluble solids (°Brix / %)').fill('60');
    await page.getByLabel('Name in the ingredient list').fill('almond paste');
    await page.getByLabel('Sugars (g)').fill('48');
    await page.getByLabel('Carbohydrate (g)').fill('50');
    await page.getByLabel('Fat (g)').fill('24,5');
    await page.getByLabel('Nuts (almond, hazelnut, walnut and other tree nuts)').check();
    await page.getByLabel('Tree nuts', { exact: true }).check();
    await page.getByLabel('E-number, if an additive').fill('E44');
    await page.getByLabel('Additive class').selectOption('thickener');
    await checkpoint(page, watch, `ingredients-label-${window}-form`);

    // A bad E-number is refused by the field, and nothing is saved.
    await page.getByRole('button', { name: 'Add ingredient' }).click();
    await page.getByText('Write the E-number like E440, E160a or E472(ii).').waitFor();
    await page.getByLabel('E-number, if an additive').fill('');
    await page.getByLabel('Additive class').selectOption('');
    // Keyboard: the checkbox toggles with the space bar.
    await page.getByLabel('Sesame seeds', { exact: true }).focus();
    await page.keyboard.press('Space');
    await page.getByRole('button', { name: 'Add ingredient' }).click();
    // The list confirms the save in a live region, so a screen reader announces it, and then drops
    // ?saved= from the address (a reload does not announce it again).
    const savedNotice = page.getByRole('status').filter({ hasText: `Saved ${name}.` });
    await savedNotice.waitFor();
    await expect(savedNotice.getAttribute('aria-live')).resolves.toBe('polite');
    await page.waitForURL((url) => url.pathname === '/ingredients' && !url.searchParams.has('saved'));
    await checkpoint(page, watch, `ingredients-label-${window}-saved-notice`);

    await page.goto(`/ingredients?q=${encodeURIComponent(name)}`);
    await page.getByRole('link', { name }).click();
    await page.waitForURL(/\/ingredients\/[0-9a-f-]{36}$/);
    await expect(page.getByLabel('Fat (g)').inputValue()).resolves.toBe('24.5');
    await expect(page.getByLabel('Water (g)').inputValue()).resolves.toBe('');
    await expect(page.getByLabel('Water (g)').getAttribute('placeholder')).resolves.toBe('unknown');
    await expect(page.getByLabel('Sesame seeds', { exact: true }).isChecked()).resolves.toBe(true);
    await expect(page.getByLabel('Tree nuts', { exact: true }).isChecked()).resolves.toBe(true);
    await page.getByText(/Now: Unknown: water \(g\)/).waitFor();
    await checkpoint(page, watch, `ingredients-label-${window}-saved`);
    await ctx.close();
  });
});
