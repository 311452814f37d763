import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Measurement } from './Measurement';

export const MEASUREMENT_CHANGE_KINDS = ['corrected', 'withdrawn'] as const;

/**
 * Every correction or withdrawal of a cook, insert-only (a trigger refuses UPDATE and DELETE):
 * `before` holds the readings the change replaced, so nothing is overwritten silently.
 */
export const MeasurementChange = defineEntity({
  name: 'MeasurementChange',
  tableName: 'measurement_changes',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    measurement: p.manyToOne(Measurement),
    kind: p.enum([...MEASUREMENT_CHANGE_KINDS]),
    before: p.json<Record<string, unknown>>(),
    reason: p.text(),
    changedBy: p.manyToOne(User),
    changedAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'measurement'] }],
});
export type MeasurementChangeEntity = InferEntity<typeof MeasurementChange>;
