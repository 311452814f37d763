import {
  BATCH_OUTCOME_LABELS, BATCH_STATUS_LABELS, PROMOTION_STATUS_LABELS, VERSION_STATUS_LABELS,
  type BatchOutcome, type BatchStatus, type PromotionStatus, type VersionStatus,
} from '@/lib/production/vocabulary';

const GOOD = 'bg-leaf-50 text-leaf-700 ring-leaf-100';
const BAD = 'bg-ember-50 text-ember-700 ring-ember-100';
const WAITING = 'bg-amberline-50 text-amberline-700 ring-amberline-100';
const QUIET = 'bg-pith-100 text-rind-600 ring-pith-300';

const STYLES: Record<string, string> = {
  pending: WAITING, approved: GOOD, current: GOOD, sent_back: BAD, withdrawn: QUIET, superseded: QUIET,
  pass: GOOD, fail: BAD, incomplete: WAITING,
  passed: GOOD, held: WAITING, discarded: QUIET, released: GOOD, rejected: BAD,
};

const LABELS: Record<string, string> = { ...PROMOTION_STATUS_LABELS, ...VERSION_STATUS_LABELS, ...BATCH_OUTCOME_LABELS, ...BATCH_STATUS_LABELS };

export function StatusBadge({ status }: { status: PromotionStatus | VersionStatus | BatchOutcome | BatchStatus }) {
  return <span className={`inline-flex rounded-full px-2 py-0.5 text-xs font-semibold ring-1 ring-inset ${STYLES[status]}`}>{LABELS[status]}</span>;
}
