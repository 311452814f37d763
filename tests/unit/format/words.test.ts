import { describe, expect, it } from 'vitest';
import { nameWithUnit, unitNote } from '@/lib/format/words';

describe('a name with its unit', () => {
  it('puts the unit in brackets after the name', () => {
    expect(nameWithUnit('Soluble solids at 20 °C', '°Brix')).toBe('Soluble solids at 20 °C (°Brix)');
  });

  it('leaves off a unit that only repeats the name ("pH", not "pH (pH)") or is empty', () => {
    expect(nameWithUnit('pH', 'pH')).toBe('pH');
    expect(nameWithUnit('Set firmness', 'set firmness ')).toBe('Set firmness');
    expect(nameWithUnit('Score', '')).toBe('Score');
    expect(unitNote('Measured pH', 'pH')).toBeNull();
    expect(unitNote('Set test score', 'score 1–5')).toBe('score 1–5');
  });
});
