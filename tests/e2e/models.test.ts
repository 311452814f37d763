/**
 * The model page of the demo's apricot spread family, walked by the product developer and the head
 * of product on a desktop (1366 px) and a phone (390 px): the families list, the data set table in
 * its own scroll box, the model with its diagnostics, residual charts and the contour plot, another
 * response and contour axes chosen through the form, the history, and both CSV exports. Every stop
 * fails on a console error, a CSP violation, an uncaught exception or sideways scroll
 * (tests/e2e/browser.ts). It only reads, so it changes nothing other tests rely on.
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, signIn, startWalk, WINDOWS } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const people = DEMO_USERS.filter((u) => u.role === 'developer' || u.role === 'head_of_product');

describe.each(people.flatMap((person) => WINDOWS.map(([size, viewport]) => ({ person, size, viewport }))))('$person.role reads the apricot spread model ($size)', ({ person, size, viewport }) => {
  it('families, data set, model, contour, history, exports', async () => {
    const walk = await startWalk(browser(), `models-${person.role}-${size}`, viewport);
    const { page } = walk;
    await signIn(page, person.email);
    await walk.nav('Models');
    const families = page.getByTestId('model-families');
    await families.waitFor();
    await walk.stop('families');

    await families.getByRole('link', { name: 'Apricot reduced-sugar spread' }).click();
    await page.waitForURL(/\/models\/reduced_sugar_spread\.[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: /^Data set: 35 variants$/ }).waitFor();
    await page.getByRole('heading', { name: 'Overall liking: full quadratic' }).waitFor();
    for (const id of ['model-dataset', 'model-coefficients', 'model-anova', 'model-history']) await page.getByTestId(id).waitFor();
    await page.getByTestId('residuals-fitted').locator('canvas').waitFor();
    await page.getByTestId('contour-plot').getByRole('img', { name: /^Predicted / }).waitFor();
    expect(await page.getByTestId('model-history').locator('tbody tr').count()).toBe(4);
    await walk.stop('model');

    // Another response and other contour axes, through the form.
    const form = page.getByRole('form', { name: 'Choose the data and the model' });
    await form.getByLabel('Response').selectOption({ label: 'Set firmness' });
    await form.getByLabel('Contour across').selectOption({ label: 'Pectin' });
    await form.getByLabel('Contour up').selectOption({ label: 'Target soluble solids' });
    await form.getByRole('button', { name: 'Fit' }).click();
    await page.getByRole('heading', { name: 'Set firmness: full quadratic' }).waitFor();
    expect(new URL(page.url()).searchParams.get('x')).toBe('pectinPct');
    await page.getByTestId('contour-plot').getByRole('img', { name: /^Predicted / }).waitFor();
    await walk.stop('firmness-contour');

    const dataset = await page.request.get(await page.getByRole('link', { name: 'Download the data set (CSV)' }).getAttribute('href') ?? '');
    expect(dataset.status()).toBe(200);
    expect((await dataset.text()).split('\n')[0]).toMatch(/^trial,trial_title,first_cook,variant,pectin,/);
    const coefficients = await page.request.get(await page.getByRole('link', { name: 'Download the coefficients (CSV)' }).getAttribute('href') ?? '');
    expect(coefficients.status()).toBe(200);
    expect(await coefficients.text()).toMatch(/^response,term,/);
    await walk.close();
  });
});
