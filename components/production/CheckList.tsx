import { QC_CHECK_STATUS_LABELS, type QcCheck } from '@/lib/chemistry';

const STATUS_STYLE = { pass: 'text-leaf-700', fail: 'text-ember-700', not_measured: 'text-amberline-700' } as const;

/** A batch's checks against its spec, one line each. */
export function CheckList({ checks, testId }: { checks: readonly QcCheck[]; testId?: string }) {
  return (
    <ul className="space-y-1 text-sm" data-testid={testId}>
      {checks.map((c) => (
        <li key={c.key}><span className={`font-semibold ${STATUS_STYLE[c.status]}`}>{QC_CHECK_STATUS_LABELS[c.status]}</span> — {c.label}: {c.reason}</li>
      ))}
    </ul>
  );
}
