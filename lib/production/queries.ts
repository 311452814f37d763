import 'server-only';
/** Production reads: the review queue, products and their versions, batch records, the audit trail. */
import type { Loaded } from '@mikro-orm/core';
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { isUuid } from '@/lib/ids';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import { AuditEvent, BatchDecision, BatchRecord, Product, ProductVersion, PromotionRequest, Trial } from '@/entities';
import type { BatchDecisionEntity } from '@/entities/BatchDecision';
import type { BatchRecordEntity } from '@/entities/BatchRecord';
import type { ProductVersionEntity } from '@/entities/ProductVersion';
import type { PromotionRequestEntity } from '@/entities/PromotionRequest';
import { awaitsAnotherDecider, inWorkspace, mayDecide, mayWithdraw, notFound, type Actor } from '@/lib/permissions';
import { trialCode } from '@/lib/trials/access';
import { toCsv } from '@/lib/csv';
import { ValidationFailed } from '@/lib/errors';
import { defaultQcSpec, estimateEndPoint, outcomeOfChecks, QC_CHECK_STATUS_LABELS, qcSpecCautions, type QcSpec } from '@/lib/chemistry';
import { getTrialOverview } from '@/lib/trials/queries';
import { DEFAULT_FILL_TEMP_C, type AuditView, type ProductionProcess, type PromotionEvidence, type BatchDecisionView, type BatchSheetQuery, type BatchView, type BatchWorkItem, type ProductSummary, type PromotionDraftVariant, type PromotionResubmission, type PromotionSummary, type PromotionTargetProduct, type PromotionView, type SheetVersion, type VersionSummary, type VersionView } from './schema';
import { buildBatchSheet, sheetAmountProblem, sheetStepProblem, type BatchSheet } from './sheet';
import { fruitsOf, weighLines } from './review';
import { BATCH_OUTCOME_LABELS, BATCH_STATUS_LABELS, promotionCode, type PromotionStatus } from './vocabulary';
import { batchStanding, goodJarsOf } from './holds';

const REQUEST_POPULATE = ['trial', 'product', 'requestedBy', 'decidedBy'] as const;
type RequestRow = Loaded<PromotionRequestEntity, (typeof REQUEST_POPULATE)[number]>;

function summary(r: RequestRow): PromotionSummary {
  return summaryOf({
    id: r.id, number: r.number, status: r.status, variantLabel: r.variantLabel, trial: r.trial, product: r.product ?? null,
    newProductName: r.newProductName, newProductCode: r.newProductCode,
    requestedBy: r.requestedBy.name, requestedAt: r.requestedAt.toISOString(), decidedAt: r.decidedAt?.toISOString() ?? null,
  });
}

export async function listPromotionRequests(actor: Actor, filter: { status?: PromotionStatus } = {}): Promise<PromotionSummary[]> {
  const em = await getEm();
  const rows = (await em.find(PromotionRequest, { ...inWorkspace(actor), ...(filter.status ? { status: filter.status } : {}) }, {
    populate: REQUEST_POPULATE, orderBy: { requestedAt: 'desc' }, limit: 500,
  }));
  return rows.map(summary);
}

function toAuditView(e: { id: string; at: Date; actorName: string; actorRole: string; action: string; summary: string; subjectType: string; subjectId: string; promotionRequestId?: string | null }): AuditView {
  return {
    id: e.id, at: e.at.toISOString(), actorName: e.actorName, actorRole: e.actorRole, action: e.action, summary: e.summary,
    subjectType: e.subjectType, subjectId: e.subjectId, promotionRequestId: e.promotionRequestId ?? null,
  };
}

/** The columns of a request a summary shows, from the ORM (lists) or from one statement (a request's page). */
interface SummaryFields {
  id: string; number: number; status: PromotionStatus; variantLabel: string;
  trial: { id: string; number: number; title: string };
  product: { name: string; code: string } | null; newProductName?: string | null; newProductCode?: string | null;
  requestedBy: string; requestedAt: string; decidedAt: string | null;
}
function summaryOf(r: SummaryFields): PromotionSummary {
  return {
    id: r.id, code: promotionCode(r.number), status: r.status,
    trial: { id: r.trial.id, code: trialCode(r.trial.number), title: r.trial.title },
    variantLabel: r.variantLabel,
    productLabel: r.product ? `${r.product.name} (${r.product.code})` : `${r.newProductName} (${r.newProductCode}, new)`,
    requestedBy: r.requestedBy, requestedAt: r.requestedAt, decidedAt: r.decidedAt,
  };
}

type FormulaColumns = { settings: FormulaSettingsInput; lines: RevisionLine[] };
type RequestRecord = {
  id: string; number: number; status: PromotionStatus; variant_id: string; variant_label: string;
  new_product_name: string | null; new_product_code: string | null; rationale: string;
  process: ProductionProcess; spec: QcSpec; evidence: PromotionEvidence;
  requested_at: Date; decided_at: Date | null; decision_comment: string | null; product_version_id: string | null;
  previous: { id: string; number: number; decisionComment: string | null } | null;
  requested_by_id: string; requested_by_name: string; decided_by_name: string | null;
  trial_id: string; trial_number: number; trial_title: string;
  product_id: string | null; product_name: string | null; product_code: string | null;
  history: Array<Omit<SummaryFields, 'trial'>>;
  audit: Array<Omit<AuditView, 'promotionRequestId'> & { promotionRequestId: string | null }>;
  variant: FormulaColumns | null;
  created: (FormulaColumns & { version: number }) | null;
  versions: Array<FormulaColumns & { id: string; version: number; status: string }>;
};

/**
 * A request with everything its review page shows, in one statement scoped to the workspace: the
 * request, its trial, product and people, the trial's other requests, its audit trail, and the
 * formulas it compares (the variant, the version it created, the product's versions). As eight ORM
 * reads it was a third of the review page's server time.
 */
export async function getPromotionRequest(actor: Actor, requestId: string): Promise<PromotionView> {
  if (!isUuid(requestId)) throw notFound('promotion request');
  const [r] = await sql<RequestRecord>(
    `select r.id, r.number, r.status, r.variant_id, r.variant_label, r.new_product_name, r.new_product_code, r.rationale, r.process, r.spec, r.evidence,
            r.requested_at, r.decided_at, r.decision_comment, r.production_formula_id as product_version_id,
            r.requested_by_id, rb.name as requested_by_name, db.name as decided_by_name,
            t.id as trial_id, t.number as trial_number, t.title as trial_title,
            p.id as product_id, p.name as product_name, p.code as product_code,
            (select json_build_object('id', pr.id, 'number', pr.number, 'decisionComment', pr.decision_comment)
               from promotion_requests pr where pr.workspace_id = r.workspace_id and pr.id = r.previous_request_id) as previous,
            coalesce((select json_agg(json_build_object(
                        'id', h.id, 'number', h.number, 'status', h.status, 'variantLabel', h.variant_label,
                        'product', case when hp.id is null then null else json_build_object('name', hp.name, 'code', hp.code) end,
                        'newProductName', h.new_product_name, 'newProductCode', h.new_product_code,
                        'requestedBy', hb.name, 'requestedAt', h.requested_at, 'decidedAt', h.decided_at) order by h.number)
                        from promotion_requests h
                        join users hb on hb.id = h.requested_by_id
                        left join products hp on hp.id = h.product_id and hp.workspace_id = h.workspace_id
                       where h.workspace_id = r.workspace_id and h.trial_id = r.trial_id and h.id <> r.id), '[]') as history,
            coalesce((select json_agg(json_build_object(
                        'id', e.id, 'at', e.at, 'actorName', e.actor_name, 'actorRole', e.actor_role, 'action', e.action, 'summary', e.summary,
                        'subjectType', e.subject_type, 'subjectId', e.subject_id, 'promotionRequestId', e.promotion_request_id) order by e.at)
                        from audit_events e where e.workspace_id = r.workspace_id and e.promotion_request_id = r.id), '[]') as audit,
            (select json_build_object('settings', v.settings, 'lines', v.lines)
               from variants v where v.workspace_id = r.workspace_id and v.id = r.variant_id) as variant,
            (select json_build_object('version', c.version, 'settings', c.settings, 'lines', c.lines)
               from production_formulas c where c.workspace_id = r.workspace_id and c.id = r.production_formula_id) as created,
            coalesce((select json_agg(json_build_object('id', pv.id, 'version', pv.version, 'status', pv.status, 'settings', pv.settings, 'lines', pv.lines) order by pv.version)
                        from production_formulas pv where pv.workspace_id = r.workspace_id and pv.product_id = r.product_id), '[]') as versions
       from promotion_requests r
       join trials t on t.id = r.trial_id and t.workspace_id = r.workspace_id
       join users rb on rb.id = r.requested_by_id
       left join users db on db.id = r.decided_by_id
       left join products p on p.id = r.product_id and p.workspace_id = r.workspace_id
      where r.workspace_id = $1 and r.id = $2`,
    [actor.workspaceId, requestId],
    'promotion-request',
  );
  if (!r) throw notFound('promotion request');
  const pending = r.status === 'pending';
  const trial = { id: r.trial_id, number: r.trial_number, title: r.trial_title };
  const product = r.product_id && r.product_name !== null && r.product_code !== null ? { id: r.product_id, code: r.product_code, name: r.product_name } : null;
  const parties = { requestedById: r.requested_by_id };
  return {
    ...promotionComparison(r, product),
    ...summaryOf({
      id: r.id, number: r.number, status: r.status, variantLabel: r.variant_label, trial, product,
      newProductName: r.new_product_name, newProductCode: r.new_product_code,
      requestedBy: r.requested_by_name, requestedAt: r.requested_at.toISOString(), decidedAt: r.decided_at?.toISOString() ?? null,
    }),
    variantId: r.variant_id,
    product,
    newProduct: product ? null : { name: r.new_product_name ?? '', code: r.new_product_code ?? '' },
    rationale: r.rationale, process: r.process, spec: r.spec, evidence: r.evidence,
    requestedById: r.requested_by_id,
    decidedBy: r.decided_by_name, decisionComment: r.decision_comment, productVersionId: r.product_version_id,
    previousRequest: r.previous ? { id: r.previous.id, code: promotionCode(r.previous.number), sentBackBecause: r.previous.decisionComment ?? '' } : null,
    canDecide: pending && mayDecide(actor, parties),
    awaitsAnotherDecider: pending && awaitsAnotherDecider(actor, parties),
    canWithdraw: pending && mayWithdraw(actor, parties),
    history: r.history.map((h) => summaryOf({ ...h, trial, requestedAt: isoOfJson(h.requestedAt), decidedAt: h.decidedAt === null ? null : isoOfJson(h.decidedAt) })),
    audit: r.audit.map((e) => ({ ...e, at: isoOfJson(e.at) })),
  };
}

/** A time PostgreSQL wrote into JSON ("…+00:00") in the form every other time is sent in. */
const isoOfJson = (t: string) => new Date(t).toISOString();

/** The formula a request puts into production and the version it stands beside. */
function promotionComparison(r: RequestRecord, product: { name: string; code: string } | null): Pick<PromotionView, 'outcome' | 'formula' | 'baseline'> {
  const { created, versions } = r;
  const source = created ?? r.variant;
  const formula = source ? { settings: source.settings, lines: source.lines, weighed: weighLines(source.settings, source.lines) } : null;
  if (!product) return { outcome: { kind: 'new_product', name: r.new_product_name ?? '', code: r.new_product_code ?? '' }, formula, baseline: null };
  // A request that created its product (approved as a new product) has no earlier version to compare with.
  const before = created ? versions.filter((v) => v.version < created.version).at(-1) ?? null : versions.find((v) => v.status === 'current') ?? null;
  const current = versions.find((v) => v.status === 'current') ?? null;
  return {
    outcome: created && !before
      ? { kind: 'new_product', name: product.name, code: product.code }
      : { kind: 'existing_product', name: product.name, code: product.code, nextVersion: created?.version ?? (versions.at(-1)?.version ?? 0) + 1, currentVersion: created ? before?.version ?? null : current?.version ?? null },
    formula,
    baseline: before ? { id: before.id, version: before.version, productName: product.name, settings: before.settings, lines: before.lines } : null,
  };
}

/** Open requests for the head of product's queue, oldest first; those they made themselves are marked. */
export async function reviewQueue(actor: Actor): Promise<Array<PromotionSummary & { ownRequest: boolean }>> {
  const em = await getEm();
  const rows = (await em.find(PromotionRequest, { ...inWorkspace(actor), status: 'pending' }, { populate: REQUEST_POPULATE, orderBy: { requestedAt: 'asc' } }));
  return rows.map((r) => ({ ...summary(r), ownRequest: r.requestedBy.id === actor.userId }));
}

export async function listProducts(actor: Actor): Promise<ProductSummary[]> {
  const em = await getEm();
  const products = await em.find(Product, inWorkspace(actor), { orderBy: { name: 'asc' } });
  if (!products.length) return [];
  const ids = products.map((p) => p.id);
  const versions = (await em.find(ProductVersion, { ...inWorkspace(actor), product: { $in: ids } }, { fields: ['product', 'version', 'status', 'approvedAt'] }));
  const batches = (await em.find(BatchRecord, { ...inWorkspace(actor), product: { $in: ids } }, { fields: ['product', 'checks', 'batchDate'] }));
  return products.map((p) => {
    const mine = versions.filter((v) => v.product.id === p.id);
    const current = mine.find((v) => v.status === 'current');
    const own = batches.filter((b) => b.product.id === p.id);
    return {
      id: p.id, code: p.code, name: p.name,
      current: current ? { id: current.id, version: current.version, approvedAt: current.approvedAt.toISOString() } : null,
      versionCount: mine.length, batchCount: own.length, failedCount: own.filter((b) => outcomeOfChecks(b.checks) === 'fail').length,
      lastBatchDate: own.map((b) => b.batchDate).sort().at(-1) ?? null,
    };
  });
}

function versionSummary(v: VersionRow): VersionSummary {
  return {
    id: v.id, version: v.version, status: v.status, approvedAt: v.approvedAt.toISOString(), approvedBy: v.approvedBy.name,
    supersededAt: v.supersededAt?.toISOString() ?? null, supersededByVersion: v.supersededByVersion ?? null,
    source: { trialId: v.sourceTrial.id, trialCode: trialCode(v.sourceTrial.number), variantLabel: v.sourceVariantLabel },
    promotionRequestId: v.promotionRequestId,
  };
}

function batchView(b: BatchRow, decisionRows: DecisionRow[]): BatchView {
  const s = b.productVersion.spec;
  const decisions: BatchDecisionView[] = decisionRows.map((d) => ({
    id: d.id, kind: d.kind, readings: d.readings ?? null, checks: d.checks ?? null, outcome: d.outcome ?? null, comment: d.comment, decidedBy: d.decidedBy.name, at: d.createdAt.toISOString(),
  }));
  const standing = batchStanding({
    readings: { brixReading: b.brixReading, brixSampleTempC: b.brixSampleTempC, ph: b.ph, fillTempC: b.fillTempC, netFillMeanG: b.netFillMeanG, netFillMinG: b.netFillMinG, setTestScore: b.setTestScore },
    checks: b.checks, disposition: b.disposition ?? null,
  }, decisions);
  return {
    id: b.id, lotCode: b.lotCode, batchDate: b.batchDate, version: b.productVersion.version, versionId: b.productVersion.id, batchSizeG: b.batchSizeG,
    brixReading: b.brixReading, brixSampleTempC: b.brixSampleTempC, brix20: b.brix20, ph: b.ph, fillTempC: b.fillTempC,
    netFillMeanG: b.netFillMeanG ?? null, netFillMinG: b.netFillMinG ?? null, setTestScore: b.setTestScore ?? null, jarsFilled: b.jarsFilled, jarsRejected: b.jarsRejected,
    goodJars: goodJarsOf(standing.status, b.jarsFilled, b.jarsRejected),
    notes: b.notes ?? null, checks: b.checks, outcome: outcomeOfChecks(b.checks), disposition: b.disposition ?? null, dispositionComment: b.dispositionComment ?? null,
    recordedBy: b.recordedBy.name,
    status: standing.status, latestOutcome: standing.outcome, latestChecks: [...standing.checks],
    canRetest: standing.canRetest, canRelease: standing.canRelease, canReject: standing.canReject, staleSinceRework: standing.staleSinceRework, decisions,
    limits: { solidsMin: s.solidsMinBrix, solidsMax: s.solidsMaxBrix, phMin: s.phMin, phMax: s.phMax },
  };
}

const VERSION_POPULATE = ['product', 'sourceTrial', 'approvedBy'] as const;
const BATCH_POPULATE = ['productVersion', 'recordedBy'] as const;
type VersionRow = Loaded<ProductVersionEntity, (typeof VERSION_POPULATE)[number]>;
type BatchRow = Loaded<BatchRecordEntity, (typeof BATCH_POPULATE)[number]>;
type DecisionRow = Loaded<BatchDecisionEntity, 'decidedBy'>;

export async function getProduct(actor: Actor, productId: string): Promise<{ product: { id: string; code: string; name: string }; versions: VersionSummary[]; batches: BatchView[] }> {
  const em = await getEm();
  const p = await em.findOne(Product, { ...inWorkspace(actor), id: productId });
  if (!p) throw notFound('product');
  const versions = (await em.find(ProductVersion, { ...inWorkspace(actor), product: p.id }, { populate: VERSION_POPULATE, orderBy: { version: 'desc' } }));
  return { product: { id: p.id, code: p.code, name: p.name }, versions: versions.map(versionSummary), batches: await listBatches(actor, { productId: p.id }) };
}

export async function listBatches(actor: Actor, filter: { productId?: string; versionId?: string }): Promise<BatchView[]> {
  const em = await getEm();
  const rows = (await em.find(BatchRecord, {
    ...inWorkspace(actor), ...(filter.productId ? { product: filter.productId } : {}), ...(filter.versionId ? { productVersion: filter.versionId } : {}),
  }, { populate: BATCH_POPULATE, orderBy: { batchDate: 'asc', createdAt: 'asc' }, limit: 5000 }));
  return withDecisions(actor, rows);
}

async function withDecisions(actor: Actor, rows: BatchRow[]): Promise<BatchView[]> {
  if (!rows.length) return [];
  const em = await getEm();
  const decisions = (await em.find(BatchDecision, { ...inWorkspace(actor), batch: { $in: rows.map((r) => r.id) } }, { populate: ['decidedBy'], orderBy: { createdAt: 'asc' } }));
  return rows.map((r) => batchView(r, decisions.filter((d) => d.batch.id === r.id)));
}

/** One batch with its re-tests and decisions, the version it was made to and its spec. */
export async function getBatch(actor: Actor, batchId: string): Promise<{ batch: BatchView; product: { id: string; code: string; name: string }; spec: QcSpec; audit: AuditView[] }> {
  const em = await getEm();
  const row = (await em.findOne(BatchRecord, { ...inWorkspace(actor), id: batchId }, { populate: [...BATCH_POPULATE, 'product'] }));
  if (!row) throw notFound('batch');
  const [batch] = await withDecisions(actor, [row]);
  const events = await em.find(AuditEvent, { ...inWorkspace(actor), subjectId: row.id }, { orderBy: { at: 'asc' } });
  return { batch, product: { id: row.product.id, code: row.product.code, name: row.product.name }, spec: row.productVersion.spec, audit: events.map(toAuditView) };
}

/** Lot codes already used for a product, so the batch form can propose the next free batch of a day. */
export async function takenLotCodes(actor: Actor, productId: string): Promise<string[]> {
  const em = await getEm();
  const rows = await em.find(BatchRecord, { ...inWorkspace(actor), product: productId }, { fields: ['lotCode'] });
  return rows.map((r) => r.lotCode);
}

export async function getProductionVersion(actor: Actor, versionId: string): Promise<VersionView> {
  const em = await getEm();
  const v = (await em.findOne(ProductVersion, { ...inWorkspace(actor), id: versionId }, { populate: VERSION_POPULATE }));
  if (!v) throw notFound('production version');
  const events = await em.find(AuditEvent, { ...inWorkspace(actor), $or: [{ subjectId: v.id }, { promotionRequestId: v.promotionRequestId }] }, { orderBy: { at: 'asc' } });
  return {
    ...versionSummary(v),
    product: { id: v.product.id, code: v.product.code, name: v.product.name },
    settings: v.settings, lines: v.lines, process: v.process, compliance: v.compliance, spec: v.spec, trialTitle: v.sourceTrial.title,
    audit: events.map(toAuditView),
    batches: await listBatches(actor, { versionId: v.id }),
  };
}

/**
 * What the batch sheet needs of a version: one read of the version with its product. Not
 * getProductionVersion, whose audit trail and batches (three more round trips) the sheet never shows.
 */
export async function getSheetVersion(actor: Actor, versionId: string): Promise<SheetVersion> {
  const em = await getEm();
  const v = await em.findOne(ProductVersion, { ...inWorkspace(actor), id: versionId }, { populate: ['product'] });
  if (!v) throw notFound('production version');
  return {
    id: v.id, version: v.version, status: v.status, product: { id: v.product.id, code: v.product.code, name: v.product.name },
    settings: v.settings, lines: v.lines, process: v.process, spec: v.spec,
  };
}

export async function getBatchSheet(actor: Actor, versionId: string, query: BatchSheetQuery): Promise<{ version: SheetVersion; sheet: BatchSheet }> {
  const version = await getSheetVersion(actor, versionId);
  const tooSmallOrLarge = sheetAmountProblem(version, query);
  if (tooSmallOrLarge) throw new ValidationFailed(tooSmallOrLarge, { amount: [tooSmallOrLarge] });
  const tooCoarse = sheetStepProblem(version, query);
  if (tooCoarse) throw new ValidationFailed(tooCoarse, { step: [tooCoarse] });
  const sheet = buildBatchSheet({
    productName: version.product.name, productCode: version.product.code, version: version.version,
    settings: version.settings, lines: version.lines, process: version.process, spec: version.spec,
  }, query);
  return { version, sheet };
}

export async function listAuditEvents(actor: Actor, options: { limit?: number } = {}): Promise<AuditView[]> {
  const em = await getEm();
  const rows = await em.find(AuditEvent, inWorkspace(actor), { orderBy: { at: 'desc' }, limit: Math.min(options.limit ?? 500, 2000) });
  return rows.map(toAuditView);
}

/** Products to promote a new version of, each with the product class and fruit of its version in production. */
export async function listPromotableProducts(actor: Actor): Promise<PromotionTargetProduct[]> {
  const em = await getEm();
  const rows = await em.find(Product, inWorkspace(actor), { orderBy: { name: 'asc' } });
  if (!rows.length) return [];
  const versions = (await em.find(ProductVersion, { ...inWorkspace(actor), product: { $in: rows.map((p) => p.id) } }, {
    fields: ['product', 'version', 'status', 'settings', 'lines'],
  }));
  return rows.map((p) => {
    const mine = versions.filter((v) => v.product.id === p.id);
    const current = mine.find((v) => v.status === 'current');
    return {
      id: p.id, code: p.code, name: p.name,
      current: current ? { version: current.version, productClass: current.settings.productClass, fruits: fruitsOf(current.lines) } : null,
      nextVersion: Math.max(0, ...mine.map((v) => v.version)) + 1,
    };
  });
}

export async function batchesCsv(actor: Actor, productId: string): Promise<{ csv: string; filename: string }> {
  const { product, batches } = await getProduct(actor, productId);
  const check = (b: BatchView, key: string) => { const c = b.checks.find((x) => x.key === key); return c ? QC_CHECK_STATUS_LABELS[c.status] : ''; };
  const csv = toCsv(batches, [
    { header: 'lot_code', value: (b) => b.lotCode },
    { header: 'batch_date', value: (b) => b.batchDate },
    { header: 'version', value: (b) => b.version },
    { header: 'batch_size_g', value: (b) => b.batchSizeG },
    { header: 'brix_reading', value: (b) => b.brixReading },
    { header: 'brix_sample_temp_c', value: (b) => b.brixSampleTempC },
    { header: 'brix_20c', value: (b) => b.brix20 },
    { header: 'solids_min', value: (b) => b.limits.solidsMin },
    { header: 'solids_max', value: (b) => b.limits.solidsMax },
    { header: 'ph', value: (b) => b.ph },
    { header: 'ph_min', value: (b) => b.limits.phMin },
    { header: 'ph_max', value: (b) => b.limits.phMax },
    { header: 'fill_temp_c', value: (b) => b.fillTempC },
    { header: 'net_fill_mean_g', value: (b) => b.netFillMeanG },
    { header: 'net_fill_min_g', value: (b) => b.netFillMinG },
    { header: 'set_test_score', value: (b) => b.setTestScore },
    { header: 'jars_filled', value: (b) => b.jarsFilled },
    { header: 'jars_rejected', value: (b) => b.jarsRejected },
    { header: 'solids_check', value: (b) => check(b, 'solids') },
    { header: 'ph_check', value: (b) => check(b, 'ph') },
    { header: 'fill_check', value: (b) => check(b, 'fill_temperature') },
    { header: 'net_fill_check', value: (b) => check(b, 'net_fill') },
    { header: 'set_check', value: (b) => check(b, 'set') },
    { header: 'outcome', value: (b) => BATCH_OUTCOME_LABELS[b.outcome] },
    { header: 'status', value: (b) => BATCH_STATUS_LABELS[b.status] },
    { header: 'latest_outcome', value: (b) => BATCH_OUTCOME_LABELS[b.latestOutcome] },
    { header: 'disposition', value: (b) => b.disposition },
    { header: 'disposition_comment', value: (b) => b.dispositionComment },
    { header: 'recorded_by', value: (b) => b.recordedBy },
    { header: 'notes', value: (b) => b.notes },
  ]);
  return { csv, filename: `${product.code}-batches.csv` };
}

/** What the request form starts from: each variant's default spec and process, and the recommendation. */
export async function getPromotionDraft(actor: Actor, trialId: string): Promise<{
  trial: { id: string; code: string; title: string };
  variants: PromotionDraftVariant[];
  recommendedVariantId: string | null;
  recommendationRationale: string | null;
  products: PromotionTargetProduct[];
  pending: PromotionSummary | null;
  resubmission: PromotionResubmission | null;
}> {
  const trial = await getTrialOverview(actor, trialId);
  const em = await getEm();
  const row = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  const variants = trial.variants.map((v): PromotionDraftVariant => {
    const c = v.computation;
    const fruits = fruitsOf(v.lines);
    if (!c) return { id: v.id, label: v.label, description: v.description, complianceOverall: null, productClass: v.settings.productClass, preservation: v.settings.preservation ?? null, fruits, defaults: null };
    const spec = defaultQcSpec(c);
    return {
      id: v.id, label: v.label, description: v.description, complianceOverall: c.compliance.overall, productClass: c.settings.productClass, preservation: c.settings.preservation ?? null, fruits,
      defaults: {
        spec,
        process: { endPointSeaLevelC: Math.round(estimateEndPoint({ targetSolidsPct: c.settings.targetSolidsPct }).endPointC * 10) / 10, fillTempC: DEFAULT_FILL_TEMP_C, cookNotes: '' },
        cautions: qcSpecCautions(spec, c.settings.productClass, c.settings.preservation),
      },
    };
  });
  const pending = (await listPromotionRequests(actor, { status: 'pending' })).find((p) => p.trial.id === trialId) ?? null;
  return {
    trial: { id: trial.id, code: trial.code, title: trial.title },
    variants,
    recommendedVariantId: row?.recommendedVariantId ?? null,
    recommendationRationale: row?.recommendationRationale ?? null,
    products: await listPromotableProducts(actor),
    pending,
    resubmission: pending ? null : await resubmissionOf(actor, trialId),
  };
}

/**
 * The trial's latest request when it was sent back: a new request is filed after it (the mutation links
 * them), and the form starts from what it asked for.
 */
async function resubmissionOf(actor: Actor, trialId: string): Promise<PromotionResubmission | null> {
  const em = await getEm();
  const last = await em.findOne(PromotionRequest, { ...inWorkspace(actor), trial: trialId }, { orderBy: { number: 'desc' } });
  if (!last || last.status !== 'sent_back') return null;
  return {
    id: last.id, code: promotionCode(last.number), sentBackBecause: last.decisionComment ?? '',
    variantId: last.variantId, productId: last.product?.id ?? null, newProductName: last.newProductName ?? null, newProductCode: last.newProductCode ?? null,
    rationale: last.rationale, process: last.process, spec: last.spec,
  };
}

/** The kitchen's worklist: batches still on hold (not yet released or rejected), and the batches recorded today. */
export async function batchWorklist(actor: Actor, today: string): Promise<{ held: BatchWorkItem[]; today: BatchWorkItem[] }> {
  const em = await getEm();
  // Candidates: anything that was not a plain pass at recording, and today's batches; where each stands comes from its decisions.
  const rows = (await em.find(
    BatchRecord,
    { ...inWorkspace(actor), $or: [{ outcome: { $ne: 'pass' } }, { batchDate: today }] },
    { populate: [...BATCH_POPULATE, 'product'], orderBy: { batchDate: 'desc', createdAt: 'desc' }, limit: 200 },
  ));
  const views = await withDecisions(actor, rows);
  const items = views.map((v, i) => ({
    id: v.id, lotCode: v.lotCode, batchDate: v.batchDate, productId: rows[i].product.id, productName: rows[i].product.name,
    status: v.status, latestOutcome: v.latestOutcome,
  }));
  return { held: items.filter((b) => b.status === 'held'), today: items.filter((b) => b.batchDate === today) };
}
