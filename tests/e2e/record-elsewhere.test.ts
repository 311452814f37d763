/** Issue 14: a link to a record of another of your own workspaces offers the switch; nobody else learns of it. */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, newContext, signIn, watchPage, sidewaysOverflow } from './browser';
import { DEMO_USERS, DEMO_WORKSPACE, OTHER_ADMIN, OTHER_WORKSPACE } from '@/lib/seed/demo';

const browser = sharedBrowser();
const tomas = DEMO_USERS.find((u) => u.alsoIn === 'taster')!;
const UUID_PATH = /^\/trials\/[0-9a-f-]{36}$/;

describe('a link to a record of another workspace', () => {
  let trialPath = '';

  it('Tomas, acting as taster at Brackenfold, is offered the switch to Hollowmere and lands on the trial', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    const watch = await watchPage(page);
    await signIn(page, tomas.email);
    await page.goto('/trials');
    const hrefs = await page.locator('main a[href^="/trials/"]').evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? ''));
    trialPath = hrefs.find((h) => UUID_PATH.test(h))!;
    expect(trialPath).toMatch(UUID_PATH);

    // Make Brackenfold (where he is a taster) the active workspace, the way the switcher does.
    await page.goto('/home');
    const switcher = page.locator('#workspace-switcher').first();
    const brackenfold = await switcher.locator('option', { hasText: OTHER_WORKSPACE.name }).getAttribute('value');
    await switcher.selectOption(brackenfold!);
    await page.waitForURL('**/home');
    await expect.poll(() => page.locator('#workspace-switcher').first().inputValue()).toBe(brackenfold);

    const res = await page.goto(trialPath);
    expect(res?.status()).toBe(403);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(`This trial is in ${DEMO_WORKSPACE.name}`);
    expect(await page.locator('#main').innerText()).toContain(`Switch to ${DEMO_WORKSPACE.name} to open it.`);
    await page.setViewportSize({ width: 390, height: 844 });
    expect(await sidewaysOverflow(page)).toBeNull();
    await page.setViewportSize({ width: 1280, height: 900 });
    await page.getByRole('button', { name: `Switch to ${DEMO_WORKSPACE.name}` }).click();
    await page.waitForURL((url) => url.pathname === trialPath && !page.url().includes('sign-in'));
    await expect.poll(async () => (await page.getByRole('heading', { level: 1 }).textContent()) ?? '').not.toContain('This trial is in');
    expect(await page.locator('#workspace-switcher').first().inputValue()).not.toBe(brackenfold);
    // The offer stands on the refused page, a 403 document, which Chromium logs as a failed load; nothing else may appear.
    expect(watch.problems.filter((p) => !p.endsWith(`${trialPath}: Failed to load resource: the server responded with a status of 403 (Forbidden)`))).toEqual([]);
    await ctx.close();
  });

  it('the administrator of Brackenfold, not a member of Hollowmere, gets the plain 404', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, OTHER_ADMIN.email);
    const res = await page.goto(trialPath);
    expect(res?.status()).toBe(404);
    const text = await page.locator('#main').innerText();
    expect(text).toContain('Nothing here');
    expect(text).not.toContain(DEMO_WORKSPACE.name);
    expect(text).not.toContain('Switch');
    await ctx.close();
  });
});
