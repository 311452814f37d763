/** A plan refuses levels no preserve has (a walk planned a sugar ratio of 5000 and got "11904.99 kg finished"). */
import { describe, expect, it } from 'vitest';
import { planSchema } from '@/lib/trials/schema';

const plan = (factor: string, low: number, high: number) => planSchema.safeParse({ kind: 'full_factorial', factors: [{ factor, low, high }] });

describe('plan levels', () => {
  it.each([
    ['sugar_ratio', 0.1, 5000, 'Sugar ratio: the high level must be between 0 and 3 g sweetener per g fruit.'],
    ['pectin_dose', 4, 10001, 'Pectin dose: the high level must be between 0 and 60 g per kg fruit.'],
    ['target_solids', 10, 65, 'Target soluble solids: the low level must be between 20 and 80 °Brix.'],
  ])('refuses %s from %d to %d with the bounds named', (factor, low, high, message) => {
    const r = plan(factor, low, high);
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.message)).toContain(message);
  });

  it('a too-large number is called too large, not "not a number"', () => {
    const r = plan('pectin_dose', 4, 99999999999);
    expect(r.error?.issues.map((i) => i.message).join(' ')).not.toMatch(/must be a number/);
  });

  it('accepts the levels the demo trials plan', () => {
    expect(plan('sugar_ratio', 0.8, 1.2).success).toBe(true);
    expect(plan('acid_dose', 3, 7).success).toBe(true);
    expect(plan('pectin_dose', 4, 8).success).toBe(true);
    expect(plan('target_solids', 58, 64).success).toBe(true);
  });
});
