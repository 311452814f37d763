/** Ingredient library writes, shared by the server actions and the API. */
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { Ingredient } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { TYPICAL_INGREDIENTS } from '@/lib/chemistry';
import type { IngredientInput } from './schema';
import type { IngredientLabelFields } from './label-data';
import { STARTER_LABEL_DATA } from './starter-composition';

/** The label data as entity properties: one column per nutrient, the additive in two. */
export function labelColumns(d: IngredientLabelFields) {
  return {
    ...d.nutrients,
    labelName: d.labelName,
    euAllergens: d.euAllergens,
    usAllergens: d.usAllergens,
    sulphiteMgPerKg: d.sulphiteMgPerKg,
    eNumber: d.additive?.eNumber ?? null,
    additiveClass: d.additive?.functionalClass ?? null,
    isAddedWater: d.isAddedWater,
    compositionSource: d.source,
  };
}

function columns(input: IngredientInput) {
  return {
    name: input.name,
    kind: input.kind,
    solidsPct: input.solidsPct,
    phMin: input.phMin ?? null,
    phMax: input.phMax ?? null,
    acidPct: input.acidPct ?? null,
    pectinLevel: input.pectinLevel ?? null,
    euFruitGroup: input.euFruitGroup ?? null,
    usFruitGroup: input.usFruitGroup ?? null,
    pectinType: input.pectinType ?? null,
    pectinGrade: input.pectinGrade ?? null,
    sweetenerType: input.sweetenerType ?? null,
    acidType: input.acidType ?? null,
    calciumSource: input.calciumSource ?? false,
    notes: input.notes ?? null,
    // Left out (an API client that predates label data): the stored label data stays.
    ...(input.labelData ? labelColumns(input.labelData) : {}),
  };
}

export async function createIngredient(actor: Actor, input: IngredientInput): Promise<{ ingredientId: string }> {
  const em = await getEm();
  const row = em.create(Ingredient, { ...columns(input), workspace: actor.workspaceId, origin: 'custom', updatedBy: actor.userId } as never) as unknown as { id: string };
  await em.flush();
  return { ingredientId: row.id };
}

/** Editing a handbook entry makes it the workspace's own value: its handbook source no longer applies. */
export async function updateIngredient(actor: Actor, id: string, input: IngredientInput): Promise<{ ingredientId: string }> {
  const em = await getEm();
  const row = await em.findOne(Ingredient, { ...inWorkspace(actor), id });
  if (!row) throw notFound('ingredient');
  em.assign(row, { ...columns(input), updatedBy: actor.userId } as never);
  if (row.origin === 'typical') {
    row.origin = 'edited';
    row.source = null;
  }
  await em.flush();
  return { ingredientId: row.id };
}

/** Archived ingredients stay in old revisions (which hold a snapshot) but cannot be picked for new lines. */
export async function setIngredientArchived(actor: Actor, id: string, archived: boolean): Promise<void> {
  const em = await getEm();
  const n = await em.nativeUpdate(Ingredient, { ...inWorkspace(actor), id }, { archivedAt: archived ? new Date() : null, updatedBy: actor.userId } as never);
  if (n === 0) throw notFound('ingredient');
}

/** A new workspace starts with the handbook starter library, each entry marked typical with its source. */
export async function addStarterLibrary(em: EntityManager, workspaceId: string): Promise<number> {
  for (const t of TYPICAL_INGREDIENTS) {
    const { key, source, ...composition } = t;
    const labelData = STARTER_LABEL_DATA[key];
    em.create(Ingredient, {
      ...columns({ ...composition, notes: null, labelData } as IngredientInput),
      workspace: workspaceId,
      origin: 'typical',
      typicalKey: key,
      source,
    } as never);
  }
  await em.flush();
  return TYPICAL_INGREDIENTS.length;
}
