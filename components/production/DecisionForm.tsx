'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { FieldErrorText, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { decidePromotionAction } from '@/lib/production/actions';
import { approvalConsequence, type PromotionOutcome } from '@/lib/production/review';

/** Approve or send back. Approval is final, so it asks first; sending back needs a comment. */
export function DecisionForm({ requestId, code, outcome }: { requestId: string; code: string; outcome: PromotionOutcome }) {
  const router = useRouter();
  const [comment, setComment] = useState('');
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState(false);

  async function decide(decision: 'approve' | 'send_back') {
    setBusy(true);
    setError(undefined);
    setFields({});
    const res = await decidePromotionAction(requestId, { decision, comment });
    setBusy(false);
    setConfirming(false);
    if (res.ok) {
      router.push(res.data.productionFormulaId ? `/production/versions/${res.data.productionFormulaId}` : `/production/reviews/${requestId}`);
      router.refresh();
    } else {
      setFields(Object.fromEntries(Object.entries(res.fields ?? {}).map(([k, v]) => [k.replace(/^decision\./, ''), v])));
      setError(res.error);
    }
  }

  return (
    <form className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Decide this request" onSubmit={(e) => e.preventDefault()} noValidate>
      <h2 className="text-lg font-semibold">Your decision</h2>
      <div>
        <label htmlFor="f-comment" className="mb-1 block text-sm font-medium text-rind-700">Comment (needed to send back)</label>
        <textarea id="f-comment" name="comment" rows={3} value={comment} onChange={(e) => setComment(e.target.value)} className={inputClass} aria-invalid={fields.comment ? true : undefined} aria-describedby={fields.comment ? 'f-comment-err' : undefined} />
        <FieldErrorText id="f-comment-err" errors={fields.comment} />
      </div>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="button" onClick={() => setConfirming(true)} disabled={busy}>Approve for production</Button>
        <Button type="button" tone="secondary" onClick={() => decide('send_back')} disabled={busy}>{busy ? 'Saving…' : 'Send back'}</Button>
      </div>
      <ConfirmDialog
        open={confirming}
        title={`Approve ${code}?`}
        body={<>{approvalConsequence(outcome)} Approval cannot be undone or edited.</>}
        confirmLabel="Approve"
        tone="primary"
        busy={busy}
        onConfirm={() => decide('approve')}
        onCancel={() => setConfirming(false)}
      />
    </form>
  );
}
