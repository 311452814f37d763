'use client';

import { useMemo, useState } from 'react';
import { costComputation, formatCost, historiesBy, type FormulaCost } from '@/lib/costing';
import type { EditorCostBasis } from '@/lib/costs/schema';
import type { UnitPreference } from '@/lib/chemistry';
import { apiFetch, ApiClientError } from '@/components/api/client';
import { Notice } from '@/components/ui/Notice';
import { unitPriceText } from '@/lib/pricing/display';
import { TableBox } from '@/components/ui/TableBox';
import { type EditorComputation, type LineDraft } from '@/components/formulas/editor-state';
import { showMass } from '@/lib/format/quantities';
import { CostSummary } from './CostSummary';
import { DateInput } from '@/components/ui/DateInput';
import { TABLE, HEAD, TH, NUM_TH, CELL, NUM } from '@/components/results/DataTable';

const SENSITIVITY_ROWS = 5;
const pct = (v: number | null) => (v === null ? '—' : `${v.toFixed(1)} %`);

/**
 * Live cost in the formula editor: recomputed from the editor's own computation on every
 * keystroke, with the prices of the chosen day (fetched when the day changes). Rendered only for
 * roles that may see prices; the page decides (prices.read).
 */
export function FormulaCostPanel({
  initialBasis,
  computed,
  drafts,
  packFormatId,
  massUnits,
}: {
  initialBasis: EditorCostBasis;
  /** The editor's own live computation (not recomputed here). */
  computed: EditorComputation;
  drafts: LineDraft[];
  /** The formula's pack format (null: none chosen). */
  packFormatId: string | null;
  massUnits: UnitPreference;
}) {
  const outcome = computed.outcome;
  const lines = useMemo(() => {
    const byKey = new Map(drafts.map((d) => [d.key, d.ingredientId]));
    return computed.lines.map((l, i) => ({ ingredientId: byKey.get(computed.lineKeys[i]) ?? '', name: l.ingredient.name }));
  }, [computed, drafts]);
  const [basis, setBasis] = useState(initialBasis);
  const [asOfText, setAsOfText] = useState(initialBasis.asOf);
  const [loading, setLoading] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [formatId, setFormatId] = useState<string>(packFormatId && initialBasis.packFormats.some((f) => f.id === packFormatId) ? packFormatId : '');

  const prices = useMemo(
    () => ({
      ingredientPrices: historiesBy(basis.ingredientPrices, (p) => p.ingredientId),
      packagingPrices: historiesBy(basis.packagingPrices, (p) => p.packagingItemId),
      refuse: new Map(basis.refuse),
    }),
    [basis],
  );

  const result = useMemo(() => {
    if (!outcome?.ok) return null;
    return costComputation(
      outcome.computation,
      lines.map((l) => ({ ...l, refusePct: prices.refuse.get(l.ingredientId) ?? 0 })),
      {
        asOf: basis.asOf,
        packFormat: basis.packFormats.find((f) => f.id === formatId) ?? null,
        overfillPct: basis.overfillPct,
        ingredientPrices: prices.ingredientPrices,
        packagingPrices: prices.packagingPrices,
      },
    );
  }, [outcome, lines, prices, basis, formatId]);

  async function changeDay(day: string) {
    setAsOfText(day);
    if (!/^\d{4}-\d{2}-\d{2}$/.test(day)) return;
    setLoading(true);
    setProblem(null);
    try {
      const next = await apiFetch<{ basis: EditorCostBasis }>(`/api/v1/costs/basis?asOf=${encodeURIComponent(day)}`);
      setBasis(next.basis);
    } catch (err) {
      setProblem(err instanceof ApiClientError ? err.message : 'The prices of that day could not be loaded; the figures are still those of the day before.');
    } finally {
      setLoading(false);
    }
  }

  const currency = basis.currency;
  return (
    <section aria-labelledby="formula-cost-title" data-testid="formula-cost">
      <header className="mb-4 flex flex-wrap items-end justify-between gap-3">
        <h2 id="formula-cost-title" className="text-lg font-semibold">Cost</h2>
        <div className="flex flex-wrap items-start gap-3">
          <div className="text-sm">
            <label htmlFor="cost-as-of" className="mb-1 block font-medium text-rind-700">Prices as of</label>
            <DateInput
              id="cost-as-of"
              className="min-h-10 rounded-md border border-pith-400 bg-white px-2"
              value={asOfText}
              onChange={(e) => void changeDay(e.target.value)}
              aria-describedby={problem ? 'cost-day-problem' : undefined}
            />
          </div>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-rind-700">Pack format</span>
            <select className="min-h-10 max-w-full rounded-md border border-pith-400 bg-white px-2" value={formatId} onChange={(e) => setFormatId(e.target.value)}>
              <option value="">None (no cost per jar)</option>
              {basis.packFormats.map((f) => (
                <option key={f.id} value={f.id}>{f.name}</option>
              ))}
            </select>
          </label>
        </div>
      </header>
      {loading ? <p className="mb-2 text-xs text-rind-500" aria-live="polite">Loading the prices of that day…</p> : null}
      {problem ? <p id="cost-day-problem" className="mb-2 text-sm text-ember-700">{problem}</p> : null}
      {!currency ? (
        <Notice tone="info">Costs appear once an administrator sets the workspace currency and enters prices.</Notice>
      ) : !result ? (
        <p className="text-sm text-rind-600">Cost appears once the formula has results.</p>
      ) : !result.ok ? (
        <p className="text-sm text-rind-600">{result.message}</p>
      ) : (
        <CostDetail cost={result.cost} currency={currency} massUnits={massUnits} />
      )}
    </section>
  );
}

function CostDetail({ cost, currency, massUnits }: { cost: FormulaCost; currency: string; massUnits: UnitPreference }) {
  const perWhat = cost.perJar ? 'per jar' : 'per kg';
  return (
    <div className="space-y-4">
      <CostSummary cost={cost} currency={currency} testId="cost-summary" />
      {cost.filledPerJarG !== null && cost.jarsPerBatch !== null ? (
        <p className="text-xs text-rind-600">
          Each jar takes {showMass(cost.filledPerJarG, massUnits)} with the overfill; the batch fills about {Math.floor(cost.jarsPerBatch)} jars.
        </p>
      ) : null}
      <TableBox label="Cost of each line" framed={false}>
        <table className={TABLE} data-testid="cost-lines">
          <thead className={HEAD}>
            <tr>
              <th scope="col" className={TH}>Line</th>
              <th scope="col" className={NUM_TH}>Bought</th>
              <th scope="col" className={NUM_TH}>Price per kg</th>
              <th scope="col" className={NUM_TH}>Per batch</th>
              <th scope="col" className={NUM_TH}>{cost.perJar ? 'Per jar' : 'Per kg'}</th>
              <th scope="col" className={NUM_TH}>Share</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-pith-200">
            {cost.ingredients.map((l, i) => (
              <tr key={`i${i}`}>
                <th scope="row" className={`${CELL} text-left font-normal`}>
                  {l.name}
                  {l.refusePct > 0 ? <span className="block text-xs text-rind-500">{l.refusePct} % trimmed away</span> : null}
                </th>
                <td className={NUM}>{showMass(l.boughtG, massUnits)}</td>
                <td className={NUM}>{l.price ? unitPriceText(l.price.perKgMinor, currency) : <Unknown />}</td>
                <td className={NUM}>{l.batchMinor === null ? <Unknown /> : formatCost(l.batchMinor, currency)}</td>
                <td className={NUM}>{(cost.perJar ? l.perJarMinor : l.perKgMinor) === null ? <Unknown /> : formatCost((cost.perJar ? l.perJarMinor : l.perKgMinor)!, currency)}</td>
                <td className={NUM}>{pct(l.sharePct)}</td>
              </tr>
            ))}
            {cost.packaging.map((p, i) => (
              <tr key={`p${i}`}>
                <th scope="row" className={`${CELL} text-left font-normal`}>
                  {p.name}
                  <span className="block text-xs text-rind-500">Packaging, {p.perJar === 1 ? 'one per jar' : `${Number(p.perJar.toFixed(4))} per jar`}</span>
                </th>
                <td className={`${CELL} text-right`}>—</td>
                <td className={`${CELL} text-right`}>—</td>
                <td className={`${CELL} text-right`}>—</td>
                <td className={NUM}>{p.perJarMinor === null ? <Unknown /> : formatCost(p.perJarMinor, currency)}</td>
                <td className={NUM}>{pct(p.sharePct)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableBox>
      {cost.sensitivity.length ? (
        <div>
          <h3 className="mb-1 text-sm font-semibold">If a price rises by {cost.stepPct} %</h3>
          <ul className="space-y-0.5 text-sm" data-testid="cost-sensitivity">
            {cost.sensitivity.slice(0, SENSITIVITY_ROWS).map((r) => (
              <li key={`${r.kind}-${r.name}`}>
                {r.name} +{cost.stepPct} % → <span className="tabular-nums font-medium">{formatCost(r.deltaMinor, currency, { signed: true })}</span> {perWhat}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <p className="text-xs text-rind-500">Figures are worked unrounded and rounded once, to the nearest minor unit of {currency}.</p>
    </div>
  );
}

function Unknown() {
  return <span className="text-amberline-700">unknown</span>;
}
