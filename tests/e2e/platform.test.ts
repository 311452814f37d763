/** Sign-in per role, the navigation's pending mark, the invitation round trip through the mail fake, wrong passwords and the rate limit. */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, newContext, signIn, mailTo, screenshot, PHONE } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';
import { navFor } from '@/lib/navigation';

const browser = sharedBrowser();
// The invitee accepts in the invitation test; the rate-limit test then locks this account out, since
// every demo account is walked by the walk-*.test.ts files, in whatever order the files run.
const invitee = `e2e.invitee.${Date.now()}@hollowmere.example`;
const INVITEE_PASSWORD = 'gooseberry-fool-9';

describe('each demo role signs in and sees its own navigation', () => {
  it.each(DEMO_USERS.map((u) => [u.role, u] as const))('%s', async (_role, user) => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, user.email);
    const nav = page.getByTestId('main-nav').first();
    const labels = (await nav.getByRole('link').allTextContents()).map((s) => s.trim());
    expect(labels).toEqual(navFor(user.role).map((n) => n.label));
    await expect(page.getByTestId('actor-name').first().textContent()).resolves.toBe(user.name);
    if (user.role === 'admin') await screenshot(page, 'home-admin');
    await ctx.close();
  });

  it('marks the navigation link that was clicked while its page is on its way', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, DEMO_USERS.find((u) => u.role === 'developer')!.email);
    // Hold the navigation's request for the trials page (not a prefetch) until the mark has been seen.
    let release = () => {};
    const held = new Promise<void>((resolve) => { release = resolve; });
    await page.route((url) => url.pathname === '/trials', async (route) => {
      const headers = route.request().headers();
      if (headers.rsc === '1' && !headers['next-router-prefetch']) await held;
      await route.continue();
    });
    const nav = page.getByTestId('main-nav').first();
    await nav.getByRole('link', { name: 'Trials' }).click();
    const mark = nav.getByTestId('nav-pending');
    await mark.waitFor();
    expect(await nav.getByRole('link', { name: 'Trials' }).getByRole('status').textContent()).toBe('Loading…');
    release();
    await page.waitForURL('**/trials');
    await mark.waitFor({ state: 'detached' });
    await ctx.close();
  });

  it('a taster who opens a staff page gets the 403 page', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, DEMO_USERS.find((u) => u.role === 'taster')!.email);
    const res = await page.goto('/settings/members');
    expect(res?.status()).toBe(403);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('not open to your role');
    await ctx.close();
  });

  it('a signed-out visitor is sent to sign in', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await page.goto('/settings/members');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await ctx.close();
  });
});

describe('invitations', () => {
  it('an admin invites from the members table; the invitee accepts through the mailed link and signs in', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, DEMO_USERS[0].email);
    await page.goto('/settings/members');
    await page.getByTestId('members-table').getByText(DEMO_USERS[1].email).waitFor();
    await page.getByLabel('E-mail to invite').fill(invitee);
    await page.getByLabel('Role', { exact: true }).selectOption('production');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${invitee}.`).waitFor();
    await page.getByTestId('members-table').getByText(invitee).waitFor();
    await screenshot(page, 'members');

    const mail = await mailTo(invitee);
    const link = mail.text.match(/https?:\/\/\S+\/accept-invite\/\S+/)?.[0];
    expect(link).toBeTruthy();
    const path = new URL(link!).pathname;

    const guest = await newContext(browser());
    const gp = await guest.newPage();
    await gp.goto(path);
    await gp.getByRole('heading', { name: /Join Hollowmere Preserves/ }).waitFor();
    await gp.getByLabel('Your name').fill('Pia Newcomb');
    await gp.getByLabel('New password').fill(INVITEE_PASSWORD);
    await gp.getByLabel('Repeat the password').fill(INVITEE_PASSWORD);
    await gp.getByRole('button', { name: 'Accept and join' }).click();
    await gp.getByText('You have joined').waitFor();
    await signIn(gp, invitee, INVITEE_PASSWORD);
    await expect(gp.getByTestId('actor-role').first().textContent()).resolves.toBe('Production lead');

    // The link is single-use.
    await gp.goto(path);
    await gp.getByRole('heading', { name: 'This invitation cannot be used' }).waitFor();
    await guest.close();

    // A role change asks first (a walk found one stray click demoting the admin themself), and goes in the audit trail.
    await page.reload();
    const role = page.getByLabel('Role of Pia Newcomb');
    await role.selectOption('taster');
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('heading', { name: 'Make Pia Newcomb Taster?' }).waitFor();
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await expect.poll(() => role.inputValue()).toBe('production');
    await role.selectOption('taster');
    await dialog.getByRole('button', { name: 'Change role' }).click();
    await page.getByText('Pia Newcomb is now Taster.').waitFor();
    await expect.poll(() => role.inputValue()).toBe('taster');
    const own = page.getByLabel(`Role of ${DEMO_USERS[0].name}`);
    await own.selectOption('developer');
    await dialog.getByRole('heading', { name: 'Change your own role?' }).waitFor();
    expect(await dialog.innerText()).toContain('lose the administration of this workspace');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await expect.poll(() => own.inputValue()).toBe('admin');
    await page.goto('/production/audit');
    await page.getByTestId('audit-trail').getByText(`Pia Newcomb (${invitee}): Production lead → Taster`).waitFor();
    await page.getByTestId('audit-trail').getByText(`Invited ${invitee} as Production lead`).waitFor();
    await ctx.close();
  });
});

describe('the role-change dialog on a phone (390 px)', () => {
  it('fits the window, and cancels or changes the role with its buttons', async () => {
    const ctx = await newContext(browser(), PHONE);
    const page = await ctx.newPage();
    await signIn(page, DEMO_USERS[0].email);
    await page.goto('/settings/members');
    const taster = DEMO_USERS.find((u) => u.role === 'taster')!;
    const role = page.getByLabel(`Role of ${taster.name}`);
    await role.selectOption('production');
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('heading', { name: `Make ${taster.name} Production lead?` }).waitFor();
    // Whole inside the window, buttons too: nothing to scroll sideways to reach them.
    const inside = async (box: { x: number; y: number; width: number; height: number } | null) => {
      expect(box).not.toBeNull();
      expect(box!.x).toBeGreaterThanOrEqual(0);
      expect(box!.y).toBeGreaterThanOrEqual(0);
      expect(box!.x + box!.width).toBeLessThanOrEqual(PHONE.width);
      expect(box!.y + box!.height).toBeLessThanOrEqual(PHONE.height);
    };
    await inside(await dialog.boundingBox());
    for (const name of ['Cancel', 'Change role']) {
      const button = dialog.getByRole('button', { name });
      await inside(await button.boundingBox());
      // A finger-sized target (WCAG 2.2 SC 2.5.8 asks at least 24 × 24 CSS px).
      expect((await button.boundingBox())!.height).toBeGreaterThanOrEqual(24);
    }
    await screenshot(page, 'members-role-dialog-phone');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(() => role.inputValue()).toBe('taster');
    // Confirmed, then put back as it was for the other tests.
    await role.selectOption('production');
    await dialog.getByRole('button', { name: 'Change role' }).click();
    await page.getByText(`${taster.name} is now Production lead.`).waitFor();
    await role.selectOption('taster');
    await dialog.getByRole('button', { name: 'Change role' }).click();
    await page.getByText(`${taster.name} is now Taster.`).waitFor();
    await expect.poll(() => role.inputValue()).toBe('taster');
    await ctx.close();
  });
});

describe('wrong passwords', () => {
  it('shows a clear error and stays on the sign-in page', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(DEMO_USERS[2].email);
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match an account.').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await ctx.close();
  });

  it('the rate limit kicks in after repeated failures, even for the right password', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await page.goto('/sign-in');
    for (let i = 0; i < 5; i++) {
      await page.getByLabel('E-mail').fill(invitee);
      await page.getByLabel('Password').fill(`wrong-${i}`);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByText('That e-mail and password do not match an account.').waitFor();
    }
    await page.getByLabel('Password').fill(INVITEE_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText(/Too many sign-in attempts\. Wait \d+ minutes? and try again\./).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await ctx.close();
  });
});

describe('baseline security headers', () => {
  it('every page forbids framing and sniffing and keeps referrers to our origin', async () => {
    // Sources: W3C CSP Level 3 (frame-ancestors, base-uri, form-action, object-src); WHATWG Fetch (nosniff);
    // W3C Referrer Policy (strict-origin-when-cross-origin).
    const ctx = await newContext(browser());
    for (const path of ['/sign-in', '/join', '/api/health']) {
      const res = await ctx.request.get(path);
      const h = res.headers();
      expect(h['content-security-policy']).toContain("frame-ancestors 'none'");
      expect(h['content-security-policy']).toContain("object-src 'none'");
      expect(h['x-frame-options']).toBe('DENY');
      expect(h['x-content-type-options']).toBe('nosniff');
      expect(h['referrer-policy']).toBe('strict-origin-when-cross-origin');
      expect(h['x-powered-by']).toBeUndefined();
    }
    await ctx.close();
  });
});
