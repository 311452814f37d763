import 'server-only';
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { Ingredient } from '@/entities';
import type { IngredientEntity } from '@/entities/Ingredient';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import type { IngredientComposition } from '@/lib/chemistry';
import { NUTRIENT_KEYS, type NutrientKey, type NutrientValues } from '@/lib/label/types';
import type { IngredientListQuery, IngredientView } from './schema';
import type { IngredientLabelFields } from './label-data';

/** A library row as the views read it; `updatedBy` is populated where the name is shown. */
type Row = IngredientEntity;

const OPTIONAL_KEYS = ['phMin', 'phMax', 'acidPct', 'pectinLevel', 'euFruitGroup', 'usFruitGroup', 'pectinType', 'pectinGrade', 'sweetenerType', 'acidType'] as const;

/**
 * What a composition is read from: a library row, or a view of one. A value nobody gave is null or
 * absent; the three sugars come from the row's label columns.
 */
type CompositionSource = Pick<IngredientComposition, 'kind' | 'name' | 'solidsPct'>
  & { [K in (typeof OPTIONAL_KEYS)[number]]?: IngredientComposition[K] | null }
  & { calciumSource?: boolean | null } & Partial<Record<'sucroseG' | 'glucoseG' | 'fructoseG', number | null>>;

/** The composition the chemistry module reads, without nulls or library bookkeeping. */
export function compositionOf(row: CompositionSource): IngredientComposition {
  const c: IngredientComposition = { kind: row.kind, name: row.name, solidsPct: row.solidsPct };
  Object.assign(c, Object.fromEntries(OPTIONAL_KEYS.filter((key) => row[key] != null).map((key) => [key, row[key]])));
  if (row.calciumSource) c.calciumSource = true;
  // Only a full profile is passed on: a sugar the library does not know is never taken as zero.
  const { sucroseG, glucoseG, fructoseG } = row;
  if (typeof sucroseG === 'number' && typeof glucoseG === 'number' && typeof fructoseG === 'number') c.sugars = { sucroseG, glucoseG, fructoseG };
  return c;
}

/** The label columns of a library row: one per nutrient, the allergen lists, the additive's two. */
type LabelColumns = Pick<IngredientEntity, NutrientKey | 'labelName' | 'euAllergens' | 'usAllergens' | 'sulphiteMgPerKg' | 'eNumber' | 'additiveClass' | 'isAddedWater' | 'compositionSource'>;

/** The stored label data of a row (columns per nutrient, allergen lists, the additive's two columns). */
export function labelDataOf(row: LabelColumns): IngredientLabelFields {
  const nutrients = Object.fromEntries(NUTRIENT_KEYS.map((k) => [k, row[k] ?? null])) as NutrientValues;
  const eNumber = row.eNumber ?? null;
  const additiveClass = row.additiveClass ?? null;
  return {
    labelName: row.labelName ?? null,
    nutrients,
    // Guarded: the JSON columns are the one place a hand-edited row could hold something else.
    euAllergens: Array.isArray(row.euAllergens) ? row.euAllergens : [],
    usAllergens: Array.isArray(row.usAllergens) ? row.usAllergens : [],
    sulphiteMgPerKg: row.sulphiteMgPerKg ?? null,
    additive: eNumber && additiveClass ? { eNumber, functionalClass: additiveClass } : null,
    isAddedWater: row.isAddedWater === true,
    source: row.compositionSource ?? null,
  };
}

export function toIngredientView(row: Row): IngredientView {
  return {
    ...compositionOf(row),
    id: row.id,
    origin: row.origin,
    source: row.source ?? null,
    notes: row.notes ?? null,
    labelData: labelDataOf(row),
    archived: !!row.archivedAt,
    updatedAt: row.updatedAt.toISOString(),
    updatedByName: row.updatedBy?.name ?? null,
  };
}

export async function listIngredients(actor: Actor, query: IngredientListQuery = {}): Promise<IngredientView[]> {
  const em = await getEm();
  const where: Record<string, unknown> = { ...inWorkspace(actor) };
  if (query.archived === 'only') where.archivedAt = { $ne: null };
  else if (query.archived !== 'include') where.archivedAt = null;
  if (query.kind) where.kind = query.kind;
  if (query.q?.trim()) where.name = { $ilike: `%${query.q.trim().replace(/[%_\\]/g, (c) => `\\${c}`)}%` };
  const sort = query.sort ?? 'name';
  const dir = query.dir ?? (sort === 'updatedAt' ? 'desc' : 'asc');
  const rows = await em.find(Ingredient, where, {
    populate: ['updatedBy'],
    orderBy: sort === 'name' ? { name: dir } : { [sort]: dir, name: 'asc' },
    limit: 1000,
  });
  return rows.map(toIngredientView);
}

export async function getIngredient(actor: Actor, id: string): Promise<IngredientView> {
  const em = await getEm();
  const row = await em.findOne(Ingredient, { ...inWorkspace(actor), id }, { populate: ['updatedBy'] });
  if (!row) throw notFound('ingredient');
  return toIngredientView(row);
}

/** Loads the named ingredients of the actor's workspace; ids of other workspaces simply do not match. */
export async function ingredientsByIds(actor: Actor, ids: string[]): Promise<Map<string, IngredientView>> {
  if (!ids.length) return new Map();
  const em = await getEm();
  const rows = await em.find(Ingredient, { ...inWorkspace(actor), id: { $in: [...new Set(ids)] } });
  return new Map(rows.map((r) => [r.id, toIngredientView(r)]));
}

/** The workspace's starter-library ingredient ids by their handbook key (strawberry, sucrose, …). */
export async function starterIdsByKey(em: EntityManager, workspaceId: string): Promise<Record<string, string>> {
  const rows = await em.find(Ingredient, { workspace: workspaceId, typicalKey: { $ne: null } });
  return Object.fromEntries(rows.map((r) => [r.typicalKey!, r.id]));
}
