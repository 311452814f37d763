import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { Conflict } from '@/lib/errors';
import { getProductionVersion } from '@/lib/production/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ versionId: string }>('production.read', async ({ actor, params }) =>
  json({ version: await getProductionVersion(actor, uuidParam(params.versionId, 'production version')) }));

/** A production version is a record of what was approved: nobody edits or deletes it (409). */
async function refuseChange({ actor, params }: { actor: Parameters<typeof getProductionVersion>[0]; params: { versionId: string } }): Promise<Response> {
  const version = await getProductionVersion(actor, uuidParam(params.versionId, 'production version'));
  throw new Conflict(`${version.product.code} v${version.version} is an approved production version and cannot be changed. Promote a new version instead.`);
}

export const PATCH = apiRoute<{ versionId: string }>('production.read', refuseChange);
export const PUT = apiRoute<{ versionId: string }>('production.read', refuseChange);
export const DELETE = apiRoute<{ versionId: string }>('production.read', refuseChange);
