import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Cook } from './Cook';

export const COOK_CHANGE_KINDS = ['corrected', 'withdrawn'] as const;

/**
 * Every correction or withdrawal of a cook, insert-only (a trigger refuses UPDATE and DELETE):
 * `before` holds the readings the change replaced, so nothing is overwritten silently.
 */
export const CookChange = defineEntity({
  name: 'CookChange',
  tableName: 'measurement_changes',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    cook: p.manyToOne(Cook).fieldName('measurement_id'),
    kind: p.enum([...COOK_CHANGE_KINDS]),
    before: p.json<Record<string, unknown>>(),
    reason: p.text(),
    changedBy: p.manyToOne(User),
    changedAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'cook'] }],
});
export type CookChangeEntity = InferEntity<typeof CookChange>;
