/**
 * Accounts in the browser: the mail outbox shows an administrator only their workspace's mail with
 * links hidden (never a reset mail), and "sign out everywhere" asks first, then ends the other
 * device's session too. Mail is read from the fake directly (mailTo), never through the page.
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, newContext, signIn, mailTo, screenshot } from './browser';
import { DEMO_USERS, OTHER_ADMIN } from '@/lib/seed/demo';

const browser = sharedBrowser();
const admin = DEMO_USERS.find((u) => u.role === 'admin')!;
const taster = DEMO_USERS.find((u) => u.role === 'taster')!;

describe('cross-workspace mail in the outbox', () => {
  it("an admin sees their own workspace's mail, links hidden, and no one's reset mail", async () => {
    // A reset for a Hollowmere member, and an invitation from Brackenfold.
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await page.goto('/forgot-password');
    await page.getByLabel('E-mail').fill(DEMO_USERS[2].email);
    await page.getByRole('button', { name: 'Send me a reset link' }).click();
    await page.getByText('Check your inbox').waitFor();
    const reset = await mailTo(DEMO_USERS[2].email, 10_000, /Reset your Setwell password/);
    const resetToken = /reset-password\/([A-Za-z0-9_-]+)/.exec(reset.text)![1];

    await signIn(page, OTHER_ADMIN.email);
    await page.goto('/settings/members');
    const invitee = `e2e.outbox.${Date.now()}@brackenfold.example`;
    await page.getByLabel('E-mail to invite').fill(invitee);
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${invitee}.`).waitFor();
    const inviteToken = /accept-invite\/([A-Za-z0-9_-]+)/.exec((await mailTo(invitee)).text)![1];

    await page.goto('/settings/outbox');
    await page.getByRole('heading', { name: 'Mail outbox' }).waitFor();
    const brackenfold = await page.locator('main').innerText();
    expect(brackenfold).toContain(invitee);
    expect(brackenfold).toContain('link hidden');
    expect(brackenfold).not.toContain(inviteToken);
    expect(brackenfold).not.toContain(resetToken);
    expect(brackenfold).not.toContain('hollowmere.example');
    await screenshot(page, 'outbox-other-admin');
    await ctx.close();

    const own = await newContext(browser());
    const ownPage = await own.newPage();
    await signIn(ownPage, admin.email);
    await ownPage.goto('/settings/outbox');
    await ownPage.getByRole('heading', { name: 'Mail outbox' }).waitFor();
    const hollowmere = await ownPage.locator('main').innerText();
    expect(hollowmere).not.toContain(invitee);
    expect(hollowmere).not.toContain(resetToken);
    expect(hollowmere).not.toContain('Reset your Setwell password');
    await own.close();
  });
});

describe('sign out everywhere', () => {
  it('asks first, then ends this session and the one on another device', async () => {
    const phone = await newContext(browser(), { width: 390, height: 844 });
    const phonePage = await phone.newPage();
    await signIn(phonePage, taster.email);
    const laptop = await newContext(browser());
    const page = await laptop.newPage();
    await signIn(page, taster.email);

    await page.goto('/settings/profile');
    await page.getByRole('button', { name: 'Sign out everywhere' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('heading', { name: 'Sign out everywhere?' }).waitFor();
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await page.goto('/settings/profile');
    expect(new URL(page.url()).pathname).toBe('/settings/profile');

    await page.getByRole('button', { name: 'Sign out everywhere' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Sign out everywhere' }).click();
    await page.waitForURL('**/sign-in?ended=1');
    await page.getByText('You were signed out on every device.').waitFor();

    await phonePage.goto('/home');
    expect(new URL(phonePage.url()).pathname).toBe('/sign-in');
    // A fresh sign-in works again.
    await signIn(phonePage, taster.email);
    await phone.close();
    await laptop.close();
  });
});
