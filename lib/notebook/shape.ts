/** A notebook document's shape (Tiptap's JSON) and the ceilings on everything that drives rendering. */

/**
 * Every number and size that drives rendering has a ceiling (project limits with room for a lab
 * notebook; no published source). A stored document within them renders on the server and in the
 * editor in well under a second (`npm run bench`, notebook.* lines); the test building the largest
 * accepted document is tests/unit/notebook/bounds.test.tsx.
 */
export const NOTEBOOK_LIMITS = {
  /** Nesting levels of nodes, the doc itself counting as 1. */
  maxDepth: 30,
  /** Size of the document as UTF-8 JSON, in bytes (200 kB). */
  maxDocBytes: 200_000,
  /** Nodes of every kind (text runs, paragraphs, cells …), the doc included. */
  maxNodes: 5_000,
  /** Characters in one text run. */
  maxTextChars: 50_000,
  /** Photos in one entry. */
  maxImages: 100,
  /** Rows of one table. */
  maxTableRows: 200,
  /** Columns of one table: the colspans of any row add up to at most this; one cell spans at most this many. */
  maxTableColumns: 30,
  /** A cell spans at most this many rows (a whole table). */
  maxRowspan: 200,
  /** One column's width, and a photo's width or height, in CSS pixels. */
  maxLengthPx: 10_000,
  /** An ordered list starts at 1 … this. */
  maxListStart: 100_000,
  /** Characters in a short attribute (alt text, titles, a code block's language, link rel/target). */
  maxAttrChars: 1_000,
  /** Characters in a link address. */
  maxHrefChars: 2_000,
  /** The highest stored version: the column is a PostgreSQL integer. */
  maxVersion: 2_147_483_647,
  headingLevels: [1, 2, 3] as readonly number[],
} as const;

export interface TiptapMark {
  type: string;
  attrs?: Record<string, unknown>;
}
export interface TiptapNode {
  type: string;
  attrs?: Record<string, unknown>;
  content?: TiptapNode[];
  marks?: TiptapMark[];
  text?: string;
}
export interface TiptapDoc extends TiptapNode {
  type: 'doc';
  content?: TiptapNode[];
}

export const EMPTY_NOTEBOOK_DOC: TiptapDoc = { type: 'doc', content: [{ type: 'paragraph' }] };
