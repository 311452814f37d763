/** Panel vocabulary shared by entities, schemas and screens. Pure data. */
export const TASTING_METHODS = ['rated', 'ranking', 'triangle'] as const;
export type TastingMethod = (typeof TASTING_METHODS)[number];
export const TASTING_METHOD_LABELS: Record<TastingMethod, string> = {
  rated: 'Rated attributes',
  ranking: 'Ranking',
  triangle: 'Triangle test',
};

/** draft → open → closed. Keys are stable; labels are what people read. */
export const TASTING_STATES = ['draft', 'open', 'closed'] as const;
export type TastingState = (typeof TASTING_STATES)[number];
export const TASTING_STATE_LABELS: Record<TastingState, string> = {
  draft: 'Being set up',
  open: 'Taking answers',
  closed: 'Closed',
};

export const SEAT_KINDS = ['staff', 'guest'] as const;
export type SeatKind = (typeof SEAT_KINDS)[number];

/** One served cup: the code the taster sees and, for the kitchen only, which sample it is. */
export interface ServedCup {
  code: string;
  sampleId: string;
}
