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

/** One answer as the analysis reads it (the columns answerRows selects). */
export type AnswerRow = { seat_id: string; kind: TastingData['answers'][number]['kind']; attribute: string; sample_id: string | null; value: number | null; ranking: string[] | null; correct: boolean | null };
/** A tasting's answers being read (readAnswers), with each seat as the analysis counts it. */
export type AnswerRead = Promise<Array<AnswerRow & { seat: { id: string } }>>;

export { ANOVA_SOURCE_WORDS, PENALTY_GROUP_WORDS } from './words';

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
