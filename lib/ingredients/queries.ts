import 'server-only';
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { Ingredient } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import type { IngredientComposition } from '@/lib/chemistry';
import { NUTRIENT_KEYS, type NutrientValues } from '@/lib/label/types';
import type { IngredientListQuery, IngredientView } from './schema';
import type { AdditiveClass, IngredientLabelFields } from './label-data';

type Row = Record<string, unknown> & {
  id: string; name: string; kind: IngredientView['kind']; solidsPct: number; origin: IngredientView['origin'];
  updatedAt: Date; archivedAt?: Date | null; updatedBy?: { name: string } | null;
};

const OPTIONAL_KEYS = ['phMin', 'phMax', 'acidPct', 'pectinLevel', 'euFruitGroup', 'usFruitGroup', 'pectinType', 'pectinGrade', 'sweetenerType', 'acidType'] as const;

/** The composition the chemistry module reads, without nulls or library bookkeeping. */
export function compositionOf(row: { kind: string; name: string; solidsPct: number; calciumSource?: boolean | null }): IngredientComposition {
  const source = row as Record<string, unknown>;
  const c: Record<string, unknown> = { kind: row.kind, name: row.name, solidsPct: row.solidsPct };
  for (const key of OPTIONAL_KEYS) if (source[key] != null) c[key] = source[key];
  if (row.calciumSource) c.calciumSource = true;
  // Only a full profile is passed on: a sugar the library does not know is never taken as zero.
  const [sucroseG, glucoseG, fructoseG] = [source.sucroseG, source.glucoseG, source.fructoseG];
  if (typeof sucroseG === 'number' && typeof glucoseG === 'number' && typeof fructoseG === 'number') c.sugars = { sucroseG, glucoseG, fructoseG };
  return c as unknown as IngredientComposition;
}

/** The stored label data of a row (columns per nutrient, allergen lists, the additive's two columns). */
export function labelDataOf(row: Record<string, unknown>): IngredientLabelFields {
  const nutrients = Object.fromEntries(NUTRIENT_KEYS.map((k) => [k, (row[k] as number | null | undefined) ?? null])) as NutrientValues;
  const eNumber = (row.eNumber as string | null | undefined) ?? null;
  const additiveClass = (row.additiveClass as AdditiveClass | null | undefined) ?? null;
  return {
    labelName: (row.labelName as string | null | undefined) ?? null,
    nutrients,
    euAllergens: Array.isArray(row.euAllergens) ? (row.euAllergens as IngredientLabelFields['euAllergens']) : [],
    usAllergens: Array.isArray(row.usAllergens) ? (row.usAllergens as IngredientLabelFields['usAllergens']) : [],
    sulphiteMgPerKg: (row.sulphiteMgPerKg as number | null | undefined) ?? null,
    additive: eNumber && additiveClass ? { eNumber, functionalClass: additiveClass } : null,
    isAddedWater: row.isAddedWater === true,
    source: (row.compositionSource as string | null | undefined) ?? null,
  };
}

export function toIngredientView(row: Row): IngredientView {
  return {
    ...compositionOf(row),
    id: row.id,
    origin: row.origin,
    source: (row.source as string | null) ?? null,
    notes: (row.notes as string | null) ?? null,
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
  return (rows as unknown as Row[]).map(toIngredientView);
}

export async function getIngredient(actor: Actor, id: string): Promise<IngredientView> {
  const em = await getEm();
  const row = await em.findOne(Ingredient, { ...inWorkspace(actor), id }, { populate: ['updatedBy'] });
  if (!row) throw notFound('ingredient');
  return toIngredientView(row as unknown as Row);
}

/** Loads the named ingredients of the actor's workspace; ids of other workspaces simply do not match. */
export async function ingredientsByIds(actor: Actor, ids: string[]): Promise<Map<string, IngredientView>> {
  if (!ids.length) return new Map();
  const em = await getEm();
  const rows = await em.find(Ingredient, { ...inWorkspace(actor), id: { $in: [...new Set(ids)] } });
  return new Map((rows as unknown as Row[]).map((r) => [r.id, toIngredientView(r)]));
}

/** The workspace's starter-library ingredient ids by their handbook key (strawberry, sucrose, …). */
export async function starterIdsByKey(em: EntityManager, workspaceId: string): Promise<Record<string, string>> {
  const rows = await em.find(Ingredient, { workspace: workspaceId, typicalKey: { $ne: null } });
  return Object.fromEntries(rows.map((r) => [r.typicalKey!, r.id]));
}
