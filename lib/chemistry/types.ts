/** Shared input and result types of the batch-chemistry module. All masses in grams unless a name says otherwise. */

export type IngredientKind = 'fruit' | 'sweetener' | 'pectin' | 'acid' | 'water' | 'other';

export type SweetenerType =
  | 'sucrose'
  | 'glucose_syrup'
  | 'invert_sugar'
  | 'honey'
  | 'fructose'
  | 'dextrose'
  | 'other';

export type PectinType = 'hm_rapid_set' | 'hm_slow_set' | 'lm_conventional' | 'lm_amidated';
export type PectinLevel = 'high' | 'medium' | 'low';
export type AcidType = 'citric' | 'malic' | 'tartaric' | 'lemon_juice' | 'other';
export type ProductClass = 'jam' | 'extra_jam' | 'jelly' | 'marmalade' | 'reduced_sugar_spread';
/** Product classes as they read inside a sentence (never the enum key on a screen). */
export const PRODUCT_CLASS_NAMES: Record<ProductClass, string> = {
  jam: 'jam', extra_jam: 'extra jam', jelly: 'jelly', marmalade: 'marmalade', reduced_sugar_spread: 'reduced-sugar spread',
};

/**
 * Market rule set. The EU set is dated: before 14 June 2026 the Directive 2001/113/EC Annex I
 * minimums apply; from 14 June 2026 the minimums raised by Directive (EU) 2024/1438.
 */
export type MarketRuleSetId = 'eu' | 'us' | 'codex';

/**
 * Keys of the EU Annex I fruit-minimum groups.
 * `reduced_minimum_fruits` = redcurrants, rowanberries, sea-buckthorn, blackcurrants, rosehips, quinces.
 */
export type EuFruitGroup = 'general' | 'reduced_minimum_fruits' | 'ginger' | 'cashew_apple' | 'passion_fruit' | 'citrus';

/** 21 CFR 150.160(b) fruit groups. */
export type UsFruitGroup = '1' | '2';

export type MassUnit = 'g' | 'kg' | 'lb' | 'oz';
export type LineUnit = MassUnit | 'pct_fruit';
export type UnitPreference = 'metric' | 'imperial';

export interface IngredientComposition {
  kind: IngredientKind;
  name: string;
  /** °Brix or % soluble solids (w/w). */
  solidsPct: number;
  phMin?: number;
  phMax?: number;
  /** Titratable acid as % citric acid, where it matters. */
  acidPct?: number;
  pectinLevel?: PectinLevel;
  /** Key for the EU Annex I exception groups. */
  euFruitGroup?: EuFruitGroup;
  /** '1' | '2' per 21 CFR 150.160(b). */
  usFruitGroup?: UsFruitGroup;
  pectinType?: PectinType;
  /** Pectin grade: grams of sugar set by 1 g of pectin at 65 % solids and optimum pH. */
  pectinGrade?: number;
  sweetenerType?: SweetenerType;
  acidType?: AcidType;
  calciumSource?: boolean;
  /**
   * The ingredient's own sugars, g per 100 g as used, when the library knows all three (its label
   * data); the water-activity estimate then uses the real mix instead of modelling by kind.
   */
  sugars?: { sucroseG: number; glucoseG: number; fructoseG: number };
}

export interface FormulaLineInput {
  ingredient: IngredientComposition;
  quantity: number;
  /** `pct_fruit` = percent of the total fruit mass. */
  unit: LineUnit;
}

export interface FormulaSettings {
  productClass: ProductClass;
  ruleSet: MarketRuleSetId;
  /** ISO date (YYYY-MM-DD) of production / labelling: selects the dated EU rules. */
  ruleDate: string;
  /** Target finished soluble solids, % w/w (°Brix). */
  targetSolidsPct: number;
  /** Net fill of one jar, g. */
  jarNetFillG: number;
  altitudeM?: number;
  measuredWaterBoilingC?: number;
  plannedPh?: number;
  /** How a reduced-sugar product is kept (guidance.ts PRESERVATION_METHODS); unset when not stated. */
  preservation?: 'heat_processed' | 'preservative' | 'chilled';
  /**
   * Share of the sucrose taken as inverted to glucose and fructose during the boil, % (0–100), for
   * the water-activity estimate. Unset: none, which errs high (the safe side for the cautions).
   */
  sucroseInversionPct?: number;
}
