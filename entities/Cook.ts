import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Variant } from './Variant';
import { SET_TEST_METHODS, SYNERESIS_LEVELS } from '../lib/trials/vocabulary';

/** One cook of a variant and what was measured. Raw readings are stored as taken. */
export const Cook = defineEntity({
  name: 'Cook',
  tableName: 'measurements',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    variant: p.manyToOne(Variant),
    cookDate: p.date(),
    batchSizeG: p.double().$type<number>().nullable(),
    /** Refractometer reading as read, with the sample temperature: corrected to 20 °C on display. */
    brixReading: p.double().$type<number>().nullable(),
    brixSampleTempC: p.double().$type<number>().nullable(),
    ph: p.double().$type<number>().nullable(),
    endPointTempC: p.double().$type<number>().nullable(),
    boilTimeMin: p.double().$type<number>().nullable(),
    setTestScore: p.integer().nullable(),
    setTestMethod: p.enum([...SET_TEST_METHODS]).nullable(),
    syneresis: p.enum([...SYNERESIS_LEVELS]).nullable(),
    colourNotes: p.text().nullable(),
    yieldJars: p.integer().nullable(),
    yieldG: p.double().$type<number>().nullable(),
    notes: p.text().nullable(),
    recordedBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
    /** A withdrawn cook stays on record (with its history) but counts in no comparison or evidence. */
    withdrawnAt: p.datetime().nullable(),
  }),
  indexes: [{ properties: ['workspace', 'variant'] }],
});
export type CookEntity = InferEntity<typeof Cook>;
