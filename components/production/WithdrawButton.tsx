'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { Notice } from '@/components/ui/Notice';
import { withdrawPromotionAction } from '@/lib/production/actions';

export function WithdrawButton({ requestId, code }: { requestId: string; code: string }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  async function withdraw() {
    setBusy(true);
    const res = await withdrawPromotionAction(requestId, { comment: '' });
    setBusy(false);
    setOpen(false);
    if (res.ok) router.refresh();
    else setError(res.error);
  }
  return (
    <div className="space-y-2">
      <Button tone="secondary" type="button" onClick={() => setOpen(true)}>Withdraw the request</Button>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <ConfirmDialog open={open} title={`Withdraw ${code}?`} body="It leaves the review queue and stays in the history. You can file a new request later." confirmLabel="Withdraw" busy={busy} onConfirm={withdraw} onCancel={() => setOpen(false)} />
    </div>
  );
}
