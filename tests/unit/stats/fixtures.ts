/**
 * Published data sets used by the statistics tests. Each one names its source.
 */

// Source: Montgomery, Design and Analysis of Experiments, Example 4.1 (vascular graft, RCBD):
// four extrusion pressures (treatments) × six batches of resin (blocks).
export const vascularGraft: Record<string, number[]> = {
  '8500': [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  '8700': [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  '8900': [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  '9100': [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
};

export function vascularGraftObservations(offset = 0) {
  return Object.entries(vascularGraft).flatMap(([treatment, values]) =>
    values.map((value, block) => ({ treatment, block: `batch ${block + 1}`, value: value + offset })),
  );
}

// Source: Montgomery, Design and Analysis of Experiments, Example 3.1 (plasma etch rate, Å/min, by RF power in W).
export const etchRate: { label: string; values: number[] }[] = [
  { label: '160 W', values: [575, 542, 530, 539, 570] },
  { label: '180 W', values: [565, 593, 590, 579, 610] },
  { label: '200 W', values: [600, 651, 610, 637, 629] },
  { label: '220 W', values: [725, 700, 715, 685, 710] },
];

// Source: R datasets::warpbreaks (Tippett 1950), as stored in a public CSV copy
// (breaks, wool, tension), 9 looms per wool × tension cell.
export const warpbreaks: { breaks: number; wool: 'A' | 'B'; tension: 'L' | 'M' | 'H' }[] = (
  [
    ['A', 'L', [26, 30, 54, 25, 70, 52, 51, 26, 67]],
    ['A', 'M', [18, 21, 29, 17, 12, 18, 35, 30, 36]],
    ['A', 'H', [36, 21, 24, 18, 10, 43, 28, 15, 26]],
    ['B', 'L', [27, 14, 29, 19, 29, 31, 41, 20, 44]],
    ['B', 'M', [42, 26, 19, 16, 39, 28, 21, 39, 29]],
    ['B', 'H', [20, 21, 24, 17, 13, 15, 15, 16, 28]],
  ] as const
).flatMap(([wool, tension, values]) => values.map((breaks) => ({ breaks, wool, tension })));

// Source: R stats::friedman.test help page example "RoundingTimes"
// (Hollander & Wolfe 1973, Nonparametric Statistical Methods, p. 140 ff.):
// 22 players × 3 methods of rounding first base, times in s.
export const roundingTimes: number[][] = [
  [5.4, 5.5, 5.55], [5.85, 5.7, 5.75], [5.2, 5.6, 5.5], [5.55, 5.5, 5.4], [5.9, 5.85, 5.7],
  [5.45, 5.55, 5.6], [5.4, 5.4, 5.35], [5.45, 5.5, 5.35], [5.25, 5.15, 5.0], [5.85, 5.8, 5.7],
  [5.25, 5.2, 5.1], [5.65, 5.55, 5.45], [5.6, 5.35, 5.45], [5.05, 5.0, 4.95], [5.5, 5.5, 5.4],
  [5.45, 5.55, 5.5], [5.55, 5.55, 5.35], [5.45, 5.5, 5.55], [5.5, 5.45, 5.25], [5.65, 5.6, 5.4],
  [5.7, 5.65, 5.55], [6.3, 6.3, 6.25],
];
export const roundingMethods = ['Round Out', 'Narrow Angle', 'Wide Angle'];

/** Walk a result and check every number is finite (JSON.stringify would hide NaN as null). */
export function collectNonFiniteNumbers(value: unknown, path = 'result', found: string[] = []): string[] {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) found.push(`${path} = ${value}`);
  } else if (Array.isArray(value)) {
    value.forEach((item, index) => collectNonFiniteNumbers(item, `${path}[${index}]`, found));
  } else if (value !== null && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) collectNonFiniteNumbers(item, `${path}.${key}`, found);
  }
  return found;
}
