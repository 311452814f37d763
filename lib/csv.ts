/** CSV out for people who analyse in spreadsheets. Cells that a spreadsheet would run as a formula are defused. */
import Papa from 'papaparse';

const FORMULA_START = /^[=+\-@\t\r]/;

function defuse(value: unknown): unknown {
  if (typeof value === 'string' && FORMULA_START.test(value)) return `'${value}`;
  return value;
}

export function toCsv<T>(rows: T[], columns: Array<{ header: string; value: (row: T) => unknown }>): string {
  return Papa.unparse({
    fields: columns.map((c) => c.header),
    data: rows.map((r) => columns.map((c) => defuse(c.value(r) ?? ''))),
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
