'use client';

import { Chart as ChartJS, CategoryScale, LinearScale, LineElement, PointElement, Tooltip, Legend } from 'chart.js';
import { Line } from 'react-chartjs-2';

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
  outcome: 'pass' | 'fail';
}

/** One reading across batches with the spec limits each batch was checked against (they step when a new version comes in). */
export function TrendChart({ title, unit, points, decimals }: { title: string; unit: string; points: TrendPoint[]; decimals: number }) {
  const labels = points.map((p) => p.lotCode);
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
                label: `${title} (${unit})`, data: points.map((p) => p.value), borderColor: DAMSON, borderWidth: 2,
                pointRadius: 5, pointBackgroundColor: points.map((p) => (p.outcome === 'fail' ? EMBER : LEAF)), pointBorderColor: points.map((p) => (p.outcome === 'fail' ? EMBER : LEAF)),
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
      {/* A table cannot shrink below its content, so the hidden box is a div that clips it. */}
      <div className="sr-only">
      <table>
        <caption>{title} by batch</caption>
        <thead><tr><th>Lot</th><th>Value</th><th>Minimum</th><th>Maximum</th><th>Result</th></tr></thead>
        <tbody>{points.map((p) => <tr key={p.lotCode}><td>{p.lotCode}</td><td>{p.value.toFixed(decimals)}</td><td>{p.min}</td><td>{p.max}</td><td>{p.outcome}</td></tr>)}</tbody>
      </table>
      </div>
    </figure>
  );
}
