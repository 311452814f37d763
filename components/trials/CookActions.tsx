'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import type { UnitPreference } from '@/lib/chemistry';
import type { CookView } from '@/lib/trials/schema';
import { withdrawCookAction } from '@/lib/trials/actions';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { inputClass } from '@/components/ui/Field';
import { RecordCookForm } from './RecordCookForm';

/** Correct (the form, starting from the stored values) or withdraw (with a reason) one cook. */
export function CookActions({ trialId, cook, massUnits, temperatureUnit }: { trialId: string; cook: CookView; massUnits: UnitPreference; temperatureUnit: 'C' | 'F' }) {
  const router = useRouter();
  const [correcting, setCorrecting] = useState(false);
  const [withdrawing, setWithdrawing] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);
  const reasonId = `withdraw-${cook.id}-reason`;

  async function withdraw() {
    if (!reason.trim()) return setError('Say why the cook is withdrawn (it is kept with its history).');
    setBusy(true);
    const res = await withdrawCookAction(trialId, cook.id, { reason });
    setBusy(false);
    if (!res.ok) return setError(res.error);
    setWithdrawing(false);
    router.refresh();
  }

  return (
    <>
      <div className="flex gap-4">
        <button type="button" className="text-sm text-damson-700 underline" onClick={() => setCorrecting((v) => !v)} aria-expanded={correcting}>Correct</button>
        <button type="button" className="text-sm text-ember-700 underline" onClick={() => { setError(undefined); setWithdrawing(true); }}>Withdraw</button>
      </div>
      {correcting ? (
        <div className="mt-3 basis-full">
          <RecordCookForm trialId={trialId} variantId={cook.variantId} massUnits={massUnits} temperatureUnit={temperatureUnit} cook={cook} onDone={() => setCorrecting(false)} />
        </div>
      ) : null}
      <ConfirmDialog
        open={withdrawing}
        busy={busy}
        title="Withdraw this cook?"
        confirmLabel="Withdraw the cook"
        onCancel={() => setWithdrawing(false)}
        onConfirm={withdraw}
        body={
          <>
            <p>It stays on record, marked as withdrawn, but leaves the comparisons and any promotion evidence from now on.</p>
            <label htmlFor={reasonId} className="mt-3 mb-1 block font-medium text-rind-700">Why is it withdrawn?</label>
            <textarea id={reasonId} rows={2} value={reason} onChange={(e) => { setReason(e.target.value); setError(undefined); }} aria-invalid={error ? true : undefined} className={inputClass} />
            {error ? <p role="alert" className="mt-1 text-ember-700">{error}</p> : null}
          </>
        }
      />
    </>
  );
}
