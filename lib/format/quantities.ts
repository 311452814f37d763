/**
 * Quantities on screens and in entry boxes: numbers with their units (g/kg/lb/oz, °C/°F, m/ft), signed
 * differences, and values kept in storage units (grams, metres, °C) while shown in display units, so
 * toggling units back and forth never drifts. PURE: no React or Next imports.
 */
import { celsiusToFahrenheit, fahrenheitToCelsius, formatMass, fromGrams, METRES_PER_FOOT, toGrams, type LineUnit, type UnitPreference } from '@/lib/chemistry';
import { readDecimal } from '@/lib/format/numbers';

export type TemperatureUnit = 'C' | 'F';

/* ---------- numbers as typed ---------- */

/** A number for an input box: at most `maxDecimals`, no trailing zeros ("17.64", "500"). */
export function formatEntryNumber(value: number, maxDecimals: number): string {
  if (!Number.isFinite(value)) return '';
  const fixed = value.toFixed(maxDecimals);
  const trimmed = fixed.includes('.') ? fixed.replace(/\.?0+$/, '') : fixed;
  return trimmed === '-0' ? '0' : trimmed;
}

/** Decimals shown in an entry box, per unit: enough for a kitchen scale, not float noise. */
export const ENTRY_DECIMALS: Record<LineUnit, number> = { g: 2, kg: 4, lb: 3, oz: 2, pct_fruit: 3 };

/** Finite number or a dash: nothing on screen may read NaN or undefined. */
export function showNumber(value: number | null | undefined, decimals: number, suffix = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatSigned(value, decimals, false)}${suffix}`;
}

/** Signed display with a true minus sign (U+2212); `plus` adds "+" to positive values. */
export function formatSigned(value: number, decimals: number, plus = true): string {
  if (!Number.isFinite(value)) return '—';
  const rounded = Number(value.toFixed(decimals));
  const body = Math.abs(rounded).toFixed(decimals);
  if (rounded < 0) return `−${body}`;
  if (rounded > 0 && plus) return `+${body}`;
  return body;
}

/**
 * Decimals for a formula line's mass: small additions (acid, pectin, calcium) weighed on a fine
 * scale keep their tenths and hundredths (0.83 g, never "1 g"); kilograms to 10 g.
 */
export function lineMassDecimals(massG: number, system: UnitPreference): number {
  if (system !== 'metric') return 2;
  const magnitude = Math.abs(massG);
  return magnitude < 1 ? 2 : magnitude < 100 ? 1 : magnitude < 1000 ? 0 : 2;
}

/** A formula line's mass with lineMassDecimals(). */
export function showLineMass(massG: number, system: UnitPreference): string {
  return formatMass(massG, system, lineMassDecimals(massG, system));
}

/** A line's share of a batch, %: a tenth, with more decimals for small lines so 0.5 g in 2 kg is not "0.0 %". */
export function showSharePct(pct: number): string {
  if (!Number.isFinite(pct)) return '—';
  const magnitude = Math.abs(pct);
  if (magnitude === 0) return '0 %';
  if (magnitude < 0.001) return '< 0.001 %';
  return `${pct.toFixed(magnitude < 0.01 ? 3 : magnitude < 0.1 ? 2 : 1)} %`;
}

/** Mass for the results: kg/lb to the gram or so, small masses to a tenth. */
export function showMass(massG: number | null | undefined, system: UnitPreference): string {
  if (massG === null || massG === undefined || !Number.isFinite(massG)) return '—';
  const magnitude = Math.abs(massG);
  if (system === 'metric') return formatMass(massG, 'metric', magnitude < 1000 ? 1 : 3);
  return formatMass(massG, 'imperial', magnitude < 16 * 28.349523125 ? 2 : 3);
}

/** A mass difference with its sign, in g or oz. */
export function showMassDelta(deltaG: number, system: UnitPreference): string {
  if (!Number.isFinite(deltaG)) return '—';
  if (system === 'metric') return `${formatSigned(deltaG, 1)} g`;
  return `${formatSigned(fromGrams(deltaG, 'oz'), 3)} oz`;
}

export function showTemperature(tempC: number | null | undefined, unit: TemperatureUnit): string {
  if (tempC === null || tempC === undefined || !Number.isFinite(tempC)) return '—';
  return unit === 'C' ? `${tempC.toFixed(1)} °C` : `${celsiusToFahrenheit(tempC).toFixed(1)} °F`;
}

/* ---------- a value kept in storage units, shown in display units ---------- */

/** `base` is in storage units (g, m, °C): null when empty, NaN when the text is not a number. */
export interface MeasuredDraft {
  text: string;
  base: number | null;
}

export interface DisplayScale {
  toDisplay: (base: number) => number;
  toBase: (display: number) => number;
  decimals: number;
  unitLabel: string;
}

export function jarFillScale(system: UnitPreference): DisplayScale {
  return system === 'metric'
    ? { toDisplay: (g) => g, toBase: (g) => g, decimals: 1, unitLabel: 'g' }
    : { toDisplay: (g) => fromGrams(g, 'oz'), toBase: (oz) => toGrams(oz, 'oz'), decimals: 2, unitLabel: 'oz' };
}

export function altitudeScale(system: UnitPreference): DisplayScale {
  return system === 'metric'
    ? { toDisplay: (m) => m, toBase: (m) => m, decimals: 1, unitLabel: 'm' }
    : { toDisplay: (m) => m / METRES_PER_FOOT, toBase: (ft) => ft * METRES_PER_FOOT, decimals: 1, unitLabel: 'ft' };
}

export function temperatureScale(unit: TemperatureUnit): DisplayScale {
  return unit === 'C'
    ? { toDisplay: (c) => c, toBase: (c) => c, decimals: 2, unitLabel: '°C' }
    : { toDisplay: celsiusToFahrenheit, toBase: fahrenheitToCelsius, decimals: 2, unitLabel: '°F' };
}

export function draftFromBase(base: number | null | undefined, scale: DisplayScale): MeasuredDraft {
  if (base === null || base === undefined || !Number.isFinite(base)) return { text: '', base: null };
  return { text: formatEntryNumber(scale.toDisplay(base), scale.decimals), base };
}

export function draftFromText(text: string, scale: DisplayScale): MeasuredDraft {
  const parsed = readDecimal(text);
  if (parsed === null) return { text, base: null };
  return { text, base: Number.isNaN(parsed) ? Number.NaN : scale.toBase(parsed) };
}

/** Re-shows a draft in another unit from its stored value, so toggling back and forth never drifts. */
export function redisplayDraft(draft: MeasuredDraft, scale: DisplayScale): MeasuredDraft {
  if (draft.base === null || !Number.isFinite(draft.base)) return draft;
  return { text: formatEntryNumber(scale.toDisplay(draft.base), scale.decimals), base: draft.base };
}

/* ---------- lines ---------- */
