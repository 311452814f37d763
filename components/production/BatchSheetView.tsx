import { formatMass, formatTemperature, fromGrams, ROUNDING_SHARE_LIMIT, type UnitPreference } from '@/lib/chemistry';
import type { BatchSheet } from '@/lib/production/sheet';
import { SpecTable } from './SpecTable';
import { TableBox } from '@/components/ui/TableBox';

const box = 'inline-block h-4 w-4 border border-rind-700 align-middle';

/** The printable sheet: tick boxes, steps, the end point for this kitchen, QC targets and spaces to fill in. */
export function BatchSheetView({ sheet, paper, massUnits, temperatures, superseded }: { sheet: BatchSheet; paper: 'a4' | 'letter'; massUnits: UnitPreference; temperatures: UnitPreference; superseded: boolean }) {
  const s = sheet.scaled;
  const unit = s.resolution.unit;
  const decimals = stepDecimals(s.resolution.step);
  // One unit on the sheet: the scale's own, so "Weigh out" and "Exact" read side by side; a line on a
  // finer step is written to that step's decimals.
  const rounded = (g: number, places = decimals) => `${fromGrams(g, unit).toFixed(places)} ${unit}`;
  const exact = (g: number, places = decimals) => `${fromGrams(g, unit).toFixed(places + 1)} ${unit}`;
  const finer = s.lines.filter((l) => l.finerStep);
  // The charge to the finest step any line uses, so its exact figure never has fewer digits than its rounded one.
  const chargeDecimals = Math.max(decimals, ...s.lines.map((l) => stepDecimals(l.stepInResolutionUnit)));
  return (
    <article className={`batch-sheet sheet-${paper} rounded-card bg-white p-6 text-sm ring-1 ring-pith-300 print:rounded-none print:p-0 print:ring-0`} data-testid="batch-sheet">
      <header className="mb-4 flex flex-wrap items-start justify-between gap-4 border-b-2 border-rind-800 pb-3">
        <div>
          <h1 className="text-2xl font-semibold">{sheet.title}</h1>
          <p className="text-rind-600">Batch sheet{superseded ? ' — SUPERSEDED, reference only' : ''}. Scale factor {s.scaleFactor.toFixed(3)}; weights rounded to {s.resolution.step} {unit}{finer.length ? ', small additions to a finer step' : ''}.</p>
        </div>
        <TableBox label="Batch" framed={false}>
          <table className="text-sm">
            <tbody>
              {['Lot code', 'Date', 'Made by (initials)', 'Checked by (initials)'].map((label) => (
                <tr key={label}><th scope="row" className="pr-3 text-left font-medium">{label}</th><td className="h-7 w-48 border-b border-rind-500" /></tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      </header>

      <section className="mb-4 break-inside-avoid">
        <h2 className="mb-1 text-lg font-semibold">Ingredients</h2>
        <TableBox label="Ingredients to weigh" framed={false}>
          <table className="w-full" data-testid="sheet-ingredients">
            <thead><tr className="border-b border-rind-500 text-left"><th className="w-8 py-1">✓</th><th className="py-1">Ingredient</th><th className="whitespace-nowrap py-1 text-right">Weigh out</th><th className="py-1 pl-3 text-left">Scale step</th><th className="py-1 text-right text-rind-500">Exact</th><th className="py-1 pl-4">Weighed (actual)</th></tr></thead>
            <tbody>
              {s.lines.map((l) => (
                <tr key={l.index} className="border-b border-pith-300">
                  <td className="py-1.5"><span className={box} aria-hidden /></td>
                  <td className="py-1.5">{l.name}</td>
                  <td className="whitespace-nowrap py-1.5 text-right font-semibold tabular-nums">{rounded(l.roundedG, stepDecimals(l.stepInResolutionUnit))}</td>
                  <td className={`py-1.5 pl-3 tabular-nums ${l.finerStep ? 'font-semibold' : 'text-rind-500'}`} data-testid="line-step">
                    {l.stepInResolutionUnit.toFixed(stepDecimals(l.stepInResolutionUnit))} {unit}{l.finerStep ? ', finer scale' : ''}
                  </td>
                  <td className="whitespace-nowrap py-1.5 text-right tabular-nums text-rind-500">{exact(l.exactG, stepDecimals(l.stepInResolutionUnit))}</td>
                  <td className="py-1.5 pl-4"><span className="inline-block w-28 border-b border-rind-400">&nbsp;</span></td>
                </tr>
              ))}
              <tr className="font-medium"><td /><td className="py-1.5">Kettle charge</td><td className="whitespace-nowrap py-1.5 text-right tabular-nums">{rounded(s.rounded.totalChargeG, chargeDecimals)}</td><td /><td className="whitespace-nowrap py-1.5 text-right tabular-nums text-rind-500">{exact(s.exact.totalChargeG, chargeDecimals)}</td><td /></tr>
            </tbody>
          </table>
        </TableBox>
        <p className="mt-2 text-rind-700" data-testid="rounding-effect">
          {finer.length ? <>Weighed on a finer scale, so rounding moves no line by more than {ROUNDING_SHARE_LIMIT * 100} %: {finer.map((l) => l.name).join(', ')}. </> : null}
          {s.effectOfRounding.noticeableLines.length ? <strong>Rounding changes {s.effectOfRounding.noticeableLines.map((l) => `${l.name} by ${signed(l.roundingErrorPct)} %`).join(', ')} of its exact weight: weigh {s.effectOfRounding.noticeableLines.length > 1 ? 'them' : 'it'} as closely as your scale allows. </strong> : null}
          Effect of rounding: charge {signed(s.effectOfRounding.totalChargeDeltaG)} g, soluble solids {signed(s.effectOfRounding.solubleSolidsDeltaG)} g.
          Cooked to the same target it gives {formatMass(s.rounded.finishedMassG, massUnits)} ({signed(s.effectOfRounding.finishedMassDeltaG)} g), about {s.rounded.jarsFilled} jars;
          boiled off by the planned amount instead it would finish at {s.effectOfRounding.solidsPctIfPlannedEvaporation.toFixed(2)} % solids ({signed(s.effectOfRounding.solidsPctDeltaIfPlannedEvaporation, 2)} points). Cook to the refractometer, not the clock.
        </p>
      </section>

      <section className="mb-4 grid gap-4 break-inside-avoid sm:grid-cols-2 print:grid-cols-2">
        <div>
          <h2 className="mb-1 text-lg font-semibold">Method</h2>
          <ol className="list-decimal space-y-1 pl-6">{sheet.steps.map((step, i) => <li key={i}>{step}</li>)}</ol>
          {sheet.cookNotes ? <p className="mt-2 whitespace-pre-line">{sheet.cookNotes}</p> : null}
        </div>
        <div>
          <h2 className="mb-1 text-lg font-semibold">End point for this kitchen</h2>
          <p className="text-xl font-semibold" data-testid="kitchen-end-point">{formatTemperature(sheet.endPoint.kitchenC, temperatures)}</p>
          <p className="text-rind-600">{formatTemperature(sheet.endPoint.seaLevelC, temperatures)} at sea level, lowered by the drop in water’s boiling point{sheet.endPoint.altitudeM !== null ? ` at ${Math.round(sheet.endPoint.altitudeM)} m` : ''} (water boils at {formatTemperature(sheet.endPoint.waterBoilingC, temperatures)}). Check a thermometer in boiling water on the day.</p>
          <h2 className="mb-1 mt-3 text-lg font-semibold">QC targets</h2>
          <SpecTable spec={sheet.spec} temperatures={temperatures} />
        </div>
      </section>

      <section className="mb-4 break-inside-avoid">
        <h2 className="mb-1 text-lg font-semibold">Record</h2>
        <TableBox label="Checks" framed={false}>
          <table className="w-full">
            <tbody>
              {['Boil started (time)', 'End point reached (time, °)', 'Refractometer reading / sample temperature', 'pH', 'Filling started / finished (time, °)', 'Jars filled / rejected', 'Net fill: mean / lightest jar'].map((label) => (
                <tr key={label} className="border-b border-pith-300"><th scope="row" className="w-1/2 py-2 text-left font-medium">{label}</th><td className="py-2" /></tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      </section>

      {sheet.cautions.length ? (
        <section className="break-inside-avoid border-t border-rind-500 pt-2 text-xs">
          <h2 className="text-sm font-semibold">Cautions</h2>
          <ul className="list-disc pl-5">{sheet.cautions.map((c) => <li key={c.code}><strong>{c.title}.</strong> {c.message}</li>)}</ul>
        </section>
      ) : null}
    </article>
  );
}

/** Decimals of a step written in its unit: 5 → 0, 0.1 → 1, 0.05 → 2. */
function stepDecimals(step: number): number {
  return Math.min(6, Math.max(0, -Math.floor(Math.log10(step) + 1e-9)));
}

/** "+12", "−3" or "0": a change too small to show at these decimals is 0, never "-0". */
function signed(x: number, decimals = 0): string {
  const v = x.toFixed(decimals);
  if (Number(v) === 0) return (0).toFixed(decimals);
  return x > 0 ? `+${v}` : v;
}
