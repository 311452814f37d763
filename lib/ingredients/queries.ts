import 'server-only';
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { Ingredient } from '@/entities';
import type { IngredientEntity } from '@/entities/Ingredient';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import type { IngredientComposition } from '@/lib/chemistry';
import { NUTRIENT_KEYS, type NutrientKey, type NutrientValues } from '@/lib/label/types';
import type { IngredientListQuery, IngredientView } from './schema';
import type { IngredientLabelFields } from './label-data';
import { fullSugarProfile, type SugarValues } from '@/lib/label/water-activity';

const OPTIONAL_KEYS = ['phMin', 'phMax', 'acidPct', 'pectinLevel', 'euFruitGroup', 'usFruitGroup', 'pectinType', 'pectinGrade', 'sweetenerType', 'acidType'] as const;

/** The columns a view of a library row reads, by their property names. */
const VIEW_FIELDS = [
  'id', 'name', 'kind', 'solidsPct', ...OPTIONAL_KEYS, 'calciumSource', 'origin', 'source', 'notes', 'archivedAt', 'updatedAt',
  'labelName', ...NUTRIENT_KEYS, 'euAllergens', 'usAllergens', 'sulphiteMgPerKg', 'eNumber', 'additiveClass', 'isAddedWater', 'compositionSource',
] as const;

/** A library row as the views read it: an entity, or a plain row read by listIngredients; `updatedBy` where the name is shown. */
type Row = Pick<IngredientEntity, (typeof VIEW_FIELDS)[number]> & { updatedBy?: { name: string } | null };

/** The select list of VIEW_FIELDS: each column (the ORM's underscore naming) under its property name. */
const VIEW_SELECT = VIEW_FIELDS.map((f) => `i.${f.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)} as "${f}"`).join(', ');

/** The list's sort keys and their columns; anything else never reaches the statement (the query schema allows only these). */
const SORT_COLUMNS: Record<NonNullable<IngredientListQuery['sort']>, string> = { name: 'i.name', kind: 'i.kind', solidsPct: 'i.solids_pct', origin: 'i.origin', updatedAt: 'i.updated_at' };

/** The composition fields of a library row, a view of one, or an ingredient sent with a request; a value nobody gave is null or absent. */
type CompositionSource = Pick<IngredientComposition, 'kind' | 'name' | 'solidsPct'>
  & { [K in (typeof OPTIONAL_KEYS)[number]]?: IngredientComposition[K] | null }
  & { calciumSource?: boolean | null };

/**
 * The composition the chemistry module reads, without nulls or library bookkeeping. The sugar
 * profile is a required argument, always the ingredient's label data (`labelData.nutrients`, or a
 * row's own columns): a view's or a request's fields alone do not carry it, and a line stored
 * without it would estimate water activity from the ingredient kinds.
 */
export function compositionOf(fields: CompositionSource, sugars: SugarValues): IngredientComposition {
  const c: IngredientComposition = { kind: fields.kind, name: fields.name, solidsPct: fields.solidsPct };
  Object.assign(c, Object.fromEntries(OPTIONAL_KEYS.filter((key) => fields[key] != null).map((key) => [key, fields[key]])));
  if (fields.calciumSource) c.calciumSource = true;
  const profile = fullSugarProfile(sugars);
  if (profile) c.sugars = profile;
  return c;
}

/** A library ingredient as a formula line stores it: its composition with the sugars of its label data. */
export function compositionOfView(view: IngredientView): IngredientComposition {
  return compositionOf(view, view.labelData.nutrients);
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
  const labelData = labelDataOf(row);
  return {
    ...compositionOf(row, labelData.nutrients),
    id: row.id,
    origin: row.origin,
    source: row.source ?? null,
    notes: row.notes ?? null,
    labelData,
    archived: !!row.archivedAt,
    updatedAt: row.updatedAt.toISOString(),
    updatedByName: row.updatedBy?.name ?? null,
  };
}

/**
 * The library, filtered and sorted, in one plain statement: the formula editor reads all of it on
 * every load, and making an entity of each row was a large part of that page's time.
 */
export async function listIngredients(actor: Actor, query: IngredientListQuery = {}): Promise<IngredientView[]> {
  const where = ['i.workspace_id = $1'];
  const values: unknown[] = [actor.workspaceId];
  if (query.archived === 'only') where.push('i.archived_at is not null');
  else if (query.archived !== 'include') where.push('i.archived_at is null');
  if (query.kind) where.push(`i.kind = $${values.push(query.kind)}`);
  if (query.q?.trim()) where.push(`i.name ilike $${values.push(`%${query.q.trim().replace(/[%_\\]/g, (c) => `\\${c}`)}%`)}`);
  const sort = query.sort ?? 'name';
  const dir = (query.dir ?? (sort === 'updatedAt' ? 'desc' : 'asc')) === 'desc' ? 'desc' : 'asc';
  const order = sort === 'name' ? `i.name ${dir}` : `${SORT_COLUMNS[sort]} ${dir}, i.name asc`;
  const rows = await sql<Row & { updatedByName: string | null }>(
    `select ${VIEW_SELECT}, u.name as "updatedByName"
       from ingredients i left join users u on u.id = i.updated_by_id
      where ${where.join(' and ')}
      order by ${order}, i.id
      limit 1000`,
    values,
    `ingredients-${query.archived ?? 'current'}-${query.kind ? 'kind' : 'any'}-${query.q?.trim() ? 'q' : 'all'}-${sort}-${dir}`,
  );
  return rows.map((r) => toIngredientView({ ...r, updatedBy: r.updatedByName === null ? null : { name: r.updatedByName } }));
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
