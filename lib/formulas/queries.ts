import 'server-only';
import type { Loaded } from '@mikro-orm/core';
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { isUuid } from '@/lib/ids';
import { Formula, FormulaRevision } from '@/entities';
import type { FormulaRevisionEntity } from '@/entities/FormulaRevision';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { computeFormula } from './compute';
import type { FormulaDetail, FormulaRevisionView, FormulaSummary } from './schema';

type RevisionRow = Loaded<FormulaRevisionEntity, 'createdBy'>;

export function toRevisionView(r: RevisionRow): FormulaRevisionView {
  return {
    formulaId: r.formula.id,
    number: r.number,
    name: r.name,
    settings: r.settings,
    lines: r.lines,
    note: r.note ?? null,
    createdAt: r.createdAt.toISOString(),
    createdBy: { id: r.createdBy.id, name: r.createdBy.name },
  };
}

export async function listFormulas(actor: Actor, opts: { q?: string } = {}): Promise<FormulaSummary[]> {
  const em = await getEm();
  const where: Record<string, unknown> = { ...inWorkspace(actor), archivedAt: null };
  if (opts.q?.trim()) where.name = { $ilike: `%${opts.q.trim().replace(/[%_\\]/g, (c) => `\\${c}`)}%` };
  const formulas = (await em.find(Formula, where, { populate: ['updatedBy'], orderBy: { updatedAt: 'desc' }, limit: 500 }));
  if (!formulas.length) return [];
  const revisions = (await em.find(FormulaRevision, {
    ...inWorkspace(actor),
    $or: formulas.map((f) => ({ formula: f.id, number: f.latestRevision })),
  }));
  const byFormula = new Map(revisions.map((r) => [r.formula.id, r]));
  return formulas.flatMap((f) => {
    const r = byFormula.get(f.id);
    if (!r) return [];
    return [{
      id: f.id,
      name: f.name,
      productClass: r.settings.productClass,
      ruleSet: r.settings.ruleSet,
      revision: f.latestRevision,
      updatedAt: f.updatedAt.toISOString(),
      updatedByName: f.updatedBy.name,
      complianceOverall: r.summary.complianceOverall,
      dangerCount: r.summary.dangerCount,
      warningCount: r.summary.warningCount,
      finishedMassG: r.summary.finishedMassG,
    }];
  });
}

async function loadFormula(actor: Actor, formulaId: string): Promise<void> {
  const em = await getEm();
  const f = await em.findOne(Formula, { ...inWorkspace(actor), id: formulaId, archivedAt: null }, { populate: ['updatedBy'] });
  if (!f) throw notFound('formula');
}

export async function getRevision(actor: Actor, formulaId: string, number: number): Promise<FormulaRevisionView> {
  const em = await getEm();
  const r = await em.findOne(FormulaRevision, { ...inWorkspace(actor), formula: formulaId, number }, { populate: ['createdBy'] });
  if (!r) throw notFound('revision');
  return toRevisionView(r);
}

/** The formula at its latest revision, with the full computation redone from the stored snapshot. */
export async function getFormula(actor: Actor, formulaId: string): Promise<FormulaDetail> {
  // One plain statement: the formula with its newest revision (revisions only ever grow) and who
  // wrote it. The editor and the label read it on every load.
  if (!isUuid(formulaId)) throw notFound('formula');
  const [r] = await sql<{
    id: string; name: string; description: string | null; number: number; revision_name: string; settings: FormulaRevisionView['settings'];
    lines: FormulaRevisionView['lines']; note: string | null; created_at: Date; created_by_id: string; created_by_name: string;
  }>(
    `select f.id, f.name, f.description, r.number, r.name as revision_name, r.settings, r.lines, r.note, r.created_at, u.id as created_by_id, u.name as created_by_name
       from formulas f
       join lateral (
         select * from formula_revisions x where x.formula_id = f.id and x.workspace_id = f.workspace_id order by x.number desc limit 1
       ) r on true
       join users u on u.id = r.created_by_id
      where f.workspace_id = $1 and f.id = $2 and f.archived_at is null`,
    [actor.workspaceId, formulaId],
    'formula-with-latest-revision',
  );
  if (!r) throw notFound('formula');
  const current: FormulaRevisionView = {
    formulaId: r.id,
    number: r.number,
    name: r.revision_name,
    settings: r.settings,
    lines: r.lines,
    note: r.note,
    createdAt: r.created_at.toISOString(),
    createdBy: { id: r.created_by_id, name: r.created_by_name },
  };
  const outcome = computeFormula(current.settings, current.lines);
  return {
    id: r.id,
    name: r.name,
    description: r.description,
    current,
    computation: outcome.ok ? outcome.computation : null,
    computationError: outcome.ok ? null : outcome.message,
  };
}

/** Newest first. */
export async function listRevisions(actor: Actor, formulaId: string): Promise<FormulaRevisionView[]> {
  await loadFormula(actor, formulaId);
  const em = await getEm();
  const rows = await em.find(FormulaRevision, { ...inWorkspace(actor), formula: formulaId }, { populate: ['createdBy'], orderBy: { number: 'desc' } });
  return rows.map(toRevisionView);
}
