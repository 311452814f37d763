'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { id } from '@/lib/input';
import {
  costSettingsSchema, ingredientPriceSchema, packagingItemSchema, packagingPriceSchema, packFormatChoiceSchema, packFormatSchema,
  priceImportSchema, refuseSchema, withdrawSchema,
} from './schema';
import {
  addIngredientPrice, addPackagingPrice, createPackagingItem, createPackFormat, saveCostSettings, setFormulaPackFormat, setPackagingArchived,
  setRefuse, setVersionPackFormat, updatePackagingItem, updatePackFormat, withdrawIngredientPrice, withdrawPackagingPrice,
} from './mutations';
import { importPricesCsv } from './csv';

function refresh(): void {
  revalidatePath('/prices', 'layout');
}

export async function saveCostSettingsAction(input: unknown) {
  const result = await runAction('costs.settings', costSettingsSchema, input, saveCostSettings);
  if (result.ok) revalidatePath('/settings/costs');
  return result;
}

export async function addIngredientPriceAction(input: unknown) {
  const result = await runAction('prices.write', ingredientPriceSchema, input, addIngredientPrice);
  if (result.ok) refresh();
  return result;
}

export async function withdrawIngredientPriceAction(priceId: unknown, input: unknown) {
  const schema = z.object({ priceId: id('Unknown price.'), change: withdrawSchema });
  const result = await runAction('prices.write', schema, { priceId, change: input }, (actor, d) => withdrawIngredientPrice(actor, d.priceId, d.change.reason));
  if (result.ok) refresh();
  return result;
}

export async function setRefuseAction(input: unknown) {
  const result = await runAction('prices.write', refuseSchema, input, (actor, d) => setRefuse(actor, d.ingredientId, d.refusePct));
  if (result.ok) refresh();
  return result;
}

export async function importPricesAction(input: unknown) {
  const result = await runAction('prices.write', priceImportSchema, input, (actor, d) => importPricesCsv(actor, d.csv));
  if (result.ok) refresh();
  return result;
}

/** Creates when packagingItemId is null, otherwise renames that item. */
export async function savePackagingItemAction(packagingItemId: unknown, input: unknown) {
  const schema = z.object({ packagingItemId: id('Unknown packaging item.').nullable(), data: packagingItemSchema });
  const result = await runAction('prices.write', schema, { packagingItemId, data: input }, (actor, d) =>
    d.packagingItemId ? updatePackagingItem(actor, d.packagingItemId, d.data) : createPackagingItem(actor, d.data),
  );
  if (result.ok) refresh();
  return result;
}

export async function addPackagingPriceAction(input: unknown) {
  const result = await runAction('prices.write', packagingPriceSchema, input, addPackagingPrice);
  if (result.ok) refresh();
  return result;
}

export async function withdrawPackagingPriceAction(priceId: unknown, input: unknown) {
  const schema = z.object({ priceId: id('Unknown price.'), change: withdrawSchema });
  const result = await runAction('prices.write', schema, { priceId, change: input }, (actor, d) => withdrawPackagingPrice(actor, d.priceId, d.change.reason));
  if (result.ok) refresh();
  return result;
}

/** Creates when packFormatId is null, otherwise replaces that format's name, fill and packaging. */
export async function savePackFormatAction(packFormatId: unknown, input: unknown) {
  const schema = z.object({ packFormatId: id('Unknown pack format.').nullable(), data: packFormatSchema });
  const result = await runAction('prices.write', schema, { packFormatId, data: input }, (actor, d) =>
    d.packFormatId ? updatePackFormat(actor, d.packFormatId, d.data) : createPackFormat(actor, d.data),
  );
  if (result.ok) refresh();
  return result;
}

export async function archivePackagingAction(kind: unknown, recordId: unknown, archived: unknown) {
  const schema = z.object({ kind: z.enum(['item', 'format']), recordId: id(), archived: z.boolean() });
  const result = await runAction('prices.write', schema, { kind, recordId, archived }, (actor, d) => setPackagingArchived(actor, d.kind, d.recordId, d.archived));
  if (result.ok) refresh();
  return result;
}

export async function setFormulaPackFormatAction(formulaId: unknown, input: unknown) {
  const schema = z.object({ formulaId: id('Unknown formula.'), choice: packFormatChoiceSchema });
  const result = await runAction('formulas.write', schema, { formulaId, choice: input }, (actor, d) => setFormulaPackFormat(actor, d.formulaId, d.choice.packFormatId));
  if (result.ok) revalidatePath(`/formulas/${String(formulaId)}`);
  return result;
}

export async function setVersionPackFormatAction(versionId: unknown, input: unknown) {
  const schema = z.object({ versionId: id('Unknown production version.'), choice: packFormatChoiceSchema });
  const result = await runAction('prices.write', schema, { versionId, choice: input }, (actor, d) => setVersionPackFormat(actor, d.versionId, d.choice.packFormatId));
  if (result.ok) revalidatePath('/production', 'layout');
  return result;
}
