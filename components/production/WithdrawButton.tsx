'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { withdrawPromotionAction } from '@/lib/production/actions';

export function WithdrawButton({ requestId, code }: { requestId: string; code: string }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const { pending: busy, error, run } = useFormAction(withdrawPromotionAction);
  async function withdraw() {
    const res = await run(requestId, { comment: '' });
    setOpen(false);
    if (res?.ok) router.refresh();
  }
  return (
    <div className="space-y-2">
      <Button tone="secondary" type="button" onClick={() => setOpen(true)}>Withdraw the request</Button>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <ConfirmDialog open={open} title={`Withdraw ${code}?`} body="It leaves the review queue and stays in the history. You can file a new request later." confirmLabel="Withdraw" busy={busy} onConfirm={withdraw} onCancel={() => setOpen(false)} />
    </div>
  );
}
