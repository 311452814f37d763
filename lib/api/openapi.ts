/**
 * The OpenAPI 3.1 description, generated from the same zod schemas the handlers validate
 * with. Each feature adds its operations to API_OPERATIONS; the authorisation test checks
 * that every route file under app/api/v1 has its operations listed here.
 */
import { z } from 'zod';
import { rolesWith, type Permission } from '@/lib/permissions';
import { inviteMemberSchema, updateMemberSchema } from '@/lib/members/schema';
import { createTokenSchema } from '@/lib/api-tokens/schema';
import { ingredientInputSchema } from '@/lib/ingredients/schema';
import { importIngredientsSchema } from '@/lib/ingredients/csv';
import { calcBatchSchema, createFormulaSchema, reviseFormulaSchema } from '@/lib/formulas/schema';
import { FILE_MAX_BYTES, PHOTO_MAX_BYTES, THUMBNAIL_MAX_PX, UPLOAD_SUBJECTS } from '@/lib/uploads/schema';
import { recommendationSchema } from '@/lib/results/schema';
import { answerSchema, createAttributeSchema, createTastingSchema, inviteTastersSchema, joinSchema } from '@/lib/tastings/schema';
import { correctCookSchema, createTrialSchema, importCooksSchema, manualVariantSchema, cookSchema, planSchema, transitionSchema, withdrawCookSchema } from '@/lib/trials/schema';
import { saveNotebookBodySchema } from '@/lib/notebook/schema';
import {
  costSettingsSchema, ingredientPriceSchema, packagingItemSchema, packagingPriceSchema, packFormatChoiceSchema, packFormatSchema, priceImportSchema,
  refuseBodySchema, withdrawSchema as withdrawPriceSchema,
} from '@/lib/pricing/schema';
import { fitOptionsSchema, optimiseRequestSchema, predictRequestSchema } from '@/lib/modelling/schema';
import { batchDecisionSchema, batchRecordSchema, batchRetestSchema, decisionSchema, requestPromotionSchema, withdrawSchema } from '@/lib/production/schema';

import { deprecatedAliasOf } from '@/lib/api/deprecated-paths';

export interface ApiOperation {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  /** OpenAPI path, with {param} placeholders. */
  path: string;
  summary: string;
  tag: string;
  /** null for public operations. */
  permission: Permission | null;
  request?: z.ZodType;
  /** A multipart/form-data body instead of JSON: the form fields as a JSON Schema object. */
  multipart?: { required: string[]; properties: Record<string, Record<string, unknown>> };
  /** Media types of a success response that is not JSON (downloads). */
  okMediaTypes?: string[];
  okStatus?: number;
  /** An old path kept for one release (lib/api/deprecated-paths.ts): same handler as the path it names. */
  deprecated?: boolean;
}

const UPLOAD_FORM: NonNullable<ApiOperation['multipart']> = {
  required: ['file'],
  properties: {
    file: { type: 'string', format: 'binary', description: `JPEG, PNG or WebP photo (${PHOTO_MAX_BYTES / 2 ** 20} MB at most), or PDF or CSV file (${FILE_MAX_BYTES / 2 ** 20} MB); the type is read from the bytes` },
    variantId: { type: 'string', format: 'uuid', description: 'the variant it documents' },
    cookId: { type: 'string', format: 'uuid', description: 'the cook it documents' },
    subject: { type: 'string', enum: [...UPLOAD_SUBJECTS], description: 'what a photo shows' },
  },
};

const CURRENT_OPERATIONS: ApiOperation[] = [
  { method: 'get', path: '/api/v1/me', summary: 'The caller, their current workspace and role, and the workspaces they can switch to', tag: 'Account', permission: 'account.self' },
  { method: 'get', path: '/api/v1/members', summary: 'Members and open invitations of the workspace', tag: 'Members', permission: 'members.manage' },
  { method: 'post', path: '/api/v1/members', summary: 'Invite a member by e-mail with a role', tag: 'Members', permission: 'members.manage', request: inviteMemberSchema, okStatus: 201 },
  { method: 'patch', path: '/api/v1/members/{membershipId}', summary: "Change a member's role or deactivate/reactivate them (the last administrator cannot be removed: 409)", tag: 'Members', permission: 'members.manage', request: updateMemberSchema },
  { method: 'delete', path: '/api/v1/invitations/{invitationId}', summary: 'Revoke an open invitation', tag: 'Members', permission: 'members.manage' },
  { method: 'get', path: '/api/v1/tokens', summary: "The caller's personal API tokens in this workspace (never the secrets)", tag: 'Account', permission: 'tokens.manage' },
  { method: 'post', path: '/api/v1/tokens', summary: 'Create a personal API token; the secret is in this response only', tag: 'Account', permission: 'tokens.manage', request: createTokenSchema, okStatus: 201 },
  { method: 'delete', path: '/api/v1/tokens/{tokenId}', summary: 'Revoke one of your tokens', tag: 'Account', permission: 'tokens.manage' },
  { method: 'get', path: '/api/v1/ingredients', summary: 'The ingredient library (query: q, kind, sort, dir, archived=include|only)', tag: 'Ingredients', permission: 'ingredients.read' },
  { method: 'post', path: '/api/v1/ingredients', summary: 'Add an ingredient of your own', tag: 'Ingredients', permission: 'ingredients.write', request: ingredientInputSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/ingredients/export', summary: 'The ingredient library as CSV (same query as the list), label data included', tag: 'Ingredients', permission: 'ingredients.read' },
  { method: 'post', path: '/api/v1/ingredients/import', summary: 'Import the library from CSV text ({ "csv": "…" }, the export\'s columns); a row whose name matches an ingredient replaces its values, any other adds one; all-or-nothing, errors by row and column; a file that changes existing ingredients answers 409 with each change (before → after) and imports nothing until sent with "confirmUpdates": true', tag: 'Ingredients', permission: 'ingredients.write', request: importIngredientsSchema },
  { method: 'get', path: '/api/v1/ingredients/{ingredientId}', summary: 'One ingredient', tag: 'Ingredients', permission: 'ingredients.read' },
  { method: 'patch', path: '/api/v1/ingredients/{ingredientId}', summary: "Replace an ingredient's values (a typical value becomes the workspace's edited value); leave out labelData to keep the stored label data", tag: 'Ingredients', permission: 'ingredients.write', request: ingredientInputSchema },
  { method: 'delete', path: '/api/v1/ingredients/{ingredientId}', summary: 'Archive an ingredient (old revisions keep their snapshot)', tag: 'Ingredients', permission: 'ingredients.write' },
  { method: 'get', path: '/api/v1/formulas', summary: 'Formulas with the headline results of their latest revision (query: q)', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'post', path: '/api/v1/formulas', summary: 'Create a formula (revision 1); lines may be in g, kg, lb, oz or % of fruit and are stored in grams', tag: 'Formulas', permission: 'formulas.write', request: createFormulaSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/formulas/{formulaId}', summary: 'A formula at its latest revision, with the full computation', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'get', path: '/api/v1/formulas/{formulaId}/label', summary: 'The label of the latest revision: ingredient lists (EU, US), fruit and total-sugar statements, EU declaration per 100 g and US facts per serving (label and unrounded values), sugar claims against reference=typical|<formula id>, additive limits and what is incomplete; format=csv|json for a download', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'get', path: '/api/v1/formulas/{formulaId}/revisions', summary: 'Revision history, newest first', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'post', path: '/api/v1/formulas/{formulaId}/revisions', summary: 'Save a new revision; 409 when baseRevision is no longer the latest (unless force)', tag: 'Formulas', permission: 'formulas.write', request: reviseFormulaSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/formulas/{formulaId}/revisions/{number}', summary: 'One revision', tag: 'Formulas', permission: 'formulas.read' },
  { method: 'post', path: '/api/v1/calc/batch', summary: 'Compute a posted formula (mass balance, end point, water activity, compliance, cautions); stores nothing', tag: 'Formulas', permission: 'calc.run', request: calcBatchSchema },
  { method: 'get', path: '/api/v1/trials/{trialId}/notebook', summary: "A trial's notebook entry, or a variant's (query: variantId), with its version and unresolved conflicts", tag: 'Notebook', permission: 'trials.read' },
  { method: 'put', path: '/api/v1/trials/{trialId}/notebook', summary: 'Save a notebook entry from baseVersion; 409 when someone saved meanwhile (the incoming document is kept as a conflict, error.conflict describes both)', tag: 'Notebook', permission: 'trials.write', request: saveNotebookBodySchema },
  { method: 'get', path: '/api/v1/trials', summary: 'Trials (query: status, owner, product, from, to, q); shelved trials only with status=archived', tag: 'Trials', permission: 'trials.read' },
  { method: 'post', path: '/api/v1/trials', summary: 'Start a trial on a formula revision; variant A is the base', tag: 'Trials', permission: 'trials.write', request: createTrialSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/trials/{trialId}', summary: 'The trial with its variants (predicted chemistry), cooks (measured against predicted) and status history', tag: 'Trials', permission: 'trials.read' },
  { method: 'post', path: '/api/v1/trials/{trialId}/status', summary: 'Move the trial to another status (409 when not allowed from the current one)', tag: 'Trials', permission: 'trials.write', request: transitionSchema },
  { method: 'post', path: '/api/v1/trials/{trialId}/plan', summary: 'Generate variants: one factor at a time or a full 2^k factorial, optionally with a centre point', tag: 'Trials', permission: 'trials.write', request: planSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/trials/{trialId}/variants', summary: 'Variants with their factor levels and predicted chemistry', tag: 'Trials', permission: 'trials.read' },
  { method: 'post', path: '/api/v1/trials/{trialId}/variants', summary: 'Add a hand-made variant (any lines)', tag: 'Trials', permission: 'trials.write', request: manualVariantSchema, okStatus: 201 },
  { method: 'delete', path: '/api/v1/trials/{trialId}/variants/{variantId}', summary: 'Remove a variant (kept on record; the base stays)', tag: 'Trials', permission: 'trials.write' },
  { method: 'get', path: '/api/v1/trials/{trialId}/variants/{variantId}/label', summary: 'The label of a variant, as for a formula (reference=typical|<formula id>, format=csv|json)', tag: 'Trials', permission: 'trials.read' },
  { method: 'get', path: '/api/v1/trials/{trialId}/cooks', summary: 'Every cook, each beside its prediction', tag: 'Trials', permission: 'trials.read' },
  { method: 'post', path: '/api/v1/trials/{trialId}/cooks', summary: 'Record a cook of a variant (refractometer reading stored raw with its sample temperature)', tag: 'Trials', permission: 'trials.write', request: cookSchema, okStatus: 201 },
  { method: 'patch', path: '/api/v1/trials/{trialId}/cooks/{cookId}', summary: 'Correct a cook with a reason (fields sent replace the stored ones; the old values stay in its history); 409 once withdrawn', tag: 'Trials', permission: 'trials.write', request: correctCookSchema },
  { method: 'post', path: '/api/v1/trials/{trialId}/cooks/{cookId}/withdraw', summary: 'Withdraw a cook with a reason: kept on record, left out of comparisons and promotion evidence', tag: 'Trials', permission: 'trials.write', request: withdrawCookSchema },
  { method: 'post', path: '/api/v1/trials/{trialId}/cooks/import', summary: 'Import cooks from CSV text ({ "csv": "…" }); all-or-nothing, errors by row and column', tag: 'Trials', permission: 'trials.write', request: importCooksSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/trials/{trialId}/export', summary: 'Variants and cooks as CSV, one row per cook', tag: 'Trials', permission: 'trials.read' },
  { method: 'get', path: '/api/v1/trials/{trialId}/uploads', summary: "A trial's photos and files, oldest first (query: variantId, cookId)", tag: 'Uploads', permission: 'trials.read' },
  { method: 'post', path: '/api/v1/trials/{trialId}/uploads', summary: 'Upload a photo or file (multipart/form-data); 413 too large, 415 not a type Setwell keeps, 422 empty', tag: 'Uploads', permission: 'trials.write', multipart: UPLOAD_FORM, okStatus: 201 },
  { method: 'get', path: '/api/v1/uploads/{uploadId}', summary: 'The original bytes, with the type read from them (inline for photos; PDF and CSV as attachments)', tag: 'Uploads', permission: 'trials.read', okMediaTypes: ['image/jpeg', 'image/png', 'image/webp', 'application/pdf', 'text/csv'] },
  { method: 'get', path: '/api/v1/uploads/{uploadId}/thumbnail', summary: `A photo's WebP thumbnail, ${THUMBNAIL_MAX_PX} px at most, without metadata (404 for files)`, tag: 'Uploads', permission: 'trials.read', okMediaTypes: ['image/webp'] },
  { method: 'delete', path: '/api/v1/uploads/{uploadId}', summary: 'Delete a photo or file (the stored object and its record)', tag: 'Uploads', permission: 'trials.write' },
  { method: 'get', path: '/api/v1/attributes', summary: 'The attribute library (what tasters rate, on which scale)', tag: 'Tastings', permission: 'tastings.read' },
  { method: 'post', path: '/api/v1/attributes', summary: 'Add an attribute of your own (intensity line, hedonic or just-about-right)', tag: 'Tastings', permission: 'tastings.run', request: createAttributeSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/trials/{trialId}/tastings', summary: 'Tastings of a trial', tag: 'Tastings', permission: 'tastings.read' },
  { method: 'post', path: '/api/v1/trials/{trialId}/tastings', summary: 'Create a tasting (draft): samples get three-digit codes, serving orders are balanced', tag: 'Tastings', permission: 'tastings.run', request: createTastingSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/tastings/{tastingId}', summary: 'A session with live progress per seat (poll it)', tag: 'Tastings', permission: 'tastings.read' },
  { method: 'patch', path: '/api/v1/tastings/{tastingId}', summary: 'Replace the set-up of a tasting that is still being set up (codes are drawn afresh); 409 once it has opened', tag: 'Tastings', permission: 'tastings.run', request: createTastingSchema },
  { method: 'delete', path: '/api/v1/tastings/{tastingId}', summary: 'Discard a tasting that never opened; 409 once it has', tag: 'Tastings', permission: 'tastings.run' },
  { method: 'post', path: '/api/v1/tastings/{tastingId}/open', summary: 'Open for answers; returns the join code', tag: 'Tastings', permission: 'tastings.run' },
  { method: 'post', path: '/api/v1/tastings/{tastingId}/close', summary: 'Close and lock the answers', tag: 'Tastings', permission: 'tastings.run' },
  { method: 'post', path: '/api/v1/tastings/{tastingId}/invitations', summary: 'Seat staff tasters and e-mail each their own link', tag: 'Tastings', permission: 'tastings.run', request: inviteTastersSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/tastings/{tastingId}/serving-sheet', summary: 'The kitchen serving sheet: codes per seat and which variant each is', tag: 'Tastings', permission: 'tastings.run' },
  { method: 'get', path: '/api/v1/tastings/{tastingId}/results', summary: 'The analysis of a session: means with 95 % CIs, blocked ANOVA, Tukey letters and the adjusted p of each pair, penalty analysis per sample, triangle or Friedman test, and verdicts', tag: 'Results', permission: 'tastings.read' },
  { method: 'get', path: '/api/v1/tastings/{tastingId}/answers.csv', summary: 'Raw answers in long format as CSV: session, seat, seat_status (submitted or partial), seat_submitted_at, code, variant (for a triangle, the cup chosen as odd), attribute, value, correct (triangle: yes or no), answered_at; times in ISO 8601', tag: 'Results', permission: 'tastings.read', okMediaTypes: ['text/csv'] },
  { method: 'get', path: '/api/v1/tastings/{tastingId}/summary.csv', summary: 'A summary table as CSV: ?table=means (mean, SD, CI, adjusted mean, letters, ANOVA p; default), anova, penalty, triangle or ranking', tag: 'Results', permission: 'tastings.read', okMediaTypes: ['text/csv'] },
  { method: 'get', path: '/api/v1/trials/{trialId}/comparison', summary: 'Variants side by side: factor levels, predicted chemistry, lab values, tasting verdicts, factor effects and lab–sensory correlations', tag: 'Results', permission: 'tastings.read' },
  { method: 'put', path: '/api/v1/trials/{trialId}/recommendation', summary: 'Mark the recommended variant with a rationale (feeds promotion)', tag: 'Results', permission: 'trials.write', request: recommendationSchema },
  { method: 'get', path: '/api/v1/models', summary: 'Product families (product class + main fruit) with cooked variants: trials, variants, last cook', tag: 'Models', permission: 'models.read' },
  { method: 'get', path: '/api/v1/models/{family}/dataset', summary: 'The data set of a family ({family} = product class + "." + main fruit ingredient id): one row per cooked or tasted variant, factors from its formula, each response as mean, n and SD; ?trials=<id> (repeatable) narrows it', tag: 'Models', permission: 'models.read' },
  { method: 'get', path: '/api/v1/models/{family}/dataset.csv', summary: 'The data set as CSV (ISO dates); ?trials=<id> (repeatable)', tag: 'Models', permission: 'models.read', okMediaTypes: ['text/csv'] },
  { method: 'get', path: '/api/v1/models/{family}/coefficients.csv', summary: 'Coefficients per coded unit with standard error, t and p as CSV, for ?response=<key> or every fitted response; ?kind, ?trials', tag: 'Models', permission: 'models.read', okMediaTypes: ['text/csv'] },
  { method: 'post', path: '/api/v1/models/{family}/fit', summary: 'Fit the family model (least squares; by default the largest of full quadratic, two-factor interactions and main effects the runs allow, panel means weighted n/s²): every response surface with ANOVA, lack of fit, PRESS, leverages and warnings. Reads only', tag: 'Models', permission: 'models.read', request: fitOptionsSchema },
  { method: 'post', path: '/api/v1/models/{family}/predict', summary: 'Predictions at a posted point with 95 % confidence and prediction intervals, or the reason there is none in words (outside the data: range or leverage), as the formula editor shows them. Reads only', tag: 'Models', permission: 'models.read', request: predictRequestSchema },
  { method: 'post', path: '/api/v1/models/{family}/optimise', summary: 'Proposals that maximise the Derringer–Suich desirability of the stated goals inside the data, with the fruit minimum and the pH window as constraints; predicted responses with intervals. Same search as the Propose screen. With baseFormulaId (a formula of this family) the fruit minimum holds on that formula’s exact mass balance at each point, and only points it can be moved to are proposed; without it, on the family’s fitted fruit-content surface. A pH window needs a model of measured pH (else 422). constraints.costCeilingPerJarMinor (minor units of the workspace currency, at most 1,000,000 in major units; needs prices.read, else 403) holds each proposal’s cost per jar — the base formula moved to the point, with its pack format, at today’s prices, as the Propose screen costs it — at or under the ceiling, and each proposal then carries costPerJarMinor and the answer cost (currency, day, pack format); it needs baseFormulaId, and a formula without a pack format, a currency or a price for every line and packaging item on the day is refused by name (422), an unknown price never counted as zero. Reads only', tag: 'Models', permission: 'models.read', request: optimiseRequestSchema },
  { method: 'get', path: '/api/v1/costs/basis', summary: 'The prices on one day the formula editor costs with (?asOf=YYYY-MM-DD, default today): ingredient and packaging prices, refuse %, pack formats, overfill, currency', tag: 'Costs', permission: 'prices.read' },
  { method: 'get', path: '/api/v1/trials/{trialId}/costs', summary: "Each variant's cost on a day (?asOf): per batch, per kg of finished product, per jar with packaging, line shares, sensitivity; incomplete with the unpriced lines named. Needs trials.read too", tag: 'Costs', permission: 'prices.read' },
  { method: 'get', path: '/api/v1/products/{productId}/costs', summary: "Every version's cost frozen at approval and today's, and whether today's cost per jar moved past the workspace threshold", tag: 'Costs', permission: 'prices.read' },
  { method: 'get', path: '/api/v1/batches/{batchId}/cost', summary: "A batch's cost: its version priced on the batch's day and the actual cost per good jar from its charge and jars", tag: 'Costs', permission: 'prices.read' },
  { method: 'post', path: '/api/v1/tastings/join', summary: 'A guest joins with the short code (rate-limited per address); returns the seat token', tag: 'Tasting', permission: null, request: joinSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/tastings/seats/{seatToken}', summary: "The taster's view: codes in serving order, scales, own answers — nothing that maps to a variant", tag: 'Tasting', permission: null },
  { method: 'post', path: '/api/v1/tastings/seats/{seatToken}/consent', summary: 'Accept the allergen and consent notice', tag: 'Tasting', permission: null },
  { method: 'put', path: '/api/v1/tastings/seats/{seatToken}/answers', summary: 'Save one answer with an idempotency key (stored once; 409 after closing)', tag: 'Tasting', permission: null, request: answerSchema },
  { method: 'post', path: '/api/v1/tastings/seats/{seatToken}/submit', summary: 'Finish the tasting', tag: 'Tasting', permission: null },
  { method: 'get', path: '/api/v1/promotions', summary: 'Promotion requests, newest first (query: status=pending|approved|sent_back|withdrawn)', tag: 'Production', permission: 'promotion.read' },
  { method: 'post', path: '/api/v1/promotions', summary: 'Request promotion of a trial variant with rationale, process and QC spec; the evidence is captured automatically and the head of product is e-mailed', tag: 'Production', permission: 'promotion.request', request: requestPromotionSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/promotions/{requestId}', summary: 'One request with its evidence, decision, history of the trial\'s other requests and audit trail', tag: 'Production', permission: 'promotion.read' },
  { method: 'post', path: '/api/v1/promotions/{requestId}/decision', summary: 'Approve (creates the production version, superseding the previous one) or send back with a comment; never on your own request (403); 409 once decided', tag: 'Production', permission: 'promotion.decide', request: decisionSchema },
  { method: 'post', path: '/api/v1/promotions/{requestId}/withdraw', summary: 'The requester withdraws a request still awaiting review', tag: 'Production', permission: 'promotion.request', request: withdrawSchema },
  { method: 'get', path: '/api/v1/products', summary: 'Products in production with their current version and batch counts', tag: 'Production', permission: 'production.read' },
  { method: 'get', path: '/api/v1/products/{productId}', summary: 'A product: every version (current and superseded) and its batch records', tag: 'Production', permission: 'production.read' },
  { method: 'get', path: '/api/v1/products/{productId}/batches.csv', summary: 'The product\'s batch records with readings, spec limits and check results as CSV', tag: 'Production', permission: 'production.read', okMediaTypes: ['text/csv'] },
  { method: 'get', path: '/api/v1/production-versions/{versionId}', summary: 'One immutable production version: lines, process, compliance, QC spec, audit trail and batches', tag: 'Production', permission: 'production.read' },
  { method: 'patch', path: '/api/v1/production-versions/{versionId}', summary: 'Always 409: an approved version cannot be edited; promote a new version', tag: 'Production', permission: 'production.read' },
  { method: 'put', path: '/api/v1/production-versions/{versionId}', summary: 'Always 409: an approved version cannot be replaced', tag: 'Production', permission: 'production.read' },
  { method: 'delete', path: '/api/v1/production-versions/{versionId}', summary: 'Always 409: an approved version cannot be deleted', tag: 'Production', permission: 'production.read' },
  { method: 'get', path: '/api/v1/production-versions/{versionId}/batch-sheet', summary: 'The batch sheet scaled to a kettle or jar count (query: target=total_charge|finished_mass|jar_count, amount, unit, step, stepUnit, altitudeM) with rounding effect, end point for the altitude and QC targets', tag: 'Production', permission: 'production.read' },
  { method: 'get', path: '/api/v1/production-versions/{versionId}/label', summary: 'The label frozen when the version was approved (computed now, and marked so, for versions approved before labels were frozen); format=csv|json for a download', tag: 'Production', permission: 'production.read' },
  { method: 'get', path: '/api/v1/production-versions/{versionId}/batches', summary: 'Batch records made to this version', tag: 'Production', permission: 'production.read' },
  { method: 'post', path: '/api/v1/production-versions/{versionId}/batches', summary: 'Record a production batch; every reading is checked against the spec; a failed batch needs a disposition and comment (422 without)', tag: 'Production', permission: 'batches.record', request: batchRecordSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/batches/{batchId}', summary: 'One batch record with where it stands (passed, on hold, discarded, released, rejected), its re-tests and decisions, its spec and audit events', tag: 'Production', permission: 'production.read' },
  { method: 'post', path: '/api/v1/batches/{batchId}/retests', summary: 'Re-test a held batch: the readings taken again, merged over the recorded ones and checked against the same spec; 409 when the batch is not on hold', tag: 'Production', permission: 'batches.record', request: batchRetestSchema, okStatus: 201 },
  { method: 'post', path: '/api/v1/batches/{batchId}/decision', summary: 'Release (only when the latest checks pass, 409 otherwise) or reject a held batch, with a comment; final', tag: 'Production', permission: 'batches.record', request: batchDecisionSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/audit', summary: 'The workspace audit trail, newest first (read-only)', tag: 'Production', permission: 'audit.read' },
  { method: 'get', path: '/api/v1/openapi.json', summary: 'This description', tag: 'Meta', permission: null },
  { method: 'get', path: '/api/v1/cost-settings', summary: "The workspace's currency (ISO 4217; null until chosen), filling overfill % and cost-change warning threshold %", tag: 'Prices', permission: 'prices.read' },
  { method: 'put', path: '/api/v1/cost-settings', summary: 'Set currency, overfill and warning threshold; 409 when changing the currency after prices exist (no conversion)', tag: 'Prices', permission: 'costs.settings', request: costSettingsSchema },
  { method: 'get', path: '/api/v1/prices', summary: 'Every ingredient with the price in force on a day (query: asOf=YYYY-MM-DD, default today) and its refuse/trim %; amounts in minor units of the stated currency', tag: 'Prices', permission: 'prices.read' },
  { method: 'post', path: '/api/v1/prices', summary: 'Add a dated price of an ingredient (pack price as decimal text in the workspace currency, pack size in g, kg or lb); prices are never overwritten', tag: 'Prices', permission: 'prices.write', request: ingredientPriceSchema, okStatus: 201 },
  { method: 'post', path: '/api/v1/prices/import', summary: 'Import ingredient prices from CSV (ingredient, valid_from, pack_price, pack_size, pack_unit, supplier, currency), all or nothing: 422 with errors by row and column', tag: 'Prices', permission: 'prices.write', request: priceImportSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/prices/export', summary: 'Every ingredient price that counts, as CSV in the import columns', tag: 'Prices', permission: 'prices.read', okMediaTypes: ['text/csv'] },
  { method: 'get', path: '/api/v1/prices/{ingredientId}', summary: "An ingredient's price history, newest first, withdrawn points included with who and why", tag: 'Prices', permission: 'prices.read' },
  { method: 'put', path: '/api/v1/prices/{ingredientId}/refuse', summary: "Set an ingredient's refuse/trim share (0–95 % of the bought mass)", tag: 'Prices', permission: 'prices.write', request: refuseBodySchema },
  { method: 'post', path: '/api/v1/price-points/{priceId}/withdraw', summary: 'Withdraw a mistaken ingredient price with a reason (kept on record, audited); 409 when already withdrawn', tag: 'Prices', permission: 'prices.write', request: withdrawPriceSchema },
  { method: 'get', path: '/api/v1/packaging-items', summary: 'Packaging items with the unit price in force on a day (query: asOf)', tag: 'Prices', permission: 'prices.read' },
  { method: 'post', path: '/api/v1/packaging-items', summary: 'Add a packaging item (jar, lid, label, case or other)', tag: 'Prices', permission: 'prices.write', request: packagingItemSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/packaging-items/{packagingItemId}', summary: "A packaging item's price history, newest first", tag: 'Prices', permission: 'prices.read' },
  { method: 'put', path: '/api/v1/packaging-items/{packagingItemId}', summary: 'Rename a packaging item or change its kind', tag: 'Prices', permission: 'prices.write', request: packagingItemSchema },
  { method: 'post', path: '/api/v1/packaging-prices', summary: 'Add a dated price of a packaging item (the price of a pack of so many pieces)', tag: 'Prices', permission: 'prices.write', request: packagingPriceSchema, okStatus: 201 },
  { method: 'post', path: '/api/v1/packaging-prices/{priceId}/withdraw', summary: 'Withdraw a mistaken packaging price with a reason; 409 when already withdrawn', tag: 'Prices', permission: 'prices.write', request: withdrawPriceSchema },
  { method: 'get', path: '/api/v1/pack-formats', summary: 'Pack formats: container, net fill and packaging per jar', tag: 'Prices', permission: 'prices.read' },
  { method: 'post', path: '/api/v1/pack-formats', summary: 'Create a pack format (pieces per jars for each packaging item: a case of 12 is 1 per 12)', tag: 'Prices', permission: 'prices.write', request: packFormatSchema, okStatus: 201 },
  { method: 'get', path: '/api/v1/pack-formats/{packFormatId}', summary: 'One pack format', tag: 'Prices', permission: 'prices.read' },
  { method: 'put', path: '/api/v1/pack-formats/{packFormatId}', summary: "Replace a pack format's name, net fill and packaging", tag: 'Prices', permission: 'prices.write', request: packFormatSchema },
  { method: 'put', path: '/api/v1/formulas/{formulaId}/pack-format', summary: 'Choose the pack format a formula is costed in (null: none)', tag: 'Prices', permission: 'formulas.write', request: packFormatChoiceSchema },
  { method: 'put', path: '/api/v1/production-versions/{versionId}/pack-format', summary: 'Choose the pack format a production version is filled in (the one change a version accepts; audited)', tag: 'Prices', permission: 'prices.write', request: packFormatChoiceSchema },
];

/** Every operation, then the deprecated aliases of the renamed ones (answered by the same handlers). */
export const API_OPERATIONS: ApiOperation[] = [
  ...CURRENT_OPERATIONS,
  ...CURRENT_OPERATIONS.flatMap((op): ApiOperation[] => {
    const old = deprecatedAliasOf(op.path);
    return old ? [{ ...op, path: old, deprecated: true, summary: `Deprecated: use ${op.path} (this path goes in the next release; its fields already carry the new names: tastingId, cookId, cooks, productVersionId). ${op.summary}` }] : [];
  }),
];

const errorSchema = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string' },
        message: { type: 'string' },
        fields: { type: 'object', additionalProperties: { type: 'array', items: { type: 'string' } } },
      },
    },
  },
} as const;

function schemaOf(schema: z.ZodType) {
  return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' });
}

export function buildOpenApiDocument(serverUrl: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const op of API_OPERATIONS) {
    const params = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => ({
      name: m[1],
      in: 'path',
      required: true,
      schema: m[1] === 'number' ? { type: 'integer', minimum: 1 } : m[1] === 'seatToken' ? { type: 'string', description: 'The seat token from the taster link' } : { type: 'string', format: 'uuid' },
    }));
    const errorRef = { description: 'Error', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
    paths[op.path] ??= {};
    paths[op.path][op.method] = {
      summary: op.summary,
      tags: [op.tag],
      ...(op.deprecated ? { deprecated: true } : {}),
      ...(op.permission
        ? { security: [{ bearerToken: [] }, { sessionCookie: [] }], 'x-setwell-roles': rolesWith(op.permission) }
        : { security: [] }),
      ...(params.length ? { parameters: params } : {}),
      ...(op.request ? { requestBody: { required: true, content: { 'application/json': { schema: schemaOf(op.request) } } } } : {}),
      ...(op.multipart ? { requestBody: { required: true, content: { 'multipart/form-data': { schema: { type: 'object', ...op.multipart } } } } } : {}),
      responses: {
        [String(op.okStatus ?? 200)]: {
          description: 'Success',
          content: op.okMediaTypes
            ? Object.fromEntries(op.okMediaTypes.map((t) => [t, { schema: { type: 'string', format: 'binary' } }]))
            : { 'application/json': { schema: { type: 'object' } } },
        },
        ...(op.permission ? { 401: errorRef, 403: errorRef } : {}),
        ...(params.length ? { 404: errorRef } : {}),
        ...(op.request || op.multipart ? { 400: errorRef, 422: errorRef } : {}),
        ...(op.multipart ? { 413: errorRef, 415: errorRef } : {}),
        ...(op.method !== 'get' ? { 409: errorRef } : {}),
      },
    };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Setwell API',
      version: '1',
      description:
        'JSON API of Setwell. Authenticate with a personal API token (Authorization: Bearer swt_…) or the browser session. Errors always have the shape { "error": { "code", "message", "fields"? } }.',
    },
    servers: [{ url: serverUrl }],
    paths,
    components: {
      schemas: { Error: errorSchema },
      securitySchemes: {
        bearerToken: { type: 'http', scheme: 'bearer', description: 'A personal API token from Settings → API tokens' },
        sessionCookie: { type: 'apiKey', in: 'cookie', name: 'next-auth.session-token', description: 'Browser session; writes must carry a same-origin Origin header' },
      },
    },
  };
}
