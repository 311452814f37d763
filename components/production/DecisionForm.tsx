'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { FieldErrorText, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { decidePromotionAction } from '@/lib/production/actions';
import { approvalConsequence, type PromotionOutcome } from '@/lib/production/review';

/** Approve or send back. Approval is final, so it asks first; sending back needs a comment. */
export function DecisionForm({ requestId, code, outcome }: { requestId: string; code: string; outcome: PromotionOutcome }) {
  const router = useRouter();
  const [comment, setComment] = useState('');
  const { pending: busy, error, fields, run, revalidate } = useFormAction(decidePromotionAction, { fieldPrefix: 'decision' });
  const [confirming, setConfirming] = useState(false);

  async function decide(decision: 'approve' | 'send_back') {
    const res = await run(requestId, { decision, comment });
    setConfirming(false);
    if (res?.ok) {
      router.push(res.data.productVersionId ? `/production/versions/${res.data.productVersionId}` : `/production/reviews/${requestId}`);
      router.refresh();
    }
  }

  return (
    <form className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Decide this request" onSubmit={(e) => e.preventDefault()} noValidate>
      <h2 className="text-lg font-semibold">Your decision</h2>
      <div>
        <label htmlFor="f-comment" className="mb-1 block text-sm font-medium text-rind-700">Comment (needed to send back)</label>
        <textarea id="f-comment" name="comment" rows={3} value={comment} onChange={(e) => { setComment(e.target.value); revalidate('comment'); }} className={inputClass} aria-invalid={fields.comment ? true : undefined} aria-describedby={fields.comment ? 'f-comment-err' : undefined} />
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
