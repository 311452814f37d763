import type { IngredientComposition } from './types';

export interface TypicalIngredient extends IngredientComposition {
  /** Stable key for data loading and ingredient pickers. */
  key: string;
  /** Where the values come from, in words for the screen. Values recalled rather than looked up are marked "(memory)" in a comment beside the entry, never in this text. */
  source: string;
}

// (memory) The Brix table and the pH list were recalled, not re-read, when these values were entered.
const BRIX_TABLE = '21 CFR 101.30(h)(1) Brix table for single-strength juices';
const NCHFP = 'National Center for Home Food Preservation, high- and low-pectin fruit lists';
const FDA_PH = 'FDA/CFSAN "Approximate pH of foods and food products"';

/** Generic commodity ingredients with handbook typical values; real lots vary, so measure. */
export const TYPICAL_INGREDIENTS: readonly TypicalIngredient[] = [
  { key: 'strawberry', kind: 'fruit', name: 'Strawberry', solidsPct: 8.0, phMin: 3.0, phMax: 3.9, pectinLevel: 'low', euFruitGroup: 'general', usFruitGroup: '1',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP}; pH: ${FDA_PH}; US group: 21 CFR 150.160(b)(1) Group I` },
  { key: 'raspberry', kind: 'fruit', name: 'Raspberry (red)', solidsPct: 9.2, phMin: 3.2, phMax: 3.95, pectinLevel: 'low', euFruitGroup: 'general', usFruitGroup: '1',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP}; pH: ${FDA_PH}; US group: 21 CFR 150.160(b)(1) Group I` },
  { key: 'apricot', kind: 'fruit', name: 'Apricot', solidsPct: 11.7, phMin: 3.3, phMax: 4.8, pectinLevel: 'low', euFruitGroup: 'general', usFruitGroup: '2',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP}; pH: ${FDA_PH}; US group: 21 CFR 150.160(b)(1) Group II` },
  { key: 'blackcurrant', kind: 'fruit', name: 'Blackcurrant', solidsPct: 11.0, pectinLevel: 'high', euFruitGroup: 'reduced_minimum_fruits',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP} (currants); EU group: Council Directive 2001/113/EC, Annex I. No US group: 21 CFR 150.160(b)(1) lists currant "other than black currant".` },
  { key: 'redcurrant', kind: 'fruit', name: 'Redcurrant', solidsPct: 10.5, pectinLevel: 'high', euFruitGroup: 'reduced_minimum_fruits', usFruitGroup: '2',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP} (currants); EU group: Council Directive 2001/113/EC, Annex I; US group: 21 CFR 150.160(b)(1) Group II (red currant)` },
  { key: 'apple_tart', kind: 'fruit', name: 'Apple (tart)', solidsPct: 11.5, phMin: 3.3, phMax: 4.0, pectinLevel: 'high', euFruitGroup: 'general',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP} (tart apples); pH: ${FDA_PH}. No US group: apple is not listed in 21 CFR 150.160(b)(1)` },
  { key: 'quince', kind: 'fruit', name: 'Quince', solidsPct: 13.3, pectinLevel: 'high', euFruitGroup: 'reduced_minimum_fruits', usFruitGroup: '2',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP}; EU group: Council Directive 2001/113/EC, Annex I; US group: 21 CFR 150.160(b)(1) Group II` },
  { key: 'plum', kind: 'fruit', name: 'Plum', solidsPct: 14.3, phMin: 2.8, phMax: 4.6, pectinLevel: 'medium', euFruitGroup: 'general', usFruitGroup: '2',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP} ("some plums" are high; medium used); pH: ${FDA_PH}; US group: 21 CFR 150.160(b)(1) Group II` },
  { key: 'blackberry', kind: 'fruit', name: 'Blackberry', solidsPct: 10.0, phMin: 3.85, phMax: 4.5, pectinLevel: 'high', euFruitGroup: 'general', usFruitGroup: '1',
    source: `Brix: ${BRIX_TABLE}; pectin: ${NCHFP} (sour blackberries); pH: ${FDA_PH}; US group: 21 CFR 150.160(b)(1) Group I` },
  { key: 'bitter_orange', kind: 'fruit', name: 'Bitter orange (Seville type)', solidsPct: 10.0, pectinLevel: 'high', euFruitGroup: 'citrus', usFruitGroup: '1',
    // (memory) Brix about 10 recalled; counting a bitter orange as "Orange" is our reading.
    source: 'Brix about 10, a typical value; citrus peel and pith are rich in pectin. US group: "Orange" is in 21 CFR 150.160(b)(1) Group I' },
  { key: 'lemon_juice', kind: 'acid', name: 'Lemon juice', solidsPct: 4.5, phMin: 2.0, phMax: 2.6, acidPct: 5.0, acidType: 'lemon_juice',
    // (memory) Acidity about 5 % as citric.
    source: `Brix: ${BRIX_TABLE}; pH: ${FDA_PH}; acidity about 5 % as citric, a typical value` },
  { key: 'sucrose', kind: 'sweetener', name: 'Sucrose (white sugar)', solidsPct: 100, sweetenerType: 'sucrose',
    source: 'Practical Action technical brief "Jams, jellies and marmalade" (sugar counted as 100 % solids)' },
  { key: 'glucose_syrup_de42', kind: 'sweetener', name: 'Glucose syrup (DE ~42)', solidsPct: 80, sweetenerType: 'glucose_syrup',
    // (memory)
    source: 'Typical dry substance of DE 42 glucose syrup, about 80 %' },
  { key: 'invert_syrup', kind: 'sweetener', name: 'Invert sugar syrup', solidsPct: 75, sweetenerType: 'invert_sugar',
    // (memory)
    source: 'Typical commercial invert syrup is 70–80 % solids; 75 % used' },
  { key: 'honey', kind: 'sweetener', name: 'Honey', solidsPct: 82, sweetenerType: 'honey',
    // (memory)
    source: 'Codex Standard for Honey (CXS 12-1981) caps moisture at 20 %; typical honey holds about 18 %' },
  { key: 'pectin_hm_rapid_150', kind: 'pectin', name: 'HM rapid-set pectin, grade 150', solidsPct: 100, pectinType: 'hm_rapid_set', pectinGrade: 150,
    source: 'Grade 150: 1 g sets 150 g of sugar at 65 % solids and optimum pH; counted as wholly soluble solids as in the Practical Action technical brief "Jams, jellies and marmalade"' },
  { key: 'pectin_lm_amidated', kind: 'pectin', name: 'LM amidated pectin', solidsPct: 100, pectinType: 'lm_amidated',
    // (memory) Powders hold a few % moisture.
    source: 'Counted as wholly soluble solids; sets with calcium' },
  { key: 'citric_acid_anhydrous', kind: 'acid', name: 'Citric acid (anhydrous powder)', solidsPct: 100, acidPct: 100, acidType: 'citric',
    source: 'Anhydrous powder, not the 50 % w/v solution; counted as 100 % solids as in the Practical Action technical brief "Jams, jellies and marmalade"' },
  { key: 'calcium_citrate', kind: 'other', name: 'Calcium citrate (powder)', solidsPct: 100, calciumSource: true,
    // (memory)
    source: 'Calcium salt for low-methoxyl pectin sets; counted as dry solids, its mass is negligible' },
  { key: 'potassium_sorbate', kind: 'other', name: 'Potassium sorbate (powder)', solidsPct: 100,
    source: 'Preservative for reduced-sugar spreads; counted as dry solids, its mass is negligible' },
  { key: 'water', kind: 'water', name: 'Water', solidsPct: 0, source: 'Pure water has no soluble solids' },
];

export function findTypicalIngredient(key: string): TypicalIngredient | undefined {
  return TYPICAL_INGREDIENTS.find((i) => i.key === key);
}
