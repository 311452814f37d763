/**
 * What the results charts draw, computed without chart.js so it can be tested: confidence whiskers
 * cut at the ends of the scale, diverging just-about-right shares, and the attributes grouped by the
 * scale they were scored on. Pure.
 */
import type { TastingDataAttribute } from './analysis';

export interface ScaleRange {
  min: number;
  max: number;
  /** "1–9 hedonic", as the chart's axis and heading say it. */
  name: string;
}

/** The scales tasters answer on: 9-point hedonic liking, 5-point just-about-right, 0–10 intensity line. */
export const SCALE_RANGES: Record<TastingDataAttribute['purpose'], ScaleRange> = {
  liking: { min: 1, max: 9, name: 'Liking, 1–9 hedonic scale' },
  'just-about-right': { min: 1, max: 5, name: 'Just about right, 1–5 (3 = just right)' },
  intensity: { min: 0, max: 10, name: 'Intensity, 0–10 line scale' },
};

export interface ClippedInterval {
  lower: number;
  upper: number;
  /** The interval ran past the scale at that end and was cut there. */
  clippedLower: boolean;
  clippedUpper: boolean;
  /** The interval as computed, for the note under the chart. */
  rawLower: number;
  rawUpper: number;
}

/**
 * A t-interval can run past the ends of a bounded scale (a mean of 4.8 on 1–5 with a wide spread);
 * no score can lie there, so the whisker stops at the end and says it was cut.
 */
export function clipInterval(interval: readonly [number, number] | null, scale: Pick<ScaleRange, 'min' | 'max'>): ClippedInterval | null {
  if (!interval) return null;
  const [rawLower, rawUpper] = interval;
  return {
    lower: Math.max(scale.min, rawLower),
    upper: Math.min(scale.max, rawUpper),
    clippedLower: rawLower < scale.min,
    clippedUpper: rawUpper > scale.max,
    rawLower,
    rawUpper,
  };
}

/** One sentence naming the samples whose whiskers were cut, or null when none were. */
export function clippingNote(labels: readonly string[], intervals: readonly (ClippedInterval | null)[], scale: Pick<ScaleRange, 'min' | 'max'>): string | null {
  const cut = labels.flatMap((label, i) => {
    const ci = intervals[i];
    if (!ci || !(ci.clippedLower || ci.clippedUpper)) return [];
    const ends = [ci.clippedLower ? `${ci.rawLower.toFixed(2)}` : null, ci.clippedUpper ? `${ci.rawUpper.toFixed(2)}` : null].filter(Boolean).join(' and ');
    return [`${label} (to ${ends})`];
  });
  if (!cut.length) return null;
  return `The 95 % interval of ${cut.join(', ')} runs past the ${scale.min}–${scale.max} scale; its whisker is cut at the end of the scale and drawn open.`;
}

export interface JarShareRow {
  label: string;
  tooLittle: number;
  justAboutRight: number;
  tooMuch: number;
  n: number;
}

/**
 * Diverging bars: "just about right" sits across the centre line, half each side; "too little"
 * extends left of it and "too much" right. Values are % of the sample's tasters, negative to the left.
 */
export function jarDiverging(rows: readonly JarShareRow[]): { labels: string[]; tooLittle: number[]; justRightLeft: number[]; justRightRight: number[]; tooMuch: number[] } {
  const pct = (x: number, n: number) => (n ? (100 * x) / n : 0);
  return {
    labels: rows.map((r) => r.label),
    justRightLeft: rows.map((r) => -pct(r.justAboutRight, r.n) / 2),
    tooLittle: rows.map((r) => -pct(r.tooLittle, r.n)),
    justRightRight: rows.map((r) => pct(r.justAboutRight, r.n) / 2),
    tooMuch: rows.map((r) => pct(r.tooMuch, r.n)),
  };
}

/** Attributes grouped by the scale they were scored on, in the order liking, JAR, intensity. */
export function groupByScale<T extends { attribute: Pick<TastingDataAttribute, 'purpose'> }>(items: readonly T[]): Array<{ purpose: TastingDataAttribute['purpose']; scale: ScaleRange; items: T[] }> {
  return (['liking', 'just-about-right', 'intensity'] as const)
    .map((purpose) => ({ purpose, scale: SCALE_RANGES[purpose], items: items.filter((x) => x.attribute.purpose === purpose) }))
    .filter((g) => g.items.length > 0);
}
