/**
 * A stored notebook document, read-only, rendered through the editor's schema with Tiptap's
 * static renderer: React elements only, never an HTML string. The document is cleaned first
 * (unknown nodes, attributes and unsafe addresses dropped), so even an old or hand-edited row
 * cannot inject markup. Works on the server (print views) and in the browser.
 */
import type { ReactNode } from 'react';
import { renderToReactElement } from '@tiptap/static-renderer/pm/react';
import { notebookExtensions } from './extensions';
import { type TiptapDoc, type TiptapNode } from '@/lib/notebook/shape';
import { linkPresentation } from '@/lib/notebook/links';
import { sanitizeDoc } from '@/lib/notebook/document';

/** Our own prose styles, applied to the plain elements the renderer produces. */
export const NOTEBOOK_PROSE_CLASS = [
  'text-base leading-relaxed text-rind-800 break-words',
  '[&_p]:my-2',
  '[&_h1]:mt-5 [&_h1]:mb-2 [&_h1]:font-display [&_h1]:text-2xl [&_h1]:font-semibold [&_h1]:text-damson-900',
  '[&_h2]:mt-4 [&_h2]:mb-2 [&_h2]:font-display [&_h2]:text-xl [&_h2]:font-semibold [&_h2]:text-damson-900',
  '[&_h3]:mt-3 [&_h3]:mb-1 [&_h3]:text-lg [&_h3]:font-semibold [&_h3]:text-damson-800',
  '[&_ul]:my-2 [&_ul]:list-disc [&_ul]:pl-6 [&_ol]:my-2 [&_ol]:list-decimal [&_ol]:pl-6',
  '[&_ul[data-type=taskList]]:list-none [&_ul[data-type=taskList]]:pl-1',
  '[&_blockquote]:my-3 [&_blockquote]:border-l-4 [&_blockquote]:border-quince-300 [&_blockquote]:pl-4 [&_blockquote]:text-rind-600',
  '[&_pre]:my-3 [&_pre]:overflow-x-auto [&_pre]:rounded-lg [&_pre]:bg-pith-200 [&_pre]:p-3 [&_pre]:font-mono [&_pre]:text-sm',
  '[&_code]:rounded [&_code]:bg-pith-200 [&_code]:px-1 [&_code]:font-mono [&_code]:text-sm',
  '[&_hr]:my-4 [&_hr]:border-pith-300',
  '[&_a]:text-damson-700 [&_a]:underline [&_a]:underline-offset-2',
  '[&_table]:my-3 [&_table]:w-full [&_table]:border-collapse [&_table]:text-sm',
  '[&_td]:border [&_td]:border-rind-300 [&_td]:px-2 [&_td]:py-1 [&_td]:align-top',
  '[&_th]:border [&_th]:border-rind-300 [&_th]:bg-pith-200 [&_th]:px-2 [&_th]:py-1 [&_th]:text-left [&_th]:font-semibold',
  '[&_img]:my-3 [&_img]:max-h-[28rem] [&_img]:max-w-full [&_img]:rounded-lg',
].join(' ');

type RenderedNode = { attrs: Record<string, unknown> };

const CELL_ALIGN_CLASS: Record<string, string> = { left: 'text-left', center: 'text-center', right: 'text-right' };

/** Spans (already bounded by sanitizeDoc) and alignment as a class, never a style attribute. */
function cellProps(node: RenderedNode): { colSpan?: number; rowSpan?: number; className?: string } {
  const { colspan, rowspan, align } = node.attrs;
  return {
    ...(typeof colspan === 'number' && colspan > 1 ? { colSpan: colspan } : {}),
    ...(typeof rowspan === 'number' && rowspan > 1 ? { rowSpan: rowspan } : {}),
    ...(typeof align === 'string' && Object.hasOwn(CELL_ALIGN_CLASS, align) ? { className: CELL_ALIGN_CLASS[align] } : {}),
  };
}

export function renderNotebookDoc(doc: unknown): ReactNode {
  return renderToReactElement({
    content: sanitizeDoc(doc),
    extensions: notebookExtensions(),
    options: {
      nodeMapping: {
        // Tables without the editor's column group and widths: those are style attributes, which the
        // CSP refuses, and the tables take the page's width anyway.
        table: ({ children }: { children?: ReactNode }) => (
          <table>
            <tbody>{children}</tbody>
          </table>
        ),
        tableCell: ({ node, children }: { node: RenderedNode; children?: ReactNode }) => <td {...cellProps(node)}>{children}</td>,
        tableHeader: ({ node, children }: { node: RenderedNode; children?: ReactNode }) => <th {...cellProps(node)}>{children}</th>,
        // Checkboxes become ☐/☑ so they print and read the same everywhere.
        taskItem: ({ node, children }: { node: RenderedNode; children?: ReactNode }) => {
          const checked = node.attrs.checked === true;
          return (
            <li data-checked={checked ? 'true' : 'false'} className="my-1 flex items-start gap-2">
              <span aria-label={checked ? 'Done' : 'Not done'} role="img" className="select-none leading-relaxed">
                {checked ? '☑' : '☐'}
              </span>
              <div className="min-w-0 flex-1 [&_p]:my-0">{children}</div>
            </li>
          );
        },
        // Images open at full size from their own (authorised, same-site) address.
        image: ({ node }: { node: RenderedNode }) => {
          const src = String(node.attrs.src);
          const alt = typeof node.attrs.alt === 'string' ? node.attrs.alt : '';
          return (
            <a href={src} target="_blank" rel="noopener noreferrer" className="block w-fit">
              {/* eslint-disable-next-line @next/next/no-img-element -- uploads are served authorised by the app, not through next/image */}
              <img src={src} alt={alt} title={typeof node.attrs.title === 'string' ? node.attrs.title : undefined} loading="lazy" />
            </a>
          );
        },
      },
      markMapping: {
        link: ({ mark, children }: { mark: RenderedNode; children?: ReactNode }) => {
          const href = String(mark.attrs.href);
          return (
            <a href={href} {...linkPresentation(href)}>
              {children}
            </a>
          );
        },
      },
    },
  });
}

function isBlank(doc: TiptapDoc): boolean {
  const hasText = (n: TiptapNode): boolean =>
    Boolean(n.text?.trim()) || n.type === 'image' || n.type === 'table' || n.type === 'horizontalRule' || (n.content ?? []).some((c) => hasText(c));
  return !hasText(doc);
}

export function NotebookView({ doc, emptyLabel = 'Nothing written yet.', className = '' }: { doc: unknown; emptyLabel?: string; className?: string }) {
  const clean = sanitizeDoc(doc);
  if (isBlank(clean)) return <p className={`text-sm italic text-rind-500 ${className}`}>{emptyLabel}</p>;
  return <div className={`${NOTEBOOK_PROSE_CLASS} ${className}`}>{renderNotebookDoc(clean)}</div>;
}
