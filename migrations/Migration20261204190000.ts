import { Migration } from '@mikro-orm/migrations';

/**
 * The foods of the starter library that hold no cholesterol, frozen as they were when this ran: the
 * fruits, sugars, honey, pectins, acids, additives and water. Invert syrup is left unknown, as its
 * other figures are (the supplier's specification gives them).
 */
export const STARTER_KEYS_WITHOUT_CHOLESTEROL = [
  'strawberry', 'raspberry', 'apricot', 'blackcurrant', 'redcurrant', 'apple_tart', 'quince', 'plum', 'blackberry',
  'bitter_orange', 'lemon_juice', 'sucrose', 'glucose_syrup_de42', 'honey', 'pectin_hm_rapid_150', 'pectin_lm_amidated',
  'citric_acid_anhydrous', 'calcium_citrate', 'potassium_sorbate', 'water',
] as const;

/**
 * Cholesterol per 100 g on ingredients, for the US Nutrition Facts. Starter entries of existing
 * workspaces (typical, and edited ones that keep their starter key: the same food) get 0 mg; every
 * other entry stays unknown until someone enters it, and the panel names it meanwhile.
 */
export class Migration20261204190000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "ingredients" add column if not exists "cholesterol_mg" double precision null;`);
    const keys = STARTER_KEYS_WITHOUT_CHOLESTEROL.map((k) => `'${k}'`).join(', ');
    // Only rows without a figure: one someone entered (or an earlier run filled) stays.
    this.addSql(`update "ingredients" set "cholesterol_mg" = 0 where "typical_key" in (${keys}) and "origin" in ('typical', 'edited') and "cholesterol_mg" is null;`);
  }

  override async down(): Promise<void> {
    // Rolling back keeps the column and its figures: older code ignores them, and dropping them
    // would delete what users entered (no data is lost).
  }

}
