import { describe, expect, it } from 'vitest';
import { HEDONIC_9_LABELS } from './fixtures';
import {
  applyAnswer,
  checkJoinInput,
  emptyAnswerBook,
  initialRankingOrder,
  isPlausibleSeatToken,
  lineValueAfterKey,
  makeIdempotencyKey,
  mergeAnswers,
  moveCode,
  normalizeJoinCode,
  parseSeatView,
  resumeStep,
  snapToStep,
  stepAfter,
  UUID_V4_PATTERN,
  type SeatView,
} from '@/lib/taster';

// Source: Peryam & Pilgrim (1957) — the nine anchors, 9 down to 1 (listed once, in fixtures.ts).
const HEDONIC_9 = HEDONIC_9_LABELS.map((label, i) => ({ value: 9 - i, label }));

function ratedView(overrides: Partial<SeatView> = {}): SeatView {
  return {
    session: { title: 'Autumn damson round', notice: 'Contains sulphites.', method: 'rated', state: 'open', place: 'Test kitchen', startsAt: '2026-10-03T10:00:00Z' },
    seat: { displayName: 'Wren', consented: true, submitted: false },
    // Source: ISO 13299 — "samples shall be coded with three-digit random numbers".
    samples: [
      { code: '482', position: 1 },
      { code: '615', position: 2 },
      { code: '903', position: 3 },
    ],
    attributes: [
      { id: 'attr-liking', name: 'Overall liking', instruction: 'How much do you like it?', scale: { kind: 'category', points: HEDONIC_9 } },
      { id: 'attr-fruit', name: 'Fruit flavour', instruction: '', scale: { kind: 'line', min: 0, max: 10, step: 0.5, lowAnchor: 'None', highAnchor: 'Very strong' } },
    ],
    answers: [],
    ...overrides,
  };
}

describe('parseSeatView', () => {
  it('keeps the contract fields and drops everything else', () => {
    const raw = {
      ...ratedView(),
      formulaName: 'SECRET formula',
      samples: [
        { code: '482', position: 1, variantName: 'SECRET less sugar', variantId: 'var_9' },
        { code: 'V-2', position: 2 },
      ],
      session: { ...ratedView().session, variantMap: { '482': 'SECRET' } },
    };
    const view = parseSeatView(raw);
    expect(JSON.stringify(view)).not.toContain('SECRET');
    expect(JSON.stringify(view)).not.toContain('var_9');
    // Source: ISO 13299 — three-digit codes; anything else is not a blinding code and is dropped.
    expect(view.samples).toEqual([{ code: '482', position: 1 }]);
    expect(view.attributes[0].scale).toEqual({ kind: 'category', points: HEDONIC_9 });
  });

  it('refuses an unknown method', () => {
    expect(() => parseSeatView({ ...ratedView(), session: { ...ratedView().session, method: 'duo-trio' } })).toThrow(/method/);
  });
});

describe('resumeStep', () => {
  it('starts with the notice until the taster consents', () => {
    expect(resumeStep(ratedView({ seat: { displayName: 'Wren', consented: false, submitted: false } }), emptyAnswerBook())).toEqual({ kind: 'notice' });
  });

  it('resumes at the first sample that lacks an answer, server answers merged with queued ones', () => {
    const view = ratedView({
      answers: [
        { code: '482', attributeId: 'attr-liking', value: 7 },
        { code: '482', attributeId: 'attr-fruit', value: 6.5 },
        { code: '615', attributeId: 'attr-liking', value: 4 },
      ],
    });
    expect(resumeStep(view, mergeAnswers(view, []))).toEqual({ kind: 'sample', index: 1 });
    const book = mergeAnswers(view, [{ kind: 'rated', code: '615', attributeId: 'attr-fruit', value: 3 }]);
    expect(resumeStep(view, book)).toEqual({ kind: 'sample', index: 2 });
  });

  it('lets a queued answer override the server’s older value', () => {
    const view = ratedView({ answers: [{ code: '482', attributeId: 'attr-liking', value: 7 }] });
    const book = mergeAnswers(view, [{ kind: 'rated', code: '482', attributeId: 'attr-liking', value: 2 }]);
    expect(book.rated).toEqual({ '482\u241fattr-liking': 2 });
  });

  it('goes to review once every sample is answered, and to closed or thanks when the server says so', () => {
    const answers = ['482', '615', '903'].flatMap((code) => [
      { code, attributeId: 'attr-liking', value: 5 },
      { code, attributeId: 'attr-fruit', value: 5 },
    ]);
    const view = ratedView({ answers });
    expect(resumeStep(view, mergeAnswers(view, []))).toEqual({ kind: 'review' });
    expect(resumeStep({ ...view, session: { ...view.session, state: 'closed' } }, emptyAnswerBook())).toEqual({ kind: 'closed' });
    expect(resumeStep({ ...view, seat: { ...view.seat, submitted: true } }, emptyAnswerBook())).toEqual({ kind: 'thanks' });
  });

  it('needs a ranking of exactly the seat’s codes, and a triangle choice among them', () => {
    const ranking = ratedView({ session: { ...ratedView().session, method: 'ranking' }, ranking: { attributeId: 'attr-liking', instruction: 'Best first' } });
    expect(resumeStep(ranking, emptyAnswerBook())).toEqual({ kind: 'ranking' });
    expect(resumeStep(ranking, applyAnswer(emptyAnswerBook(), { kind: 'ranking', attributeId: 'attr-liking', ranking: ['903', '482'] }))).toEqual({ kind: 'ranking' });
    expect(resumeStep(ranking, applyAnswer(emptyAnswerBook(), { kind: 'ranking', attributeId: 'attr-liking', ranking: ['903', '482', '615'] }))).toEqual({ kind: 'review' });
    // Source: ISO 4120 (triangle test) — three coded samples, the assessor names the odd one.
    const triangle = ratedView({ session: { ...ratedView().session, method: 'triangle' } });
    expect(resumeStep(triangle, applyAnswer(emptyAnswerBook(), { kind: 'triangle', oddCode: '111' }))).toEqual({ kind: 'triangle' });
    expect(resumeStep(triangle, applyAnswer(emptyAnswerBook(), { kind: 'triangle', oddCode: '615' }))).toEqual({ kind: 'review' });
  });
});

describe('stepAfter', () => {
  it('puts a rinse screen between samples but not after the last', () => {
    // Common practice, no published source: water and a plain cracker between samples.
    const view = ratedView();
    const book = emptyAnswerBook();
    expect(stepAfter({ kind: 'sample', index: 0 }, view, book)).toEqual({ kind: 'rinse', nextIndex: 1 });
    expect(stepAfter({ kind: 'rinse', nextIndex: 1 }, view, book)).toEqual({ kind: 'sample', index: 1 });
    expect(stepAfter({ kind: 'sample', index: 2 }, view, book)).toEqual({ kind: 'review' });
    expect(stepAfter({ kind: 'sample', index: 0, fromReview: true }, view, book)).toEqual({ kind: 'review' });
    expect(stepAfter({ kind: 'notice' }, ratedView({ seat: { displayName: 'Wren', consented: false, submitted: false } }), book)).toEqual({ kind: 'sample', index: 0 });
  });
});

describe('ranking helpers', () => {
  it('moves a code up or down one place and ignores moves off the ends', () => {
    expect(moveCode(['482', '615', '903'], 2, -1)).toEqual(['482', '903', '615']);
    expect(moveCode(['482', '615', '903'], 0, -1)).toEqual(['482', '615', '903']);
    expect(initialRankingOrder(emptyAnswerBook(), ratedView())).toEqual(['482', '615', '903']);
  });
});

describe('line scale keys', () => {
  const scale = { min: 0, max: 10, step: 0.1 };
  it('steps by the scale step, starts unmarked lines at the middle and clamps at the ends', () => {
    expect(lineValueAfterKey(undefined, 'ArrowRight', scale)).toBe(5);
    expect(lineValueAfterKey(0.2, 'ArrowRight', scale)).toBe(0.3);
    expect(lineValueAfterKey(10, 'ArrowUp', scale)).toBe(10);
    expect(lineValueAfterKey(0, 'ArrowLeft', scale)).toBe(0);
    expect(lineValueAfterKey(4, 'PageUp', scale)).toBe(5);
    expect(lineValueAfterKey(4, 'End', scale)).toBe(10);
    expect(lineValueAfterKey(4, 'Tab', scale)).toBeNull();
    expect(snapToStep(7.26, { min: 0, max: 10, step: 0.5 })).toBe(7.5);
  });
});

describe('makeIdempotencyKey', () => {
  it('sets the version and variant bits of a version-4 UUID', () => {
    // Source: RFC 9562 (Universally Unique IDentifiers), example UUIDv4 value 919108f7-52d1-4320-9bac-f847db4148a8.
    // The bytes below differ from it only in the version and variant bits, which the function must set.
    const bytes = Uint8Array.from([0x91, 0x91, 0x08, 0xf7, 0x52, 0xd1, 0x03, 0x20, 0x1b, 0xac, 0xf8, 0x47, 0xdb, 0x41, 0x48, 0xa8]);
    expect(makeIdempotencyKey(() => bytes.slice())).toBe('919108f7-52d1-4320-9bac-f847db4148a8');
    // Source: RFC 9562, section 5.4 — version nibble 0b0100, variant bits 0b10.
    const keys = Array.from({ length: 50 }, () => makeIdempotencyKey());
    for (const key of keys) expect(key).toMatch(UUID_V4_PATTERN);
    expect(new Set(keys).size).toBe(50);
  });
});

describe('join code', () => {
  it('upper-cases, keeps letters and digits, and needs exactly six', () => {
    expect(normalizeJoinCode(' qx7-k2 9p ')).toBe('QX7K29');
    expect(checkJoinInput('QX7K2', 'Wren').joinCode).toBeDefined();
    expect(checkJoinInput('qx7k29', 'Wren')).toEqual({});
    expect(checkJoinInput('QX7K29', '   ').displayName).toBeDefined();
    expect(checkJoinInput('QX7K29', 'x'.repeat(41)).displayName).toBeDefined();
    expect(isPlausibleSeatToken('seat_tok_7Qx2mPz9')).toBe(true);
    expect(isPlausibleSeatToken('../admin')).toBe(false);
  });
});
