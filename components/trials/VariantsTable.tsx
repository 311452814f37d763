import Link from 'next/link';
import type { UnitPreference } from '@/lib/chemistry';
import { FACTOR_LABELS, SET_TEST_SCALE } from '@/lib/trials/vocabulary';
import type { VariantView } from '@/lib/trials/schema';
import { FLAG_CLASS, massText, numText, tempText } from './format';
import { TableBox } from '@/components/ui/TableBox';

const COMPLIANCE: Record<string, string> = {
  compliant: 'Meets the rules',
  non_compliant: 'Fails a rule',
  incomplete: 'Incomplete',
  not_applicable: 'No standard',
};

/** The trial at a glance: each variant's factor levels, predicted chemistry and latest cook side by side. */
export function VariantsTable({ trialId, variants, massUnits, temperatureUnit, costPerJar }: {
  trialId: string; variants: VariantView[]; massUnits: UnitPreference; temperatureUnit: 'C' | 'F';
  /** Cost per jar as shown, by variant id; absent for roles that may not see prices. */
  costPerJar?: Map<string, string>;
}) {
  const factors = [...new Set(variants.flatMap((v) => v.factorLevels.map((l) => l.factor)))];
  return (
    <TableBox label="Variants">
      <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm" data-testid="variants-table">
        <caption className="sr-only">Variants with predicted and measured values</caption>
        <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
          <tr>
            <th scope="col" className="px-3 py-2">Variant</th>
            {factors.map((f) => (
              <th key={f} scope="col" className="px-3 py-2" title={FACTOR_LABELS[f].help}>
                {FACTOR_LABELS[f].name}
                <span className="block normal-case tracking-normal text-rind-500">{FACTOR_LABELS[f].unit}</span>
              </th>
            ))}
            <th scope="col" className="px-3 py-2">Predicted finished</th>
            <th scope="col" className="px-3 py-2">Target solids</th>
            <th scope="col" className="px-3 py-2">aw (est.)</th>
            <th scope="col" className="px-3 py-2">End point</th>
            <th scope="col" className="px-3 py-2">Rules</th>
            {costPerJar ? <th scope="col" className="px-3 py-2">Cost per jar</th> : null}
            <th scope="col" className="px-3 py-2">Last cook: yield</th>
            <th scope="col" className="px-3 py-2">Brix at 20 °C</th>
            <th scope="col" className="px-3 py-2">pH</th>
            <th scope="col" className="px-3 py-2">Set</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-pith-200">
          {variants.map((v) => {
            const c = v.computation;
            const cook = v.cooks.at(-1);
            const flag = (key: string) => cook?.comparison.rows.find((r) => r.key === key)?.flag ?? 'unknown';
            const danger = v.summary.dangerCount > 0;
            return (
              <tr key={v.id} className={v.isBase ? 'bg-quince-50/50' : ''}>
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  <Link href={`/trials/${trialId}/variants/${v.id}`} className="font-semibold text-damson-800 underline-offset-2 hover:underline">
                    {v.label}
                  </Link>
                  {v.isBase ? <span className="ml-1 text-xs text-rind-500">(base)</span> : null}
                  <span className="block max-w-56 text-xs text-rind-600">{v.description}</span>
                </th>
                {factors.map((f) => {
                  const level = v.factorLevels.find((l) => l.factor === f);
                  return (
                    <td key={f} className="px-3 py-2 tabular-nums">
                      {level ? numText(level.value, f === 'sugar_ratio' ? 2 : 1) : '—'}
                      {level && Math.abs(level.coded) <= 1 && Number.isInteger(level.coded) ? <span className="ml-1 text-xs text-rind-500">({level.coded > 0 ? '+' : level.coded < 0 ? '−' : '0'})</span> : null}
                    </td>
                  );
                })}
                <td className="px-3 py-2 tabular-nums">{massText(c?.massBalance.finishedMassG, massUnits)}</td>
                <td className="px-3 py-2 tabular-nums">{numText(v.settings.targetSolidsPct, 0, ' %')}</td>
                <td className="px-3 py-2 tabular-nums">{numText(c?.waterActivity.aw, 3)}</td>
                <td className="px-3 py-2 tabular-nums">{tempText(c?.endPoint.endPointC, temperatureUnit)}</td>
                <td className="px-3 py-2">
                  {v.summary.complianceOverall ? COMPLIANCE[v.summary.complianceOverall] : '—'}
                  {danger ? <span className="ml-1 rounded bg-ember-600 px-1 text-xs font-semibold text-white">caution</span> : null}
                </td>
                {costPerJar ? <td className="px-3 py-2 tabular-nums" data-testid="variant-cost">{costPerJar.get(v.id) ?? '—'}</td> : null}
                <td className={`px-3 py-2 tabular-nums ${FLAG_CLASS[flag('finished_mass')]}`}>{cook ? massText(cook.yieldG, massUnits) : 'not cooked'}</td>
                <td className={`px-3 py-2 tabular-nums ${FLAG_CLASS[flag('solids')]}`}>{cook ? numText(cook.comparison.correctedBrix ?? cook.brixReading, 1) : '—'}</td>
                <td className={`px-3 py-2 tabular-nums ${FLAG_CLASS[flag('ph')]}`}>{cook ? numText(cook.ph, 2) : '—'}</td>
                <td className="px-3 py-2">{cook?.setTestScore ? SET_TEST_SCALE[cook.setTestScore - 1].label : '—'}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </TableBox>
  );
}
