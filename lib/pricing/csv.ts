/**
 * Ingredient prices in and out as CSV. Import is all-or-nothing: every row is checked first,
 * errors are reported by row and column, and nothing lands unless every row is good.
 * Ingredients are named as in the library (case does not matter); amounts are in the workspace currency.
 */
import { getEm, lockForTransaction } from '@/lib/db';
import { Ingredient, IngredientPrice } from '@/entities';
import { inWorkspace, type Actor } from '@/lib/permissions';
import { ValidationFailed } from '@/lib/errors';
import { csvReadProblems, readCsv, toCsv } from '@/lib/csv';
import { todayIso } from '@/lib/format/dates';
import { parseDecimal, unsafeTextReason } from '@/lib/input';
import { costSettings } from './queries';
import { ingredientPriceSchema } from './schema';
import { ingredientPriceColumns, NO_CURRENCY_MESSAGE } from './mutations';
import { amountText } from './money';
import { PRICE_LIMITS } from './vocabulary';

export const PRICE_CSV_COLUMNS = ['ingredient', 'valid_from', 'pack_price', 'pack_size', 'pack_unit', 'supplier', 'currency'] as const;
const REQUIRED = ['ingredient', 'valid_from', 'pack_price', 'pack_size', 'pack_unit'];
const FIELD_COLUMN: Record<string, string> = { ingredientId: 'ingredient', validFrom: 'valid_from', packPrice: 'pack_price', packSize: 'pack_size', packUnit: 'pack_unit', supplier: 'supplier' };

export interface CsvRowError {
  row: number;
  column: string;
  message: string;
}

type Columns = ReturnType<typeof ingredientPriceColumns>;

/** Checks every row; returns the points ready to insert or every error found. Pure apart from the name map. */
export function parsePriceCsv(text: string, ingredientIdsByName: Map<string, string[]>, currency: string): { rows: Columns[]; errors: CsvRowError[] } {
  const parsed = readCsv(text);
  const errors: CsvRowError[] = [];
  const headers = parsed.meta.fields ?? [];
  const known = new Set<string>(PRICE_CSV_COLUMNS);
  for (const h of headers) {
    const unsafe = unsafeTextReason(h, true);
    if (unsafe) errors.push({ row: 1, column: '', message: unsafe });
    else if (!known.has(h)) errors.push({ row: 1, column: h, message: `Unknown column “${h}”. Known columns: ${PRICE_CSV_COLUMNS.join(', ')}.` });
  }
  for (const required of REQUIRED) if (!headers.includes(required)) errors.push({ row: 1, column: required, message: `The column “${required}” is required.` });
  for (const e of csvReadProblems(parsed)) errors.push({ ...e, column: '' });
  if (errors.length) return { rows: [], errors };
  if (parsed.data.length === 0) return { rows: [], errors: [{ row: 2, column: '', message: 'The file has a header but no rows.' }] };
  if (parsed.data.length > PRICE_LIMITS.maxCsvRows) return { rows: [], errors: [{ row: PRICE_LIMITS.maxCsvRows + 2, column: '', message: `At most ${PRICE_LIMITS.maxCsvRows} rows per import.` }] };

  const rows: Columns[] = [];
  parsed.data.forEach((record, i) => {
    const row = i + 2; // the header is row 1, as a spreadsheet shows it
    const cell = (column: string) => (Object.prototype.hasOwnProperty.call(record, column) ? String(record[column] ?? '') : '').trim();
    const fail = (column: string, message: string) => errors.push({ row, column, message });
    // Checked per cell, so the row is numbered as every other problem is (the header is row 1).
    for (const [column, value] of Object.entries(record)) {
      const unsafe = unsafeTextReason(String(value ?? ''), true);
      if (unsafe) return fail(known.has(column) ? column : '', unsafe);
    }
    const rowCurrency = cell('currency');
    if (rowCurrency && rowCurrency.toUpperCase() !== currency) return fail('currency', `Prices here are in ${currency}; this row says ${rowCurrency}. Setwell does not convert currencies.`);
    const name = cell('ingredient');
    const matches = ingredientIdsByName.get(name.toLowerCase()) ?? [];
    if (matches.length !== 1) {
      return fail('ingredient', !name ? 'Name the ingredient as in the library.' : matches.length ? `Several ingredients are called “${name}”; rename one in the library first.` : `No ingredient “${name}” in the library.`);
    }
    const size = parseDecimal(cell('pack_size'));
    const candidate = { ingredientId: matches[0], validFrom: cell('valid_from'), packPrice: cell('pack_price'), packSize: Number.isFinite(size) ? size : cell('pack_size'), packUnit: cell('pack_unit').toLowerCase(), supplier: cell('supplier') || null };
    const result = ingredientPriceSchema.safeParse(candidate);
    if (!result.success) {
      for (const issue of result.error.issues) fail(FIELD_COLUMN[String(issue.path[0])] ?? '', issue.message);
      return;
    }
    try {
      rows.push(ingredientPriceColumns(result.data, currency));
    } catch (err) {
      if (!(err instanceof ValidationFailed)) throw err;
      for (const [field, messages] of Object.entries(err.fields)) for (const m of messages) fail(FIELD_COLUMN[field] ?? field, m);
    }
  });
  return { rows: errors.length ? [] : rows, errors };
}

/**
 * Imports a checked file whole, inside one transaction. Rows already on record (samePointKey) are
 * counted, not added again, so re-importing a file is harmless.
 */
export async function importPricesCsv(actor: Actor, text: string): Promise<{ imported: number; alreadyPresent: number }> {
  const { currency } = await costSettings(actor.workspaceId);
  // A file-level problem like any other: the import is refused as a whole (422), nothing lands.
  if (!currency) throw new ValidationFailed(NO_CURRENCY_MESSAGE, { 'row 1': [NO_CURRENCY_MESSAGE] });
  const em = await getEm();
  const ingredients = await em.find(Ingredient, { ...inWorkspace(actor) }, { fields: ['id', 'name'] });
  const byName = new Map<string, string[]>();
  for (const i of ingredients) {
    const key = i.name.trim().toLowerCase();
    byName.set(key, [...(byName.get(key) ?? []), i.id]);
  }
  const { rows, errors } = parsePriceCsv(text, byName, currency);
  if (errors.length) {
    const fields: Record<string, string[]> = Object.create(null);
    for (const e of errors) (fields[`row ${e.row}${e.column ? `, ${e.column}` : ''}`] ??= []).push(e.message);
    throw new ValidationFailed(`Nothing was imported: ${errors.length} problem${errors.length > 1 ? 's' : ''} in the file.`, fields);
  }
  return em.transactional(async (tx) => {
    // Imports of one workspace take turns, so the same file sent twice at once cannot land twice.
    await lockForTransaction(tx, `price-import:${actor.workspaceId}`);
    const present = await tx.execute<Array<{ ingredient_id: string; valid_from: string; pack_price_minor: number; pack_size_g: number; supplier: string | null }>>(
      `select ingredient_id, to_char(valid_from, 'YYYY-MM-DD') as valid_from, pack_price_minor, pack_size_g, supplier
         from ingredient_prices
        where workspace_id = ? and withdrawn_at is null
          and ingredient_id in (select value::uuid from jsonb_array_elements_text(?::jsonb))
          and valid_from in (select value::date from jsonb_array_elements_text(?::jsonb))`,
      [actor.workspaceId, JSON.stringify([...new Set(rows.map((r) => r.ingredient))]), JSON.stringify([...new Set(rows.map((r) => r.validFrom))])],
    );
    const seen = new Set(present.map((p) => samePointKey({ ingredient: p.ingredient_id, validFrom: p.valid_from, packPriceMinor: Number(p.pack_price_minor), packSizeG: Number(p.pack_size_g), supplier: p.supplier })));
    let imported = 0;
    for (const r of rows) {
      const key = samePointKey(r);
      if (seen.has(key)) continue;
      seen.add(key);
      tx.create(IngredientPrice, { ...r, workspace: actor.workspaceId, enteredBy: actor.userId });
      imported++;
    }
    return { imported, alreadyPresent: rows.length - imported };
  });
}

/**
 * A point already on record (not withdrawn) for the same ingredient and day, at the same pack price
 * and pack size from the same supplier, is the same point: importing it again adds nothing. The
 * currency is the workspace's one, so it always matches. A different supplier or size is a new fact.
 */
export function samePointKey(p: Pick<Columns, 'ingredient' | 'validFrom' | 'packPriceMinor' | 'packSizeG' | 'supplier'>): string {
  return JSON.stringify([p.ingredient, p.validFrom, p.packPriceMinor, p.packSizeG, p.supplier ?? null]);
}

/** Every point that counts (withdrawn ones left out), in the import's columns, so an export can be edited and read back. */
export async function exportPricesCsv(actor: Actor): Promise<{ filename: string; csv: string }> {
  const { currency } = await costSettings(actor.workspaceId);
  const em = await getEm();
  const points = await em.find(IngredientPrice, { ...inWorkspace(actor), withdrawnAt: null }, { populate: ['ingredient'], orderBy: { ingredient: { name: 'asc' }, validFrom: 'asc', enteredAt: 'asc' }, limit: 200_000 });
  const csv = toCsv(points, [
    { header: 'ingredient', value: (p) => p.ingredient.name },
    { header: 'valid_from', value: (p) => p.validFrom },
    { header: 'pack_price', value: (p) => (currency ? amountText(Number(p.packPriceMinor), currency) : '') },
    { header: 'pack_size', value: (p) => p.packSizeG },
    { header: 'pack_unit', value: () => 'g' },
    { header: 'supplier', value: (p) => p.supplier ?? '' },
    { header: 'currency', value: () => currency ?? '' },
  ]);
  return { filename: `prices-${todayIso()}.csv`, csv };
}
