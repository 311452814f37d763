/**
 * Response-surface benchmark (part of `npm run bench`; pure, no server or database):
 * - fitting a full quadratic in 4 features to 200 variants (target ≤ 50 ms);
 * - one prediction with its 95 % intervals and the region check, the work the formula editor adds
 *   per keystroke (target ≤ 2 ms), printed beside the editor's chemistry-only recompute
 *   (computeFormula on a demo-sized apricot formula);
 * - an optimisation over three responses with constraints (target ≤ 1 s).
 * Invented data (a made-up quadratic plus deterministic noise), our own scenario. Prints median
 * and p95 of each and writes bench-results/models.json.
 * Alone: `node --require ./scripts/outside-next.cjs --import tsx scripts/bench-models.ts`.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { findTypicalIngredient } from '../lib/chemistry';
import { computeFormula, type ComputableLine } from '../lib/formulas/compute';
import { fitResponseSurface, optimise, predictResponse, windowConstraint, type SurfaceRun } from '../lib/models';

const FACTORS = [
  { name: 'targetSolids', low: 55, high: 68 },
  { name: 'pectinPercent', low: 0.3, high: 1.0 },
  { name: 'acidPercent', low: 0.1, high: 0.6 },
  { name: 'sugarRatio', low: 0.5, high: 1.2 },
];

/** Deterministic pseudo-random numbers (Park–Miller), so every run measures the same data. */
function random(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 48271) % 2147483647;
    return state / 2147483647;
  };
}

function variants(count: number, response: (x: number[]) => number, seed: number): SurfaceRun[] {
  const next = random(seed);
  return Array.from({ length: count }, () => {
    const coded = FACTORS.map(() => 2 * next() - 1);
    const point = Object.fromEntries(FACTORS.map((f, i) => [f.name, (f.low + f.high) / 2 + (coded[i] * (f.high - f.low)) / 2]));
    return { point, response: response(coded) + (next() - 0.5) * 0.6 };
  });
}

const firmnessRuns = variants(200, ([s, p, a, r]) => 5 + 0.8 * s + 1.2 * p + 0.3 * a - 0.2 * r - 0.4 * p * p + 0.15 * s * p - 0.2 * s * s, 11);
const tartnessRuns = variants(200, ([s, , a, r]) => 4 + 1.5 * a - 0.5 * r - 0.3 * s + 0.1 * a * a, 23);
const likingRuns = variants(200, ([s, p, a, r]) => 6.5 + 0.3 * s - 0.2 * p - 0.6 * a * a + 0.4 * r - 0.5 * r * r - 0.3 * s * s + 0.2 * a * r, 37);

function stats(samples: number[]): { median: number; p95: number } {
  const sorted = [...samples].sort((a, b) => a - b);
  return { median: sorted[Math.floor(sorted.length / 2)], p95: sorted[Math.min(sorted.length - 1, Math.ceil(sorted.length * 0.95) - 1)] };
}

function time(repeats: number, work: () => unknown): { median: number; p95: number } {
  for (let i = 0; i < Math.min(20, repeats); i++) work();
  const samples: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    work();
    samples.push(performance.now() - t0);
  }
  return stats(samples);
}

const fit = time(100, () => fitResponseSurface({ factors: FACTORS.map((f) => f.name), kind: 'full_quadratic', runs: firmnessRuns }));
const surfaces = [firmnessRuns, tartnessRuns, likingRuns].map((runs) => fitResponseSurface({ factors: FACTORS.map((f) => f.name), kind: 'full_quadratic', runs }));

const ingredient = (key: string) => {
  const found = findTypicalIngredient(key);
  if (!found) throw new Error(`no typical ingredient ${key}`);
  return found;
};
const apricotLines: ComputableLine[] = [
  { ingredient: ingredient('apricot'), quantity: 1000, unit: 'g' },
  { ingredient: ingredient('sucrose'), quantity: 750, unit: 'g' },
  { ingredient: ingredient('pectin_hm_rapid_150'), quantity: 9, unit: 'g' },
  { ingredient: ingredient('citric_acid_anhydrous'), quantity: 5, unit: 'g' },
  { ingredient: ingredient('lemon_juice'), quantity: 30, unit: 'g' },
];
const apricotSettings = { productClass: 'jam' as const, ruleSet: 'eu' as const, ruleDate: '2026-11-20', targetSolidsPct: 62, jarNetFillG: 340, altitudeM: null, measuredWaterBoilingC: null, plannedPh: 3.3, preservation: null };
const chemistryOutcome = computeFormula(apricotSettings, apricotLines);
if (!chemistryOutcome.ok) throw new Error(`the demo formula does not compute: ${chemistryOutcome.message}`);
const chemistry = time(2000, () => computeFormula(apricotSettings, apricotLines));
const at = { targetSolids: 62, pectinPercent: 0.6, acidPercent: 0.3, sugarRatio: 0.8 };
if (!predictResponse(surfaces[0], at).inRegion) throw new Error('the bench point left the data region');
const prediction = time(2000, () => surfaces.map((s) => predictResponse(s, at)));

const optimisation = time(10, () =>
  optimise({
    factors: FACTORS,
    goals: [
      { name: 'set firmness', surface: surfaces[0], goal: { kind: 'band', low: 4, bandLow: 5, bandHigh: 6, high: 7 } },
      { name: 'tartness', surface: surfaces[1], goal: { kind: 'target', low: 3, target: 4, high: 5 } },
      { name: 'overall liking', surface: surfaces[2], goal: { kind: 'maximise', low: 5, high: 7 }, importance: 2 },
    ],
    constraints: [windowConstraint('reduced sugar', (p) => p.targetSolids, { high: 60 })],
  }),
);

const figures = [
  { name: 'models.fit_quadratic_4x200_ms', measured: fit.median, p95: fit.p95, target: '<= 50 ms' },
  { name: 'models.predict_3_responses_ms', measured: prediction.median, p95: prediction.p95, target: '<= 2 ms' },
  { name: 'models.chemistry_recompute_ms', measured: chemistry.median, p95: chemistry.p95, target: '(reference: the keystroke without models)' },
  { name: 'models.optimise_3_responses_ms', measured: optimisation.median, p95: optimisation.p95, target: '<= 1000 ms' },
];
console.log(`models: full quadratic, 4 features × 200 variants; three responses predicted per keystroke; optimisation (load average ${os.loadavg()[0].toFixed(1)} on ${os.cpus().length} cores)`);
for (const f of figures) console.log(`${f.name.padEnd(34)} ${f.measured.toFixed(3).padStart(9)}  p95 ${f.p95.toFixed(3).padStart(9)}   target ${f.target}`);
fs.mkdirSync('bench-results', { recursive: true });
fs.writeFileSync(path.join('bench-results', 'models.json'), JSON.stringify({ measuredAt: new Date().toISOString(), loadAverage: os.loadavg()[0], figures }, null, 2));
