/** Query parameters of the label pages and endpoints. */
import { z } from 'zod';
import { id } from '@/lib/input';
import type { LabelChange } from './label';

/** The product a "reduced sugars" claim is measured against: a typical jam, or another formula (its id). */
export const claimReferenceChoice = z.union([z.literal('typical'), id('Choose a formula of this workspace as the reference.')]);

export const labelQuerySchema = z.object({
  reference: claimReferenceChoice.optional(),
  /** csv / json: the label as a download instead of the API's answer. */
  format: z.enum(['csv', 'json']).optional(),
});
export type LabelQuery = z.infer<typeof labelQuerySchema>;

/** How the label shown was kept. */
export type LabelKept = 'live' | 'frozen' | 'not_frozen';

export interface LabelView {
  /** Null when the formula cannot be computed; `problem` says why. */
  label: import('./label').Label | null;
  problem: string | null;
  kept: LabelKept;
  /** The claim reference as chosen ('typical' or a formula id) and its name. */
  reference: { choice: string; name: string } | null;
  /** What the label belongs to, for headings and file names. */
  subject: { kind: 'formula' | 'variant' | 'version'; id: string; name: string };
}

/** A promotion's label beside the label of the version it replaces. */
export interface LabelComparison {
  baselineVersion: number;
  /** How the baseline's label was kept: frozen at approval, or computed now. */
  baselineKept: LabelView['kept'];
  changes: LabelChange[];
  /** Set when either label cannot be computed; then there are no changes to show. */
  problem: string | null;
}
