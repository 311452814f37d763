/**
 * The one list of Tiptap extensions the notebook uses: the editor, the read-only view and the
 * save check all agree on the same node and mark types.
 */
import type { Extensions } from '@tiptap/core';
import StarterKit from '@tiptap/starter-kit';
import Link from '@tiptap/extension-link';
import { TaskItem, TaskList } from '@tiptap/extension-list';
import { TableKit } from '@tiptap/extension-table';
import Image from '@tiptap/extension-image';
import { isAllowedLinkHref, linkPresentation } from '@/lib/notebook/links';

/**
 * Links whose target and rel are ours: never read from pasted HTML or a stored document, always
 * rendered from the address (linkPresentation), the same as the read-only view.
 */
const NotebookLink = Link.extend({
  addAttributes() {
    const ignored = { default: null, parseHTML: () => null, renderHTML: () => ({}) };
    return {
      ...this.parent?.(),
      target: { default: null, parseHTML: () => null, renderHTML: (attrs: Record<string, unknown>) => linkPresentation(String(attrs.href ?? '')) },
      rel: ignored,
      class: ignored,
    };
  },
}).configure({
  openOnClick: false,
  autolink: true,
  defaultProtocol: 'https',
  // No fixed target/rel/class from Tiptap's defaults either: the target attribute above renders them.
  HTMLAttributes: { target: null, rel: null, class: null },
  // The same rule the server applies, so the editor never creates a link the save refuses.
  isAllowedUri: (url) => isAllowedLinkHref(url),
});

export function notebookExtensions(): Extensions {
  return [
    StarterKit.configure({ heading: { levels: [1, 2, 3] }, link: false }),
    NotebookLink,
    TaskList,
    TaskItem.configure({ nested: true }),
    TableKit.configure({ table: { resizable: false } }),
    Image.configure({ inline: false, allowBase64: false }),
  ];
}
