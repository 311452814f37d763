import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getRevision } from '@/lib/formulas/queries';
import { notFound } from '@/lib/permissions';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ formulaId: string; number: string }>('formulas.read', async ({ actor, params }) => {
  const number = Number(params.number);
  if (!Number.isInteger(number) || number < 1 || number > 1_000_000) throw notFound('revision');
  return json({ revision: await getRevision(actor, uuidParam(params.formulaId, 'formula'), number) });
});
