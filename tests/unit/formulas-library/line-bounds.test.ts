/** A formula line's bound holds in grams whatever its unit (a walk saved 10,000,000 kg of strawberries and pectin at 5000 % of the fruit). */
import { describe, expect, it } from 'vitest';
import { formulaLineSchema } from '@/lib/formulas/schema';

const line = (quantity: number, unit: string) => formulaLineSchema.safeParse({ ingredientId: '0b6b6a38-6f0e-4a43-9a65-4a1b2f0f5c11', quantity, unit });
const messages = (r: ReturnType<typeof line>) => r.error?.issues.map((i) => i.message) ?? [];

describe('formula line bounds', () => {
  it('refuses more than 10 t in any mass unit', () => {
    expect(messages(line(10_000_000, 'kg'))).toEqual(['More than 10 t in one line is not plausible for a batch.']);
    expect(messages(line(25_000, 'lb'))).toEqual(['More than 10 t in one line is not plausible for a batch.']);
    expect(line(10_000, 'kg').success).toBe(true);
    expect(line(2_500, 'g').success).toBe(true);
  });

  it('refuses a share of the fruit above ten times the fruit', () => {
    expect(messages(line(5000, 'pct_fruit'))).toEqual(['More than 1000 % of the fruit (ten times its mass) is not plausible for one line.']);
    expect(line(0.6, 'pct_fruit').success).toBe(true);
    expect(line(150, 'pct_fruit').success).toBe(true);
  });
});
