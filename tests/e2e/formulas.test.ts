/**
 * A product developer builds a formula from scratch in the browser, watches the results
 * change, switches to imperial units, saves, revises and compares the two revisions.
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, newContext, signIn, screenshot, setFormulaLine } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();

const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

describe('the formula editor', () => {
  it('builds, saves, revises and compares a formula', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, developer.email);

    await page.goto('/formulas');
    await page.getByTestId('formula-list').getByText('Hedgerow strawberry jam').waitFor();
    await page.getByRole('link', { name: 'New formula' }).click();
    await page.waitForURL('**/formulas/new');

    const name = `E2E plum jam ${Date.now()}`;
    await page.getByLabel('Name').fill(name);
    await page.getByLabel('Target final soluble solids (%)').fill('65');
    await page.getByRole('button', { name: 'Add line' }).click();
    await setFormulaLine(page, 1, 'Plum', '1000');
    await page.getByRole('button', { name: 'Add line' }).click();
    await setFormulaLine(page, 2, 'Sucrose (white sugar)', '800');

    // Source: mass balance (Practical Action technical brief "Jams, jellies and marmalade"):
    // solids = 1000 g × 14.3 % (plum, starter library) + 800 g × 100 % = 943 g; at 65 % → 1450.8 g.
    const finished = page.getByTestId('result-finished-mass');
    await expect.poll(async () => (await finished.textContent())?.replace(/\s/g, '')).toMatch(/^1[,.]?45[01]/);

    // The share of sucrose inverted in the boil lowers the water-activity estimate, which says so.
    // Source: colligative principle (one sucrose gives two monosaccharides), tests/unit/chemistry/water-activity-sugars.test.ts.
    const aw = page.getByTestId('result-water-activity');
    const awBefore = Number((await aw.textContent())?.replace(',', '.').match(/0[.,]\d{3}/)?.[0]);
    await page.getByLabel('Sucrose inverted in the boil (%)').fill('30');
    await page.getByText(/30 % of the sucrose taken as inverted/).first().waitFor();
    await expect.poll(async () => Number((await aw.textContent())?.replace(',', '.').match(/0[.,]\d{3}/)?.[0])).toBeLessThan(awBefore);
    await page.getByLabel('Sucrose inverted in the boil (%)').fill('');
    await expect.poll(async () => Number((await aw.textContent())?.replace(',', '.').match(/0[.,]\d{3}/)?.[0])).toBe(awBefore);

    await page.getByRole('button', { name: 'Add line' }).click();
    await setFormulaLine(page, 3, 'Sucrose (white sugar)', '100');
    // 1043 g solids at 65 % → 1604.6 g: the panel follows the typing.
    await expect.poll(async () => (await finished.textContent())?.replace(/\s/g, '')).toMatch(/^1[,.]?60[45]/);
    await page.getByRole('button', { name: 'Remove line 3' }).click();

    await page.getByRole('group', { name: 'Mass units' }).getByRole('button', { name: 'Imperial' }).click();
    // 1450.8 g = 3.198 lb (1 lb = 453.59237 g, international yard and pound agreement 1959).
    await expect.poll(async () => await finished.textContent()).toMatch(/lb|oz/);
    await expect(page.getByLabel('Line 1: unit').inputValue()).resolves.toBe('oz');
    await screenshot(page, 'formula-editor-imperial');
    await page.getByRole('group', { name: 'Mass units' }).getByRole('button', { name: 'Metric' }).click();

    await page.getByRole('button', { name: 'Save formula' }).click();
    await page.waitForURL(/\/formulas\/[0-9a-f-]{36}$/);
    await page.getByText('Revision 1, saved by').waitFor();

    await page.getByLabel('Line 2: quantity').fill('700');
    await page.getByLabel('What changed (short note)').fill('Less sugar');
    await page.getByRole('button', { name: 'Save new revision' }).click();
    await page.getByText('Revision 2, saved by').waitFor();

    await page.getByRole('link', { name: 'History' }).click();
    await page.getByTestId('revision-list').getByText('Less sugar').waitFor();
    const diff = page.getByText('Revision 1 → revision 2');
    await diff.waitFor();
    await expect(page.getByText(/800/).first().isVisible()).resolves.toBe(true);
    await expect(page.getByText(/700/).first().isVisible()).resolves.toBe(true);
    await screenshot(page, 'formula-history');

    await page.getByRole('link', { name: 'Print view' }).click();
    await page.getByRole('button', { name: 'Print' }).waitFor();
    await ctx.close();
  });

  it('shows the seeded failing formula and the safety cautions of the reduced-sugar spread', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, developer.email);
    await page.goto('/formulas');
    const list = page.getByTestId('formula-list');
    await list.getByRole('link', { name: /Raspberry jam, economy trial/ }).getByText('Fails a rule').waitFor();
    await list.getByRole('link', { name: /Apricot spread, reduced sugar/ }).click();
    await page.getByText(/Reduced sugar with no preservation stated/).first().waitFor();
    await page.getByText('Local food-safety codes and licensed practice govern.').first().waitFor();
    await screenshot(page, 'formula-cautions');
    await ctx.close();
  });

  it('the ingredient library can be searched and exported', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, developer.email);
    await page.goto('/ingredients?q=pectin');
    await page.getByText('HM rapid-set pectin, grade 150').waitFor();
    expect(await page.getByText('Strawberry').count()).toBe(0);
    const res = await page.request.get('/api/v1/ingredients/export');
    expect(res.headers()['content-type']).toContain('text/csv');
    expect((await res.text()).split('\n').length).toBeGreaterThan(20);
    await ctx.close();
  });
});
