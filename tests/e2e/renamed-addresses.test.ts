// words-codemod: keep — this test names the old addresses on purpose.
/**
 * Issue 18 renamed panels to tastings and measurements to cooks. Old page addresses (in e-mails already
 * sent, in bookmarks) redirect permanently with their query string; the old API paths still answer, as
 * deprecated aliases, through the same handlers.
 */
import { describe, it, expect } from 'vitest';
import { BASE_URL, sharedBrowser, newContext, signIn } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';

const browser = sharedBrowser();
const ID = '3f1c2a4e-5b6d-4e7f-8a9b-0c1d2e3f4a5b';

async function redirectOf(path: string) {
  const res = await fetch(`${BASE_URL}${path}`, { redirect: 'manual' });
  return { status: res.status, location: res.headers.get('location') };
}

describe('old page addresses', () => {
  it.each([
    ['/panels', '/tastings'],
    ['/panels?state=open&trial=' + ID, `/tastings?state=open&trial=${ID}`],
    [`/panels/${ID}`, `/tastings/${ID}`],
    [`/panels/${ID}/results?table=anova`, `/tastings/${ID}/results?table=anova`],
    [`/panels/${ID}/sheet`, `/tastings/${ID}/sheet`],
    [`/trials/${ID}/panels/new?from=home`, `/trials/${ID}/tastings/new?from=home`],
  ])('%s redirects permanently to %s', async (from, to) => {
    const { status, location } = await redirectOf(from);
    expect(status).toBe(308);
    expect(new URL(location!, BASE_URL).pathname + new URL(location!, BASE_URL).search).toBe(to);
  });

  it('sends a taster who opens the old "My tastings" address (/tastings) to /tastings/mine; staff who run tastings get the list', async () => {
    const taster = DEMO_USERS.find((u) => u.role === 'taster')!;
    const developer = DEMO_USERS.find((u) => u.role === 'developer')!;
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    await signIn(page, taster.email);
    await page.goto('/tastings');
    await page.waitForURL('**/tastings/mine');
    await page.getByRole('heading', { level: 1, name: 'My tastings' }).waitFor();
    await ctx.close();

    const staffCtx = await newContext(browser());
    const staff = await staffCtx.newPage();
    await signIn(staff, developer.email);
    const res = await staff.goto('/tastings');
    expect(res?.status()).toBe(200);
    expect(new URL(staff.url()).pathname).toBe('/tastings');
    await staff.getByRole('heading', { level: 1, name: 'Tastings' }).waitFor();
    await staffCtx.close();
  });
});

describe('old API paths', () => {
  it('answer like the new ones (here: 401 without a session) and are marked deprecated in the OpenAPI document', async () => {
    for (const path of [`/api/v1/panels/${ID}`, `/api/v1/tastings/${ID}`, `/api/v1/trials/${ID}/measurements`, `/api/v1/trials/${ID}/cooks`]) {
      const res = await fetch(`${BASE_URL}${path}`);
      expect(res.status, path).toBe(401);
    }
    const unknownSeat = await fetch(`${BASE_URL}/api/v1/tasting/sws_unknown`);
    const unknownSeatNow = await fetch(`${BASE_URL}/api/v1/tastings/seats/sws_unknown`);
    expect(unknownSeat.status).toBe(unknownSeatNow.status);
    const doc = (await (await fetch(`${BASE_URL}/api/v1/openapi.json`)).json()) as { paths: Record<string, Record<string, { deprecated?: boolean }>> };
    expect(doc.paths['/api/v1/panels/{tastingId}'].get.deprecated).toBe(true);
    expect(doc.paths['/api/v1/tasting/{seatToken}/answers'].put.deprecated).toBe(true);
    expect(doc.paths['/api/v1/trials/{trialId}/measurements'].post.deprecated).toBe(true);
    expect(doc.paths['/api/v1/tastings/{tastingId}'].get.deprecated).toBeUndefined();
  });
});
