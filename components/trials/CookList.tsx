import type { UnitPreference } from '@/lib/chemistry';
import { SET_TEST_METHOD_LABELS, SET_TEST_SCALE, SYNERESIS_LABELS } from '@/lib/trials/vocabulary';
import type { MeasurementView } from '@/lib/trials/schema';
import { EmptyState } from '@/components/ui/Card';
import { FLAG_CLASS, massText, numText, tempText } from './format';
import { DeleteCookButton } from './DeleteCookButton';
import { TableBox } from '@/components/ui/TableBox';

const FLAG_WORD: Record<string, string> = { ok: 'within', watch: 'check', out: 'out of window', danger: 'SAFETY', unknown: '' };

/** Each cook with its measurements beside the predictions for the batch actually cooked. */
export function CookList({ trialId, cooks, massUnits, temperatureUnit, canEdit }: { trialId: string; cooks: MeasurementView[]; massUnits: UnitPreference; temperatureUnit: 'C' | 'F'; canEdit: boolean }) {
  if (!cooks.length) return <EmptyState title="Not cooked yet">Record the cook below: what the refractometer read, the pH, the end point and the yield.</EmptyState>;
  const show = (unit: string, v: number | null) =>
    unit === 'g' ? massText(v, massUnits) : unit === '°C' ? tempText(v, temperatureUnit) : unit === 'pH' ? numText(v, 2) : unit === '°Brix' ? numText(v, 1) : numText(v, 0);
  return (
    <ol className="space-y-4" data-testid="cook-list">
      {cooks.map((m) => (
        <li key={m.id} className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <p className="font-medium">Cook of {new Date(`${m.cookDate}T12:00:00Z`).toLocaleDateString('en-GB', { dateStyle: 'medium' })} <span className="text-sm font-normal text-rind-500">by {m.recordedByName}{m.batchSizeG ? ` · ${massText(m.batchSizeG, massUnits)} charge` : ''}</span></p>
            {canEdit ? <DeleteCookButton trialId={trialId} measurementId={m.id} /> : null}
          </div>
          {m.comparison.rows.some((r) => r.flag === 'danger') ? (
            <div role="alert" className="mt-2 rounded-lg bg-ember-600 px-3 py-2 text-sm font-semibold text-white">
              {m.comparison.rows.find((r) => r.flag === 'danger')!.note}
            </div>
          ) : null}
          <TableBox label="Cook against prediction" framed={false}>
            <table className="mt-3 w-full text-sm">
              <thead className="text-left text-xs uppercase tracking-wider text-rind-500">
                <tr><th scope="col" className="py-1">Measure</th><th scope="col">Predicted</th><th scope="col">Measured</th><th scope="col">Difference</th><th scope="col" className="sr-only">Note</th></tr>
              </thead>
              <tbody className="divide-y divide-pith-200">
                {m.comparison.rows.map((r) => (
                  <tr key={r.key}>
                    <th scope="row" className="py-1.5 text-left font-normal">{r.label}</th>
                    <td className="tabular-nums">{show(r.unit, r.predicted)}</td>
                    <td className={`tabular-nums ${FLAG_CLASS[r.flag]}`}>{show(r.unit, r.measured)} {FLAG_WORD[r.flag] ? <span className="text-xs">({FLAG_WORD[r.flag]})</span> : null}</td>
                    <td className="tabular-nums">{r.difference === null ? '—' : `${r.difference > 0 ? '+' : ''}${show(r.unit, r.difference)}`}</td>
                    <td className="hidden max-w-72 py-1.5 text-xs text-rind-500 md:table-cell">{r.note}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableBox>
          <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
            <div><dt className="text-xs text-rind-500">Set test</dt><dd>{m.setTestScore ? `${m.setTestScore} · ${SET_TEST_SCALE[m.setTestScore - 1].label}` : '—'}{m.setTestMethod ? ` (${SET_TEST_METHOD_LABELS[m.setTestMethod]})` : ''}</dd></div>
            <div><dt className="text-xs text-rind-500">Syneresis</dt><dd>{m.syneresis ? SYNERESIS_LABELS[m.syneresis] : '—'}</dd></div>
            <div><dt className="text-xs text-rind-500">Boil time</dt><dd>{m.boilTimeMin != null ? `${m.boilTimeMin} min` : '—'}</dd></div>
            <div><dt className="text-xs text-rind-500">Refractometer as read</dt><dd>{m.brixReading != null ? `${m.brixReading} °Brix at ${tempText(m.brixSampleTempC, temperatureUnit)}` : '—'}</dd></div>
          </dl>
          {m.colourNotes ? <p className="mt-2 text-sm"><span className="text-xs text-rind-500">Colour: </span>{m.colourNotes}</p> : null}
          {m.notes ? <p className="mt-1 text-sm text-rind-700">{m.notes}</p> : null}
        </li>
      ))}
    </ol>
  );
}
