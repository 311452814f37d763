import { describe, it, expect } from 'vitest';
import { analyseTasting, type TastingData } from '@/lib/results/analysis';
import { ANALYSIS_MEMO_SIZE, analyseRemembered } from '@/lib/results/analysis-memo';

// Source: Montgomery, Design and Analysis of Experiments, Example 4.1 (vascular graft, RCBD):
// treatments F = 8.10708 — the remembered analysis must be the analysis, not an approximation.
const MONTGOMERY = {
  A: [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  B: [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  C: [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  D: [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
};

function ratedData(): TastingData {
  const samples = Object.keys(MONTGOMERY).map((l) => ({ sampleId: `s-${l}`, label: l, description: '' }));
  const answers = Object.entries(MONTGOMERY).flatMap(([l, values]) =>
    values.map((value, seatIndex) => ({ seatIndex, kind: 'rating' as const, attribute: 'firm', sampleId: `s-${l}`, value, rankingSampleIds: null, correct: null })),
  );
  return { method: 'rated', samples, attributes: [{ id: 'firm', name: 'Set firmness', purpose: 'intensity', highAnchor: 'Very firm' }], answers, seatCount: 6, submittedSeats: 6 };
}

const treatmentsF = (data: TastingData) => analyseRemembered(data).attributes[0].anova.rows.find((r) => r.source === 'treatments')!.f;

describe('remembered analyses', () => {
  it('gives the same analysis as a fresh one, and the same object for the same input', () => {
    const first = analyseRemembered(ratedData());
    expect(first).toEqual(analyseTasting(ratedData()));
    expect(treatmentsF(ratedData())).toBeCloseTo(8.10708, 4);
    // A separately built but equal input (another request's reads) is a hit.
    expect(analyseRemembered(ratedData())).toBe(first);
  });

  it('recomputes when one answer, a label or an option changes', () => {
    const base = analyseRemembered(ratedData());
    const changed = ratedData();
    changed.answers[0] = { ...changed.answers[0], value: 60 };
    expect(analyseRemembered(changed)).not.toBe(base);
    expect(treatmentsF(changed)).not.toBeCloseTo(8.10708, 4);
    const relabelled = ratedData();
    relabelled.samples[0] = { ...relabelled.samples[0], label: 'A2' };
    expect(analyseRemembered(relabelled).attributes[0].comparison.letters).toHaveProperty('A2');
    expect(analyseRemembered(ratedData(), { pooledPenalty: true })).not.toBe(base);
  });

  it('keeps at most ANALYSIS_MEMO_SIZE inputs, dropping the least recently used', () => {
    const kept = analyseRemembered(ratedData());
    let firstOfLoop: unknown;
    for (let i = 0; i < ANALYSIS_MEMO_SIZE - 1; i++) {
      const d = ratedData();
      d.seatCount = 100 + i;
      const r = analyseRemembered(d);
      if (i === 0) firstOfLoop = r;
      analyseRemembered(ratedData()); // used again: stays
    }
    const d = ratedData();
    d.seatCount = 999;
    analyseRemembered(d);
    expect(analyseRemembered(ratedData())).toBe(kept);
    const oldest = ratedData();
    oldest.seatCount = 100;
    // The least recently used input was dropped: it is computed afresh (a new object, same result).
    const again = analyseRemembered(oldest);
    expect(again).not.toBe(firstOfLoop);
    expect(again).toEqual(firstOfLoop);
  });
});
