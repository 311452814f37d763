'use client';

import { Chart as ChartJS, BarElement, CategoryScale, LinearScale, Tooltip, Legend, type Plugin } from 'chart.js';
import { Bar } from 'react-chartjs-2';

ChartJS.register(BarElement, CategoryScale, LinearScale, Tooltip, Legend);
// Results are read, printed and screenshotted: draw the final state at once.
ChartJS.defaults.animation = false;

const DAMSON = '#83466e';
const QUINCE = '#d9a82e';
const LEAF = '#2f7a43';
const EMBER = '#b2331f';

/** Draws each bar's 95 % interval as a whisker; chart.js has no error bars of its own. */
const errorBars: Plugin<'bar'> = {
  id: 'setwellErrorBars',
  afterDatasetsDraw(chart) {
    const intervals = (chart.options.plugins as unknown as { setwellErrorBars?: { intervals: Array<[number, number] | null> } }).setwellErrorBars?.intervals;
    if (!intervals) return;
    const { ctx, scales } = chart;
    const meta = chart.getDatasetMeta(0);
    ctx.save();
    ctx.strokeStyle = '#2f1729';
    ctx.lineWidth = 1.5;
    meta.data.forEach((bar, i) => {
      const ci = intervals[i];
      if (!ci) return;
      const x = bar.x;
      const y1 = scales.y.getPixelForValue(ci[0]);
      const y2 = scales.y.getPixelForValue(ci[1]);
      ctx.beginPath();
      ctx.moveTo(x, y1);
      ctx.lineTo(x, y2);
      ctx.moveTo(x - 6, y1);
      ctx.lineTo(x + 6, y1);
      ctx.moveTo(x - 6, y2);
      ctx.lineTo(x + 6, y2);
      ctx.stroke();
    });
    ctx.restore();
  },
};

export function MeansChart({ title, labels, means, intervals, min, max, letters }: {
  title: string; labels: string[]; means: Array<number | null>; intervals: Array<[number, number] | null>; min: number; max: number; letters: string[];
}) {
  return (
    <div className="h-64" role="img" aria-label={`${title}: means with 95 % confidence intervals`} data-testid="means-chart">
      <Bar
        data={{ labels: labels.map((l, i) => `${l} (${letters[i] ?? ''})`), datasets: [{ label: title, data: means, backgroundColor: DAMSON, borderRadius: 6 }] }}
        options={{
          maintainAspectRatio: false,
          scales: { y: { min, max, title: { display: true, text: 'Mean score' } } },
          plugins: { legend: { display: false }, setwellErrorBars: { intervals } } as never,
        }}
        plugins={[errorBars]}
      />
    </div>
  );
}

export function JarChart({ title, rows }: { title: string; rows: Array<{ label: string; tooLittle: number; justAboutRight: number; tooMuch: number; n: number }> }) {
  const pct = (x: number, n: number) => (n ? (100 * x) / n : 0);
  return (
    <div className="h-56" role="img" aria-label={`${title}: share of tasters too little, just about right, too much`} data-testid="jar-chart">
      <Bar
        data={{
          labels: rows.map((r) => r.label),
          datasets: [
            { label: 'Too little', data: rows.map((r) => pct(r.tooLittle, r.n)), backgroundColor: QUINCE },
            { label: 'Just about right', data: rows.map((r) => pct(r.justAboutRight, r.n)), backgroundColor: LEAF },
            { label: 'Too much', data: rows.map((r) => pct(r.tooMuch, r.n)), backgroundColor: EMBER },
          ],
        }}
        options={{ indexAxis: 'y', maintainAspectRatio: false, scales: { x: { stacked: true, max: 100, title: { display: true, text: '% of tasters' } }, y: { stacked: true } } }}
      />
    </div>
  );
}

export function CountChart({ label, labels, values, ariaLabel }: { label: string; labels: string[]; values: number[]; ariaLabel: string }) {
  return (
    <div className="h-56" role="img" aria-label={ariaLabel} data-testid="count-chart">
      <Bar data={{ labels, datasets: [{ label, data: values, backgroundColor: [DAMSON, QUINCE, LEAF, EMBER, '#9f6389', '#6f665e'] }] }} options={{ maintainAspectRatio: false, plugins: { legend: { display: false } } }} />
    </div>
  );
}

const SERIES = [DAMSON, QUINCE, LEAF, EMBER, '#9f6389', '#6f665e', '#b98a1c', '#245f34', '#3b3632', '#d9bccf', '#e8c153', '#8c2616'];

/** All attributes at once, one bar group per attribute and one colour per sample. */
export function ProfileChart({ attributes, samples, means }: { attributes: string[]; samples: string[]; means: Record<string, Record<string, number | null>> }) {
  return (
    <div className="h-72" role="img" aria-label="Attribute profile: mean score of each sample on each attribute" data-testid="profile-chart">
      <Bar
        data={{ labels: attributes, datasets: samples.map((s, i) => ({ label: `Sample ${s}`, data: attributes.map((a) => means[a]?.[s] ?? null), backgroundColor: SERIES[i % SERIES.length] })) }}
        options={{ maintainAspectRatio: false, scales: { y: { min: 0, title: { display: true, text: 'Mean score (each on its own scale)' } } } }}
      />
    </div>
  );
}

/** Weighted penalties of the too-little and too-much groups; the larger the bar, the more liking that side costs. */
export function PenaltyChart({ title, tooLittle, tooMuch }: { title: string; tooLittle: number | null; tooMuch: number | null }) {
  return (
    <div className="h-40" role="img" aria-label={`${title}: weighted penalties`} data-testid="penalty-chart">
      <Bar
        data={{ labels: ['Too little', 'Too much'], datasets: [{ label: 'Weighted penalty', data: [tooLittle ?? 0, tooMuch ?? 0], backgroundColor: [QUINCE, EMBER] }] }}
        options={{ indexAxis: 'y', maintainAspectRatio: false, plugins: { legend: { display: false } }, scales: { x: { title: { display: true, text: 'Share × mean drop in liking' } } } }}
      />
    </div>
  );
}
