/**
 * The largest notebook document the save check accepts: every limit in NOTEBOOK_LIMITS reached at
 * once (the most nodes and exactly the most bytes, a text run of the longest length, the widest
 * and tallest table, the deepest nesting, every photo). The
 * bound test renders it on the server and in the editor, and `npm run bench` times it.
 * Pure: no framework.
 */
import { NOTEBOOK_LIMITS as L, type TiptapDoc, type TiptapNode } from './shape';

const PHOTO = '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d';
const text = (t: string): TiptapNode => ({ type: 'text', text: t });
const para = (t: string): TiptapNode => ({ type: 'paragraph', content: [text(t)] });

function countNodes(node: TiptapNode): number {
  return 1 + (node.content ?? []).reduce((n, c) => n + countNodes(c), 0);
}

function byteSize(doc: TiptapDoc): number {
  return new TextEncoder().encode(JSON.stringify(doc)).length;
}

export function largestNotebookDoc(): TiptapDoc {
  const blocks: TiptapNode[] = [];

  // Nested to the deepest level: doc > blockquote × (maxDepth − 3) > paragraph > text.
  let deep: TiptapNode = para('Deepest note');
  for (let i = 0; i < L.maxDepth - 3; i += 1) deep = { type: 'blockquote', content: [deep] };
  blocks.push(deep);

  // One cell spanning the widest and tallest table, with a width for every column.
  const spanned: TiptapNode = {
    type: 'tableHeader',
    attrs: { colspan: L.maxTableColumns, rowspan: L.maxRowspan, colwidth: Array.from({ length: L.maxTableColumns }, () => L.maxLengthPx), align: 'center' },
    content: [para('Spans every row and column')],
  };
  blocks.push({ type: 'table', content: [{ type: 'tableRow', content: [spanned] }, ...Array.from({ length: L.maxTableRows - 1 }, () => ({ type: 'tableRow', content: [] }))] });

  // A full-width table of real cells.
  const cell = (r: number, c: number): TiptapNode => ({ type: r === 0 ? 'tableHeader' : 'tableCell', attrs: { colspan: 1, rowspan: 1, colwidth: null, align: null }, content: [para(`${r}.${c}`)] });
  blocks.push({ type: 'table', content: Array.from({ length: 2 }, (_, r) => ({ type: 'tableRow', content: Array.from({ length: L.maxTableColumns }, (_, c) => cell(r, c)) })) });

  // Every photo an entry may hold, at the largest size attributes.
  const caption = 'Set test on a cold saucer, '.repeat(40).slice(0, L.maxAttrChars);
  for (let i = 0; i < L.maxImages; i += 1) {
    blocks.push({ type: 'image', attrs: { src: PHOTO, alt: i === 0 ? caption : `Jar ${i + 1}`, title: i === 0 ? caption : null, width: L.maxLengthPx, height: L.maxLengthPx } });
  }

  // Headings at every level, the highest list start, every mark on one run, a long link.
  for (const level of L.headingLevels) blocks.push({ type: 'heading', attrs: { level }, content: [text(`Heading ${level}`)] });
  blocks.push({ type: 'orderedList', attrs: { start: L.maxListStart, type: 'i' }, content: [{ type: 'listItem', content: [para('Last step')] }] });
  const href = `https://example.org/${'a'.repeat(L.maxHrefChars - 'https://example.org/'.length)}`;
  blocks.push({
    type: 'paragraph',
    content: [
      { type: 'text', text: 'Every mark', marks: [{ type: 'bold' }, { type: 'italic' }, { type: 'underline' }, { type: 'strike' }, { type: 'code' }, { type: 'link', attrs: { href, title: caption } }] },
    ],
  });
  blocks.push({ type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: true }, content: [para('Jars labelled')] }] });
  blocks.push({ type: 'codeBlock', attrs: { language: 'text' }, content: [text('Brix 65.0 at 20 °C')] });
  blocks.push({ type: 'horizontalRule' });

  const fixed = blocks.length;
  // Then the cheapest nodes, line breaks, and text runs (one byte per character, every other one
  // bold so they stay separate runs) filling the bytes that are left.
  for (let runs = 1; ; runs += 1) {
    blocks.length = fixed;
    const doc: TiptapDoc = { type: 'doc', content: blocks };
    const breaks = L.maxNodes - countNodes(doc) - 2 - runs;
    blocks.push({ type: 'paragraph', content: Array.from({ length: breaks }, () => ({ type: 'hardBreak' })) });
    const padding: TiptapNode[] = Array.from({ length: runs }, (_, i) => ({ type: 'text', text: 'x', ...(i % 2 ? { marks: [{ type: 'bold' }] } : {}) }));
    blocks.push({ type: 'paragraph', content: padding });
    let room = L.maxDocBytes - byteSize(doc);
    if (room > runs * (L.maxTextChars - 1)) continue;
    for (const run of padding) {
      const extra = Math.min(L.maxTextChars - 1, room);
      run.text += 'Pectin '.repeat(Math.ceil(extra / 7)).slice(0, extra);
      room -= extra;
    }
    return doc;
  }
}

/** Sizes of a document, for test output and the bench. */
export function docFigures(doc: TiptapDoc): { nodes: number; bytes: number } {
  return { nodes: countNodes(doc), bytes: byteSize(doc) };
}
