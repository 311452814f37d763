'use client';

/** The notebook's formatting toolbar: headings, marks, lists, tables, links and photos, each with its shortcut. */
import { useId, useRef, useState, useSyncExternalStore, type ReactNode } from 'react';
import { useEditorState, type Editor } from '@tiptap/react';
import { isAllowedLinkHref } from '@/lib/notebook/links';
import { normaliseLinkInput } from '@/lib/notebook/autosave';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { uploadPhoto } from './uploadImage';

const PHOTO_TYPES = 'image/jpeg,image/png,image/webp';

const noSubscription = () => () => undefined;

/** "⌘" on Apple devices, "Ctrl" elsewhere; "Ctrl" on the server so hydration matches. */
function useModifierLabel(): string {
  return useSyncExternalStore(
    noSubscription,
    () => (/Mac|iPhone|iPad/.test(navigator.platform || navigator.userAgent) ? '⌘' : 'Ctrl'),
    () => 'Ctrl',
  );
}

export function NotebookToolbar({
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
