import {
  BATCH_OUTCOME_LABELS, BATCH_STATUS_LABELS, PROMOTION_STATUS_LABELS, VERSION_STATUS_LABELS,
  type BatchOutcome, type BatchStatus, type PromotionStatus, type VersionStatus,
} from '@/lib/production/vocabulary';
import { Badge, type BadgeTone } from '@/components/ui/Badge';

type ProductionStatus = PromotionStatus | VersionStatus | BatchOutcome | BatchStatus;

const TONE: Record<ProductionStatus, BadgeTone> = {
  pending: 'waiting', approved: 'good', current: 'good', sent_back: 'bad', withdrawn: 'quiet', superseded: 'quiet',
  pass: 'good', fail: 'bad', incomplete: 'waiting',
  passed: 'good', held: 'waiting', discarded: 'quiet', released: 'good', rejected: 'bad',
};

const LABELS: Record<ProductionStatus, string> = { ...PROMOTION_STATUS_LABELS, ...VERSION_STATUS_LABELS, ...BATCH_OUTCOME_LABELS, ...BATCH_STATUS_LABELS };

export function StatusBadge({ status }: { status: ProductionStatus }) {
  return <Badge tone={TONE[status]}>{LABELS[status]}</Badge>;
}
