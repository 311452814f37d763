import { z } from 'zod';
import { longText } from '@/lib/input';
import type { TastingView } from '@/lib/tastings/schema';
import type { TastingData } from './analysis';

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

/**
 * What the results page shows before the statistics, read with the tasting (its 404): the unblinded
 * samples, the seat counts and the CSV tables; and what the analysis needs besides the answers.
 */
export interface ResultsSetup {
  tastingId: string;
  session: Pick<TastingView, 'title' | 'state' | 'samples'>;
  method: TastingData['method'];
  attributes: TastingData['attributes'];
  /** Each seat's serving order, through which a ranking's codes are read as samples. */
  seats: Array<{ id: string; seatIndex: number; servingOrder: Array<{ code: string; sampleId: string }> }>;
  seatCount: number;
  submittedSeats: number;
  tables: SummaryTable[];
}
