import { TRIAL_STATUS_LABELS, type TrialStatus } from '@/lib/trials/vocabulary';
import { Badge, type BadgeTone } from '@/components/ui/Badge';

const TONE: Record<TrialStatus, BadgeTone> = { planning: 'planning', cooking: 'cooking', tasting: 'tasting', decided: 'good', archived: 'archived' };

export function StatusBadge({ status }: { status: TrialStatus }) {
  return <Badge tone={TONE[status]}>{TRIAL_STATUS_LABELS[status]}</Badge>;
}
