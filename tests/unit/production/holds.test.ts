import { describe, expect, it } from 'vitest';
import { checkBatchAgainstSpec, type QcSpec } from '@/lib/chemistry/qc';
import { batchStanding, checkRetest, type BatchRetestReadings } from '@/lib/production/holds';

// The walk's case: a batch failed on pH, kept for rework (re-boil), then re-tested on pH alone. A
// re-boil changes the solids (and the acidity and set; the jars are filled again), so the readings
// from before it say nothing about the reworked batch (common practice, no published source).
const spec: QcSpec = {
  solidsMinBrix: 64, solidsMaxBrix: 66, phMin: 2.9, phMax: 3.3, minFillTempC: 85, netFillG: 340, netFillToleranceG: 10.2,
  setMinScore: 4, setDescription: 'Clean set', shelfLifeMonths: 12, storageNotes: 'Store cool and dark.',
};
const readings = { brixReading: 65, brixSampleTempC: 20, ph: 3.45, fillTempC: 88, netFillMeanG: 342, netFillMinG: 336, setTestScore: 4 };
const recorded = checkBatchAgainstSpec(spec, readings);
const everything: BatchRetestReadings = { brixReading: 65.2, brixSampleTempC: 20, ph: 3.1, fillTempC: 87, netFillMeanG: 343, netFillMinG: 337, setTestScore: 4 };

describe('a re-test after a rework', () => {
  it('a pH-only re-test is incomplete: solids, fill, net fill and set were not measured since the rework', () => {
    expect(recorded.outcome).toBe('fail');
    const result = checkRetest(spec, readings, { ph: 3.1 }, { earlierRetests: [] });
    expect(result.outcome).toBe('incomplete');
    expect(result.checks.filter((c) => c.status === 'not_measured').map((c) => c.key)).toEqual(['solids', 'fill_temperature', 'net_fill', 'set']);
    expect(result.checks.find((c) => c.key === 'solids')?.reason).toMatch(/Not measured again since the rework/);
    const standing = batchStanding({ readings, checks: recorded.checks, disposition: 'rework' }, [{ kind: 'retest', readings: { ph: 3.1 }, checks: result.checks }]);
    expect(standing.canRelease).toBe(false);
    expect(standing.outcome).toBe('incomplete');
    expect(standing.staleSinceRework).toEqual(['Soluble solids', 'Fill temperature', 'Net fill', 'Set test']);
  });

  it('passes once every reading is taken again, in one re-test or over several', () => {
    expect(checkRetest(spec, readings, everything, { earlierRetests: [] }).outcome).toBe('pass');
    const first: BatchRetestReadings = { ph: 3.1, brixReading: 65.2, brixSampleTempC: 20 };
    const second: BatchRetestReadings = { fillTempC: 87, netFillMeanG: 343, setTestScore: 4 };
    const c1 = checkRetest(spec, readings, first, { earlierRetests: [] });
    const c2 = checkRetest(spec, c1.readings, second, { earlierRetests: [first] });
    expect(c1.outcome).toBe('incomplete');
    expect(c2.outcome).toBe('pass');
    const standing = batchStanding({ readings, checks: recorded.checks, disposition: 'rework' }, [
      { kind: 'retest', readings: first, checks: c1.checks }, { kind: 'retest', readings: second, checks: c2.checks },
    ]);
    expect(standing.canRelease).toBe(true);
    expect(standing.staleSinceRework).toEqual([]);
  });

  it('a re-test stored before this rule, pH only and "pass", no longer opens release', () => {
    const old = checkRetest(spec, readings, { ph: 3.1 });
    expect(old.outcome).toBe('pass');
    const standing = batchStanding({ readings, checks: recorded.checks, disposition: 'rework' }, [{ kind: 'retest', readings: { ph: 3.1 }, checks: old.checks }]);
    expect(standing.canRelease).toBe(false);
  });

  it('a batch on hold (no rework) keeps its other readings: a pH re-test alone can pass', () => {
    const result = checkRetest(spec, readings, { ph: 3.1 });
    expect(result.outcome).toBe('pass');
    expect(batchStanding({ readings, checks: recorded.checks, disposition: 'hold' }, [{ kind: 'retest', readings: { ph: 3.1 }, checks: result.checks }]).canRelease).toBe(true);
  });
});
