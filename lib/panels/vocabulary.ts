/** Panel vocabulary shared by entities, schemas and screens. Pure data. */
export const PANEL_METHODS = ['rated', 'ranking', 'triangle'] as const;
export type PanelMethod = (typeof PANEL_METHODS)[number];
export const PANEL_METHOD_LABELS: Record<PanelMethod, string> = {
  rated: 'Rated attributes',
  ranking: 'Ranking',
  triangle: 'Triangle test',
};

/** draft → open → closed. Keys are stable; labels are what people read. */
export const PANEL_STATES = ['draft', 'open', 'closed'] as const;
export type PanelState = (typeof PANEL_STATES)[number];
export const PANEL_STATE_LABELS: Record<PanelState, string> = {
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
