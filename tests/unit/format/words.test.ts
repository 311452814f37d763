import { describe, expect, it } from 'vitest';
import { nameWithUnit, sentence, unitNote } from '@/lib/format/words';

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

describe('a title closed as a sentence', () => {
  it('adds a full stop, but not after a question mark or one already there', () => {
    expect(sentence('Strawberry jam: less acid, same set?')).toBe('Strawberry jam: less acid, same set?');
    expect(sentence('Apricot spread trial')).toBe('Apricot spread trial.');
    expect(sentence('Done.')).toBe('Done.');
    expect(sentence('Strawberry jam (STJ, new)')).toBe('Strawberry jam (STJ, new).');
    expect(sentence('Does it set?”')).toBe('Does it set?”');
  });
});
