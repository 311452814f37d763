// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { goodJarsOf } from '@/lib/production/holds';
import { BatchCostCard } from '@/components/costs/BatchCostCard';
import type { BatchCost } from '@/lib/costs/schema';

afterEach(cleanup);

// The walk: a rejected batch of 105 jars showed "Actual, over 105 good jars GBP 1.62". Every jar of a
// rejected or discarded batch goes with it.
describe('good jars', () => {
  it('are the jars filled less those rejected, and none once the batch is rejected or discarded', () => {
    expect(goodJarsOf('passed', 105, 2)).toBe(103);
    expect(goodJarsOf('released', 105, 0)).toBe(105);
    expect(goodJarsOf('held', 105, 0)).toBe(105);
    expect(goodJarsOf('rejected', 105, 0)).toBe(0);
    expect(goodJarsOf('discarded', 105, 0)).toBe(0);
  });

  it('the cost card of a rejected batch says it has no good jars instead of a cost per jar', () => {
    const cost: BatchCost = { currency: 'GBP', planned: { ok: false, message: 'No pack format.' }, goodJars: 0, actualPerJar: null };
    render(<BatchCostCard cost={cost} writtenOff="rejected" />);
    expect(screen.getByTestId('batch-cost').textContent).not.toMatch(/good jars GBP|over \d+ good jars/);
    expect(screen.getByTestId('batch-actual-cost').textContent).toBe('None: the batch was rejected, so it has no good jars.');
  });
});
