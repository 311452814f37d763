import 'server-only';
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { Formula, FormulaRevision, Cook, CookChange, Trial, TrialStatusChange, Variant } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { computeFormula } from '@/lib/formulas/compute';
import { compareCook } from './compare';
import { trialCode } from './access';
import type { Loaded } from '@mikro-orm/core';
import type { CookEntity } from '@/entities/Cook';
import { cookValues, type CookChangeView, type CookView, type StoveItem, type TrialListQuery, type TrialOverview, type TrialSummary, type VariantView } from './schema';

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
  for (const v of variants) {
    counts.set(v.trial.id, (counts.get(v.trial.id) ?? 0) + 1);
    if (v.isBase) productOf.set(v.trial.id, v.settings.productClass);
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
      productClass: productOf.get(t.id) ?? 'jam',
      variantCount: counts.get(t.id) ?? 0,
      createdAt: t.createdAt.toISOString(),
      updatedAt: t.updatedAt.toISOString(),
    }))
    .filter((t) => !query.product || t.productClass === query.product);
}

type CookRow = Loaded<CookEntity, 'recordedBy'>;
type ChangeRow = { cook: { id: string }; kind: CookChangeView['kind']; before: CookChangeView['before']; reason: string; changedBy: { name: string }; changedAt: Date };

function toCookView(m: CookRow, v: VariantView, changeRows: ChangeRow[]): CookView {
  const changes: CookChangeView[] = changeRows.map((c) => ({ kind: c.kind, reason: c.reason, byName: c.changedBy.name, at: c.changedAt.toISOString(), before: c.before }));
  const withdrawal = changes.find((c) => c.kind === 'withdrawn');
  const readings = cookValues(m);
  return {
    id: m.id,
    variantId: m.variant.id,
    cookDate: m.cookDate,
    ...readings,
    recordedByName: m.recordedBy.name,
    createdAt: m.createdAt.toISOString(),
    comparison: compareCook(v.computation, readings, v.settings.plannedPh),
    withdrawn: m.withdrawnAt ? { reason: withdrawal?.reason ?? '', byName: withdrawal?.byName ?? '', at: withdrawal?.at ?? m.withdrawnAt.toISOString() } : null,
    changes,
  };
}

/** Variants with their recomputed chemistry and every cook beside its prediction. */
export async function listVariants(actor: Actor, trialId: string): Promise<VariantView[]> {
  const em = await getEm();
  const rows = (await em.find(Variant, { ...inWorkspace(actor), trial: trialId, removedAt: null }, { orderBy: { position: 'asc' } }));
  const cookRows = (await em.find(
    Cook,
    { ...inWorkspace(actor), variant: { $in: rows.map((r) => r.id) } },
    { populate: ['recordedBy'], orderBy: { cookDate: 'asc', createdAt: 'asc' } },
  ));
  const changeRows = cookRows.length
    ? ((await em.find(CookChange, { ...inWorkspace(actor), cook: { $in: cookRows.map((m) => m.id) } }, { populate: ['changedBy'], orderBy: { changedAt: 'asc' } })))
    : [];
  return rows.map((r) => {
    const outcome = computeFormula(r.settings, r.lines);
    const view: VariantView = {
      id: r.id,
      label: r.label,
      isBase: r.isBase,
      description: r.description,
      factorLevels: r.factorLevels,
      settings: r.settings,
      lines: r.lines,
      summary: r.summary,
      computation: outcome.ok ? outcome.computation : null,
      computationError: outcome.ok ? null : outcome.message,
      cooks: [],
      withdrawnCooks: [],
    };
    const variantCooks = cookRows.filter((m) => m.variant.id === r.id).map((m) => toCookView(m, view, changeRows.filter((c) => c.cook.id === m.id)));
    view.cooks = variantCooks.filter((m) => !m.withdrawn);
    view.withdrawnCooks = variantCooks.filter((m) => m.withdrawn);
    return view;
  });
}

export async function getTrialOverview(actor: Actor, trialId: string): Promise<TrialOverview> {
  const em = await getEm();
  // The trial, its history and its variants are read at once (each scoped to the workspace); a
  // trial of another workspace finds nothing in any of them.
  const [t, history, variants] = await Promise.all([
    em.findOne(Trial, { ...inWorkspace(actor), id: trialId }, { populate: ['owner', 'baseFormula'] }),
    em.find(TrialStatusChange, { ...inWorkspace(actor), trial: trialId }, { populate: ['changedBy'], orderBy: { changedAt: 'asc' } }),
    listVariants(actor, trialId),
  ]);
  if (!t) throw notFound('trial');
  return {
    id: t.id,
    code: trialCode(t.number),
    title: t.title,
    question: t.question,
    status: t.status,
    owner: { id: t.owner.id, name: t.owner.name },
    baseFormula: { id: t.baseFormula.id, name: t.baseFormula.name, revision: t.baseRevision },
    createdAt: t.createdAt.toISOString(),
    variants,
    history: history.map((h) => ({ from: h.fromStatus ?? null, to: h.toStatus, note: h.note ?? null, byName: h.changedBy.name, at: h.changedAt.toISOString() })),
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
