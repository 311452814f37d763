import { Migration } from '@mikro-orm/migrations';
import { STARTER_LABEL_DATA } from '../lib/ingredients/starter-composition';
import { TYPICAL_INGREDIENTS } from '../lib/chemistry/typical-ingredients';
import type { IngredientLabelFields } from '../lib/ingredients/label-data';

/** The nutrients this migration added, frozen as they were: later nutrients have migrations of their own. */
const NUTRIENT_COLUMNS = {
  waterG: 'water_g', energyKcal: 'energy_kcal', energyKj: 'energy_kj', proteinG: 'protein_g', fatG: 'fat_g',
  saturatesG: 'saturates_g', carbohydrateG: 'carbohydrate_g', sugarsG: 'sugars_g', sucroseG: 'sucrose_g',
  glucoseG: 'glucose_g', fructoseG: 'fructose_g', fibreG: 'fibre_g', polyolsG: 'polyols_g',
  organicAcidsG: 'organic_acids_g', sodiumMg: 'sodium_mg',
} as const;
const NUTRIENT_KEYS = Object.keys(NUTRIENT_COLUMNS) as Array<keyof typeof NUTRIENT_COLUMNS>;

function literal(value: string | number | boolean | null): string {
  if (value === null) return 'null';
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  return `'${value.replace(/'/g, "''")}'`;
}

/** The label-data columns of one starter entry, as `column = value` pairs. */
function labelColumns(d: IngredientLabelFields): [string, string][] {
  return [
    ['label_name', literal(d.labelName)],
    ...NUTRIENT_KEYS.map((k): [string, string] => [NUTRIENT_COLUMNS[k], literal(d.nutrients[k])]),
    ['eu_allergens', `${literal(JSON.stringify(d.euAllergens))}::jsonb`],
    ['us_allergens', `${literal(JSON.stringify(d.usAllergens))}::jsonb`],
    ['sulphite_mg_per_kg', literal(d.sulphiteMgPerKg)],
    ['e_number', literal(d.additive?.eNumber ?? null)],
    ['additive_class', literal(d.additive?.functionalClass ?? null)],
    ['is_added_water', literal(d.isAddedWater)],
    ['composition_source', literal(d.source)],
  ];
}

/**
 * Label data on ingredients (per 100 g: nutrients, label name, allergens, sulphite, additive, added
 * water, where the composition came from). Starter entries of existing workspaces (typical, and edited
 * ones that still carry their starter key: they had no composition to keep) get the starter values;
 * every workspace with a starter library gets the starter entries it lacks (potassium sorbate).
 */
export class Migration20261203140000 extends Migration {

  override async up(): Promise<void> {
    // `if not exists`: a rollback keeps the columns (see down), so running up again must not fail on them.
    const nutrients = Object.values(NUTRIENT_COLUMNS).map((c) => `add column if not exists "${c}" double precision null`).join(', ');
    this.addSql(`alter table "ingredients" add column if not exists "label_name" varchar(120) null, ${nutrients}, add column if not exists "eu_allergens" jsonb not null default '[]', add column if not exists "us_allergens" jsonb not null default '[]', add column if not exists "sulphite_mg_per_kg" double precision null, add column if not exists "e_number" varchar(12) null, add column if not exists "additive_class" text check ("additive_class" in ('gelling_agent', 'thickener', 'stabiliser', 'firming_agent', 'acid', 'acidity_regulator', 'preservative', 'antioxidant', 'colour', 'sweetener', 'sequestrant', 'anti_foaming_agent', 'humectant', 'emulsifier')) null, add column if not exists "is_added_water" boolean not null default false, add column if not exists "composition_source" text null;`);

    for (const t of TYPICAL_INGREDIENTS) {
      const data = STARTER_LABEL_DATA[t.key];
      if (!data) continue;
      const sets = labelColumns(data).map(([c, v]) => `"${c}" = ${v}`).join(', ');
      // Only rows that carry no label data yet: what someone entered (or an earlier run filled) stays.
      this.addSql(`update "ingredients" set ${sets} where "typical_key" = ${literal(t.key)} and "origin" in ('typical', 'edited') and "composition_source" is null;`);
    }

    // Starter entries added since a workspace was created: insert them, with their chemistry and label data.
    for (const t of TYPICAL_INGREDIENTS.filter((i) => i.key === 'potassium_sorbate')) {
      const data = STARTER_LABEL_DATA[t.key];
      const columns: [string, string][] = [
        ['name', literal(t.name)], ['kind', literal(t.kind)], ['solids_pct', literal(t.solidsPct)],
        ['calcium_source', literal(t.calciumSource ?? false)], ['origin', `'typical'`], ['typical_key', literal(t.key)],
        ['source', literal(t.source)], ...labelColumns(data),
      ];
      this.addSql(`insert into "ingredients" ("id", "workspace_id", "created_at", "updated_at", ${columns.map(([c]) => `"${c}"`).join(', ')}) `
        + `select gen_random_uuid(), w."id", now(), now(), ${columns.map(([, v]) => v).join(', ')} from "workspaces" w `
        + `where exists (select 1 from "ingredients" i where i."workspace_id" = w."id" and i."typical_key" is not null) `
        + `and not exists (select 1 from "ingredients" i where i."workspace_id" = w."id" and i."typical_key" = ${literal(t.key)});`);
    }
  }

  override async down(): Promise<void> {
    // Rolling back leaves the label columns, their data and the potassium sorbate entries in place:
    // older code ignores them, and dropping them would delete what users entered (no data is lost).
  }

}
