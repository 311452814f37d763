/**
 * The one date format of the app. Pure; no Intl or locale, so the server and the browser print the
 * same text (no hydration mismatch) and a date never reads two ways (03/12 vs 12/03).
 *   - screens and e-mails: "3 Dec 2026", with a time "3 Dec 2026, 14:05 UTC";
 *   - CSV and the API: ISO 8601 ("2026-12-03", "2026-12-03T14:05:00.000Z").
 * Times are shown in UTC and say so: there is no workspace or user time-zone setting yet.
 */

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

type DateInput = Date | string;

const DATE_ONLY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A calendar date ("2026-12-03") stays that day; a timestamp is read in UTC. */
function parts(value: DateInput): { y: number; m: number; d: number; hh: number; mm: number } | null {
  if (typeof value === 'string') {
    const only = DATE_ONLY.exec(value);
    if (only) return { y: Number(only[1]), m: Number(only[2]), d: Number(only[3]), hh: 0, mm: 0 };
  }
  const date = typeof value === 'string' ? new Date(value) : value;
  if (Number.isNaN(date.getTime())) return null;
  return { y: date.getUTCFullYear(), m: date.getUTCMonth() + 1, d: date.getUTCDate(), hh: date.getUTCHours(), mm: date.getUTCMinutes() };
}

const pad = (n: number) => String(n).padStart(2, '0');

/** "3 Dec 2026" — screens and e-mails. An unreadable value prints as "—". */
export function formatDate(value: DateInput | null | undefined): string {
  const p = value == null ? null : parts(value);
  return p ? `${p.d} ${MONTHS[p.m - 1]} ${p.y}` : '—';
}

/** "3 Dec 2026, 14:05 UTC" — screens and e-mails. */
export function formatDateTime(value: DateInput | null | undefined): string {
  const p = value == null ? null : parts(value);
  return p ? `${p.d} ${MONTHS[p.m - 1]} ${p.y}, ${pad(p.hh)}:${pad(p.mm)} UTC` : '—';
}

/** "2026-12-03" — CSV, the API, form values of date inputs. */
export function isoDate(value: DateInput): string {
  const p = parts(value);
  if (!p) throw new RangeError('Not a date.');
  return `${p.y}-${pad(p.m)}-${pad(p.d)}`;
}

/** Full ISO 8601 in UTC — CSV and the API. */
export function isoDateTime(value: Date | string): string {
  return (typeof value === 'string' ? new Date(value) : value).toISOString();
}

/** Today's calendar date in UTC, for date inputs' defaults. */
export function todayIso(now: Date = new Date()): string {
  return isoDate(now);
}

/** The calendar date `days` after an ISO date ("2026-12-31" + 1 → "2027-01-01"; negative goes back). */
export function addDaysIso(day: string, days: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}
