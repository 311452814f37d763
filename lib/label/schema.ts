/** Query parameters of the label pages and endpoints. */
import { z } from 'zod';
import { id } from '@/lib/input';
import type { LabelChange } from './label';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';

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
  /** What the label belongs to, for headings, file names and the printed page's header. */
  subject: LabelSubject;
}

export interface LabelSubject {
  kind: 'formula' | 'variant' | 'version';
  id: string;
  name: string;
  /** Which state of it: "Revision 4, saved 3 Dec 2026", "Version 2, approved …"; null when none applies. */
  state: string | null;
  /** The market rules the label was checked against. */
  rules: { ruleSet: FormulaSettingsInput['ruleSet']; ruleDate: string } | null;
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
