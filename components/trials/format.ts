/** Small display helpers for trial screens; never print NaN. */
import { formatMass, formatTemperature, type UnitPreference } from '@/lib/chemistry';

export function massText(g: number | null | undefined, units: UnitPreference): string {
  return g == null || !Number.isFinite(g) ? '—' : formatMass(g, units);
}

export function tempText(c: number | null | undefined, unit: 'C' | 'F'): string {
  return c == null || !Number.isFinite(c) ? '—' : formatTemperature(c, unit === 'F' ? 'imperial' : 'metric');
}

export function numText(n: number | null | undefined, decimals = 1, suffix = ''): string {
  return n == null || !Number.isFinite(n) ? '—' : `${n.toFixed(decimals)}${suffix}`;
}

export const FLAG_CLASS: Record<string, string> = {
  ok: 'text-leaf-700',
  watch: 'text-amberline-700 font-semibold',
  out: 'text-ember-700 font-semibold',
  danger: 'bg-ember-600 text-white font-semibold px-1 rounded',
  unknown: 'text-rind-400',
};
