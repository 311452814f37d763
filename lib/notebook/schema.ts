/** Notebook entries: the request schemas and the views that cross to components (the document's check is document.ts). */
import { z } from 'zod';
import { wholeNumber } from '@/lib/input';
import { findDocProblems } from './document';
import { withoutLinkPresentation } from './links';
import { NOTEBOOK_LIMITS as L, type TiptapDoc } from './shape';

/** A notebook document: refused with every problem's path, or accepted as it will be stored. */
export const notebookDocSchema = z
  .unknown()
  .superRefine((value, ctx) => {
    for (const p of findDocProblems(value)) ctx.addIssue({ code: 'custom', path: p.path, message: p.message });
  })
  // superRefine has refused everything that is not a document, so the value is one here.
  .transform((value): TiptapDoc => ({ ...withoutLinkPresentation(value as TiptapDoc), type: 'doc' }));

/** The body of PUT /api/v1/trials/{trialId}/notebook. */
export const saveNotebookBodySchema = z
  .object({
    /** Null (or absent) for the trial's own entry. */
    variantId: z.uuid('Unknown variant.').nullable().default(null),
    /** The version the writer started from; an older one than the stored version is kept as a conflict. */
    baseVersion: wholeNumber('baseVersion', 0, L.maxVersion),
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

/** What resolving a conflict did (lib/notebook/mutations.ts resolveConflict). */
export interface ConflictResolution {
  entryId: string;
  trialId: string;
  variantId: string | null;
  /** The entry's version afterwards (unchanged for 'theirs'). */
  version: number;
  keep: ResolveNotebookConflictInput['keep'];
}
