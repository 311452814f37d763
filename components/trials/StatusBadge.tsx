import { TRIAL_STATUS_LABELS, type TrialStatus } from '@/lib/trials/vocabulary';

const TONE: Record<TrialStatus, string> = {
  planning: 'bg-pith-200 text-rind-700 ring-pith-300',
  cooking: 'bg-quince-100 text-quince-700 ring-quince-200',
  tasting: 'bg-damson-100 text-damson-800 ring-damson-200',
  decided: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  archived: 'bg-rind-300/30 text-rind-600 ring-rind-300',
};

export function StatusBadge({ status }: { status: TrialStatus }) {
  return <span className={`inline-flex rounded-full px-2.5 py-0.5 text-xs font-semibold ring-1 ring-inset ${TONE[status]}`}>{TRIAL_STATUS_LABELS[status]}</span>;
}
