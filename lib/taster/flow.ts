/**
 * The taster's path through a session as plain data: which screen comes next, where a
 * reload resumes, and what has been answered (server answers with unsent ones laid over).
 */
import type { AnswerPayload, LineScaleView, SeatView, StoredAnswer, TriangleConfidence } from './types';

export type FlowStep =
  | { kind: 'notice' }
  | { kind: 'sample'; index: number; fromReview?: boolean }
  | { kind: 'rinse'; nextIndex: number }
  | { kind: 'ranking'; fromReview?: boolean }
  | { kind: 'triangle'; fromReview?: boolean }
  | { kind: 'review' }
  | { kind: 'thanks' }
  | { kind: 'closed' };

export interface TriangleAnswer {
  oddCode: string;
  confidence?: TriangleConfidence;
  comment?: string;
}

export interface AnswerBook {
  /** value by `ratedKey(code, attributeId)` */
  rated: Readonly<Record<string, number>>;
  ranking: readonly string[] | null;
  triangle: TriangleAnswer | null;
}

export const RINSE_REMINDER = 'Take a sip of water and a bite of cracker before the next sample.';

export function ratedKey(code: string, attributeId: string): string {
  return `${code}\u241f${attributeId}`;
}

export function emptyAnswerBook(): AnswerBook {
  return { rated: {}, ranking: null, triangle: null };
}

export function applyAnswer(book: AnswerBook, answer: AnswerPayload): AnswerBook {
  switch (answer.kind) {
    case 'rated':
      return { ...book, rated: { ...book.rated, [ratedKey(answer.code, answer.attributeId)]: answer.value } };
    case 'ranking':
      return { ...book, ranking: [...answer.ranking] };
    case 'triangle': {
      const t: TriangleAnswer = { oddCode: answer.oddCode };
      if (answer.confidence !== undefined) t.confidence = answer.confidence;
      if (answer.comment) t.comment = answer.comment;
      return { ...book, triangle: t };
    }
  }
}

function asConfidence(value: number | undefined): TriangleConfidence | undefined {
  return value === 1 || value === 2 || value === 3 ? value : undefined;
}

/** Turns the server's stored answers into payloads of this session's method. */
export function storedToPayloads(answers: readonly StoredAnswer[], view: Pick<SeatView, 'session' | 'ranking'>): AnswerPayload[] {
  const out: AnswerPayload[] = [];
  for (const a of answers) {
    if (view.session.method === 'rated' && a.code && a.attributeId && a.value !== undefined) {
      out.push({ kind: 'rated', code: a.code, attributeId: a.attributeId, value: a.value });
    } else if (view.session.method === 'ranking' && a.ranking) {
      out.push({ kind: 'ranking', attributeId: a.attributeId ?? view.ranking?.attributeId ?? '', ranking: a.ranking });
    } else if (view.session.method === 'triangle' && a.oddCode) {
      out.push({ kind: 'triangle', oddCode: a.oddCode, confidence: asConfidence(a.confidence), comment: a.comment });
    }
  }
  return out;
}

/** The server's answers with the not-yet-sent ones on top (the queue is newer). */
export function mergeAnswers(view: SeatView, queued: readonly AnswerPayload[]): AnswerBook {
  let book = emptyAnswerBook();
  for (const a of storedToPayloads(view.answers, view)) book = applyAnswer(book, a);
  for (const a of queued) book = applyAnswer(book, a);
  return book;
}

export function ratedValue(book: AnswerBook, code: string, attributeId: string): number | undefined {
  const key = ratedKey(code, attributeId);
  return Object.prototype.hasOwnProperty.call(book.rated, key) ? book.rated[key] : undefined;
}

export function isSampleComplete(book: AnswerBook, code: string, view: Pick<SeatView, 'attributes'>): boolean {
  return view.attributes.every((attr) => ratedValue(book, code, attr.id) !== undefined);
}

/** A ranking counts only if it orders exactly this seat's codes. */
export function isRankingComplete(book: AnswerBook, view: Pick<SeatView, 'samples'>): boolean {
  if (!book.ranking || book.ranking.length !== view.samples.length) return false;
  const codes = new Set(view.samples.map((s) => s.code));
  return new Set(book.ranking).size === codes.size && book.ranking.every((c) => codes.has(c));
}

export function isTriangleComplete(book: AnswerBook, view: Pick<SeatView, 'samples'>): boolean {
  return !!book.triangle && view.samples.some((s) => s.code === book.triangle?.oddCode);
}

/** Where a taster picks up: the first sample still lacking an answer, else the review. */
export function resumeStep(view: SeatView, book: AnswerBook): FlowStep {
  if (view.session.state === 'closed') return { kind: 'closed' };
  if (view.seat.submitted) return { kind: 'thanks' };
  if (!view.seat.consented) return { kind: 'notice' };
  switch (view.session.method) {
    case 'rated': {
      const index = view.samples.findIndex((s) => !isSampleComplete(book, s.code, view));
      return index === -1 ? { kind: 'review' } : { kind: 'sample', index };
    }
    case 'ranking':
      return isRankingComplete(book, view) ? { kind: 'review' } : { kind: 'ranking' };
    case 'triangle':
      return isTriangleComplete(book, view) ? { kind: 'review' } : { kind: 'triangle' };
  }
}

/** The screen after the taster presses the forward button on `step`. */
export function stepAfter(step: FlowStep, view: SeatView, book: AnswerBook): FlowStep {
  switch (step.kind) {
    case 'notice':
      return resumeStep({ ...view, seat: { ...view.seat, consented: true } }, book);
    case 'sample': {
      if (step.fromReview) return { kind: 'review' };
      const last = view.samples.length - 1;
      return step.index < last ? { kind: 'rinse', nextIndex: step.index + 1 } : { kind: 'review' };
    }
    case 'rinse':
      return { kind: 'sample', index: step.nextIndex };
    case 'ranking':
    case 'triangle':
      return { kind: 'review' };
    case 'review':
      return { kind: 'thanks' };
    case 'thanks':
    case 'closed':
      return step;
  }
}

/** Moves the code at `index` by `delta` places; out-of-range moves leave the order alone. */
export function moveCode(order: readonly string[], index: number, delta: -1 | 1): string[] {
  const target = index + delta;
  const next = [...order];
  if (index < 0 || index >= next.length || target < 0 || target >= next.length) return next;
  [next[index], next[target]] = [next[target], next[index]];
  return next;
}

/** The ranking to show first: the saved one if it still fits, else the serving order. */
export function initialRankingOrder(book: AnswerBook, view: Pick<SeatView, 'samples'>): string[] {
  return isRankingComplete(book, view) && book.ranking ? [...book.ranking] : view.samples.map((s) => s.code);
}

/** Rounds to the scale's step without binary-fraction noise (0.1 + 0.2). */
export function snapToStep(value: number, scale: Pick<LineScaleView, 'min' | 'max' | 'step'>): number {
  const clamped = Math.min(scale.max, Math.max(scale.min, value));
  const steps = Math.round((clamped - scale.min) / scale.step);
  const decimals = Math.max(0, Math.ceil(-Math.log10(scale.step)));
  return Number(Math.min(scale.max, scale.min + steps * scale.step).toFixed(decimals + 1));
}

/**
 * The line-scale value after a key press, or null for keys the slider ignores. An unmarked
 * line starts from its middle so the first press lands near the centre, not at an end.
 */
export function lineValueAfterKey(current: number | undefined, key: string, scale: Pick<LineScaleView, 'min' | 'max' | 'step'>): number | null {
  const start = current ?? (scale.min + scale.max) / 2;
  const bigStep = (scale.max - scale.min) / 10;
  switch (key) {
    case 'ArrowRight':
    case 'ArrowUp':
      return snapToStep(current === undefined ? start : start + scale.step, scale);
    case 'ArrowLeft':
    case 'ArrowDown':
      return snapToStep(current === undefined ? start : start - scale.step, scale);
    case 'PageUp':
      return snapToStep(start + bigStep, scale);
    case 'PageDown':
      return snapToStep(start - bigStep, scale);
    case 'Home':
      return scale.min;
    case 'End':
      return scale.max;
    default:
      return null;
  }
}

export const CONFIDENCE_CHOICES: ReadonlyArray<{ value: TriangleConfidence; label: string }> = [
  { value: 3, label: 'Sure' },
  { value: 2, label: 'Fairly sure' },
  { value: 1, label: 'Guessing' },
];
