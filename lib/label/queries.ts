import 'server-only';
/**
 * Labels of stored formulas, variants and production versions. A stored line keeps the chemistry
 * of its ingredient as saved; its label data is read from the library now, which is why a
 * production version freezes its label at approval.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Ingredient, ProductVersion } from '@/entities';
import { getEm } from '@/lib/db';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { ValidationFailed } from '@/lib/errors';
import { getFormula } from '@/lib/formulas/queries';
import { getTrialOverview } from '@/lib/trials/queries';
import { toIngredientView } from '@/lib/ingredients/queries';
import { toLabelData } from '@/lib/ingredients/label-data';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import { formatDate } from '@/lib/format/dates';
import { TYPICAL_JAM_REFERENCE, type ClaimReference } from './claims';
import type { IngredientLabelData } from './types';
import { claimReferenceFrom, labelForLines, type LabelOptions, type LabelOutcome } from './index';
import { labelChanges, type Label } from './label';
import type { LabelComparison, LabelQuery, LabelView } from './schema';

/** The library's label data for each stored line, in line order; null for an ingredient no longer there. */
export async function labelDataForLines(em: EntityManager, actor: Actor, lines: readonly RevisionLine[]): Promise<Array<IngredientLabelData | null>> {
  const ids = [...new Set(lines.map((l) => l.ingredientId))];
  const rows = ids.length ? await em.find(Ingredient, { ...inWorkspace(actor), id: { $in: ids } }) : [];
  const byId = new Map(rows.map((r) => [r.id, toLabelData(toIngredientView(r))]));
  return lines.map((l) => byId.get(l.ingredientId) ?? null);
}

/** The label of stored lines, reading label data through `em` (inside a transaction when freezing). */
export async function labelOfStored(em: EntityManager, actor: Actor, settings: FormulaSettingsInput, lines: readonly RevisionLine[], options: LabelOptions = {}): Promise<LabelOutcome> {
  return labelForLines(settings, [...lines], await labelDataForLines(em, actor, lines), options);
}

async function resolveReference(actor: Actor, choice: LabelQuery['reference']): Promise<{ reference: ClaimReference; choice: string }> {
  if (!choice || choice === 'typical') return { reference: TYPICAL_JAM_REFERENCE, choice: 'typical' };
  const formula = await getFormula(actor, choice);
  const data = await labelDataForLines(await getEm(), actor, formula.current.lines);
  const reference = claimReferenceFrom(formula.name, formula.current.settings, formula.current.lines, data, `Formula ${formula.name}, revision ${formula.current.number}`);
  if (!reference) {
    throw new ValidationFailed('The reference formula cannot be computed.', { reference: [`${formula.name} cannot be computed, so it cannot serve as the reference; choose another.`] });
  }
  return { reference, choice };
}

function rulesOf(settings: FormulaSettingsInput): LabelView['subject']['rules'] {
  return { ruleSet: settings.ruleSet, ruleDate: settings.ruleDate };
}

function view(outcome: LabelOutcome, kept: LabelView['kept'], subject: LabelView['subject'], reference: LabelView['reference']): LabelView {
  return outcome.ok
    ? { label: outcome.label, problem: null, kept, reference, subject }
    : { label: null, problem: outcome.message, kept, reference, subject };
}

/** The live label of a formula's latest revision. */
export async function formulaLabel(actor: Actor, formulaId: string, query: LabelQuery = {}): Promise<LabelView> {
  const formula = await getFormula(actor, formulaId);
  const { reference, choice } = await resolveReference(actor, query.reference);
  const outcome = await labelOfStored(await getEm(), actor, formula.current.settings, formula.current.lines, { claimReference: reference });
  const state = `Revision ${formula.current.number}, saved ${formatDate(formula.current.createdAt)}`;
  return view(outcome, 'live', { kind: 'formula', id: formula.id, name: formula.name, state, rules: rulesOf(formula.current.settings) }, { choice, name: reference.name });
}

/** The live label of one variant of a trial. */
export async function variantLabel(actor: Actor, trialId: string, variantId: string, query: LabelQuery = {}): Promise<LabelView & { trialCode: string }> {
  const trial = await getTrialOverview(actor, trialId);
  const variant = trial.variants.find((v) => v.id === variantId);
  if (!variant) throw notFound('variant');
  const { reference, choice } = await resolveReference(actor, query.reference);
  const outcome = await labelOfStored(await getEm(), actor, variant.settings, variant.lines, { claimReference: reference });
  const subject = { kind: 'variant' as const, id: variant.id, name: `${trial.code} variant ${variant.label}`, state: `Trial ${trial.code}: ${trial.title}`, rules: rulesOf(variant.settings) };
  return { ...view(outcome, 'live', subject, { choice, name: reference.name }), trialCode: trial.code };
}

/** A production version's label: frozen at approval, or computed now for versions approved before labels were frozen. */
export async function versionLabel(actor: Actor, versionId: string): Promise<LabelView> {
  const em = await getEm();
  const v = await em.findOne(ProductVersion, { ...inWorkspace(actor), id: versionId }, { populate: ['product'] });
  if (!v) throw notFound('production version');
  const product = v.product;
  const subject = { kind: 'version' as const, id: v.id, name: `${product.name} v${v.version}`, state: `Version ${v.version}, approved ${formatDate(v.approvedAt.toISOString())}`, rules: rulesOf(v.settings) };
  const frozen = v.label as Label | null;
  if (frozen) return { label: frozen, problem: null, kept: 'frozen', reference: { choice: 'typical', name: frozen.claims.reference ?? TYPICAL_JAM_REFERENCE.name }, subject };
  const outcome = await labelOfStored(em, actor, v.settings, v.lines);
  return view(outcome, 'not_frozen', subject, { choice: 'typical', name: TYPICAL_JAM_REFERENCE.name });
}

/**
 * The label a promotion puts into production beside the label of the version it replaces: the
 * proposed variant's (or, once approved, the new version's frozen label) against the baseline's.
 */
export async function promotionLabelComparison(
  actor: Actor,
  request: { productVersionId: string | null; formula: { settings: FormulaSettingsInput; lines: RevisionLine[] } | null; baseline: { id: string; version: number } | null },
): Promise<LabelComparison | null> {
  if (!request.baseline || !request.formula) return null;
  const before = await versionLabel(actor, request.baseline.id);
  const after = request.productVersionId
    ? await versionLabel(actor, request.productVersionId)
    : view(await labelOfStored(await getEm(), actor, request.formula.settings, request.formula.lines), 'live', { kind: 'variant', id: '', name: '', state: null, rules: null }, null);
  const base = { baselineVersion: request.baseline.version, baselineKept: before.kept };
  if (!before.label || !after.label) return { ...base, changes: [], problem: before.problem ?? after.problem };
  return { ...base, changes: labelChanges(before.label, after.label), problem: null };
}
