'use client';

import { Chart as ChartJS, BarElement, CategoryScale, LinearScale, Tooltip, Legend, type ChartType, type Plugin } from 'chart.js';
import { Bar } from 'react-chartjs-2';
import { clipInterval, clippingNote, jarDiverging, type ClippedInterval, type JarShareRow } from '@/lib/results/chart-data';

ChartJS.register(BarElement, CategoryScale, LinearScale, Tooltip, Legend);
// Results are read, printed and screenshotted: draw the final state at once.
ChartJS.defaults.animation = false;

const DAMSON = '#83466e';
const QUINCE = '#d9a82e';
const LEAF = '#2f7a43';
const EMBER = '#b2331f';

type WhiskerOptions = { intervals?: Array<ClippedInterval | null> };

// chart.js's own way to type a plugin's options (set on the chart, read by the plugin's hooks).
declare module 'chart.js' {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars -- a merged interface repeats chart.js's own type parameter
  interface PluginOptionsByType<TType extends ChartType> {
    setwellErrorBars?: WhiskerOptions;
  }
}

/**
 * Draws each bar's 95 % interval as a whisker; chart.js has no error bars of its own. An end cut at
 * the scale gets an arrowhead instead of a cap, so a cut whisker never reads as the true limit.
 */
const errorBars: Plugin<'bar', WhiskerOptions> = {
  id: 'setwellErrorBars',
  afterDatasetsDraw(chart, _args, options) {
    const intervals = options.intervals;
    if (!intervals) return;
    const { ctx, scales } = chart;
    const meta = chart.getDatasetMeta(0);
    ctx.save();
    ctx.strokeStyle = '#2f1729';
    ctx.lineWidth = 1.5;
    const end = (x: number, y: number, clipped: boolean, pointsUp: boolean) => {
      if (!clipped) {
        ctx.moveTo(x - 6, y);
        ctx.lineTo(x + 6, y);
        return;
      }
      const tip = pointsUp ? -1 : 1;
      ctx.moveTo(x - 5, y - 5 * tip);
      ctx.lineTo(x, y);
      ctx.lineTo(x + 5, y - 5 * tip);
    };
    meta.data.forEach((bar, i) => {
      const ci = intervals[i];
      if (!ci) return;
      const x = bar.x;
      const y1 = scales.y.getPixelForValue(ci.lower);
      const y2 = scales.y.getPixelForValue(ci.upper);
      ctx.beginPath();
      ctx.moveTo(x, y1);
      ctx.lineTo(x, y2);
      end(x, y1, ci.clippedLower, false);
      end(x, y2, ci.clippedUpper, true);
      ctx.stroke();
    });
    ctx.restore();
  },
};

/** Means with 95 % whiskers on the attribute's own scale; whiskers stop at the scale's ends. */
export function MeansChart({ title, labels, means, intervals, min, max, letters }: {
  title: string; labels: string[]; means: Array<number | null>; intervals: Array<[number, number] | null>; min: number; max: number; letters: string[];
}) {
  const clipped = intervals.map((ci) => clipInterval(ci, { min, max }));
  const note = clippingNote(labels, clipped, { min, max });
  return (
    <div>
      <div className="h-64" role="img" aria-label={`${title}: means with 95 % confidence intervals`} data-testid="means-chart">
        <Bar
          data={{ labels: labels.map((l, i) => `${l} (${letters[i] ?? ''})`), datasets: [{ label: title, data: means, backgroundColor: DAMSON, borderRadius: 6 }] }}
          options={{
            maintainAspectRatio: false,
            scales: { y: { min, max, title: { display: true, text: `Mean score (${min}–${max})` } } },
            plugins: { legend: { display: false }, setwellErrorBars: { intervals: clipped } },
          }}
          plugins={[errorBars]}
        />
      </div>
      {note ? <p className="mt-1 text-xs text-rind-500" data-testid="whisker-clip-note">{note}</p> : null}
    </div>
  );
}

/**
 * Just-about-right shares as diverging bars: "just about right" straddles the centre line, "too
 * little" runs left of it and "too much" right, so the side a sample leans to shows at a glance.
 */
export function JarChart({ title, rows }: { title: string; rows: JarShareRow[] }) {
  const d = jarDiverging(rows);
  const percent = (v: number | string) => `${Math.abs(Number(v)).toFixed(0)} %`;
  return (
    <div className="h-56" role="img" aria-label={`${title}: share of tasters too little, just about right, too much`} data-testid="jar-chart">
      <Bar
        data={{
          labels: d.labels,
          datasets: [
            { label: 'Just about right', data: d.justRightLeft, backgroundColor: LEAF, stack: 'jar' },
            { label: 'Too little', data: d.tooLittle, backgroundColor: QUINCE, stack: 'jar' },
            { label: 'Just about right ', data: d.justRightRight, backgroundColor: LEAF, stack: 'jar' },
            { label: 'Too much', data: d.tooMuch, backgroundColor: EMBER, stack: 'jar' },
          ],
        }}
        options={{
          indexAxis: 'y',
          maintainAspectRatio: false,
          scales: {
            x: { stacked: true, min: -100, max: 100, ticks: { callback: percent }, title: { display: true, text: '← too little · % of tasters · too much →' } },
            y: { stacked: true },
          },
          plugins: {
            // The right half of "just about right" is the same series as the left: one legend entry.
            legend: { labels: { filter: (item) => item.text !== 'Just about right ' } },
            tooltip: {
              callbacks: {
                label: (item) => {
                  const row = rows[item.dataIndex];
                  if (item.dataset.label?.startsWith('Just about right')) return `Just about right: ${percent(row.n ? (100 * row.justAboutRight) / row.n : 0)}`;
                  return `${item.dataset.label}: ${percent(item.parsed.x ?? 0)}`;
                },
              },
            },
          },
        }}
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

/**
 * The attributes scored on one scale, one bar group per attribute and one colour per sample. Scales
 * are never mixed on one axis; on the JAR scale the bars start at 3 ("just right").
 */
export function ProfileChart({ attributes, samples, means, scale, base }: {
  attributes: string[]; samples: string[]; means: Record<string, Record<string, number | null>>; scale: { min: number; max: number; name: string }; base?: number;
}) {
  return (
    <div className="h-72" role="img" aria-label={`Profile, ${scale.name}: mean score of each sample on each attribute`} data-testid="profile-chart">
      <Bar
        // Bars from a base: a mean exactly at it ("just right") keeps a stub of 3 px, so it does not read as missing.
        data={{ labels: attributes, datasets: samples.map((s, i) => ({ label: `Sample ${s}`, data: attributes.map((a) => means[a]?.[s] ?? null), backgroundColor: SERIES[i % SERIES.length], ...(base === undefined ? {} : { base, minBarLength: 3 }) })) }}
        options={{ maintainAspectRatio: false, scales: { y: { min: scale.min, max: scale.max, title: { display: true, text: scale.name } } } }}
      />
    </div>
  );
}

/** Weighted penalties of the too-little and too-much groups, per sample; the longer the bar, the more liking that side costs. */
export function PenaltyChart({ title, rows }: { title: string; rows: Array<{ label: string; tooLittle: number | null; tooMuch: number | null }> }) {
  return (
    <div className="h-48" role="img" aria-label={`${title}: weighted penalties per sample`} data-testid="penalty-chart">
      <Bar
        data={{
          labels: rows.map((r) => `Sample ${r.label}`),
          datasets: [
            { label: 'Too little', data: rows.map((r) => r.tooLittle ?? 0), backgroundColor: QUINCE },
            { label: 'Too much', data: rows.map((r) => r.tooMuch ?? 0), backgroundColor: EMBER },
          ],
        }}
        options={{ indexAxis: 'y', maintainAspectRatio: false, scales: { x: { title: { display: true, text: 'Share × mean drop in liking' } } } }}
      />
    </div>
  );
}
