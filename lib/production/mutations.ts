import 'server-only';
/**
 * Production writes: promotion requests and decisions, the versions they create, and batch records.
 * Every step writes an audit event in the same transaction, so the trail and the change stand or
 * fall together.
 */
import { momentOf, type RecordedAt } from '@/lib/recorded-at';
import type { EntityManager } from '@mikro-orm/postgresql';
import { LockMode } from '@mikro-orm/core';
import { getEm, lockForTransaction } from '@/lib/db';
import { AuditEvent, BatchDecision, BatchRecord, Membership, Product, ProductVersion, PromotionRequest, Trial, User, Variant } from '@/entities';
import { authorizeDecision, authorizeWithdrawal, inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { Conflict, ValidationFailed } from '@/lib/errors';
import { computeFormula } from '@/lib/formulas/compute';
import { labelOfStored } from '@/lib/label/queries';
import { checkBatchAgainstSpec } from '@/lib/chemistry';
import { getTrialComparison } from '@/lib/results/trial-comparison';
import { trialCode } from '@/lib/trials/access';
import { sendMail, escapeHtml } from '@/lib/mail';
import { env } from '@/lib/env';
import { logger } from '@/lib/log';
import { costForApproval } from '@/lib/costs/queries';
import { todayIso } from '@/lib/format/dates';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import type { BatchDecisionInput, BatchRecordInput, BatchRetestInput, DecisionInput, PromotionEvidence, RequestPromotionInput } from './schema';
import { batchRecordProblems } from './schema';
import { batchStanding, checkRetest, type BatchDecisionFact } from './holds';
import { AUDIT_ACTIONS, dayOfYear, promotionCode, type AuditAction, type BatchOutcome } from './vocabulary';

async function audit(
  tx: EntityManager, actor: Actor, action: AuditAction,
  subject: { type: 'promotion_request' | 'production_formula' | 'batch_record'; id: string },
  promotionRequestId: string | null, summary: string, options: RecordedAt = {},
): Promise<void> {
  tx.create(AuditEvent, {
    workspace: actor.workspaceId, actor: actor.userId, actorName: actor.name, actorRole: actor.role,
    action, subjectType: subject.type, subjectId: subject.id, promotionRequestId, summary: `${AUDIT_ACTIONS[action]}: ${summary}`, at: momentOf(options),
  });
}

/** Mail is a courtesy: the in-app queue is the record, so a mail failure never undoes the step. */
async function notify(actor: Actor, to: string[], subject: string, lines: string[], link: string): Promise<void> {
  const url = `${env().APP_URL}${link}`;
  for (const address of to) {
    try {
      await sendMail({
        workspaceId: actor.workspaceId,
        to: address, subject,
        text: `${lines.join('\n\n')}\n\n${url}\n`,
        html: `${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('')}<p><a href="${escapeHtml(url)}">${escapeHtml(url)}</a></p>`,
      });
    } catch (err) {
      logger.warn({ err, subject }, 'notification mail failed');
    }
  }
}

function buildEvidence(comparison: Awaited<ReturnType<typeof getTrialComparison>>, variantId: string): { evidence: PromotionEvidence; computation: NonNullable<ReturnType<typeof computeOk>> } | null {
  const variant = comparison.trial.variants.find((v) => v.id === variantId);
  if (!variant) return null;
  const computation = computeOk(variant.settings, variant.lines);
  if (!computation) return null;
  return {
    computation,
    evidence: {
      trial: { code: comparison.trial.code, title: comparison.trial.title, question: comparison.trial.question },
      variant: { label: variant.label, description: variant.description, factorLevels: variant.factorLevels.map((l) => ({ factor: l.factor, value: l.value })) },
      recommendation: comparison.recommendation && comparison.recommendation.variantId === variantId
        ? { rationale: comparison.recommendation.rationale, byName: comparison.recommendation.byName, at: comparison.recommendation.at }
        : null,
      means: comparison.means,
      verdicts: comparison.sessions.flatMap((s) => s.verdicts.map((v) => ({ session: s.title, method: s.method, attribute: v.attribute, verdict: v.verdict.headline }))),
      lab: comparison.trial.variants.flatMap((v) => v.cooks.map((m) => ({
        label: v.label, cookDate: m.cookDate, ph: m.ph ?? null, brix20: m.comparison.correctedBrix ?? m.brixReading ?? null, endPointTempC: m.endPointTempC ?? null, setTestScore: m.setTestScore ?? null,
      }))),
      compliance: {
        overall: computation.compliance.overall,
        edition: computation.compliance.edition,
        failing: computation.compliance.results.filter((r) => r.status === 'fail').map((r) => `${r.title}: ${r.actual ?? '—'} (needs ${r.requirement})`),
      },
      cautions: computation.cautions.map((c) => ({ code: c.code, severity: c.severity, title: c.title })),
      predicted: {
        productClass: computation.settings.productClass,
        targetSolidsPct: computation.settings.targetSolidsPct,
        plannedPh: computation.settings.plannedPh ?? null,
        endPointC: computation.endPoint.endPointC,
        waterBoilingC: computation.endPoint.waterBoilingC,
        finishedMassG: computation.massBalance.finishedMassG,
        aw: computation.waterActivity.aw,
        preservation: computation.settings.preservation ?? null,
      },
    },
  };
}

function computeOk(settings: FormulaSettingsInput, lines: RevisionLine[]) {
  const outcome = computeFormula(settings, lines);
  return outcome.ok ? outcome.computation : null;
}

async function headsOfProduct(em: EntityManager, actor: Actor): Promise<string[]> {
  const members = await em.find(Membership, { ...inWorkspace(actor), role: 'head_of_product' }, { populate: ['user'] });
  return members.filter((m) => m.user.id !== actor.userId).map((m) => m.user.email);
}

export async function requestPromotion(actor: Actor, input: RequestPromotionInput, options: RecordedAt = {}): Promise<{ requestId: string; code: string }> {
  const em = await getEm();
  const trial = await em.findOne(Trial, { ...inWorkspace(actor), id: input.trialId });
  if (!trial) throw notFound('trial');
  const variant = await em.findOne(Variant, { ...inWorkspace(actor), trial: trial.id, id: input.variantId, removedAt: null });
  if (!variant) throw new ValidationFailed('Choose a variant of this trial.', { variantId: ['Choose a variant of this trial.'] });
  if (input.target === 'existing_product') {
    const product = await em.findOne(Product, { ...inWorkspace(actor), id: input.productId });
    if (!product) throw new ValidationFailed('Choose a product of this workspace.', { productId: ['Choose a product of this workspace.'] });
  } else if (await em.count(Product, { ...inWorkspace(actor), code: input.newProductCode! })) {
    throw new ValidationFailed('That product code is taken.', { newProductCode: ['That product code is taken: choose the existing product or another code.'] });
  }
  const built = buildEvidence(await getTrialComparison(actor, trial.id), variant.id);
  if (!built) throw new ValidationFailed('This variant’s chemistry cannot be computed; fix the formula first.', { variantId: ['This variant’s chemistry cannot be computed.'] });
  if (built.computation.compliance.overall === 'non_compliant') {
    throw new ValidationFailed('This variant fails the market rules it is set to; it cannot go to production as it stands.', {
      variantId: built.evidence.compliance.failing.length ? built.evidence.compliance.failing : ['Fails the market rules.'],
    });
  }

  const result = await em.transactional(async (tx) => {
    await lockForTransaction(tx, `promotion-number:${actor.workspaceId}`);
    if (await tx.count(PromotionRequest, { ...inWorkspace(actor), trial: trial.id, status: 'pending' })) {
      throw new Conflict('This trial already has a promotion request awaiting review: withdraw it or wait for the decision.');
    }
    const last = await tx.findOne(PromotionRequest, inWorkspace(actor), { orderBy: { number: 'desc' } });
    // Filed after a sent-back request of this trial: keep the link, so the reviewer sees what was asked for.
    const previous = await tx.findOne(PromotionRequest, { ...inWorkspace(actor), trial: trial.id }, { orderBy: { number: 'desc' } });
    const request = tx.create(PromotionRequest, {
      previousRequestId: previous?.status === 'sent_back' ? previous.id : null,
      workspace: actor.workspaceId, number: (last?.number ?? 0) + 1, trial: trial.id, variantId: variant.id, variantLabel: variant.label,
      product: input.target === 'existing_product' ? input.productId : null,
      newProductName: input.target === 'new_product' ? input.newProductName : null, newProductCode: input.target === 'new_product' ? input.newProductCode : null,
      rationale: input.rationale, process: input.process, spec: input.spec, evidence: built.evidence, status: 'pending', requestedBy: actor.userId,
      requestedAt: momentOf(options),
    });
    await tx.flush();
    await audit(tx, actor, 'promotion.requested', { type: 'promotion_request', id: request.id }, request.id,
      `${promotionCode(request.number)} for ${trialCode(trial.number)} variant ${variant.label}`, options);
    await tx.flush();
    return { requestId: request.id, code: promotionCode(request.number) };
  });

  await notify(actor, await headsOfProduct(em, actor), `Promotion ${result.code} awaits your review`, [
    `${actor.name} asks to put variant ${variant.label} of ${trialCode(trial.number)} “${trial.title}” into production.`,
    `Reason given: ${input.rationale}`,
  ], `/production/reviews/${result.requestId}`);
  return result;
}

/** The cost a version would be frozen with if this request were approved now; null when the request cannot be approved. */
async function costBeforeDecision(actor: Actor, requestId: string, day: string) {
  const em = await getEm();
  const request = await em.findOne(PromotionRequest, { ...inWorkspace(actor), id: requestId });
  if (!request || request.status !== 'pending') return null;
  const variant = await em.findOne(Variant, { ...inWorkspace(actor), id: request.variantId });
  if (!variant || variant.removedAt) return null;
  return costForApproval(actor.workspaceId, { settings: variant.settings, lines: variant.lines, trialId: request.trial.id }, day);
}

export async function decidePromotion(actor: Actor, requestId: string, input: DecisionInput, options: RecordedAt = {}): Promise<{ status: 'approved' | 'sent_back'; productVersionId: string | null }> {
  const em = await getEm();
  // Today's cost reads prices on connections of its own, so it is read before the transaction: a
  // transaction waiting for the version lock must never need a second connection from the pool.
  const frozenCost = input.decision === 'approve' ? await costBeforeDecision(actor, requestId, todayIso(momentOf(options))) : null;
  const outcome = await em.transactional(async (tx) => {
    const request = await tx.findOne(PromotionRequest, { ...inWorkspace(actor), id: requestId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!request) throw notFound('promotion request');
    const requestedById = request.requestedBy.id;
    authorizeDecision(actor, { requestedById });
    if (request.status !== 'pending') throw new Conflict(`This request was already decided (${request.status.replace('_', ' ')}).`);
    const code = promotionCode(request.number);
    request.decidedBy = tx.getReference(User, actor.userId);
    request.decidedAt = momentOf(options);
    request.decisionComment = input.comment || null;

    if (input.decision === 'send_back') {
      request.status = 'sent_back';
      await tx.flush();
      await audit(tx, actor, 'promotion.sent_back', { type: 'promotion_request', id: request.id }, request.id, `${code}: ${input.comment}`, options);
      await tx.flush();
      return { status: 'sent_back' as const, productVersionId: null, code, requestedById };
    }

    const variant = await tx.findOne(Variant, { ...inWorkspace(actor), id: request.variantId });
    if (!variant || variant.removedAt) throw new Conflict('The variant of this request was removed from the trial; send the request back.');
    const computation = computeOk(variant.settings, variant.lines);
    if (!computation) throw new Conflict('The variant’s chemistry can no longer be computed; send the request back.');

    let productId = request.product?.id ?? null;
    if (!productId) {
      if (await tx.count(Product, { ...inWorkspace(actor), code: request.newProductCode! })) {
        throw new Conflict(`The product code ${request.newProductCode} was taken since the request was made; send it back so a new code can be chosen.`);
      }
      const product = tx.create(Product, { workspace: actor.workspaceId, code: request.newProductCode!, name: request.newProductName!, createdBy: requestedById });
      await tx.flush();
      productId = product.id;
      request.product = product;
    }
    // The label is frozen with the version; one the label modules cannot compute stays null and is computed on read.
    const labelOutcome = await labelOfStored(tx, actor, variant.settings, variant.lines);
    // Serialise versioning per product; the one-current index is the backstop.
    await lockForTransaction(tx, `product-version:${productId}`);
    const current = await tx.findOne(ProductVersion, { ...inWorkspace(actor), product: productId, status: 'current' });
    const latest = await tx.findOne(ProductVersion, { ...inWorkspace(actor), product: productId }, { orderBy: { version: 'desc' } });
    const version = (latest?.version ?? 0) + 1;
    if (current) {
      current.status = 'superseded';
      current.supersededAt = momentOf(options);
      current.supersededByVersion = version;
      await tx.flush();
      await audit(tx, actor, 'version.superseded', { type: 'production_formula', id: current.id }, request.id, `v${current.version} superseded by v${version} (${code})`, options);
    }
    const { packFormatId, costAtApproval } = frozenCost ?? { packFormatId: null, costAtApproval: null };
    const created = tx.create(ProductVersion, {
      workspace: actor.workspaceId, product: productId, version, status: 'current', packFormat: packFormatId, costAtApproval,
      settings: variant.settings, lines: variant.lines, process: request.process, compliance: computation.compliance, spec: request.spec,
      label: labelOutcome.ok ? labelOutcome.label : null,
      sourceTrial: request.trial.id, sourceVariantId: variant.id, sourceVariantLabel: variant.label,
      promotionRequestId: request.id, approvedBy: actor.userId, approvedAt: momentOf(options),
    });
    await tx.flush();
    request.status = 'approved';
    request.productVersionId = created.id;
    await tx.flush();
    await audit(tx, actor, 'promotion.approved', { type: 'promotion_request', id: request.id }, request.id, `${code}${input.comment ? `: ${input.comment}` : ''}`, options);
    await audit(tx, actor, 'version.created', { type: 'production_formula', id: created.id }, request.id, `v${version} from variant ${variant.label} (${code})`, options);
    await tx.flush();
    return { status: 'approved' as const, productVersionId: created.id, code, requestedById };
  });

  const requester = await em.fork().findOne(Membership, { ...inWorkspace(actor), user: outcome.requestedById }, { populate: ['user'] });
  if (requester) {
    await notify(actor, [requester.user.email],
      outcome.status === 'approved' ? `Promotion ${outcome.code} approved` : `Promotion ${outcome.code} sent back`,
      [outcome.status === 'approved'
        ? `${actor.name} approved ${outcome.code}; it is now the production version.`
        : `${actor.name} sent ${outcome.code} back: ${input.comment}`],
      outcome.productVersionId ? `/production/versions/${outcome.productVersionId}` : `/production/reviews/${requestId}`);
  }
  return { status: outcome.status, productVersionId: outcome.productVersionId };
}

/** The requester takes back a request that is still waiting. */
export async function withdrawPromotion(actor: Actor, requestId: string, comment: string): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const request = await tx.findOne(PromotionRequest, { ...inWorkspace(actor), id: requestId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!request) throw notFound('promotion request');
    authorizeWithdrawal(actor, { requestedById: request.requestedBy.id });
    if (request.status !== 'pending') throw new Conflict('Only a request awaiting review can be withdrawn.');
    request.status = 'withdrawn';
    request.decidedBy = tx.getReference(User, actor.userId);
    request.decidedAt = new Date();
    request.decisionComment = comment || null;
    await tx.flush();
    await audit(tx, actor, 'promotion.withdrawn', { type: 'promotion_request', id: request.id }, request.id, `${promotionCode(request.number)}${comment ? `: ${comment}` : ''}`);
    await tx.flush();
  });
}

export async function recordBatch(actor: Actor, versionId: string, input: BatchRecordInput, options: RecordedAt = {}): Promise<{ batchId: string; outcome: BatchOutcome }> {
  const em = await getEm();
  const version = await em.findOne(ProductVersion, { ...inWorkspace(actor), id: versionId }, { populate: ['product'] });
  if (!version) throw notFound('production version');
  if (version.status !== 'current') throw new Conflict(`v${version.version} is superseded: record batches against the version in production.`);
  const impossible = batchRecordProblems(input, {
    today: todayIso(momentOf(options)), version: version.version, approvedOn: todayIso(version.approvedAt),
    netFillG: version.spec.netFillG, netFillToleranceG: version.spec.netFillToleranceG,
  });
  if (Object.keys(impossible).length) throw new ValidationFailed('This batch cannot have been made as entered.', impossible);

  const [prefix, dateSegment] = input.lotCode.split('-');
  const expectedSegment = `${input.batchDate.slice(2, 4)}${String(dayOfYear(input.batchDate)).padStart(3, '0')}`;
  const lotProblems: string[] = [];
  if (prefix !== version.product.code) lotProblems.push(`A lot of this product starts with ${version.product.code}.`);
  if (dateSegment !== expectedSegment) lotProblems.push(`For ${input.batchDate} the date part is ${expectedSegment} (year and day of the year).`);
  if (lotProblems.length) throw new ValidationFailed('The lot code does not match the product or the date.', { lotCode: lotProblems });

  const result = checkBatchAgainstSpec(version.spec, input);
  if (result.outcome === 'fail') {
    const fields: Record<string, string[]> = {};
    if (!input.disposition) fields.disposition = ['This batch failed a check: choose rework, hold or discard.'];
    if (!input.dispositionComment || input.dispositionComment.trim().length < 5) fields.dispositionComment = ['Say what was done or decided about the failed batch.'];
    if (Object.keys(fields).length) throw new ValidationFailed('A failed batch needs a disposition with a comment.', fields);
  } else if (input.disposition) {
    throw new ValidationFailed(
      result.outcome === 'pass' ? 'This batch passed every check; it needs no disposition.' : 'This batch is incomplete: it stays on hold until the missing checks are re-tested.',
      { disposition: [result.outcome === 'pass' ? 'A passed batch needs no disposition.' : 'An incomplete batch is held; re-test the missing checks.'] },
    );
  }
  if (await em.count(BatchRecord, { ...inWorkspace(actor), lotCode: input.lotCode })) {
    throw new ValidationFailed('That lot code is already recorded.', { lotCode: ['That lot code is already recorded: use the next batch number of the day.'] });
  }

  return em.transactional(async (tx) => {
    const batch = tx.create(BatchRecord, {
      workspace: actor.workspaceId, product: version.product.id, productVersion: version.id, lotCode: input.lotCode, batchDate: input.batchDate,
      batchSizeG: input.batchSizeG, brixReading: input.brixReading, brixSampleTempC: input.brixSampleTempC, brix20: result.correctedBrix20C,
      ph: input.ph, fillTempC: input.fillTempC, netFillMeanG: input.netFillMeanG ?? null, netFillMinG: input.netFillMinG ?? null,
      setTestScore: input.setTestScore ?? null, jarsFilled: input.jarsFilled, jarsRejected: input.jarsRejected, notes: input.notes ?? null,
      checks: result.checks, outcome: result.outcome,
      disposition: result.outcome === 'fail' ? input.disposition : null, dispositionComment: result.outcome === 'fail' ? input.dispositionComment : null,
      recordedBy: actor.userId, createdAt: momentOf(options),
    });
    await tx.flush();
    const failed = result.checks.filter((c) => c.status === 'fail').map((c) => c.label);
    const missing = result.checks.filter((c) => c.status === 'not_measured').map((c) => c.label.toLowerCase());
    await audit(tx, actor, result.outcome === 'fail' ? 'batch.failed' : result.outcome === 'incomplete' ? 'batch.incomplete' : 'batch.recorded', { type: 'batch_record', id: batch.id }, version.promotionRequestId,
      result.outcome === 'fail' ? `${input.lotCode} failed ${failed.join(', ')}; ${input.disposition}: ${input.dispositionComment}`
        : result.outcome === 'incomplete' ? `${input.lotCode} held: ${missing.join(' and ')} not measured` : `${input.lotCode} passed`, options);
    await tx.flush();
    return { batchId: batch.id, outcome: result.outcome };
  });
}

/** Locks the batch row (decisions on one batch are serialised) and works out where it stands. */
async function lockedStanding(tx: EntityManager, actor: Actor, batchId: string) {
  const batch = await tx.findOne(BatchRecord, { ...inWorkspace(actor), id: batchId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  if (!batch) throw notFound('batch');
  const version = await tx.findOneOrFail(ProductVersion, { ...inWorkspace(actor), id: batch.productVersion.id });
  const decisions: BatchDecisionFact[] = (await tx.find(BatchDecision, { ...inWorkspace(actor), batch: batch.id }, { orderBy: { createdAt: 'asc' } }))
    .map((d) => ({ kind: d.kind, readings: d.readings ?? null, checks: d.checks ?? null }));
  const readings = {
    brixReading: batch.brixReading, brixSampleTempC: batch.brixSampleTempC, ph: batch.ph, fillTempC: batch.fillTempC,
    netFillMeanG: batch.netFillMeanG, netFillMinG: batch.netFillMinG, setTestScore: batch.setTestScore,
  };
  return { batch, version, decisions, standing: batchStanding({ readings, checks: batch.checks, disposition: batch.disposition ?? null }, decisions) };
}

const NOT_HELD = { passed: 'This batch passed at recording; it is not on hold.', discarded: 'This batch was discarded at recording.', released: 'This batch was already released.', rejected: 'This batch was already rejected.' } as const;

/** New readings of a held batch, checked against the spec of the version it was made to. */
export async function retestBatch(actor: Actor, batchId: string, input: BatchRetestInput, options: RecordedAt = {}): Promise<{ decisionId: string; outcome: BatchOutcome }> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const { batch, version, decisions, standing } = await lockedStanding(tx, actor, batchId);
    if (!standing.canRetest) throw new Conflict(standing.status === 'held' ? 'This batch cannot be re-tested.' : NOT_HELD[standing.status]);
    const { comment, ...retest } = input;
    const rework = batch.disposition === 'rework'
      ? { earlierRetests: decisions.flatMap((d) => (d.kind === 'retest' && d.readings ? [d.readings] : [])) }
      : null;
    const result = checkRetest(version.spec, standing.readings, retest, rework);
    const decision = tx.create(BatchDecision, {
      workspace: actor.workspaceId, batch: batch.id, kind: 'retest', readings: retest, checks: result.checks, outcome: result.outcome, comment, decidedBy: actor.userId,
      createdAt: momentOf(options),
    });
    await tx.flush();
    const failed = result.checks.filter((c) => c.status !== 'pass').map((c) => `${c.label.toLowerCase()} ${c.status === 'fail' ? 'failed' : rework ? 'not measured since the rework' : 'not measured'}`);
    await audit(tx, actor, 'batch.retested', { type: 'batch_record', id: batch.id }, version.promotionRequestId,
      `${batch.lotCode} ${result.outcome === 'pass' ? 'passed every check' : failed.join(', ')}: ${comment}`, options);
    await tx.flush();
    return { decisionId: decision.id, outcome: result.outcome };
  });
}

/** Release (only once the latest checks pass) or reject a held batch. Final. */
export async function decideBatch(actor: Actor, batchId: string, input: BatchDecisionInput, options: RecordedAt = {}): Promise<{ decisionId: string; status: 'released' | 'rejected' }> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const { batch, version, standing } = await lockedStanding(tx, actor, batchId);
    if (standing.status !== 'held') throw new Conflict(NOT_HELD[standing.status]);
    if (input.decision === 'release' && !standing.canRelease) {
      throw new Conflict(standing.outcome === 'fail'
        ? 'The latest checks of this batch failed: re-test it after rework, or reject it.'
        : standing.staleSinceRework.length
          ? `This batch was reworked: ${standing.staleSinceRework.join(', ').toLowerCase()} ${standing.staleSinceRework.length > 1 ? 'have' : 'has'} not been measured again since. Re-test ${standing.staleSinceRework.length > 1 ? 'them' : 'it'} before release.`
          : 'A check the spec requires is still missing: re-test it before release.');
    }
    const decision = tx.create(BatchDecision, {
      workspace: actor.workspaceId, batch: batch.id, kind: input.decision, readings: null, checks: null, outcome: null, comment: input.comment, decidedBy: actor.userId,
      createdAt: momentOf(options),
    });
    await tx.flush();
    await audit(tx, actor, input.decision === 'release' ? 'batch.released' : 'batch.rejected', { type: 'batch_record', id: batch.id }, version.promotionRequestId,
      `${batch.lotCode}: ${input.comment}`, options);
    await tx.flush();
    return { decisionId: decision.id, status: input.decision === 'release' ? 'released' as const : 'rejected' as const };
  });
}
