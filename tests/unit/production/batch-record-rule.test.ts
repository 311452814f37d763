import { describe, expect, it } from 'vitest';
import { batchRecordProblems, mostJarsFor, type BatchRecordContext } from '@/lib/production/schema';

// The walk's impossible batches against a version approved on 4 Dec 2026 (the server's today), 340 g
// jars with a 10.2 g tolerance. The one day of slack and the 5 % jar allowance are common practice,
// no published source; the jar arithmetic is plain division.
const context: BatchRecordContext = { today: '2026-12-04', version: 2, approvedOn: '2026-12-04', netFillG: 340, netFillToleranceG: 10.2 };
const batch = (over: Partial<{ batchDate: string; batchSizeG: number; jarsFilled: number }> = {}) => ({ batchDate: '2026-12-04', batchSizeG: 50_000, jarsFilled: 140, ...over });

describe('a batch that cannot have happened', () => {
  it('is not dated in the future, beyond one day of clock slack', () => {
    expect(batchRecordProblems(batch({ batchDate: '2031-06-15' }), context).batchDate?.[0]).toMatch(/15 Jun 2031 is in the future \(today is 4 Dec 2026\)/);
    expect(batchRecordProblems(batch({ batchDate: '2099-01-01' }), context).batchDate).toHaveLength(1);
    expect(batchRecordProblems(batch({ batchDate: '2026-12-06' }), context).batchDate).toHaveLength(1);
    expect(batchRecordProblems(batch({ batchDate: '2026-12-05' }), context)).toEqual({});
  });

  it('is not dated before its version was approved (one day of slack for time zones)', () => {
    expect(batchRecordProblems(batch({ batchDate: '2020-01-01' }), context).batchDate?.[0]).toBe('v2 was approved on 4 Dec 2026: a batch made to it cannot be dated 1 Jan 2020, before that.');
    expect(batchRecordProblems(batch({ batchDate: '2026-12-02' }), context).batchDate).toHaveLength(1);
    expect(batchRecordProblems(batch({ batchDate: '2026-12-03' }), context)).toEqual({});
  });

  it('does not fill more jars than its mass can', () => {
    // 1 kg at the lightest accepted jar (340 − 10.2 = 329.8 g), with 5 % to spare: 1050 / 329.8 = 3.18 → 3 jars.
    expect(mostJarsFor(1000, 340, 10.2)).toBe(3);
    const problems = batchRecordProblems(batch({ batchSizeG: 1000, jarsFilled: 1_000_000 }), context);
    expect(problems.jarsFilled?.[0]).toMatch(/A batch of 1 kg fills at most 3 jars of 340 g .*; 1000000 were entered/);
    expect(batchRecordProblems(batch({ batchSizeG: 1000, jarsFilled: 3 }), context)).toEqual({});
    // 50 kg: 52,500 / 329.8 = 159.2 → 159.
    expect(batchRecordProblems(batch({ jarsFilled: 159 }), context)).toEqual({});
    expect(batchRecordProblems(batch({ jarsFilled: 160 }), context).jarsFilled).toHaveLength(1);
  });
});
