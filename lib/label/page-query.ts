/** The label pages' query: a reference the schema refuses is ignored and reported, never passed on. */
import { ValidationFailed } from '@/lib/errors';
import { listFormulas } from '@/lib/formulas/queries';
import type { Actor } from '@/lib/permissions';
import { claimReferenceChoice, type LabelQuery, type LabelView } from './schema';

export async function labelForPage<V extends LabelView>(
  raw: string | string[] | undefined,
  load: (query: LabelQuery) => Promise<V>,
): Promise<{ view: V; referenceError?: string }> {
  const parsed = typeof raw === 'string' && raw !== '' ? claimReferenceChoice.safeParse(raw) : null;
  if (parsed && !parsed.success) return { view: await load({}), referenceError: 'Choose a reference from the list.' };
  try {
    return { view: await load(parsed?.success ? { reference: parsed.data } : {}) };
  } catch (err) {
    if (!(err instanceof ValidationFailed)) throw err;
    return { view: await load({}), referenceError: err.fields.reference?.[0] ?? err.message };
  }
}

/** Other formulas of the workspace a claim may be measured against. */
export async function referenceOptions(actor: Actor, exceptFormulaId?: string): Promise<Array<{ value: string; label: string }>> {
  return (await listFormulas(actor)).filter((f) => f.id !== exceptFormulaId).map((f) => ({ value: f.id, label: f.name }));
}
