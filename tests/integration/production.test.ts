/** Promotion to production through the real handlers: the four-eyes rule, immutable versions, superseding, batch checks, the audit trail. */
import { describe, it, expect, beforeAll } from 'vitest';
import { asCaller, createWorkspace, callRoute, actorOf, waitForMail, type WorkspaceFixture, type Caller } from './harness';
import { recordBatchAction } from '@/lib/production/actions';
import { strawberryJamInput } from './fixtures';
import { createApprovedVersion, createPromotableTrial, freshProductCode, promotionInput } from './production-fixtures';
import * as promotionsRoute from '@/app/api/v1/promotions/route';
import * as promotionRoute from '@/app/api/v1/promotions/[requestId]/route';
import * as decisionRoute from '@/app/api/v1/promotions/[requestId]/decision/route';
import * as withdrawRoute from '@/app/api/v1/promotions/[requestId]/withdraw/route';
import * as productRoute from '@/app/api/v1/products/[productId]/route';
import * as productsRoute from '@/app/api/v1/products/route';
import * as batchesCsvRoute from '@/app/api/v1/products/[productId]/batches.csv/route';
import * as versionRoute from '@/app/api/v1/production-versions/[versionId]/route';
import * as sheetRoute from '@/app/api/v1/production-versions/[versionId]/batch-sheet/route';
import * as batchesRoute from '@/app/api/v1/production-versions/[versionId]/batches/route';
import * as auditRoute from '@/app/api/v1/audit/route';
import * as batchRoute from '@/app/api/v1/batches/[batchId]/route';
import * as retestsRoute from '@/app/api/v1/batches/[batchId]/retests/route';
import * as batchDecisionRoute from '@/app/api/v1/batches/[batchId]/decision/route';
import { getEm } from '@/lib/db';
import { AuditEvent, BatchDecision, BatchRecord, Membership, ProductVersion, PromotionRequest } from '@/entities';
import { createFormula } from '@/lib/formulas/mutations';
import { createTrial } from '@/lib/trials/mutations';
import { listVariants } from '@/lib/trials/queries';
import { computeFormula } from '@/lib/formulas/compute';
import { scaleFormula } from '@/lib/chemistry';
import { toChemistrySettings } from '@/lib/formulas/compute';
import { lotCodeFor } from '@/lib/production/vocabulary';
import { diffRevisions } from '@/lib/formulas/diff';
import { getPromotionDraft } from '@/lib/production/queries';

let a: WorkspaceFixture;
const as = (role: keyof WorkspaceFixture['people']): Caller => ({ kind: 'session', person: a.people[role] });
const tokenOf = (role: keyof WorkspaceFixture['people']): Caller => ({ kind: 'token', person: a.people[role] });

beforeAll(async () => {
  a = await createWorkspace('Production');
});

async function newRequest() {
  const { trialId, variantId } = await createPromotableTrial(a);
  const code = freshProductCode();
  const input = await promotionInput(a, trialId, variantId, { code });
  const res = await callRoute(promotionsRoute.POST, { method: 'POST', path: '/api/v1/promotions', caller: as('developer'), body: input });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { requestId: res.body.requestId as string, trialId, variantId, code, input };
}

const decide = (caller: Caller, requestId: string, body: unknown) =>
  callRoute(decisionRoute.POST, { method: 'POST', path: '', caller, params: { requestId }, body });
const sql = async (query: string, params: unknown[] = []) => (await getEm()).getConnection().execute(query, params);

describe('requesting promotion', () => {
  it('captures the evidence, queues the request and e-mails the head of product', async () => {
    const { requestId } = await newRequest();
    const res = await callRoute(promotionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { requestId } });
    expect(res.status).toBe(200);
    const p = res.body.promotion;
    expect(p.status).toBe('pending');
    expect(p.code).toMatch(/^PR-\d{3}$/);
    expect(p.evidence.trial.code).toMatch(/^T-\d{3}$/);
    expect(p.evidence.variant.label).toBe('A');
    expect(p.evidence.compliance.overall).toBe('compliant');
    // The fixture jam targets 65 %: the sucrose table gives 103.9 °C at sea level (Cruess & McNair, quoted in Lowe).
    expect(p.evidence.predicted.endPointC).toBeCloseTo(103.9, 1);
    expect(p.canDecide).toBe(true);
    expect(p.audit.map((e: any) => e.action)).toEqual(['promotion.requested']);
    const mail = await waitForMail(a.people.head_of_product.email);
    expect(mail.subject).toMatch(/^Promotion PR-\d{3} awaits your review$/);
    expect(mail.text).toContain(`/production/reviews/${requestId}`);
  });

  it('refuses a second open request for the same trial (409) and leaves one row', async () => {
    const { trialId, input } = await newRequest();
    const again = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: { ...input, newProductCode: freshProductCode() } });
    expect(again.status).toBe(409);
    expect(await (await getEm()).fork().count(PromotionRequest, { trial: trialId })).toBe(1);
  });

  it('refuses a variant that fails its market rules, with the failing rule named (422)', async () => {
    const dev = actorOf(a, 'developer');
    // Council Directive 2001/113/EC Annex I: jam at least 60 % soluble solids; 55 % fails.
    const base = await strawberryJamInput(a);
    const { formulaId } = await createFormula(dev, { ...base, name: 'Too runny', settings: { ...base.settings, targetSolidsPct: 55 } });
    const { trialId } = await createTrial(dev, { title: 'Low solids', question: 'Does 55 % pass?', formulaId });
    const [v] = await listVariants(dev, trialId);
    const spec = { solidsMinBrix: 54, solidsMaxBrix: 56, phMin: 2.9, phMax: 3.3, minFillTempC: 85, netFillG: 340, netFillToleranceG: 10.2, setMinScore: 3, setDescription: 'Soft set', shelfLifeMonths: 6, storageNotes: 'Refrigerate after opening.' };
    const body = { trialId, variantId: v.id, target: 'new_product', newProductName: 'Runny jam', newProductCode: freshProductCode(), rationale: 'Trying a softer set.', process: { endPointSeaLevelC: 103, fillTempC: 88, cookNotes: '' } };
    const res = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: { ...body, spec } });
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(res.body.error.fields.variantId.join(' ')).toMatch(/Soluble dry matter: 55 %.*needs ≥ 60 %/);
    expect(await (await getEm()).fork().count(PromotionRequest, { trial: trialId })).toBe(0);
  });

  it('refuses a request that does not say where the variant goes (422), and stores nothing', async () => {
    const { trialId, variantId } = await createPromotableTrial(a);
    const input = await promotionInput(a, trialId, variantId, { code: freshProductCode() });
    const untargeted: Record<string, unknown> = { ...input };
    delete untargeted.target;
    const missing = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: untargeted });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields.target.join(' ')).toMatch(/new product or a new version/);
    // "A new version" without naming the product is no choice either.
    const bare: Record<string, unknown> = { ...input, target: 'existing_product' };
    delete bare.newProductName;
    delete bare.newProductCode;
    const noProduct = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: bare });
    expect(noProduct.status).toBe(422);
    expect(noProduct.body.error.fields.productId.join(' ')).toMatch(/Choose the product/);
    expect(await (await getEm()).fork().count(PromotionRequest, { trial: trialId })).toBe(0);
  });

  it('refuses a QC spec above pH 4.6 with a clear message and stores nothing', async () => {
    const { trialId, variantId } = await createPromotableTrial(a);
    const input = await promotionInput(a, trialId, variantId, { code: freshProductCode() });
    const res = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: { ...input, spec: { ...input.spec, phMax: 4.8 } } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields['spec.phMax'].join(' ')).toMatch(/4\.6/);
    expect(await (await getEm()).fork().count(PromotionRequest, { trial: trialId })).toBe(0);
  });
});

describe('who may decide', () => {
  it('a developer, an admin and production cannot approve (403); nothing changes', async () => {
    const { requestId } = await newRequest();
    for (const role of ['developer', 'admin', 'production'] as const) {
      const res = await decide(as(role), requestId, { decision: 'approve' });
      expect(res.status, role).toBe(403);
    }
    const row = await (await getEm()).fork().findOneOrFail(PromotionRequest, { id: requestId });
    expect(row.status).toBe('pending');
    expect(await (await getEm()).fork().count(ProductVersion, { promotionRequestId: requestId })).toBe(0);
  });

  it('nobody approves their own request, even after becoming head of product', async () => {
    const { requestId } = await newRequest();
    const em = (await getEm()).fork();
    const m = await em.findOneOrFail(Membership, { workspace: a.workspaceId, user: a.people.developer.userId });
    m.role = 'head_of_product';
    await em.flush();
    try {
      const res = await decide(as('developer'), requestId, { decision: 'approve' });
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/own request/);
      const view = await callRoute(promotionRoute.GET, { method: 'GET', path: '', caller: as('developer'), params: { requestId } });
      expect(view.body.promotion.canDecide).toBe(false);
    } finally {
      m.role = 'developer';
      await em.flush();
    }
    expect((await (await getEm()).fork().findOneOrFail(PromotionRequest, { id: requestId })).status).toBe('pending');
  });

  it('a re-submission starts from the sent-back request and is linked to it, with the reason on its review', async () => {
    const { trialId, variantId } = await createPromotableTrial(a);
    const code = freshProductCode();
    const typed = { ...(await promotionInput(a, trialId, variantId, { code, name: 'Resubmitted jam' })), rationale: 'Best liking; the set held after a week.' };
    typed.spec = { ...typed.spec, phMax: typed.spec.phMin + 0.3, storageNotes: 'Cool and dark.' };
    const first = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: typed });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const firstView = (await callRoute(promotionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { requestId: first.body.requestId } })).body.promotion;
    expect(firstView.previousRequest).toBeNull();
    expect((await getPromotionDraft(actorOf(a, 'developer'), trialId)).resubmission).toBeNull();
    expect((await decide(as('head_of_product'), first.body.requestId, { decision: 'send_back', comment: 'Say how the set was tested.' })).status).toBe(200);

    const draft = await getPromotionDraft(actorOf(a, 'developer'), trialId);
    expect(draft.resubmission).toMatchObject({
      id: first.body.requestId, sentBackBecause: 'Say how the set was tested.', variantId, productId: null,
      newProductName: 'Resubmitted jam', newProductCode: code, rationale: typed.rationale, process: typed.process, spec: typed.spec,
    });
    const second = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: { ...typed, rationale: `${typed.rationale} Set tested by the tilt test.` } });
    expect(second.status, JSON.stringify(second.body)).toBe(201);
    expect((await (await getEm()).fork().findOneOrFail(PromotionRequest, { id: second.body.requestId })).previousRequestId).toBe(first.body.requestId);
    const view = (await callRoute(promotionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { requestId: second.body.requestId } })).body.promotion;
    expect(view.previousRequest).toEqual({ id: first.body.requestId, code: firstView.code, sentBackBecause: 'Say how the set was tested.' });
    // Pending again: nothing to start from while it waits.
    expect((await getPromotionDraft(actorOf(a, 'developer'), trialId)).resubmission).toBeNull();
  });

  it('sending back needs a comment, is kept in the history, and the trial can be requested again', async () => {
    const { requestId, trialId, variantId } = await newRequest();
    expect((await decide(as('head_of_product'), requestId, { decision: 'send_back' })).status).toBe(422);
    const res = await decide(as('head_of_product'), requestId, { decision: 'send_back', comment: 'Tighten the pH window to 3.0–3.2.' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.status).toBe('sent_back');
    // Decided once: a second decision is a conflict.
    expect((await decide(as('head_of_product'), requestId, { decision: 'approve' })).status).toBe(409);
    const second = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: await promotionInput(a, trialId, variantId, { code: freshProductCode() }) });
    expect(second.status, JSON.stringify(second.body)).toBe(201);
    const view = (await callRoute(promotionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { requestId: second.body.requestId } })).body.promotion;
    expect(view.history.map((h: any) => [h.id, h.status])).toEqual([[requestId, 'sent_back']]);
    // The history and the audit trail (read as JSON inside one statement) carry the same fields and
    // ISO times as every other view.
    const [earlier] = view.history;
    expect(earlier).toMatchObject({ trial: view.trial, variantLabel: view.variantLabel, requestedBy: view.requestedBy });
    expect(earlier.code).toMatch(/^PR-\d{3}$/);
    expect(earlier.requestedAt).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
    expect(earlier.decidedAt).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
    expect(view.audit.map((e: any) => e.at)).toEqual(view.audit.map((e: any) => new Date(e.at).toISOString()));
    expect(view.audit.map((e: any) => e.promotionRequestId)).toEqual(view.audit.map(() => second.body.requestId));
    const code = (await (await getEm()).fork().findOneOrFail(PromotionRequest, { id: requestId })).number;
    const sentBackMail = await waitForMail(a.people.developer.email, 5000, `Promotion PR-${String(code).padStart(3, '0')} sent back`);
    expect(sentBackMail.text).toContain('Tighten the pH window');
  });

  it('the requester can withdraw a waiting request; others cannot', async () => {
    const { requestId } = await newRequest();
    expect((await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: as('admin'), params: { requestId }, body: {} })).status).toBe(403);
    const res = await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: as('developer'), params: { requestId }, body: { comment: 'Re-cooking first.' } });
    expect(res.status).toBe(200);
    expect((await decide(as('head_of_product'), requestId, { decision: 'approve' })).status).toBe(409);
  });
});

describe('approval and the production version', () => {
  it('creates an immutable snapshot with the spec, process and compliance, and audits every step', async () => {
    const { requestId, variantId, input } = await newRequest();
    const res = await decide(as('head_of_product'), requestId, { decision: 'approve', comment: 'Good evidence.' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const versionId = res.body.productVersionId;
    const v = (await callRoute(versionRoute.GET, { method: 'GET', path: '', caller: as('production'), params: { versionId } })).body.version;
    expect(v.version).toBe(1);
    expect(v.status).toBe('current');
    expect(v.source.variantLabel).toBe('A');
    expect(v.spec).toEqual(input.spec);
    expect(v.process).toEqual(input.process);
    expect(v.compliance.overall).toBe('compliant');
    const variant = (await listVariants(actorOf(a, 'developer'), (await (await getEm()).fork().findOneOrFail(PromotionRequest, { id: requestId }, { populate: ['trial'] })).trial.id)).find((x) => x.id === variantId)!;
    expect(v.lines).toEqual(variant.lines);
    expect(v.audit.map((e: any) => e.action)).toEqual(['promotion.requested', 'promotion.approved', 'version.created']);
    const number = (await (await getEm()).fork().findOneOrFail(PromotionRequest, { id: requestId })).number;
    const approvedMail = await waitForMail(a.people.developer.email, 5000, `Promotion PR-${String(number).padStart(3, '0')} approved`);
    expect(approvedMail.text).toContain(`/production/versions/${versionId}`);
  });

  it('nobody can edit or delete it: the API answers 409 and the database refuses', async () => {
    const { versionId } = await createApprovedVersion(a);
    for (const role of ['admin', 'developer', 'head_of_product', 'production'] as const) {
      for (const [handler, method] of [[versionRoute.PATCH, 'PATCH'], [versionRoute.PUT, 'PUT'], [versionRoute.DELETE, 'DELETE']] as const) {
        const res = await callRoute(handler, { method, path: '', caller: as(role), params: { versionId }, body: method === 'DELETE' ? undefined : { spec: { phMax: 4 } } });
        expect(res.status, `${role} ${method}`).toBe(409);
      }
    }
    const before = (await sql('select to_jsonb(p) as row from production_formulas p where id = ?', [versionId]))[0].row;
    await expect(sql(`update production_formulas set spec = jsonb_set(spec, '{phMax}', '4.0') where id = ?`, [versionId])).rejects.toThrow(/immutable/);
    await expect(sql(`update production_formulas set status = 'superseded' where id = ?`, [versionId])).rejects.toThrow(/immutable/);
    await expect(sql('delete from production_formulas where id = ?', [versionId])).rejects.toThrow(/cannot be deleted/);
    const after = (await sql('select to_jsonb(p) as row from production_formulas p where id = ?', [versionId]))[0].row;
    expect(after).toEqual(before);
  });

  it('a new version of the same product supersedes the previous one, which keeps its content and history', async () => {
    const first = await createApprovedVersion(a);
    const v1Before = (await callRoute(versionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { versionId: first.versionId } })).body.version;
    const productId = v1Before.product.id;
    const second = await createApprovedVersion(a, { productId });
    const v1 = (await callRoute(versionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { versionId: first.versionId } })).body.version;
    const v2 = (await callRoute(versionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { versionId: second.versionId } })).body.version;
    expect(v2.version).toBe(2);
    expect(v2.status).toBe('current');
    expect(v1.status).toBe('superseded');
    expect(v1.supersededByVersion).toBe(2);
    for (const key of ['lines', 'settings', 'spec', 'process', 'compliance', 'approvedAt', 'approvedBy', 'promotionRequestId'] as const) expect(v1[key]).toEqual(v1Before[key]);
    expect(v1.audit.map((e: any) => e.action)).toContain('version.superseded');
    const product = (await callRoute(productRoute.GET, { method: 'GET', path: '', caller: as('production'), params: { productId } })).body;
    expect(product.versions.map((x: any) => [x.version, x.status])).toEqual([[2, 'current'], [1, 'superseded']]);
    // A superseded version takes no new batches.
    const late = await callRoute(batchesRoute.POST, { method: 'POST', path: '', caller: as('production'), params: { versionId: first.versionId }, body: goodBatch(product.product.code, '2026-11-20', 1) });
    expect(late.status).toBe(409);
  });
});

describe('what the head of product reviews', () => {
  it('the formula lines in grams and % of the batch, the version in production beside them, and what approval does', async () => {
    const first = await createApprovedVersion(a);
    const productId = (await callRoute(versionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { versionId: first.versionId } })).body.version.product.id;
    const dev = actorOf(a, 'developer');
    const base = await strawberryJamInput(a);
    // Variant with 900 g sugar instead of 1000 g: the one line that changes.
    const { formulaId } = await createFormula(dev, { ...base, name: 'Less sugar', lines: base.lines.map((l, i) => (i === 1 ? { ...l, quantity: 900 } : l)) });
    const { trialId } = await createTrial(dev, { title: 'Less sugar', question: 'Does 900 g still set?', formulaId });
    const [v] = await listVariants(dev, trialId);
    const input = await promotionInput(a, trialId, v.id, { productId });
    const created = await callRoute(promotionsRoute.POST, { method: 'POST', path: '', caller: as('developer'), body: input });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const p = (await callRoute(promotionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { requestId: created.body.requestId } })).body.promotion;
    expect(p.outcome).toEqual({ kind: 'existing_product', name: 'Fixture strawberry jam', code: first.productCode, nextVersion: 2, currentVersion: 1 });
    // Hand computation: charge 1000 + 900 + 6 + 5.5 = 1911.5 g; strawberry 1000 / 1911.5 = 52.31 %.
    expect(p.formula.weighed.totalChargeG).toBeCloseTo(1911.5, 9);
    expect(p.formula.weighed.lines.map((l: any) => l.grams)).toEqual([1000, 900, 6, 5.5]);
    expect(p.formula.weighed.lines[0].pctOfBatch).toBeCloseTo(100_000 / 1911.5, 9);
    expect(p.baseline.version).toBe(1);
    const diff = diffRevisions(
      { formulaId: '', number: 1, name: 'x', settings: p.baseline.settings, lines: p.baseline.lines, note: null, createdAt: '', createdBy: { id: '', name: '' } },
      { formulaId: '', number: 2, name: 'x', settings: p.formula.settings, lines: p.formula.lines, note: null, createdAt: '', createdBy: { id: '', name: '' } },
    );
    expect(diff.lines.map((l) => l.status)).toEqual(['unchanged', 'changed', 'unchanged', 'unchanged']);
  });

  it('a new product has nothing to compare with and becomes version 1', async () => {
    const { requestId } = await newRequest();
    const p = (await callRoute(promotionRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { requestId } })).body.promotion;
    expect(p.outcome.kind).toBe('new_product');
    expect(p.baseline).toBeNull();
    expect(p.formula.weighed.lines).toHaveLength(4);
  });
});

function goodBatch(code: string, date: string, n: number, overrides: Record<string, unknown> = {}) {
  return { lotCode: lotCodeFor(code, date, n), batchDate: date, batchSizeG: 40_000, brixReading: 65.2, brixSampleTempC: 20, ph: 3.1, fillTempC: 88, netFillMeanG: 342, netFillMinG: 336, setTestScore: 4, jarsFilled: 96, jarsRejected: 1, notes: 'Smooth run.', ...overrides };
}

describe('batch records against the spec', () => {
  let versionId: string;
  let code: string;
  let productId: string;
  beforeAll(async () => {
    const v = await createApprovedVersion(a);
    versionId = v.versionId;
    code = v.productCode;
    productId = (await callRoute(versionRoute.GET, { method: 'GET', path: '', caller: as('production'), params: { versionId } })).body.version.product.id;
  });
  const post = (caller: Caller, body: unknown) => callRoute(batchesRoute.POST, { method: 'POST', path: '', caller, params: { versionId }, body });

  it('records a batch that passes, with every check', async () => {
    const res = await post(as('production'), goodBatch(code, '2026-11-02', 1));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.outcome).toBe('pass');
  });

  it('a failed batch needs a disposition with a comment; without one nothing is stored', async () => {
    const bad = goodBatch(code, '2026-11-02', 2, { fillTempC: 80 });
    const refused = await post(as('production'), bad);
    expect(refused.status).toBe(422);
    expect(Object.keys(refused.body.error.fields)).toEqual(expect.arrayContaining(['disposition', 'dispositionComment']));
    expect(await (await getEm()).fork().count(BatchRecord, { lotCode: bad.lotCode })).toBe(0);
    const ok = await post(tokenOf('production'), { ...bad, disposition: 'hold', dispositionComment: 'Held; re-process in the water bath.' });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(ok.body.outcome).toBe('fail');
    const stored = await (await getEm()).fork().findOneOrFail(BatchRecord, { lotCode: bad.lotCode });
    expect(stored.checks.find((c) => c.key === 'fill_temperature')!.status).toBe('fail');
    expect(stored.disposition).toBe('hold');
  });

  it('refuses a disposition on a passing batch, a duplicate lot code, and a lot code of another product or date', async () => {
    expect((await post(as('production'), { ...goodBatch(code, '2026-11-03', 1), disposition: 'rework', dispositionComment: 'just in case' })).status).toBe(422);
    expect((await post(as('production'), goodBatch(code, '2026-11-02', 1))).status).toBe(422);
    const wrongPrefix = await post(as('production'), { ...goodBatch(code, '2026-11-03', 1), lotCode: lotCodeFor('ZZZ', '2026-11-03', 1) });
    expect(wrongPrefix.body.error.fields.lotCode.join(' ')).toMatch(new RegExp(`starts with ${code}`));
    const wrongDate = await post(as('production'), { ...goodBatch(code, '2026-11-03', 1), lotCode: lotCodeFor(code, '2026-11-04', 1) });
    expect(wrongDate.body.error.fields.lotCode.join(' ')).toMatch(/26307/);
  });

  it('refuses a batch that cannot have happened, from the API and the form alike, and stores nothing', async () => {
    // The walk: future dates, a date before the version's approval, and a 1 kg batch of 1,000,000 jars of 340 g
    // were all accepted. The fixture's version was approved on 2 Jan 2025 (FIXTURE_APPROVED_AT).
    const em = (await getEm()).fork();
    const before = await em.count(BatchRecord, {});
    for (const date of ['2031-06-15', '2099-01-01']) {
      const res = await post(as('production'), goodBatch(code, date, 1));
      expect(res.status, date).toBe(422);
      expect(res.body.error.fields.batchDate.join(' ')).toMatch(/is in the future \(today is /);
    }
    const early = await post(as('production'), goodBatch(code, '2020-01-01', 1));
    expect(early.status).toBe(422);
    expect(early.body.error.fields.batchDate).toEqual(['v1 was approved on 2 Jan 2025: a batch made to it cannot be dated 1 Jan 2020, before that.']);
    const jars = await post(as('production'), goodBatch(code, '2026-11-06', 1, { batchSizeG: 1000, jarsFilled: 1_000_000 }));
    expect(jars.status).toBe(422);
    expect(jars.body.error.fields.jarsFilled.join(' ')).toMatch(/A batch of 1 kg fills at most \d+ jars of \d+ g/);
    // The form's server action runs the same rule.
    const fromForm = await asCaller(as('production'), () => recordBatchAction(versionId, goodBatch(code, '2099-01-01', 1)));
    expect(fromForm.ok).toBe(false);
    expect(fromForm.ok ? null : fromForm.status).toBe(422);
    expect(await em.count(BatchRecord, {})).toBe(before);
  });

  it('only production records batches', async () => {
    for (const role of ['developer', 'head_of_product', 'admin', 'taster'] as const) {
      expect((await post(as(role), goodBatch(code, '2026-11-05', 1))).status, role).toBe(403);
    }
  });

  it('batch records cannot be changed, even in the database', async () => {
    await expect(sql(`update batch_records set outcome = 'pass' where outcome = 'fail' and workspace_id = ?`, [a.workspaceId])).rejects.toThrow(/insert-only/);
    await expect(sql('delete from batch_records where workspace_id = ?', [a.workspaceId])).rejects.toThrow(/insert-only/);
  });

  it('exports every batch with its readings, limits and checks as CSV', async () => {
    const res = await callRoute(batchesCsvRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { productId } });
    expect(res.status).toBe(200);
    const lines = String(res.body).trim().split(/\r?\n/);
    expect(lines[0].split(',')).toEqual(expect.arrayContaining(['lot_code', 'brix_20c', 'solids_min', 'ph_max', 'outcome', 'disposition']));
    expect(lines).toHaveLength(3);
    // outcome, status, latest outcome and disposition: the screens' words, not their keys.
    expect(lines.find((l) => l.includes(lotCodeFor(code, '2026-11-02', 2)))).toMatch(/,Fail,On hold,Fail,hold,/);
    expect(lines.join('\n')).not.toMatch(/not_measured|,held,/);
  });
});

describe('held batches: incomplete, re-test, release or reject', () => {
  let versionId: string;
  let code: string;
  beforeAll(async () => {
    const v = await createApprovedVersion(a);
    versionId = v.versionId;
    code = v.productCode;
  });
  const record = async (body: unknown) => {
    const res = await callRoute(batchesRoute.POST, { method: 'POST', path: '', caller: as('production'), params: { versionId }, body });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body as { batchId: string; outcome: string };
  };
  const retest = (batchId: string, body: unknown, caller = as('production')) => callRoute(retestsRoute.POST, { method: 'POST', path: '', caller, params: { batchId }, body });
  const decide = (batchId: string, body: unknown, caller = as('production')) => callRoute(batchDecisionRoute.POST, { method: 'POST', path: '', caller, params: { batchId }, body });
  const view = async (batchId: string) => (await callRoute(batchRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { batchId } })).body.batch;

  it('a batch with its net fill and set test not measured is incomplete and held, never passed', async () => {
    const { batchId, outcome } = await record(goodBatch(code, '2026-10-01', 1, { netFillMeanG: null, netFillMinG: null, setTestScore: null }));
    expect(outcome).toBe('incomplete');
    const b = await view(batchId);
    expect(b.outcome).toBe('incomplete');
    expect(b.status).toBe('held');
    expect(b.canRelease).toBe(false);
    expect(b.checks.filter((c: any) => c.status === 'not_measured').map((c: any) => c.key).sort()).toEqual(['net_fill', 'set']);
    // An incomplete batch takes no disposition: it is held by rule.
    const withDisposition = await callRoute(batchesRoute.POST, { method: 'POST', path: '', caller: as('production'), params: { versionId }, body: { ...goodBatch(code, '2026-10-01', 2, { setTestScore: null }), disposition: 'hold', dispositionComment: 'Held anyway.' } });
    expect(withDisposition.status).toBe(422);
  });

  it('re-tests the missing checks against the same spec, then releases, with the audit trail; the release is final', async () => {
    const { batchId } = await record(goodBatch(code, '2026-10-02', 1, { setTestScore: null }));
    const early = await decide(batchId, { decision: 'release', comment: 'Looks fine to me.' });
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/still missing/);
    const passing = await retest(batchId, { setTestScore: 4, comment: 'Set test read at 24 h.' });
    expect(passing.status, JSON.stringify(passing.body)).toBe(201);
    expect(passing.body.outcome).toBe('pass');
    let b = await view(batchId);
    expect(b.status).toBe('held');
    expect(b.latestOutcome).toBe('pass');
    expect(b.canRelease).toBe(true);
    // The recorded readings are kept as they were; the re-test carries its own checks.
    expect(b.setTestScore).toBeNull();
    expect(b.decisions.map((d: any) => [d.kind, d.outcome])).toEqual([['retest', 'pass']]);
    const released = await decide(batchId, { decision: 'release', comment: 'Every check passes after the set test.' });
    expect(released.status, JSON.stringify(released.body)).toBe(201);
    b = await view(batchId);
    expect(b.status).toBe('released');
    expect((await decide(batchId, { decision: 'reject', comment: 'Changed my mind.' })).status).toBe(409);
    expect((await retest(batchId, { ph: 3.1, comment: 'One more.' })).status).toBe(409);
    const trail = (await callRoute(batchRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { batchId } })).body.audit.map((e: any) => e.action);
    expect(trail).toEqual(['batch.incomplete', 'batch.retested', 'batch.released']);
    const roles = (await callRoute(batchRoute.GET, { method: 'GET', path: '', caller: as('head_of_product'), params: { batchId } })).body.audit.map((e: any) => e.actorRole);
    expect(new Set(roles)).toEqual(new Set(['production']));
  });

  it('a failed batch on hold that still fails its re-test cannot be released; it can be rejected', async () => {
    const { batchId } = await record({ ...goodBatch(code, '2026-10-03', 1, { ph: 3.6 }), disposition: 'hold', dispositionComment: 'Acid short; holding for re-acidifying.' });
    const stillBad = await retest(batchId, { ph: 3.45, comment: 'Re-acidified once.' });
    expect(stillBad.body.outcome).toBe('fail');
    expect((await decide(batchId, { decision: 'release', comment: 'Close enough.' })).status).toBe(409);
    const rejected = await decide(batchId, { decision: 'reject', comment: 'pH will not come down; discard.' });
    expect(rejected.status).toBe(201);
    expect((await view(batchId)).status).toBe('rejected');
  });

  it('a reworked batch re-tested on pH alone stays incomplete and held; release opens once every reading is taken again', async () => {
    // The walk: failed on pH, kept for rework (re-boil), re-tested on pH alone — release opened on Brix from before the re-boil.
    const { batchId } = await record({ ...goodBatch(code, '2026-10-06', 1, { ph: 3.6 }), disposition: 'rework', dispositionComment: 'Re-acidify and re-boil.' });
    const phOnly = await retest(batchId, { ph: 3.1, comment: 'Re-boiled; pH read again.' });
    expect(phOnly.status, JSON.stringify(phOnly.body)).toBe(201);
    expect(phOnly.body.outcome).toBe('incomplete');
    let b = await view(batchId);
    expect(b.canRelease).toBe(false);
    expect(b.staleSinceRework).toEqual(['Soluble solids', 'Fill temperature', 'Net fill', 'Set test']);
    const early = await decide(batchId, { decision: 'release', comment: 'pH is fine now.' });
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/reworked: soluble solids, fill temperature, net fill, set test have not been measured again since/);
    const rest = await retest(batchId, { brixReading: 65, brixSampleTempC: 20, fillTempC: 88, netFillMeanG: 343, netFillMinG: 336, setTestScore: 4, comment: 'Refilled; the rest read again.' });
    expect(rest.body.outcome).toBe('pass');
    b = await view(batchId);
    expect(b.canRelease).toBe(true);
    expect((await decide(batchId, { decision: 'release', comment: 'Every check taken again after the rework.' })).status).toBe(201);
  });

  it('refuses a re-test of a passed or discarded batch, empty or lopsided re-tests, and other roles; nothing is written', async () => {
    const passed = await record(goodBatch(code, '2026-10-04', 1));
    expect(passed.outcome).toBe('pass');
    expect((await retest(passed.batchId, { ph: 3.1, comment: 'Checking.' })).status).toBe(409);
    const discarded = await record({ ...goodBatch(code, '2026-10-04', 2, { fillTempC: 70 }), disposition: 'discard', dispositionComment: 'Filled cold; discarded.' });
    expect((await decide(discarded.batchId, { decision: 'release', comment: 'Please.' })).status).toBe(409);
    const held = await record(goodBatch(code, '2026-10-04', 3, { setTestScore: null }));
    const before = await (await getEm()).fork().count(BatchDecision, {});
    expect((await retest(held.batchId, { comment: 'Nothing measured.' })).status).toBe(422);
    expect((await retest(held.batchId, { brixReading: 65, comment: 'No temperature.' })).status).toBe(422);
    expect((await retest(held.batchId, { setTestScore: 4, comment: '' })).status).toBe(422);
    expect((await decide(held.batchId, { decision: 'approve', comment: 'Wrong word.' })).status).toBe(422);
    for (const role of ['developer', 'head_of_product', 'admin'] as const) {
      expect((await retest(held.batchId, { setTestScore: 4, comment: 'Not mine to do.' }, as(role))).status, role).toBe(403);
      expect((await decide(held.batchId, { decision: 'reject', comment: 'Not mine to do.' }, as(role))).status, role).toBe(403);
    }
    expect(await (await getEm()).fork().count(BatchDecision, {})).toBe(before);
  });

  it('re-tests and decisions cannot be changed, even in the database, and only one release or reject can exist', async () => {
    const { batchId } = await record(goodBatch(code, '2026-10-05', 1, { setTestScore: null }));
    await decide(batchId, { decision: 'reject', comment: 'Set never checked; rejected.' });
    await expect(sql(`update batch_decisions set comment = 'edited' where batch_id = ?`, [batchId])).rejects.toThrow(/insert-only/);
    await expect(sql('delete from batch_decisions where batch_id = ?', [batchId])).rejects.toThrow(/insert-only/);
    const decision = await (await getEm()).fork().findOneOrFail(BatchDecision, { batch: batchId });
    await expect(sql(
      `insert into batch_decisions (id, workspace_id, batch_id, kind, comment, decided_by_id, created_at) values (gen_random_uuid(), ?, ?, 'release', 'sneaky', ?, now())`,
      [a.workspaceId, batchId, (decision.decidedBy as unknown as { id: string }).id],
    )).rejects.toThrow(/batch_decisions_one_final/);
  });
});

describe('the batch sheet', () => {
  it('scales to a kettle charge with the weights rounded to the scale and the solids effect shown', async () => {
    const { versionId } = await createApprovedVersion(a);
    const res = await callRoute(sheetRoute.GET, { method: 'GET', path: `/api/v1/production-versions/${versionId}/batch-sheet?target=total_charge&amount=50&unit=kg&step=10&stepUnit=g&altitudeM=600`, caller: as('production'), params: { versionId } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const sheet = res.body.sheet;
    // On the 10 g step, or (a small addition) a finer one that keeps its rounding within 2 % (common practice, no published source).
    for (const l of sheet.scaled.lines) {
      const steps = l.roundedG / l.stepG;
      expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-6);
      expect(l.stepG === 10 || (l.finerStep && Math.abs(l.roundingErrorG) <= 0.02 * l.exactG)).toBe(true);
    }
    expect(sheet.scaled.lines[0].stepG).toBe(10);
    const v = (await callRoute(versionRoute.GET, { method: 'GET', path: '', caller: as('production'), params: { versionId } })).body.version;
    const expected = scaleFormula(v.lines, toChemistrySettings(v.settings), { kind: 'total_charge', mass: 50, unit: 'kg' }, { step: 10, unit: 'g' });
    expect(sheet.scaled.rounded.solubleSolidsInG).toBeCloseTo(expected.rounded.solubleSolidsInG, 6);
    expect(sheet.scaled.effectOfRounding.solidsPctIfPlannedEvaporation).toBeCloseTo(expected.effectOfRounding.solidsPctIfPlannedEvaporation, 9);
    // At 600 m water boils near 98.0 °C (ISA pressure 94.3 kPa, Antoine): the end point drops by about 2 °C.
    expect(sheet.endPoint.seaLevelC - sheet.endPoint.kitchenC).toBeGreaterThan(1.8);
    expect(sheet.endPoint.seaLevelC - sheet.endPoint.kitchenC).toBeLessThan(2.2);
    expect(computeFormula(v.settings, v.lines).ok).toBe(true);
  });

  it('refuses a nonsense amount with a clear message', async () => {
    const { versionId } = await createApprovedVersion(a);
    const res = await callRoute(sheetRoute.GET, { method: 'GET', path: `/x?amount=-3`, caller: as('production'), params: { versionId } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.amount[0]).toMatch(/more than 0/);
  });

  it('refuses an amount below one jar or above the largest kettle with a 422 naming the amount', async () => {
    const { versionId } = await createApprovedVersion(a);
    for (const q of ['amount=0.001&unit=g', 'target=finished_mass&amount=1&unit=g', 'amount=5001&unit=kg', 'target=jar_count&amount=4000000']) {
      const res = await callRoute(sheetRoute.GET, { method: 'GET', path: `/x?${q}`, caller: as('production'), params: { versionId } });
      expect(res.status, q).toBe(422);
      expect(res.body.error.fields.amount[0], q).toMatch(/too small to fill one|too large/);
    }
    for (const amount of ['NaN', 'Infinity', '-1', '1e400']) {
      const res = await callRoute(sheetRoute.GET, { method: 'GET', path: `/x?amount=${amount}`, caller: as('production'), params: { versionId } });
      expect(res.status, amount).toBe(422);
    }
  });
});

describe('the audit trail', () => {
  it('lists who did what for the head of product, is hidden from production and tasters, and cannot be edited', async () => {
    await createApprovedVersion(a);
    const res = await callRoute(auditRoute.GET, { method: 'GET', path: '', caller: as('head_of_product') });
    expect(res.status).toBe(200);
    const actions = new Set(res.body.events.map((e: any) => e.action));
    for (const action of ['promotion.requested', 'promotion.approved', 'version.created', 'batch.recorded', 'batch.failed']) expect(actions).toContain(action);
    expect((await callRoute(auditRoute.GET, { method: 'GET', path: '', caller: as('production') })).status).toBe(403);
    expect((await callRoute(auditRoute.GET, { method: 'GET', path: '', caller: as('taster') })).status).toBe(403);
    await expect(sql(`update audit_events set summary = 'nothing happened' where workspace_id = ?`, [a.workspaceId])).rejects.toThrow(/insert-only/);
    await expect(sql('delete from audit_events where workspace_id = ?', [a.workspaceId])).rejects.toThrow(/insert-only/);
    expect(await (await getEm()).fork().count(AuditEvent, { workspace: a.workspaceId })).toBeGreaterThan(5);
  });

  it('a taster sees no production data', async () => {
    for (const [handler, params] of [[productsRoute.GET, {}], [promotionsRoute.GET, {}]] as const) {
      expect((await callRoute(handler, { method: 'GET', path: '', caller: as('taster'), params })).status).toBe(403);
    }
  });
});
