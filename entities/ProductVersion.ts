import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Trial } from './Trial';
import { Product } from './Product';
import { PackFormat } from './PackFormat';
import { VERSION_STATUSES } from '../lib/production/vocabulary';
import type { FormulaSettingsInput, RevisionLine } from '../lib/formulas/schema';
import type { ProductionProcess } from '../lib/production/schema';
import type { QcSpec } from '../lib/chemistry/qc';
import type { ComplianceReport } from '../lib/chemistry/compliance';
import type { Label } from '../lib/label/label';
import type { FrozenCost } from '../lib/costs/schema';

/**
 * One approved version of a product: a frozen snapshot of lines, process, rules and QC spec.
 * The database refuses every change except the one-way move from current to superseded.
 */
export const ProductVersion = defineEntity({
  name: 'ProductVersion',
  tableName: 'production_formulas',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    product: p.manyToOne(Product),
    version: p.integer(),
    status: p.enum([...VERSION_STATUSES]).default('current'),
    settings: p.json<FormulaSettingsInput>(),
    lines: p.json<RevisionLine[]>(),
    process: p.json<ProductionProcess>(),
    compliance: p.json<ComplianceReport>(),
    spec: p.json<QcSpec>(),
    /** The label computed at approval; null for versions approved before labels were frozen. */
    label: p.json<Label>().nullable(),
    sourceTrial: p.manyToOne(Trial),
    sourceVariantId: p.uuid(),
    sourceVariantLabel: p.string().length(8),
    promotionRequestId: p.uuid(),
    approvedBy: p.manyToOne(User),
    approvedAt: p.datetime().onCreate(() => new Date()),
    supersededAt: p.datetime().nullable(),
    supersededByVersion: p.integer().nullable(),
    /** The jar and packaging the version is filled in; the one column that may change after approval (lib/pricing). */
    packFormat: p.manyToOne(PackFormat).nullable(),
    /** The cost on the approval day, frozen at approval (lib/costs); null without a workspace currency. */
    costAtApproval: p.json<FrozenCost>().nullable(),
  }),
  indexes: [{ properties: ['workspace', 'status'] }],
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  // One current version per product.
  uniques: [
    { properties: ['product', 'version'] },
    { name: 'production_formulas_one_current', expression: `create unique index "production_formulas_one_current" on "production_formulas" ("product_id") where "status" = 'current'` },
  ],
});
export type ProductVersionEntity = InferEntity<typeof ProductVersion>;
