import { describe, it, expect } from 'vitest';
import {
  GRAMS_PER_OUNCE, GRAMS_PER_POUND, celsiusToFahrenheit, fahrenheitToCelsius, formatMass, formatTemperature, fromGrams, toGrams,
} from '@/lib/chemistry';

describe('unit conversions', () => {
  it('uses the exact pound and ounce', () => {
    // Source: International yard and pound agreement (1959): 1 lb = 0.45359237 kg exactly; 1 oz = 1/16 lb
    expect(toGrams(1, 'lb')).toBe(453.59237);
    expect(toGrams(1, 'oz')).toBe(28.349523125);
    expect(GRAMS_PER_POUND / 16).toBe(GRAMS_PER_OUNCE);
    expect(toGrams(2.5, 'kg')).toBe(2500);
    expect(fromGrams(453.59237 * 3, 'lb')).toBeCloseTo(3, 12);
  });

  it('converts water boiling and freezing points between °C and °F', () => {
    // Source: definition of the Fahrenheit scale (water freezes at 32 °F and boils at 212 °F at standard pressure)
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(fahrenheitToCelsius(220)).toBeCloseTo(104.444, 3);
    expect(fahrenheitToCelsius(celsiusToFahrenheit(37.5))).toBeCloseTo(37.5, 12);
  });

  it('formats by unit preference', () => {
    expect(formatMass(16346, 'metric')).toBe('16.35 kg');
    expect(formatMass(340, 'metric')).toBe('340 g');
    expect(formatMass(453.59237, 'imperial')).toBe('1.00 lb');
    expect(formatMass(28.349523125 * 12, 'imperial')).toBe('12.0 oz');
    expect(formatTemperature(104, 'imperial')).toBe('219.2 °F');
    expect(formatTemperature(104, 'metric')).toBe('104.0 °C');
  });
});
