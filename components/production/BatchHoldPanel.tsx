'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { Field, FieldErrorText, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { decideBatchAction, retestBatchAction } from '@/lib/production/actions';
import { batchDecisionSchema } from '@/lib/production/schema';
import { fromDisplayTemperature, parseNumber, type TemperatureUnit } from './temperature';

const RETEST_RENAMES = { brixSampleTempC: 'brixSampleTemp', fillTempC: 'fillTemp' };

/** A held batch: re-test the readings, then release (once the latest checks pass) or reject. */
export function BatchHoldPanel({ batchId, lotCode, canRelease, reworked, temperatureUnit }: {
  batchId: string; lotCode: string; canRelease: boolean; reworked: boolean; temperatureUnit: TemperatureUnit;
}) {
  const router = useRouter();
  const deg = temperatureUnit === 'F' ? '°F' : '°C';
  const [v, setV] = useState<Record<string, string>>({
    brixReading: '', brixSampleTemp: '', ph: '', fillTemp: '', netFillMeanG: '', netFillMinG: '', setTestScore: '', comment: '',
  });
  const [decision, setDecision] = useState({ comment: '' });
  const [confirming, setConfirming] = useState<'release' | 'reject' | null>(null);
  const retest = useFormAction(retestBatchAction, { fieldPrefix: 'retest', renameFields: RETEST_RENAMES });
  const decide = useFormAction(decideBatchAction, { fieldPrefix: 'decision', schema: batchDecisionSchema });
  const set = (key: string) => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) => {
    setV((s) => ({ ...s, [key]: e.target.value }));
    retest.revalidate(key);
  };

  async function submitRetest(e: React.FormEvent) {
    e.preventDefault();
    const res = await retest.run(batchId, {
      brixReading: parseNumber(v.brixReading), brixSampleTempC: fromDisplayTemperature(v.brixSampleTemp, temperatureUnit), ph: parseNumber(v.ph),
      fillTempC: fromDisplayTemperature(v.fillTemp, temperatureUnit), netFillMeanG: parseNumber(v.netFillMeanG), netFillMinG: parseNumber(v.netFillMinG),
      setTestScore: parseNumber(v.setTestScore), comment: v.comment,
    });
    if (res?.ok) {
      setV({ brixReading: '', brixSampleTemp: '', ph: '', fillTemp: '', netFillMeanG: '', netFillMinG: '', setTestScore: '', comment: '' });
      router.refresh();
    }
  }

  async function submitDecision(kind: 'release' | 'reject') {
    const res = await decide.run(batchId, { decision: kind, comment: decision.comment });
    setConfirming(null);
    if (res?.ok) router.refresh();
  }

  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <form onSubmit={submitRetest} className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Re-test the batch" noValidate>
        <h2 className="text-lg font-semibold">Re-test</h2>
        <p className="text-sm text-rind-600">
          {reworked
            ? 'This batch was reworked: take every reading again — refractometer, pH, fill temperature, net fill and set. A re-boil or blend changes the batch, so a reading from before it does not count. They are checked against the same spec.'
            : 'Enter the readings taken again; the others keep their recorded values. They are checked against the same spec.'}
        </p>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field label="Refractometer (°Brix, as read)" name="brixReading" inputMode="decimal" value={v.brixReading} onChange={set('brixReading')} errors={retest.fields.brixReading} />
          <Field label={`Sample temperature (${deg})`} name="brixSampleTemp" inputMode="decimal" value={v.brixSampleTemp} onChange={set('brixSampleTemp')} errors={retest.fields.brixSampleTemp} />
          <Field label="pH" name="ph" inputMode="decimal" value={v.ph} onChange={set('ph')} errors={retest.fields.ph} />
          <Field label={`Fill temperature (${deg})`} name="fillTemp" inputMode="decimal" value={v.fillTemp} onChange={set('fillTemp')} errors={retest.fields.fillTemp} hint={reworked ? undefined : 'Only after a re-fill.'} />
          <Field label="Mean net fill (g)" name="netFillMeanG" inputMode="decimal" value={v.netFillMeanG} onChange={set('netFillMeanG')} errors={retest.fields.netFillMeanG} />
          <Field label="Lightest jar (g)" name="netFillMinG" inputMode="decimal" value={v.netFillMinG} onChange={set('netFillMinG')} errors={retest.fields.netFillMinG} />
          <Field label="Set test score (1–5)" name="setTestScore" inputMode="numeric" value={v.setTestScore} onChange={set('setTestScore')} errors={retest.fields.setTestScore} />
        </div>
        <div>
          <label htmlFor="f-retest-comment" className="mb-1 block text-sm font-medium text-rind-700">What was done before the re-test</label>
          <textarea id="f-retest-comment" name="comment" rows={2} value={v.comment} onChange={set('comment')} className={inputClass}
            aria-invalid={retest.fields.comment ? true : undefined} aria-describedby={retest.fields.comment ? 'f-retest-comment-err' : undefined} />
          <FieldErrorText id="f-retest-comment-err" errors={retest.fields.comment} />
        </div>
        {retest.error ? <Notice tone="danger">{retest.error}</Notice> : null}
        <Button type="submit" disabled={retest.pending}>{retest.pending ? 'Checking…' : 'Record the re-test'}</Button>
      </form>

      <form onSubmit={(e) => e.preventDefault()} className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Release or reject the batch" noValidate>
        <h2 className="text-lg font-semibold">Release or reject</h2>
        {canRelease ? (
          <p className="text-sm text-rind-600">The latest checks pass: the batch can be released.</p>
        ) : (
          <p className="text-sm text-rind-600">Release needs a re-test in which every check passes. Reject if the batch cannot be saved.</p>
        )}
        <div>
          <label htmlFor="f-decision-comment" className="mb-1 block text-sm font-medium text-rind-700">Reason</label>
          <textarea id="f-decision-comment" name="comment" rows={2} value={decision.comment}
            onChange={(e) => { const next = { comment: e.target.value }; setDecision(next); decide.revalidate('comment', { decision: 'reject', ...next }); }}
            className={inputClass} aria-invalid={decide.fields.comment ? true : undefined} aria-describedby={decide.fields.comment ? 'f-decision-comment-err' : undefined} />
          <FieldErrorText id="f-decision-comment-err" errors={decide.fields.comment} />
        </div>
        {decide.error ? <Notice tone="danger">{decide.error}</Notice> : null}
        <div className="flex flex-wrap gap-3">
          <Button type="button" disabled={!canRelease || decide.pending} onClick={() => setConfirming('release')}>Release the batch</Button>
          <Button type="button" tone="danger" disabled={decide.pending} onClick={() => setConfirming('reject')}>Reject the batch</Button>
        </div>
        <ConfirmDialog
          open={confirming !== null}
          title={confirming === 'release' ? `Release ${lotCode}?` : `Reject ${lotCode}?`}
          body={confirming === 'release'
            ? 'The batch leaves hold and may be sold. This is recorded in the audit trail and cannot be undone.'
            : 'The batch will not be sold. This is recorded in the audit trail and cannot be undone.'}
          confirmLabel={confirming === 'release' ? 'Release' : 'Reject'}
          tone={confirming === 'release' ? 'primary' : 'danger'}
          busy={decide.pending}
          onConfirm={() => submitDecision(confirming ?? 'reject')}
          onCancel={() => setConfirming(null)}
        />
      </form>
    </div>
  );
}
