/** Join-code handling for the taster's phone. */

export const JOIN_CODE_LENGTH = 6;
export const DISPLAY_NAME_MAX = 40;
/** Remembers the last seat on this phone so a reload of /join can offer to continue. */
export const LAST_SEAT_STORAGE_KEY = 'setwell.tasting.lastSeat';

/**
 * The seats this phone joined, with the code each was joined with (newest last, at most
 * JOINED_SEATS_MAX): a phone that has submitted for a tasting says so before it takes another seat there.
 */
export const JOINED_SEATS_STORAGE_KEY = 'setwell.tasting.joinedSeats';
export const JOINED_SEATS_MAX = 20;
export type JoinedSeat = { joinCode: string; seatToken: string };

/** PURE. The stored list read back; anything that is not such a list reads as none. */
export function readJoinedSeats(stored: string | null): JoinedSeat[] {
  try {
    const list: unknown = JSON.parse(stored ?? '[]');
    if (!Array.isArray(list)) return [];
    return list.filter((x): x is JoinedSeat => typeof x === 'object' && x !== null && typeof x.joinCode === 'string' && isPlausibleSeatToken(x.seatToken));
  } catch {
    return [];
  }
}

/** PURE. The list with one more seat, the oldest dropped past the limit. */
export function withJoinedSeat(list: JoinedSeat[], seat: JoinedSeat): JoinedSeat[] {
  return [...list.filter((x) => x.seatToken !== seat.seatToken), seat].slice(-JOINED_SEATS_MAX);
}

/** Upper-cases and keeps letters and digits only, at most six. */
export function normalizeJoinCode(input: string): string {
  return input
    .toUpperCase()
    .replace(/[^A-Z0-9]/g, '')
    .slice(0, JOIN_CODE_LENGTH);
}

export interface JoinProblems {
  joinCode?: string;
  displayName?: string;
}

export function checkJoinInput(joinCode: string, displayName: string): JoinProblems {
  const problems: JoinProblems = {};
  if (normalizeJoinCode(joinCode).length !== JOIN_CODE_LENGTH) problems.joinCode = `The code has ${JOIN_CODE_LENGTH} letters or digits.`;
  const name = displayName.trim();
  if (name.length < 1) problems.displayName = 'Tell us what to call you.';
  else if (name.length > DISPLAY_NAME_MAX) problems.displayName = `Keep it to ${DISPLAY_NAME_MAX} characters.`;
  return problems;
}

/** Seat tokens go into a URL path; anything outside this alphabet is not a token we made. */
export function isPlausibleSeatToken(value: unknown): value is string {
  return typeof value === 'string' && /^[A-Za-z0-9_-]{8,200}$/.test(value);
}
