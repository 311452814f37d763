import 'server-only';
/** Upload reads, scoped to the actor's workspace; another workspace's upload is a plain 404. */
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { Upload } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { isUuid } from '@/lib/ids';
import { loadTrial } from '@/lib/trials/access';
import { getObject } from '@/lib/storage';
import { cleanFileName, contentDisposition, PHOTO_CONTENT_TYPES } from './content';
import { thumbnailUrl, uploadUrl, uploadListQuerySchema, type UploadDownload, type UploadKind, type UploadListQuery, type UploadSubject, type UploadView } from './schema';

interface UploadRow {
  id: string;
  kind: UploadKind;
  subject?: string | null;
  variantId?: string | null;
  cookId?: string | null;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  storageKey: string;
  thumbnailKey?: string | null;
  width?: number | null;
  height?: number | null;
  createdAt: Date;
  uploadedBy?: { name?: string } | null;
}

export function toUploadView(row: UploadRow, uploadedByName?: string): UploadView {
  return {
    id: row.id,
    kind: row.kind,
    subject: (row.subject as UploadSubject | null | undefined) ?? null,
    variantId: row.variantId ?? null,
    cookId: row.cookId ?? null,
    // Cleaned again on the way out: rows stored before the name rules are shown safely too.
    originalName: cleanFileName(row.originalName),
    contentType: row.contentType,
    sizeBytes: row.sizeBytes,
    width: row.width ?? null,
    height: row.height ?? null,
    createdAt: row.createdAt.toISOString(),
    uploadedByName: uploadedByName ?? row.uploadedBy?.name ?? null,
    url: uploadUrl(row.id),
    thumbnailUrl: row.thumbnailKey ? thumbnailUrl(row.id) : null,
  };
}

/** A trial's uploads in the order they were taken (oldest first), optionally for one variant or cook. */
export async function listUploads(actor: Actor, trialId: string, query: UploadListQuery = {}): Promise<UploadView[]> {
  await loadTrial(actor, trialId);
  return readUploads(actor, trialId, query);
}

/**
 * listUploads without its trial check, for a caller that checks the trial itself in the same
 * request (the trial page). Still scoped to the actor's workspace.
 */
export async function readUploads(actor: Actor, trialId: string, query: UploadListQuery = {}): Promise<UploadView[]> {
  const filter = uploadListQuerySchema.parse(query);
  // One plain statement (the trial page reads it on every load); the optional filters are null when not asked.
  const rows = await sql<UploadRow & { uploadedByName: string | null }>(
    `select x.id, x.kind, x.subject, x.variant_id as "variantId", x.measurement_id as "cookId", x.original_name as "originalName",
            x.content_type as "contentType", x.size_bytes as "sizeBytes", x.storage_key as "storageKey", x.thumbnail_key as "thumbnailKey",
            x.width, x.height, x.created_at as "createdAt", u.name as "uploadedByName"
       from uploads x left join users u on u.id = x.uploaded_by_id
      where x.workspace_id = $1 and x.trial_id = $2 and ($3::uuid is null or x.variant_id = $3) and ($4::uuid is null or x.measurement_id = $4)
      order by x.created_at, x.id
      limit 1000`,
    [actor.workspaceId, trialId, filter.variantId ?? null, filter.cookId ?? null],
    'trial-uploads',
  );
  return rows.map((r) => toUploadView(r, r.uploadedByName ?? undefined));
}

/** The row itself (storage keys included), for the download and delete paths only. */
export async function findUploadRow(actor: Actor, uploadId: string): Promise<UploadRow> {
  if (!isUuid(uploadId)) throw notFound('upload');
  const em = await getEm();
  const row = await em.findOne(Upload, { ...inWorkspace(actor), id: uploadId }, { populate: ['uploadedBy'] });
  if (!row) throw notFound('upload');
  return row;
}

export async function getUpload(actor: Actor, uploadId: string): Promise<UploadView> {
  return toUploadView(await findUploadRow(actor, uploadId));
}

/**
 * The original or the thumbnail with the headers a download needs: the sniffed type (never the
 * client's), nosniff so browsers do not second-guess it, inline only for photos.
 */
export async function openUpload(actor: Actor, uploadId: string, which: 'original' | 'thumbnail'): Promise<UploadDownload> {
  const row = await findUploadRow(actor, uploadId);
  const key = which === 'original' ? row.storageKey : row.thumbnailKey;
  if (!key) throw notFound('thumbnail');
  const object = await getObject(key);
  if (!object) throw notFound(which === 'original' ? 'upload' : 'thumbnail');

  const contentType = which === 'thumbnail' ? 'image/webp' : row.contentType === 'text/csv' ? 'text/csv; charset=utf-8' : row.contentType;
  // Only pictures open in the browser; a PDF (which can carry actions that run on opening) or a CSV is saved.
  const inline = which === 'thumbnail' || PHOTO_CONTENT_TYPES.has(row.contentType);
  const fileName = which === 'thumbnail' ? `${row.originalName.replace(/\.[^.]*$/, '')}-thumbnail.webp` : row.originalName;
  const headers: Record<string, string> = {
    'content-type': contentType,
    'content-disposition': contentDisposition(inline ? 'inline' : 'attachment', fileName),
    'x-content-type-options': 'nosniff',
    'cache-control': 'private, max-age=300',
  };
  if (object.contentLength !== undefined) headers['content-length'] = String(object.contentLength);
  return { body: object.body, headers };
}
