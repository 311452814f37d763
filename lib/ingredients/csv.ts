/**
 * The ingredient library in and out as CSV. One column table serves both ways, so an exported file
 * imports back unchanged. Import is all-or-nothing: every row is checked first, errors are reported
 * by row and column, and nothing lands unless every row is good. A row replaces the values of the
 * ingredient its id names or, without an id, the one its name matches (ignoring case); any other row adds one.
 * A file that changes ingredients already there is previewed first (each change, before → after) and
 * lands only when the import is confirmed.
 */
import { z } from 'zod';
import { csvNumber, csvReadProblems, readCsv, toCsv } from '@/lib/csv';
import { parseDecimal } from '@/lib/input';
import { unreadableNumberMessage } from '@/lib/format/numbers';
import { NUTRIENT_KEYS, type NutrientKey } from '@/lib/label/types';
import { ingredientInputSchema, type IngredientFieldChange, type IngredientInput, type IngredientView } from './schema';

/** How a nutrient is named in a CSV header. */
const NUTRIENT_COLUMNS: Record<NutrientKey, string> = {
  waterG: 'water_g', energyKcal: 'energy_kcal', energyKj: 'energy_kj', proteinG: 'protein_g', fatG: 'fat_g',
  saturatesG: 'saturates_g', carbohydrateG: 'carbohydrate_g', sugarsG: 'sugars_g', sucroseG: 'sucrose_g',
  glucoseG: 'glucose_g', fructoseG: 'fructose_g', fibreG: 'fibre_g', polyolsG: 'polyols_g',
  organicAcidsG: 'organic_acids_g', sodiumMg: 'sodium_mg', cholesterolMg: 'cholesterol_mg',
};

type Cell = string | number | null;
interface Column {
  header: string;
  /** The cell of an ingredient on export. */
  out: (v: IngredientView) => Cell;
  /** Writes the cell into the import candidate; absent for columns that are exported for reading only. */
  in?: (raw: string, into: Candidate) => string | null;
  /** Where the schema's issues for this column point (first path segments, joined by "."). */
  path?: string;
}
type Candidate = Record<string, unknown> & { labelData: Record<string, unknown> & { nutrients: Record<string, unknown> } };

const blankToNull = (raw: string) => (raw === '' ? null : raw);
function numberCell(raw: string): { value: number | null; problem: string | null } {
  if (raw === '') return { value: null, problem: null };
  const n = parseDecimal(raw);
  return Number.isFinite(n) ? { value: n, problem: null } : { value: null, problem: unreadableNumberMessage(raw) };
}
const yes = (raw: string) => ['yes', 'true', '1', 'y'].includes(raw.toLowerCase());
const list = (raw: string) => raw.split(/[;,]/).map((s) => s.trim()).filter(Boolean);

function plain(header: string, field: keyof IngredientInput, out: (v: IngredientView) => Cell): Column {
  return { header, out, path: field, in: (raw, c) => { (c as Record<string, unknown>)[field] = blankToNull(raw); return null; } };
}
function numeric(header: string, field: keyof IngredientInput, out: (v: IngredientView) => Cell): Column {
  return { header, out, path: field, in: (raw, c) => { const n = numberCell(raw); (c as Record<string, unknown>)[field] = n.value; return n.problem; } };
}
function label(header: string, field: string, out: (v: IngredientView) => Cell, read: (raw: string) => unknown): Column {
  return { header, out, path: `labelData.${field}`, in: (raw, c) => { c.labelData[field] = read(raw); return null; } };
}

export const INGREDIENT_CSV_COLUMNS: Column[] = [
  { header: 'name', out: (v) => v.name, path: 'name', in: (raw, c) => { c.name = raw; return null; } },
  { header: 'kind', out: (v) => v.kind, path: 'kind', in: (raw, c) => { c.kind = raw; return null; } },
  numeric('soluble_solids_pct', 'solidsPct', (v) => v.solidsPct),
  numeric('ph_min', 'phMin', (v) => v.phMin ?? null),
  numeric('ph_max', 'phMax', (v) => v.phMax ?? null),
  numeric('acid_pct_as_citric', 'acidPct', (v) => v.acidPct ?? null),
  plain('pectin_level', 'pectinLevel', (v) => v.pectinLevel ?? null),
  plain('pectin_type', 'pectinType', (v) => v.pectinType ?? null),
  numeric('pectin_grade', 'pectinGrade', (v) => v.pectinGrade ?? null),
  plain('sweetener_type', 'sweetenerType', (v) => v.sweetenerType ?? null),
  plain('acid_type', 'acidType', (v) => v.acidType ?? null),
  plain('eu_fruit_group', 'euFruitGroup', (v) => v.euFruitGroup ?? null),
  plain('us_fruit_group', 'usFruitGroup', (v) => v.usFruitGroup ?? null),
  { header: 'calcium_source', out: (v) => (v.calciumSource ? 'yes' : ''), path: 'calciumSource', in: (raw, c) => { c.calciumSource = yes(raw); return null; } },
  label('label_name', 'labelName', (v) => v.labelData.labelName, blankToNull),
  ...NUTRIENT_KEYS.map((k): Column => ({
    header: NUTRIENT_COLUMNS[k],
    out: (v) => v.labelData.nutrients[k],
    path: `labelData.nutrients.${k}`,
    in: (raw, c) => { const n = numberCell(raw); c.labelData.nutrients[k] = n.value; return n.problem; },
  })),
  label('eu_allergens', 'euAllergens', (v) => v.labelData.euAllergens.join(';'), list),
  label('us_allergens', 'usAllergens', (v) => v.labelData.usAllergens.join(';'), list),
  {
    header: 'sulphite_mg_per_kg', out: (v) => v.labelData.sulphiteMgPerKg, path: 'labelData.sulphiteMgPerKg',
    in: (raw, c) => { const n = numberCell(raw); c.labelData.sulphiteMgPerKg = n.value; return n.problem; },
  },
  { header: 'e_number', out: (v) => v.labelData.additive?.eNumber ?? null, path: 'labelData.additive.eNumber', in: (raw, c) => { c.eNumber = raw; return null; } },
  { header: 'additive_class', out: (v) => v.labelData.additive?.functionalClass ?? null, path: 'labelData.additive.functionalClass', in: (raw, c) => { c.additiveClass = raw; return null; } },
  label('added_water', 'isAddedWater', (v) => (v.labelData.isAddedWater ? 'yes' : ''), yes),
  label('composition_source', 'source', (v) => v.labelData.source, blankToNull),
  plain('notes', 'notes', (v) => v.notes),
  // Exported for reading; the library sets them itself.
  { header: 'origin', out: (v) => v.origin },
  { header: 'source', out: (v) => v.source },
  { header: 'updated_at', out: (v) => v.updatedAt },
  // Read by the import itself: which ingredient a row replaces (blank: matched by name, or added).
  { header: 'id', out: (v) => v.id },
];

export function ingredientsToCsv(rows: IngredientView[]): string {
  return toCsv(rows, INGREDIENT_CSV_COLUMNS.map((c) => ({ header: c.header, value: c.out })));
}

/** At most as many rows as the library page lists. */
export const MAX_INGREDIENT_IMPORT_ROWS = 1000;
export const importIngredientsSchema = z.object({
  csv: z.string({ error: 'Send the CSV text.' }).min(1, 'Send the CSV text.').max(2_000_000, 'At most 2 MB.'),
  /** Rows that change ingredients already in the library are written only with this: the first send previews them. */
  confirmUpdates: z.boolean({ error: 'confirmUpdates is true or false.' }).optional(),
}).strict();

export interface CsvRowError {
  row: number;
  column: string;
  message: string;
}

const INPUT_FIELDS = [
  'name', 'kind', 'solidsPct', 'phMin', 'phMax', 'acidPct', 'pectinLevel', 'pectinType', 'pectinGrade', 'sweetenerType', 'acidType',
  'euFruitGroup', 'usFruitGroup', 'calciumSource', 'notes',
] as const satisfies ReadonlyArray<keyof IngredientInput>;

/** An ingredient's stored values as an import starts from them, so a column left out of the file keeps its value. */
function candidateOf(v: IngredientView | undefined): Candidate {
  if (!v) return { labelData: { nutrients: {} } };
  const { additive, ...labelData } = v.labelData;
  const values = Object.fromEntries(INPUT_FIELDS.filter((k) => v[k] !== undefined).map((k) => [k, v[k]]));
  return { ...values, labelData: { ...labelData, nutrients: { ...labelData.nutrients } }, eNumber: additive?.eNumber ?? '', additiveClass: additive?.functionalClass ?? '' };
}

/** A checked row and the library ingredient it replaces (null: a new one), with what it changes there. */
export interface IngredientCsvRow {
  /** As a spreadsheet numbers it: the header is row 1. */
  row: number;
  ingredientId: string | null;
  input: IngredientInput;
  /** The file's columns whose value differs from the stored one (empty for a new ingredient). */
  changes: IngredientFieldChange[];
}

/** The cells of the columns a file gives, before (the stored ingredient) and after (the row), as the export writes them. */
function changesOf(target: IngredientView, input: IngredientInput, columns: Column[]): IngredientFieldChange[] {
  const after = { ...target, ...input, labelData: { ...target.labelData, ...input.labelData } } as IngredientView;
  const text = (c: Cell) => (c === null || c === undefined ? '' : typeof c === 'number' ? String(csvNumber(c)) : c);
  return columns.flatMap((col) => {
    const [b, a] = [text(col.out(target)), text(col.out(after))];
    return b === a ? [] : [{ column: col.header, before: b, after: a }];
  });
}

/**
 * Pure: the file's rows as checked ingredient inputs, or every error found (then no rows). A row
 * naming an ingredient of `library` starts from its values: only the file's columns change it.
 */
export function parseIngredientCsv(text: string, library: IngredientView[] = []): { rows: IngredientCsvRow[]; errors: CsvRowError[] } {
  const parsed = readCsv(text);
  const errors: CsvRowError[] = [];
  const headers = parsed.meta.fields ?? [];
  const known = new Set(INGREDIENT_CSV_COLUMNS.map((c) => c.header));
  for (const h of headers) if (!known.has(h)) errors.push({ row: 1, column: h, message: `Unknown column “${h}”. Known columns: ${[...known].join(', ')}.` });
  for (const required of ['name', 'kind', 'soluble_solids_pct']) if (!headers.includes(required)) errors.push({ row: 1, column: required, message: `The column “${required}” is required.` });
  if (new Set(headers).size !== headers.length) errors.push({ row: 1, column: '', message: 'A column appears twice.' });
  for (const e of csvReadProblems(parsed)) errors.push({ ...e, column: '' });
  if (errors.length) return { rows: [], errors };
  if (parsed.data.length === 0) return { rows: [], errors: [{ row: 2, column: '', message: 'The file has a header but no rows.' }] };
  if (parsed.data.length > MAX_INGREDIENT_IMPORT_ROWS) return { rows: [], errors: [{ row: MAX_INGREDIENT_IMPORT_ROWS + 2, column: '', message: `At most ${MAX_INGREDIENT_IMPORT_ROWS} rows per import.` }] };

  const columns = INGREDIENT_CSV_COLUMNS.filter((c) => c.in && headers.includes(c.header));
  const byPath = new Map(INGREDIENT_CSV_COLUMNS.filter((c) => c.path).map((c) => [c.path!, c.header]));
  const rows: IngredientCsvRow[] = [];
  const seen = new Map<string, number>();
  const byId = new Map(library.map((v) => [v.id, v]));
  const byName = new Map<string, IngredientView[]>();
  for (const v of library) byName.set(v.name.toLowerCase(), [...(byName.get(v.name.toLowerCase()) ?? []), v]);
  parsed.data.forEach((record, i) => {
    const rowNumber = i + 2; // the header is row 1, as a spreadsheet shows it
    const id = (record.id ?? '').trim();
    const named = byName.get((record.name ?? '').trim().toLowerCase()) ?? [];
    const target = id ? byId.get(id) : named.length === 1 ? named[0] : undefined;
    if (id && !target) {
      errors.push({ row: rowNumber, column: 'id', message: 'No ingredient of this library has this id; leave it blank to add one.' });
      return;
    }
    if (!id && named.length > 1) {
      errors.push({ row: rowNumber, column: 'name', message: `${named.length} ingredients are called “${named[0].name}”: give the id column to say which.` });
      return;
    }
    const candidate = candidateOf(target);
    let rowOk = true;
    for (const col of columns) {
      const problem = col.in!((record[col.header] ?? '').trim(), candidate);
      if (problem) {
        errors.push({ row: rowNumber, column: col.header, message: problem });
        rowOk = false;
      }
    }
    const { eNumber, additiveClass, ...input } = candidate;
    input.labelData.additive = eNumber || additiveClass ? { eNumber, functionalClass: additiveClass } : null;
    if (!rowOk) return;
    const result = ingredientInputSchema.safeParse(input);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const path = issue.path.map(String);
        const column = [3, 2, 1].map((n) => byPath.get(path.slice(0, n).join('.'))).find(Boolean) ?? path.join('.');
        errors.push({ row: rowNumber, column, message: issue.message });
      }
      return;
    }
    const key = target ? target.id : result.data.name.toLowerCase();
    const first = seen.get(key);
    // The column that matched the row: its id when the file gives one, else its name.
    if (first) errors.push({ row: rowNumber, column: id ? 'id' : 'name', message: `Row ${first} already gives this ingredient.` });
    else seen.set(key, rowNumber);
    rows.push({ row: rowNumber, ingredientId: target?.id ?? null, input: result.data, changes: target ? changesOf(target, result.data, columns) : [] });
  });
  return { rows: errors.length ? [] : rows, errors };
}
