/** Invented seats for the taster-flow tests. Codes are three digits, as ISO 13299 asks. */

// Source: Peryam & Pilgrim (1957), Hedonic scale method of measuring food preferences — anchors 9 down to 1.
export const HEDONIC_9_LABELS = [
  'Like extremely',
  'Like very much',
  'Like moderately',
  'Like slightly',
  'Neither like nor dislike',
  'Dislike slightly',
  'Dislike moderately',
  'Dislike very much',
  'Dislike extremely',
];

export const SEAT_TOKEN = 'seat_tok_7Qx2mPz9';

/** The server payload, with fields outside the contract that must never reach the page. */
export function ratedSeatPayload(overrides: { answers?: unknown[]; consented?: boolean; state?: 'open' | 'closed'; attributes?: unknown[] } = {}) {
  return {
    session: {
      title: 'Autumn damson round',
      notice: 'Contains sulphites and traces of almond.\nBy tasting you agree that your scores are kept for <b>product development</b>.',
      method: 'rated',
      state: overrides.state ?? 'open',
      place: 'Test kitchen',
      startsAt: '2026-10-03T10:00:00Z',
      variantMap: { '482': 'SECRET-base', '615': 'SECRET-less-sugar' },
    },
    seat: { displayName: 'Wren', consented: overrides.consented ?? false, submitted: false, seatId: 'SECRET-seat-id' },
    samples: [
      { code: '482', position: 1, variantName: 'SECRET Damson base', formulaId: 'SECRET-frm-1' },
      { code: '615', position: 2, variantName: 'SECRET Damson 55 Brix', formulaId: 'SECRET-frm-1' },
      { code: '903', position: 3, variantName: 'SECRET Damson LM pectin', formulaId: 'SECRET-frm-2' },
    ],
    attributes: overrides.attributes ?? [
      {
        id: 'attr-liking',
        name: 'Overall liking',
        instruction: 'How much do you like this sample overall?',
        scale: { kind: 'category', points: HEDONIC_9_LABELS.map((label, i) => ({ value: 9 - i, label })) },
        internalNote: 'SECRET note',
      },
    ],
    answers: overrides.answers ?? [],
    formulaName: 'SECRET formula',
  };
}
