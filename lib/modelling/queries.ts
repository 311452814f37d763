import 'server-only';
/**
 * Reads for modelling: the data set of a product family (or of chosen trials), the fitted family
 * model, and the family of a formula. Every read is scoped to the caller's workspace; the callers
 * (pages, the API) have asked lib/permissions first. Nothing is stored in the database: a fit is
 * made on read (the formula editor keeps its fits in memory, keyed by modelDataVersion()).
 */
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { Formula, FormulaRevision, Cook, TastingAnswer, TastingSample, SensoryAttributeDef, Variant } from '@/entities';
import { correctBrixTo20C } from '@/lib/chemistry';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { trialCode } from '@/lib/trials/access';
import { scaleNote, type SensoryScale } from '@/lib/sensory';
import { getFormula } from '@/lib/formulas/queries';
import { formulaFeatures, type FormulaFeatures } from './features';
import { proposalCosting, type ProposalBase, type ProposalCosting } from './proposals';
import { editorCostBasis } from '@/lib/costs/queries';
import { packFormatOfFormulas } from '@/lib/pricing/queries';
import { fitFamilyModel, fitResponse, varyingFactors } from './fit';
import { ValidationFailed } from '@/lib/errors';
import { isoDate } from '@/lib/format/dates';
import {
  DEFAULT_MODEL_FACTORS,
  familySlug,
  LAB_RESPONSE_INFO,
  LAB_RESPONSES,
  type Dataset,
  type DatasetRow,
  type DatasetSelection,
  type FamilyInfo,
  type FamilySummary,
  type FamilyKey,
  type FamilyModel,
  type FitOptions,
  type LabResponse,
  type ResponseInfo,
  type ResponseKey,
  type ResponseValue,
} from './schema';

type Scope = Pick<Actor, 'workspaceId'>;

const SYNERESIS_SCORE: Record<string, number> = { none: 0, slight: 1, marked: 2 };

function summarise(values: readonly number[]): ResponseValue | undefined {
  const n = values.length;
  if (n === 0) return undefined;
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const sd = n >= 2 ? Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1)) : null;
  return { mean, n, sd };
}

/** Soluble solids at 20 °C: the reading corrected when its temperature is known and inside the table, else as read. */
function solidsAt20(reading: number, tempC: number | null): number {
  if (tempC === null) return reading;
  try {
    return correctBrixTo20C(reading, tempC).correctedBrix20C;
  } catch {
    return reading;
  }
}

function scaleEnds(scale: SensoryScale): { min: number; max: number } {
  if (scale.kind === 'line') return { min: scale.minValue, max: scale.maxValue };
  const values = scale.points.map((p) => p.value);
  return { min: Math.min(...values), max: Math.max(...values) };
}

function sameFamily(a: FamilyKey, b: FamilyKey): boolean {
  return a.productClass === b.productClass && a.fruitIngredientId === b.fruitIngredientId;
}

interface VariantRecord {
  id: string;
  label: string;
  trial: { id: string; number: number; title: string; createdAt: Date };
  settings: Parameters<typeof formulaFeatures>[0];
  lines: Parameters<typeof formulaFeatures>[1];
}

/** The workspace's variants (not removed), of some trials or of one product class. */
async function loadVariants(scope: Scope, only: { trialIds?: string[]; productClass?: FamilyKey['productClass'] } = {}): Promise<VariantRecord[]> {
  const em = await getEm();
  const where = {
    ...inWorkspace(scope),
    removedAt: null,
    ...(only.trialIds ? { trial: { $in: only.trialIds } } : {}),
    ...(only.productClass ? { settings: { productClass: only.productClass } } : {}),
  };
  const found = await em.find(Variant, where, { populate: ['trial'], orderBy: { trial: { number: 'asc' }, position: 'asc' } });
  return found.map((v) => ({
    id: v.id, label: v.label, settings: v.settings, lines: v.lines,
    trial: { id: v.trial.id, number: v.trial.number, title: v.trial.title, createdAt: v.trial.createdAt },
  }));
}

/**
 * The data set: one row per variant that was cooked or tasted, its factors from its formula, and
 * each response's mean with its count and spread. By family: every variant of the workspace whose
 * formula falls in the family; by trials: every variant of those trials (of any family — the page
 * warns when they mix).
 */
export async function modelDataset(scope: Scope, selection: DatasetSelection): Promise<Dataset> {
  const em = await getEm();
  const variants = await loadVariants(scope, 'family' in selection ? { productClass: selection.family.productClass } : { trialIds: selection.trialIds });

  const excluded: Dataset['excluded'] = [];
  const featured: Array<{ variant: VariantRecord; features: FormulaFeatures }> = [];
  let family: FamilyInfo | null = null;
  for (const variant of variants) {
    const outcome = formulaFeatures(variant.settings, variant.lines);
    const ref = { variantId: variant.id, trialCode: trialCode(variant.trial.number), variantLabel: variant.label };
    if (!outcome.ok) {
      excluded.push({ ...ref, reason: outcome.message });
      continue;
    }
    const own = outcome.features.family;
    if ('family' in selection) {
      if (!own || !sameFamily(own, selection.family)) continue;
    } else if (own && family && !sameFamily(own, family)) {
      excluded.push({ ...ref, reason: `Another product family (${own.name}).` });
      continue;
    }
    family ??= own;
    featured.push({ variant, features: outcome.features });
  }

  const variantIds = featured.map((f) => f.variant.id);
  const [cooks, samples, attributes] = variantIds.length
    ? await Promise.all([
        em.find(Cook, { ...inWorkspace(scope), variant: { $in: variantIds }, withdrawnAt: null }, { orderBy: { cookDate: 'asc' } }),
        em.find(TastingSample, { ...inWorkspace(scope), variant: { $in: variantIds }, session: { state: { $ne: 'draft' } } }, { fields: ['variant', 'id'] }),
        em.find(SensoryAttributeDef, inWorkspace(scope), { orderBy: { createdAt: 'asc' } }),
      ])
    : [[], [], []];
  const answers = samples.length
    ? await em.find(
        TastingAnswer,
        { ...inWorkspace(scope), kind: 'rating', sampleId: { $in: samples.map((s) => s.id) }, value: { $ne: null } },
        // In a fixed order, so the same data always give the same fit to the last digit.
        { fields: ['sampleId', 'attribute', 'value'], orderBy: { id: 'asc' } },
      )
    : [];

  const variantOfSample = new Map(samples.map((s) => [s.id, s.variant.id]));
  const scores = new Map<string, Map<string, number[]>>();
  for (const answer of answers) {
    const variantId = variantOfSample.get(answer.sampleId ?? '');
    if (!variantId || answer.value === null || answer.value === undefined) continue;
    const byAttribute = scores.get(variantId) ?? new Map<string, number[]>();
    scores.set(variantId, byAttribute);
    const list = byAttribute.get(answer.attribute) ?? [];
    byAttribute.set(answer.attribute, list);
    list.push(answer.value);
  }
  const cooksOf = new Map<string, typeof cooks>();
  for (const cook of cooks) {
    const list = cooksOf.get(cook.variant.id) ?? [];
    cooksOf.set(cook.variant.id, list);
    list.push(cook);
  }

  const rows: DatasetRow[] = [];
  const seenResponses = new Set<ResponseKey>();
  const firstCookOfTrial = new Map<string, string>();
  for (const cook of cooks) {
    const trialId = featured.find((f) => f.variant.id === cook.variant.id)!.variant.trial.id;
    const day = isoDate(cook.cookDate);
    const known = firstCookOfTrial.get(trialId);
    if (!known || day < known) firstCookOfTrial.set(trialId, day);
  }
  for (const { variant, features } of featured) {
    const own = cooksOf.get(variant.id) ?? [];
    const lab: Record<LabResponse, number[]> = {
      measuredSolids: own.filter((c) => c.brixReading !== null).map((c) => solidsAt20(c.brixReading!, c.brixSampleTempC ?? null)),
      measuredPh: own.filter((c) => c.ph !== null).map((c) => c.ph!),
      setTest: own.filter((c) => c.setTestScore !== null).map((c) => c.setTestScore!),
      syneresis: own.filter((c) => c.syneresis !== null).map((c) => SYNERESIS_SCORE[c.syneresis!]),
    };
    const responses: DatasetRow['responses'] = {};
    for (const key of LAB_RESPONSES) {
      const value = summarise(lab[key]);
      if (value) {
        responses[`lab:${key}`] = value;
        seenResponses.add(`lab:${key}`);
      }
    }
    for (const [attributeId, values] of scores.get(variant.id) ?? []) {
      const value = summarise(values);
      if (value) {
        responses[`attribute:${attributeId}`] = value;
        seenResponses.add(`attribute:${attributeId}`);
      }
    }
    if (Object.keys(responses).length === 0) {
      excluded.push({ variantId: variant.id, trialCode: trialCode(variant.trial.number), variantLabel: variant.label, reason: 'Not cooked or tasted yet.' });
      continue;
    }
    rows.push({
      trialId: variant.trial.id,
      trialCode: trialCode(variant.trial.number),
      trialTitle: variant.trial.title,
      trialDate: firstCookOfTrial.get(variant.trial.id) ?? isoDate(variant.trial.createdAt),
      variantId: variant.id,
      variantLabel: variant.label,
      pectinFamily: features.pectinFamily,
      factors: features.factors,
      responses,
    });
  }
  rows.sort((a, b) => a.trialDate.localeCompare(b.trialDate) || a.trialCode.localeCompare(b.trialCode) || a.variantLabel.localeCompare(b.variantLabel));

  const responses: ResponseInfo[] = [];
  for (const key of LAB_RESPONSES) {
    if (!seenResponses.has(`lab:${key}`)) continue;
    const info = LAB_RESPONSE_INFO[key];
    responses.push({ key: `lab:${key}`, name: info.name, unit: info.unit, kind: 'lab', decimals: info.decimals, libraryKey: null, scale: null });
  }
  for (const attribute of attributes) {
    const key: ResponseKey = `attribute:${attribute.id}`;
    if (!seenResponses.has(key)) continue;
    const ends = scaleEnds(attribute.scale);
    // An intensity line is named after its attribute: "Set firmness (0–10)", not "(Set firmness, 0–10)".
    const unit = [scaleNote(attribute.name, attribute.scale.name), `${ends.min}–${ends.max}`].filter(Boolean).join(', ');
    responses.push({ key, name: attribute.name, unit, kind: 'sensory', decimals: 1, libraryKey: attribute.libraryKey ?? null, scale: ends });
  }
  return { family, rows, responses, excluded };
}

/** The family's default model for every response (or with the options' factors, kind and trials). */
export async function familyModel(scope: Scope, family: FamilyKey, options: FitOptions = {}): Promise<FamilyModel | null> {
  const dataset = await modelDataset(scope, { family });
  const rows = options.trialIds ? dataset.rows.filter((r) => options.trialIds!.includes(r.trialId)) : dataset.rows;
  if (!dataset.family) return null;
  return fitFamilyModel({ ...dataset, rows, family: dataset.family }, { factors: options.factors, kind: options.kind });
}

/** A formula's latest revision as the optimiser's base; 404 for an unknown formula, 422 for one of another family. */
export async function baseFormulaOfFamily(actor: Actor, family: FamilyKey, formulaId: string): Promise<ProposalBase> {
  const [formula, own] = await Promise.all([getFormula(actor, formulaId), familyOfFormula(actor, formulaId)]);
  if (!own || own.slug !== familySlug(family)) {
    throw new ValidationFailed('The base formula is not of this product family.', { baseFormulaId: ['The base formula is not of this product family.'] });
  }
  return { settings: formula.current.settings, lines: formula.current.lines };
}

/**
 * The costing of proposals on a formula, as the Propose page reads it: today's prices and the
 * formula's pack format (null when none is chosen). Callers hold prices.read.
 */
export async function proposalCostingOf(actor: Actor, formulaId: string): Promise<ProposalCosting> {
  const [basis, packFormats] = await Promise.all([editorCostBasis(actor), packFormatOfFormulas(actor.workspaceId, [formulaId])]);
  return proposalCosting(basis, packFormats.get(formulaId) ?? null);
}

/** The family of a formula's latest revision; 404 for a formula of another workspace, null without a fruit line. */
export async function familyOfFormula(scope: Scope, formulaId: string): Promise<FamilyInfo | null> {
  const em = await getEm();
  const formula = await em.findOne(Formula, { ...inWorkspace(scope), id: formulaId });
  if (!formula) throw notFound('formula');
  const revision = await em.findOne(FormulaRevision, { formula: formula.id }, { orderBy: { number: 'desc' } });
  if (!revision) return null;
  const outcome = formulaFeatures(revision.settings, revision.lines);
  return outcome.ok ? outcome.features.family : null;
}

/** Every family with at least one cooked or tasted variant, most variants first. */
export async function listFamilies(scope: Scope): Promise<FamilySummary[]> {
  const em = await getEm();
  const variants = await loadVariants(scope);
  const cooks = variants.length
    ? await em.find(Cook, { ...inWorkspace(scope), withdrawnAt: null, variant: { $in: variants.map((v) => v.id) } }, { fields: ['variant', 'cookDate'] })
    : [];
  const lastCookOf = new Map<string, string>();
  for (const cook of cooks) {
    const day = isoDate(cook.cookDate);
    if ((lastCookOf.get(cook.variant.id) ?? '') < day) lastCookOf.set(cook.variant.id, day);
  }
  const families = new Map<string, FamilySummary & { trialIds: Set<string> }>();
  for (const variant of variants) {
    const cooked = lastCookOf.get(variant.id);
    if (!cooked) continue;
    const outcome = formulaFeatures(variant.settings, variant.lines);
    if (!outcome.ok || !outcome.features.family) continue;
    const info = outcome.features.family;
    const entry = families.get(info.slug) ?? { ...info, trials: 0, variants: 0, lastCook: null, trialIds: new Set<string>() };
    families.set(info.slug, entry);
    entry.variants++;
    entry.trialIds.add(variant.trial.id);
    entry.trials = entry.trialIds.size;
    if (!entry.lastCook || entry.lastCook < cooked) entry.lastCook = cooked;
  }
  return [...families.values()]
    .map(({ trialIds: _ids, ...rest }) => {
      void _ids;
      return rest;
    })
    .sort((a, b) => b.variants - a.variants || a.name.localeCompare(b.name));
}

/** The tables a model's data set reads (modelDataVersion). */
const MODEL_DATA_TABLES = ['variants', 'trials', 'measurements', 'panel_sessions', 'panel_samples', 'panel_answers', 'sensory_attributes'];

/**
 * A fingerprint of everything a workspace's data sets are built from: its variants, trials, cooks,
 * tastings (their state), tasting samples, answers and attributes. Per table, the row count (a
 * delete changes it) and the sum of the rows' transaction ids (PostgreSQL's xmin: every insert and
 * update gives its row a new one). Any write to those rows changes it, from the application or
 * not, so a fit kept under it is never stale; a write that changes nothing a data set reads only
 * costs a refit. One statement of sums, about a seventh of the digest of every row's text it replaced.
 */
export async function modelDataVersion(scope: Scope): Promise<string> {
  const table = (name: string) => `(select count(*) || '.' || coalesce(sum(x.xmin::text::bigint), 0) from ${name} x where x.workspace_id = $1)`;
  const [row] = await sql<{ version: string }>(
    `select concat_ws('/', ${MODEL_DATA_TABLES.map(table).join(', ')}) as version`,
    [scope.workspaceId],
    'model-data-version',
  );
  return row.version;
}

/** The family's data set, or 404 when the workspace has no cooked variant of it; optionally only some trials. */
export async function familyDataset(scope: Scope, family: FamilyKey, trialIds?: readonly string[]): Promise<Dataset & { family: FamilyInfo }> {
  const dataset = await modelDataset(scope, { family });
  if (!dataset.family) throw notFound('product family');
  const rows = trialIds ? dataset.rows.filter((r) => trialIds.includes(r.trialId)) : dataset.rows;
  return { ...dataset, rows, family: dataset.family };
}

/** The family model, or 404 (as familyDataset). */
export async function familyModelOrNotFound(scope: Scope, family: FamilyKey, options: FitOptions = {}): Promise<FamilyModel> {
  const dataset = await familyDataset(scope, family, options.trialIds);
  return fitFamilyModel(dataset, { factors: options.factors, kind: options.kind });
}

/**
 * The fits for the coefficients export: one response (422 when the data set has no such response or
 * too few runs for it), or every response that can be fitted.
 */
export async function responseFits(scope: Scope, family: FamilyKey, query: { response?: ResponseKey; kind?: FitOptions['kind']; trialIds?: readonly string[] }) {
  const dataset = await familyDataset(scope, family, query.trialIds);
  if (query.response === undefined) return { dataset, models: fitFamilyModel(dataset, { kind: query.kind }).responses };
  const response = dataset.responses.find((r) => r.key === query.response);
  if (!response) throw new ValidationFailed('Choose a response of this data set.', { response: ['Choose a response of this data set.'] });
  const result = fitResponse(dataset.rows, response, varyingFactors(dataset.rows, DEFAULT_MODEL_FACTORS), query.kind);
  if (!result.ok) throw new ValidationFailed(result.unfitted.reason, { response: [result.unfitted.reason] });
  return { dataset, models: [result.model] };
}

export { familySlug };
