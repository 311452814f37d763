/**
 * Notebook entries: the structural check of a Tiptap document, shared by the editor, the
 * server actions and the API. Only the node and mark types the editor offers are accepted,
 * links only to web, mail or same-site addresses, and images only from the app's own uploads.
 */
import { z } from 'zod';
import { INT32_MAX, lookup, unsafeTextReason, wholeNumber } from '@/lib/input';

export const NOTEBOOK_LIMITS = {
  /** Nesting levels of nodes, the doc itself counting as 1. */
  maxDepth: 30,
  /** Size of the document as UTF-8 JSON, in bytes (200 kB). */
  maxDocBytes: 200_000,
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
const nullableString: AttrCheck = (v) => (v === null || typeof v === 'string' ? null : 'must be text');
const nullablePositiveInt: AttrCheck = (v) => (v === null || (Number.isInteger(v) && (v as number) > 0) ? null : 'must be a whole number above 0');
const positiveInt: AttrCheck = (v) => (Number.isInteger(v) && (v as number) > 0 ? null : 'must be a whole number above 0');

const TABLE_CELL_ATTRS: Record<string, AttrCheck> = {
  colspan: positiveInt,
  rowspan: positiveInt,
  colwidth: (v) => (v === null || (Array.isArray(v) && v.every((n) => n === null || Number.isFinite(n))) ? null : 'must be a list of widths'),
  align: (v) => (v === null || v === 'left' || v === 'center' || v === 'right' ? null : 'align must be left, center or right'),
};

/** The attributes each node may carry; any other attribute is refused. */
const NODE_ATTRS: Record<string, Record<string, AttrCheck>> = {
  heading: { level: (v) => (NOTEBOOK_LIMITS.headingLevels.includes(v as number) ? null : 'heading level must be 1, 2 or 3') },
  orderedList: { start: positiveInt, type: nullableString },
  taskItem: { checked: (v) => (typeof v === 'boolean' ? null : 'checked must be true or false') },
  codeBlock: { language: nullableString },
  tableCell: TABLE_CELL_ATTRS,
  tableHeader: TABLE_CELL_ATTRS,
  image: {
    src: (v) => (typeof v === 'string' && isOwnUploadSrc(v) ? null : 'images must come from this app’s uploads (/api/v1/uploads/…)'),
    alt: nullableString,
    title: nullableString,
    width: nullablePositiveInt,
    height: nullablePositiveInt,
  },
};

const MARK_ATTRS: Record<string, Record<string, AttrCheck>> = {
  link: {
    href: (v) => (typeof v === 'string' && isAllowedLinkHref(v) ? null : 'links may only use http:, https:, mailto: or a path on this site (/…)'),
    target: (v) => (v === null || v === '_blank' ? null : 'target may only be _blank'),
    rel: nullableString,
    class: (v) => (v === null ? null : 'links carry no class'),
    title: nullableString,
  },
};

const REQUIRED_ATTRS: Record<string, string[]> = { heading: ['level'], image: ['src'], taskItem: ['checked'] };
const REQUIRED_MARK_ATTRS: Record<string, string[]> = { link: ['href'] };

const UPLOAD_SRC = /^\/api\/v1\/uploads\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** True only for the app's own upload addresses, e.g. /api/v1/uploads/{uuid}. */
export function isOwnUploadSrc(src: string): boolean {
  return UPLOAD_SRC.test(src);
}

/**
 * http:, https:, mailto: or a same-site path. "//host" and "/\host" are refused because
 * browsers read them as another host.
 */
export function isAllowedLinkHref(href: string): boolean {
  if (href.length === 0 || href.length > 2000) return false;
  // Control characters and spaces are how "java\tscript:" tricks get past naive checks.
  if (/[\u0000-\u0020\u007f]/.test(href)) return false;
  if (href.startsWith('/')) return !(href.startsWith('//') || href.startsWith('/\\'));
  let url: URL;
  try {
    url = new URL(href);
  } catch {
    return false;
  }
  return url.protocol === 'http:' || url.protocol === 'https:' || url.protocol === 'mailto:';
}

export interface DocProblem {
  path: Array<string | number>;
  message: string;
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

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
    if (!(key in attrs)) problems.push({ path: [...path, 'attrs', key], message: `${what} needs ${key}.` });
  }
  for (const [key, value] of Object.entries(attrs)) {
    const check = lookup(allowed, key);
    if (!check) {
      problems.push({ path: [...path, 'attrs', key], message: `${what} has no attribute "${key}".` });
      continue;
    }
    const why = check(value);
    if (why) problems.push({ path: [...path, 'attrs', key], message: `${what}: ${why}.` });
  }
}

function checkNode(node: unknown, parentType: string | null, depth: number, path: Array<string | number>, problems: DocProblem[]): void {
  if (problems.length >= 50) return;
  if (depth > NOTEBOOK_LIMITS.maxDepth) {
    problems.push({ path, message: `The document is nested more than ${NOTEBOOK_LIMITS.maxDepth} levels deep.` });
    return;
  }
  if (!isRecord(node)) {
    problems.push({ path, message: 'Each node must be an object.' });
    return;
  }
  const type = node.type;
  if (typeof type !== 'string' || !(type in CHILDREN) || (type === 'doc') !== (parentType === null)) {
    problems.push({ path: [...path, 'type'], message: `"${String(type)}" is not a node the notebook accepts.` });
    return;
  }
  if (parentType !== null && !CHILDREN[parentType].includes(type)) {
    problems.push({ path: [...path, 'type'], message: `A ${type} cannot sit inside a ${parentType}.` });
    return;
  }
  for (const key of Object.keys(node)) {
    if (!['type', 'attrs', 'content', 'marks', 'text'].includes(key)) problems.push({ path: [...path, key], message: `Nodes have no "${key}" field.` });
  }
  checkAttrs(node.attrs, NODE_ATTRS[type], REQUIRED_ATTRS[type], type, path, problems);

  if (type === 'text') {
    if (typeof node.text !== 'string' || node.text.length === 0) problems.push({ path: [...path, 'text'], message: 'A text node needs non-empty text.' });
  } else if (node.text !== undefined) {
    problems.push({ path: [...path, 'text'], message: `A ${type} carries no text of its own.` });
  }

  if (node.marks !== undefined) {
    if (type !== 'text' || !Array.isArray(node.marks)) {
      problems.push({ path: [...path, 'marks'], message: 'Only text carries marks, as a list.' });
    } else {
      node.marks.forEach((mark, i) => {
        const markPath = [...path, 'marks', i];
        if (!isRecord(mark) || typeof mark.type !== 'string' || !(NOTEBOOK_MARK_TYPES as readonly string[]).includes(mark.type)) {
          problems.push({ path: [...markPath, 'type'], message: `"${isRecord(mark) ? String(mark.type) : String(mark)}" is not a mark the notebook accepts.` });
          return;
        }
        for (const key of Object.keys(mark)) {
          if (key !== 'type' && key !== 'attrs') problems.push({ path: [...markPath, key], message: `Marks have no "${key}" field.` });
        }
        checkAttrs(mark.attrs, MARK_ATTRS[mark.type], REQUIRED_MARK_ATTRS[mark.type], mark.type, markPath, problems);
      });
    }
  }

  if (node.content !== undefined) {
    if (!Array.isArray(node.content)) {
      problems.push({ path: [...path, 'content'], message: 'content must be a list of nodes.' });
    } else if (node.content.length && CHILDREN[type].length === 0) {
      problems.push({ path: [...path, 'content'], message: `A ${type} holds no content.` });
    } else {
      node.content.forEach((child, i) => checkNode(child, type, depth + 1, [...path, 'content', i], problems));
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
  const problems: DocProblem[] = [];
  checkNode(value, null, 1, [], problems);
  if (problems.length) return problems;
  const unsafe = findUnsafeText(value, []);
  if (unsafe) return [unsafe];
  const bytes = new TextEncoder().encode(JSON.stringify(value)).length;
  if (bytes > NOTEBOOK_LIMITS.maxDocBytes) {
    problems.push({ path: [], message: `The entry is ${Math.ceil(bytes / 1000)} kB; the limit is ${NOTEBOOK_LIMITS.maxDocBytes / 1000} kB. Split it or move long tables to a file.` });
  }
  return problems;
}

export const notebookDocSchema = z.unknown().superRefine((value, ctx) => {
  for (const p of findDocProblems(value)) ctx.addIssue({ code: 'custom', path: p.path, message: p.message });
}) as unknown as z.ZodType<TiptapDoc, unknown>;

/** The body of PUT /api/v1/trials/{trialId}/notebook. */
export const saveNotebookBodySchema = z
  .object({
    /** Null (or absent) for the trial's own entry. */
    variantId: z.uuid('Unknown variant.').nullable().default(null),
    /** The version the writer started from; an older one than the stored version is kept as a conflict. */
    baseVersion: wholeNumber('baseVersion', 0, INT32_MAX),
    doc: notebookDocSchema,
  })
  .strict();

export const saveNotebookSchema = saveNotebookBodySchema.extend({ trialId: z.uuid('Unknown trial.') }).strict();

export const KEEP_CHOICES = ['mine', 'theirs', 'both'] as const;
export type KeepChoice = (typeof KEEP_CHOICES)[number];

export const resolveNotebookConflictSchema = z
  .object({
    conflictId: z.uuid('Unknown conflict.'),
    keep: z.enum(KEEP_CHOICES, { error: 'Choose mine, theirs or both.' }),
  })
  .strict();

export const notebookQuerySchema = z.object({ variantId: z.uuid('Unknown variant.').nullable().default(null) });

export type SaveNotebookInput = z.infer<typeof saveNotebookSchema>;
export type ResolveNotebookConflictInput = z.infer<typeof resolveNotebookConflictSchema>;

export interface NotebookConflictView {
  conflictId: string;
  doc: TiptapDoc;
  baseVersion: number;
  savedByName: string;
  /** ISO 8601. */
  createdAt: string;
}

export interface NotebookEntryView {
  entryId: string | null;
  doc: TiptapDoc;
  version: number;
  /** ISO 8601; null while nobody has saved yet. */
  updatedAt: string | null;
  updatedByName: string | null;
  conflicts: NotebookConflictView[];
}

export type SaveNotebookResult =
  | { status: 'saved'; version: number; updatedAt: string }
  | {
      status: 'conflict';
      version: number;
      conflictId: string;
      current: { doc: TiptapDoc; updatedByName: string | null; updatedAt: string | null };
    };

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
 * nodes and marks, unsafe links and image sources). Read-only views use it so that even a
 * row written before the check existed renders safely.
 */
export function sanitizeDoc(doc: unknown): TiptapDoc {
  const clean = (node: unknown, parentType: string | null, depth: number): TiptapNode | null => {
    if (!isRecord(node) || typeof node.type !== 'string' || !(node.type in CHILDREN) || depth > NOTEBOOK_LIMITS.maxDepth) return null;
    const type = node.type;
    if (parentType === null ? type !== 'doc' : !CHILDREN[parentType].includes(type)) return null;
    if (type === 'image' && !(isRecord(node.attrs) && typeof node.attrs.src === 'string' && isOwnUploadSrc(node.attrs.src))) return null;
    const out: TiptapNode = { type };
    if (isRecord(node.attrs)) {
      const allowed = NODE_ATTRS[type] ?? {};
      const attrs = Object.fromEntries(Object.entries(node.attrs).filter(([k, v]) => lookup(allowed, k)?.(v) === null));
      if (Object.keys(attrs).length) out.attrs = attrs;
    }
    if (type === 'heading' && !out.attrs?.level) out.attrs = { ...out.attrs, level: 2 };
    if (type === 'taskItem' && typeof out.attrs?.checked !== 'boolean') out.attrs = { ...out.attrs, checked: false };
    if (type === 'text') {
      if (typeof node.text !== 'string' || !node.text) return null;
      out.text = node.text;
      if (Array.isArray(node.marks)) {
        const marks = node.marks.flatMap((m): TiptapMark[] => {
          if (!isRecord(m) || typeof m.type !== 'string' || !(NOTEBOOK_MARK_TYPES as readonly string[]).includes(m.type)) return [];
          if (m.type !== 'link') return [{ type: m.type }];
          const href = isRecord(m.attrs) ? m.attrs.href : undefined;
          return typeof href === 'string' && isAllowedLinkHref(href) ? [{ type: 'link', attrs: { href } }] : [];
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
