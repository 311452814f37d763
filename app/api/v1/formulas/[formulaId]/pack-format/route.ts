import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { setFormulaPackFormat } from '@/lib/pricing/mutations';
import { packFormatChoiceSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const PUT = apiRoute<{ formulaId: string }>('formulas.write', async ({ actor, params, body }) => {
  const formulaId = uuidParam(params.formulaId, 'formula');
  await setFormulaPackFormat(actor, formulaId, (await body(packFormatChoiceSchema)).packFormatId);
  return json({ ok: true });
});
