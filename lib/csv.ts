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

/** What the reader could not read, by row, in plain words (plainCsvProblem). */
export function csvReadProblems(parsed: Papa.ParseResult<unknown>): Array<{ row: number; message: string }> {
  const columns = parsed.meta.fields?.length ?? 0;
  // As a spreadsheet numbers rows (the header is row 1): the library counts a quote error's row from
  // the header line, any other from the first data row.
  const rowOf = (e: Papa.ParseError) => (e.row ?? 0) + (e.type === 'Quotes' ? 1 : 2);
  const quoteRows = new Set(parsed.errors.filter((e) => e.type === 'Quotes').map(rowOf));
  const problems = parsed.errors
    // A guess at the separator: the header's columns show it was a comma after all.
    .filter((e) => !(e.code === 'UndetectableDelimiter' && columns > 1))
    // A quote left open swallows the cells after it: the cell count is its consequence, not a second problem.
    .filter((e) => !(e.type === 'FieldMismatch' && quoteRows.has(rowOf(e))))
    .map((e) => ({ row: rowOf(e), message: plainCsvProblem(e, columns) }));
  return problems.filter((p, i) => problems.findIndex((q) => q.row === p.row && q.message === p.message) === i);
}

/**
 * A reader's complaint in plain words: the CSV library's own wording ("Quoted field unterminated",
 * "Too few fields: expected 5 fields but parsed 3") means nothing to a user.
 */
export function plainCsvProblem(e: Pick<Papa.ParseError, 'code' | 'message'>, columns: number): string {
  const parsedCells = /parsed (\d+)/.exec(e.message)?.[1];
  const cells = parsedCells ? `${parsedCells} cell${parsedCells === '1' ? '' : 's'}` : 'a different number of cells';
  switch (e.code) {
    case 'MissingQuotes':
      return 'A cell opens with a double quote (") that is never closed, so the rest of the file reads as one cell. Close the quote, or remove it.';
    case 'InvalidQuotes':
      return 'A cell in double quotes has a stray quote inside it. Inside quotes, write a double quote as two ("").';
    case 'TooFewFields':
      return `This row has ${cells}, fewer than the ${columns} columns of the header row. Check for a missing comma or a line break inside a cell.`;
    case 'TooManyFields':
      return `This row has ${cells}, more than the ${columns} columns of the header row. A cell holding a comma must be in double quotes.`;
    case 'UndetectableDelimiter':
      return 'The cells are not separated by commas. Save the file as CSV with commas between cells.';
    default:
      return 'This row cannot be read as CSV. Save the file from the spreadsheet as CSV and try again.';
  }
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
