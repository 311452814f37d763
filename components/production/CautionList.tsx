import type { Caution } from '@/lib/chemistry';
import { Notice } from '@/components/ui/Notice';

const TONE = { danger: 'danger', warning: 'warning', info: 'info' } as const;

export function CautionList({ cautions }: { cautions: Pick<Caution, 'code' | 'severity' | 'title' | 'message'>[] }) {
  if (!cautions.length) return null;
  return (
    <div className="space-y-2" data-testid="cautions">
      {cautions.map((c) => (
        <Notice key={c.code} tone={TONE[c.severity]} title={c.title}>{c.message}</Notice>
      ))}
    </div>
  );
}
