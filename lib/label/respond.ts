/** The label endpoints' answer: the view as JSON, or the label as a CSV or JSON download (?format=). */
import { json } from '@/lib/api/route';
import { csvResponse } from '@/lib/csv';
import { Conflict } from '@/lib/errors';
import { labelCsv } from './export';
import type { LabelQuery, LabelView } from './schema';

export function labelResponse(view: LabelView, format: LabelQuery['format']): Response {
  const fileName = `label-${view.subject.name.replace(/[^\w.-]+/g, '-').toLowerCase()}`;
  // Nothing to download while the formula cannot be computed.
  if (format && !view.label) throw new Conflict(view.problem ?? 'The formula cannot be computed.');
  if (format === 'csv') return csvResponse(labelCsv(view.label!), `${fileName}.csv`);
  if (format === 'json') {
    return json(view.label, 200, { 'content-disposition': `attachment; filename="${fileName}.json"` });
  }
  return json({ label: view.label, problem: view.problem, kept: view.kept, reference: view.reference, subject: view.subject });
}
