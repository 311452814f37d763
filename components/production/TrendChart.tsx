'use client';

import { Chart as ChartJS, CategoryScale, LinearScale, LineElement, PointElement, Tooltip, Legend } from 'chart.js';
import { Line } from 'react-chartjs-2';
import { RUN_RULE_LABELS, RUN_RULE_SET, runRuleSignals } from '@/lib/stats/run-rules';
import { nameWithUnit } from '@/lib/format/words';

ChartJS.register(CategoryScale, LinearScale, LineElement, PointElement, Tooltip, Legend);
ChartJS.defaults.animation = false;

const DAMSON = '#83466e';
const LEAF = '#2f7a43';
const EMBER = '#b2331f';
const LIMIT = '#8c7a6b';

export interface TrendPoint {
  lotCode: string;
  value: number;
  min: number;
  max: number;
  /** Passed its checks (leaf), or not (ember). */
  ok: boolean;
}

/**
 * One reading across batches with the spec limits each batch was checked against (they step when a
 * new version comes in). Points that break a run rule are drawn as triangles and listed below.
 */
export function TrendChart({ title, unit, points, decimals }: { title: string; unit: string; points: TrendPoint[]; decimals: number }) {
  const labels = points.map((p) => p.lotCode);
  const signals = runRuleSignals(points, { resolution: 10 ** -decimals });
  const flagged = new Set(signals.map((s) => s.index));
  const limitLine = (label: string, data: number[]) => ({
    label, data, borderColor: LIMIT, borderDash: [6, 4], borderWidth: 1.5, pointRadius: 0, stepped: 'middle' as const, fill: false,
  });
  return (
    <figure className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
      <figcaption className="mb-2 font-medium">{title}</figcaption>
      <div className="h-64" role="img" aria-label={`${title} by batch, with the spec limits`} data-testid="trend-chart">
        <Line
          data={{
            labels,
            datasets: [
              {
                label: nameWithUnit(title, unit), data: points.map((p) => p.value), borderColor: DAMSON, borderWidth: 2,
                pointRadius: points.map((_, i) => (flagged.has(i) ? 8 : 5)),
                pointStyle: points.map((_, i) => (flagged.has(i) ? 'triangle' : 'circle')),
                pointBackgroundColor: points.map((p) => (p.ok ? LEAF : EMBER)), pointBorderColor: points.map((p, i) => (flagged.has(i) ? EMBER : p.ok ? LEAF : EMBER)),
              },
              limitLine('Spec minimum', points.map((p) => p.min)),
              limitLine('Spec maximum', points.map((p) => p.max)),
            ],
          }}
          options={{
            maintainAspectRatio: false,
            plugins: { legend: { position: 'bottom' }, tooltip: { callbacks: { label: (ctx) => `${ctx.dataset.label}: ${Number(ctx.parsed.y).toFixed(decimals)}` } } },
            scales: { y: { title: { display: true, text: unit } } },
          }}
        />
      </div>
      <div className="mt-3 text-sm" data-testid="run-rule-signals">
        {signals.length ? (
          <ul className="space-y-1">
            {signals.map((s) => (
              <li key={`${s.index}-${s.rule}`}><span className="font-mono">{points[s.index].lotCode}</span> — <strong className="text-ember-700">{RUN_RULE_LABELS[s.rule]}</strong>: {s.message}</li>
            ))}
          </ul>
        ) : <p className="text-rind-600">No point breaks a run rule.</p>}
        <p className="mt-1 text-xs text-rind-500">Run rules: {RUN_RULE_SET}, with the spec window as the limits and its middle as the target.</p>
      </div>
      {/* A table cannot shrink to sr-only's 1 px, so the wrapper hides it (no sideways scroll on a phone). */}
      <div className="sr-only"><table>
        <caption>{title} by batch</caption>
        <thead><tr><th>Lot</th><th>Value</th><th>Minimum</th><th>Maximum</th><th>Checks</th><th>Run rule</th></tr></thead>
        <tbody>{points.map((p, i) => <tr key={p.lotCode}><td>{p.lotCode}</td><td>{p.value.toFixed(decimals)}</td><td>{p.min}</td><td>{p.max}</td><td>{p.ok ? 'Passed' : 'Not passed'}</td><td>{signals.filter((s) => s.index === i).map((s) => RUN_RULE_LABELS[s.rule]).join('; ') || 'None'}</td></tr>)}</tbody>
      </table></div>
    </figure>
  );
}
