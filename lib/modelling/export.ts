/** CSV of a family's data set and of one response's coefficients (ISO dates, factor names in words). PURE. */
import { toCsv } from '@/lib/csv';
import type { RegressionFit } from '@/lib/models';
import { FACTOR_INFO, MODEL_FACTORS, PECTIN_FAMILY_LABELS, termInWords, type Dataset, type FamilyInfo, type ResponseModel } from './schema';

export function datasetCsv(dataset: Dataset): string {
  const columns: Array<{ header: string; value: (row: Dataset['rows'][number]) => unknown }> = [
    { header: 'trial', value: (r) => r.trialCode },
    { header: 'trial_title', value: (r) => r.trialTitle },
    { header: 'first_cook', value: (r) => r.trialDate },
    { header: 'variant', value: (r) => r.variantLabel },
    { header: 'pectin', value: (r) => PECTIN_FAMILY_LABELS[r.pectinFamily] },
    ...MODEL_FACTORS.map((f) => ({ header: `${FACTOR_INFO[f].name} (${FACTOR_INFO[f].unit})`, value: (r: Dataset['rows'][number]) => r.factors[f] })),
  ];
  for (const response of dataset.responses) {
    columns.push(
      { header: `${response.name} mean`, value: (r) => r.responses[response.key]?.mean },
      { header: `${response.name} n`, value: (r) => r.responses[response.key]?.n },
      { header: `${response.name} SD`, value: (r) => r.responses[response.key]?.sd },
    );
  }
  return toCsv(dataset.rows, columns);
}

/** One row per response and term. */
export function coefficientsCsv(responses: ReadonlyArray<Pick<ResponseModel, 'name'> & { surface: { fit: RegressionFit } }>): string {
  const rows = responses.flatMap((response) => response.surface.fit.terms.map((term) => ({ response: response.name, ...term })));
  return toCsv(rows, [
    { header: 'response', value: (t) => t.response },
    { header: 'term', value: (t) => termInWords(t.name) },
    { header: 'estimate_per_coded_unit', value: (t) => t.estimate },
    { header: 'standard_error', value: (t) => t.standardError },
    { header: 't', value: (t) => t.t },
    { header: 'p', value: (t) => t.p },
    { header: 'aliased_with', value: (t) => t.aliasedWith.map(termInWords).join('; ') },
  ]);
}

/** A file name from the family and today's ISO date. */
export function exportName(family: FamilyInfo, what: string, today: string): string {
  return `${family.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${what}-${today}.csv`;
}
