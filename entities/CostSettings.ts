import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';

/**
 * A workspace's costing settings: its one currency (ISO 4217; prices are never converted), the
 * filling overfill and the share a version's cost per jar may move before the product page warns.
 * One row per workspace, created when an admin first saves the settings.
 */
export const CostSettings = defineEntity({
  name: 'CostSettings',
  tableName: 'cost_settings',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace).unique(),
    currency: p.string().length(3),
    overfillPct: p.double().$type<number>().default(0),
    costWarningPct: p.double().$type<number>().default(5),
    updatedBy: p.manyToOne(User),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  }),
});
export type CostSettingsEntity = InferEntity<typeof CostSettings>;
