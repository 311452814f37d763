'use client';

/**
 * The notebook editor of a trial or one of its variants: rich text with our own toolbar,
 * autosave, inline photos through the uploads API, and conflict-keeping. A save that arrives
 * after someone else's is stored beside theirs on the server; the writer then chooses.
 */
import { useEffect, useRef, useState } from 'react';
import { Extension } from '@tiptap/core';
import { EditorContent, useEditor, type Editor } from '@tiptap/react';
import { sanitizeDoc } from '@/lib/notebook/document';
import { clockTime, saveStateLabel } from '@/lib/notebook/autosave';
import { notebookExtensions } from './extensions';
import { NOTEBOOK_PROSE_CLASS, NotebookView } from './NotebookView';
import { ConflictPanel } from './ConflictPanel';
import { NotebookToolbar } from './NotebookToolbar';
import { useNotebookAutosave, type NotebookInitial } from './useNotebookAutosave';

export interface NotebookEditorProps {
  trialId: string;
  variantId: string | null;
  initial: NotebookInitial;
  canEdit: boolean;
  title?: string;
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
  const [linkOpen, setLinkOpen] = useState(false);
  const editorRef = useRef<Editor | null>(null);
  const openLinkRef = useRef<() => void>(() => undefined);
  const { saveState, conflicts, current, resolving, resolveError, resolve, noteChange, saveNowRef } = useNotebookAutosave({ trialId, variantId, initial, editorRef });

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
    onUpdate: noteChange,
    onBlur: () => void saveNowRef.current(),
  });

  useEffect(() => {
    editorRef.current = editor;
    openLinkRef.current = () => setLinkOpen(true);
  }, [editor]);

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
        <NotebookToolbar editor={editor} trialId={trialId} variantId={variantId} linkOpen={linkOpen} setLinkOpen={setLinkOpen} />
      ) : null}
      <EditorContent editor={editor} className={activeConflict ? 'opacity-60' : ''} />
    </section>
  );
}
