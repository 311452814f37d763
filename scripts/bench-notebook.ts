/**
 * Notebook render benchmark (part of `npm run bench`): the largest document the save check
 * accepts (lib/notebook/largest-doc.ts) rendered read-only on the server with the real renderer,
 * as the print page, the head of product's view and the conflict view do. Production React.
 * Prints one line per figure with its target and writes them to bench-results/notebook.json.
 */
import fs from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { NotebookView } from '../components/notebook/NotebookView';
import { docFigures, largestNotebookDoc } from '../lib/notebook/largest-doc';
import { findDocProblems } from '../lib/notebook/document';

const REPEATS = 7;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

const doc = largestNotebookDoc();
if (findDocProblems(doc).length) throw new Error('the largest document no longer passes the save check');
const checkMs: number[] = [];
const renderMs: number[] = [];
for (let r = 0; r < REPEATS; r++) {
  const t0 = performance.now();
  findDocProblems(doc);
  const t1 = performance.now();
  renderToStaticMarkup(createElement(NotebookView, { doc }));
  const t2 = performance.now();
  checkMs.push(t1 - t0);
  renderMs.push(t2 - t1);
}
const { nodes, bytes } = docFigures(doc);
const figures = [
  { name: 'notebook.largest_render_ms', measured: median(renderMs), target: '< 1000 ms' },
  { name: 'notebook.largest_first_render_ms', measured: renderMs[0], target: '(reference: cold)' },
  { name: 'notebook.largest_check_ms', measured: median(checkMs), target: '< 200 ms' },
];
console.log(`notebook: largest accepted entry, ${nodes} nodes, ${bytes} bytes (median of ${REPEATS})`);
for (const f of figures) console.log(`${f.name.padEnd(34)} ${f.measured.toFixed(1).padStart(9)}   target ${f.target}`);
fs.mkdirSync('bench-results', { recursive: true });
fs.writeFileSync(path.join('bench-results', 'notebook.json'), JSON.stringify({ measuredAt: new Date().toISOString(), nodes, bytes, figures }, null, 2));
