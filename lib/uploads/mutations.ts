import 'server-only';
/** Upload writes, shared by the API and any server action: checks, object storage, then the row. */
import { randomUUID } from 'node:crypto';
import { getEm } from '@/lib/db';
import { Cook, Upload } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { isUuid } from '@/lib/ids';
import { logger } from '@/lib/log';
import { assertVariantOfTrial, loadTrial } from '@/lib/trials/access';
import { deleteObject, originalKey, putObject, thumbnailKey } from '@/lib/storage';
import { cleanFileName, inspectUpload, nameForStorage } from './content';
import { findUploadRow, toUploadView } from './queries';
import { UPLOAD_LIMITS, uploadFieldsSchema, type CreateUploadInput, type UploadLimits, type UploadView } from './schema';

/** 404 unless the cook belongs to that trial (and to that variant, when one is named). */
async function assertCookOfTrial(actor: Actor, trialId: string, cookId: string, variantId?: string): Promise<void> {
  const em = await getEm();
  const where: Record<string, unknown> = { ...inWorkspace(actor), id: cookId, variant: { trial: trialId } };
  if (variantId) where.variant = { id: variantId, trial: trialId };
  const n = await em.count(Cook, where);
  if (!n) throw notFound('measurement');
}

/**
 * Stores a photo or file on a trial. Order matters: the trial (and variant, cook) are checked
 * first, so another workspace learns nothing from validation; the objects are written before the
 * row, so a row never points at nothing; a failed insert removes the objects again.
 */
export async function createUpload(actor: Actor, input: CreateUploadInput, limits: UploadLimits = UPLOAD_LIMITS): Promise<UploadView> {
  if (!isUuid(input.trialId)) throw notFound('trial');
  await loadTrial(actor, input.trialId);
  const fields = uploadFieldsSchema.parse({
    variantId: input.variantId ?? undefined,
    cookId: input.cookId ?? undefined,
    subject: input.subject ?? undefined,
  });
  if (fields.variantId) await assertVariantOfTrial(actor, input.trialId, fields.variantId);
  if (fields.cookId) await assertCookOfTrial(actor, input.trialId, fields.cookId, fields.variantId);

  const cleanName = cleanFileName(input.file.name);
  const inspected = await inspectUpload(cleanName, input.file.bytes, limits);
  const originalName = nameForStorage(cleanName, inspected.contentType);

  const id = randomUUID();
  const storageKey = originalKey(actor.workspaceId, input.trialId, id);
  const thumbKey = inspected.thumbnail ? thumbnailKey(actor.workspaceId, input.trialId, id) : null;
  const written: string[] = [];
  try {
    await putObject(storageKey, input.file.bytes, inspected.contentType);
    written.push(storageKey);
    if (thumbKey && inspected.thumbnail) {
      await putObject(thumbKey, inspected.thumbnail, 'image/webp');
      written.push(thumbKey);
    }
    const em = await getEm();
    const row = em.create(Upload, {
      id,
      workspace: actor.workspaceId,
      trial: input.trialId,
      variantId: fields.variantId ?? null,
      cookId: fields.cookId ?? null,
      kind: inspected.kind,
      subject: fields.subject ?? null,
      originalName,
      contentType: inspected.contentType,
      sizeBytes: input.file.bytes.byteLength,
      storageKey,
      thumbnailKey: thumbKey,
      width: inspected.width,
      height: inspected.height,
      uploadedBy: actor.userId,
    });
    await em.flush();
    return toUploadView(row, actor.name);
  } catch (err) {
    await Promise.all(written.map((key) => deleteObject(key).catch((e: unknown) => logger.warn({ err: e, key }, 'could not remove an orphaned upload object'))));
    throw err;
  }
}

/** Removes the objects, then the row (S3 deletes are idempotent, so a retry after a failure completes it). */
export async function deleteUpload(actor: Actor, uploadId: string): Promise<void> {
  const row = await findUploadRow(actor, uploadId);
  await deleteObject(row.storageKey);
  if (row.thumbnailKey) await deleteObject(row.thumbnailKey);
  const em = await getEm();
  await em.nativeDelete(Upload, { ...inWorkspace(actor), id: row.id });
}
