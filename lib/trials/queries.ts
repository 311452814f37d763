import 'server-only';
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { Formula, FormulaRevision, Trial, Variant } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { computeFormula } from '@/lib/formulas/compute';
import { compareCook } from './compare';
import { trialCode } from './access';
import { cookValues, type CookChangeView, type CookValues, type CookView, type StoveItem, type TrialListQuery, type TrialOverview, type TrialSummary, type VariantView } from './schema';

export async function listTrials(actor: Actor, query: TrialListQuery = {}): Promise<TrialSummary[]> {
  const em = await getEm();
  const where: Record<string, unknown> = { ...inWorkspace(actor) };
  if (query.status) where.status = query.status;
  else where.status = { $ne: 'archived' };
  if (query.owner) where.owner = query.owner;
  if (query.from || query.to) {
    where.createdAt = {
      ...(query.from ? { $gte: new Date(`${query.from}T00:00:00Z`) } : {}),
      ...(query.to ? { $lt: new Date(new Date(`${query.to}T00:00:00Z`).getTime() + 86_400_000) } : {}),
    };
  }
  if (query.q?.trim()) where.title = { $ilike: `%${query.q.trim().replace(/[%_\\]/g, (c) => `\\${c}`)}%` };
  const trials = (await em.find(Trial, where, { populate: ['owner', 'baseFormula'], orderBy: { updatedAt: 'desc' }, limit: 500 }));
  if (!trials.length) return [];
  const variants = await em.find(Variant, { ...inWorkspace(actor), trial: { $in: trials.map((t) => t.id) }, removedAt: null }, { fields: ['trial', 'settings', 'isBase'] });
  const counts = new Map<string, number>();
  const productOf = new Map<string, TrialSummary['productClass']>();
  const classesOf = new Map<string, Set<TrialSummary['productClass']>>();
  for (const v of variants) {
    counts.set(v.trial.id, (counts.get(v.trial.id) ?? 0) + 1);
    if (v.isBase) productOf.set(v.trial.id, v.settings.productClass);
    classesOf.set(v.trial.id, (classesOf.get(v.trial.id) ?? new Set()).add(v.settings.productClass));
  }
  // Without a base variant (a proposal's trial) the trial's product is its variants' common class,
  // else that of the formula revision it started from: never a guess.
  for (const [trialId, classes] of classesOf) if (!productOf.has(trialId) && classes.size === 1) productOf.set(trialId, [...classes][0]);
  const unclassed = trials.filter((t) => !productOf.has(t.id));
  if (unclassed.length) {
    const revisions = await em.find(
      FormulaRevision,
      { ...inWorkspace(actor), $or: unclassed.map((t) => ({ formula: t.baseFormula.id, number: t.baseRevision })) },
      { fields: ['formula', 'number', 'settings'] },
    );
    const classOfRevision = new Map(revisions.map((r) => [`${r.formula.id}:${r.number}`, r.settings.productClass]));
    for (const t of unclassed) {
      const productClass = classOfRevision.get(`${t.baseFormula.id}:${t.baseRevision}`);
      if (productClass) productOf.set(t.id, productClass);
    }
  }
  return trials
    .map((t) => ({
      id: t.id,
      code: trialCode(t.number),
      title: t.title,
      status: t.status,
      ownerId: t.owner.id,
      ownerName: t.owner.name,
      baseFormulaName: t.baseFormula.name,
      productClass: productOf.get(t.id) ?? null,
      variantCount: counts.get(t.id) ?? 0,
      createdAt: t.createdAt.toISOString(),
      updatedAt: t.updatedAt.toISOString(),
    }))
    .filter((t) => !query.product || t.productClass === query.product);
}

/** A cook as the plain statement below reads it: the readings under their view names. */
type CookRow = CookValues & { id: string; variantId: string; cookDate: string; recordedByName: string; createdAt: Date; withdrawnAt: Date | null; changes: Array<Omit<CookChangeView, 'at'> & { at: string }> };

function toCookView(m: CookRow, v: VariantView): CookView {
  // PostgreSQL's JSON timestamps carry microseconds and an offset: shown as every other timestamp is.
  const changes: CookChangeView[] = m.changes.map((c) => ({ kind: c.kind, reason: c.reason, byName: c.byName, at: new Date(c.at).toISOString(), before: c.before }));
  const withdrawal = changes.find((c) => c.kind === 'withdrawn');
  const readings = cookValues(m);
  return {
    id: m.id,
    variantId: m.variantId,
    cookDate: m.cookDate,
    ...readings,
    recordedByName: m.recordedByName,
    createdAt: m.createdAt.toISOString(),
    comparison: compareCook(v.computation, readings, v.settings.plannedPh),
    withdrawn: m.withdrawnAt ? { reason: withdrawal?.reason ?? '', byName: withdrawal?.byName ?? '', at: withdrawal?.at ?? m.withdrawnAt.toISOString() } : null,
    changes,
  };
}

/**
 * Variants with their recomputed chemistry and every cook beside its prediction. Two plain
 * statements (the variants; the cooks with their recorder and changes): the trial page reads this
 * on every visit, and the ORM's per-entity work was the largest part of that page's time.
 */
export async function listVariants(actor: Actor, trialId: string): Promise<VariantView[]> {
  const [rows, cookRows] = await Promise.all([
    sql<{ id: string; label: string; is_base: boolean; description: string; factor_levels: VariantView['factorLevels']; settings: VariantView['settings']; lines: VariantView['lines']; summary: VariantView['summary'] }>(
      `select id, label, is_base, description, factor_levels, settings, lines, summary
         from variants
        where workspace_id = $1 and trial_id = $2 and removed_at is null
        order by position, id`,
      [actor.workspaceId, trialId],
      'trial-variants',
    ),
    sql<CookRow>(
      `select m.id, m.variant_id as "variantId", m.cook_date::text as "cookDate", m.batch_size_g as "batchSizeG", m.brix_reading as "brixReading",
              m.brix_sample_temp_c as "brixSampleTempC", m.ph, m.end_point_temp_c as "endPointTempC", m.boil_time_min as "boilTimeMin",
              m.set_test_score as "setTestScore", m.set_test_method as "setTestMethod", m.syneresis, m.colour_notes as "colourNotes",
              m.yield_jars as "yieldJars", m.yield_g as "yieldG", m.notes, u.name as "recordedByName", m.created_at as "createdAt", m.withdrawn_at as "withdrawnAt",
              coalesce((select json_agg(json_build_object('kind', c.kind, 'reason', c.reason, 'byName', cu.name, 'at', c.changed_at, 'before', c.before) order by c.changed_at, c.id)
                          from measurement_changes c join users cu on cu.id = c.changed_by_id
                         where c.measurement_id = m.id and c.workspace_id = m.workspace_id), '[]'::json) as changes
         from measurements m
         join variants v on v.id = m.variant_id and v.workspace_id = m.workspace_id
         join users u on u.id = m.recorded_by_id
        where m.workspace_id = $1 and v.trial_id = $2 and v.removed_at is null
        order by m.cook_date, m.created_at, m.id`,
      [actor.workspaceId, trialId],
      'trial-cooks',
    ),
  ]);
  return rows.map((r) => {
    const outcome = computeFormula(r.settings, r.lines);
    const view: VariantView = {
      id: r.id,
      label: r.label,
      isBase: r.is_base,
      description: r.description,
      factorLevels: r.factor_levels,
      settings: r.settings,
      lines: r.lines,
      summary: r.summary,
      computation: outcome.ok ? outcome.computation : null,
      computationError: outcome.ok ? null : outcome.message,
      cooks: [],
      withdrawnCooks: [],
    };
    const variantCooks = cookRows.filter((m) => m.variantId === r.id).map((m) => toCookView(m, view));
    view.cooks = variantCooks.filter((m) => !m.withdrawn);
    view.withdrawnCooks = variantCooks.filter((m) => m.withdrawn);
    return view;
  });
}

export async function getTrialOverview(actor: Actor, trialId: string): Promise<TrialOverview> {
  // The trial with its owner, base formula and status history in one statement, the variants
  // beside it (each scoped to the workspace); a trial of another workspace finds nothing.
  const [[t], variants] = await Promise.all([
    sql<{
      id: string; number: number; title: string; question: string; status: TrialOverview['status']; base_revision: number; created_at: Date;
      owner_id: string; owner_name: string; formula_id: string; formula_name: string;
      history: Array<{ from: TrialOverview['status'] | null; to: TrialOverview['status']; note: string | null; byName: string; at: string }>;
    }>(
      `select t.id, t.number, t.title, t.question, t.status, t.base_revision, t.created_at, o.id as owner_id, o.name as owner_name, f.id as formula_id, f.name as formula_name,
              coalesce((select json_agg(json_build_object('from', h.from_status, 'to', h.to_status, 'note', h.note, 'byName', hu.name, 'at', h.changed_at) order by h.changed_at, h.id)
                          from trial_status_changes h join users hu on hu.id = h.changed_by_id
                         where h.trial_id = t.id and h.workspace_id = t.workspace_id), '[]'::json) as history
         from trials t
         join users o on o.id = t.owner_id
         join formulas f on f.id = t.base_formula_id and f.workspace_id = t.workspace_id
        where t.workspace_id = $1 and t.id = $2`,
      [actor.workspaceId, trialId],
      'trial-overview',
    ),
    listVariants(actor, trialId),
  ]);
  if (!t) throw notFound('trial');
  return {
    id: t.id,
    code: trialCode(t.number),
    title: t.title,
    question: t.question,
    status: t.status,
    owner: { id: t.owner_id, name: t.owner_name },
    baseFormula: { id: t.formula_id, name: t.formula_name, revision: t.base_revision },
    createdAt: t.created_at.toISOString(),
    variants,
    history: t.history.map((h) => ({ from: h.from ?? null, to: h.to, note: h.note ?? null, byName: h.byName, at: new Date(h.at).toISOString() })),
  };
}

/** Formulas to start a trial from, with their latest revision. */
export async function listTrialBases(actor: Actor): Promise<Array<{ formulaId: string; name: string; latestRevision: number }>> {
  const em = await getEm();
  const rows = await em.find(Formula, { ...inWorkspace(actor), archivedAt: null }, { orderBy: { name: 'asc' } });
  return rows.map((f) => ({ formulaId: f.id, name: f.name, latestRevision: f.latestRevision }));
}

export async function revisionExists(actor: Actor, formulaId: string, number: number): Promise<boolean> {
  const em = await getEm();
  return (await em.count(FormulaRevision, { ...inWorkspace(actor), formula: formulaId, number })) > 0;
}

/** The developer's trials at the stove (status cooking) and which of their variants are not cooked yet. */
export async function trialsAtTheStove(actor: Actor): Promise<StoveItem[]> {
  // One plain statement: the developer's home page asks for it on every visit.
  const rows = await sql<{ id: string; number: number; title: string; uncooked: string[] }>(
    `select t.id, t.number, t.title,
            coalesce(array_agg(v.label order by v.position) filter (
              where v.id is not null and not exists (select 1 from measurements m where m.variant_id = v.id and m.workspace_id = t.workspace_id and m.withdrawn_at is null)
            ), '{}') as uncooked
       from trials t
       left join variants v on v.trial_id = t.id and v.workspace_id = t.workspace_id and v.removed_at is null
      where t.workspace_id = $1 and t.owner_id = $2 and t.status = 'cooking'
      group by t.id
      order by t.updated_at desc, t.id
      limit 50`,
    [actor.workspaceId, actor.userId],
    'trials-at-the-stove',
  );
  return rows.map((r) => ({ id: r.id, code: trialCode(r.number), title: r.title, uncooked: r.uncooked }));
}
