'use client';

import { Chart as ChartJS, LinearScale, PointElement, ScatterController, Tooltip, type Plugin } from 'chart.js';
import { Scatter } from 'react-chartjs-2';

ChartJS.register(ScatterController, PointElement, LinearScale, Tooltip);
ChartJS.defaults.animation = false;

const DAMSON = '#83466e';

export interface CostLikingPoint {
  label: string;
  /** Cost per jar in major units, already rounded to the minor unit. */
  cost: number;
  liking: number;
}

/** Writes each variant's label beside its point (drawn on the canvas: nothing inline for the CSP). */
const pointLabels: Plugin<'scatter'> = {
  id: 'setwellPointLabels',
  afterDatasetsDraw(chart) {
    const { ctx } = chart;
    const meta = chart.getDatasetMeta(0);
    const data = chart.data.datasets[0]?.data ?? [];
    // Each point carries its variant's label beside x and y (see the dataset below).
    const labelOf = (p: (typeof data)[number]) => (typeof p === 'object' && p !== null && 'label' in p && typeof p.label === 'string' ? p.label : '');
    ctx.save();
    ctx.fillStyle = '#2f1729';
    ctx.font = '600 12px sans-serif';
    ctx.textBaseline = 'middle';
    meta.data.forEach((point, i) => ctx.fillText(labelOf(data[i]), point.x + 8, point.y));
    ctx.restore();
  },
};

/** Cost per jar against overall liking, one labelled point per variant; the table beside it carries the same figures. */
export function CostLikingChart({ points, currency, digits, likingScale }: { points: CostLikingPoint[]; currency: string; digits: number; likingScale: { min: number; max: number } }) {
  return (
    <div className="h-72" role="img" aria-label={`Cost per jar (${currency}) against overall liking, one point per variant; the figures are in the table`} data-testid="cost-liking-chart">
      <Scatter
        data={{ datasets: [{ label: 'Variants', data: points.map((p) => ({ x: p.cost, y: p.liking, label: p.label })), backgroundColor: DAMSON, pointRadius: 6 }] }}
        options={{
          maintainAspectRatio: false,
          layout: { padding: { right: 24 } },
          scales: {
            x: { title: { display: true, text: `Cost per jar (${currency})` } },
            y: { min: likingScale.min, max: likingScale.max, title: { display: true, text: `Overall liking (${likingScale.min}–${likingScale.max})` } },
          },
          plugins: {
            legend: { display: false },
            tooltip: { callbacks: { label: (item) => `${points[item.dataIndex]?.label}: ${currency} ${item.parsed.x?.toFixed(digits)}, liking ${item.parsed.y?.toFixed(2)}` } },
          },
        }}
        plugins={[pointLabels]}
      />
    </div>
  );
}
