/** Authorisation-table rows for the uploads feature (merged into access-table.ts). */
import sharp from 'sharp';
import type { ActionCase, RouteCase } from './access-table';
import { createFixtureTrial } from './fixtures';
import { actorOf, type WorkspaceFixture } from './harness';
import { createUpload } from '@/lib/uploads/mutations';
import { ensureBucket } from '@/lib/storage';
import type { Role } from '@/lib/permissions';

const READ: Role[] = ['admin', 'developer', 'head_of_product'];
const WRITE: Role[] = ['admin', 'developer'];

/** A small generated PNG (no real picture). */
async function tinyPng(): Promise<Uint8Array> {
  return new Uint8Array(await sharp({ create: { width: 32, height: 24, channels: 3, background: '#a4243b' } }).png().toBuffer());
}

async function trialOf(a: WorkspaceFixture): Promise<string> {
  await ensureBucket();
  return (await createFixtureTrial(a)).trialId;
}

/** A fresh photo on a fresh trial of workspace A, so each caller deletes its own. */
async function photoOf(a: WorkspaceFixture): Promise<string> {
  const trialId = await trialOf(a);
  const upload = await createUpload(actorOf(a, 'developer'), { trialId, subject: 'jar', file: { name: 'matrix.png', bytes: await tinyPng() } });
  return upload.id;
}

async function photoForm(): Promise<FormData> {
  const form = new FormData();
  form.set('file', new File([(await tinyPng()) as BlobPart], 'matrix.png', { type: 'image/png' }));
  form.set('subject', 'set_test');
  return form;
}

export const UPLOADS_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/trials/[trialId]/uploads', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: await trialOf(a) } }) },
  {
    route: 'POST /api/v1/trials/[trialId]/uploads',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { trialId: await trialOf(a) }, body: await photoForm() }),
  },
  { route: 'GET /api/v1/uploads/[uploadId]', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { uploadId: await photoOf(a) } }) },
  { route: 'GET /api/v1/uploads/[uploadId]/thumbnail', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { uploadId: await photoOf(a) } }) },
  { route: 'DELETE /api/v1/uploads/[uploadId]', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ params: { uploadId: await photoOf(a) } }) },
];
export const UPLOADS_ACTION_CASES: ActionCase[] = [];
