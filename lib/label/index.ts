/**
 * The label from a formula: one serialisable `Label` built from the nutrition, ingredient-list,
 * statement, claim and additive modules beside this file. Pure, so the formula editor runs it on
 * every keystroke and the server runs the same code for pages, the API and the frozen label of a
 * production version.
 */
import { ChemistryInputError } from '@/lib/chemistry';
import type { MassBalance } from '@/lib/chemistry/mass-balance';
import { computeFormula, toChemistrySettings, type ComputableLine } from '@/lib/formulas/compute';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import { NUTRIENT_KEYS, type IngredientLabelData, type LabelInput, type NutrientValues } from './types';
import { finishedNutrients } from './nutrition';
import { euDeclaration, type EuDeclaration } from './eu-declaration';
import { usNutritionFacts, type UsNutritionFacts } from './us-facts';
import { ingredientList, type IngredientList } from './ingredient-list';
import { compareStatedSugar, jamStatements, statedTotalSugar, type JamStatement, type StatedSugarComparison } from './statements';
import { referenceFromNutrients, sugarClaimChecks, TYPICAL_JAM_REFERENCE, type ClaimCheck, type ClaimReference } from './claims';
import { additiveLimitChecks, type AdditiveCheck } from './additives';
import { LABEL_FORMAT, type Label, type LabelAdditiveCheck, type LabelClaim, type LabelFactsRow, type LabelIncomplete, type LabelIngredientList, type LabelNutrientRow, type LabelStatement } from './label';

export * from './label';

export interface LabelOptions {
  /** The product a "reduced sugars" claim is measured against; a typical jam when not given. */
  claimReference?: ClaimReference | null;
}

const NO_NUTRIENTS = (): NutrientValues => Object.fromEntries(NUTRIENT_KEYS.map((k) => [k, null])) as NutrientValues;

/**
 * The label input from a computed mass balance: each line at its weight at the time of use, with
 * its label data. A line whose ingredient has no label data counts with every value unknown, so
 * the label says what it lacks instead of treating it as zero.
 */
export function labelInputFor(settings: FormulaSettingsInput, massBalance: MassBalance, labelData: ReadonlyArray<IngredientLabelData | null | undefined>): LabelInput {
  return {
    settings: toChemistrySettings(settings),
    massBalance: {
      finishedMassG: massBalance.finishedMassG,
      waterToEvaporateG: massBalance.waterToEvaporateG,
      totalChargeG: massBalance.totalChargeG,
      fruitMassG: massBalance.fruitMassG,
      targetSolidsPct: massBalance.targetSolidsPct,
    },
    lines: massBalance.lines.map((line, i) => {
      const data = labelData[i] ?? {
        labelName: line.ingredient.name, kind: line.ingredient.kind, nutrients: NO_NUTRIENTS(), euAllergens: [], usAllergens: [],
        sulphiteMgPerKg: null, additive: null, source: null,
      };
      return { grams: line.massG, ingredient: data, ...(line.ingredient.kind === 'fruit' ? { fruitName: data.labelName } : {}) };
    }),
  };
}

function listView(list: IngredientList): LabelIngredientList {
  const notes = [...list.notes];
  if (list.market === 'eu' && list.fruitIndication.text) notes.push(`Fruit named with the product name: ${list.fruitIndication.text}.`);
  return { runs: list.segments.map((s) => ({ text: s.text, emphasis: s.emphasis })), contains: list.containsStatement, notes };
}

function statementView(kind: LabelStatement['kind'], s: JamStatement | null, notes: string[]): LabelStatement {
  if (!s) return { kind, text: null, gramsPer100g: null, notes };
  return { kind, text: s.text, gramsPer100g: s.exactValue, notes: [s.required ? s.reason : `Optional: ${s.reason}`, ...notes] };
}

function euRows(eu: EuDeclaration): LabelNutrientRow[] {
  const rows: LabelNutrientRow[] = [];
  for (const r of eu.rows) {
    const depth = r.subRow ? 1 : 0;
    if (r.nutrient === 'energy') {
      for (const unit of ['kJ', 'kcal'] as const) {
        const amount = r.amounts?.find((a) => a.unit === unit) ?? null;
        rows.push({ key: `energy_${unit}`, name: 'Energy', unit, depth, unrounded: amount?.value ?? null, label: amount?.label ?? null, incomplete: r.incomplete });
      }
      continue;
    }
    const amount = r.amounts?.[0] ?? null;
    rows.push({ key: r.nutrient, name: r.name, unit: 'g', depth, unrounded: amount?.value ?? null, label: amount?.label ?? null, incomplete: r.incomplete });
  }
  return rows;
}

function usRows(us: UsNutritionFacts): LabelFactsRow[] {
  const calories: LabelFactsRow = {
    key: 'calories', name: 'Calories', unit: 'kcal', depth: 0, unrounded: us.calories.value,
    label: us.calories.labelValue === null ? null : us.calories.label, incomplete: us.calories.incomplete, dailyValue: null,
  };
  return [calories, ...us.rows.map((r) => ({
    key: r.nutrient, name: r.name, unit: r.unit, depth: r.indent, unrounded: r.amount?.value ?? null,
    label: r.amount ? r.label : null, incomplete: r.incomplete, dailyValue: r.dailyValuePct === null ? null : `${r.dailyValuePct}%`,
  }))];
}

const claimFigure = (value: number | null, unit: string) => (value === null ? 'unknown' : `${Number(value.toFixed(1))} ${unit}`);

function claimView(c: ClaimCheck): LabelClaim {
  const figures = c.figures.map((f) => `${f.label} ${claimFigure(f.value, f.unit)}`).join('; ');
  return {
    claim: c.title,
    holds: c.status === 'met' ? true : c.status === 'not_met' ? false : null,
    figures: [`${figures}.`, `${c.requirement}.`, c.note ?? '', c.status === 'met' && c.accompanyingStatement ? `With it: ${c.accompanyingStatement}` : ''].filter(Boolean).join(' '),
    rule: c.source,
  };
}

const ADDITIVE_STATUS = { pass: 'within', fail: 'over', not_evaluable: 'unknown', not_applicable: 'not_applicable' } as const;

function additiveView(a: AdditiveCheck): LabelAdditiveCheck {
  return { name: a.title, status: ADDITIVE_STATUS[a.status], amount: a.actual, limit: a.requirement, rule: a.source, note: a.note ?? null };
}

function incompleteParts(eu: EuDeclaration, us: UsNutritionFacts, claims: LabelClaim[], additives: LabelAdditiveCheck[]): LabelIncomplete[] {
  const out: LabelIncomplete[] = [];
  for (const r of eu.rows) if (r.incomplete && r.note) out.push({ part: `EU declaration: ${r.name}`, reason: r.note });
  if (us.calories.incomplete && us.calories.note) out.push({ part: 'US facts: Calories', reason: us.calories.note });
  for (const r of us.rows) if (r.incomplete && r.note) out.push({ part: `US facts: ${r.name}`, reason: r.note });
  for (const c of claims) if (c.holds === null) out.push({ part: `Claim: ${c.claim}`, reason: 'A figure the claim needs is not known.' });
  for (const a of additives) if (a.status === 'unknown') out.push({ part: `Additive: ${a.name}`, reason: a.note ?? 'Its limit cannot be checked with what is known.' });
  return out;
}

/** The whole label of one formula. Throws ChemistryInputError on input the modules refuse. */
export function buildLabel(input: LabelInput, options: LabelOptions = {}): Label {
  const nutrients = finishedNutrients(input);
  const eu = euDeclaration(nutrients);
  const us = usNutritionFacts(nutrients, input);
  const statements = jamStatements(input);
  const reference = options.claimReference === undefined ? TYPICAL_JAM_REFERENCE : options.claimReference;
  const energyRow = eu.rows.find((r) => r.nutrient === 'energy');
  const claims = sugarClaimChecks(input, { nutrients, energyKj: eu.energyKj, energyIncomplete: energyRow?.incomplete ?? false }, reference).map(claimView);
  const additives = additiveLimitChecks(input).map(additiveView);
  const usNotes = [
    ...us.notSignificantStatements,
    ...us.rows.filter((r) => r.amount === null && !r.incomplete && r.note).map((r) => r.note as string),
  ];
  return {
    format: LABEL_FORMAT,
    productClass: input.settings.productClass,
    ruleSet: input.settings.ruleSet,
    ingredients: { eu: listView(ingredientList(input, 'eu')), us: listView(ingredientList(input, 'us')) },
    statements: [statementView('fruit', statements.fruit, []), statementView('total_sugar', statements.totalSugar, statements.notes)],
    eu: {
      per: '100 g',
      energyBasis: 'Energy by the Annex XIV factors of Regulation (EU) No 1169/2011; the carbohydrate declared and counted is carbohydrate by difference less fibre.',
      rows: euRows(eu),
    },
    us: { serving: us.servingSizeLabel, servingG: us.servingSizeG, servingsPerJar: us.servingsPerContainerLabel, energyBasis: us.caloriesMethod, rows: usRows(us), notes: usNotes },
    claims: { reference: reference?.name ?? null, items: claims },
    additives,
    incomplete: incompleteParts(eu, us, claims, additives),
  };
}

export type LabelOutcome = { ok: true; label: Label } | { ok: false; message: string };

/** Stored or edited lines → chemistry → label; a formula the chemistry or the label refuses gives its message. */
export function labelForLines(settings: FormulaSettingsInput, lines: ComputableLine[], labelData: ReadonlyArray<IngredientLabelData | null | undefined>, options: LabelOptions = {}): LabelOutcome {
  const outcome = computeFormula(settings, lines);
  if (!outcome.ok) return { ok: false, message: outcome.message };
  try {
    return { ok: true, label: buildLabel(labelInputFor(settings, outcome.computation.massBalance, labelData), options) };
  } catch (err) {
    if (err instanceof ChemistryInputError) return { ok: false, message: err.message };
    throw err;
  }
}

/** Another formula as the reference of a "reduced sugars" claim; null when it cannot be computed. */
export function claimReferenceFrom(name: string, settings: FormulaSettingsInput, lines: ComputableLine[], labelData: ReadonlyArray<IngredientLabelData | null | undefined>, source: string): ClaimReference | null {
  const outcome = computeFormula(settings, lines);
  if (!outcome.ok) return null;
  try {
    const nutrients = finishedNutrients(labelInputFor(settings, outcome.computation.massBalance, labelData));
    return referenceFromNutrients(name, nutrients, euDeclaration(nutrients).energyKj, source);
  } catch (err) {
    if (err instanceof ChemistryInputError) return null;
    throw err;
  }
}

/**
 * A measured Brix (corrected to 20 °C) against the total sugar a label states; null when the label
 * states none or nothing was measured. Directive 2001/113/EC: the refractometer value, ± 3 degrees.
 */
export function statedSugarAgainst(label: Label | null, measuredBrix: number | null): StatedSugarComparison | null {
  const stated = label?.statements.find((s) => s.kind === 'total_sugar')?.gramsPer100g;
  if (stated == null || measuredBrix == null || !(stated > 0 && stated < 100) || !(measuredBrix >= 0 && measuredBrix <= 100)) return null;
  return compareStatedSugar(statedTotalSugar(stated), Math.round(measuredBrix * 10) / 10);
}
