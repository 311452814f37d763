import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { Tasting } from './Tasting';
import { TastingSeat } from './TastingSeat';

/**
 * One answer. (seat, item, attribute) is unique in the database: item is the sample code
 * for ratings and '*' for a ranking or a triangle choice; attribute is '*' for triangles.
 * A retry with any idempotency key it has had changes nothing, so a late replay of an older
 * answer never overwrites a newer one.
 */
export const TastingAnswer = defineEntity({
  name: 'TastingAnswer',
  tableName: 'panel_answers',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    session: p.manyToOne(Tasting),
    seat: p.manyToOne(TastingSeat),
    kind: p.enum(['rating', 'ranking', 'triangle']),
    item: p.string().length(3),
    attribute: p.string().length(36),
    /** The sample behind the code (ratings), for analysis; never sent to tasters. */
    sampleId: p.uuid().nullable(),
    value: p.double().$type<number>().nullable(),
    ranking: p.json<string[]>().nullable(),
    oddCode: p.string().length(3).nullable(),
    correct: p.boolean().nullable(),
    confidence: p.integer().nullable(),
    comment: p.text().nullable(),
    /** The key of the request that set the current value. */
    idempotencyKey: p.uuid(),
    /** Every key this answer has had, the current one last: a replay of any of them changes nothing. */
    idempotencyKeys: p.array<string>().columnType('uuid[]'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['seat', 'item', 'attribute'] }],
  indexes: [{ properties: ['workspace', 'session'] }],
});
export type TastingAnswerEntity = InferEntity<typeof TastingAnswer>;
