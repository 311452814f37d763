// @vitest-environment jsdom
/**
 * Bounded documents in the editor (Tiptap in jsdom): the largest accepted document loads, a row
 * stored before the limits (a colspan of a billion) loads without hanging, and links render with
 * our rel and target whatever the document says. The load time is printed, never asserted.
 */
import { performance } from 'node:perf_hooks';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { cleanup, render, waitFor } from '@testing-library/react';
import { largestNotebookDoc } from '@/lib/notebook/largest-doc';
import { NOTEBOOK_LIMITS as L, type TiptapDoc } from '@/lib/notebook/shape';

const actions = vi.hoisted(() => ({ saveNotebookAction: vi.fn(), resolveNotebookConflictAction: vi.fn() }));
vi.mock('next/navigation', () => ({ useRouter: () => ({ refresh: vi.fn(), push: vi.fn() }), usePathname: () => '/' }));
vi.mock('@/lib/notebook/actions', () => actions);
vi.mock('@/components/notebook/uploadImage', () => ({ uploadPhoto: vi.fn() }));

import { NotebookEditor } from '@/components/notebook/NotebookEditor';

const TRIAL_ID = '6b1f4c9e-2d3a-4e5f-8a7b-9c0d1e2f3a4b';

beforeAll(() => {
  // jsdom has no layout; ProseMirror asks for rectangles when it scrolls the selection into view.
  const rect = { x: 0, y: 0, top: 0, left: 0, bottom: 0, right: 0, width: 0, height: 0, toJSON: () => ({}) };
  Range.prototype.getClientRects = () => ({ length: 0, item: () => null, [Symbol.iterator]: [][Symbol.iterator] }) as unknown as DOMRectList;
  Range.prototype.getBoundingClientRect = () => rect as DOMRect;
  document.elementFromPoint = () => null;
  Element.prototype.scrollIntoView = () => undefined;
});
afterEach(cleanup);

async function openEditor(doc: TiptapDoc): Promise<HTMLElement> {
  const { container } = render(
    <NotebookEditor trialId={TRIAL_ID} variantId={null} canEdit title="Trial notebook" initial={{ doc, version: 3, updatedAt: null, updatedByName: null, conflicts: [] }} />,
  );
  await waitFor(() => expect(container.querySelector('.ProseMirror[contenteditable="true"]')).not.toBeNull(), { timeout: 20_000 });
  return container.querySelector('.ProseMirror') as HTMLElement;
}

describe('bounded documents: the editor', () => {
  it('loads the largest accepted document', async () => {
    const started = performance.now();
    const editor = await openEditor(largestNotebookDoc());
    const ms = performance.now() - started;
    console.log(`bounded documents: largest accepted entry loaded into the editor (Tiptap, jsdom) in ${ms.toFixed(0)} ms`);
    expect(editor.querySelectorAll('img:not(.ProseMirror-separator)')).toHaveLength(L.maxImages);
    expect(editor.querySelector(`th[colspan="${L.maxTableColumns}"][rowspan="${L.maxRowspan}"]`)).not.toBeNull();
    expect(editor.querySelector(`ol[start="${L.maxListStart}"]`)).not.toBeNull();
    expect(editor.textContent).toContain('Deepest note');
    expect(editor.querySelectorAll('blockquote')).toHaveLength(L.maxDepth - 3);
  }, 60_000);

  it('loads a row stored before the limits (a colspan of a billion) as a one-column cell', async () => {
    const stored: TiptapDoc = {
      type: 'doc',
      content: [{ type: 'table', content: [{ type: 'tableRow', content: [{ type: 'tableCell', attrs: { colspan: 1_000_000_000, rowspan: 1 }, content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Brix' }] }] }] }] }],
    };
    const editor = await openEditor(stored);
    const cell = editor.querySelector('td')!;
    expect(cell.textContent).toBe('Brix');
    expect(cell.getAttribute('colspan')).toBeNull();
    expect(editor.querySelectorAll('col')).toHaveLength(1);
  });

  it('renders links with our rel and target, whatever the stored document says', async () => {
    const stored: TiptapDoc = {
      type: 'doc',
      content: [{ type: 'paragraph', content: [
        { type: 'text', text: 'elsewhere', marks: [{ type: 'link', attrs: { href: 'https://example.org/m', target: '_self', rel: 'opener', class: 'x' } }] },
        { type: 'text', text: ' and ' },
        { type: 'text', text: 'here', marks: [{ type: 'link', attrs: { href: '/formulas', target: '_blank', rel: 'opener' } }] },
      ] }],
    };
    const editor = await openEditor(stored);
    const [external, local] = [...editor.querySelectorAll('a')];
    // Source: WHATWG HTML, link types — noopener keeps window.opener null; noreferrer sends no Referer.
    expect([external.getAttribute('target'), external.getAttribute('rel'), external.getAttribute('class')]).toEqual(['_blank', 'noopener noreferrer nofollow', null]);
    expect([local.getAttribute('target'), local.getAttribute('rel')]).toEqual([null, null]);
  });
});
