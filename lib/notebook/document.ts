/**
 * The notebook's document: the structural check of a Tiptap document, shared by the editor, the
 * server actions and the API. Only the node and mark types the editor offers are accepted,
 * links only to web, mail or same-site addresses, and images only from the app's own uploads.
 */
import { unsafeTextReason } from '@/lib/input';
import { isAllowedLinkHref, isOwnUploadSrc, LINK_PRESENTATION_ATTRS } from './links';
import { EMPTY_NOTEBOOK_DOC, NOTEBOOK_LIMITS, type TiptapDoc, type TiptapMark, type TiptapNode } from './shape';

const BLOCKS = ['paragraph', 'heading', 'bulletList', 'orderedList', 'taskList', 'table', 'blockquote', 'codeBlock', 'horizontalRule', 'image'];
const INLINE = ['text', 'hardBreak'];

/** Which children each node type may hold (a light version of the editor's content rules). */
const CHILDREN: Record<string, readonly string[]> = {
  doc: BLOCKS,
  paragraph: INLINE,
  heading: INLINE,
  codeBlock: ['text'],
  blockquote: BLOCKS,
  bulletList: ['listItem'],
  orderedList: ['listItem'],
  listItem: BLOCKS,
  taskList: ['taskItem'],
  taskItem: BLOCKS,
  table: ['tableRow'],
  tableRow: ['tableCell', 'tableHeader'],
  tableCell: BLOCKS,
  tableHeader: BLOCKS,
  horizontalRule: [],
  hardBreak: [],
  image: [],
  text: [],
};
export const NOTEBOOK_NODE_TYPES = Object.keys(CHILDREN);
export const NOTEBOOK_MARK_TYPES = ['bold', 'italic', 'underline', 'strike', 'code', 'link'] as const;

type AttrCheck = (value: unknown) => string | null;
const L = NOTEBOOK_LIMITS;
const isWhole = (v: unknown, min: number, max: number): boolean => Number.isInteger(v) && (v as number) >= min && (v as number) <= max;
const wholeInRange =
  (min: number, max: number): AttrCheck =>
  (v) =>
    isWhole(v, min, max) ? null : `must be a whole number from ${min} to ${max}`;
const nullable =
  (check: AttrCheck): AttrCheck =>
  (v) =>
    v === null ? null : check(v);
const shortText =
  (max: number): AttrCheck =>
  (v) =>
    typeof v === 'string' && v.length <= max ? null : `must be text of at most ${max} characters`;
const oneOf =
  (values: readonly unknown[], message: string): AttrCheck =>
  (v) =>
    values.includes(v) ? null : message;

const TABLE_CELL_ATTRS: Record<string, AttrCheck> = {
  colspan: wholeInRange(1, L.maxTableColumns),
  rowspan: wholeInRange(1, L.maxRowspan),
  // One width (or null) per spanned column, as the table extension stores them.
  colwidth: nullable((v) =>
    Array.isArray(v) && v.length <= L.maxTableColumns && v.every((n) => n === null || isWhole(n, 1, L.maxLengthPx))
      ? null
      : `must be a list of at most ${L.maxTableColumns} widths of 1 to ${L.maxLengthPx} pixels`,
  ),
  align: nullable(oneOf(['left', 'center', 'right'], 'must be left, center or right')),
};

/** The attributes each node may carry; any other attribute is refused. */
const NODE_ATTRS: Record<string, Record<string, AttrCheck>> = {
  heading: { level: oneOf(L.headingLevels, 'must be 1, 2 or 3') },
  // HTML's list numbering types (WHATWG HTML, the ol element's type attribute).
  orderedList: { start: wholeInRange(1, L.maxListStart), type: nullable(oneOf(['1', 'a', 'A', 'i', 'I'], 'must be 1, a, A, i or I')) },
  taskItem: { checked: (v) => (typeof v === 'boolean' ? null : 'must be true or false') },
  codeBlock: { language: nullable((v) => (typeof v === 'string' && /^[A-Za-z0-9_+#.-]{1,40}$/.test(v) ? null : 'must be a short name such as "text"')) },
  tableCell: TABLE_CELL_ATTRS,
  tableHeader: TABLE_CELL_ATTRS,
  image: {
    src: (v) => (typeof v === 'string' && isOwnUploadSrc(v) ? null : 'must be one of this app’s uploads (/api/v1/uploads/…): images from elsewhere are not kept'),
    alt: nullable(shortText(L.maxAttrChars)),
    title: nullable(shortText(L.maxAttrChars)),
    width: nullable(wholeInRange(1, L.maxLengthPx)),
    height: nullable(wholeInRange(1, L.maxLengthPx)),
  },
};

const MARK_ATTRS: Record<string, Record<string, AttrCheck>> = {
  link: {
    href: (v) => (typeof v === 'string' && isAllowedLinkHref(v) ? null : 'may only use http:, https:, mailto: or a path on this site (/…)'),
    title: nullable(shortText(L.maxAttrChars)),
    ...Object.fromEntries(LINK_PRESENTATION_ATTRS.map((name) => [name, nullable(shortText(L.maxAttrChars))])),
  },
};

const REQUIRED_ATTRS: Record<string, string[]> = { heading: ['level'], image: ['src'], taskItem: ['checked'] };
const REQUIRED_MARK_ATTRS: Record<string, string[]> = { link: ['href'] };

export interface DocProblem {
  path: Array<string | number>;
  message: string;
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Own keys only: "constructor", "__proto__" or "valueOf" must never find Object.prototype's. */
function own<T>(table: Record<string, T> | undefined, key: string): T | undefined {
  return table && Object.hasOwn(table, key) ? table[key] : undefined;
}

/** What a walk over a document has seen so far. */
interface Walk {
  problems: DocProblem[];
  nodes: number;
  images: number;
}

const MAX_PROBLEMS = 50;

function checkAttrs(
  attrs: unknown,
  allowed: Record<string, AttrCheck> | undefined,
  required: string[] | undefined,
  what: string,
  path: Array<string | number>,
  problems: DocProblem[],
) {
  if (attrs === undefined) {
    for (const key of required ?? []) problems.push({ path: [...path, 'attrs', key], message: `${what} needs ${key}.` });
    return;
  }
  if (!isRecord(attrs)) {
    problems.push({ path: [...path, 'attrs'], message: `${what} attributes must be an object.` });
    return;
  }
  for (const key of required ?? []) {
    if (!Object.hasOwn(attrs, key)) problems.push({ path: [...path, 'attrs', key], message: `${what} needs ${key}.` });
  }
  for (const [key, value] of Object.entries(attrs)) {
    const check = own(allowed, key);
    if (!check) {
      problems.push({ path: [...path, 'attrs', key], message: `${what} has no attribute "${key.slice(0, 40)}".` });
      continue;
    }
    const why = check(value);
    if (why) problems.push({ path: [...path, 'attrs', key], message: `${what} ${key} ${why}.` });
  }
}

/** A table's rows, and the columns of each row (its cells' colspans added up). */
function checkTableShape(node: Record<string, unknown>, path: Array<string | number>, problems: DocProblem[]) {
  const rows = Array.isArray(node.content) ? node.content : [];
  if (rows.length > L.maxTableRows) {
    problems.push({ path: [...path, 'content'], message: `A table has at most ${L.maxTableRows} rows; this one has ${rows.length}. Split it or attach it as a CSV file.` });
    return;
  }
  rows.forEach((row, r) => {
    const cells = isRecord(row) && Array.isArray(row.content) ? row.content : [];
    let columns = 0;
    for (const cell of cells) {
      const span = isRecord(cell) && isRecord(cell.attrs) ? cell.attrs.colspan : undefined;
      columns += isWhole(span, 1, L.maxTableColumns) ? (span as number) : 1;
    }
    if (columns > L.maxTableColumns) {
      problems.push({ path: [...path, 'content', r], message: `A table has at most ${L.maxTableColumns} columns; row ${r + 1} has ${columns}. Split it or attach it as a CSV file.` });
    }
  });
}

function checkNode(node: unknown, parentType: string | null, depth: number, path: Array<string | number>, walk: Walk): void {
  const { problems } = walk;
  if (problems.length >= MAX_PROBLEMS) return;
  if (depth > L.maxDepth) {
    problems.push({ path, message: `The document is nested more than ${L.maxDepth} levels deep.` });
    return;
  }
  walk.nodes += 1;
  if (walk.nodes === L.maxNodes + 1) {
    problems.push({ path, message: `An entry holds at most ${L.maxNodes} pieces (paragraphs, cells, text runs …). Split it into several entries.` });
  }
  if (walk.nodes > L.maxNodes) return;
  if (!isRecord(node)) {
    problems.push({ path, message: 'Each node must be an object.' });
    return;
  }
  const type = node.type;
  if (typeof type !== 'string' || !own(CHILDREN, type) || (type === 'doc') !== (parentType === null)) {
    problems.push({ path: [...path, 'type'], message: `"${String(type).slice(0, 40)}" is not a node the notebook accepts.` });
    return;
  }
  if (parentType !== null && !CHILDREN[parentType].includes(type)) {
    problems.push({ path: [...path, 'type'], message: `A ${type} cannot sit inside a ${parentType}.` });
    return;
  }
  for (const key of Object.keys(node)) {
    if (!['type', 'attrs', 'content', 'marks', 'text'].includes(key)) problems.push({ path: [...path, key], message: `Nodes have no "${key.slice(0, 40)}" field.` });
  }
  checkAttrs(node.attrs, own(NODE_ATTRS, type), own(REQUIRED_ATTRS, type), type, path, problems);
  if (type === 'image') {
    walk.images += 1;
    if (walk.images === L.maxImages + 1) problems.push({ path, message: `An entry holds at most ${L.maxImages} photos. Put the rest in another entry.` });
  }
  if (type === 'table') checkTableShape(node, path, problems);

  if (type === 'text') {
    if (typeof node.text !== 'string' || node.text.length === 0) problems.push({ path: [...path, 'text'], message: 'A text node needs non-empty text.' });
    else if (node.text.length > L.maxTextChars) problems.push({ path: [...path, 'text'], message: `One run of text holds at most ${L.maxTextChars} characters; this one has ${node.text.length}.` });
  } else if (node.text !== undefined) {
    problems.push({ path: [...path, 'text'], message: `A ${type} carries no text of its own.` });
  }

  if (node.marks !== undefined) {
    if (type !== 'text' || !Array.isArray(node.marks)) {
      problems.push({ path: [...path, 'marks'], message: 'Only text carries marks, as a list.' });
    } else if (node.marks.length > NOTEBOOK_MARK_TYPES.length) {
      problems.push({ path: [...path, 'marks'], message: `Text carries at most ${NOTEBOOK_MARK_TYPES.length} marks, each once.` });
    } else {
      const seen = new Set<string>();
      node.marks.forEach((mark, i) => {
        const markPath = [...path, 'marks', i];
        if (!isRecord(mark) || typeof mark.type !== 'string' || !(NOTEBOOK_MARK_TYPES as readonly string[]).includes(mark.type)) {
          problems.push({ path: [...markPath, 'type'], message: `"${(isRecord(mark) ? String(mark.type) : String(mark)).slice(0, 40)}" is not a mark the notebook accepts.` });
          return;
        }
        if (seen.has(mark.type)) problems.push({ path: [...markPath, 'type'], message: `Text carries each mark once; "${mark.type}" is repeated.` });
        seen.add(mark.type);
        for (const key of Object.keys(mark)) {
          if (key !== 'type' && key !== 'attrs') problems.push({ path: [...markPath, key], message: `Marks have no "${key.slice(0, 40)}" field.` });
        }
        checkAttrs(mark.attrs, own(MARK_ATTRS, mark.type), own(REQUIRED_MARK_ATTRS, mark.type), mark.type, markPath, problems);
      });
    }
  }

  if (node.content !== undefined) {
    if (!Array.isArray(node.content)) {
      problems.push({ path: [...path, 'content'], message: 'content must be a list of nodes.' });
    } else if (node.content.length && CHILDREN[type].length === 0) {
      problems.push({ path: [...path, 'content'], message: `A ${type} holds no content.` });
    } else {
      for (let i = 0; i < node.content.length && walk.nodes <= L.maxNodes && problems.length < MAX_PROBLEMS; i += 1) {
        checkNode(node.content[i], type, depth + 1, [...path, 'content', i], walk);
      }
    }
  }
}

/** The first string (text, attribute or key) with characters no text may hold: NUL, other controls, direction overrides, broken characters. */
function findUnsafeText(value: unknown, path: Array<string | number>): DocProblem | null {
  if (typeof value === 'string') {
    const why = unsafeTextReason(value, true);
    return why ? { path, message: why } : null;
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = findUnsafeText(value[i], [...path, i]);
      if (found) return found;
    }
    return null;
  }
  if (isRecord(value)) {
    for (const [k, v] of Object.entries(value)) {
      const found = findUnsafeText(k, [...path, k]) ?? findUnsafeText(v, [...path, k]);
      if (found) return found;
    }
  }
  return null;
}

/** Every reason the value is not an acceptable notebook document (empty when it is). */
export function findDocProblems(value: unknown): DocProblem[] {
  const walk: Walk = { problems: [], nodes: 0, images: 0 };
  checkNode(value, null, 1, [], walk);
  const { problems } = walk;
  if (problems.length) return problems;
  const unsafe = findUnsafeText(value, []);
  if (unsafe) return [unsafe];
  const bytes = new TextEncoder().encode(JSON.stringify(value)).length;
  if (bytes > L.maxDocBytes) {
    problems.push({ path: [], message: `The entry is ${Math.ceil(bytes / 1000)} kB; the limit is ${L.maxDocBytes / 1000} kB. Split it or move long tables to a file.` });
  }
  return problems;
}

/**
 * "Keep both": the current document, then a heading naming who wrote the parallel edit and
 * when, then that edit's content. Nothing of either version is dropped.
 */
export function mergeKeepingBoth(current: TiptapDoc, parallel: TiptapDoc, parallelByName: string, parallelAtLabel: string): TiptapDoc {
  return {
    type: 'doc',
    content: [
      ...(current.content ?? []),
      { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: `Kept from a parallel edit by ${parallelByName} at ${parallelAtLabel}` }] },
      ...(parallel.content ?? []),
    ],
  };
}

/**
 * A copy of a stored document with anything the save check would refuse taken out (unknown
 * nodes, marks and attributes, numbers past their limits, unsafe links and image sources).
 * The read-only views and the editor load through it, so even a row written before a check
 * existed renders safely and in bounded time; a valid document comes out as it went in.
 */
export function sanitizeDoc(doc: unknown): TiptapDoc {
  const cleanAttrs = (attrs: unknown, allowed: Record<string, AttrCheck> | undefined): Record<string, unknown> | undefined => {
    if (!isRecord(attrs) || !allowed) return undefined;
    const kept = Object.entries(attrs).filter(([k, v]) => own(allowed, k)?.(v) === null);
    return kept.length ? Object.fromEntries(kept) : undefined;
  };
  const clean = (node: unknown, parentType: string | null, depth: number): TiptapNode | null => {
    if (!isRecord(node) || typeof node.type !== 'string' || !own(CHILDREN, node.type) || depth > L.maxDepth) return null;
    const type = node.type;
    if (parentType === null ? type !== 'doc' : !CHILDREN[parentType].includes(type)) return null;
    if (type === 'image' && !(isRecord(node.attrs) && typeof node.attrs.src === 'string' && isOwnUploadSrc(node.attrs.src))) return null;
    const out: TiptapNode = { type };
    const attrs = cleanAttrs(node.attrs, own(NODE_ATTRS, type));
    if (attrs) out.attrs = attrs;
    if (type === 'heading' && !out.attrs?.level) out.attrs = { ...out.attrs, level: 2 };
    if (type === 'taskItem' && typeof out.attrs?.checked !== 'boolean') out.attrs = { ...out.attrs, checked: false };
    if (type === 'text') {
      if (typeof node.text !== 'string' || !node.text) return null;
      out.text = node.text;
      if (Array.isArray(node.marks)) {
        const seen = new Set<string>();
        const marks = node.marks.flatMap((m): TiptapMark[] => {
          if (!isRecord(m) || typeof m.type !== 'string' || !(NOTEBOOK_MARK_TYPES as readonly string[]).includes(m.type) || seen.has(m.type)) return [];
          seen.add(m.type);
          if (m.type !== 'link') return [{ type: m.type }];
          const linkAttrs = cleanAttrs(m.attrs, { href: MARK_ATTRS.link.href, title: MARK_ATTRS.link.title });
          return linkAttrs?.href ? [{ type: 'link', attrs: linkAttrs }] : [];
        });
        if (marks.length) out.marks = marks;
      }
      return out;
    }
    if (Array.isArray(node.content)) {
      const content = node.content.map((c) => clean(c, type, depth + 1)).filter((c): c is TiptapNode => c !== null);
      if (content.length) out.content = content;
    }
    return out;
  };
  return (clean(doc, null, 1) as TiptapDoc | null) ?? { ...EMPTY_NOTEBOOK_DOC };
}
