/**
 * A product developer runs a trial without paper: starts it from a formula, lays out a
 * factorial, writes the notebook with a photo, records a cook and reads it beside the prediction.
 */
import { describe, it, expect, beforeAll, onTestFailed } from 'vitest';
import sharp from 'sharp';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { sharedBrowser, newContext, signIn, screenshot } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
let photoPath: string;
beforeAll(async () => {
  // An invented picture made here, not a photo from anywhere.
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="320" height="240"><rect width="320" height="240" fill="#f3ecdd"/><rect x="110" y="40" width="100" height="160" rx="14" fill="#9f6389"/><text x="160" y="225" font-size="18" text-anchor="middle">test jar</text></svg>`;
  photoPath = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'setwell-e2e-')), 'jar.png');
  fs.writeFileSync(photoPath, await sharp(Buffer.from(svg)).png().toBuffer());
});

const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

describe('a whole trial in the browser', () => {
  it('plans a factorial, writes the notebook with a photo, records a cook and compares it', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    onTestFailed(async () => {
      await screenshot(page, 'trials-failure');
    });
    await signIn(page, developer.email);

    await page.goto('/trials');
    await page.getByTestId('trial-list').getByText('Apricot spread: how low can the sugar go?').waitFor();
    await page.getByRole('link', { name: 'Start a trial' }).click();
    const title = `E2E sugar trial ${Date.now()}`;
    await page.getByLabel('Title').fill(title);
    await page.getByLabel('Question or hypothesis').fill('Does a lower sugar ratio still set?');
    await page.getByLabel('Base formula').selectOption({ label: 'Hedgerow strawberry jam' });
    await page.getByRole('button', { name: 'Start the trial' }).click();
    await page.getByRole('heading', { level: 1, name: new RegExp(title) }).waitFor();

    // Plan: 2^2 on sugar ratio and acid dose, with a centre point → five new variants.
    await page.getByLabel('Sugar ratio low level').fill('0.7');
    await page.getByLabel('Sugar ratio high level').fill('0.9');
    await page.getByRole('checkbox', { name: /Acid dose/ }).check();
    await page.getByLabel('Acid dose low level').fill('4');
    await page.getByLabel('Acid dose high level').fill('8');
    await page.getByRole('checkbox', { name: 'Add a centre point' }).check();
    await expect.poll(async () => page.getByTestId('plan-preview').locator('li').count()).toBe(5);
    await page.getByRole('button', { name: 'Add these variants' }).click();
    await page.getByText('Added variants B, C, D, E, F.').waitFor();
    const table = page.getByTestId('variants-table');
    await table.getByRole('link', { name: 'F', exact: true }).waitFor();
    expect(await table.locator('tbody tr').count()).toBe(6);

    // Notebook: text and an inline photo, autosaved.
    const notebook = page.getByRole('region', { name: 'Trial notebook' }).or(page.locator('section[aria-label="Trial notebook"]')).first();
    const editor = notebook.locator('.ProseMirror');
    await editor.click();
    await page.keyboard.type('Cooked all five in the small pan. ');
    await notebook.getByLabel('Choose a photo to insert').setInputFiles(photoPath);
    await editor.locator('img').waitFor({ state: 'attached' });
    await expect.poll(async () => (await editor.locator('img').getAttribute('src')) ?? '').toMatch(/^\/api\/v1\/uploads\/[0-9a-f-]{36}$/);
    await notebook.getByText(/Saved at/).waitFor({ timeout: 15_000 });
    await screenshot(page, 'trial-overview');

    // Record a cook of variant B and read it beside the prediction.
    await table.getByRole('link', { name: 'B', exact: true }).click();
    await page.getByRole('heading', { name: 'Variant B', exact: true }).waitFor();
    await page.getByLabel(/Batch size, total charge/).fill('2000');
    await page.getByLabel('Refractometer reading (°Brix, as read)').fill('64.6');
    await page.getByLabel(/Sample temperature/).fill('19');
    await page.getByRole('textbox', { name: 'pH', exact: true }).fill('3.15');
    await page.getByLabel(/End-point temperature/).fill('104.2');
    await page.getByRole('textbox', { name: 'Jars filled' }).fill('3');
    await page.getByRole('textbox', { name: /^Yield/ }).fill('1190');
    await page.getByRole('radio', { name: /4 · Clean set/ }).check();
    await page.getByRole('button', { name: 'Save the cook' }).click();
    const cook = page.getByTestId('cook-list').locator('li').first();
    await cook.waitFor();
    const massRow = cook.getByRole('row', { name: /Finished mass/ });
    const cells = await massRow.locator('td').allTextContents();
    expect(cells[0]).toMatch(/\d/); // predicted for the 2000 g charge
    expect(cells[1]).toMatch(/1[.,]19 kg|1190 g/);
    await cook.getByRole('row', { name: /Soluble solids/ }).waitFor();
    await screenshot(page, 'variant-cook');
    await ctx.close();
  });
});
