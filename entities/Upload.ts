import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Trial } from './Trial';

/** A photo or file kept in object storage. The type is what the content is, not what the name says. */
export const Upload = defineEntity({
  name: 'Upload',
  tableName: 'uploads',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    trial: p.manyToOne(Trial),
    /** Optional links: the variant or the cook the file documents. */
    variantId: p.uuid().nullable(),
    cookId: p.uuid().nullable().fieldName('measurement_id'),
    kind: p.enum(['photo', 'file']),
    /** What it shows, for photos: jar, set test, spread, other. */
    subject: p.string().length(40).nullable(),
    originalName: p.string().length(255),
    contentType: p.string().length(100),
    sizeBytes: p.integer(),
    storageKey: p.string().length(300),
    thumbnailKey: p.string().length(300).nullable(),
    width: p.integer().nullable(),
    height: p.integer().nullable(),
    uploadedBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'trial'] }],
});
export type UploadEntity = InferEntity<typeof Upload>;
