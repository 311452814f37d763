/**
 * Rounding to a step the way a person reads it on a label: half away from zero on the decimal
 * value (0.15 → 0.2), not on its binary approximation (0.15 × 10 = 1.4999… in floating point).
 * Pure.
 */

/** Digits after the point a step shows: 1 → 0, 0.5 → 1, 0.01 → 2. */
export function stepDecimals(step: number): number {
  const text = String(step);
  const point = text.indexOf('.');
  return point < 0 ? 0 : text.length - point - 1;
}

/** Nearest multiple of `step` (a power of ten, or 0.5/5/10-type step), half up, free of binary noise. */
export function roundToStep(value: number, step: number): number {
  // 12 significant digits drop the binary tail of the scaled value but keep every real digit.
  const scaled = Number((value / step).toPrecision(12));
  const rounded = Math.round(scaled) * step;
  return Number(rounded.toFixed(stepDecimals(step)));
}

/** The rounded value written with the step's decimals: roundToStep(9.96, 0.1) → "10.0". */
export function formatToStep(value: number, step: number): string {
  return roundToStep(value, step).toFixed(stepDecimals(step));
}

/** "pectin", "pectin and sugar", "pectin, sugar and citric acid". */
export function listInWords(names: readonly string[]): string {
  if (names.length <= 1) return names.join('');
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** Names in first-seen order, each once. */
export function unionOfNames(...lists: ReadonlyArray<readonly string[] | undefined>): string[] {
  const names: string[] = [];
  for (const list of lists) for (const name of list ?? []) if (!names.includes(name)) names.push(name);
  return names;
}

/** The note beside an incomplete figure, in words for the screen; null when complete. */
export function incompleteNote(unknownFrom: readonly string[]): string | null {
  return unknownFrom.length === 0 ? null : `Incomplete: no figure for ${listInWords(unknownFrom)}`;
}
