/**
 * Reads the seat payload field by field. Only contract fields survive, so a stray server
 * field (a variant or formula name, an internal id) can never reach the taster's screen.
 */
import type { AttributeView, SampleView, ScaleView, SeatView, StoredAnswer } from './types';

export class SeatViewError extends Error {}

const THREE_DIGIT_CODE = /^\d{3}$/;

export function isBlindingCode(value: unknown): value is string {
  return typeof value === 'string' && THREE_DIGIT_CODE.test(value);
}

function obj(value: unknown, what: string): Record<string, unknown> {
  if (!value || typeof value !== 'object' || Array.isArray(value)) throw new SeatViewError(`The tasting data is missing ${what}.`);
  return value as Record<string, unknown>;
}

function str(value: unknown, fallback = ''): string {
  return typeof value === 'string' ? value : fallback;
}

function num(value: unknown): number | undefined {
  return typeof value === 'number' && Number.isFinite(value) ? value : undefined;
}

function parseScale(raw: unknown): ScaleView | null {
  if (!raw || typeof raw !== 'object') return null;
  const s = raw as Record<string, unknown>;
  if (s.kind === 'category' && Array.isArray(s.points)) {
    const points = s.points
      .map((p) => {
        const r = (p ?? {}) as Record<string, unknown>;
        const value = num(r.value);
        return value === undefined ? null : { value, label: str(r.label, String(value)) };
      })
      .filter((p): p is { value: number; label: string } => p !== null);
    return points.length ? { kind: 'category', points } : null;
  }
  if (s.kind === 'line') {
    const min = num(s.min) ?? 0;
    const max = num(s.max) ?? 10;
    const step = num(s.step);
    if (!(max > min)) return null;
    return { kind: 'line', min, max, step: step && step > 0 ? step : 0.1, lowAnchor: str(s.lowAnchor), highAnchor: str(s.highAnchor) };
  }
  return null;
}

function parseAnswer(raw: unknown): StoredAnswer | null {
  if (!raw || typeof raw !== 'object') return null;
  const r = raw as Record<string, unknown>;
  const out: StoredAnswer = {};
  if (isBlindingCode(r.code)) out.code = r.code;
  if (typeof r.attributeId === 'string') out.attributeId = r.attributeId;
  const value = num(r.value);
  if (value !== undefined) out.value = value;
  if (Array.isArray(r.ranking) && r.ranking.every(isBlindingCode)) out.ranking = [...(r.ranking as string[])];
  if (isBlindingCode(r.oddCode)) out.oddCode = r.oddCode;
  const confidence = num(r.confidence);
  if (confidence !== undefined) out.confidence = confidence;
  if (typeof r.comment === 'string') out.comment = r.comment;
  return Object.keys(out).length ? out : null;
}

export function parseSeatView(json: unknown): SeatView {
  const root = obj(json, 'its contents');
  const session = obj(root.session, 'the session');
  const seat = obj(root.seat, 'the seat');
  const method = session.method;
  if (method !== 'rated' && method !== 'ranking' && method !== 'triangle') throw new SeatViewError('This tasting uses a method this page does not know.');

  const samples: SampleView[] = (Array.isArray(root.samples) ? root.samples : [])
    .map((raw, i) => {
      const r = (raw ?? {}) as Record<string, unknown>;
      return isBlindingCode(r.code) ? { code: r.code, position: num(r.position) ?? i + 1 } : null;
    })
    .filter((s): s is SampleView => s !== null);

  const attributes: AttributeView[] = (Array.isArray(root.attributes) ? root.attributes : [])
    .map((raw) => {
      const r = (raw ?? {}) as Record<string, unknown>;
      const scale = parseScale(r.scale);
      if (typeof r.id !== 'string' || !scale) return null;
      return { id: r.id, name: str(r.name), instruction: str(r.instruction), scale };
    })
    .filter((a): a is AttributeView => a !== null);

  const view: SeatView = {
    session: {
      title: str(session.title),
      notice: str(session.notice),
      method,
      state: session.state === 'closed' ? 'closed' : 'open',
      place: str(session.place),
      startsAt: str(session.startsAt),
    },
    seat: { displayName: str(seat.displayName), consented: seat.consented === true, submitted: seat.submitted === true },
    samples,
    attributes,
    answers: (Array.isArray(root.answers) ? root.answers : []).map(parseAnswer).filter((a): a is StoredAnswer => a !== null),
  };
  if (root.ranking && typeof root.ranking === 'object') {
    const r = root.ranking as Record<string, unknown>;
    if (typeof r.attributeId === 'string') view.ranking = { attributeId: r.attributeId, instruction: str(r.instruction) };
  }
  return view;
}

/** What the taster reads when the seat link is unknown, whether the page or the API found out. */
export const SEAT_NOT_FOUND_MESSAGE = 'This tasting link is not valid. Ask the organiser for the join code again.';
