'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { Notice } from '@/components/ui/Notice';
import { inputClass } from '@/components/ui/Field';
import { TRIAL_STATUS_LABELS, TRIAL_TRANSITIONS, type TrialStatus } from '@/lib/trials/vocabulary';
import { transitionTrialAction } from '@/lib/trials/actions';
import { useFormAction } from '@/components/ui/useFormAction';

export function StatusControls({ trialId, status }: { trialId: string; status: TrialStatus }) {
  const router = useRouter();
  const [target, setTarget] = useState<TrialStatus | null>(null);
  const [note, setNote] = useState('');
  const { pending: busy, error, run } = useFormAction(transitionTrialAction);
  return (
    <div className="no-print">
      <div className="flex flex-wrap gap-2" role="group" aria-label="Move the trial">
        {TRIAL_TRANSITIONS[status].map((to) => (
          <Button key={to} tone={to === 'archived' ? 'ghost' : 'secondary'} type="button" onClick={() => setTarget(to)}>
            Move to “{TRIAL_STATUS_LABELS[to]}”
          </Button>
        ))}
      </div>
      {error ? <div className="mt-2"><Notice tone="danger">{error}</Notice></div> : null}
      <ConfirmDialog
        open={target !== null}
        busy={busy}
        tone={target === 'archived' ? 'danger' : 'primary'}
        title={target ? `Move to “${TRIAL_STATUS_LABELS[target]}”?` : ''}
        body={
          <>
            <p>{target === 'tasting' ? 'Variants are fixed from here on, so the panel tastes what was planned.' : target === 'archived' ? 'The trial leaves the list but keeps everything; you can reopen it.' : 'The move is recorded with your name and the time.'}</p>
            <label className="mt-3 block text-sm font-medium text-rind-700" htmlFor="status-note">Note (optional)</label>
            <input id="status-note" className={inputClass} value={note} onChange={(e) => setNote(e.target.value)} maxLength={500} />
          </>
        }
        confirmLabel="Move"
        onCancel={() => setTarget(null)}
        onConfirm={async () => {
          if (!target) return;
          const res = await run(trialId, { to: target, note: note || undefined });
          setTarget(null);
          if (res?.ok) {
            setNote('');
            router.refresh();
          }
        }}
      />
    </div>
  );
}
