/** °C ↔ the person's unit for form fields; the server always receives °C. */
import { celsiusToFahrenheit, fahrenheitToCelsius } from '@/lib/chemistry/units';
import { readOptionalDecimal } from '@/lib/format/numbers';

export type TemperatureUnit = 'C' | 'F';

export function toDisplayTemperature(celsius: number, unit: TemperatureUnit): string {
  return (unit === 'F' ? celsiusToFahrenheit(celsius) : celsius).toFixed(1).replace(/\.0$/, '');
}

/** Null for an empty or unreadable entry, so the schema answers with its own message. */
export function fromDisplayTemperature(text: string, unit: TemperatureUnit): number | null {
  const n = parseNumber(text);
  if (n === null) return null;
  return Math.round((unit === 'F' ? fahrenheitToCelsius(n) : n) * 100) / 100;
}

/** Accepts a decimal comma as well as a point; null when empty or not a number. */
export const parseNumber = readOptionalDecimal;
