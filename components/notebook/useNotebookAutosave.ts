'use client';

/**
 * The notebook's saving: autosave after a pause, on blur, when the tab hides and when the
 * connection returns; retries with back-off; a save that arrives after someone else's is kept
 * beside theirs and locks the editor until the writer chooses. Nothing typed is dropped.
 */
import { useCallback, useEffect, useRef, useState, type RefObject } from 'react';
import type { Editor } from '@tiptap/react';
import { resolveNotebookConflictAction, saveNotebookAction } from '@/lib/notebook/actions';
import { type TiptapDoc } from '@/lib/notebook/shape';
import { sanitizeDoc } from '@/lib/notebook/document';
import { type NotebookConflictView } from '@/lib/notebook/schema';
import { AUTOSAVE_DELAY_MS, hasUnsavedWork, retryDelayMs, type SaveState } from '@/lib/notebook/autosave';
import { useUnsavedWarning } from '@/components/ui/useUnsavedWarning';
import type { EntrySnapshot } from './ConflictPanel';

export interface NotebookInitial {
  doc: TiptapDoc;
  version: number;
  updatedAt: string | null;
  updatedByName: string | null;
  conflicts: NotebookConflictView[];
}

/**
 * Tiptap builds some attrs objects without Object.prototype; React's server-action encoding
 * sends such objects as opaque references, so the server would see no attrs at all.
 * A JSON round trip gives plain objects.
 */
function plainDoc(json: unknown): TiptapDoc {
  return JSON.parse(JSON.stringify(json)) as TiptapDoc;
}

export function useNotebookAutosave({ trialId, variantId, initial, editorRef }: { trialId: string; variantId: string | null; initial: NotebookInitial; editorRef: RefObject<Editor | null> }) {
  const [saveState, setSaveState] = useState<SaveState>({ kind: 'idle', savedAt: initial.updatedAt });
  const [conflicts, setConflicts] = useState<NotebookConflictView[]>(initial.conflicts);
  const [current, setCurrent] = useState<EntrySnapshot>({ doc: initial.doc, updatedAt: initial.updatedAt, updatedByName: initial.updatedByName });
  const [resolving, setResolving] = useState(false);
  const [resolveError, setResolveError] = useState<string | null>(null);

  const versionRef = useRef(initial.version);
  const dirtyRef = useRef(false);
  const inFlightRef = useRef(false);
  const lockedRef = useRef(initial.conflicts.length > 0);
  const debounceRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  const retryRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  const attemptRef = useRef(0);
  const saveNowRef = useRef<() => Promise<void>>(async () => undefined);

  /** The editor's onUpdate: mark the text unsaved and save after a pause. */
  const noteChange = useCallback(() => {
    if (lockedRef.current) return;
    dirtyRef.current = true;
    setSaveState((s) => (s.kind === 'saving' || s.kind === 'offline' ? s : { kind: 'dirty' }));
    if (debounceRef.current) clearTimeout(debounceRef.current);
    debounceRef.current = setTimeout(() => void saveNowRef.current(), AUTOSAVE_DELAY_MS);
  }, []);

  const scheduleRetry = useCallback(() => {
    if (retryRef.current) clearTimeout(retryRef.current);
    attemptRef.current += 1;
    const delay = retryDelayMs(attemptRef.current);
    retryRef.current = setTimeout(() => void saveNowRef.current(), delay);
  }, []);

  const lockForConflict = useCallback((ed: Editor, next: NotebookConflictView[], snapshot: EntrySnapshot) => {
    lockedRef.current = true;
    ed.setEditable(false);
    setConflicts(next);
    setCurrent(snapshot);
    setSaveState({ kind: 'conflict' });
  }, []);

  const saveNow = useCallback(async () => {
    if (debounceRef.current) clearTimeout(debounceRef.current);
    debounceRef.current = null;
    const editor = editorRef.current;
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
  }, [editorRef, trialId, variantId, scheduleRetry, lockForConflict]);

  useEffect(() => {
    saveNowRef.current = saveNow;
  }, [saveNow]);

  // Save when the tab is hidden and retry when the connection returns.
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

  useUnsavedWarning(hasUnsavedWork(saveState));

  useEffect(
    () => () => {
      if (debounceRef.current) clearTimeout(debounceRef.current);
      if (retryRef.current) clearTimeout(retryRef.current);
    },
    [],
  );

  const resolve = async (keep: 'mine' | 'theirs' | 'both') => {
    const conflict = conflicts[0];
    const editor = editorRef.current;
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

  return { saveState, conflicts, current, resolving, resolveError, resolve, noteChange, saveNowRef };
}
