/**
 * The one list of Tiptap extensions the notebook uses: the editor, the read-only view and the
 * save check all agree on the same node and mark types.
 */
import type { Extensions } from '@tiptap/core';
import StarterKit from '@tiptap/starter-kit';
import { TaskItem, TaskList } from '@tiptap/extension-list';
import { TableKit } from '@tiptap/extension-table';
import Image from '@tiptap/extension-image';
import { isAllowedLinkHref } from '@/lib/notebook/schema';

export function notebookExtensions(): Extensions {
  return [
    StarterKit.configure({
      heading: { levels: [1, 2, 3] },
      link: {
        openOnClick: false,
        autolink: true,
        defaultProtocol: 'https',
        // The same rule the server applies, so the editor never creates a link the save refuses.
        isAllowedUri: (url) => isAllowedLinkHref(url),
      },
    }),
    TaskList,
    TaskItem.configure({ nested: true }),
    TableKit.configure({ table: { resizable: false } }),
    Image.configure({ inline: false, allowBase64: false }),
  ];
}
