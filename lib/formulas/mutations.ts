import 'server-only';
/** Formula writes. Every save is a new immutable revision; the formula row tracks the latest number. */
import { momentOf, type RecordedAt } from '@/lib/recorded-at';
import { LockMode } from '@mikro-orm/core';
import { getEm } from '@/lib/db';
import { Formula, FormulaRevision, User } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { Conflict, ValidationFailed, type FieldErrors } from '@/lib/errors';
import { compositionOfView, ingredientsByIds } from '@/lib/ingredients/queries';
import { chemistryFieldPath, computeFormula, normaliseQuantity } from './compute';
import type { CreateFormulaInput, FormulaLineInputData, FormulaSettingsInput, ReviseFormulaInput, RevisionLine } from './schema';

/**
 * Resolves library ingredients (of this workspace only, not archived), snapshots their
 * composition, converts kg/lb/oz to grams, and proves the formula computes.
 */
export async function prepareRevision(actor: Actor, settings: FormulaSettingsInput, lines: FormulaLineInputData[]) {
  const library = await ingredientsByIds(actor, lines.map((l) => l.ingredientId));
  const fields: FieldErrors = {};
  const stored: RevisionLine[] = [];
  lines.forEach((line, i) => {
    const ingredient = library.get(line.ingredientId);
    if (!ingredient) {
      fields[`lines.${i}.ingredientId`] = ['Choose an ingredient from this workspace’s library.'];
    } else if (ingredient.archived) {
      fields[`lines.${i}.ingredientId`] = [`${ingredient.name} is archived; restore it or pick another ingredient.`];
    } else {
      stored.push({ ingredientId: line.ingredientId, ingredient: compositionOfView(ingredient), ...normaliseQuantity(line.quantity, line.unit) });
    }
  });
  if (Object.keys(fields).length) throw new ValidationFailed('Some lines are not valid.', fields);
  const outcome = computeFormula(settings, stored);
  if (!outcome.ok) throw new ValidationFailed(outcome.message, { [chemistryFieldPath(outcome.field)]: [outcome.message] });
  const c = outcome.computation;
  const summary = {
    complianceOverall: c.compliance.overall,
    dangerCount: c.cautions.filter((x) => x.severity === 'danger').length,
    warningCount: c.cautions.filter((x) => x.severity === 'warning').length,
    finishedMassG: c.massBalance.finishedMassG,
  };
  return { stored, summary };
}

export async function createFormula(actor: Actor, input: CreateFormulaInput, options: RecordedAt = {}): Promise<{ formulaId: string; revision: number }> {
  const { stored, summary } = await prepareRevision(actor, input.settings, input.lines);
  const em = await getEm();
  return em.transactional(async (tx) => {
    const formula = tx.create(Formula, {
      workspace: actor.workspaceId,
      name: input.name,
      description: input.description ?? null,
      latestRevision: 1,
      createdBy: actor.userId,
      updatedBy: actor.userId,
      createdAt: momentOf(options), updatedAt: momentOf(options),
    });
    tx.create(FormulaRevision, {
      workspace: actor.workspaceId,
      formula,
      number: 1,
      name: input.name,
      settings: input.settings,
      lines: stored,
      note: input.note || 'First version',
      summary,
      createdBy: actor.userId,
      createdAt: momentOf(options),
    });
    await tx.flush();
    return { formulaId: formula.id, revision: 1 };
  });
}

/**
 * Saves a new revision. The formula row is locked, so two saves from the same base cannot
 * both win: the second gets 409 unless it explicitly asks to save on top (force), in which
 * case both versions remain in the history.
 */
export async function reviseFormula(actor: Actor, formulaId: string, input: ReviseFormulaInput, options: RecordedAt = {}): Promise<{ formulaId: string; revision: number }> {
  const em = await getEm();
  // 404 before 422: a formula of another workspace must not reveal whether the body was valid.
  if (!(await em.count(Formula, { ...inWorkspace(actor), id: formulaId, archivedAt: null }))) throw notFound('formula');
  const { stored, summary } = await prepareRevision(actor, input.settings, input.lines);
  return em.transactional(async (tx) => {
    const formula = await tx.findOne(Formula, { ...inWorkspace(actor), id: formulaId, archivedAt: null }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!formula) throw notFound('formula');
    // A base that was never saved is bad input, not someone else's newer save (and force cannot mend it).
    if (input.baseRevision > formula.latestRevision) {
      const message = `This formula has no revision ${input.baseRevision}; its latest is revision ${formula.latestRevision}.`;
      throw new ValidationFailed(message, { baseRevision: [message] });
    }
    if (formula.latestRevision !== input.baseRevision && !input.force) {
      const by = await tx.findOne(User, { id: formula.updatedBy.id });
      throw new Conflict(
        `${by?.name ?? 'Someone'} saved revision ${formula.latestRevision} after you opened revision ${input.baseRevision}. Your changes are not saved yet; you can save them on top, and both versions stay in the history.`,
      );
    }
    const number = formula.latestRevision + 1;
    const name = input.name ?? formula.name;
    tx.create(FormulaRevision, {
      workspace: actor.workspaceId,
      formula,
      number,
      name,
      settings: input.settings,
      lines: stored,
      note: input.note || null,
      summary,
      createdBy: actor.userId,
      createdAt: momentOf(options),
    });
    formula.latestRevision = number;
    formula.name = name;
    formula.updatedBy = tx.getReference(User, actor.userId);
    formula.updatedAt = momentOf(options);
    await tx.flush();
    return { formulaId, revision: number };
  });
}
