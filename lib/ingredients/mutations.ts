import 'server-only';
/** Ingredient library writes, shared by the server actions and the API. */
import { wrap } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { Ingredient } from '@/entities';
import type { IngredientEntity } from '@/entities/Ingredient';
import { ValidationFailed } from '@/lib/errors';
import { parseIngredientCsv } from './csv';
import { listIngredients } from './queries';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { TYPICAL_INGREDIENTS } from '@/lib/chemistry';
import type { IngredientImportResult, IngredientInput } from './schema';
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
  const row = createRow(em, actor, input);
  await em.flush();
  return { ingredientId: row.id };
}

function createRow(em: EntityManager, actor: Actor, input: IngredientInput): { id: string } {
  return em.create(Ingredient, { ...columns(input), workspace: actor.workspaceId, origin: 'custom', updatedBy: actor.userId });
}

/** Editing a handbook entry makes it the workspace's own value: its handbook source no longer applies. */
function assignRow(row: IngredientEntity, actor: Actor, input: IngredientInput): void {
  wrap(row).assign({ ...columns(input), updatedBy: actor.userId });
  if (row.origin === 'typical') {
    row.origin = 'edited';
    row.source = null;
  }
}

export async function updateIngredient(actor: Actor, id: string, input: IngredientInput): Promise<{ ingredientId: string }> {
  const em = await getEm();
  const row = await em.findOne(Ingredient, { ...inWorkspace(actor), id });
  if (!row) throw notFound('ingredient');
  assignRow(row, actor, input);
  await em.flush();
  return { ingredientId: row.id };
}

/** True when saving the input would change nothing (an exported row imported back keeps its origin and source). */
function sameValues(row: IngredientEntity, input: IngredientInput): boolean {
  const next = columns(input);
  return (Object.keys(next) as Array<keyof typeof next>).every((k) => JSON.stringify(row[k] ?? null) === JSON.stringify(next[k] ?? null));
}

/**
 * All-or-nothing CSV import: every row is checked before anything is written, then one transaction
 * replaces the values of the ingredients the rows name (by id, or by name ignoring case; archived
 * ones too, so none is duplicated) and adds the rest as the workspace's own.
 */
export async function importIngredientsCsv(actor: Actor, text: string, options: { confirmUpdates?: boolean } = {}): Promise<IngredientImportResult> {
  const library = await listIngredients(actor, { archived: 'include' });
  const { rows, errors } = parseIngredientCsv(text, library);
  if (errors.length) {
    const fields: Record<string, string[]> = {};
    for (const e of errors) (fields[`row ${e.row}${e.column ? `, ${e.column}` : ''}`] ??= []).push(e.message);
    throw new ValidationFailed(`Nothing was imported: ${errors.length} problem${errors.length > 1 ? 's' : ''} in the file.`, fields);
  }
  const em = await getEm();
  const plan = async (tx: EntityManager) => {
    const ids = rows.flatMap((r) => (r.ingredientId ? [r.ingredientId] : []));
    const existing = new Map((await tx.find(Ingredient, { ...inWorkspace(actor), id: { $in: ids } })).map((r) => [r.id, r]));
    const steps = rows.map((r) => {
      const stored = r.ingredientId ? existing.get(r.ingredientId) : undefined;
      return { ...r, stored, kind: !stored ? ('create' as const) : sameValues(stored, r.input) ? ('keep' as const) : ('update' as const) };
    });
    const count = (k: string) => steps.filter((s) => s.kind === k).length;
    const updates = steps.flatMap((s) => (s.kind === 'update' && s.stored ? [{ row: s.row, ingredientId: s.stored.id, name: s.stored.name, changes: s.changes }] : []));
    return { steps, result: { imported: false, created: count('create'), updated: count('update'), unchanged: count('keep'), updates } };
  };
  // Changing what the library holds is never silent: the first send only previews the updates.
  if (!options.confirmUpdates) {
    const { result } = await plan(em.fork());
    if (result.updates.length) return result;
  }
  return em.transactional(async (tx) => {
    const { steps, result } = await plan(tx);
    for (const s of steps) {
      if (s.kind === 'update' && s.stored) assignRow(s.stored, actor, s.input);
      else if (s.kind === 'create') createRow(tx, actor, s.input);
    }
    return { ...result, imported: true };
  });
}

/** Archived ingredients stay in old revisions (which hold a snapshot) but cannot be picked for new lines. */
export async function setIngredientArchived(actor: Actor, id: string, archived: boolean): Promise<void> {
  const em = await getEm();
  const n = await em.nativeUpdate(Ingredient, { ...inWorkspace(actor), id }, { archivedAt: archived ? new Date() : null, updatedBy: actor.userId });
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
    });
  }
  await em.flush();
  return TYPICAL_INGREDIENTS.length;
}
