import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime, isoDate, isoDateTime, todayIso } from '@/lib/format/dates';
import { walk } from '../../integration/routes';

// Source: ISO 8601-1:2019, 5.2.2 (calendar date YYYY-MM-DD) and 5.4.2 (date and time with UTC designator).
describe('the one date format', () => {
  it('screens and e-mails: day, short month, year — never a numeric day/month order', () => {
    expect(formatDate('2026-12-03')).toBe('3 Dec 2026');
    expect(formatDate('2026-03-12')).toBe('12 Mar 2026');
    expect(formatDate(new Date(Date.UTC(2026, 11, 3, 23, 59)))).toBe('3 Dec 2026');
    expect(formatDate('2026-12-03T14:05:09.000Z')).toBe('3 Dec 2026');
  });

  it('a calendar date stays its day in every time zone', () => {
    // "2026-01-01" parsed as a Date would be midnight UTC, which is 31 Dec in the Americas.
    expect(formatDate('2026-01-01')).toBe('1 Jan 2026');
  });

  it('with a time: 24-hour clock in UTC, said so', () => {
    expect(formatDateTime('2026-12-03T14:05:59.000Z')).toBe('3 Dec 2026, 14:05 UTC');
    expect(formatDateTime(new Date(Date.UTC(2026, 0, 9, 7, 3)))).toBe('9 Jan 2026, 07:03 UTC');
  });

  it('CSV and the API: ISO 8601', () => {
    expect(isoDate(new Date(Date.UTC(2026, 11, 3, 14, 5)))).toBe('2026-12-03');
    expect(isoDate('2026-12-03')).toBe('2026-12-03');
    expect(isoDateTime(new Date(Date.UTC(2026, 11, 3, 14, 5)))).toBe('2026-12-03T14:05:00.000Z');
    expect(todayIso(new Date(Date.UTC(2026, 11, 3, 23, 30)))).toBe('2026-12-03');
  });

  it('an unreadable value shows as a dash, never "Invalid Date"', () => {
    expect(formatDate('not a date')).toBe('—');
    expect(formatDateTime(null)).toBe('—');
    expect(() => isoDate('nope')).toThrow(RangeError);
  });
});

describe('no stray date formatting', () => {
  const ROOT = path.resolve(__dirname, '../../..');
  const files = ['components', 'app', 'lib'].flatMap((dir) => walk(path.join(ROOT, dir), (f) => /\.(ts|tsx)$/.test(f)));
  const STRAY = [
    /\.toLocaleDateString\(/, /\.toLocaleTimeString\(/, /\.toLocaleString\(/, /Intl\.DateTimeFormat/,
    /toISOString\(\)\.slice\(0, (10|16)\)/, /\.(at|createdAt|approvedAt|requestedAt|decidedAt|supersededAt|updatedAt)\??\.slice\(0, (10|16)\)/,
  ];

  it('dates on screens, in e-mails and in CSV go through lib/format/dates.ts', () => {
    const offenders: string[] = [];
    for (const file of files) {
      if (file.endsWith(path.join('lib', 'format', 'dates.ts'))) continue;
      readFileSync(file, 'utf8').split('\n').forEach((line, i) => {
        if (STRAY.some((re) => re.test(line))) offenders.push(`${path.relative(ROOT, file)}:${i + 1}: ${line.trim().slice(0, 120)}`);
      });
    }
    expect(offenders).toEqual([]);
  });
});
