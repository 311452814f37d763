import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { setVersionPackFormat } from '@/lib/pricing/mutations';
import { packFormatChoiceSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

/** The one change a version accepts after approval: the jar it is filled in (audited). */
export const PUT = apiRoute<{ versionId: string }>('prices.write', async ({ actor, params, body }) => {
  const versionId = uuidParam(params.versionId, 'production version');
  await setVersionPackFormat(actor, versionId, (await body(packFormatChoiceSchema)).packFormatId);
  return json({ ok: true });
});
