'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { discardTastingAction } from '@/lib/tastings/actions';
import { NETWORK_FAILURE_MESSAGE } from '@/components/ui/useFormAction';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';

/** Discards a tasting that never opened, after asking. */
export function DiscardTastingButton({ tastingId, trialId }: { tastingId: string; trialId: string }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  async function discard() {
    setBusy(true);
    const result = await discardTastingAction(tastingId).catch(() => ({ ok: false as const, error: NETWORK_FAILURE_MESSAGE }));
    if (result.ok) {
      router.push(`/trials/${trialId}`);
      router.refresh();
      return;
    }
    setError(result.error);
    setBusy(false);
    setOpen(false);
  }
  return (
    <>
      <Button type="button" tone="ghost" onClick={() => setOpen(true)}>Discard</Button>
      {error ? <span role="alert" className="text-sm text-ember-700">{error}</span> : null}
      <ConfirmDialog open={open} busy={busy} title="Discard this tasting?" body="It has not opened, so nobody has tasted or answered. Its set-up and sample codes are removed." confirmLabel="Discard the tasting" onCancel={() => setOpen(false)} onConfirm={discard} />
    </>
  );
}
