/**
 * The label of a formula, variant or production version: plain tables in our own layout, made to
 * print. Unknown figures read "unknown", never 0. No data access; the label comes computed.
 */
import type { Label, LabelFactsRow, LabelIngredientList, LabelNutrientRow } from '@/lib/label/label';
import { TableBox } from '@/components/ui/TableBox';

const UNKNOWN = 'unknown';

function IngredientText({ list, title }: { list: LabelIngredientList; title: string }) {
  return (
    <div>
      <h4 className="text-sm font-semibold">{title}</h4>
      <p className="mt-1 text-sm" data-testid="ingredient-list">
        {list.runs.length === 0 ? <span className="text-rind-600">No lines yet.</span> : list.runs.map((r, i) => (r.emphasis ? <strong key={i}>{r.text}</strong> : <span key={i}>{r.text}</span>))}
      </p>
      {list.contains ? <p className="mt-1 text-sm font-semibold">{list.contains}</p> : null}
      {list.notes.length ? <ul className="mt-1 list-disc pl-5 text-xs text-rind-600">{list.notes.map((n) => <li key={n}>{n}</li>)}</ul> : null}
    </div>
  );
}

const unrounded = (value: number | null, unit: string) => (value === null ? UNKNOWN : `${Number(value.toPrecision(4))}${unit ? ` ${unit}` : ''}`);

function NutrientCells({ row }: { row: LabelNutrientRow }) {
  return (
    <>
      <th scope="row" className={`py-1 pr-3 text-left font-normal ${row.depth === 2 ? 'pl-8' : row.depth === 1 ? 'pl-4' : ''}`}>{row.name}</th>
      <td className={`py-1 pr-3 tabular-nums ${row.label === null ? 'text-rind-600 italic' : 'font-medium'}`}>
        {row.label ?? UNKNOWN}
        {row.incomplete && row.label !== null ? <span className="ml-1 text-xs text-amberline-700">(incomplete)</span> : null}
      </td>
      <td className="py-1 pr-3 tabular-nums text-rind-600">{unrounded(row.unrounded, row.unit)}</td>
    </>
  );
}

function EuTable({ label }: { label: Label }) {
  return (
    <TableBox label="EU nutrition declaration" framed={false}>
      <table className="w-full text-sm">
        <caption className="pb-1 text-left text-xs text-rind-600">Per {label.eu.per}. {label.eu.energyBasis}</caption>
        <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th scope="col" className="py-1 pr-3 font-medium">Nutrient</th><th scope="col" className="py-1 pr-3 font-medium">On the label</th><th scope="col" className="py-1 pr-3 font-medium">Unrounded</th></tr></thead>
        <tbody>{label.eu.rows.map((r) => <tr key={r.key} className="border-b border-pith-200"><NutrientCells row={r} /></tr>)}</tbody>
      </table>
    </TableBox>
  );
}

function UsTable({ label }: { label: Label }) {
  return (
    <TableBox label="US nutrition facts" framed={false}>
      <table className="w-full text-sm">
        <caption className="pb-1 text-left text-xs text-rind-600">
          Serving size {label.us.serving}{label.us.servingsPerJar ? `; ${label.us.servingsPerJar}` : ''}. {label.us.energyBasis}
        </caption>
        <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th scope="col" className="py-1 pr-3 font-medium">Per serving</th><th scope="col" className="py-1 pr-3 font-medium">On the label</th><th scope="col" className="py-1 pr-3 font-medium">Unrounded</th><th scope="col" className="py-1 pr-3 font-medium">% Daily Value</th></tr></thead>
        <tbody>{label.us.rows.map((r: LabelFactsRow) => (
          <tr key={r.key} className="border-b border-pith-200">
            <NutrientCells row={r} />
            <td className="py-1 pr-3 tabular-nums">{r.dailyValue ?? (r.label === null ? UNKNOWN : '')}</td>
          </tr>
        ))}</tbody>
      </table>
      {label.us.notes.length ? <ul className="mt-1 list-disc pl-5 text-xs text-rind-600">{label.us.notes.map((n) => <li key={n}>{n}</li>)}</ul> : null}
    </TableBox>
  );
}

const claimVerdict = (holds: boolean | null) => (holds === null ? 'Cannot tell yet' : holds ? 'May be made' : 'May not be made');
const additiveVerdict = { within: 'Within the limit', over: 'Over the limit', unknown: 'Cannot tell yet', not_applicable: 'Does not apply' } as const;

/** `heading` names what the label belongs to ("Label of v3"); `frozenNote` says how a version's label was kept. */
export function LabelPanel({ label, heading = 'Label', frozenNote }: { label: Label; heading?: string; frozenNote?: string }) {
  return (
    <section className="label-panel space-y-6" aria-label={heading}>
      {frozenNote ? <p className="text-sm text-rind-600">{frozenNote}</p> : null}
      {label.incomplete.length ? (
        <div className="rounded-card bg-amberline-50 p-3 ring-1 ring-amberline-100" data-testid="label-incomplete">
          <h3 className="text-sm font-semibold">What is incomplete</h3>
          <ul className="mt-1 list-disc pl-5 text-sm">{label.incomplete.map((n, i) => <li key={i}><strong className="font-medium">{n.part}:</strong> {n.reason}</li>)}</ul>
        </div>
      ) : null}

      <div>
        <h3 className="text-base font-semibold">Ingredient list</h3>
        <div className="mt-2 grid grid-cols-1 gap-4 md:grid-cols-2">
          <IngredientText list={label.ingredients.eu} title="EU" />
          <IngredientText list={label.ingredients.us} title="US" />
        </div>
      </div>

      <div>
        <h3 className="text-base font-semibold">Statements</h3>
        <ul className="mt-2 space-y-2 text-sm">
          {label.statements.map((s) => (
            <li key={s.kind}>
              <span className="text-rind-600">{s.kind === 'fruit' ? 'Fruit' : 'Total sugar'}: </span>
              {s.text === null ? <span className="italic text-rind-600">{UNKNOWN}</span> : <strong className="font-medium">{s.text}</strong>}
              {s.notes.map((n) => <span key={n} className="block text-xs text-rind-600">{n}</span>)}
            </li>
          ))}
        </ul>
      </div>

      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        <div className="min-w-0"><h3 className="mb-2 text-base font-semibold">EU nutrition declaration</h3><EuTable label={label} /></div>
        <div className="min-w-0"><h3 className="mb-2 text-base font-semibold">US nutrition facts</h3><UsTable label={label} /></div>
      </div>

      <div>
        <h3 className="text-base font-semibold">Claims{label.claims.reference ? ` against ${label.claims.reference}` : ''}</h3>
        {label.claims.items.length === 0 ? <p className="mt-1 text-sm text-rind-600">No claims checked.</p> : (
          <TableBox label="Claims" framed={false} className="mt-2">
            <table className="w-full text-sm">
              <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th scope="col" className="py-1 pr-3 font-medium">Claim</th><th scope="col" className="py-1 pr-3 font-medium">Verdict</th><th scope="col" className="py-1 pr-3 font-medium">Figures</th><th scope="col" className="py-1 pr-3 font-medium">Rule</th></tr></thead>
              <tbody>{label.claims.items.map((c) => (
                <tr key={c.claim} className="border-b border-pith-200">
                  <th scope="row" className="py-1 pr-3 text-left font-normal">{c.claim}</th>
                  <td className={`py-1 pr-3 ${c.holds === false ? 'text-ember-700' : ''}`}>{claimVerdict(c.holds)}</td>
                  <td className="py-1 pr-3">{c.figures}</td>
                  <td className="py-1 pr-3 text-xs text-rind-600">{c.rule}</td>
                </tr>
              ))}</tbody>
            </table>
          </TableBox>
        )}
      </div>

      <div>
        <h3 className="text-base font-semibold">Additive limits</h3>
        {label.additives.length === 0 ? <p className="mt-1 text-sm text-rind-600">No additive with a limit in this formula.</p> : (
          <TableBox label="Additive limits" framed={false} className="mt-2">
            <table className="w-full text-sm">
              <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th scope="col" className="py-1 pr-3 font-medium">Additive</th><th scope="col" className="py-1 pr-3 font-medium">Check</th><th scope="col" className="py-1 pr-3 font-medium">In the product</th><th scope="col" className="py-1 pr-3 font-medium">Limit</th><th scope="col" className="py-1 pr-3 font-medium">Rule</th></tr></thead>
              <tbody>{label.additives.map((a) => (
                <tr key={a.name} className="border-b border-pith-200">
                  <th scope="row" className="py-1 pr-3 text-left font-normal">{a.name}</th>
                  <td className={`py-1 pr-3 ${a.status === 'over' ? 'font-semibold text-ember-700' : ''}`}>{additiveVerdict[a.status]}</td>
                  <td className="py-1 pr-3 tabular-nums">{a.amount ?? UNKNOWN}</td>
                  <td className="py-1 pr-3">{a.limit}{a.note ? <span className="block text-xs text-rind-600">{a.note}</span> : null}</td>
                  <td className="py-1 pr-3 text-xs text-rind-600">{a.rule}</td>
                </tr>
              ))}</tbody>
            </table>
          </TableBox>
        )}
      </div>
    </section>
  );
}
