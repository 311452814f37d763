'use client';

/**
 * The notebook editor of a trial or one of its variants: rich text with our own toolbar,
 * autosave, inline photos through the uploads API, and conflict-keeping. A save that arrives
 * after someone else's is stored beside theirs on the server; the writer then chooses.
 */
import { useCallback, useEffect, useId, useRef, useState, useSyncExternalStore, type ReactNode } from 'react';
import { Extension } from '@tiptap/core';
import { EditorContent, useEditor, useEditorState, type Editor } from '@tiptap/react';
import { resolveNotebookConflictAction, saveNotebookAction } from '@/lib/notebook/actions';
import { isAllowedLinkHref, sanitizeDoc, type NotebookConflictView, type TiptapDoc } from '@/lib/notebook/schema';
import { AUTOSAVE_DELAY_MS, clockTime, hasUnsavedWork, normaliseLinkInput, retryDelayMs, saveStateLabel, type SaveState } from '@/lib/notebook/autosave';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { notebookExtensions } from './extensions';
import { NOTEBOOK_PROSE_CLASS, NotebookView } from './NotebookView';
import { uploadPhoto } from './uploadImage';

export interface NotebookEditorProps {
  trialId: string;
  variantId: string | null;
  initial: {
    doc: TiptapDoc;
    version: number;
    updatedAt: string | null;
    updatedByName: string | null;
    conflicts: NotebookConflictView[];
  };
  canEdit: boolean;
  title?: string;
}

type EntrySnapshot = { doc: TiptapDoc; updatedAt: string | null; updatedByName: string | null };

const PHOTO_TYPES = 'image/jpeg,image/png,image/webp';

/**
 * Tiptap builds some attrs objects without Object.prototype; React's server-action encoding
 * sends such objects as opaque references, so the server would see no attrs at all.
 * A JSON round trip gives plain objects.
 */
function plainDoc(json: unknown): TiptapDoc {
  return JSON.parse(JSON.stringify(json)) as TiptapDoc;
}

export function NotebookEditor({ trialId, variantId, initial, canEdit, title }: NotebookEditorProps) {
  if (!canEdit) {
    return (
      <section aria-label={title ?? 'Notebook'} className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
        {title ? <h2 className="mb-3 text-lg font-semibold">{title}</h2> : null}
        <NotebookView doc={initial.doc} />
        {initial.updatedAt ? (
          <p className="mt-4 text-xs text-rind-500">
            Last saved {initial.updatedByName ? `by ${initial.updatedByName} ` : ''}at {clockTime(initial.updatedAt)}
          </p>
        ) : null}
      </section>
    );
  }
  return <EditableNotebook trialId={trialId} variantId={variantId} initial={initial} title={title} />;
}

function EditableNotebook({ trialId, variantId, initial, title }: Omit<NotebookEditorProps, 'canEdit'>) {
  const [saveState, setSaveState] = useState<SaveState>({ kind: 'idle', savedAt: initial.updatedAt });
  const [conflicts, setConflicts] = useState<NotebookConflictView[]>(initial.conflicts);
  const [current, setCurrent] = useState<EntrySnapshot>({ doc: initial.doc, updatedAt: initial.updatedAt, updatedByName: initial.updatedByName });
  const [resolving, setResolving] = useState(false);
  const [resolveError, setResolveError] = useState<string | null>(null);
  const [linkOpen, setLinkOpen] = useState(false);

  const versionRef = useRef(initial.version);
  const dirtyRef = useRef(false);
  const inFlightRef = useRef(false);
  const lockedRef = useRef(initial.conflicts.length > 0);
  const debounceRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  const retryRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  const attemptRef = useRef(0);
  const saveNowRef = useRef<() => Promise<void>>(async () => undefined);
  const openLinkRef = useRef<() => void>(() => undefined);

  // Built once: the editor keeps its first extension list anyway, so re-creating it per render is waste.
  const [extensions] = useState(() => [
    ...notebookExtensions(),
    Extension.create({
      name: 'notebookShortcuts',
      addKeyboardShortcuts: () => ({
        'Mod-k': () => {
          openLinkRef.current();
          return true;
        },
        'Mod-s': () => {
          void saveNowRef.current();
          return true;
        },
      }),
    }),
  ]);
  const editor = useEditor({
    extensions,
    // Cleaned like the read-only view: a stored row from before a limit existed cannot hang the browser.
    content: sanitizeDoc(initial.doc),
    editable: initial.conflicts.length === 0,
    immediatelyRender: false,
    // The Content-Security-Policy refuses <style> tags without a nonce; Tiptap's core rules are in app/globals.css.
    injectCSS: false,
    editorProps: { attributes: { class: `${NOTEBOOK_PROSE_CLASS} min-h-48 px-4 py-3 focus:outline-none`, 'aria-label': title ? `${title}: notebook text` : 'Notebook text', role: 'textbox', 'aria-multiline': 'true' } },
    onUpdate: () => {
      if (lockedRef.current) return;
      dirtyRef.current = true;
      setSaveState((s) => (s.kind === 'saving' || s.kind === 'offline' ? s : { kind: 'dirty' }));
      if (debounceRef.current) clearTimeout(debounceRef.current);
      debounceRef.current = setTimeout(() => void saveNowRef.current(), AUTOSAVE_DELAY_MS);
    },
    onBlur: () => void saveNowRef.current(),
  });

  const scheduleRetry = useCallback(() => {
    if (retryRef.current) clearTimeout(retryRef.current);
    const delay = retryDelayMs(attemptRef.current);
    attemptRef.current += 1;
    retryRef.current = setTimeout(() => void saveNowRef.current(), delay);
  }, []);

  const lockForConflict = useCallback(
    (ed: Editor, next: NotebookConflictView[], snapshot: EntrySnapshot) => {
      lockedRef.current = true;
      ed.setEditable(false);
      setConflicts(next);
      setCurrent(snapshot);
      setSaveState({ kind: 'conflict' });
    },
    [],
  );

  const saveNow = useCallback(async () => {
    if (debounceRef.current) clearTimeout(debounceRef.current);
    debounceRef.current = null;
    if (!editor || lockedRef.current || !dirtyRef.current) return;
    // One save at a time; changes made meanwhile are picked up when it returns.
    if (inFlightRef.current) return;
    inFlightRef.current = true;
    dirtyRef.current = false;
    const doc = plainDoc(editor.getJSON());
    setSaveState({ kind: 'saving' });
    let result: Awaited<ReturnType<typeof saveNotebookAction>>;
    try {
      result = await saveNotebookAction({ trialId, variantId, baseVersion: versionRef.current, doc });
    } catch {
      // The request never got an answer (offline, server restarting): keep the text and retry.
      inFlightRef.current = false;
      dirtyRef.current = true;
      setSaveState({ kind: 'offline', attempt: attemptRef.current });
      scheduleRetry();
      return;
    }
    inFlightRef.current = false;
    if (!result.ok) {
      dirtyRef.current = true;
      setSaveState({ kind: 'error', message: result.error });
      if (result.status >= 500) scheduleRetry();
      return;
    }
    attemptRef.current = 0;
    const data = result.data;
    if (data.status === 'saved') {
      versionRef.current = data.version;
      if (dirtyRef.current) {
        setSaveState({ kind: 'dirty' });
        debounceRef.current = setTimeout(() => void saveNowRef.current(), AUTOSAVE_DELAY_MS);
      } else {
        setSaveState({ kind: 'saved', savedAt: data.updatedAt });
      }
      return;
    }
    const kept: NotebookConflictView[] = [
      { conflictId: data.conflictId, doc, baseVersion: versionRef.current, savedByName: 'you', createdAt: new Date().toISOString() },
    ];
    if (dirtyRef.current) {
      // Typing continued while the save was on its way: keep that newest text as well.
      dirtyRef.current = false;
      const latest = plainDoc(editor.getJSON());
      try {
        const again = await saveNotebookAction({ trialId, variantId, baseVersion: versionRef.current, doc: latest });
        if (again.ok && again.data.status === 'conflict') {
          kept.push({ conflictId: again.data.conflictId, doc: latest, baseVersion: versionRef.current, savedByName: 'you', createdAt: new Date().toISOString() });
        }
      } catch {
        dirtyRef.current = true;
      }
    }
    lockForConflict(editor, kept, data.current);
  }, [editor, trialId, variantId, scheduleRetry, lockForConflict]);

  useEffect(() => {
    saveNowRef.current = saveNow;
    openLinkRef.current = () => setLinkOpen(true);
  }, [saveNow]);

  // Save when the tab is hidden, retry when the connection returns, warn before leaving unsaved text.
  useEffect(() => {
    const onHidden = () => {
      if (document.visibilityState === 'hidden') void saveNowRef.current();
    };
    const onOnline = () => {
      if (dirtyRef.current) void saveNowRef.current();
    };
    document.addEventListener('visibilitychange', onHidden);
    window.addEventListener('online', onOnline);
    return () => {
      document.removeEventListener('visibilitychange', onHidden);
      window.removeEventListener('online', onOnline);
    };
  }, []);

  const unsaved = hasUnsavedWork(saveState);
  useEffect(() => {
    if (!unsaved) return;
    const warn = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      e.returnValue = '';
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [unsaved]);

  useEffect(
    () => () => {
      if (debounceRef.current) clearTimeout(debounceRef.current);
      if (retryRef.current) clearTimeout(retryRef.current);
    },
    [],
  );

  const resolve = async (keep: 'mine' | 'theirs' | 'both') => {
    const conflict = conflicts[0];
    if (!conflict || !editor) return;
    setResolving(true);
    setResolveError(null);
    try {
      const result = await resolveNotebookConflictAction({ conflictId: conflict.conflictId, keep });
      if (!result.ok) {
        setResolveError(result.error);
        return;
      }
      const entry = result.data.entry;
      editor.commands.setContent(sanitizeDoc(entry.doc), { emitUpdate: false });
      versionRef.current = entry.version;
      dirtyRef.current = false;
      setCurrent({ doc: entry.doc, updatedAt: entry.updatedAt, updatedByName: entry.updatedByName });
      setConflicts(entry.conflicts);
      if (entry.conflicts.length === 0) {
        lockedRef.current = false;
        editor.setEditable(true);
        setSaveState(entry.updatedAt ? { kind: 'saved', savedAt: entry.updatedAt } : { kind: 'idle', savedAt: null });
      }
    } catch {
      setResolveError('The choice did not reach the server. Check the connection and try again; both versions are still kept.');
    } finally {
      setResolving(false);
    }
  };

  // Oldest first, as the server lists them; each is resolved in turn.
  const activeConflict = conflicts[0];

  return (
    <section aria-label={title ?? 'Notebook'} className="rounded-card bg-pith-50 shadow-card ring-1 ring-pith-300">
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-pith-300 px-4 py-2">
        {title ? <h2 className="text-lg font-semibold">{title}</h2> : <span />}
        <p aria-live="polite" role="status" data-testid="notebook-save-state" className={`text-sm ${saveState.kind === 'error' ? 'text-ember-700' : saveState.kind === 'offline' || saveState.kind === 'conflict' ? 'text-amberline-700' : 'text-rind-500'}`}>
          {saveStateLabel(saveState)}
        </p>
      </header>

      {activeConflict ? (
        <ConflictPanel mine={activeConflict} theirs={current} busy={resolving} error={resolveError} remaining={conflicts.length} onKeep={resolve} />
      ) : null}

      {editor && !activeConflict ? (
        <Toolbar editor={editor} trialId={trialId} variantId={variantId} linkOpen={linkOpen} setLinkOpen={setLinkOpen} />
      ) : null}
      <EditorContent editor={editor} className={activeConflict ? 'opacity-60' : ''} />
    </section>
  );
}

function ConflictPanel({
  mine,
  theirs,
  busy,
  error,
  remaining,
  onKeep,
}: {
  mine: NotebookConflictView;
  theirs: EntrySnapshot;
  busy: boolean;
  error: string | null;
  remaining: number;
  onKeep: (keep: 'mine' | 'theirs' | 'both') => void;
}) {
  const theirsBy = theirs.updatedByName ?? 'Someone';
  return (
    <div role="region" aria-label="Parallel edit" className="border-b border-amberline-100 bg-amberline-50 px-4 py-4">
      <p role="alert" className="font-semibold text-amberline-700">
        Someone else saved this entry while you were writing. Nothing is lost: your version is kept beside theirs.
      </p>
      {remaining > 1 ? <p className="mt-1 text-sm text-amberline-700">{remaining} parallel versions are kept; you choose for each in turn.</p> : null}
      <div className="mt-3 grid gap-3 md:grid-cols-2">
        <VersionCard label={mine.savedByName === 'you' ? `Your version (${clockTime(mine.createdAt)})` : `Kept version by ${mine.savedByName} (${clockTime(mine.createdAt)})`} testId="conflict-mine">
          <NotebookView doc={mine.doc} />
        </VersionCard>
        <VersionCard label={`Their version by ${theirsBy}${theirs.updatedAt ? ` (${clockTime(theirs.updatedAt)})` : ''}`} testId="conflict-theirs">
          <NotebookView doc={theirs.doc} />
        </VersionCard>
      </div>
      {error ? <p role="alert" className="mt-2 text-sm text-ember-700">{error}</p> : null}
      <div className="mt-3 flex flex-wrap gap-2">
        <ChoiceButton onClick={() => onKeep('mine')} disabled={busy}>Keep mine</ChoiceButton>
        <ChoiceButton onClick={() => onKeep('theirs')} disabled={busy}>Keep theirs</ChoiceButton>
        <ChoiceButton onClick={() => onKeep('both')} disabled={busy} primary>Keep both</ChoiceButton>
      </div>
    </div>
  );
}

function VersionCard({ label, testId, children }: { label: string; testId: string; children: ReactNode }) {
  return (
    <article aria-label={label} data-testid={testId} className="min-w-0 rounded-lg bg-pith-50 p-3 ring-1 ring-pith-300">
      <h3 className="mb-2 text-sm font-semibold text-rind-600">{label}</h3>
      <div className="max-h-96 overflow-y-auto">{children}</div>
    </article>
  );
}

function ChoiceButton({ children, onClick, disabled, primary = false }: { children: ReactNode; onClick: () => void; disabled: boolean; primary?: boolean }) {
  return (
    <button
      type="button"
      onClick={onClick}
      disabled={disabled}
      className={`inline-flex min-h-10 items-center rounded-lg px-4 py-2 text-sm font-semibold disabled:cursor-not-allowed disabled:opacity-60 ${primary ? 'bg-damson-700 text-pith-50 hover:bg-damson-800' : 'bg-pith-50 text-damson-800 ring-1 ring-inset ring-damson-200 hover:bg-damson-50'}`}
    >
      {children}
    </button>
  );
}

const noSubscription = () => () => undefined;

/** "⌘" on Apple devices, "Ctrl" elsewhere; "Ctrl" on the server so hydration matches. */
function useModifierLabel(): string {
  return useSyncExternalStore(
    noSubscription,
    () => (/Mac|iPhone|iPad/.test(navigator.platform || navigator.userAgent) ? '⌘' : 'Ctrl'),
    () => 'Ctrl',
  );
}

function Toolbar({
  editor,
  trialId,
  variantId,
  linkOpen,
  setLinkOpen,
}: {
  editor: Editor;
  trialId: string;
  variantId: string | null;
  linkOpen: boolean;
  setLinkOpen: (open: boolean) => void;
}) {
  const mod = useModifierLabel();
  const [confirmDeleteTable, setConfirmDeleteTable] = useState(false);
  const [upload, setUpload] = useState<{ name: string; fraction: number } | null>(null);
  const [uploadError, setUploadError] = useState<string | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const state = useEditorState({
    editor,
    selector: ({ editor: e }) => ({
      h2: e.isActive('heading', { level: 2 }),
      h3: e.isActive('heading', { level: 3 }),
      bold: e.isActive('bold'),
      italic: e.isActive('italic'),
      underline: e.isActive('underline'),
      bullet: e.isActive('bulletList'),
      ordered: e.isActive('orderedList'),
      task: e.isActive('taskList'),
      link: e.isActive('link'),
      inTable: e.isActive('table'),
      canUndo: e.can().undo(),
      canRedo: e.can().redo(),
    }),
  });

  const chain = () => editor.chain().focus();

  const onPhotoChosen = async (file: File | undefined) => {
    if (!file) return;
    setUploadError(null);
    setUpload({ name: file.name, fraction: 0 });
    const outcome = await uploadPhoto(trialId, variantId, file, (fraction) => setUpload({ name: file.name, fraction }));
    setUpload(null);
    if (fileInput.current) fileInput.current.value = '';
    if (!outcome.ok) {
      setUploadError(`${file.name} was not added: ${outcome.message}`);
      return;
    }
    if (outcome.upload.kind !== 'photo') {
      setUploadError(`${file.name} was stored as a file, not a photo, so it cannot be shown inline.`);
      return;
    }
    chain().setImage({ src: outcome.upload.url, alt: file.name }).run();
  };

  return (
    <div className="border-b border-pith-300 bg-pith-100 px-2 py-1">
      <div role="toolbar" aria-label="Formatting" className="flex flex-wrap items-center gap-1">
        <ToolButton label="Heading 2" shortcut={`${mod}+Alt+2`} active={state.h2} onClick={() => chain().toggleHeading({ level: 2 }).run()}>H2</ToolButton>
        <ToolButton label="Heading 3" shortcut={`${mod}+Alt+3`} active={state.h3} onClick={() => chain().toggleHeading({ level: 3 }).run()}>H3</ToolButton>
        <Divider />
        <ToolButton label="Bold" shortcut={`${mod}+B`} active={state.bold} onClick={() => chain().toggleBold().run()}><b>B</b></ToolButton>
        <ToolButton label="Italic" shortcut={`${mod}+I`} active={state.italic} onClick={() => chain().toggleItalic().run()}><i>I</i></ToolButton>
        <ToolButton label="Underline" shortcut={`${mod}+U`} active={state.underline} onClick={() => chain().toggleUnderline().run()}><u>U</u></ToolButton>
        <Divider />
        <ToolButton label="Bullet list" shortcut={`${mod}+Shift+8`} active={state.bullet} onClick={() => chain().toggleBulletList().run()}>• List</ToolButton>
        <ToolButton label="Numbered list" shortcut={`${mod}+Shift+7`} active={state.ordered} onClick={() => chain().toggleOrderedList().run()}>1. List</ToolButton>
        <ToolButton label="Checklist" shortcut={`${mod}+Shift+9`} active={state.task} onClick={() => chain().toggleTaskList().run()}>☑ Checks</ToolButton>
        <Divider />
        <ToolButton label="Insert table (3 × 3)" onClick={() => chain().insertTable({ rows: 3, cols: 3, withHeaderRow: true }).run()}>Table</ToolButton>
        <ToolButton label="Add table row below" disabled={!state.inTable} onClick={() => chain().addRowAfter().run()}>+ Row</ToolButton>
        <ToolButton label="Add table column to the right" disabled={!state.inTable} onClick={() => chain().addColumnAfter().run()}>+ Column</ToolButton>
        <ToolButton label="Delete table" disabled={!state.inTable} onClick={() => setConfirmDeleteTable(true)}>Delete table</ToolButton>
        <Divider />
        <ToolButton label="Link" shortcut={`${mod}+K`} active={state.link || linkOpen} onClick={() => setLinkOpen(!linkOpen)}>Link</ToolButton>
        <ToolButton label="Insert photo" disabled={upload !== null} onClick={() => fileInput.current?.click()}>Photo</ToolButton>
        <input
          ref={fileInput}
          type="file"
          accept={PHOTO_TYPES}
          className="sr-only"
          tabIndex={-1}
          aria-label="Choose a photo to insert"
          onChange={(e) => void onPhotoChosen(e.target.files?.[0])}
        />
        <Divider />
        <ToolButton label="Undo" shortcut={`${mod}+Z`} disabled={!state.canUndo} onClick={() => chain().undo().run()}>↶</ToolButton>
        <ToolButton label="Redo" shortcut={`${mod}+Shift+Z`} disabled={!state.canRedo} onClick={() => chain().redo().run()}>↷</ToolButton>
      </div>
      {upload ? (
        <p role="status" className="px-1 py-1 text-sm text-rind-600">
          Uploading… {upload.name} ({Math.round(upload.fraction * 100)} %)
          <progress className="ml-2 align-middle" max={1} value={upload.fraction} aria-label={`Upload progress of ${upload.name}`} />
        </p>
      ) : null}
      {uploadError ? (
        <p role="alert" className="px-1 py-1 text-sm text-ember-700">
          {uploadError}{' '}
          <button type="button" className="underline" onClick={() => setUploadError(null)}>
            Dismiss
          </button>
        </p>
      ) : null}
      {linkOpen ? <LinkForm editor={editor} onClose={() => setLinkOpen(false)} /> : null}
      <ConfirmDialog
        open={confirmDeleteTable}
        title="Delete this table?"
        body="The whole table and everything in its cells is removed. Undo brings it back."
        confirmLabel="Delete table"
        onCancel={() => setConfirmDeleteTable(false)}
        onConfirm={() => {
          chain().deleteTable().run();
          setConfirmDeleteTable(false);
        }}
      />
    </div>
  );
}

function LinkForm({ editor, onClose }: { editor: Editor; onClose: () => void }) {
  const id = useId();
  const [value, setValue] = useState(() => String(editor.getAttributes('link').href ?? ''));
  const [error, setError] = useState<string | null>(null);
  const apply = () => {
    const outcome = normaliseLinkInput(value, isAllowedLinkHref);
    if (!outcome.ok) {
      setError(outcome.message);
      return;
    }
    const { empty } = editor.state.selection;
    if (empty && !editor.isActive('link')) {
      editor.chain().focus().insertContent({ type: 'text', text: outcome.href, marks: [{ type: 'link', attrs: { href: outcome.href } }] }).run();
    } else {
      editor.chain().focus().extendMarkRange('link').setLink({ href: outcome.href }).run();
    }
    onClose();
  };
  return (
    <form
      className="flex flex-wrap items-end gap-2 px-1 py-2"
      onSubmit={(e) => {
        e.preventDefault();
        apply();
      }}
    >
      <label htmlFor={`${id}-href`} className="flex min-w-64 flex-1 flex-col text-sm font-medium">
        Link address
        <input
          id={`${id}-href`}
          autoFocus
          value={value}
          onChange={(e) => {
            setValue(e.target.value);
            setError(null);
          }}
          onKeyDown={(e) => {
            if (e.key === 'Escape') onClose();
          }}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          placeholder="https://…"
          className="mt-1 rounded-md border border-pith-300 bg-white px-2 py-1 font-normal"
        />
      </label>
      <button type="submit" className="rounded-md bg-damson-700 px-3 py-1.5 text-sm font-semibold text-pith-50">Apply link</button>
      {editor.isActive('link') ? (
        <button
          type="button"
          className="rounded-md px-3 py-1.5 text-sm text-damson-700 ring-1 ring-inset ring-damson-200"
          onClick={() => {
            editor.chain().focus().extendMarkRange('link').unsetLink().run();
            onClose();
          }}
        >
          Remove link
        </button>
      ) : null}
      <button type="button" className="rounded-md px-3 py-1.5 text-sm text-rind-600" onClick={onClose}>Cancel</button>
      {error ? <p id={`${id}-error`} role="alert" className="basis-full text-sm text-ember-700">{error}</p> : null}
    </form>
  );
}

function ToolButton({
  label,
  shortcut,
  active,
  disabled = false,
  onClick,
  children,
}: {
  label: string;
  shortcut?: string;
  active?: boolean;
  disabled?: boolean;
  onClick: () => void;
  children: ReactNode;
}) {
  return (
    <button
      type="button"
      aria-label={label}
      title={shortcut ? `${label} (${shortcut})` : label}
      aria-pressed={active === undefined ? undefined : active}
      disabled={disabled}
      // Keep the editor's selection: a mouse-down on the button would otherwise blur it first.
      onMouseDown={(e) => e.preventDefault()}
      onClick={onClick}
      className={`inline-flex min-h-9 min-w-9 items-center justify-center rounded-md px-2 text-sm transition-colors disabled:cursor-not-allowed disabled:opacity-40 ${active === true ? 'bg-damson-100 text-damson-900' : 'text-rind-700 hover:bg-pith-200'}`}
    >
      {children}
    </button>
  );
}

function Divider() {
  return <span aria-hidden="true" className="mx-1 h-6 w-px bg-pith-300" />;
}
