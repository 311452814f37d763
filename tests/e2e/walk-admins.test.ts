/**
 * The administrators' part of the job, on a desktop and on a phone: Ines (Hollowmere Preserves)
 * goes through members, sends an invitation and visits every settings page; Wren (Brackenfold
 * Kitchen, the second workspace) does the same in hers and sees none of Hollowmere's records.
 * Every stop fails on a console error, a CSP violation, an uncaught exception or a page wider
 * than the window (tests/e2e/browser.ts).
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, signIn, startWalk, WINDOWS } from './browser';
import { DEMO_USERS, OTHER_ADMIN } from '@/lib/seed/demo';

const browser = sharedBrowser();
const admin = DEMO_USERS.find((u) => u.role === 'admin')!;

const SETTINGS = ['Tasting attributes', 'Costs and currency', 'API tokens', 'Mail outbox', 'Profile & units'];

describe.each(WINDOWS)('administrators walk the loop (%s)', (size, viewport) => {
  it.each([
    ['ines', admin.email, 'hollowmere.example'],
    ['wren', OTHER_ADMIN.email, 'brackenfold.example'],
  ])('%s: members, an invitation, every settings page', async (who, email, domain) => {
    const walk = await startWalk(browser(), `admin-${who}-${size}`, viewport);
    const { page } = walk;
    await signIn(page, email);
    await walk.stop('home');

    await walk.nav('Members');
    await page.getByTestId('members-table').getByText(email).waitFor();
    const invitee = `walk.${who}.${size}.${Date.now()}@${domain}`;
    await page.getByLabel('E-mail to invite').fill(invitee);
    await page.getByLabel('Role', { exact: true }).selectOption('taster');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${invitee}.`).waitFor();
    await page.getByTestId('members-table').getByText(invitee).waitFor();
    await walk.stop('members');

    for (const label of SETTINGS) {
      await walk.nav(label);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await walk.stop(label.toLowerCase().replace(/[^a-z]+/g, '-'));
    }

    // Each workspace sees its own records only.
    await walk.nav('Formulas');
    await page.getByRole('heading', { level: 1 }).waitFor();
    const hollowmereFormula = page.getByText('Hedgerow strawberry jam');
    if (who === 'ines') await hollowmereFormula.first().waitFor();
    else expect(await hollowmereFormula.count()).toBe(0);
    await walk.stop('formulas');
    await walk.close();
  });
});
