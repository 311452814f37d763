import 'server-only';
/** Trial writes, shared by the server actions and the API. */
import { momentOf, type RecordedAt } from '@/lib/recorded-at';
import type { EntityManager } from '@mikro-orm/postgresql';
import { LockMode } from '@mikro-orm/core';
import { getEm, lockForTransaction } from '@/lib/db';
import { AuditEvent, Formula, FormulaRevision, Cook, CookChange, Trial, TrialStatusChange, Variant } from '@/entities';
import { describePoint, formulaAtPoint } from '@/lib/modelling/proposals';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { Conflict, ValidationFailed } from '@/lib/errors';
import { resolveLines } from '@/lib/chemistry';
import { prepareRevision } from '@/lib/formulas/mutations';
import type { RevisionLine, RevisionSummary, FormulaSettingsInput } from '@/lib/formulas/schema';
import { computeFormula } from '@/lib/formulas/compute';
import { applyFactorLevels, measureFactor, planRuns, PlanError, targetSolidsOf, variantLinesKey, type FactorLevel, type MassLine } from './plan';
import { TRIAL_STATUS_LABELS, TRIAL_TRANSITIONS, type TrialStatus } from './vocabulary';
import { cookReadingProblems, cookValues, type CookReadings, type CorrectCookInput, type CreateTrialInput, type ManualVariantInput, type CookInput, type PlanInput, type ProposalTrialInput } from './schema';

/** A, B, … Z, AA, AB, … in creation order; A is always the base. */
export function variantLabel(index: number): string {
  let n = index;
  let label = '';
  do {
    label = String.fromCharCode(65 + (n % 26)) + label;
    n = Math.floor(n / 26) - 1;
  } while (n >= 0);
  return label;
}

function summarise(settings: FormulaSettingsInput, lines: RevisionLine[]): RevisionSummary {
  const outcome = computeFormula(settings, lines);
  if (!outcome.ok) return { complianceOverall: null, dangerCount: 0, warningCount: 0, finishedMassG: null };
  const c = outcome.computation;
  return {
    complianceOverall: c.compliance.overall,
    dangerCount: c.cautions.filter((x) => x.severity === 'danger').length,
    warningCount: c.cautions.filter((x) => x.severity === 'warning').length,
    finishedMassG: c.massBalance.finishedMassG,
  };
}

async function loadTrialForUpdate(tx: EntityManager, actor: Actor, trialId: string) {
  const trial = await tx.findOne(Trial, { ...inWorkspace(actor), id: trialId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  if (!trial) throw notFound('trial');
  return trial;
}

interface ExtraVariant {
  description: string;
  settings: FormulaSettingsInput;
  lines: RevisionLine[];
}

/** Creates the trial with its base variant (the formula's revision) and, when given, more variants in the same transaction. */
export async function createTrial(
  actor: Actor,
  input: CreateTrialInput,
  extra: { variants: ExtraVariant[]; audit?: { action: string; summary: string } } = { variants: [] },
): Promise<{ trialId: string; code: string }> {
  const em = await getEm();
  const formula = await em.findOne(Formula, { ...inWorkspace(actor), id: input.formulaId, archivedAt: null });
  if (!formula) throw new ValidationFailed('Choose a base formula of this workspace.', { formulaId: ['Choose a base formula of this workspace.'] });
  const number = input.baseRevision ?? formula.latestRevision;
  const revision = await em.findOne(FormulaRevision, { ...inWorkspace(actor), formula: formula.id, number });
  if (!revision) throw new ValidationFailed('That revision does not exist.', { baseRevision: [`Formula “${formula.name}” has revisions 1 to ${formula.latestRevision}.`] });

  return em.transactional(async (tx) => {
    // Serialise numbering per workspace; the unique (workspace, number) index is the backstop.
    await lockForTransaction(tx, `trial-number:${actor.workspaceId}`);
    const last = await tx.findOne(Trial, inWorkspace(actor), { orderBy: { number: 'desc' } });
    const trial = tx.create(Trial, {
      workspace: actor.workspaceId,
      number: (last?.number ?? 0) + 1,
      title: input.title,
      question: input.question,
      owner: actor.userId,
      baseFormula: formula.id,
      baseRevision: number,
    });
    const variants = [{ description: `Base: ${formula.name}, revision ${number}`, settings: revision.settings, lines: revision.lines }, ...extra.variants];
    variants.forEach((v, position) => {
      tx.create(Variant, {
        workspace: actor.workspaceId,
        trial,
        label: variantLabel(position),
        isBase: position === 0,
        description: v.description,
        factorLevels: [],
        settings: v.settings,
        lines: v.lines,
        summary: position === 0 ? revision.summary : summarise(v.settings, v.lines),
        position,
        createdBy: actor.userId,
      });
    });
    tx.create(TrialStatusChange, { workspace: actor.workspaceId, trial, fromStatus: null, toStatus: 'planning', changedBy: actor.userId });
    if (extra.audit) {
      await tx.flush(); // the trial's id comes from the insert
      tx.create(AuditEvent, {
        workspace: actor.workspaceId, actor: actor.userId, actorName: actor.name, actorRole: actor.role,
        action: extra.audit.action, subjectType: 'trial', subjectId: trial.id, promotionRequestId: null, summary: extra.audit.summary,
      });
    }
    await tx.flush();
    return { trialId: trial.id, code: `T-${String(trial.number).padStart(3, '0')}` };
  });
}

/**
 * A trial from the optimiser's proposal: the base formula's latest revision as variant A, then the
 * proposal and the points around it, each the base formula moved to that point (lib/modelling/
 * proposals.ts). The points come from the browser; the lines are built here from the stored revision.
 */
export async function createProposalTrial(actor: Actor, input: ProposalTrialInput): Promise<{ trialId: string; code: string }> {
  const em = await getEm();
  const formula = await em.findOne(Formula, { ...inWorkspace(actor), id: input.formulaId, archivedAt: null });
  if (!formula) throw new ValidationFailed('Choose a base formula of this workspace.', { formulaId: ['Choose a base formula of this workspace.'] });
  const revision = await em.findOneOrFail(FormulaRevision, { ...inWorkspace(actor), formula: formula.id, number: formula.latestRevision });
  const base = { settings: revision.settings, lines: revision.lines };
  const variants = input.points.map((point, i) => {
    const made = formulaAtPoint(base, point);
    if (!made.ok) throw new ValidationFailed(made.message, { [`points.${i}`]: [made.message] });
    return { description: `${i === 0 ? 'Proposal' : 'Near the proposal'}: ${describePoint(point)}`, settings: made.settings, lines: made.lines };
  });
  return createTrial(actor, { title: input.title, question: input.question, formulaId: formula.id, baseRevision: formula.latestRevision }, {
    variants,
    audit: { action: 'trial.from_proposal', summary: `Trial from the optimiser's proposal on ${formula.name}, revision ${formula.latestRevision}: ${variants.length} variant(s) besides the base.` },
  });
}

export async function transitionTrial(actor: Actor, trialId: string, to: TrialStatus, note?: string, options: RecordedAt = {}): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const trial = await loadTrialForUpdate(tx, actor, trialId);
    const from = trial.status as TrialStatus;
    if (!TRIAL_TRANSITIONS[from].includes(to)) {
      throw new Conflict(`A trial that is “${TRIAL_STATUS_LABELS[from]}” cannot move to “${TRIAL_STATUS_LABELS[to]}”.`);
    }
    tx.create(TrialStatusChange, { workspace: actor.workspaceId, trial, fromStatus: trial.status, toStatus: to, note: note || null, changedBy: actor.userId, changedAt: momentOf(options) });
    trial.status = to;
    trial.updatedAt = momentOf(options);
    await tx.flush();
  });
}

function assertEditable(status: TrialStatus) {
  if (status !== 'planning' && status !== 'cooking') {
    throw new Conflict(`Variants can be changed while the trial is “${TRIAL_STATUS_LABELS.planning}” or “${TRIAL_STATUS_LABELS.cooking}”.`);
  }
}

function massLinesOf(lines: RevisionLine[]): MassLine[] {
  const resolved = resolveLines(lines.map((l) => ({ ingredient: l.ingredient, quantity: l.quantity, unit: l.unit })));
  return resolved.map((r) => ({ ingredient: r.ingredient, massG: r.massG }));
}

/**
 * Generates the planned variants from the base variant; the base gets its own factor levels recorded.
 * Runs that would repeat a variant already in the trial (same lines, same target soluble solids) are
 * skipped and named, one existing variant per repeated run, so a design's replicated centre runs are
 * all added the first time and none the second; if every run would repeat, nothing is added (422).
 */
export async function planVariants(actor: Actor, trialId: string, plan: PlanInput): Promise<{ created: string[]; skipped: string[] }> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const trial = await loadTrialForUpdate(tx, actor, trialId);
    assertEditable(trial.status as TrialStatus);
    const base = await tx.findOneOrFail(Variant, { ...inWorkspace(actor), trial: trialId, isBase: true });
    const existing = await tx.count(Variant, { trial: trialId });
    let runs;
    let baseMass: MassLine[];
    try {
      baseMass = massLinesOf(base.lines);
      const baseLevels = Object.fromEntries(plan.factors.map((f) => [f.factor, measureFactor(baseMass, f.factor, base.settings)]));
      runs = planRuns(plan.kind, plan.factors, { centrePoint: plan.centrePoint, centreRuns: plan.centreRuns, baseLevels });
      base.factorLevels = plan.factors.map((f) => {
        const half = (f.high - f.low) / 2;
        return { factor: f.factor, value: baseLevels[f.factor], coded: (baseLevels[f.factor] - (f.low + f.high) / 2) / half };
      });
    } catch (err) {
      if (err instanceof PlanError) throw new ValidationFailed(err.message, { [err.field]: [err.message] });
      throw err;
    }
    // The base is left out: a run at the base's own levels is a deliberate replicate of it.
    const active = await tx.find(Variant, { ...inWorkspace(actor), trial: trialId, removedAt: null, isBase: false }, { orderBy: { position: 'asc' } });
    const labelsByKey = new Map<string, string[]>();
    for (const v of active) {
      const key = variantLinesKey(v.lines, v.settings.targetSolidsPct);
      labelsByKey.set(key, [...(labelsByKey.get(key) ?? []), v.label]);
    }
    const skipped: string[] = [];
    const fresh: Array<{ run: (typeof runs)[number]; lines: RevisionLine[]; settings: typeof base.settings }> = [];
    for (const run of runs) {
      let scaled: MassLine[];
      try {
        scaled = applyFactorLevels(baseMass, run.levels);
      } catch (err) {
        if (err instanceof PlanError) throw new ValidationFailed(err.message, { [err.field]: [err.message] });
        throw err;
      }
      const lines: RevisionLine[] = base.lines.map((l, j) => ({ ...l, quantity: scaled[j].massG, unit: 'g' }));
      const settings = { ...base.settings, targetSolidsPct: targetSolidsOf(run.levels, base.settings.targetSolidsPct) };
      const same = labelsByKey.get(variantLinesKey(lines, settings.targetSolidsPct))?.shift();
      if (same) {
        skipped.push(same);
        continue;
      }
      fresh.push({ run, lines, settings });
    }
    if (!fresh.length) {
      const message = `These variants are already in the trial (${skipped.join(', ')}): nothing was added.`;
      throw new ValidationFailed(message, { factors: [message] });
    }
    const created = fresh.map(({ run, lines, settings }, i) => {
      const label = variantLabel(existing + i);
      tx.create(Variant, {
        workspace: actor.workspaceId,
        trial,
        label,
        isBase: false,
        description: run.description,
        factorLevels: run.levels as FactorLevel[],
        settings,
        lines,
        summary: summarise(settings, lines),
        position: existing + i,
        createdBy: actor.userId,
      });
      return label;
    });
    trial.updatedAt = new Date();
    await tx.flush();
    return { created, skipped };
  });
}

/** A hand-made variant: any lines, checked and snapshotted exactly like a formula revision. */
export async function addVariant(actor: Actor, trialId: string, input: ManualVariantInput): Promise<{ variantId: string; label: string }> {
  const em = await getEm();
  const trialCheck = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  if (!trialCheck) throw notFound('trial');
  const base = await em.findOneOrFail(Variant, { ...inWorkspace(actor), trial: trialId, isBase: true });
  const settings = input.settings ?? base.settings;
  const { stored, summary } = await prepareRevision(actor, settings, input.lines);
  return em.transactional(async (tx) => {
    const trial = await loadTrialForUpdate(tx, actor, trialId);
    assertEditable(trial.status as TrialStatus);
    const position = await tx.count(Variant, { trial: trialId });
    const label = variantLabel(position);
    const v = tx.create(Variant, {
      workspace: actor.workspaceId, trial, label, isBase: false, description: input.description, factorLevels: [],
      settings, lines: stored, summary, position, createdBy: actor.userId,
    });
    trial.updatedAt = new Date();
    await tx.flush();
    return { variantId: v.id, label };
  });
}

/** Removing keeps the row (and its cooks) for the record; the base cannot be removed. */
export async function removeVariant(actor: Actor, trialId: string, variantId: string): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const trial = await loadTrialForUpdate(tx, actor, trialId);
    const v = await tx.findOne(Variant, { ...inWorkspace(actor), trial: trialId, id: variantId, removedAt: null });
    if (!v) throw notFound('variant');
    if (v.isBase) throw new Conflict('The base variant stays: it is what the others are compared with.');
    assertEditable(trial.status as TrialStatus);
    v.removedAt = new Date();
    await tx.flush();
  });
}

export function cookColumns(m: Omit<CookInput, 'variantId'>) {
  return { cookDate: m.cookDate, ...cookValues(m) };
}

export async function recordCook(actor: Actor, trialId: string, input: CookInput): Promise<{ cookId: string }> {
  const em = await getEm();
  const trial = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  if (!trial) throw notFound('trial');
  const variant = await em.findOne(Variant, { ...inWorkspace(actor), trial: trialId, id: input.variantId, removedAt: null });
  if (!variant) throw new ValidationFailed('Choose a variant of this trial.', { variantId: ['Choose a variant of this trial.'] });
  const { variantId: _ignored, ...rest } = input;
  void _ignored;
  const m = em.create(Cook, { workspace: actor.workspaceId, variant, recordedBy: actor.userId, ...cookColumns(rest) });
  trial.updatedAt = new Date();
  await em.flush();
  return { cookId: m.id };
}

type CookColumns = ReturnType<typeof cookColumns>;

async function loadCookForChange(tx: EntityManager, actor: Actor, trialId: string, cookId: string) {
  const m = await tx.findOne(Cook, { ...inWorkspace(actor), id: cookId, variant: { trial: trialId } }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  if (!m) throw notFound('cook');
  if (m.withdrawnAt) throw new Conflict('This cook was withdrawn; it stays on record as it was. Record a new cook instead.');
  return m;
}

/**
 * Corrects a cook: the fields sent replace the stored ones, the result must still be a cook, and the
 * values replaced are kept in a measurement_changes row with the reason. A change that changes
 * nothing is refused, so the history never fills with empty corrections.
 */
export async function correctCook(actor: Actor, trialId: string, cookId: string, input: CorrectCookInput): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const m = await loadCookForChange(tx, actor, trialId, cookId);
    const { reason, ...sent } = input;
    const stored: CookColumns = { cookDate: m.cookDate, ...cookValues(m) };
    const next = cookColumns({ ...stored, ...sent } as CookReadings);
    const problems = cookReadingProblems(next);
    if (problems.length) {
      throw new ValidationFailed(problems[0].message, Object.fromEntries(problems.map((p) => [p.path, [p.message]])));
    }
    const before: Partial<CookColumns> = {};
    for (const key of Object.keys(next) as Array<keyof CookColumns>) {
      if (next[key] !== stored[key]) (before as Record<string, unknown>)[key] = stored[key];
    }
    if (!Object.keys(before).length) throw new ValidationFailed('Nothing changed: the cook already reads like that.', { readings: ['Change at least one value.'] });
    tx.create(CookChange, { workspace: actor.workspaceId, cook: m, kind: 'corrected', before, reason, changedBy: actor.userId });
    tx.assign(m, next);
    await touchTrial(tx, actor, trialId);
    await tx.flush();
  });
}

/** Withdraws a cook: it stays on record, marked, and leaves every comparison and the promotion evidence. */
export async function withdrawCook(actor: Actor, trialId: string, cookId: string, reason: string): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const m = await loadCookForChange(tx, actor, trialId, cookId);
    tx.create(CookChange, { workspace: actor.workspaceId, cook: m, kind: 'withdrawn', before: {}, reason, changedBy: actor.userId });
    m.withdrawnAt = new Date();
    await touchTrial(tx, actor, trialId);
    await tx.flush();
  });
}

async function touchTrial(tx: EntityManager, actor: Actor, trialId: string) {
  const trial = await tx.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  if (trial) trial.updatedAt = new Date();
}
