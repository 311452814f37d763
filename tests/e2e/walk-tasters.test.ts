/**
 * The tasters' part of the job, on a desktop and on a phone: a staff taster (Sol) seated by the
 * organiser gets the e-mail, signs in, looks at My tastings, opens the seat from the link and
 * answers every sample; a guest joins the same kind of tasting with the code. Each walk gets a
 * tasting of its own, made through the API and the organiser's page, so the seeded ones stay as
 * they are. Every stop fails on a console error, a CSP violation, an uncaught exception or a page
 * wider than the window (tests/e2e/browser.ts).
 */
import { describe, it } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, signIn, startWalk, mailTo, openApricotTasting, WINDOWS, type Walk } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;
const taster = DEMO_USERS.find((u) => u.role === 'taster')!;

/** A rated tasting of two apricot variants on overall liking, opened; Sol seated when asked. */
const openTasting = (title: string, seatSol: boolean) =>
  openApricotTasting(browser(), { organiserEmail: developer.email, title, attribute: 'Overall liking', seat: seatSol ? taster.name : undefined });

/** From the notice to "Thank you!": like each sample moderately, review, submit. */
async function answerEverything(walk: Walk, page: Page) {
  await page.getByRole('button', { name: 'I agree, start' }).click();
  await page.getByText('Sample 1 of 2').waitFor();
  await page.getByRole('radio', { name: 'Like moderately', exact: true }).check();
  await walk.stop('sample-1');
  await page.getByRole('button', { name: 'Next', exact: true }).click();
  await page.getByRole('button', { name: 'Next sample' }).click();
  await page.getByText('Sample 2 of 2').waitFor();
  await page.getByRole('radio', { name: 'Like slightly', exact: true }).check();
  await page.getByRole('button', { name: 'Review my answers' }).click();
  await walk.stop('review');
  await page.getByRole('button', { name: 'Submit my answers' }).click();
  await page.getByRole('heading', { name: 'Thank you!' }).waitFor();
  await walk.stop('thank-you');
}

describe.each(WINDOWS)('tasters walk the loop (%s)', (size, viewport) => {
  it('a staff taster opens the seat from the e-mail and answers', async () => {
    const title = `Walk tasting for Sol, ${size} ${Date.now()}`;
    await openTasting(title, true);
    const mail = await mailTo(taster.email, 10_000, new RegExp(`^Tasting: ${title}$`));
    const seatPath = new URL(mail.text.match(/https?:\/\/\S+\/t\/\S+/)![0]).pathname;

    const walk = await startWalk(browser(), `taster-${size}`, viewport);
    const { page } = walk;
    await signIn(page, taster.email);
    await walk.stop('home');
    await walk.nav('My tastings');
    await page.getByRole('heading', { level: 1, name: 'My tastings' }).waitFor();
    await walk.stop('my-tastings');
    await page.goto(seatPath);
    await answerEverything(walk, page);
    await walk.close();
  });

  it('a guest joins with the code and answers', async () => {
    const { joinCode } = await openTasting(`Walk tasting for a guest, ${size} ${Date.now()}`, false);
    const walk = await startWalk(browser(), `guest-${size}`, viewport);
    const { page } = walk;
    await page.goto('/join');
    await page.getByLabel('Tasting code').fill(joinCode);
    await page.getByLabel('Your name').fill(`Walk guest ${size}`);
    await walk.stop('join');
    await page.getByRole('button', { name: 'Join the tasting' }).click();
    await page.waitForURL(/\/t\/sws_/);
    await answerEverything(walk, page);
    await walk.close();
  });
});
