import 'server-only';
/** Price and packaging writes, shared by the server actions and the API. Every point is an insert; a withdrawal is the only change. */
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { writeAudit } from '@/lib/audit';
import {
  CostSettings, Formula, Ingredient, IngredientPrice, PackagingItem, PackagingPrice, PackFormat, PackFormatItem, ProductVersion,
} from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { Conflict, ValidationFailed } from '@/lib/errors';
import { formatMoney, isCurrencyCode, parseAmount, toGrams } from './money';
import { PRICE_LIMITS } from './vocabulary';
import type { CostSettingsInput, IngredientPriceInput, PackagingItemInput, PackagingPriceInput, PackFormatInput } from './schema';

export const NO_CURRENCY_MESSAGE = 'Choose the workspace currency first (Settings → Costs and currency); every price is stated in it.';


/** Saves currency, overfill and warning threshold. The currency is fixed once a price exists: prices are never converted. */
export async function saveCostSettings(actor: Actor, input: CostSettingsInput): Promise<void> {
  if (!isCurrencyCode(input.currency)) throw new ValidationFailed('Choose a currency from the list.', { currency: ['Choose a currency from the list.'] });
  const em = await getEm();
  await em.transactional(async (tx) => {
    const row = await tx.findOne(CostSettings, { workspace: actor.workspaceId });
    if (row && row.currency !== input.currency && (await tx.count(IngredientPrice, { workspace: actor.workspaceId })) + (await tx.count(PackagingPrice, { workspace: actor.workspaceId })) > 0) {
      throw new Conflict(`The currency stays ${row.currency}: prices are already recorded in it and Setwell never converts them. Start a new workspace for another currency.`);
    }
    const columns = { currency: input.currency, overfillPct: input.overfillPct, costWarningPct: input.costWarningPct, updatedBy: actor.userId };
    if (row) tx.assign(row, columns);
    else tx.create(CostSettings, { ...columns, workspace: actor.workspaceId });
    await tx.flush();
    writeAudit(tx, actor, 'costs.settings_saved', { type: 'workspace', id: actor.workspaceId },
      `Cost settings: ${input.currency}, overfill ${input.overfillPct} %, warning above ${input.costWarningPct} %`);
  });
}

async function currencyOf(em: EntityManager, workspaceId: string): Promise<string> {
  const row = await em.findOne(CostSettings, { workspace: workspaceId });
  if (!row) throw new Conflict(NO_CURRENCY_MESSAGE);
  return row.currency;
}

function amountOrFail(raw: string, currency: string): number {
  const parsed = parseAmount(raw, currency);
  if ('problem' in parsed) throw new ValidationFailed(parsed.problem, { packPrice: [parsed.problem] });
  if (parsed.minor > PRICE_LIMITS.maxPackPriceMinor) throw new ValidationFailed('That price is too large.', { packPrice: [`At most ${formatMoney(PRICE_LIMITS.maxPackPriceMinor, currency)} per pack.`] });
  return parsed.minor;
}

function packSizeOrFail(input: Pick<IngredientPriceInput, 'packSize' | 'packUnit'>): number {
  const grams = toGrams(input.packSize, input.packUnit);
  if (grams < PRICE_LIMITS.minPackSizeG || grams > PRICE_LIMITS.maxPackSizeG) {
    throw new ValidationFailed('The pack size is out of range.', { packSize: [`Give a pack size from 1 mg to ${PRICE_LIMITS.maxPackSizeG / 1_000_000} t.`] });
  }
  return grams;
}

/** The checked columns of an ingredient price point (shared by the form, the API and the CSV import). */
export function ingredientPriceColumns(input: IngredientPriceInput, currency: string) {
  return {
    ingredient: input.ingredientId,
    validFrom: input.validFrom,
    packPriceMinor: amountOrFail(input.packPrice, currency),
    packSizeG: packSizeOrFail(input),
    supplier: input.supplier || null,
  };
}

export async function addIngredientPrice(actor: Actor, input: IngredientPriceInput): Promise<{ priceId: string }> {
  const em = await getEm();
  const ingredient = await em.findOne(Ingredient, { ...inWorkspace(actor), id: input.ingredientId });
  if (!ingredient) throw notFound('ingredient');
  const columns = ingredientPriceColumns(input, await currencyOf(em, actor.workspaceId));
  const row = em.create(IngredientPrice, { ...columns, workspace: actor.workspaceId, enteredBy: actor.userId });
  await em.flush();
  return { priceId: row.id };
}

/** Withdraws a mistaken point once, with the reason, in the audit trail too. The point stays on record. */
async function withdrawPoint(actor: Actor, kind: 'ingredient' | 'packaging', priceId: string, reason: string): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const entity = kind === 'ingredient' ? IngredientPrice : PackagingPrice;
    const where = { ...inWorkspace(actor), id: priceId };
    const row = kind === 'ingredient'
      ? await tx.findOne(IngredientPrice, where, { populate: ['ingredient'] }).then((r) => r && { validFrom: r.validFrom, packPriceMinor: r.packPriceMinor, withdrawnAt: r.withdrawnAt, subject: r.ingredient.name })
      : await tx.findOne(PackagingPrice, where, { populate: ['packagingItem'] }).then((r) => r && { validFrom: r.validFrom, packPriceMinor: r.packPriceMinor, withdrawnAt: r.withdrawnAt, subject: r.packagingItem.name });
    if (!row) throw notFound('price');
    if (row.withdrawnAt) throw new Conflict('This price was already withdrawn.');
    const n = await tx.nativeUpdate(entity as typeof IngredientPrice, { ...inWorkspace(actor), id: priceId, withdrawnAt: null }, { withdrawnAt: new Date(), withdrawnBy: actor.userId, withdrawReason: reason });
    if (n === 0) throw new Conflict('This price was already withdrawn.');
    const currency = await currencyOf(tx, actor.workspaceId);
    writeAudit(tx, actor, 'price.withdrawn', { type: `${kind}_price`, id: priceId },
      `Withdrew the price of ${row.subject} from ${row.validFrom} (${formatMoney(row.packPriceMinor, currency)}): ${reason}`);
  });
}

export function withdrawIngredientPrice(actor: Actor, priceId: string, reason: string): Promise<void> {
  return withdrawPoint(actor, 'ingredient', priceId, reason);
}

export function withdrawPackagingPrice(actor: Actor, priceId: string, reason: string): Promise<void> {
  return withdrawPoint(actor, 'packaging', priceId, reason);
}

export async function setRefuse(actor: Actor, ingredientId: string, refusePct: number): Promise<void> {
  const em = await getEm();
  const n = await em.nativeUpdate(Ingredient, { ...inWorkspace(actor), id: ingredientId }, { refusePct, updatedBy: actor.userId });
  if (n === 0) throw notFound('ingredient');
}

export async function createPackagingItem(actor: Actor, input: PackagingItemInput): Promise<{ packagingItemId: string }> {
  const em = await getEm();
  const row = em.create(PackagingItem, { ...input, workspace: actor.workspaceId });
  await em.flush();
  return { packagingItemId: row.id };
}

export async function updatePackagingItem(actor: Actor, id: string, input: PackagingItemInput): Promise<{ packagingItemId: string }> {
  const em = await getEm();
  const n = await em.nativeUpdate(PackagingItem, { ...inWorkspace(actor), id }, { name: input.name, kind: input.kind });
  if (n === 0) throw notFound('packaging item');
  return { packagingItemId: id };
}

export async function addPackagingPrice(actor: Actor, input: PackagingPriceInput): Promise<{ priceId: string }> {
  const em = await getEm();
  const item = await em.findOne(PackagingItem, { ...inWorkspace(actor), id: input.packagingItemId });
  if (!item) throw notFound('packaging item');
  const currency = await currencyOf(em, actor.workspaceId);
  const row = em.create(PackagingPrice, {
    workspace: actor.workspaceId, packagingItem: input.packagingItemId, validFrom: input.validFrom,
    packPriceMinor: amountOrFail(input.packPrice, currency), piecesPerPack: input.piecesPerPack,
    supplier: input.supplier || null, enteredBy: actor.userId,
  });
  await em.flush();
  return { priceId: row.id };
}

async function writeFormatItems(tx: EntityManager, actor: Actor, packFormatId: string, items: PackFormatInput['items']): Promise<void> {
  const ids = items.map((i) => i.packagingItemId);
  const found = ids.length ? await tx.count(PackagingItem, { ...inWorkspace(actor), id: { $in: ids } }) : 0;
  if (found !== ids.length) throw new ValidationFailed('A packaging item is not in this workspace.', { items: ['Pick packaging items from this workspace’s list.'] });
  await tx.nativeDelete(PackFormatItem, { ...inWorkspace(actor), packFormat: packFormatId });
  items.forEach((item, position) => {
    tx.create(PackFormatItem, { workspace: actor.workspaceId, packFormat: packFormatId, packagingItem: item.packagingItemId, pieces: item.pieces, perJars: item.perJars, position });
  });
}

export async function createPackFormat(actor: Actor, input: PackFormatInput): Promise<{ packFormatId: string }> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const row = tx.create(PackFormat, { workspace: actor.workspaceId, name: input.name, netFillG: input.netFillG });
    await tx.flush();
    await writeFormatItems(tx, actor, row.id, input.items);
    await tx.flush();
    return { packFormatId: row.id };
  });
}

/** Changes name, fill or packaging. Costs are computed from today's format (approval figures are frozen by lib/costing). */
export async function updatePackFormat(actor: Actor, id: string, input: PackFormatInput): Promise<{ packFormatId: string }> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const n = await tx.nativeUpdate(PackFormat, { ...inWorkspace(actor), id }, { name: input.name, netFillG: input.netFillG });
    if (n === 0) throw notFound('pack format');
    await writeFormatItems(tx, actor, id, input.items);
    await tx.flush();
    return { packFormatId: id };
  });
}

/** Archived items and formats keep their prices and their place in old costings but are no longer offered. */
export async function setPackagingArchived(actor: Actor, kind: 'item' | 'format', id: string, archived: boolean): Promise<void> {
  const em = await getEm();
  const entity = kind === 'item' ? PackagingItem : PackFormat;
  const n = await em.nativeUpdate(entity as typeof PackFormat, { ...inWorkspace(actor), id }, { archivedAt: archived ? new Date() : null });
  if (n === 0) throw notFound(kind === 'item' ? 'packaging item' : 'pack format');
}

async function pickableFormat(em: EntityManager, actor: Actor, packFormatId: string | null): Promise<{ id: string; name: string } | null> {
  if (packFormatId === null) return null;
  const format = await em.findOne(PackFormat, { ...inWorkspace(actor), id: packFormatId, archivedAt: null });
  if (!format) throw new ValidationFailed('Pick a pack format from the list.', { packFormatId: ['Pick a pack format from the list.'] });
  return { id: format.id, name: format.name };
}

export async function setFormulaPackFormat(actor: Actor, formulaId: string, packFormatId: string | null): Promise<void> {
  const em = await getEm();
  const formula = await em.findOne(Formula, { ...inWorkspace(actor), id: formulaId });
  if (!formula) throw notFound('formula');
  await pickableFormat(em, actor, packFormatId);
  await em.nativeUpdate(Formula, { ...inWorkspace(actor), id: formulaId }, { packFormat: packFormatId });
}

/** The one change a production version accepts after approval (the database guard allows nothing else); audited. */
export async function setVersionPackFormat(actor: Actor, versionId: string, packFormatId: string | null): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const version = await tx.findOne(ProductVersion, { ...inWorkspace(actor), id: versionId }, { populate: ['product'] });
    if (!version) throw notFound('production version');
    const format = await pickableFormat(tx, actor, packFormatId);
    await tx.nativeUpdate(ProductVersion, { ...inWorkspace(actor), id: versionId }, { packFormat: packFormatId });
    writeAudit(tx, actor, 'version.pack_format', { type: 'production_formula', id: versionId },
      `Pack format of ${version.product.code} v${version.version}: ${format ? format.name : 'none'}`);
  });
}
