/**
 * Scale definitions as plain data, so the tasting screen, the serving sheet and the
 * analysis all read the same anchors and bounds.
 */
import { unitNote } from '@/lib/format/words';

export interface CategoryPoint {
  value: number;
  label: string;
}

/** A scale of labelled points; only the listed whole-number values are valid. */
export interface CategoryScale {
  kind: 'category';
  id: string;
  name: string;
  purpose: 'liking' | 'just-about-right';
  /** Points from the highest value down, as they are usually shown. */
  points: readonly CategoryPoint[];
  /** For just-about-right scales: the value that means "just about right". */
  justRightValue?: number;
  source: string;
}

/** An unstructured line with labelled ends; tasters mark anywhere between them. */
export interface LineScale {
  kind: 'line';
  id: string;
  name: string;
  purpose: 'intensity';
  minValue: number;
  maxValue: number;
  /** Smallest recorded step; a phone slider stores values rounded to this. */
  resolution: number;
  lowAnchor: string;
  highAnchor: string;
  source: string;
}

export type SensoryScale = CategoryScale | LineScale;

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object') {
    for (const nested of Object.values(value as Record<string, unknown>)) deepFreeze(nested);
    Object.freeze(value);
  }
  return value;
}

/** 9-point hedonic scale with the published verbal anchors. */
export const HEDONIC_9_POINT: CategoryScale = deepFreeze({
  kind: 'category',
  id: 'hedonic-9',
  name: '9-point hedonic',
  purpose: 'liking',
  points: [
    { value: 9, label: 'Like extremely' },
    { value: 8, label: 'Like very much' },
    { value: 7, label: 'Like moderately' },
    { value: 6, label: 'Like slightly' },
    { value: 5, label: 'Neither like nor dislike' },
    { value: 4, label: 'Dislike slightly' },
    { value: 3, label: 'Dislike moderately' },
    { value: 2, label: 'Dislike very much' },
    { value: 1, label: 'Dislike extremely' },
  ],
  source: 'Peryam & Pilgrim (1957), Hedonic scale method of measuring food preferences',
});

/**
 * 5-point just-about-right scale for one attribute. The wording is the standard JAR form
 * (memory); structure per ASTM MNL 63, Just-About-Right (JAR) Scales (Rothman & Parker, 2009).
 */
export function makeJustAboutRightScale(id: string, name: string): CategoryScale {
  return deepFreeze({
    kind: 'category',
    id,
    name,
    purpose: 'just-about-right',
    points: [
      { value: 5, label: 'Much too much' },
      { value: 4, label: 'Somewhat too much' },
      { value: 3, label: 'Just about right' },
      { value: 2, label: 'Somewhat too little' },
      { value: 1, label: 'Much too little' },
    ],
    justRightValue: 3,
    // (memory) The point wording was recalled, not copied from the manual.
    source: 'ASTM MNL 63, Just-About-Right (JAR) Scales (2009)',
  });
}

/** The generic JAR scale, for attributes without their own definition. */
export const JUST_ABOUT_RIGHT_5_POINT: CategoryScale = makeJustAboutRightScale(
  'jar-5',
  '5-point just-about-right',
);

/** Default resolution of intensity lines: one decimal place on a 0–10 line. */
export const INTENSITY_LINE_RESOLUTION = 0.1;

/** A 0–10 intensity line with end anchors worded for one attribute. */
export function makeIntensityLine(
  id: string,
  name: string,
  lowAnchor: string,
  highAnchor: string,
): LineScale {
  if (lowAnchor.trim() === '' || highAnchor.trim() === '') {
    throw new Error('An intensity line needs wording at both ends.');
  }
  return deepFreeze({
    kind: 'line',
    id,
    name,
    purpose: 'intensity',
    minValue: 0,
    maxValue: 10,
    resolution: INTENSITY_LINE_RESOLUTION,
    lowAnchor,
    highAnchor,
    source: 'Setwell wording for the end anchors',
  });
}

/** Set firmness line: the attribute preserve makers check first. */
export const SET_FIRMNESS_LINE: LineScale = makeIntensityLine(
  'intensity-set-firmness',
  'Set firmness',
  'Very loose',
  'Very firm',
);

/** Labels a category value, e.g. 7 on the hedonic scale → "Like moderately". */
export function categoryLabel(scale: CategoryScale, value: number): string | undefined {
  return scale.points.find((point) => point.value === value)?.label;
}

/** Tolerance for float noise when checking a line value against its resolution. */
const RESOLUTION_TOLERANCE = 1e-9;

/**
 * True when a recorded answer is allowed on the scale: one of the listed points for a
 * category scale; a finite number within bounds, on the resolution grid, for a line.
 */
export function isValidScaleValue(scale: SensoryScale, value: unknown): value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) return false;
  if (scale.kind === 'category') {
    return scale.points.some((point) => point.value === value);
  }
  if (value < scale.minValue || value > scale.maxValue) return false;
  const steps = (value - scale.minValue) / scale.resolution;
  return Math.abs(steps - Math.round(steps)) < RESOLUTION_TOLERANCE * Math.max(1, Math.abs(steps));
}

/** Rounds a slider position onto the line's grid and clamps it to the ends. */
export function snapLineValue(scale: LineScale, rawValue: number): number {
  if (!Number.isFinite(rawValue)) throw new RangeError(`Line value ${rawValue} is not a number.`);
  const clamped = Math.min(scale.maxValue, Math.max(scale.minValue, rawValue));
  const steps = Math.round((clamped - scale.minValue) / scale.resolution);
  // Fixing the decimals keeps 0.1 × 3 from being stored as 0.30000000000000004.
  const decimals = Math.max(0, -Math.floor(Math.log10(scale.resolution)));
  return Number((scale.minValue + steps * scale.resolution).toFixed(decimals));
}

/** The scale's name beside an attribute's, unless it only repeats it (an intensity line is named after its attribute). */
export function scaleNote(attributeName: string, scaleName: string): string | null {
  return unitNote(attributeName, scaleName);
}
