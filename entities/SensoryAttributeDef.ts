import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import type { SensoryScale } from '../lib/sensory';

/** A workspace's attribute library entry: what tasters rate and on which scale. */
export const SensoryAttributeDef = defineEntity({
  name: 'SensoryAttributeDef',
  tableName: 'sensory_attributes',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    /** The default library's key (e.g. set-firmness); null for the workspace's own. */
    libraryKey: p.string().length(60).nullable(),
    name: p.string().length(80),
    instruction: p.text(),
    modality: p.string().length(30),
    scale: p.json<SensoryScale>(),
    formulationCaution: p.text().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
});
export type SensoryAttributeDefEntity = InferEntity<typeof SensoryAttributeDef>;
