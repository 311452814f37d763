'use client';

import { useState, useTransition } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { FieldErrorText, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { withdrawIngredientPriceAction, withdrawPackagingPriceAction } from '@/lib/pricing/actions';

/** Withdraws a mistaken price after a confirmation that asks why; the point stays in the history. */
export function WithdrawPriceButton({ kind, priceId, label }: { kind: 'ingredient' | 'packaging'; priceId: string; label: string }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  const [fieldErrors, setFieldErrors] = useState<string[]>();
  const [pending, startTransition] = useTransition();
  const fieldId = `withdraw-reason-${priceId}`;

  function confirm() {
    setError(undefined);
    startTransition(async () => {
      const action = kind === 'ingredient' ? withdrawIngredientPriceAction : withdrawPackagingPriceAction;
      const result = await action(priceId, { reason });
      if (!result.ok) {
        setFieldErrors(result.fields?.['change.reason']);
        setError(result.fields?.['change.reason'] ? undefined : result.error);
        if (!result.fields) setOpen(false);
        return;
      }
      setOpen(false);
      router.refresh();
    });
  }

  return (
    <div className="space-y-2">
      <Button tone="ghost" type="button" disabled={pending} onClick={() => setOpen(true)} aria-label={`Withdraw ${label}`}>
        Withdraw
      </Button>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <ConfirmDialog
        open={open}
        busy={pending}
        title={`Withdraw ${label}?`}
        body={
          <div className="space-y-3">
            <p>The price stays in the history, marked withdrawn with your reason, and no longer counts in any cost. To change a price, add a new one instead.</p>
            <label htmlFor={fieldId} className="block text-sm font-medium text-rind-700">Why is it withdrawn?</label>
            <textarea id={fieldId} className={inputClass} rows={3} value={reason} onChange={(e) => setReason(e.target.value)}
              aria-invalid={fieldErrors?.length ? true : undefined} aria-describedby={fieldErrors?.length ? `${fieldId}-err` : undefined} />
            <FieldErrorText id={`${fieldId}-err`} errors={fieldErrors} />
          </div>
        }
        confirmLabel="Withdraw price"
        onCancel={() => setOpen(false)}
        onConfirm={confirm}
      />
    </div>
  );
}
