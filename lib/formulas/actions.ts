'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { createFormulaSchema, reviseFormulaSchema } from './schema';
import { createFormula, reviseFormula } from './mutations';

export async function createFormulaAction(input: unknown) {
  const result = await runAction('formulas.write', createFormulaSchema, input, createFormula);
  if (result.ok) revalidatePath('/formulas');
  return result;
}

export async function reviseFormulaAction(formulaId: unknown, input: unknown) {
  const schema = z.object({ formulaId: z.uuid('Unknown formula.'), change: reviseFormulaSchema });
  const result = await runAction('formulas.write', schema, { formulaId, change: input }, (actor, d) => reviseFormula(actor, d.formulaId, d.change));
  if (result.ok) revalidatePath(`/formulas/${String(formulaId)}`);
  return result;
}
