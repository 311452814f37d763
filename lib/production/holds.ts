/**
 * Where a batch stands after it was recorded, and what may follow. Pure.
 *
 * A batch that failed a check (kept for rework or on hold) or is incomplete (a check the spec
 * requires was not measured) is held. While held it can be re-tested — new readings checked against
 * the same spec, merged over the recorded ones — and then released (only when the latest check
 * passes) or rejected. A batch discarded at recording is final; so are a release and a reject.
 */
import { checkBatchAgainstSpec, outcomeOfChecks, type BatchCheckResult, type BatchReadings, type QcCheck, type QcSpec } from '@/lib/chemistry/qc';
import type { BatchOutcome, BatchStatus, Disposition } from './vocabulary';

/** The readings a re-test takes again; any left out keep their recorded value. */
export interface BatchRetestReadings {
  brixReading?: number | null;
  brixSampleTempC?: number | null;
  ph?: number | null;
  fillTempC?: number | null;
  netFillMeanG?: number | null;
  netFillMinG?: number | null;
  setTestScore?: number | null;
}

export interface RecordedBatch {
  readings: BatchReadings;
  checks: readonly QcCheck[];
  disposition: Disposition | null;
}

export interface BatchDecisionFact {
  kind: 'retest' | 'release' | 'reject';
  readings: BatchRetestReadings | null;
  checks: readonly QcCheck[] | null;
}

export interface BatchStanding {
  status: BatchStatus;
  /** The outcome of the latest checks (the last re-test's, or the recording's). */
  outcome: BatchOutcome;
  checks: readonly QcCheck[];
  /** The readings the latest checks were made on. */
  readings: BatchReadings;
  canRetest: boolean;
  canRelease: boolean;
  canReject: boolean;
}

/** The recorded readings with a re-test's values laid over them. */
export function mergeRetest(readings: BatchReadings, retest: BatchRetestReadings): BatchReadings {
  const merged: BatchReadings = { ...readings };
  for (const [key, value] of Object.entries(retest) as Array<[keyof BatchRetestReadings, number | null | undefined]>) {
    if (value !== undefined && value !== null) merged[key] = value;
  }
  return merged;
}

/** A re-test's checks: the merged readings against the spec the batch was made to. */
export function checkRetest(spec: QcSpec, readings: BatchReadings, retest: BatchRetestReadings): BatchCheckResult & { readings: BatchReadings } {
  const merged = mergeRetest(readings, retest);
  return { ...checkBatchAgainstSpec(spec, merged), readings: merged };
}

export function batchStanding(batch: RecordedBatch, decisions: readonly BatchDecisionFact[]): BatchStanding {
  let checks = batch.checks;
  let readings = batch.readings;
  for (const d of decisions) {
    if (d.kind === 'retest' && d.checks && d.readings) {
      checks = d.checks;
      readings = mergeRetest(readings, d.readings);
    }
  }
  const outcome = outcomeOfChecks(checks);
  const recorded = outcomeOfChecks(batch.checks);
  const final = decisions.find((d) => d.kind === 'release' || d.kind === 'reject');
  const status: BatchStatus = final
    ? final.kind === 'release' ? 'released' : 'rejected'
    : recorded === 'pass' ? 'passed'
      : batch.disposition === 'discard' ? 'discarded'
        : 'held';
  const held = status === 'held';
  return { status, outcome, checks, readings, canRetest: held, canRelease: held && outcome === 'pass', canReject: held };
}
