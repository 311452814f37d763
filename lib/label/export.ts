/** The label's CSV export (server side: it loads the CSV writer). */
import { toCsv } from '@/lib/csv';
import { labelRows, type Label } from './label';

/** The label as CSV: one row per line of the label, with the unrounded figure where there is one. */
export function labelCsv(label: Label): string {
  const unrounded = new Map<string, number | null>();
  for (const r of label.eu.rows) unrounded.set(`eu.${r.key}`, r.unrounded);
  for (const r of label.us.rows) unrounded.set(`us.${r.key}`, r.unrounded);
  const rows = labelRows(label).map((r) => {
    const raw = unrounded.get(r.id);
    return [r.section, r.item, r.value, raw === undefined || raw === null ? '' : String(raw)];
  });
  for (const n of label.incomplete) rows.push(['Incomplete', n.part, n.reason, '']);
  return toCsv(rows, [
    { header: 'section', value: (r) => r[0] },
    { header: 'item', value: (r) => r[1] },
    { header: 'value', value: (r) => r[2] },
    { header: 'unrounded', value: (r) => r[3] },
  ]);
}
