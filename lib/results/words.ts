/**
 * The words of the results, on the page and in its CSVs alike (the CSVs in lower case, like every
 * other export's words): an ANOVA row's source and a penalty analysis's group, never their keys; and
 * a p-value as the page writes it. PURE and dependency-free: the results page renders in the browser
 * too, and must not pull the statistics in with its words.
 */
export const ANOVA_SOURCE_WORDS = { treatments: 'Samples', blocks: 'Assessors', error: 'Error', total: 'Total' } as const;
export const PENALTY_GROUP_WORDS = { tooLittle: 'Too little', justAboutRight: 'Just about right', tooMuch: 'Too much' } as const;

export function formatP(p: number | null): string {
  if (p === null) return 'p not available';
  if (p < 0.001) return 'p < 0.001';
  return `p = ${p.toFixed(3)}`;
}
