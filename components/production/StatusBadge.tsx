import { PROMOTION_STATUS_LABELS, VERSION_STATUS_LABELS, type PromotionStatus, type VersionStatus } from '@/lib/production/vocabulary';

const STYLES: Record<string, string> = {
  pending: 'bg-amberline-50 text-amberline-700 ring-amberline-100',
  approved: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  current: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  sent_back: 'bg-ember-50 text-ember-700 ring-ember-100',
  withdrawn: 'bg-pith-100 text-rind-600 ring-pith-300',
  superseded: 'bg-pith-100 text-rind-600 ring-pith-300',
  pass: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  fail: 'bg-ember-50 text-ember-700 ring-ember-100',
};

const LABELS: Record<string, string> = { ...PROMOTION_STATUS_LABELS, ...VERSION_STATUS_LABELS, pass: 'Pass', fail: 'Fail' };

export function StatusBadge({ status }: { status: PromotionStatus | VersionStatus | 'pass' | 'fail' }) {
  return <span className={`inline-flex rounded-full px-2 py-0.5 text-xs font-semibold ring-1 ring-inset ${STYLES[status]}`}>{LABELS[status]}</span>;
}
