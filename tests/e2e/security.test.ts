/**
 * The Content Security Policy in a real browser: the key pages run with zero violations (their
 * scripts carry the per-request nonce from proxy.ts), and a script injected without the nonce
 * is refused. Source for the behaviour checked: W3C Content Security Policy Level 3 (nonce-source,
 * 'strict-dynamic', inline script and event-handler checks, the securitypolicyviolation event).
 */
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { sharedBrowser, newContext, signIn, watchCsp } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

/** Every script tag of the page carries a nonce, and it is the one in this response's policy. */
async function expectNoncedScripts(page: Page, policy: string) {
  const nonce = /'nonce-([^']+)'/.exec(policy)?.[1];
  expect(nonce, policy).toBeTruthy();
  const scripts = await page.evaluate(() => [...document.querySelectorAll('script')].map((s) => ({ src: s.src, nonce: s.nonce })));
  expect(scripts.length).toBeGreaterThan(0);
  for (const s of scripts) expect(s.nonce, s.src || 'inline script').toBe(nonce);
}

describe('Content Security Policy', () => {
  it('the page policy allows only nonce scripts and our own origin, with a fresh nonce per response', async () => {
    const ctx = await newContext(browser());
    const first = (await ctx.request.get('/sign-in')).headers()['content-security-policy'];
    const second = (await ctx.request.get('/sign-in')).headers()['content-security-policy'];
    for (const part of ["default-src 'self'", "'strict-dynamic'", "object-src 'none'", "frame-ancestors 'none'", "base-uri 'self'"]) expect(first).toContain(part);
    expect(first).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{20,}' 'strict-dynamic'(;|$)/);
    expect(first).not.toContain('unsafe-inline');
    expect(first).not.toContain('unsafe-eval');
    expect(/'nonce-([^']+)'/.exec(first)![1]).not.toBe(/'nonce-([^']+)'/.exec(second)![1]);
    // CSP on prefetch requests: the router's prefetches, RSC requests and speculative loads carry it too.
    const prefetches: Array<Record<string, string>> = [{ purpose: 'prefetch' }, { 'next-router-prefetch': '1', rsc: '1' }, { rsc: '1' }, { 'sec-purpose': 'prefetch' }];
    for (const headers of prefetches) {
      const policy = (await ctx.request.get('/sign-in', { headers })).headers()['content-security-policy'];
      expect(policy, JSON.stringify(headers)).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{20,}' 'strict-dynamic'(;|$)/);
    }
    await ctx.close();
  });

  it('sign-in, the trial notebook, the results charts and the phone tasting run without a single violation', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    const violations = await watchCsp(page);

    const signInRes = await page.goto('/sign-in');
    await expectNoncedScripts(page, signInRes!.headers()['content-security-policy']);
    await signIn(page, developer.email);

    // A trial page: the Tiptap editor only exists once client scripts have run.
    await page.goto('/trials');
    await page.getByRole('link', { name: /Apricot spread: how low can the sugar go\?/ }).click();
    await page.locator('.ProseMirror[contenteditable="true"]').first().waitFor();
    const trialUrl = page.url();

    // Results: chart.js draws into canvases.
    await page.getByTestId('tasting-list').getByRole('link', { name: 'Spread tasting, 19 November' }).click();
    await page.getByRole('link', { name: 'Results' }).click();
    const canvas = page.getByTestId('means-chart').first().locator('canvas');
    await canvas.waitFor();
    expect((await canvas.boundingBox())!.width).toBeGreaterThan(100);

    // A session of our own (the demo's open one may already be closed by the tasting test),
    // opened through the API as the signed-in developer, then the phone flow on a small screen.
    const trialId = new URL(trialUrl).pathname.split('/').pop()!;
    const api = page.request;
    const write = { headers: { origin: new URL(trialUrl).origin } };
    const { variants } = await (await api.get(`/api/v1/trials/${trialId}/variants`)).json();
    const { attributes } = await (await api.get('/api/v1/attributes')).json();
    const created = await api.post(`/api/v1/trials/${trialId}/tastings`, {
      ...write,
      data: { title: 'Policy check tasting', method: 'rated', variantIds: variants.slice(0, 2).map((v: { id: string }) => v.id), attributeIds: [attributes[0].id], notice: 'Contains fruit and sugar.' },
    });
    expect(created.status(), await created.text()).toBe(201);
    const { tastingId } = await created.json();
    const { joinCode } = await (await api.post(`/api/v1/tastings/${tastingId}/open`, write)).json();
    const phoneCtx = await newContext(browser(), { width: 360, height: 740 });
    const phone = await phoneCtx.newPage();
    const phoneViolations = await watchCsp(phone);
    await phone.goto('/join');
    await phone.getByLabel('Tasting code').fill(joinCode);
    await phone.getByLabel('Your name').fill('Policy guest');
    await phone.getByRole('button', { name: 'Join the tasting' }).click();
    await phone.waitForURL(/\/t\/sws_/);
    await phone.getByRole('button', { name: 'I agree, start' }).click();
    await phone.getByText('Sample 1 of 2').waitFor();

    // Production: the seeded product's trend charts (chart.js) and its printable batch sheet.
    await page.goto('/production');
    await page.getByTestId('products').getByRole('link', { name: 'Blackcurrant jam' }).first().click();
    await expect.poll(() => page.getByTestId('trend-chart').locator('canvas').count()).toBeGreaterThan(0);
    await page.goto('/production');
    await page.getByTestId('products').locator('li', { hasText: 'Blackcurrant jam' }).getByRole('link', { name: /^v\d+$/ }).click();
    await page.getByRole('link', { name: 'Batch sheet' }).click();
    await page.getByTestId('sheet-ingredients').waitFor();

    // Print styles: the formula print page's margins and white paper come from the stylesheet, not a refused <style>.
    await page.goto('/formulas');
    await page.locator('main a[href^="/formulas/"]:not([href="/formulas/new"])').first().click();
    await page.getByRole('link', { name: 'Print view' }).click();
    await page.getByRole('article', { name: /^Formula sheet:/ }).waitFor();
    expect(await page.locator('style:not([nonce])').count()).toBe(0);
    await page.emulateMedia({ media: 'print' });
    expect(await page.evaluate(() => getComputedStyle(document.body).backgroundColor)).toBe('rgb(255, 255, 255)');
    await page.emulateMedia({ media: 'screen' });

    expect(violations).toEqual([]);
    expect(phoneViolations).toEqual([]);
    await api.post(`/api/v1/tastings/${tastingId}/close`, write);
    await phoneCtx.close();
    await ctx.close();
  });

  it('refuses a script and an event handler that reach the page markup without the nonce', async () => {
    // As stored markup would arrive: inside the server's HTML (parser-inserted), under the page's real policy.
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    const violations = await watchCsp(page);
    await page.route('**/sign-in', async (route) => {
      const res = await route.fetch();
      const html = (await res.text()).replace(
        '</body>',
        '<script>window.injectedInline = true;</script><img alt="" src="/setwell-mark.svg?csp" onload="window.injectedHandler = true"></body>',
      );
      expect(res.headers()['content-security-policy']).toContain("'strict-dynamic'");
      await route.fulfill({ response: res, body: html });
    });
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').waitFor();
    await page.locator('img[src="/setwell-mark.svg?csp"]').waitFor({ state: 'attached' });
    await expect.poll(() => violations.filter((v) => v.directive.startsWith('script-src')).map((v) => v.directive).sort()).toEqual(['script-src-attr', 'script-src-elem']);
    const ran = await page.evaluate(() => {
      const w = window as unknown as { injectedInline?: boolean; injectedHandler?: boolean };
      return { inline: w.injectedInline === true, handler: w.injectedHandler === true };
    });
    expect(ran).toEqual({ inline: false, handler: false });
    await ctx.close();
  });
});
