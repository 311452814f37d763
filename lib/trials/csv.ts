/**
 * Cooks in and out as CSV. Import is all-or-nothing: every row is checked first,
 * errors are reported by row and column, and nothing lands unless every row is good.
 */
import { getEm } from '@/lib/db';
import { Cook, Trial, Variant } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { ValidationFailed } from '@/lib/errors';
import { csvReadProblems, readCsv, toCsv } from '@/lib/csv';
import { parseDecimal } from '@/lib/input';
import { unreadableNumberMessage } from '@/lib/format/numbers';
import { cookSchema } from './schema';
import { cookColumns } from './mutations';
import { getTrialOverview } from './queries';
import { FACTOR_LABELS, TRIAL_FACTORS } from './vocabulary';
import { OVERALL_STATUS_LABELS } from '@/lib/chemistry';

/** CSV column → measurement field, with the parser for the cell text. */
export const COOK_CSV_COLUMNS = [
  { column: 'variant', field: 'variant', kind: 'text' },
  { column: 'cook_date', field: 'cookDate', kind: 'text' },
  { column: 'batch_size_g', field: 'batchSizeG', kind: 'number' },
  { column: 'brix_reading', field: 'brixReading', kind: 'number' },
  { column: 'brix_sample_temp_c', field: 'brixSampleTempC', kind: 'number' },
  { column: 'ph', field: 'ph', kind: 'number' },
  { column: 'end_point_c', field: 'endPointTempC', kind: 'number' },
  { column: 'boil_time_min', field: 'boilTimeMin', kind: 'number' },
  { column: 'set_test_score', field: 'setTestScore', kind: 'number' },
  { column: 'set_test_method', field: 'setTestMethod', kind: 'text' },
  { column: 'syneresis', field: 'syneresis', kind: 'text' },
  { column: 'colour_notes', field: 'colourNotes', kind: 'text' },
  { column: 'yield_jars', field: 'yieldJars', kind: 'number' },
  { column: 'yield_g', field: 'yieldG', kind: 'number' },
  { column: 'notes', field: 'notes', kind: 'text' },
] as const;

export const MAX_IMPORT_ROWS = 2000;

export interface CsvRowError {
  row: number;
  column: string;
  message: string;
}

/** Parses and checks; returns the rows ready to insert or every error found. Pure apart from the label map. */
export function parseCookCsv(text: string, variantIdByLabel: Map<string, string>): { rows: Array<Parameters<typeof cookColumns>[0] & { variantId: string }>; errors: CsvRowError[] } {
  const parsed = readCsv(text);
  const errors: CsvRowError[] = [];
  const headers = parsed.meta.fields ?? [];
  const known = new Set<string>(COOK_CSV_COLUMNS.map((c) => c.column));
  for (const h of headers) if (!known.has(h)) errors.push({ row: 1, column: h, message: `Unknown column “${h}”. Known columns: ${[...known].join(', ')}.` });
  for (const required of ['variant', 'cook_date']) if (!headers.includes(required)) errors.push({ row: 1, column: required, message: `The column “${required}” is required.` });
  for (const e of csvReadProblems(parsed)) errors.push({ ...e, column: '' });
  if (errors.length) return { rows: [], errors };
  if (parsed.data.length === 0) return { rows: [], errors: [{ row: 2, column: '', message: 'The file has a header but no rows.' }] };
  if (parsed.data.length > MAX_IMPORT_ROWS) return { rows: [], errors: [{ row: MAX_IMPORT_ROWS + 2, column: '', message: `At most ${MAX_IMPORT_ROWS} rows per import.` }] };

  const rows: Array<Parameters<typeof cookColumns>[0] & { variantId: string }> = [];
  parsed.data.forEach((record, i) => {
    const rowNumber = i + 2; // the header is row 1, as a spreadsheet shows it
    const candidate: Record<string, unknown> = {};
    let rowOk = true;
    for (const col of COOK_CSV_COLUMNS) {
      const raw = (record[col.column] ?? '').trim();
      if (col.field === 'variant') {
        const id = variantIdByLabel.get(raw.toUpperCase());
        if (!id) {
          errors.push({ row: rowNumber, column: col.column, message: raw ? `No variant “${raw}” in this trial.` : 'Say which variant (its label, e.g. B).' });
          rowOk = false;
        } else candidate.variantId = id;
        continue;
      }
      if (raw === '') continue;
      if (col.kind === 'number') {
        const n = parseDecimal(raw);
        if (!Number.isFinite(n)) {
          errors.push({ row: rowNumber, column: col.column, message: unreadableNumberMessage(raw) });
          rowOk = false;
        } else candidate[col.field] = n;
      } else candidate[col.field] = raw;
    }
    if (!rowOk) return;
    const result = cookSchema.safeParse(candidate);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const field = String(issue.path[0] ?? '');
        const column = COOK_CSV_COLUMNS.find((c) => c.field === field)?.column ?? field;
        errors.push({ row: rowNumber, column, message: issue.message });
      }
      return;
    }
    const { variantId, ...rest } = result.data;
    rows.push({ ...rest, variantId });
  });
  return { rows: errors.length ? [] : rows, errors };
}

export async function importCooksCsv(actor: Actor, trialId: string, text: string): Promise<{ imported: number }> {
  const em = await getEm();
  const trial = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  if (!trial) throw notFound('trial');
  const variants = await em.find(Variant, { ...inWorkspace(actor), trial: trialId, removedAt: null });
  const { rows, errors } = parseCookCsv(text, new Map(variants.map((v) => [v.label.toUpperCase(), v.id])));
  if (errors.length) {
    const fields: Record<string, string[]> = {};
    for (const e of errors) (fields[`row ${e.row}${e.column ? `, ${e.column}` : ''}`] ??= []).push(e.message);
    throw new ValidationFailed(`Nothing was imported: ${errors.length} problem${errors.length > 1 ? 's' : ''} in the file.`, fields);
  }
  await em.transactional(async (tx) => {
    for (const r of rows) {
      const { variantId, ...rest } = r;
      tx.create(Cook, { workspace: actor.workspaceId, variant: variantId, recordedBy: actor.userId, ...cookColumns(rest) });
    }
  });
  return { imported: rows.length };
}

/** One row per cook (variants without a cook get one row of predictions), long enough for any statistics package. */
export async function exportTrialCsv(actor: Actor, trialId: string): Promise<{ filename: string; csv: string }> {
  const t = await getTrialOverview(actor, trialId);
  type Row = { v: (typeof t.variants)[number]; m: (typeof t.variants)[number]['cooks'][number] | null };
  const rows: Row[] = t.variants.flatMap((v): Row[] => (v.cooks.length ? v.cooks.map((m) => ({ v, m })) : [{ v, m: null }]));
  const level = (r: Row, f: (typeof TRIAL_FACTORS)[number]) => r.v.factorLevels.find((l) => l.factor === f)?.value ?? '';
  const predicted = (r: Row, key: string) => r.m?.comparison.rows.find((x) => x.key === key)?.predicted ?? '';
  const csv = toCsv(rows, [
    { header: 'trial', value: () => t.code },
    { header: 'variant', value: (r) => r.v.label },
    { header: 'description', value: (r) => r.v.description },
    ...TRIAL_FACTORS.map((f) => ({ header: `${f} (${FACTOR_LABELS[f].unit})`, value: (r: Row) => level(r, f) })),
    { header: 'predicted_finished_mass_g', value: (r) => r.v.computation?.massBalance.finishedMassG ?? '' },
    { header: 'target_solids_pct', value: (r) => r.v.settings.targetSolidsPct },
    { header: 'predicted_aw', value: (r) => r.v.computation?.waterActivity.aw ?? '' },
    { header: 'predicted_end_point_c', value: (r) => r.v.computation?.endPoint.endPointC ?? '' },
    { header: 'compliance', value: (r) => (r.v.computation ? OVERALL_STATUS_LABELS[r.v.computation.compliance.overall] : '') },
    { header: 'cook_date', value: (r) => r.m?.cookDate ?? '' },
    { header: 'batch_size_g', value: (r) => r.m?.batchSizeG ?? '' },
    { header: 'predicted_finished_mass_for_batch_g', value: (r) => predicted(r, 'finished_mass') },
    { header: 'yield_g', value: (r) => r.m?.yieldG ?? '' },
    { header: 'yield_jars', value: (r) => r.m?.yieldJars ?? '' },
    { header: 'brix_reading', value: (r) => r.m?.brixReading ?? '' },
    { header: 'brix_sample_temp_c', value: (r) => r.m?.brixSampleTempC ?? '' },
    { header: 'brix_corrected_20c', value: (r) => r.m?.comparison.correctedBrix ?? '' },
    { header: 'ph', value: (r) => r.m?.ph ?? '' },
    { header: 'end_point_c', value: (r) => r.m?.endPointTempC ?? '' },
    { header: 'boil_time_min', value: (r) => r.m?.boilTimeMin ?? '' },
    { header: 'set_test_score', value: (r) => r.m?.setTestScore ?? '' },
    { header: 'set_test_method', value: (r) => r.m?.setTestMethod ?? '' },
    { header: 'syneresis', value: (r) => r.m?.syneresis ?? '' },
    { header: 'colour_notes', value: (r) => r.m?.colourNotes ?? '' },
    { header: 'notes', value: (r) => r.m?.notes ?? '' },
  ]);
  return { filename: `${t.code}-cooks.csv`, csv };
}
