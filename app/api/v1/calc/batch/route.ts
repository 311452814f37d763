import { apiRoute, json } from '@/lib/api/route';
import { calcBatchSchema } from '@/lib/formulas/schema';
import { calculateBatch } from '@/lib/formulas/calculator';

export const dynamic = 'force-dynamic';

/** Stateless: computes a posted formula and stores nothing. */
export const POST = apiRoute('calc.run', async ({ actor, body }) => json(await calculateBatch(actor, await body(calcBatchSchema))));
