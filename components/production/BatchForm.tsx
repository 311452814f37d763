'use client';

import { useMemo, useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Field, FieldErrorText, SelectField, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { CheckList } from './CheckList';
import { ChemistryInputError, checkBatchAgainstSpec, plainChemistryMessage, toGrams, type QcSpec } from '@/lib/chemistry';
import { DISPOSITIONS, DISPOSITION_LABELS, nextLotCode } from '@/lib/production/vocabulary';
import { recordBatchAction } from '@/lib/production/actions';
import { fromDisplayTemperature, parseNumber, type TemperatureUnit } from './temperature';

// Field names of the form differ from the server's where it converts units.
const RENAMES = { batchSizeG: 'batchSize', brixSampleTempC: 'brixSampleTemp', fillTempC: 'fillTemp' };

/** Production's batch entry: every reading is checked against the spec as it is typed, and again on the server. */
export function BatchForm({ versionId, spec, productCode, takenLotCodes, today, temperatureUnit, massUnits }: {
  versionId: string; spec: QcSpec; productCode: string; takenLotCodes: readonly string[]; today: string; temperatureUnit: TemperatureUnit; massUnits: 'metric' | 'imperial';
}) {
  const router = useRouter();
  const deg = temperatureUnit === 'F' ? '°F' : '°C';
  const sizeUnit = massUnits === 'imperial' ? 'lb' : 'kg';
  const [v, setV] = useState<Record<string, string>>({
    lotCode: nextLotCode(productCode, today, takenLotCodes), batchDate: today, batchSize: '', brixReading: '', brixSampleTemp: temperatureUnit === 'F' ? '68' : '20', ph: '',
    fillTemp: '', netFillMeanG: '', netFillMinG: '', setTestScore: '', jarsFilled: '', jarsRejected: '0', notes: '', disposition: '', dispositionComment: '',
  });
  const [saved, setSaved] = useState<string>();
  const { pending: busy, error, fields, run, revalidate } = useFormAction(recordBatchAction, { fieldPrefix: 'batch', renameFields: RENAMES });
  const set = (key: string) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) => {
    setV((s) => ({ ...s, [key]: e.target.value }));
    revalidate(key);
  };

  const readings = {
    brixReading: parseNumber(v.brixReading), brixSampleTempC: fromDisplayTemperature(v.brixSampleTemp, temperatureUnit), ph: parseNumber(v.ph),
    fillTempC: fromDisplayTemperature(v.fillTemp, temperatureUnit), netFillMeanG: parseNumber(v.netFillMeanG), netFillMinG: parseNumber(v.netFillMinG),
    setTestScore: parseNumber(v.setTestScore),
  };
  const { live, liveProblem } = useMemo(() => {
    const { brixReading, brixSampleTempC, ph, fillTempC } = readings;
    if (brixReading === null || brixSampleTempC === null || ph === null || fillTempC === null) return { live: null, liveProblem: null };
    try {
      return { live: checkBatchAgainstSpec(spec, { ...readings, brixReading, brixSampleTempC, ph, fillTempC }), liveProblem: null };
    } catch (err) {
      // Outside the correction table, say: the reading cannot be checked as it stands, and this says why.
      if (err instanceof ChemistryInputError) return { live: null, liveProblem: `No checks yet. ${plainChemistryMessage(err)}.` };
      throw err;
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [v, spec]);

  function onDateChange(e: React.ChangeEvent<HTMLInputElement>) {
    const date = e.target.value;
    revalidate('batchDate');
    revalidate('lotCode');
    setV((s) => ({ ...s, batchDate: date, lotCode: /^\d{4}-\d{2}-\d{2}$/.test(date) ? nextLotCode(productCode, date, takenLotCodes) : s.lotCode }));
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setSaved(undefined);
    const size = parseNumber(v.batchSize);
    const res = await run(versionId, {
      lotCode: v.lotCode, batchDate: v.batchDate, batchSizeG: size === null ? null : toGrams(size, sizeUnit), ...readings,
      jarsFilled: parseNumber(v.jarsFilled), jarsRejected: parseNumber(v.jarsRejected), notes: v.notes || null,
      disposition: v.disposition || null, dispositionComment: v.dispositionComment || null,
    });
    if (res?.ok) {
      setSaved(`${v.lotCode} recorded: ${res.data.outcome === 'pass' ? 'passed every check' : res.data.outcome === 'incomplete' ? 'incomplete, on hold until the missing checks are re-tested' : 'failed, with its disposition'}.`);
      router.push(`/production/versions/${versionId}#batches`);
      router.refresh();
    }
  }

  return (
    <form onSubmit={submit} className="space-y-6" aria-label="Record a batch" noValidate>
      <section className="grid gap-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300 sm:grid-cols-3">
        <Field label="Batch date" name="batchDate" type="date" value={v.batchDate} onChange={onDateChange} errors={fields.batchDate} />
        <Field label="Lot code" name="lotCode" value={v.lotCode} onChange={set('lotCode')} errors={fields.lotCode} hint={`${productCode}, year and day of the year, batch of the day.`} autoCapitalize="characters" />
        <Field label={`Batch size (${sizeUnit})`} name="batchSize" inputMode="decimal" value={v.batchSize} onChange={set('batchSize')} errors={fields.batchSize} />
      </section>
      <section className="grid gap-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300 sm:grid-cols-3">
        <h2 className="text-lg font-semibold sm:col-span-3">Readings</h2>
        <Field label="Refractometer (°Brix, as read)" name="brixReading" inputMode="decimal" value={v.brixReading} onChange={set('brixReading')} errors={fields.brixReading} />
        <Field label={`Sample temperature (${deg})`} name="brixSampleTemp" inputMode="decimal" value={v.brixSampleTemp} onChange={set('brixSampleTemp')} errors={fields.brixSampleTemp} hint="Corrected to 20 °C for the check." />
        <Field label="pH" name="ph" inputMode="decimal" value={v.ph} onChange={set('ph')} errors={fields.ph} />
        <Field label={`Fill temperature (${deg})`} name="fillTemp" inputMode="decimal" value={v.fillTemp} onChange={set('fillTemp')} errors={fields.fillTemp} />
        <Field label="Mean net fill (g)" name="netFillMeanG" inputMode="decimal" value={v.netFillMeanG} onChange={set('netFillMeanG')} errors={fields.netFillMeanG} hint="Of the jars weighed. The spec needs it for a pass." />
        <Field label="Lightest jar (g)" name="netFillMinG" inputMode="decimal" value={v.netFillMinG} onChange={set('netFillMinG')} errors={fields.netFillMinG} />
        <Field label="Set test score (1–5)" name="setTestScore" inputMode="numeric" value={v.setTestScore} onChange={set('setTestScore')} errors={fields.setTestScore} />
        <Field label="Jars filled" name="jarsFilled" inputMode="numeric" value={v.jarsFilled} onChange={set('jarsFilled')} errors={fields.jarsFilled} />
        <Field label="Jars rejected" name="jarsRejected" inputMode="numeric" value={v.jarsRejected} onChange={set('jarsRejected')} errors={fields.jarsRejected} />
        <div className="sm:col-span-3">
          <label htmlFor="f-notes" className="mb-1 block text-sm font-medium text-rind-700">Notes</label>
          <textarea id="f-notes" name="notes" rows={2} value={v.notes} onChange={set('notes')} className={inputClass} />
        </div>
      </section>

      <section className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-live="polite">
        <h2 className="mb-2 text-lg font-semibold">Against the spec</h2>
        {live ? (
          <>
            <CheckList checks={live.checks} testId="live-checks" />
            {live.outcome === 'incomplete' ? (
              <p className="mt-2 text-sm font-medium text-amberline-700" data-testid="live-outcome">Incomplete: the spec requires every check. Without the missing ones the batch is recorded on hold until they are re-tested.</p>
            ) : null}
            {live.brixCorrectionNote ? <p className="mt-2 text-xs text-rind-500">{live.brixCorrectionNote}</p> : null}
          </>
        ) : liveProblem ? <p className="text-sm text-amberline-700" data-testid="live-problem">{liveProblem}</p>
          : <p className="text-sm text-rind-600">Enter the refractometer reading and its temperature, the pH and the fill temperature to see the checks.</p>}
        {live?.outcome === 'fail' || fields.disposition ? (
          <div className="mt-4 grid gap-3 sm:grid-cols-2">
            <SelectField label="Disposition" name="disposition" value={v.disposition} onChange={set('disposition')} errors={fields.disposition}
              options={[{ value: '', label: 'Choose…' }, ...DISPOSITIONS.map((d) => ({ value: d, label: DISPOSITION_LABELS[d] }))]} />
            <div>
              <label htmlFor="f-disposition-comment" className="mb-1 block text-sm font-medium text-rind-700">What was done</label>
              <textarea id="f-disposition-comment" name="dispositionComment" rows={2} value={v.dispositionComment} onChange={set('dispositionComment')} className={inputClass} aria-invalid={fields.dispositionComment ? true : undefined} />
              <FieldErrorText id="f-disposition-comment-err" errors={fields.dispositionComment} />
            </div>
          </div>
        ) : null}
      </section>

      {error ? <Notice tone="danger">{error}</Notice> : null}
      {saved ? <Notice tone="success">{saved}</Notice> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Saving…' : 'Record the batch'}</Button>
    </form>
  );
}
