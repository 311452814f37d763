'use client';

import { useEffect, useRef } from 'react';
import { checkRegion, type ResponseSurface } from '@/lib/models';
import { FACTOR_INFO, type ModelFactor } from '@/lib/modelling/schema';

const WIDTH = 640;
const HEIGHT = 440;
const MARGIN = { left: 64, right: 16, top: 16, bottom: 52 };
const CELLS = 56;
/** Light to dark damson: low to high predicted values. */
const BANDS = ['#f6eef3', '#ead7e3', '#dbbdd0', '#c99fba', '#b681a3', '#9f648a', '#83466e', '#642f53'];
const NO_DATA = '#e6e1d8';

export interface ContourProps {
  surface: ResponseSurface;
  x: ModelFactor;
  y: ModelFactor;
  fixed: Partial<Record<ModelFactor, number>>;
  responseName: string;
  decimals: number;
}

function bandOf(value: number, low: number, high: number): number {
  if (!(high > low)) return 0;
  return Math.min(BANDS.length - 1, Math.max(0, Math.floor(((value - low) / (high - low)) * BANDS.length)));
}

/**
 * The fitted response over two factors with the others held fixed, drawn cell by cell on a canvas
 * (no inline styles: CSP). Cells outside the data's region (surface.ts: box and leverage rule) are
 * grey and marked "no data"; the runs are dots. The legend lists the bands in text below.
 */
export function ContourPlot({ surface, x, y, fixed, responseName, decimals }: ContourProps) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const legend = useRef<HTMLOListElement>(null);
  useEffect(() => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx) return;
    const rx = surface.dataBox.find((r) => r.name === x)!;
    const ry = surface.dataBox.find((r) => r.name === y)!;
    const plotW = WIDTH - MARGIN.left - MARGIN.right;
    const plotH = HEIGHT - MARGIN.top - MARGIN.bottom;
    const values: Array<number | null> = [];
    for (let j = 0; j < CELLS; j++) {
      for (let i = 0; i < CELLS; i++) {
        const point = { ...fixed, [x]: rx.low + ((i + 0.5) / CELLS) * (rx.high - rx.low), [y]: ry.low + ((j + 0.5) / CELLS) * (ry.high - ry.low) } as Record<string, number>;
        const check = checkRegion(surface, point);
        values.push(check.inRegion ? check.estimate : null);
      }
    }
    const inside = values.filter((v): v is number => v !== null);
    const low = inside.length ? Math.min(...inside) : 0;
    const high = inside.length ? Math.max(...inside) : 1;
    ctx.clearRect(0, 0, WIDTH, HEIGHT);
    ctx.fillStyle = '#ffffff';
    ctx.fillRect(0, 0, WIDTH, HEIGHT);
    const cw = plotW / CELLS;
    const ch = plotH / CELLS;
    values.forEach((v, index) => {
      const i = index % CELLS;
      const j = Math.floor(index / CELLS);
      ctx.fillStyle = v === null ? NO_DATA : BANDS[bandOf(v, low, high)];
      ctx.fillRect(MARGIN.left + i * cw, MARGIN.top + plotH - (j + 1) * ch, Math.ceil(cw), Math.ceil(ch));
    });
    // The runs, projected onto the two factors.
    const ix = surface.factors.indexOf(x);
    const iy = surface.factors.indexOf(y);
    ctx.fillStyle = '#2f1729';
    for (const coded of surface.codedRuns) {
      const cx = surface.coding[ix];
      const cy = surface.coding[iy];
      const nx = (cx.low + cx.high) / 2 + (coded[ix] * (cx.high - cx.low)) / 2;
      const ny = (cy.low + cy.high) / 2 + (coded[iy] * (cy.high - cy.low)) / 2;
      ctx.beginPath();
      ctx.arc(MARGIN.left + ((nx - rx.low) / (rx.high - rx.low)) * plotW, MARGIN.top + plotH - ((ny - ry.low) / (ry.high - ry.low)) * plotH, 3, 0, 2 * Math.PI);
      ctx.fill();
    }
    // Axes and ticks.
    ctx.strokeStyle = '#2f1729';
    ctx.strokeRect(MARGIN.left, MARGIN.top, plotW, plotH);
    ctx.fillStyle = '#2f1729';
    ctx.font = '12px sans-serif';
    ctx.textAlign = 'center';
    for (let t = 0; t <= 4; t++) {
      const vx = rx.low + (t / 4) * (rx.high - rx.low);
      ctx.fillText(vx.toFixed(FACTOR_INFO[x].decimals), MARGIN.left + (t / 4) * plotW, MARGIN.top + plotH + 16);
    }
    ctx.fillText(`${FACTOR_INFO[x].name} (${FACTOR_INFO[x].unit})`, MARGIN.left + plotW / 2, HEIGHT - 10);
    ctx.textAlign = 'right';
    for (let t = 0; t <= 4; t++) {
      const vy = ry.low + (t / 4) * (ry.high - ry.low);
      ctx.fillText(vy.toFixed(FACTOR_INFO[y].decimals), MARGIN.left - 6, MARGIN.top + plotH - (t / 4) * plotH + 4);
    }
    ctx.save();
    ctx.translate(14, MARGIN.top + plotH / 2);
    ctx.rotate(-Math.PI / 2);
    ctx.textAlign = 'center';
    ctx.fillText(FACTOR_INFO[y].name, 0, 0);
    ctx.restore();
    // The legend as text with a drawn swatch each (no inline colours in the markup).
    const list = legend.current;
    if (list) {
      list.replaceChildren(
        ...BANDS.map((colour, b) => {
          const item = document.createElement('li');
          item.className = 'flex items-center gap-2';
          const swatch = document.createElement('canvas');
          swatch.width = 14;
          swatch.height = 14;
          swatch.setAttribute('aria-hidden', 'true');
          const sctx = swatch.getContext('2d');
          if (sctx) {
            sctx.fillStyle = colour;
            sctx.fillRect(0, 0, 14, 14);
          }
          const from = low + (b / BANDS.length) * (high - low);
          const to = low + ((b + 1) / BANDS.length) * (high - low);
          item.append(swatch, document.createTextNode(`${from.toFixed(decimals)} to ${to.toFixed(decimals)}`));
          return item;
        }),
      );
    }
  }, [surface, x, y, fixed, decimals]);

  const fixedText = Object.entries(fixed).map(([f, v]) => `${FACTOR_INFO[f as ModelFactor].name} ${v!.toFixed(FACTOR_INFO[f as ModelFactor].decimals)}`).join(', ');
  return (
    <figure className="min-w-0" data-testid="contour-plot">
      <canvas
        ref={canvas}
        width={WIDTH}
        height={HEIGHT}
        className="h-auto w-full max-w-2xl rounded-card ring-1 ring-pith-300"
        role="img"
        aria-label={`Predicted ${responseName} over ${FACTOR_INFO[x].name.toLowerCase()} and ${FACTOR_INFO[y].name.toLowerCase()}; grey where there is no data`}
      />
      <figcaption className="mt-2 text-sm text-rind-600">
        Predicted {responseName.toLowerCase()}, darker is higher; dots are the variants. {fixedText ? `Held at the middle of the data: ${fixedText}. ` : ''}
        Grey: no data — outside the runs’ range or far from them (leverage above the largest of the runs), so no prediction is drawn.
      </figcaption>
      <ol ref={legend} className="mt-2 grid grid-cols-2 gap-1 text-xs text-rind-700 sm:grid-cols-4" aria-label="Colour bands" />
    </figure>
  );
}
