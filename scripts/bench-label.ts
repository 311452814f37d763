/**
 * Label recompute benchmark (part of `npm run bench`, pure: no database, no server). The formula
 * editor recomputes on every keystroke; this times, for a 40-line formula, the chemistry alone
 * (computeFormula: mass balance, end point, aw, compliance, cautions) and the editor's whole
 * recompute, labelForLines: the same chemistry, then buildLabel (finished nutrients, EU
 * declaration, US Nutrition Facts, both ingredient lists, the jam statements, the sugar claims
 * against the typical jam, the additive limits), median and p95 of many runs.
 * Prints one line per figure with its target and writes them to bench-results/label.json.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { TYPICAL_INGREDIENTS } from '../lib/chemistry/typical-ingredients';
import { computeFormula, type ComputableLine } from '../lib/formulas/compute';
import type { FormulaSettingsInput } from '../lib/formulas/schema';
import { labelForLines } from '../lib/label';
import type { IngredientLabelData, NutrientValues } from '../lib/label/types';

const LINES = 40;
const WARM_UP = 50;
const REPEATS = 400;

const settings: FormulaSettingsInput = { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-07-01', targetSolidsPct: 65, jarNetFillG: 340 };

/** Plausible per-100 g figures by kind (invented for timing; the tests check the real ones). */
function nutrientsFor(kind: IngredientLabelData['kind'], i: number): NutrientValues {
  const base: NutrientValues = {
    waterG: 85, energyKcal: 50, energyKj: 210, proteinG: 0.8, fatG: 0.3, saturatesG: 0.02, carbohydrateG: 12,
    sugarsG: 8, sucroseG: 2, glucoseG: 3, fructoseG: 3, fibreG: 2, polyolsG: null, organicAcidsG: null, sodiumMg: 1, cholesterolMg: 0,
  };
  if (kind === 'sweetener') return { ...base, waterG: 0.02, carbohydrateG: 99.98, sugarsG: 99.8, fibreG: 0, proteinG: 0, fatG: 0, sodiumMg: 1 };
  if (kind === 'pectin') return { ...base, waterG: 8.7, carbohydrateG: 90.4, sugarsG: null, fibreG: 8.6, sodiumMg: 200 };
  if (kind === 'acid') return { ...base, waterG: 0, carbohydrateG: 0, sugarsG: 0, fibreG: 0, proteinG: 0, fatG: 0, organicAcidsG: 100, sodiumMg: 0 };
  if (kind === 'water') return { ...base, waterG: 100, carbohydrateG: 0, sugarsG: 0, fibreG: 0, proteinG: 0, fatG: 0, sodiumMg: 0 };
  // Every fifth fruit lacks a fibre figure, so the incomplete paths are timed too.
  return i % 5 === 0 ? { ...base, fibreG: null } : base;
}

function fortyLines(): { lines: ComputableLine[]; labelData: IngredientLabelData[] } {
  const fruits = TYPICAL_INGREDIENTS.filter((t) => t.kind === 'fruit');
  const others = TYPICAL_INGREDIENTS.filter((t) => t.kind !== 'fruit');
  const lines: ComputableLine[] = [];
  const labelData: IngredientLabelData[] = [];
  for (let i = 0; i < LINES; i++) {
    const ingredient = i < 28 ? fruits[i % fruits.length] : others[i % others.length];
    const grams = ingredient.kind === 'fruit' ? 40 + i : ingredient.kind === 'sweetener' ? 120 : 4;
    lines.push({ ingredient, quantity: grams, unit: 'g' });
    labelData.push({
      labelName: `${ingredient.name.toLowerCase()} ${i + 1}`, kind: ingredient.kind, nutrients: nutrientsFor(ingredient.kind, i),
      euAllergens: [], usAllergens: [], sulphiteMgPerKg: null, additive: null, source: null,
    });
  }
  return { lines, labelData };
}

function quantile(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))];
}

/**
 * Wall time per run, and the process's CPU time per run beside it: on a loaded machine a run the
 * scheduler preempts shows a long wall time with a short CPU time, so the two p95s tell the code's
 * cost from the machine's load.
 */
function time(run: () => void): { medianMs: number; p95Ms: number; cpuP95Ms: number } {
  for (let i = 0; i < WARM_UP; i++) run();
  const ms: number[] = [];
  const cpuMs: number[] = [];
  for (let i = 0; i < REPEATS; i++) {
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    run();
    ms.push(performance.now() - t0);
    const cpu = process.cpuUsage(cpu0);
    cpuMs.push((cpu.user + cpu.system) / 1000);
  }
  return { medianMs: quantile(ms, 0.5), p95Ms: quantile(ms, 0.95), cpuP95Ms: quantile(cpuMs, 0.95) };
}

const { lines, labelData } = fortyLines();

function chemistryOnly() {
  const outcome = computeFormula(settings, lines);
  if (!outcome.ok) throw new Error(`the bench formula does not compute: ${outcome.message}`);
  return outcome.computation;
}

function chemistryAndLabel() {
  const outcome = labelForLines(settings, lines, labelData);
  if (!outcome.ok) throw new Error(`the bench formula has no label: ${outcome.message}`);
  return outcome.label;
}

const covers = 'labelForLines: chemistry (computeFormula) + buildLabel (finished nutrients, EU declaration, US Nutrition Facts, EU and US ingredient lists, jam statements, sugar claims, additive limits)';
const chemistry = time(chemistryOnly);
const label = time(chemistryAndLabel);
const figures = [
  { name: 'label.chemistry_only_median_ms_40_lines', measured: chemistry.medianMs, target: '(reference)' },
  { name: 'label.chemistry_only_p95_ms_40_lines', measured: chemistry.p95Ms, target: '(reference)' },
  { name: 'label.recompute_median_ms_40_lines', measured: label.medianMs, target: '<= 16 ms' },
  { name: 'label.recompute_p95_ms_40_lines', measured: label.p95Ms, target: '<= 16 ms' },
  { name: 'label.recompute_cpu_p95_ms_40_lines', measured: label.cpuP95Ms, target: '(CPU time of the same runs)' },
];
// Other processes on a busy machine show in the p95 (a preempted run), so the load is printed too.
console.log(`label recompute covers: ${covers}; ${REPEATS} runs after ${WARM_UP} warm-up; load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')} on ${os.cpus().length} cores`);
for (const f of figures) console.log(`${f.name.padEnd(42)} ${f.measured.toFixed(3).padStart(9)}   target ${f.target}`);
fs.mkdirSync('bench-results', { recursive: true });
fs.writeFileSync(path.join('bench-results', 'label.json'), JSON.stringify({ measuredAt: new Date().toISOString(), covers, lines: LINES, repeats: REPEATS, figures }, null, 2));
