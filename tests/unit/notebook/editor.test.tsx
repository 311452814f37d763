// @vitest-environment jsdom
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { act, cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { type TiptapDoc } from '@/lib/notebook/shape';
import { findDocProblems } from '@/lib/notebook/document';
import { type NotebookConflictView } from '@/lib/notebook/schema';
import { clockTime } from '@/lib/notebook/autosave';

const actions = vi.hoisted(() => ({ saveNotebookAction: vi.fn(), resolveNotebookConflictAction: vi.fn() }));
vi.mock('next/navigation', () => ({ useRouter: () => ({ refresh: vi.fn(), push: vi.fn() }), usePathname: () => '/' }));
vi.mock('@/lib/notebook/actions', () => actions);
const uploads = vi.hoisted(() => ({ uploadPhoto: vi.fn() }));
vi.mock('@/components/notebook/uploadImage', () => uploads);

import { NotebookEditor } from '@/components/notebook/NotebookEditor';

const TRIAL_ID = '6b1f4c9e-2d3a-4e5f-8a7b-9c0d1e2f3a4b';
const CONFLICT_ID = '0e9d8c7b-6a5f-4e3d-8c2b-1a0f9e8d7c6b';
const para = (text: string): TiptapDoc => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

beforeAll(() => {
  // jsdom has no layout; ProseMirror asks for rectangles when it scrolls the selection into view.
  const rect = { x: 0, y: 0, top: 0, left: 0, bottom: 0, right: 0, width: 0, height: 0, toJSON: () => ({}) };
  Range.prototype.getClientRects = () => ({ length: 0, item: () => null, [Symbol.iterator]: [][Symbol.iterator] }) as unknown as DOMRectList;
  Range.prototype.getBoundingClientRect = () => rect as DOMRect;
  document.elementFromPoint = () => null;
  Element.prototype.scrollIntoView = () => undefined;
});

beforeEach(() => {
  vi.useFakeTimers();
});
afterEach(() => {
  cleanup();
  vi.useRealTimers();
  vi.clearAllMocks();
});

/** Lets effects, the editor's creation and resolved promises run. */
async function flush(ms = 0) {
  await act(async () => {
    await vi.advanceTimersByTimeAsync(ms);
  });
}

function deferred<T>() {
  let resolve!: (v: T) => void;
  let reject!: (e: unknown) => void;
  const promise = new Promise<T>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  return { promise, resolve, reject };
}

const indicator = () => screen.getByTestId('notebook-save-state');

function renderEditor(initial: Partial<Parameters<typeof NotebookEditor>[0]['initial']> = {}) {
  return render(
    <NotebookEditor
      trialId={TRIAL_ID}
      variantId={null}
      canEdit
      title="Trial notebook"
      initial={{ doc: { type: 'doc', content: [{ type: 'paragraph' }] }, version: 0, updatedAt: null, updatedByName: null, conflicts: [], ...initial }}
    />,
  );
}

describe('NotebookEditor autosave', () => {
  it('moves through Unsaved → Saving… → Saved, Offline — will retry, and Not saved', async () => {
    const firstSave = deferred<unknown>();
    actions.saveNotebookAction.mockReturnValueOnce(firstSave.promise);
    renderEditor();
    await flush();
    // Source: WAI-ARIA 1.2, aria-live property — "polite" announces changes without interrupting.
    expect(indicator().getAttribute('aria-live')).toBe('polite');
    expect(indicator().textContent).toBe('No changes yet');

    fireEvent.click(screen.getByRole('button', { name: 'Bullet list' }));
    await flush();
    expect(indicator().textContent).toBe('Unsaved changes');

    // The 1.5 s quiet time is the product's choice. Common practice, no published source.
    await flush(1499);
    expect(actions.saveNotebookAction).not.toHaveBeenCalled();
    await flush(1);
    expect(actions.saveNotebookAction).toHaveBeenCalledTimes(1);
    expect(indicator().textContent).toBe('Saving…');
    const sent = actions.saveNotebookAction.mock.calls[0][0];
    expect(sent).toMatchObject({ trialId: TRIAL_ID, variantId: null, baseVersion: 0 });
    expect(sent.doc.content[0].type).toBe('bulletList');
    // What the editor produces must pass the server's check, or autosave would fail with 422.
    expect(findDocProblems(sent.doc)).toEqual([]);

    const savedAt = '2026-06-14T14:02:00.000Z';
    firstSave.resolve({ ok: true, data: { status: 'saved', version: 1, updatedAt: savedAt } });
    await flush();
    expect(indicator().textContent).toBe(`Saved at ${clockTime(savedAt)}`);
    expect(indicator().textContent).toMatch(/^Saved at \d{2}:\d{2}$/);

    // A network failure keeps the text and retries after a back-off.
    actions.saveNotebookAction.mockRejectedValueOnce(new TypeError('Failed to fetch'));
    fireEvent.click(screen.getByRole('button', { name: 'Insert table (3 × 3)' }));
    await flush(1500);
    expect(actions.saveNotebookAction).toHaveBeenCalledTimes(2);
    expect(indicator().textContent).toBe('Offline — will retry');

    actions.saveNotebookAction.mockResolvedValueOnce({ ok: false, status: 422, error: 'The entry is 210 kB; the limit is 200 kB.' });
    await flush(1999);
    expect(actions.saveNotebookAction).toHaveBeenCalledTimes(2);
    await flush(1);
    expect(actions.saveNotebookAction).toHaveBeenCalledTimes(3);
    const retried = actions.saveNotebookAction.mock.calls[2][0];
    expect(retried.baseVersion).toBe(1);
    expect(retried.doc.content.some((n: { type: string }) => n.type === 'table')).toBe(true);
    expect(findDocProblems(retried.doc)).toEqual([]);
    expect(indicator().textContent).toBe('Not saved: The entry is 210 kB; the limit is 200 kB.');
  });

  it('warns before the page is left while changes are unsaved', async () => {
    renderEditor();
    await flush();
    const calm = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(calm);
    expect(calm.defaultPrevented).toBe(false);
    fireEvent.click(screen.getByRole('button', { name: 'Checklist' }));
    await flush();
    const leaving = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(leaving);
    expect(leaving.defaultPrevented).toBe(true);
  });

  it('saves at once when the tab is hidden', async () => {
    actions.saveNotebookAction.mockResolvedValue({ ok: true, data: { status: 'saved', version: 1, updatedAt: '2026-06-14T09:30:00.000Z' } });
    renderEditor();
    await flush();
    fireEvent.click(screen.getByRole('button', { name: 'Numbered list' }));
    await flush();
    Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => 'hidden' });
    document.dispatchEvent(new Event('visibilitychange'));
    await flush();
    Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => 'visible' });
    expect(actions.saveNotebookAction).toHaveBeenCalledTimes(1);
    expect(actions.saveNotebookAction.mock.calls[0][0].doc.content[0].type).toBe('orderedList');
  });
});

describe('NotebookEditor conflicts', () => {
  const theirs = para('Their note: set after 3 minutes.');
  const mine = para('My note: set after 4 minutes.');
  const kept: NotebookConflictView = { conflictId: CONFLICT_ID, doc: mine, baseVersion: 2, savedByName: 'Ada Quill', createdAt: '2026-06-14T10:15:00.000Z' };
  const BANNER = 'Someone else saved this entry while you were writing. Nothing is lost: your version is kept beside theirs.';

  it('shows both versions of a kept conflict and "Keep both" resolves with keep: both, then reloads', async () => {
    const merged: TiptapDoc = {
      type: 'doc',
      content: [
        ...theirs.content!,
        { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Kept from a parallel edit by Ada Quill at 2026-06-14 10:15 UTC' }] },
        ...mine.content!,
      ],
    };
    actions.resolveNotebookConflictAction.mockResolvedValue({
      ok: true,
      data: { entryId: 'e', trialId: TRIAL_ID, variantId: null, version: 4, keep: 'both', entry: { entryId: 'e', doc: merged, version: 4, updatedAt: '2026-06-14T10:20:00.000Z', updatedByName: 'Ben Ladle', conflicts: [] } },
    });
    renderEditor({ doc: theirs, version: 3, updatedAt: '2026-06-14T10:10:00.000Z', updatedByName: 'Ben Ladle', conflicts: [kept] });
    await flush();

    // Conflict wording is the product's own. Common practice, no published source.
    expect(screen.getByText(BANNER)).toBeTruthy();
    expect(within(screen.getByTestId('conflict-mine')).getByText('My note: set after 4 minutes.')).toBeTruthy();
    expect(within(screen.getByTestId('conflict-theirs')).getByText('Their note: set after 3 minutes.')).toBeTruthy();
    expect(screen.getByTestId('conflict-theirs').getAttribute('aria-label')).toContain('Ben Ladle');
    expect(screen.getByRole('button', { name: 'Keep mine' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Keep theirs' })).toBeTruthy();
    // No toolbar while the choice is open: nothing new can be typed over either version.
    expect(screen.queryByRole('toolbar')).toBeNull();

    fireEvent.click(screen.getByRole('button', { name: 'Keep both' }));
    await flush();
    expect(actions.resolveNotebookConflictAction).toHaveBeenCalledWith({ conflictId: CONFLICT_ID, keep: 'both' });
    expect(screen.queryByText(BANNER)).toBeNull();
    const editorText = document.querySelector('.ProseMirror')?.textContent ?? '';
    expect(editorText).toContain('Their note: set after 3 minutes.');
    expect(editorText).toContain('Kept from a parallel edit by Ada Quill');
    expect(editorText).toContain('My note: set after 4 minutes.');
    expect(screen.getByRole('toolbar')).toBeTruthy();
  });

  it('shows the banner when a save comes back as a conflict, and stops autosaving', async () => {
    actions.saveNotebookAction.mockResolvedValueOnce({
      ok: true,
      data: { status: 'conflict', version: 5, conflictId: CONFLICT_ID, current: { doc: theirs, updatedByName: 'Ben Ladle', updatedAt: '2026-06-14T11:00:00.000Z' } },
    });
    renderEditor({ doc: mine, version: 4, updatedAt: '2026-06-14T10:00:00.000Z', updatedByName: 'Ada Quill' });
    await flush();
    fireEvent.click(screen.getByRole('button', { name: 'Heading 2' }));
    await flush(1500);
    expect(actions.saveNotebookAction).toHaveBeenCalledTimes(1);
    expect(screen.getByText(BANNER)).toBeTruthy();
    expect(within(screen.getByTestId('conflict-theirs')).getByText('Their note: set after 3 minutes.')).toBeTruthy();
    expect(within(screen.getByTestId('conflict-mine')).getByRole('heading', { level: 2, name: 'My note: set after 4 minutes.' })).toBeTruthy();
    await flush(10_000);
    expect(actions.saveNotebookAction).toHaveBeenCalledTimes(1);
  });
});

describe('NotebookEditor links and photos', () => {
  it('refuses a javascript: link in the link form and applies a web address', async () => {
    renderEditor({ doc: para('method notes'), version: 1, updatedAt: '2026-06-14T10:00:00.000Z', updatedByName: 'Ada Quill' });
    await flush();
    fireEvent.click(screen.getByRole('button', { name: 'Link' }));
    const address = screen.getByLabelText('Link address');
    // Source: OWASP Cross Site Scripting Prevention Cheat Sheet (javascript: URLs).
    fireEvent.change(address, { target: { value: 'javascript:alert(1)' } });
    fireEvent.click(screen.getByRole('button', { name: 'Apply link' }));
    expect(screen.getByRole('alert').textContent).toMatch(/https:\/\/, http:\/\/, mailto: or \//);
    fireEvent.change(address, { target: { value: 'example.org/method' } });
    fireEvent.click(screen.getByRole('button', { name: 'Apply link' }));
    await flush();
    expect(screen.queryByLabelText('Link address')).toBeNull();
    expect(document.querySelector('.ProseMirror a')?.getAttribute('href')).toBe('https://example.org/method');
  });

  it('uploads a chosen photo with the variant and inserts it with src = upload.url and alt = file name', async () => {
    const variantId = '7c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f';
    const upload = deferred<unknown>();
    uploads.uploadPhoto.mockImplementationOnce((_t: string, _v: string | null, _f: File, onProgress: (f: number) => void) => {
      onProgress(0.4);
      return upload.promise;
    });
    actions.saveNotebookAction.mockResolvedValue({ ok: true, data: { status: 'saved', version: 1, updatedAt: '2026-06-14T10:00:00.000Z' } });
    render(
      <NotebookEditor trialId={TRIAL_ID} variantId={variantId} canEdit initial={{ doc: para('Jar photos'), version: 0, updatedAt: null, updatedByName: null, conflicts: [] }} />,
    );
    await flush();
    const file = new File([new Uint8Array([0xff, 0xd8, 0xff])], 'jar-b.jpg', { type: 'image/jpeg' });
    fireEvent.change(screen.getByLabelText('Choose a photo to insert'), { target: { files: [file] } });
    await flush();
    expect(uploads.uploadPhoto).toHaveBeenCalledWith(TRIAL_ID, variantId, file, expect.any(Function));
    expect(screen.getByText(/Uploading… jar-b\.jpg \(40 %\)/)).toBeTruthy();

    const url = '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d';
    upload.resolve({ ok: true, upload: { id: '5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d', url, thumbnailUrl: null, width: 800, height: 600, originalName: 'jar-b.jpg', kind: 'photo' } });
    await flush();
    expect(screen.queryByText(/Uploading…/)).toBeNull();
    const img = document.querySelector('.ProseMirror img');
    expect(img?.getAttribute('src')).toBe(url);
    expect(img?.getAttribute('alt')).toBe('jar-b.jpg');

    await flush(1500);
    const saved = actions.saveNotebookAction.mock.calls[0][0];
    expect(saved.doc.content.some((n: { type: string; attrs?: { src?: string } }) => n.type === 'image' && n.attrs?.src === url)).toBe(true);
    expect(findDocProblems(saved.doc)).toEqual([]);
  });

  it('shows an upload refusal inline and inserts nothing', async () => {
    uploads.uploadPhoto.mockResolvedValueOnce({ ok: false, message: 'Photos may be at most 12 MB.' });
    renderEditor({ doc: para('x'), version: 1 });
    await flush();
    const file = new File([new Uint8Array([1, 2, 3])], 'huge.png', { type: 'image/png' });
    fireEvent.change(screen.getByLabelText('Choose a photo to insert'), { target: { files: [file] } });
    await flush();
    expect(screen.getByRole('alert').textContent).toContain('huge.png was not added: Photos may be at most 12 MB.');
    expect(document.querySelector('.ProseMirror img')).toBeNull();
  });
});

describe('NotebookEditor read-only', () => {
  it('renders the document without an editor or toolbar when canEdit is false', async () => {
    render(
      <NotebookEditor
        trialId={TRIAL_ID}
        variantId={null}
        canEdit={false}
        initial={{ doc: para('Tasting notes only.'), version: 2, updatedAt: '2026-06-14T10:00:00.000Z', updatedByName: 'Ada Quill', conflicts: [] }}
      />,
    );
    await flush();
    expect(screen.getByText('Tasting notes only.')).toBeTruthy();
    expect(screen.queryByRole('toolbar')).toBeNull();
    expect(document.querySelector('[contenteditable="true"]')).toBeNull();
  });
});
