import 'server-only';
/**
 * Object storage for photos and files: any S3-compatible store (AWS S3, MinIO, the local fake in
 * scripts/s3-fake.ts), configured from the S3_* variables. The app proxies every download, so
 * buckets stay private and no presigned URL ever leaves the server.
 */
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { storageEnv } from '@/lib/env';

/** Typed in lib/process-cache.ts. */
const cache = globalThis;

/** One client per process, cached on globalThis so dev-server reloads do not open new sockets. */
export function storageClient(): S3Client {
  if (cache.setwellS3) return cache.setwellS3;
  const e = storageEnv();
  cache.setwellS3 = new S3Client({
    region: e.S3_REGION,
    endpoint: e.S3_ENDPOINT,
    forcePathStyle: e.S3_FORCE_PATH_STYLE === 'true',
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    // Checksum headers only where S3 demands them: many S3-compatible stores reject the newer defaults.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  return cache.setwellS3;
}

function bucket(): string {
  return storageEnv().S3_BUCKET;
}

/** Where an upload's original bytes live. */
export function originalKey(workspaceId: string, trialId: string, uploadId: string): string {
  return `${workspaceId}/${trialId}/${uploadId}/original`;
}

/** Where an upload's WebP thumbnail lives (photos only). */
export function thumbnailKey(workspaceId: string, trialId: string, uploadId: string): string {
  return `${workspaceId}/${trialId}/${uploadId}/thumb.webp`;
}

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  await storageClient().send(
    new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength }),
  );
}

export interface StoredObject {
  /** A web stream, so a download is passed through without holding it in memory. */
  body: ReadableStream<Uint8Array>;
  contentType: string | undefined;
  contentLength: number | undefined;
}

function isMissing(err: unknown): boolean {
  if (err instanceof S3ServiceException) {
    return err.name === 'NoSuchKey' || err.name === 'NotFound' || err.name === 'NoSuchBucket' || err.$metadata?.httpStatusCode === 404;
  }
  return false;
}

/** The object, or null when there is none under that key. */
export async function getObject(key: string): Promise<StoredObject | null> {
  try {
    const res = await storageClient().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    if (!res.Body) return null;
    return {
      body: res.Body.transformToWebStream() as ReadableStream<Uint8Array>,
      contentType: res.ContentType,
      contentLength: res.ContentLength,
    };
  } catch (err) {
    if (isMissing(err)) return null;
    throw err;
  }
}

/** The whole object in memory, or null; for small objects and checks. */
export async function getObjectBytes(key: string): Promise<Uint8Array | null> {
  const found = await getObject(key);
  if (!found) return null;
  return new Uint8Array(await new Response(found.body).arrayBuffer());
}

/** Deleting a key that is not there succeeds, as in S3, so a retried delete is harmless. */
export async function deleteObject(key: string): Promise<void> {
  await storageClient().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}

/** Keys under a prefix (at most 1000): for checks and clean-up, not for listing uploads (the table does that). */
export async function listObjectKeys(prefix: string): Promise<string[]> {
  const res = await storageClient().send(new ListObjectsV2Command({ Bucket: bucket(), Prefix: prefix, MaxKeys: 1000 }));
  return (res.Contents ?? []).map((o) => o.Key!).filter(Boolean);
}

/** Creates the bucket when it is missing (the fake's start and the tests call it). */
export async function ensureBucket(): Promise<void> {
  const client = storageClient();
  try {
    await client.send(new HeadBucketCommand({ Bucket: bucket() }));
    return;
  } catch (err) {
    if (!isMissing(err)) throw err;
  }
  try {
    await client.send(new CreateBucketCommand({ Bucket: bucket() }));
  } catch (err) {
    // Another process may have created it in between.
    const name = (err as { name?: string }).name;
    if (name !== 'BucketAlreadyOwnedByYou' && name !== 'BucketAlreadyExists') throw err;
  }
}
