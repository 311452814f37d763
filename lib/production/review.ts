/**
 * What the promotion form and the review page put side by side: the variant's product class and
 * fruit beside those of the version now in production, and the formula lines in grams and % of the
 * batch. Pure.
 */
import { ChemistryInputError, computeMassBalance, type IngredientKind } from '@/lib/chemistry';
import { toChemistrySettings } from '@/lib/formulas/compute';
import { PRODUCT_CLASS_LABELS, type FormulaSettingsInput, type RevisionLine } from '@/lib/formulas/schema';

export interface RecipeIdentity {
  productClass: string;
  /** Names of the fruit lines, in formula order, without repeats. */
  fruits: string[];
}

/** The fruit lines of a formula: what a practitioner means by "a strawberry jam". */
export function fruitsOf(lines: readonly Pick<RevisionLine, 'ingredient'>[]): string[] {
  return [...new Set(lines.filter((l) => l.ingredient.kind === 'fruit').map((l) => l.ingredient.name))];
}

export function productClassLabel(productClass: string): string {
  return PRODUCT_CLASS_LABELS[productClass as keyof typeof PRODUCT_CLASS_LABELS] ?? productClass;
}

const fruitText = (identity: RecipeIdentity) => (identity.fruits.length ? identity.fruits.join(', ').toLowerCase() : 'no fruit line');

/** "Jam, strawberry": the product class and fruit, as the promotion form shows them side by side. */
export function describeIdentity(identity: RecipeIdentity): string {
  return `${productClassLabel(identity.productClass)}, ${fruitText(identity)}`;
}

const sameFruits = (a: string[], b: string[]) => {
  const norm = (xs: string[]) => [...new Set(xs.map((x) => x.trim().toLowerCase()))].sort().join('|');
  return norm(a) === norm(b);
};

/** Plain sentences for each way the variant differs from the version it would replace; empty when they match. */
export function identityDifferences(variant: RecipeIdentity, current: RecipeIdentity, currentName: string): string[] {
  const out: string[] = [];
  if (!sameFruits(variant.fruits, current.fruits)) {
    out.push(`Different fruit: the variant is ${fruitText(variant)}; ${currentName} is ${fruitText(current)}.`);
  }
  if (variant.productClass !== current.productClass) {
    out.push(`Different product class: the variant is ${productClassLabel(variant.productClass).toLowerCase()}; ${currentName} is ${productClassLabel(current.productClass).toLowerCase()}.`);
  }
  return out;
}

export interface WeighedLine {
  name: string;
  kind: IngredientKind;
  grams: number;
  /** Share of the kettle charge (every line as weighed, before boiling), 0–100. */
  pctOfBatch: number;
}

/** The lines as the kitchen weighs them: % of fruit resolved to grams; null when the lines cannot be resolved. */
export function weighLines(settings: FormulaSettingsInput, lines: readonly RevisionLine[]): { lines: WeighedLine[]; totalChargeG: number } | null {
  try {
    const balance = computeMassBalance([...lines], toChemistrySettings(settings));
    if (!(balance.totalChargeG > 0)) return null;
    return {
      totalChargeG: balance.totalChargeG,
      lines: balance.lines.map((l) => ({ name: l.ingredient.name, kind: l.ingredient.kind, grams: l.massG, pctOfBatch: (100 * l.massG) / balance.totalChargeG })),
    };
  } catch (err) {
    if (err instanceof ChemistryInputError) return null;
    throw err;
  }
}

export type PromotionOutcome =
  | { kind: 'new_product'; name: string; code: string }
  | { kind: 'existing_product'; name: string; code: string; nextVersion: number; currentVersion: number | null };

/** What approval does, in the words of the choice the developer made. */
export function approvalConsequence(outcome: PromotionOutcome): string {
  if (outcome.kind === 'new_product') return `This creates the product ${outcome.name} (${outcome.code}): the variant becomes version 1 of it.`;
  return outcome.currentVersion === null
    ? `The variant becomes version ${outcome.nextVersion} of ${outcome.name} (${outcome.code}); no version of it is in production now.`
    : `The variant becomes version ${outcome.nextVersion} of ${outcome.name} (${outcome.code}) and supersedes version ${outcome.currentVersion} now in production.`;
}

/**
 * The review's verdict on the label: whether the pack must change before the first batch of the new
 * version. Only printed rows call for a new label; a claim that may no longer be made or an additive
 * limit is a check behind the pack, said as such.
 */
export function labelChangeVerdict(changes: ReadonlyArray<{ printed: boolean }>, baselineVersion: number): string {
  if (changes.some((c) => c.printed)) return 'The declaration changes: relabel before this batch.';
  if (changes.length > 0) return `The printed label reads the same as version ${baselineVersion}'s: no relabelling is needed. Some checks behind it change (below).`;
  return `The label reads the same as version ${baselineVersion}'s: no relabelling is needed.`;
}

/**
 * The evidence's predicted end point where the trial's water boils, with its sea-level equivalent: the
 * spec states the end point at sea level, and the two must not read as two answers to one question.
 * A sucrose solution's boiling-point elevation barely moves with pressure over kitchen altitudes, so
 * the sea-level figure adds back the drop in water's boiling point (as lib/chemistry/end-point.ts does).
 */
export function predictedEndPointText(p: { endPointC: number; waterBoilingC?: number }, show: (celsius: number) => string): string {
  if (p.waterBoilingC === undefined) return `${show(p.endPointC)} at the trial's altitude`;
  if (Math.abs(p.waterBoilingC - 100) < 0.05) return `${show(p.endPointC)} at sea level`;
  return `${show(p.endPointC)} where water boils at ${show(p.waterBoilingC)} (${show(p.endPointC - p.waterBoilingC + 100)} at sea level)`;
}
