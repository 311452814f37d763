import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Trial } from './Trial';
import { Product } from './Product';
import { PROMOTION_STATUSES } from '../lib/production/vocabulary';
import type { PromotionEvidence, ProductionProcess } from '../lib/production/schema';
import type { QcSpec } from '../lib/chemistry/qc';

/**
 * A developer's request to put a trial variant into production, with the evidence captured when it
 * was made. A request that is sent back stays as it was; the developer files a new one, which keeps
 * the link to it (previousRequestId) so the reviewer sees what was asked for.
 */
export const PromotionRequest = defineEntity({
  name: 'PromotionRequest',
  tableName: 'promotion_requests',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    /** Sequential per workspace: shown as PR-001. */
    number: p.integer(),
    trial: p.manyToOne(Trial),
    variantId: p.uuid(),
    variantLabel: p.string().length(8),
    /** An existing product gets a new version; otherwise the product is created on approval. */
    product: p.manyToOne(Product).nullable(),
    newProductName: p.string().length(120).nullable(),
    newProductCode: p.string().length(5).nullable(),
    rationale: p.text(),
    process: p.json<ProductionProcess>(),
    spec: p.json<QcSpec>(),
    evidence: p.json<PromotionEvidence>(),
    status: p.enum([...PROMOTION_STATUSES]).default('pending'),
    requestedBy: p.manyToOne(User),
    requestedAt: p.datetime().onCreate(() => new Date()),
    decidedBy: p.manyToOne(User).nullable(),
    decidedAt: p.datetime().nullable(),
    decisionComment: p.text().nullable(),
    productVersionId: p.uuid().nullable().fieldName('production_formula_id'),
    /** The sent-back request of the same trial this one was filed after; null for a first request. */
    previousRequestId: p.uuid().nullable(),
  }),
  indexes: [{ properties: ['workspace', 'status'] }],
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  // One pending request per trial.
  uniques: [
    { properties: ['workspace', 'number'] },
    { name: 'promotion_requests_one_pending', expression: `create unique index "promotion_requests_one_pending" on "promotion_requests" ("trial_id") where "status" = 'pending'` },
  ],
});
export type PromotionRequestEntity = InferEntity<typeof PromotionRequest>;
