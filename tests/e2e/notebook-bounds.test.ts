/**
 * Bounded documents in a real browser: the largest notebook entry the save check accepts
 * (lib/notebook/largest-doc.ts) is saved through the API, then opened in the editor (Tiptap in
 * chromium) and on the print page (the server's read-only render). Both must finish without a
 * CSP violation; their times are printed, never asserted (speed targets live in `npm run bench`).
 */
import { describe, it, expect } from 'vitest';
import { sharedBrowser, newContext, signIn, watchCsp } from './browser';
import { DEMO_USERS } from '@/lib/seed/demo';
import { largestNotebookDoc } from '@/lib/notebook/largest-doc';
import { NOTEBOOK_LIMITS as L } from '@/lib/notebook/shape';

const browser = sharedBrowser();
const developer = DEMO_USERS.find((u) => u.role === 'developer')!;

describe('bounded documents in the browser', () => {
  it('the largest accepted entry opens in the editor and on the print page; a span of a billion is refused', async () => {
    const ctx = await newContext(browser());
    const page = await ctx.newPage();
    const violations = await watchCsp(page);
    await signIn(page, developer.email);
    const api = page.request;
    const write = { headers: { origin: new URL(page.url()).origin } };
    const { formulas } = await (await api.get('/api/v1/formulas')).json();
    const created = await api.post('/api/v1/trials', { ...write, data: { title: 'Largest notebook entry', question: 'Does the largest accepted entry open?', formulaId: formulas[0].id } });
    expect(created.status(), await created.text()).toBe(201);
    const { trialId } = await created.json();

    const saved = await api.put(`/api/v1/trials/${trialId}/notebook`, { ...write, data: { variantId: null, baseVersion: 0, doc: largestNotebookDoc() } });
    expect(saved.status(), await saved.text()).toBe(200);
    const tooWide = { type: 'doc', content: [{ type: 'table', content: [{ type: 'tableRow', content: [{ type: 'tableCell', attrs: { colspan: 1_000_000_000 }, content: [{ type: 'paragraph' }] }] }] }] };
    const refused = await api.put(`/api/v1/trials/${trialId}/notebook`, { ...write, data: { variantId: null, baseVersion: 1, doc: tooWide } });
    expect(refused.status()).toBe(422);

    // The same pages with a one-line entry, for comparison on the same (shared) machine.
    const small = await api.post('/api/v1/trials', { ...write, data: { title: 'One-line notebook entry', question: 'Baseline', formulaId: formulas[0].id } });
    const smallTrialId = (await small.json()).trialId;
    const oneLine = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Spans every row and column' }] }] };
    expect((await api.put(`/api/v1/trials/${smallTrialId}/notebook`, { ...write, data: { variantId: null, baseVersion: 0, doc: oneLine } })).status()).toBe(200);
    // The fixture's photo address names no stored upload: answer it in the browser so 100 lookups do not load the server.
    await page.route('**/api/v1/uploads/**', (route) => route.fulfill({ status: 404, body: '' }));

    const openEditor = async (id: string, images: number) => {
      const started = Date.now();
      await page.goto(`/trials/${id}`);
      const editor = page.locator('.ProseMirror[contenteditable="true"]').first();
      await editor.waitFor({ timeout: 60_000 });
      await expect.poll(() => editor.locator('img:not(.ProseMirror-separator)').count(), { timeout: 60_000 }).toBe(images);
      return { editor, ms: Date.now() - started };
    };
    const openPrint = async (id: string) => {
      const started = Date.now();
      const res = await page.goto(`/trials/${id}/print`);
      expect(res!.status()).toBe(200);
      await page.getByText('Spans every row and column').first().waitFor();
      return Date.now() - started;
    };

    const baselineEditor = (await openEditor(smallTrialId, 0)).ms;
    const { editor, ms: largestEditor } = await openEditor(trialId, L.maxImages);
    expect(await editor.locator(`th[colspan="${L.maxTableColumns}"][rowspan="${L.maxRowspan}"]`).count()).toBe(1);
    console.log(`bounded documents: editor page (chromium, page load included): largest accepted entry ${largestEditor} ms, one-line entry ${baselineEditor} ms`);

    const baselinePrint = await openPrint(smallTrialId);
    const largestPrint = await openPrint(trialId);
    expect(await page.locator('article img').count()).toBe(L.maxImages);
    console.log(`bounded documents: print page (server render, page load included): largest accepted entry ${largestPrint} ms, one-line entry ${baselinePrint} ms`);
    // Its tables (a cell spanning 30 columns and 200 rows, aligned) render without style attributes.
    expect(violations).toEqual([]);
    await ctx.close();
  }, 180_000);
});
