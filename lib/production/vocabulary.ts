/** Production vocabulary shared by entities, schemas and screens. Pure data. */

export const PROMOTION_STATUSES = ['pending', 'approved', 'sent_back', 'withdrawn'] as const;
export type PromotionStatus = (typeof PROMOTION_STATUSES)[number];
export const PROMOTION_STATUS_LABELS: Record<PromotionStatus, string> = {
  pending: 'Awaiting review',
  approved: 'Approved',
  sent_back: 'Sent back',
  withdrawn: 'Withdrawn',
};

/** Where a promoted variant goes; the developer always chooses, there is no default. */
export const PROMOTION_TARGETS = ['new_product', 'existing_product'] as const;
export type PromotionTarget = (typeof PROMOTION_TARGETS)[number];

export const VERSION_STATUSES = ['current', 'superseded'] as const;
export type VersionStatus = (typeof VERSION_STATUSES)[number];
export const VERSION_STATUS_LABELS: Record<VersionStatus, string> = { current: 'In production', superseded: 'Superseded' };

/** A batch's checks: all passed, one failed, or none failed but one the spec requires was not measured. */
export const BATCH_OUTCOMES = ['pass', 'fail', 'incomplete'] as const;
export type BatchOutcome = (typeof BATCH_OUTCOMES)[number];
export const BATCH_OUTCOME_LABELS: Record<BatchOutcome, string> = { pass: 'Pass', fail: 'Fail', incomplete: 'Incomplete' };

/** What can follow a held batch: re-tests, then one release or reject. */
export const BATCH_DECISION_KINDS = ['retest', 'release', 'reject'] as const;
export type BatchDecisionKind = (typeof BATCH_DECISION_KINDS)[number];

/** Where a batch stands: passed at recording, held (failed or incomplete), discarded at recording, or released/rejected after a hold. */
export const BATCH_STATUSES = ['passed', 'held', 'discarded', 'released', 'rejected'] as const;
export type BatchStatus = (typeof BATCH_STATUSES)[number];
export const BATCH_STATUS_LABELS: Record<BatchStatus, string> = {
  passed: 'Passed', held: 'On hold', discarded: 'Discarded', released: 'Released', rejected: 'Rejected',
};

/** What happens to a batch that failed a check. */
export const DISPOSITIONS = ['rework', 'hold', 'discard'] as const;
export type Disposition = (typeof DISPOSITIONS)[number];
export const DISPOSITION_LABELS: Record<Disposition, string> = {
  rework: 'Rework (re-boil or blend, then re-test)',
  hold: 'Hold (quarantine pending a decision)',
  discard: 'Discard',
};

/** Audit actions, in the words the trail shows. */
export const AUDIT_ACTIONS = {
  'promotion.requested': 'Requested promotion',
  'promotion.approved': 'Approved promotion',
  'promotion.sent_back': 'Sent back promotion',
  'promotion.withdrawn': 'Withdrew promotion',
  'version.created': 'Created production version',
  'version.superseded': 'Superseded production version',
  'batch.recorded': 'Recorded batch',
  'batch.failed': 'Recorded failed batch',
  'batch.incomplete': 'Recorded incomplete batch',
  'batch.retested': 'Re-tested held batch',
  'batch.released': 'Released held batch',
  'batch.rejected': 'Rejected held batch',
} as const;
export type AuditAction = keyof typeof AUDIT_ACTIONS;

/**
 * Our lot-code scheme: product code, the two-digit year and day of the year, then the batch of
 * that day, e.g. QMJ-26336-2 for the second batch of quince jam on 2 December 2026.
 */
export const LOT_CODE_PATTERN = /^[A-Z]{2,5}-\d{5}-\d{1,2}$/;
export const PRODUCT_CODE_PATTERN = /^[A-Z]{2,5}$/;

export function dayOfYear(isoDate: string): number {
  const d = new Date(`${isoDate}T00:00:00Z`);
  const start = Date.UTC(d.getUTCFullYear(), 0, 1);
  return Math.floor((d.getTime() - start) / 86_400_000) + 1;
}

export function lotCodeFor(productCode: string, isoDate: string, batchOfDay: number): string {
  const yy = isoDate.slice(2, 4);
  return `${productCode}-${yy}${String(dayOfYear(isoDate)).padStart(3, '0')}-${batchOfDay}`;
}

/** The first batch number of the day not yet used by `takenLotCodes` (lot codes of the product). */
export function nextLotCode(productCode: string, isoDate: string, takenLotCodes: readonly string[]): string {
  const taken = new Set(takenLotCodes);
  let batch = 1;
  while (taken.has(lotCodeFor(productCode, isoDate, batch))) batch += 1;
  return lotCodeFor(productCode, isoDate, batch);
}

export function promotionCode(number: number): string {
  return `PR-${String(number).padStart(3, '0')}`;
}

export function versionCode(productCode: string, version: number): string {
  return `${productCode} v${version}`;
}
