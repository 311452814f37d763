import 'server-only';
/**
 * Cost reads: loads the prices a set of formulas needs (one history read per kind, for the whole
 * range of days asked) and costs them with lib/costing. Callers hold `prices.read`.
 */
import { getEm } from '@/lib/db';
import { BatchDecision, BatchRecord, Trial } from '@/entities';
import { goodJarsOf } from '@/lib/production/holds';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { todayIso, isoDate } from '@/lib/format/dates';
import { batchActualCostPerJar, changePct, costStoredFormula, historiesBy, type IngredientPricePoint, type PackagingPricePoint, type PackFormatData } from '@/lib/costing';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import { sql } from '@/lib/sql';
import { isUuid } from '@/lib/ids';
import { costingData } from '@/lib/pricing/queries';
import type { BatchCost, CostResult, EditorCostBasis, FrozenCost, ProductCosts, TrialCosts, VersionCost } from './schema';

/** Everything costFormula needs for some formulas over a range of days. */
interface CostBasis {
  currency: string | null;
  overfillPct: number;
  warningPct: number;
  ingredientPrices: Map<string, IngredientPricePoint[]>;
  packagingPrices: Map<string, PackagingPricePoint[]>;
  refuse: Map<string, number>;
  packFormats: Map<string, PackFormatData>;
}

/** The price rows the formulas' ingredients and pack formats need from `from` to `to`: one statement. */
export async function loadCostBasis(
  workspaceId: string,
  need: { ingredientIds: readonly string[] | 'workspace'; packFormatIds: readonly string[] | 'workspace'; from: string; to: string },
): Promise<CostBasis> {
  const data = await costingData(workspaceId, need);
  return {
    currency: data.settings.currency,
    overfillPct: data.settings.overfillPct,
    warningPct: data.settings.costWarningPct,
    ingredientPrices: historiesBy(data.ingredientPoints, (p) => p.ingredientId),
    packagingPrices: historiesBy(data.packagingPoints, (p) => p.packagingItemId),
    refuse: data.refuse,
    packFormats: data.packFormats,
  };
}

/** One formula (lines as stored) costed on `asOf` in its pack format. */
export function costOn(basis: CostBasis, settings: FormulaSettingsInput, lines: RevisionLine[], packFormatId: string | null, asOf: string): CostResult {
  if (!basis.currency) return { ok: false, message: 'The workspace has no currency yet: an administrator sets it under prices.' };
  return costStoredFormula(
    settings,
    lines.map((l) => ({ ...l, refusePct: basis.refuse.get(l.ingredientId) ?? 0 })),
    {
      asOf,
      packFormat: packFormatId ? (basis.packFormats.get(packFormatId) ?? null) : null,
      overfillPct: basis.overfillPct,
      ingredientPrices: basis.ingredientPrices,
      packagingPrices: basis.packagingPrices,
    },
  );
}

const ingredientIdsOf = (formulas: Array<{ lines: RevisionLine[] }>) => [...new Set(formulas.flatMap((f) => f.lines.map((l) => l.ingredientId)))];

/** The editor's prices on one day, for every ingredient and (not archived) pack format of the workspace: two round trips. */
export async function editorCostBasis(actor: Actor, asOf: string = todayIso()): Promise<EditorCostBasis> {
  // Every ingredient's and every pack format's prices in force that day (from = to = asOf), in one statement.
  const data = await costingData(actor.workspaceId, { ingredientIds: 'workspace', packFormatIds: 'workspace', from: asOf, to: asOf });
  return {
    currency: data.settings.currency,
    asOf,
    overfillPct: data.settings.overfillPct,
    ingredientPrices: data.ingredientPoints,
    packagingPrices: data.packagingPoints,
    refuse: [...data.refuse.entries()],
    // In name order, as the statement lists them.
    packFormats: [...data.packFormats.values()],
  };
}

/** Each variant of a trial costed on `asOf` in the pack format of the trial's base formula. */
export async function trialCosts(actor: Actor, trialId: string, asOf: string = todayIso()): Promise<TrialCosts> {
  // The trial, its base formula's pack format and its variants in one statement, and at the same
  // time the day's prices of every ingredient and pack format in use (one round trip, not two).
  const [rows, inUse] = await Promise.all([
    isUuid(trialId) ? sql<{ pack_format_id: string | null; id: string | null; label: string; settings: FormulaSettingsInput; lines: RevisionLine[] }>(
      `select f.pack_format_id, v.id, v.label, v.settings, v.lines
         from trials t
         left join formulas f on f.id = t.base_formula_id
         left join variants v on v.trial_id = t.id and v.workspace_id = t.workspace_id and v.removed_at is null
        where t.workspace_id = $1 and t.id = $2
        order by v.position`,
      [actor.workspaceId, trialId], 'trial_costs_variants',
    ) : Promise.resolve([]),
    loadCostBasis(actor.workspaceId, { ingredientIds: 'workspace', packFormatIds: 'workspace', from: asOf, to: asOf }),
  ]);
  if (!rows.length) throw notFound('trial');
  const packFormatId = rows[0].pack_format_id;
  const variants = rows.filter((r) => r.id !== null);
  // A pack format archived since the formula took it is not among those in use: then read by id.
  const basis = packFormatId && !inUse.packFormats.has(packFormatId)
    ? await loadCostBasis(actor.workspaceId, { ingredientIds: ingredientIdsOf(variants), packFormatIds: [packFormatId], from: asOf, to: asOf })
    : inUse;
  const format = packFormatId ? basis.packFormats.get(packFormatId) : undefined;
  return {
    currency: basis.currency,
    asOf,
    packFormat: format ? { id: format.id, name: format.name } : null,
    variants: variants.map((v) => ({ variantId: v.id!, label: v.label, result: costOn(basis, v.settings, v.lines, packFormatId, asOf) })),
  };
}

/** A cost reduced to what is frozen with a version. */
export function freeze(result: CostResult, currency: string | null, packFormatName: string | null): FrozenCost | null {
  if (!result.ok || !currency) return null;
  const c = result.cost;
  return {
    asOf: c.asOf, currency, packFormatName,
    batchMinor: c.batch.minor, perKgMinor: c.perKg.minor, perJarMinor: c.perJar?.minor ?? null,
    complete: c.complete, missing: c.missing,
  };
}

/**
 * What a new version takes at approval: the pack format of the trial's base formula (a version is
 * filled in the jar its formula was costed in) and the cost of its lines on the approval day in it,
 * frozen (null when the workspace has no currency). Read outside the approval's transaction: prices
 * are committed data.
 */
export async function costForApproval(
  workspaceId: string,
  formula: { settings: FormulaSettingsInput; lines: RevisionLine[]; trialId: string },
  day: string,
): Promise<{ packFormatId: string | null; costAtApproval: FrozenCost | null }> {
  const em = await getEm();
  const trial = await em.findOne(Trial, { workspace: workspaceId, id: formula.trialId }, { fields: ['id', 'baseFormula'], populate: ['baseFormula'] });
  const packFormatId = trial?.baseFormula.packFormat?.id ?? null;
  const basis = await loadCostBasis(workspaceId, { ingredientIds: ingredientIdsOf([formula]), packFormatIds: packFormatId ? [packFormatId] : [], from: day, to: day });
  const name = packFormatId ? (basis.packFormats.get(packFormatId)?.name ?? null) : null;
  return { packFormatId, costAtApproval: freeze(costOn(basis, formula.settings, formula.lines, packFormatId, day), basis.currency, name) };
}

/** Every version of a product: its cost frozen at approval and today's, and whether it moved past the threshold. */
export async function productCosts(actor: Actor, productId: string, asOf: string = todayIso()): Promise<ProductCosts> {
  // The product and its versions in one statement; then the prices in one more.
  const rows = isUuid(productId) ? await sql<{
    id: string | null; version: number; status: VersionCost['status']; settings: FormulaSettingsInput; lines: RevisionLine[];
    pack_format_id: string | null; cost_at_approval: FrozenCost | null; approved_at: Date;
  }>(
    `select v.id, v.version, v.status, v.settings, v.lines, v.pack_format_id, v.cost_at_approval, v.approved_at
       from products p
       left join production_formulas v on v.product_id = p.id and v.workspace_id = p.workspace_id
      where p.workspace_id = $1 and p.id = $2
      order by v.version desc`,
    [actor.workspaceId, productId], 'product_costs_versions',
  ) : [];
  if (!rows.length) throw notFound('product');
  const versions = rows.filter((r) => r.id !== null);
  const packFormatIds = [...new Set(versions.map((v) => v.pack_format_id).filter((id): id is string => !!id))];
  const basis = await loadCostBasis(actor.workspaceId, { ingredientIds: ingredientIdsOf(versions), packFormatIds, from: asOf, to: asOf });
  return {
    currency: basis.currency,
    asOf,
    warningPct: basis.warningPct,
    versions: versions.map((v): VersionCost => {
      const today = costOn(basis, v.settings, v.lines, v.pack_format_id, asOf);
      const atApproval = v.cost_at_approval ?? null;
      const before = atApproval?.complete && atApproval.currency === basis.currency ? atApproval.perJarMinor : null;
      const after = today.ok && today.cost.perJar?.complete ? today.cost.perJar.minor : null;
      const movedPct = before !== null && after !== null ? changePct(before, after) : null;
      return {
        versionId: v.id!, version: v.version, status: v.status, approvedAt: new Date(v.approved_at).toISOString(),
        atApproval, today, movedPct, warn: movedPct !== null && Math.abs(movedPct) > basis.warningPct,
      };
    }),
  };
}

/** A batch's cost: the version costed on the batch's day, and per good jar from its charge and jars. */
export async function batchCost(actor: Actor, batchId: string): Promise<BatchCost> {
  const em = await getEm();
  const batch = await em.findOne(BatchRecord, { ...inWorkspace(actor), id: batchId }, { populate: ['productVersion'] });
  if (!batch) throw notFound('batch');
  const version = batch.productVersion;
  const day = isoDate(batch.batchDate);
  const packFormatId = version.packFormat?.id ?? null;
  const basis = await loadCostBasis(actor.workspaceId, { ingredientIds: ingredientIdsOf([version]), packFormatIds: packFormatId ? [packFormatId] : [], from: day, to: day });
  const planned = costOn(basis, version.settings, version.lines, packFormatId, day);
  const rejected = await em.count(BatchDecision, { ...inWorkspace(actor), batch: batch.id, kind: 'reject' });
  const status = rejected ? 'rejected' : batch.disposition === 'discard' ? 'discarded' : 'passed';
  const goodJars = goodJarsOf(status, batch.jarsFilled, batch.jarsRejected);
  return {
    currency: basis.currency,
    planned,
    goodJars,
    // A rejected or discarded batch writes every jar off: no cost per good jar.
    actualPerJar: planned.ok ? batchActualCostPerJar(planned.cost, { chargeG: batch.batchSizeG, jarsFilled: batch.jarsFilled, jarsRejected: batch.jarsFilled - goodJars }) : null,
  };
}
