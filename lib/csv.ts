/**
 * CSV out for people who analyse in spreadsheets, and back in. Cells that a spreadsheet would run as
 * a formula are defused on the way out (OWASP "CSV Injection": a leading apostrophe); readCsv takes
 * exactly that apostrophe off again, so an exported file imports back unchanged.
 */
import Papa from 'papaparse';

// Apostrophes before a formula start are guarded too, so a name that truly begins "'+" survives the round trip.
const FORMULA_START = /^'*[=+\-@\t\r]/;

export function defuse(value: unknown): unknown {
  if (typeof value === 'string' && FORMULA_START.test(value)) return `'${value}`;
  return value;
}

/** A cell as it was before defuse(): the one apostrophe export put before a formula start comes off, nothing else. */
export function undefuse(cell: string): string {
  return cell.startsWith("'") && FORMULA_START.test(cell.slice(1)) ? cell.slice(1) : cell;
}

/**
 * The imports' one reader: a header row (names trimmed, lower case), blank lines skipped, a byte-order
 * mark ignored, and every cell undefused.
 */
export function readCsv(text: string): Papa.ParseResult<Record<string, string>> {
  return Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
    transform: (value) => undefuse(value),
  });
}

/**
 * A number as a spreadsheet should read it: 12 significant digits, so binary noise such as
 * 6.199999999999999 goes out as 6.2 while every digit a measurement or a statistic carries stays.
 */
export function csvNumber(value: number): number {
  return Number.isFinite(value) ? Number(value.toPrecision(12)) + 0 : value;
}

export function toCsv<T>(rows: T[], columns: Array<{ header: string; value: (row: T) => unknown }>): string {
  const cell = (v: unknown) => (typeof v === 'number' ? csvNumber(v) : defuse(v ?? ''));
  return Papa.unparse({
    fields: columns.map((c) => c.header),
    data: rows.map((r) => columns.map((c) => cell(c.value(r)))),
  });
}

export function csvResponse(csv: string, filename: string): Response {
  return new Response(csv, {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${filename.replace(/[^\w.-]/g, '_')}"`,
      'cache-control': 'no-store',
    },
  });
}
