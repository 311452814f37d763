/**
 * The two CSV imports a developer runs from the screen, on a desktop and a phone: the ingredient
 * library's and a trial's cooks. Each is all or nothing: a file with bad cells lists every one of them
 * by row and column and stores nothing; then a good file lands whole. The test makes its own
 * ingredients and its own trial (names carry the window and the time), so no demo record changes.
 * Every stop fails on console errors, CSP violations and sideways scroll.
 */
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, signIn, startOwnTrial, startWalk, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

/** Picks a file made here (never one from disk) in the panel's file input and presses Import. */
async function importFile(page: Page, panelTitle: string, name: string, text: string): Promise<void> {
  const panel = page.locator('section', { has: page.getByRole('heading', { level: 2, name: panelTitle }) });
  await panel.locator('input[type="file"]').setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(text, 'utf8') });
  await panel.getByRole('button', { name: 'Import' }).click();
}

/** The "row N, column" entries the panel lists under a refused file. */
async function listedProblems(page: Page): Promise<string[]> {
  const list = page.getByTestId('csv-errors');
  await list.waitFor();
  return (await list.locator('li strong').allTextContents()).map((t) => t.replace(/:$/, ''));
}

describe.each(WINDOWS)('CSV imports from the screen (%s)', (size, viewport) => {
  it('the ingredient library: a bad file names every bad cell and adds nothing; a good file adds its rows', async () => {
    const walk = await startWalk(browser(), `csv-ingredients-${size}`, viewport);
    const { page } = walk;
    await signIn(page, developer.email);
    const stamp = `${size} ${Date.now()}`;
    const plum = `E2E csv plum ${stamp}`;
    const quince = `E2E csv quince ${stamp}`;
    await page.goto('/ingredients');
    await page.getByRole('heading', { level: 2, name: 'Ingredients from a spreadsheet' }).waitFor();
    await walk.stop('library');

    const bad = [
      'name,kind,soluble_solids_pct,fat_g,eu_allergens,label_name',
      `${plum},fruit,14,0.3,,plums`, // good
      `${quince},fruit,14,lots,,`, // not a number
      `${quince} 2,fruit,14,0.2,__proto__,`, // not an allergen
      `${quince} 3,berry,14,0.2,,`, // no such kind
    ].join('\n');
    await importFile(page, 'Ingredients from a spreadsheet', 'bad-ingredients.csv', bad);
    await page.getByText('Nothing was imported: 3 problems in the file.').waitFor();
    expect((await listedProblems(page)).sort()).toEqual(['row 3, fat_g', 'row 4, eu_allergens', 'row 5, kind'].sort());
    await walk.stop('refused');
    // All or nothing: even the good row did not land.
    await page.goto(`/ingredients?q=${encodeURIComponent(`E2E csv plum ${stamp}`)}`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(await page.getByRole('link', { name: plum }).count()).toBe(0);

    const good = ['name,kind,soluble_solids_pct,fat_g,label_name', `${plum},fruit,14,0.3,plums`, `${quince},fruit,13.5,0.1,quinces`].join('\n');
    await page.goto('/ingredients');
    await importFile(page, 'Ingredients from a spreadsheet', 'good-ingredients.csv', good);
    await page.getByText('Imported: 2 added, 0 changed, 0 unchanged.').waitFor();
    await walk.stop('imported');
    await page.goto(`/ingredients?q=${encodeURIComponent(`E2E csv quince ${stamp}`)}`);
    await page.getByRole('link', { name: quince, exact: true }).waitFor();
    await walk.stop('found');
    await walk.close();
  });

  it('the cooks of a trial: a bad file names every bad cell and records nothing; a good file records its cooks', async () => {
    const walk = await startWalk(browser(), `csv-cooks-${size}`, viewport);
    const { page } = walk;
    await signIn(page, developer.email);
    // A trial of its own, so the demo's trials keep their cooks.
    await startOwnTrial(page, { title: `E2E cooks import ${size} ${Date.now()}`, question: 'Do the cooks from the kitchen spreadsheet land as they were written?', formula: 'Hedgerow strawberry jam' });
    await page.getByRole('heading', { level: 2, name: 'Cooks from a spreadsheet' }).waitFor();
    await walk.stop('trial');

    const header = 'variant,cook_date,batch_size_g,brix_reading,brix_sample_temp_c,ph,yield_jars';
    const bad = [
      header,
      'A,2026-11-20,2000,64.8,20,3.15,5', // good
      'Z,2026-11-21,2000,65,20,3.1,5', // no variant Z in this trial
      'A,2026-02-30,2000,65,20,3.1,5', // no 30 February
      'A,2026-11-22,2000,sixty,20,3.1,5', // not a number
    ].join('\n');
    await importFile(page, 'Cooks from a spreadsheet', 'bad-cooks.csv', bad);
    await page.getByText('Nothing was imported: 3 problems in the file.').waitFor();
    expect((await listedProblems(page)).sort()).toEqual(['row 3, variant', 'row 4, cook_date', 'row 5, brix_reading'].sort());
    await walk.stop('refused');
    const row = page.getByTestId('variants-table').locator('tbody tr').first();
    expect(await row.textContent()).not.toContain('64.8');

    await importFile(page, 'Cooks from a spreadsheet', 'good-cooks.csv', [header, 'A,2026-11-20,2000,64.8,20,3.15,5'].join('\n'));
    await page.getByText('Imported 1 cook.').waitFor();
    // The page refreshes: the base variant's last cook now shows the reading.
    await expect.poll(async () => row.textContent(), { timeout: 15_000 }).toContain('64.8');
    await walk.stop('imported');
    await walk.close();
  });
});
