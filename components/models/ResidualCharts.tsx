'use client';

import { Chart as ChartJS, LinearScale, PointElement, ScatterController, Tooltip } from 'chart.js';
import { Scatter } from 'react-chartjs-2';

ChartJS.register(ScatterController, PointElement, LinearScale, Tooltip);
ChartJS.defaults.animation = false;

const DAMSON = '#83466e';

export interface ResidualPoint {
  /** "T-004 C" */
  label: string;
  fitted: number;
  /** Internally studentized residual (R's rstandard); null when the run has leverage 1. */
  standardized: number | null;
  order: number;
}

function ResidualScatter({ points, x, title, testId }: { points: Array<{ x: number; y: number; label: string }>; x: string; title: string; testId: string }) {
  return (
    <div className="h-64 min-w-0" role="img" aria-label={`${title}; the figures are in the data set table`} data-testid={testId}>
      <Scatter
        data={{ datasets: [{ label: title, data: points, backgroundColor: DAMSON, pointRadius: 4 }] }}
        options={{
          maintainAspectRatio: false,
          scales: { x: { title: { display: true, text: x } }, y: { title: { display: true, text: 'Standardised residual' }, suggestedMin: -3, suggestedMax: 3 } },
          plugins: { legend: { display: false }, tooltip: { callbacks: { label: (item) => `${points[item.dataIndex]?.label}: ${item.parsed.y?.toFixed(2)}` } } },
        }}
      />
    </div>
  );
}

/** Standardised residuals against the fitted values and against the order the trials were cooked in. */
export function ResidualCharts({ points }: { points: ResidualPoint[] }) {
  const usable = points.filter((p): p is ResidualPoint & { standardized: number } => p.standardized !== null);
  return (
    <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
      <ResidualScatter testId="residuals-fitted" title="Residuals against fitted values" x="Fitted value" points={usable.map((p) => ({ x: p.fitted, y: p.standardized, label: p.label }))} />
      <ResidualScatter testId="residuals-order" title="Residuals in cooking order" x="Run (in date order)" points={usable.map((p) => ({ x: p.order, y: p.standardized, label: p.label }))} />
    </div>
  );
}
