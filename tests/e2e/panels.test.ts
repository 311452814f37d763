/**
 * A guest tastes on a phone-sized screen — join with the code, answer every sample, reload in
 * the middle, finish — while the organiser watches the progress and closes the session.
 */
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, newContext, signIn, screenshot } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();

const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

async function answerSample(phone: Page) {
  await phone.getByRole('radio', { name: 'Like moderately', exact: true }).check();
  await phone.getByRole('slider').click();
}

describe('a tasting on phones', () => {
  it('joins, answers, survives a reload, submits; the organiser sees it and closes', async () => {
    const desk = await newContext(browser());
    const organiser = await desk.newPage();
    await signIn(organiser, developer.email);
    await organiser.goto('/trials');
    await organiser.getByRole('link', { name: /Apricot spread: how low can the sugar go\?/ }).click();
    await organiser.getByTestId('panel-list').getByRole('link', { name: 'Second look: two spreads' }).click();
    const joinCode = (await organiser.getByTestId('join-code').textContent())!.trim();
    expect(joinCode).toMatch(/^[A-Z0-9]{6}$/);

    const phoneCtx = await newContext(browser(), { width: 360, height: 740 });
    const phone = await phoneCtx.newPage();
    await phone.goto('/join');
    await phone.getByLabel('Tasting code').fill(joinCode.toLowerCase());
    await phone.getByLabel('Your name').fill('Phone guest');
    await phone.getByRole('button', { name: 'Join the tasting' }).click();
    await phone.waitForURL(/\/t\/sws_/);
    await phone.getByRole('button', { name: 'I agree, start' }).click();

    await phone.getByText('Sample 1 of 2').waitFor();
    const firstCode = (await phone.getByRole('heading', { level: 1 }).textContent())!.replace(/\D/g, '');
    expect(firstCode).toMatch(/^\d{3}$/);
    await answerSample(phone);
    await screenshot(phone, 'phone-sample');
    await phone.getByRole('button', { name: 'Next', exact: true }).click();
    await phone.getByRole('button', { name: 'Next sample' }).click();
    await phone.getByText('Sample 2 of 2').waitFor();

    // The organiser sees the seat answering, polled from the API.
    await expect.poll(async () => organiser.getByTestId('seat-progress').textContent(), { timeout: 15_000 }).toMatch(/Phone guest.*2 of 4/);

    // A reload (or a dropped connection) resumes where the taster was.
    await phone.reload();
    await phone.getByText('Sample 2 of 2').waitFor();
    await answerSample(phone);
    await phone.getByRole('button', { name: 'Review my answers' }).click();
    await phone.getByRole('button', { name: 'Submit my answers' }).click();
    await phone.getByRole('heading', { name: 'Thank you!' }).waitFor();

    // Nothing on the phone names a variant or a recipe.
    const text = (await phone.content()) + JSON.stringify(await phone.evaluate(() => ({ ...localStorage })));
    for (const secret of ['Base:', 'Apricot spread, reduced sugar', 'sugar ratio', 'Variant A', 'Variant E']) expect(text).not.toContain(secret);

    await expect.poll(async () => organiser.getByTestId('seat-progress').textContent(), { timeout: 15_000 }).toMatch(/Phone guest.*4 of 4.*Submitted/);
    await organiser.getByRole('button', { name: 'Close the tasting' }).click();
    await organiser.getByRole('dialog').getByRole('button', { name: 'Close', exact: true }).click();
    await expect.poll(async () => organiser.getByTestId('panel-state').textContent(), { timeout: 10_000 }).toBe('Closed');
    await screenshot(organiser, 'panel-organiser');
    await phoneCtx.close();
    await desk.close();
  });
});

describe('the results of a closed tasting', () => {
  it('shows a verdict and a chart for the demo panel, and exports the raw answers', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, developer.email);
    await page.goto('/trials');
    await page.getByRole('link', { name: /Apricot spread: how low can the sugar go\?/ }).click();
    await page.getByTestId('panel-list').getByRole('link', { name: 'Spread tasting, 19 November' }).click();
    await page.getByRole('link', { name: 'Results' }).click();
    const verdicts = page.getByTestId('verdict');
    await verdicts.first().waitFor();
    expect(await verdicts.count()).toBe(3);
    await expect(verdicts.first().textContent()).resolves.toMatch(/p [=<] 0\.\d{3}/);
    // chart.js draws into a canvas: it rendered when the canvas has a size.
    const box = await page.getByTestId('means-chart').first().locator('canvas').boundingBox();
    expect(box!.width).toBeGreaterThan(100);
    await page.getByTestId('jar-chart').first().locator('canvas').waitFor();
    const csv = await page.request.get(page.url().replace(/\/panels\/([^/]+)\/results$/, '/api/v1/panels/$1/answers.csv'));
    const lines = (await csv.text()).trim().split(/\r?\n/);
    expect(lines[0]).toBe('session,seat,code,variant,attribute,value');
    expect(lines.length - 1).toBe(24 * 5 * 3);
    await screenshot(page, 'panel-results');

    // The comparison page gathers the evidence; the developer marks a recommendation.
    await page.goto('/trials');
    await page.getByRole('link', { name: /Apricot spread: how low can the sugar go\?/ }).click();
    await page.getByRole('link', { name: 'Compare variants' }).click();
    await page.getByTestId('comparison-verdicts').first().waitFor();
    await page.getByTestId('sensory-means').waitFor();
    await page.getByLabel('Variant', { exact: true }).selectOption({ label: 'E — sugar ratio high, pectin dose high' });
    await page.getByLabel('Why').fill('Firmest set and best liked; keeps the sugar ratio at 0.5, so no extra preservation step.');
    await page.getByRole('button', { name: 'Recommend' }).click();
    await page.getByText('Recommended: variant E').waitFor();
    await screenshot(page, 'trial-compare');
    await ctx.close();
  });
});
