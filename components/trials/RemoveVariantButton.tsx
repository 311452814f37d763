'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { removeVariantAction } from '@/lib/trials/actions';

function useConfirmedAction(run: () => Promise<{ ok: boolean; error?: string }>) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  return {
    open, busy, error, setOpen,
    confirm: async () => {
      setBusy(true);
      const res = await run();
      setBusy(false);
      setOpen(false);
      if (!res.ok) setError(res.error);
      else router.refresh();
    },
  };
}

export function RemoveVariantButton({ trialId, variantId, label, onDone }: { trialId: string; variantId: string; label: string; onDone?: string }) {
  const router = useRouter();
  const c = useConfirmedAction(async () => {
    const res = await removeVariantAction(trialId, variantId);
    if (res.ok && onDone) router.push(onDone);
    return res;
  });
  return (
    <>
      <button type="button" className="text-sm text-ember-700 underline" onClick={() => c.setOpen(true)}>Remove variant {label}</button>
      {c.error ? <span className="ml-2 text-sm text-ember-700">{c.error}</span> : null}
      <ConfirmDialog open={c.open} busy={c.busy} title={`Remove variant ${label}?`} body="It leaves the trial but stays on record with its cooks." confirmLabel="Remove" onCancel={() => c.setOpen(false)} onConfirm={c.confirm} />
    </>
  );
}
