// @vitest-environment node
/**
 * Bounded documents: every number and size that drives rendering has a ceiling in the save check
 * (NOTEBOOK_LIMITS, project limits with no published source), the largest accepted document
 * renders on the server with the real read-only renderer, and a stored row from before the limits
 * renders in bounded time. The editor half is bounds-editor.test.tsx. Render times are printed,
 * never asserted (speed targets live in `npm run bench`).
 */
import { performance } from 'node:perf_hooks';
import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { NotebookView } from '@/components/notebook/NotebookView';
import { docFigures, largestNotebookDoc } from '@/lib/notebook/largest-doc';
import { NOTEBOOK_LIMITS as L, type TiptapDoc, type TiptapNode } from '@/lib/notebook/shape';
import { findDocProblems, sanitizeDoc } from '@/lib/notebook/document';
import { saveNotebookSchema } from '@/lib/notebook/schema';

const TRIAL_ID = '6b1f4c9e-2d3a-4e5f-8a7b-9c0d1e2f3a4b';
const PHOTO = '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d';
const para = (text: string): TiptapNode => ({ type: 'paragraph', content: [{ type: 'text', text }] });
const doc = (...content: TiptapNode[]): TiptapDoc => ({ type: 'doc', content });
const cell = (attrs: Record<string, unknown> = {}): TiptapNode => ({ type: 'tableCell', attrs: { colspan: 1, rowspan: 1, colwidth: null, ...attrs }, content: [para('1')] });
const table = (rows: TiptapNode[][]): TiptapNode => ({ type: 'table', content: rows.map((content) => ({ type: 'tableRow', content })) });
const paths = (value: unknown) => findDocProblems(value).map((p) => p.path.join('.'));
const blocks = (d: TiptapDoc) => d.content as TiptapNode[];

describe('bounded documents: the save check', () => {
  it('accepts the largest document, which reaches every limit at once as far as they combine', () => {
    const largest = largestNotebookDoc();
    expect(findDocProblems(largest)).toEqual([]);
    const { nodes, bytes } = docFigures(largest);
    expect(nodes).toBe(L.maxNodes);
    expect(bytes).toBe(L.maxDocBytes);
    const json = JSON.stringify(largest);
    expect(json).toContain(`"colspan":${L.maxTableColumns},"rowspan":${L.maxRowspan}`);
    expect(json.match(/"type":"image"/g)).toHaveLength(L.maxImages);
    expect(json).toContain(`"start":${L.maxListStart}`);
    expect(blocks(largest).at(-1)!.content![0].text).toHaveLength(L.maxTextChars);
    console.log(`bounded documents: largest accepted entry: ${nodes} nodes, ${bytes} bytes`);
    // The views and the editor load through sanitizeDoc: a valid document comes out as it went in
    // (an empty content list and none mean the same).
    const withoutEmptyContent = (value: unknown) => JSON.parse(JSON.stringify(value, (key, v) => (key === 'content' && Array.isArray(v) && v.length === 0 ? undefined : v)));
    expect(sanitizeDoc(largest)).toEqual(withoutEmptyContent(largest));
  });

  it('refuses one past each limit, naming where', () => {
    const over = (change: (d: TiptapDoc) => void): TiptapDoc => {
      const d = largestNotebookDoc();
      change(d);
      return d;
    };
    const spanned = (d: TiptapDoc) => (blocks(d)[1].content as TiptapNode[])[0].content![0];
    // Each change alone; the message names the limit.
    const cases: Array<[string, (d: TiptapDoc) => void, RegExp]> = [
      ['colspan', (d) => (spanned(d).attrs!.colspan = L.maxTableColumns + 1), /tableHeader colspan must be a whole number from 1 to 30/],
      ['rowspan', (d) => (spanned(d).attrs!.rowspan = L.maxRowspan + 1), /rowspan.*1 to 200/],
      ['column width', (d) => ((spanned(d).attrs!.colwidth as number[])[0] = L.maxLengthPx + 1), /widths of 1 to 10000/],
      ['widths listed', (d) => (spanned(d).attrs!.colwidth = Array.from({ length: L.maxTableColumns + 1 }, () => 100)), /at most 30 widths/],
      ['table rows', (d) => blocks(d)[1].content!.push({ type: 'tableRow', content: [] }), /at most 200 rows/],
      ['table columns', (d) => blocks(d)[2].content![0].content!.push(cell()), /at most 30 columns; row 1 has 31/],
      ['nesting', (d) => (blocks(d)[0] = { type: 'blockquote', content: [blocks(d)[0]] }), /nested more than 30/],
      ['photos', (d) => (blocks(d).at(-2)!.content!.pop(), blocks(d).push({ type: 'image', attrs: { src: PHOTO } })), /at most 100 photos/],
      ['nodes', (d) => blocks(d).push({ type: 'horizontalRule' }), /at most 5000 pieces/],
      ['bytes', (d) => (blocks(d).at(-1)!.content!.at(-1)!.text += 'x'), /limit is 200 kB/],
      ['text run', (d) => (blocks(d).at(-1)!.content![0].text += 'x'), /at most 50000 characters; this one has 50001/],
      ['list start', (d) => (blocks(d).find((b) => b.type === 'orderedList')!.attrs!.start = L.maxListStart + 1), /1 to 100000/],
      ['photo width', (d) => (blocks(d).find((b) => b.type === 'image')!.attrs!.height = L.maxLengthPx + 1), /1 to 10000/],
      ['alt text', (d) => (blocks(d).find((b) => b.type === 'image')!.attrs!.alt = 'a'.repeat(L.maxAttrChars + 1)), /at most 1000 characters/],
      ['heading level', (d) => (blocks(d).find((b) => b.type === 'heading')!.attrs!.level = 4), /heading level must be 1, 2 or 3/],
    ];
    for (const [what, change, message] of cases) {
      const problems = findDocProblems(over(change));
      expect(problems.length, what).toBeGreaterThan(0);
      expect(problems[0].message, what).toMatch(message);
    }
    expect(findDocProblems(doc(para('x'.repeat(L.maxTextChars))))).toEqual([]);
    expect(findDocProblems(doc(para('x'.repeat(L.maxTextChars + 1))))[0].message).toMatch(/at most 50000 characters/);
    // Marks: each once.
    expect(paths(doc({ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'bold' }, { type: 'bold' }] }] }))).toEqual(['content.0.content.0.marks.1.type']);
  });

  it('refuses the colspan that stopped the server, and a version past a PostgreSQL integer', () => {
    expect(paths(doc(table([[cell({ colspan: 1e9 })]])))).toContain('content.0.content.0.content.0.attrs.colspan');
    expect(paths(doc(table([[cell({ colspan: Number.MAX_SAFE_INTEGER + 2 })]])))).toContain('content.0.content.0.content.0.attrs.colspan');
    // Source: PostgreSQL documentation, Numeric Types — integer ranges from -2147483648 to +2147483647.
    const save = (baseVersion: number) => saveNotebookSchema.safeParse({ trialId: TRIAL_ID, variantId: null, baseVersion, doc: doc(para('x')) }).success;
    expect(save(2 ** 31 - 1)).toBe(true);
    expect(save(2 ** 31)).toBe(false);
    expect(save(2 ** 53)).toBe(false);
  });

  it('refuses prototype-named attributes, nodes and marks without throwing', () => {
    for (const name of ['__proto__', 'constructor', 'valueOf', 'hasOwnProperty', 'toString', 'prototype']) {
      // JSON.parse keeps "__proto__" as an own key, as a request body would.
      const asAttr = JSON.parse(`{"type":"doc","content":[{"type":"heading","attrs":{"level":2,"${name}":{"polluted":true}},"content":[{"type":"text","text":"x"}]}]}`);
      expect(paths(asAttr), name).toEqual([`content.0.attrs.${name}`]);
      const asMarkAttr = JSON.parse(`{"type":"doc","content":[{"type":"paragraph","content":[{"type":"text","text":"x","marks":[{"type":"link","attrs":{"href":"/x","${name}":1}}]}]}]}`);
      expect(paths(asMarkAttr), name).toEqual([`content.0.content.0.marks.0.attrs.${name}`]);
      expect(paths(doc({ type: name })), name).toEqual(['content.0.type']);
      expect(paths(doc({ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: name }] }] })), name).toEqual(['content.0.content.0.marks.0.type']);
      expect(() => sanitizeDoc(asAttr)).not.toThrow();
      expect(sanitizeDoc(asAttr).content![0].attrs).toEqual({ level: 2 });
    }
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

describe('bounded documents: links carry our rel and target', () => {
  const link = (attrs: Record<string, unknown>) => doc({ type: 'paragraph', content: [{ type: 'text', text: 'method', marks: [{ type: 'link', attrs }] }] });

  it('drops rel, target and class on save, keeping the address and title', () => {
    const parsed = saveNotebookSchema.parse({ trialId: TRIAL_ID, variantId: null, baseVersion: 0, doc: link({ href: 'https://example.org/m', target: '_self', rel: 'opener', class: 'x', title: 'Method' }) });
    expect(parsed.doc.content![0].content![0].marks).toEqual([{ type: 'link', attrs: { href: 'https://example.org/m', title: 'Method' } }]);
  });

  it('renders a stored link with our values, whatever the row says', () => {
    const html = renderToStaticMarkup(
      <NotebookView doc={doc({ type: 'paragraph', content: [
        { type: 'text', text: 'elsewhere', marks: [{ type: 'link', attrs: { href: 'https://example.org/m', target: '_self', rel: 'opener' } }] },
        { type: 'text', text: 'here', marks: [{ type: 'link', attrs: { href: '/formulas', target: '_blank', rel: 'opener' } }] },
      ] })} />,
    );
    // Source: WHATWG HTML, link types — noopener keeps window.opener null; noreferrer sends no Referer.
    expect(html).toContain('<a href="https://example.org/m" target="_blank" rel="noopener noreferrer nofollow">elsewhere</a>');
    expect(html).toContain('<a href="/formulas">here</a>');
    expect(html).not.toContain('opener"');
  });
});

describe('bounded documents: server-side render', () => {
  it('renders a row stored before the limits (a colspan of a billion) in bounded time, as a one-column cell', () => {
    const stored = doc(table([[cell({ colspan: 1_000_000_000, rowspan: 1_000_000_000, colwidth: Array.from({ length: 5 }, () => 1e12) }), cell()]]));
    const html = renderToStaticMarkup(<NotebookView doc={stored} />);
    expect(html).toContain('<tr><td><p>1</p></td><td><p>1</p></td></tr>');
    expect(html).not.toContain('1000000000');
  });

  it('renders the largest accepted document with the real read-only renderer', () => {
    const largest = largestNotebookDoc();
    const started = performance.now();
    const html = renderToStaticMarkup(<NotebookView doc={largest} />);
    const ms = performance.now() - started;
    console.log(`bounded documents: largest accepted entry rendered on the server in ${ms.toFixed(0)} ms, cold, development React under vitest (${html.length} characters of HTML; production timing: npm run bench, notebook.*)`);
    expect(html.match(/<img /g)).toHaveLength(L.maxImages);
    expect(html).toContain(`<th colSpan="${L.maxTableColumns}" rowSpan="${L.maxRowspan}" class="text-center">`);
    // No style attributes: the page's CSP (style-src without 'unsafe-inline') would refuse them.
    expect(html).not.toMatch(/ style=/);
    expect(html).toContain(`start="${L.maxListStart}"`);
    expect(html.match(/<br\/>/g)).toHaveLength(JSON.stringify(largest).match(/hardBreak/g)!.length);
    expect(html).toContain('Deepest note');
    expect(html.endsWith('</p></div>')).toBe(true);
  });
});
