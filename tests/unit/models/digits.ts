/** Correct significant digits of `value` against `reference` (the log relative error; NIST's LRE). */
export function agreeingDigits(value: number | null, reference: number): number {
  if (value === null || !Number.isFinite(value)) return 0;
  if (value === reference) return 15;
  const error = reference === 0 ? Math.abs(value) : Math.abs(value - reference) / Math.abs(reference);
  return Math.min(15, -Math.log10(error));
}

/** The fewest agreeing digits over a list. */
export function fewestDigits(values: ReadonlyArray<number | null>, references: readonly number[]): number {
  return Math.min(...references.map((reference, i) => agreeingDigits(values[i], reference)));
}
