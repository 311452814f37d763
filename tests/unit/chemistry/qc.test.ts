import { describe, it, expect } from 'vitest';
import {
  checkBatchAgainstSpec, computeBatch, defaultQcSpec, qcSpecCautions, qcSpecProblems, tolerableNegativeErrorG,
  type QcSpec,
} from '@/lib/chemistry';
import { PRACTICAL_ACTION_LINES, fruit, SUGAR, settings } from './fixtures';

const SPEC: QcSpec = {
  solidsMinBrix: 66, solidsMaxBrix: 68, phMin: 2.9, phMax: 3.3, minFillTempC: 85,
  netFillG: 340, netFillToleranceG: 10.2, setMinScore: 4, setDescription: 'Clean set', shelfLifeMonths: 12, storageNotes: 'Cool and dark',
};
const GOOD = { brixReading: 67, brixSampleTempC: 20, ph: 3.1, fillTempC: 88 };
const statusOf = (key: string, readings: Partial<typeof GOOD> & Record<string, unknown>) =>
  checkBatchAgainstSpec(SPEC, { ...GOOD, ...readings }).checks.find((c) => c.key === key)!.status;

describe('tolerable negative error of a jar', () => {
  // Source: Directive 76/211/EEC Annex I 2.4 as in FPackV § 9 (3) / FPVO 1993 § 9 (1); worked examples
  // from Justervesenet (Norwegian Metrology Service), "Pre-packaged goods": 400 g → 12 g, 250 ml → 9 ml.
  it('matches the published worked examples', () => {
    expect(tolerableNegativeErrorG(400)).toBe(12);
    expect(tolerableNegativeErrorG(250)).toBe(9);
  });
  it('uses the percentage bands, rounded up to 0.1 g, and the fixed-gram bands', () => {
    expect(tolerableNegativeErrorG(340)).toBe(10.2); // 3 % of 340 g
    expect(tolerableNegativeErrorG(454)).toBe(13.7); // 3 % = 13.62 → rounded up
    expect(tolerableNegativeErrorG(150)).toBe(6.8); // 4.5 % = 6.75 → 6.8
    expect(tolerableNegativeErrorG(750)).toBe(15);
    expect(tolerableNegativeErrorG(60)).toBe(4.5);
  });
  it('has no jump where the bands meet', () => {
    for (const edge of [50, 100, 200, 300, 500, 1000]) {
      expect(tolerableNegativeErrorG(edge - 0.001)).toBeCloseTo(tolerableNegativeErrorG(edge)!, 0);
    }
  });
  it('is undefined outside 5 g – 10 kg', () => {
    expect(tolerableNegativeErrorG(4)).toBeNull();
    expect(tolerableNegativeErrorG(20_000)).toBeNull();
  });
});

describe('default QC specification from the chemistry', () => {
  it('centres the windows on the formula and keeps to the hot-fill guidance', () => {
    const computation = computeBatch(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 67, plannedPh: 3.1 }));
    const spec = defaultQcSpec(computation);
    expect(spec.solidsMinBrix).toBe(66);
    expect(spec.solidsMaxBrix).toBe(68);
    // HM pectin: planned pH ± 0.2 (common practice, no published source), within the 2.8–3.3 optimum's neighbourhood.
    expect(spec.phMin).toBe(2.9);
    expect(spec.phMax).toBe(3.3);
    expect(spec.minFillTempC).toBe(85);
    expect(spec.netFillG).toBe(340);
    expect(spec.netFillToleranceG).toBe(10.2);
    expect(spec.shelfLifeMonths).toBe(12);
    expect(qcSpecProblems(spec)).toEqual([]);
  });

  it('never sets the solids minimum below the legal minimum', () => {
    // Council Directive 2001/113/EC Annex I: jam at least 60 % soluble solids.
    const computation = computeBatch(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 60.5, plannedPh: 3.1 }));
    expect(defaultQcSpec(computation).solidsMinBrix).toBe(60);
    // 21 CFR 150.160: jam at least 65 %.
    const us = computeBatch(PRACTICAL_ACTION_LINES, settings({ ruleSet: 'us', targetSolidsPct: 65.5, plannedPh: 3.1 }));
    expect(defaultQcSpec(us).solidsMinBrix).toBe(65);
  });

  it('treats a reduced-sugar spread as such: softer set, shorter life, refrigerate after opening', () => {
    const lines = [{ ingredient: fruit(10), quantity: 1000, unit: 'g' as const }, { ingredient: SUGAR, quantity: 450, unit: 'g' as const }];
    const computation = computeBatch(lines, settings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 45, plannedPh: 3.4 }));
    const spec = defaultQcSpec(computation);
    expect(spec.solidsMinBrix).toBe(44);
    expect(spec.setMinScore).toBe(3);
    expect(spec.shelfLifeMonths).toBe(6);
    expect(spec.storageNotes).toMatch(/Refrigerate after opening/);
    // No HM pectin: the window may sit above 3.3 but stays under the 4.2 margin.
    expect(spec.phMax).toBe(3.6);
    const codes = qcSpecCautions(spec, 'reduced_sugar_spread').map((c) => c.code);
    expect(codes).toContain('SPEC_REDUCED_SUGAR_STORAGE');
  });
});

describe('specification problems and cautions', () => {
  it('refuses a pH window above 4.6 and inverted windows', () => {
    // 21 CFR 114.3: acid foods have an equilibrium pH of 4.6 or below.
    expect(qcSpecProblems({ ...SPEC, phMax: 4.7 }).map((p) => p.field)).toContain('phMax');
    expect(qcSpecProblems({ ...SPEC, phMax: 4.6 })).toEqual([]);
    expect(qcSpecProblems({ ...SPEC, solidsMinBrix: 68, solidsMaxBrix: 68 }).map((p) => p.field)).toEqual(['solidsMaxBrix']);
    expect(qcSpecProblems({ ...SPEC, netFillToleranceG: 400 }).map((p) => p.field)).toEqual(['netFillToleranceG']);
  });
  it('warns when the fill is below the hot-fill guidance', () => {
    expect(qcSpecCautions({ ...SPEC, minFillTempC: 80 }, 'jam').map((c) => c.code)).toContain('SPEC_FILL_BELOW_HOT_FILL');
    expect(qcSpecCautions(SPEC, 'jam').map((c) => c.code)).not.toContain('SPEC_FILL_BELOW_HOT_FILL');
    for (const c of qcSpecCautions({ ...SPEC, minFillTempC: 80 }, 'reduced_sugar_spread')) {
      expect(c.message).toMatch(/Local food-safety codes and licensed practice govern\./);
    }
  });
});

describe('checking a batch against its specification at the boundaries', () => {
  it('passes a batch inside every window', () => {
    const result = checkBatchAgainstSpec(SPEC, { ...GOOD, netFillMeanG: 341, netFillMinG: 335, setTestScore: 4 });
    expect(result.outcome).toBe('pass');
    expect(result.checks.filter((c) => c.status === 'fail')).toEqual([]);
  });

  it('solids: the limits are inclusive at 0.1 °Brix resolution', () => {
    expect(statusOf('solids', { brixReading: 66.0 })).toBe('pass');
    expect(statusOf('solids', { brixReading: 65.9 })).toBe('fail');
    expect(statusOf('solids', { brixReading: 68.0 })).toBe('pass');
    expect(statusOf('solids', { brixReading: 68.1 })).toBe('fail');
    // 66.04 reads as 66.0 on a 0.1 °Brix instrument.
    expect(statusOf('solids', { brixReading: 65.96 })).toBe('pass');
  });

  it('solids: the reading is corrected to 20 °C before comparing', () => {
    // OIV-MA-AS2-02 Table I: at 15 °C and 65–70 % add −0.38 °Brix. 66.3 read at 15 °C is 65.92 → 65.9: fail.
    const cold = checkBatchAgainstSpec(SPEC, { ...GOOD, brixReading: 66.3, brixSampleTempC: 15 });
    expect(cold.correctedBrix20C).toBe(65.9);
    expect(cold.checks[0].status).toBe('fail');
    expect(cold.checks[0].reason).toMatch(/below the minimum 66\.0/);
    // 66.4 at 15 °C → 66.02 → 66.0: pass.
    expect(checkBatchAgainstSpec(SPEC, { ...GOOD, brixReading: 66.4, brixSampleTempC: 15 }).checks[0].status).toBe('pass');
  });

  it('pH: inclusive at 0.01, and above 4.6 always fails with a hold', () => {
    expect(statusOf('ph', { ph: 2.9 })).toBe('pass');
    expect(statusOf('ph', { ph: 2.89 })).toBe('fail');
    expect(statusOf('ph', { ph: 3.3 })).toBe('pass');
    expect(statusOf('ph', { ph: 3.31 })).toBe('fail');
    const wide = { ...SPEC, phMax: 4.6 };
    expect(checkBatchAgainstSpec(wide, { ...GOOD, ph: 4.6 }).checks[1].status).toBe('pass');
    const high = checkBatchAgainstSpec(wide, { ...GOOD, ph: 4.61 }).checks[1];
    expect(high.status).toBe('fail');
    expect(high.reason).toMatch(/Hold the batch/);
  });

  it('fill temperature: at the minimum passes, 0.1 °C below fails', () => {
    expect(statusOf('fill_temperature', { fillTempC: 85.0 })).toBe('pass');
    expect(statusOf('fill_temperature', { fillTempC: 84.9 })).toBe('fail');
  });

  it('net fill: mean at least the declared fill, no jar below fill − tolerance', () => {
    expect(statusOf('net_fill', { netFillMeanG: 340, netFillMinG: 329.8 })).toBe('pass');
    expect(statusOf('net_fill', { netFillMeanG: 339.9, netFillMinG: 335 })).toBe('fail');
    expect(statusOf('net_fill', { netFillMeanG: 342, netFillMinG: 329.7 })).toBe('fail');
    expect(statusOf('net_fill', {})).toBe('not_measured');
  });

  it('set test: below the minimum score fails; not measured leaves the batch incomplete, never passed', () => {
    expect(statusOf('set', { setTestScore: 4 })).toBe('pass');
    expect(statusOf('set', { setTestScore: 3 })).toBe('fail');
    const unmeasured = checkBatchAgainstSpec(SPEC, { ...GOOD, netFillMeanG: 341, netFillMinG: 335 });
    expect(unmeasured.checks.find((c) => c.key === 'set')!.status).toBe('not_measured');
    expect(unmeasured.outcome).toBe('incomplete');
    // Net fill and set test both missing: still incomplete; a failure elsewhere wins.
    expect(checkBatchAgainstSpec(SPEC, GOOD).outcome).toBe('incomplete');
    expect(checkBatchAgainstSpec(SPEC, { ...GOOD, fillTempC: 80 }).outcome).toBe('fail');
  });

  it('one failed check fails the batch and says why', () => {
    const result = checkBatchAgainstSpec(SPEC, { ...GOOD, fillTempC: 80 });
    expect(result.outcome).toBe('fail');
    expect(result.checks.find((c) => c.status === 'fail')!.reason).toMatch(/80\.0 °C, below the minimum 85\.0 °C/);
  });
});
