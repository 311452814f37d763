import type { UnitPreference } from '@/lib/chemistry';
import { SET_TEST_METHOD_LABELS, SET_TEST_SCALE, SYNERESIS_LABELS } from '@/lib/trials/vocabulary';
import type { CookView } from '@/lib/trials/schema';
import { EmptyState } from '@/components/ui/Card';
import { FLAG_CLASS, massText, numText, tempText } from './format';
import { CookActions } from './CookActions';
import { formatDate } from '@/lib/format/dates';

const FIELD_LABELS: Record<string, string> = {
  cookDate: 'cook date', batchSizeG: 'batch size', brixReading: 'refractometer', brixSampleTempC: 'sample temperature', ph: 'pH',
  endPointTempC: 'end point', boilTimeMin: 'boil time', setTestScore: 'set test', setTestMethod: 'set test method', syneresis: 'syneresis',
  colourNotes: 'colour', yieldJars: 'jars', yieldG: 'yield', notes: 'notes',
};

/** What a correction replaced, in words: "pH 3.40, yield 1.50 kg". */
function beforeText(before: Partial<CookView>, massUnits: UnitPreference, temperatureUnit: 'C' | 'F'): string {
  return Object.entries(before).map(([key, v]) => {
    const value = v == null || v === '' ? 'blank'
      : key === 'batchSizeG' || key === 'yieldG' ? massText(v as number, massUnits)
      : key === 'brixSampleTempC' || key === 'endPointTempC' ? tempText(v as number, temperatureUnit)
      : key === 'setTestMethod' ? SET_TEST_METHOD_LABELS[v as keyof typeof SET_TEST_METHOD_LABELS]
      : key === 'syneresis' ? SYNERESIS_LABELS[v as keyof typeof SYNERESIS_LABELS]
      : key === 'cookDate' ? formatDate(String(v))
      : String(v);
    return `${FIELD_LABELS[key] ?? key} ${value}`;
  }).join(', ');
}

function CookHistory({ cook, massUnits, temperatureUnit }: { cook: CookView; massUnits: UnitPreference; temperatureUnit: 'C' | 'F' }) {
  const corrections = cook.changes.filter((c) => c.kind === 'corrected');
  if (!corrections.length) return null;
  return (
    <details className="mt-3 text-sm">
      <summary className="cursor-pointer text-rind-600">Corrected {corrections.length === 1 ? 'once' : `${corrections.length} times`}: see what changed</summary>
      <ol className="mt-2 space-y-1 text-rind-700">
        {corrections.map((c) => (
          <li key={c.at}>{formatDate(c.at)}, {c.byName}: “{c.reason}”. Before: {beforeText(c.before, massUnits, temperatureUnit)}.</li>
        ))}
      </ol>
    </details>
  );
}
import { TableBox } from '@/components/ui/TableBox';

const FLAG_WORD: Record<string, string> = { ok: 'within', watch: 'check', out: 'out of window', danger: 'SAFETY', unknown: '' };

/** Each cook with its measurements beside the predictions for the batch actually cooked. */
export function CookList({ trialId, cooks, massUnits, temperatureUnit, canEdit, withdrawn = false }: {
  trialId: string; cooks: CookView[]; massUnits: UnitPreference; temperatureUnit: 'C' | 'F'; canEdit: boolean; withdrawn?: boolean;
}) {
  if (!cooks.length && withdrawn) return null;
  if (!cooks.length) return <EmptyState title="Not cooked yet">Record the cook below: what the refractometer read, the pH, the end point and the yield.</EmptyState>;
  const show = (unit: string, v: number | null) =>
    unit === 'g' ? massText(v, massUnits) : unit === '°C' ? tempText(v, temperatureUnit) : unit === 'pH' ? numText(v, 2) : unit === '°Brix' ? numText(v, 1) : numText(v, 0);
  return (
    <ol className="space-y-4" data-testid={withdrawn ? 'withdrawn-cook-list' : 'cook-list'}>
      {cooks.map((m) => (
        <li key={m.id} className={`rounded-card p-4 ring-1 ring-pith-300 ${m.withdrawn ? 'bg-pith-100 text-rind-600' : 'bg-pith-50'}`}>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <p className="font-medium">Cook of {formatDate(m.cookDate)} <span className="text-sm font-normal text-rind-500">by {m.recordedByName}{m.batchSizeG ? ` · ${massText(m.batchSizeG, massUnits)} charge` : ''}</span></p>
            {canEdit && !m.withdrawn ? <CookActions trialId={trialId} cook={m} massUnits={massUnits} temperatureUnit={temperatureUnit} /> : null}
          </div>
          {m.withdrawn ? (
            <p className="mt-2 rounded-lg bg-pith-200 px-3 py-2 text-sm text-rind-800">
              <strong>Withdrawn</strong> on {formatDate(m.withdrawn.at)} by {m.withdrawn.byName}: “{m.withdrawn.reason}”. It counts in no comparison or promotion evidence.
            </p>
          ) : null}
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
          <CookHistory cook={m} massUnits={massUnits} temperatureUnit={temperatureUnit} />
        </li>
      ))}
    </ol>
  );
}
