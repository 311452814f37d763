import { describe, it, expect } from 'vitest';
import { norrishBinaryAw, rossMixtureAw, sucroseSolutionAw } from '@/lib/chemistry';

describe('Norrish water activity of sucrose solutions', () => {
  it('is about 0.895 at 60 % w/w', () => {
    // Source: Norrish equation with K = 6.47 for sucrose (Chirife et al. 1980, memory): aw ≈ 0.895 at 60 % w/w
    const estimate = sucroseSolutionAw(60);
    expect(estimate.aw).toBeCloseTo(0.895, 3);
    expect(estimate.model).toBe('Norrish (sucrose)');
    expect(estimate.isEstimate).toBe(true);
  });

  it('is about 0.865 at 65 % w/w', () => {
    // Source: Norrish equation with K = 6.47 for sucrose (Chirife et al. 1980, memory): aw ≈ 0.865 at 65 % w/w
    expect(sucroseSolutionAw(65).aw).toBeCloseTo(0.865, 3);
  });

  it('agrees with the measured value for 65 % sucrose to within 0.01', () => {
    // Source: Beuchat (1981): 65 % sucrose has aw about 0.87
    expect(Math.abs(sucroseSolutionAw(65).aw - 0.87)).toBeLessThan(0.01);
  });
});

describe('Ross rule for mixed sugars', () => {
  it('is the product of each solute at its own molality in the total water', () => {
    const mixed = rossMixtureAw([
      { solute: 'sucrose', massG: 40 },
      { solute: 'glucose', massG: 20 },
    ], 40);
    expect(mixed.aw).toBeCloseTo(norrishBinaryAw(40, 40, 'sucrose') * norrishBinaryAw(20, 40, 'glucose'), 12);
    expect(mixed.model).toMatch(/Ross/);
  });

  it('gives the binary Norrish value for sucrose alone', () => {
    expect(rossMixtureAw([{ solute: 'sucrose', massG: 65 }], 35).aw).toBeCloseTo(sucroseSolutionAw(65).aw, 12);
  });

  it('lowers aw more with monosaccharides than with the same mass of sucrose', () => {
    // Source: colligative principle: glucose (180 g/mol) gives more moles per gram than sucrose (342 g/mol)
    expect(rossMixtureAw([{ solute: 'glucose', massG: 60 }], 40).aw).toBeLessThan(sucroseSolutionAw(60).aw);
  });
});
