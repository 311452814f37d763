/**
 * A family model over invented runs around one base formula (a reduced-sugar apricot spread) and
 * invented prices for it, shared by the proposal tests and the Propose form's component test.
 */
import { findTypicalIngredient, type IngredientComposition } from '@/lib/chemistry';
import { fitResponseSurface } from '@/lib/models';
import { formulaFeatures } from '@/lib/modelling/features';
import type { ProposalBase } from '@/lib/modelling/proposals';
import { DEFAULT_MODEL_FACTORS, type FamilyModel, type ModelFactor } from '@/lib/modelling/schema';
import type { RevisionLine } from '@/lib/formulas/schema';
import type { EditorCostBasis } from '@/lib/costs/schema';

function composition(key: string): IngredientComposition {
  const { key: _key, source: _source, ...rest } = findTypicalIngredient(key)!;
  void _key; void _source;
  return rest;
}
const line = (key: string, grams: number, n: number): RevisionLine => ({ ingredientId: `00000000-0000-4000-8000-00000000000${n}`, ingredient: composition(key), quantity: grams, unit: 'g' });

export const base: ProposalBase = {
  settings: { productClass: 'reduced_sugar_spread', ruleSet: 'eu', ruleDate: '2026-11-20', targetSolidsPct: 46, jarNetFillG: 250, altitudeM: null, measuredWaterBoilingC: null, plannedPh: null, preservation: null },
  lines: [line('apricot', 1000, 1), line('sucrose', 400, 2), line('pectin_lm_amidated', 10, 3), line('calcium_citrate', 1, 4), line('lemon_juice', 40, 5)],
};
const features = formulaFeatures(base.settings, base.lines);
if (!features.ok || !features.features.family) throw new Error('base has no family');
export const centre = features.features.factors;

// Invented runs: a 2⁴ factorial at ±15 % around the base plus three centre runs, with fixed scatter.
const points: Array<Record<ModelFactor, number>> = [];
for (let r = 0; r < 16; r++) points.push(Object.fromEntries(DEFAULT_MODEL_FACTORS.map((f, j) => [f, centre[f] * ((r >> j) & 1 ? 1.15 : 0.85)])) as Record<ModelFactor, number>);
for (let c = 0; c < 3; c++) points.push({ ...centre });
const scatter = (i: number) => 0.04 * Math.sin(3 * i + 1);
const coded = (p: Record<ModelFactor, number>, f: ModelFactor) => (p[f] / centre[f] - 1) / 0.15;
const fit = (truth: (p: Record<ModelFactor, number>) => number) =>
  fitResponseSurface({ factors: [...DEFAULT_MODEL_FACTORS], kind: 'two_factor_interactions', runs: points.map((point, i) => ({ point, response: truth(point) + scatter(i) })) });

export const liking = fit((p) => 6 + 0.6 * coded(p, 'sugarRatio') + 0.3 * coded(p, 'pectinPct') - 0.2 * coded(p, 'acidPct'));
const firmness = fit((p) => 5 + 1.5 * coded(p, 'pectinPct') + 0.6 * coded(p, 'targetSolidsPct'));
const ph = fit((p) => 3.55 - 0.15 * coded(p, 'acidPct') - 0.02 * coded(p, 'sugarRatio'));

const response = (key: string, name: string, surface: typeof liking, libraryKey: string | null, scale: { min: number; max: number } | null) => ({
  key: key as `lab:measuredPh`, name, unit: 'u', kind: scale ? ('sensory' as const) : ('lab' as const), decimals: 2, libraryKey, scale, surface, weighting: '', newRunWeight: null,
});
export const MODEL: FamilyModel = {
  family: features.features.family,
  factors: [...DEFAULT_MODEL_FACTORS],
  runs: points.length,
  responses: [
    response('attribute:00000000-0000-4000-8000-0000000000a1', 'Overall liking', liking, 'overall-liking', { min: 1, max: 9 }),
    response('attribute:00000000-0000-4000-8000-0000000000a2', 'Set firmness', firmness, 'set-firmness', { min: 0, max: 10 }),
    response('lab:measuredPh', 'Measured pH', ph, null, null),
  ],
  unfitted: [],
  fruitContent: null,
  fittedAt: '2026-12-03T12:00:00.000Z',
};
export const LIKING = MODEL.responses[0].key;
export const ranges = DEFAULT_MODEL_FACTORS.map((name) => ({ name, low: centre[name] * 0.85, high: centre[name] * 1.15 }));

export const id = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;
// Invented prices (minor units): apricot 300 per 1000 g, sucrose 100 per 1000 g, pectin 2000 per 100 g,
// calcium citrate 500 per 100 g, lemon juice 200 per 1000 g; a jar 30 and a lid 8; no overfill, no refuse.
const price = (n: number, packPriceMinor: number, packSizeG: number) => ({ ingredientId: id(n), validFrom: '2026-01-01', packPriceMinor, packSizeG, supplier: null });
export const basis: EditorCostBasis = {
  currency: 'EUR',
  asOf: '2026-12-03',
  overfillPct: 0,
  ingredientPrices: [price(1, 300, 1000), price(2, 100, 1000), price(3, 2000, 100), price(4, 500, 100), price(5, 200, 1000)],
  packagingPrices: [
    { packagingItemId: 'jar', validFrom: '2026-01-01', unitPriceMinor: 30, supplier: null },
    { packagingItemId: 'lid', validFrom: '2026-01-01', unitPriceMinor: 8, supplier: null },
  ],
  refuse: [],
  packFormats: [{ id: 'pf', name: '250 g jar', netFillG: 250, items: [{ packagingItemId: 'jar', name: 'Jar', perJar: 1 }, { packagingItemId: 'lid', name: 'Lid', perJar: 1 }] }],
};
