import { z } from 'zod';
import { longText } from '@/lib/input';

export const recommendationSchema = z
  .object({
    variantId: z.uuid('Choose a variant.'),
    rationale: longText(2000, { min: 10, required: 'Say why, in a sentence or two: the evidence travels with the recommendation.' }),
  })
  .strict();

/** The results page's summary tables, each downloadable as CSV (?table=…). */
export const SUMMARY_TABLES = ['means', 'anova', 'penalty', 'triangle', 'ranking'] as const;
export type SummaryTable = (typeof SUMMARY_TABLES)[number];

export function isSummaryTable(value: string): value is SummaryTable {
  return SUMMARY_TABLES.some((table) => table === value);
}
