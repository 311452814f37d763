import { ChemistryInputError } from './errors';
import type { MassUnit, UnitPreference } from './types';

/** Exact by the international yard and pound agreement (1959). */
export const GRAMS_PER_POUND = 453.59237;
/** 1/16 lb, exact. */
export const GRAMS_PER_OUNCE = 28.349523125;

const GRAMS_PER_UNIT: Record<MassUnit, number> = {
  g: 1,
  kg: 1000,
  lb: GRAMS_PER_POUND,
  oz: GRAMS_PER_OUNCE,
};

export function isMassUnit(unit: string): unit is MassUnit {
  return unit === 'g' || unit === 'kg' || unit === 'lb' || unit === 'oz';
}

export function toGrams(quantity: number, unit: MassUnit): number {
  const factor = GRAMS_PER_UNIT[unit];
  if (factor === undefined) throw new ChemistryInputError('unit', `unknown mass unit "${String(unit)}"`);
  return quantity * factor;
}

export function fromGrams(massG: number, unit: MassUnit): number {
  const factor = GRAMS_PER_UNIT[unit];
  if (factor === undefined) throw new ChemistryInputError('unit', `unknown mass unit "${String(unit)}"`);
  return massG / factor;
}

export function celsiusToFahrenheit(tempC: number): number {
  return (tempC * 9) / 5 + 32;
}

export function fahrenheitToCelsius(tempF: number): number {
  return ((tempF - 32) * 5) / 9;
}

/** A temperature difference (not a reading): 4 °C of elevation is 7.2 °F. */
export function celsiusDeltaToFahrenheit(deltaC: number): number {
  return (deltaC * 9) / 5;
}

function fixed(value: number, decimals: number): string {
  return value.toFixed(decimals);
}

/**
 * Mass for display. Metric: g below 1 kg, kg above. Imperial: oz below 1 lb, lb above.
 * `decimals` overrides the default precision.
 */
export function formatMass(massG: number, preference: UnitPreference, decimals?: number): string {
  const magnitude = Math.abs(massG);
  if (preference === 'metric') {
    if (magnitude < 1000) return `${fixed(massG, decimals ?? 0)} g`;
    return `${fixed(massG / 1000, decimals ?? 2)} kg`;
  }
  const ounces = massG / GRAMS_PER_OUNCE;
  if (Math.abs(ounces) < 16) return `${fixed(ounces, decimals ?? 1)} oz`;
  return `${fixed(massG / GRAMS_PER_POUND, decimals ?? 2)} lb`;
}

export function formatTemperature(tempC: number, preference: UnitPreference, decimals = 1): string {
  if (preference === 'metric') return `${fixed(tempC, decimals)} °C`;
  return `${fixed(celsiusToFahrenheit(tempC), decimals)} °F`;
}

/** Altitude is kept in metres internally; imperial users see feet (1 ft = 0.3048 m exactly). */
export const METRES_PER_FOOT = 0.3048;

export function formatAltitude(altitudeM: number, preference: UnitPreference): string {
  if (preference === 'metric') return `${Math.round(altitudeM)} m`;
  return `${Math.round(altitudeM / METRES_PER_FOOT)} ft`;
}
