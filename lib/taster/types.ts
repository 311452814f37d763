/**
 * The taster-side view of the panel API, exactly as the contract names it. Anything a
 * server sends beyond these fields is dropped by `parseSeatView`, so it can never reach
 * the screen or localStorage.
 */

export type TastingMethod = 'rated' | 'ranking' | 'triangle';
export type SessionState = 'open' | 'closed';

export interface CategoryScaleView {
  kind: 'category';
  points: Array<{ value: number; label: string }>;
}

export interface LineScaleView {
  kind: 'line';
  min: number;
  max: number;
  step: number;
  lowAnchor: string;
  highAnchor: string;
}

export type ScaleView = CategoryScaleView | LineScaleView;

export interface AttributeView {
  id: string;
  name: string;
  instruction: string;
  scale: ScaleView;
}

export interface SampleView {
  /** The three-digit blinding code; the only thing a taster ever learns about a sample. */
  code: string;
  position: number;
}

export interface StoredAnswer {
  code?: string;
  attributeId?: string;
  value?: number;
  ranking?: string[];
  oddCode?: string;
  confidence?: number;
  comment?: string;
}

export interface SeatView {
  session: {
    title: string;
    notice: string;
    method: TastingMethod;
    state: SessionState;
    place: string;
    startsAt: string;
  };
  seat: { displayName: string; consented: boolean; submitted: boolean };
  /** In this seat's serving order. */
  samples: SampleView[];
  attributes: AttributeView[];
  ranking?: { attributeId: string; instruction: string };
  answers: StoredAnswer[];
}

/** Triangle confidence: 1 guessing, 2 fairly sure, 3 sure. */
export type TriangleConfidence = 1 | 2 | 3;

/** One answer as the PUT body carries it, without its idempotency key. */
export type AnswerPayload =
  | { kind: 'rated'; code: string; attributeId: string; value: number }
  | { kind: 'ranking'; attributeId: string; ranking: string[] }
  | { kind: 'triangle'; oddCode: string; confidence?: TriangleConfidence; comment?: string };
