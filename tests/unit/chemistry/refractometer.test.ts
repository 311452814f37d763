import { describe, it, expect } from 'vitest';
import { ChemistryInputError, correctBrixTo20C, correctionCaution } from '@/lib/chemistry';

describe('refractometer temperature correction to 20 °C', () => {
  it('subtracts 0.38 °Brix from a 65 °Brix reading at 15 °C', () => {
    // Source: OIV-MA-AS2-02 (OIV Compendium of International Methods of Analysis), Table I: 15 °C, 65 % → −0.38
    const result = correctBrixTo20C(65, 15);
    expect(result.correctionBrix).toBeCloseTo(-0.38, 6);
    expect(result.correctedBrix20C).toBeCloseTo(64.62, 6);
    expect(result.usedRecalledValues).toBe(false);
  });

  it('subtracts 0.65 °Brix from a 20 % reading at 10 °C', () => {
    // Source: OIV-MA-AS2-02, Table I: 10 °C, 20 % → −0.65
    expect(correctBrixTo20C(20, 10).correctionBrix).toBeCloseTo(-0.65, 6);
  });

  it('interpolates bilinearly between table cells', () => {
    // Source: OIV-MA-AS2-02, Table I cells 12/13 °C × 60/65 %: −0.61, −0.61, −0.53, −0.53
    expect(correctBrixTo20C(62.5, 12.5).correctionBrix).toBeCloseTo(-0.57, 6);
    // Cells 16 °C: 25 % −0.28, 30 % −0.29
    expect(correctBrixTo20C(27.5, 16).correctionBrix).toBeCloseTo(-0.285, 6);
  });

  it('makes no correction at 20 °C', () => {
    expect(correctBrixTo20C(66, 20).correctionBrix).toBe(0);
    expect(correctBrixTo20C(66, 20).usedRecalledValues).toBe(false);
  });

  it('flags recalled rows above 17 °C', () => {
    expect(correctBrixTo20C(65, 22).usedRecalledValues).toBe(true);
  });

  it('refuses readings outside the table', () => {
    expect(() => correctBrixTo20C(65, 35)).toThrow(ChemistryInputError);
    expect(() => correctBrixTo20C(80, 15)).toThrow(/10–70 °Brix/);
  });
});

describe('the caution beside a corrected reading', () => {
  // The 3 °C threshold is common practice, no published source; the point tested is that the caution
  // follows the temperature gap and not which table rows were recalled (rows 18–25 °C are).
  it('says nothing within 3 °C of 20 °C, recalled rows or not, and asks for a reading at 20 °C beyond', () => {
    expect(correctBrixTo20C(65, 22).usedRecalledValues).toBe(true);
    expect(correctionCaution(correctBrixTo20C(65, 22))).toBeNull();
    expect(correctionCaution(correctBrixTo20C(65, 17.5))).toBeNull();
    expect(correctionCaution(correctBrixTo20C(65, 15))).toBe('Read 5 °C below 20 °C: if the result is close to a limit, bring the sample to 20 °C and read again.');
    expect(correctionCaution(correctBrixTo20C(65, 23.5))).toBe('Read 3.5 °C above 20 °C: if the result is close to a limit, bring the sample to 20 °C and read again.');
  });
});
