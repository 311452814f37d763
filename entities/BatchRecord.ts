import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Product } from './Product';
import { ProductVersion } from './ProductVersion';
import { BATCH_OUTCOMES, DISPOSITIONS } from '../lib/production/vocabulary';
import type { QcCheck } from '../lib/chemistry/qc';

/** One production batch, checked against the spec of the version it was made to. A record, never edited. */
export const BatchRecord = defineEntity({
  name: 'BatchRecord',
  tableName: 'batch_records',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    product: p.manyToOne(Product),
    productVersion: p.manyToOne(ProductVersion).fieldName('production_formula_id'),
    lotCode: p.string().length(16),
    batchDate: p.date(),
    batchSizeG: p.double().$type<number>(),
    brixReading: p.double().$type<number>(),
    brixSampleTempC: p.double().$type<number>(),
    brix20: p.double().$type<number>(),
    ph: p.double().$type<number>(),
    fillTempC: p.double().$type<number>(),
    netFillMeanG: p.double().$type<number>().nullable(),
    netFillMinG: p.double().$type<number>().nullable(),
    setTestScore: p.integer().nullable(),
    jarsFilled: p.integer(),
    jarsRejected: p.integer(),
    notes: p.text().nullable(),
    checks: p.json<QcCheck[]>(),
    outcome: p.enum([...BATCH_OUTCOMES]),
    disposition: p.enum([...DISPOSITIONS]).nullable(),
    dispositionComment: p.text().nullable(),
    recordedBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['workspace', 'lotCode'] }],
  indexes: [{ properties: ['workspace', 'product', 'batchDate'] }],
});
export type BatchRecordEntity = InferEntity<typeof BatchRecord>;
