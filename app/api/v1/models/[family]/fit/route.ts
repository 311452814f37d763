import { apiRoute, json } from '@/lib/api/route';
import { familyModelOrNotFound } from '@/lib/modelling/queries';
import { familyParam } from '@/lib/modelling/respond';
import { fitOptionsSchema } from '@/lib/modelling/schema';

export const dynamic = 'force-dynamic';

/** POST because the options are a body; it reads and fits, and stores nothing. */
export const POST = apiRoute<{ family: string }>('models.read', async ({ actor, params, body }) => {
  const family = familyParam(params.family);
  return json(await familyModelOrNotFound(actor, family, await body(fitOptionsSchema)));
});
