import { describe, expect, it } from 'vitest';
import { TYPICAL_INGREDIENTS } from '@/lib/chemistry';
import { STARTER_LABEL_DATA } from '@/lib/ingredients/starter-composition';
import { emptyLabelFields, missingNutrients, toLabelData, E_NUMBER_PATTERN } from '@/lib/ingredients/label-data';
import { ingredientInputSchema, labelDataSchema } from '@/lib/ingredients/schema';
import { NUTRIENT_KEYS } from '@/lib/label/types';
import { STARTER_KEYS_WITHOUT_CHOLESTEROL } from '@/migrations/Migration20261204190000';

const SR28 = 'USDA National Nutrient Database for Standard Reference, Legacy Release 28';

/**
 * Expected values copied again, independently of the module, from
 * Source: USDA ARS, National Nutrient Database for Standard Reference, Legacy Release 28 (SR28),
 * NUT_DATA nutrients 255 water, 208 kcal, 268 kJ, 203 protein, 204 fat, 606 saturates,
 * 205 carbohydrate by difference, 291 fibre, 269 sugars, 307 sodium, 210/211/212 sucrose/glucose/fructose
 * (per 100 g edible portion, as printed; null = SR28 gives no value).
 */
const REFERENCE: Record<string, { ndb: string; values: (number | null)[]; sugars: (number | null)[] }> = {
  strawberry: { ndb: '09316', values: [90.95, 32, 136, 0.67, 0.30, 0.015, 7.68, 2.0, 4.89, 1], sugars: [0.47, 1.99, 2.44] },
  raspberry: { ndb: '09302', values: [85.75, 52, 220, 1.20, 0.65, 0.019, 11.94, 6.5, 4.42, 1], sugars: [0.20, 1.86, 2.35] },
  apricot: { ndb: '09021', values: [86.35, 48, 201, 1.40, 0.39, 0.027, 11.12, 2.0, 9.24, 1], sugars: [5.87, 2.37, 0.94] },
  blackcurrant: { ndb: '09083', values: [81.96, 63, 264, 1.40, 0.41, 0.034, 15.38, null, null, 2], sugars: [null, null, null] },
  redcurrant: { ndb: '09084', values: [83.95, 56, 234, 1.40, 0.20, 0.017, 13.80, 4.3, 7.37, 1], sugars: [0.61, 3.22, 3.53] },
  apple_tart: { ndb: '09003', values: [85.56, 52, 218, 0.26, 0.17, 0.028, 13.81, 2.4, 10.39, 1], sugars: [2.07, 2.43, 5.90] },
  quince: { ndb: '09296', values: [83.80, 57, 238, 0.40, 0.10, 0.010, 15.30, 1.9, null, 4], sugars: [null, null, null] },
  plum: { ndb: '09279', values: [87.23, 46, 192, 0.70, 0.28, 0.017, 11.42, 1.4, 9.92, 0], sugars: [1.57, 5.07, 3.07] },
  blackberry: { ndb: '09042', values: [88.15, 43, 181, 1.39, 0.49, 0.014, 9.61, 5.3, 4.88, 1], sugars: [0.07, 2.31, 2.40] },
  lemon_juice: { ndb: '09152', values: [92.31, 22, 91, 0.35, 0.24, 0.040, 6.90, 0.3, 2.52, 1], sugars: [0.43, 0.99, 1.10] },
  sucrose: { ndb: '19335', values: [0.02, 387, 1618, 0.00, 0.00, 0.000, 99.98, 0.0, 99.80, 1], sugars: [99.80, 0.00, 0.00] },
  honey: { ndb: '19296', values: [17.10, 304, 1272, 0.30, 0.00, 0.000, 82.40, 0.2, 82.12, 4], sugars: [0.89, 35.75, 40.94] },
  pectin_hm_rapid_150: { ndb: '19310', values: [8.70, 325, 1360, 0.30, 0.30, 0.050, 90.40, 8.6, null, 200], sugars: [null, null, null] },
};
const ORDER = ['waterG', 'energyKcal', 'energyKj', 'proteinG', 'fatG', 'saturatesG', 'carbohydrateG', 'fibreG', 'sugarsG', 'sodiumMg'] as const;

describe('starter label data', () => {
  it('gives every starter entry label data that the schema accepts as it is', () => {
    for (const t of TYPICAL_INGREDIENTS) {
      const data = STARTER_LABEL_DATA[t.key];
      expect(data, t.key).toBeDefined();
      expect(labelDataSchema.parse(data), t.key).toEqual(data);
    }
  });

  it('equals SR28 value for value, with null where SR28 gives none', () => {
    for (const [key, ref] of Object.entries(REFERENCE)) {
      const n = STARTER_LABEL_DATA[key].nutrients;
      ORDER.forEach((k, i) => expect(n[k], `${key}.${k}`).toBe(ref.values[i]));
      expect([n.sucroseG, n.glucoseG, n.fructoseG], key).toEqual(ref.sugars);
      expect(n.polyolsG).toBeNull();
      expect(n.organicAcidsG).toBeNull();
      expect(STARTER_LABEL_DATA[key].source).toContain(`${SR28}, NDB ${ref.ndb}`);
    }
  });

  it('gives 0 mg cholesterol to every starter food but invert syrup, and to each key the migration fills', () => {
    // SR28 nutrient 601 is 0 mg for these fruits, sugars, honey and pectin (from memory, not re-read
    // here); the additives and water are pure substances. Invert syrup has no figures at all.
    for (const t of TYPICAL_INGREDIENTS) {
      expect(STARTER_LABEL_DATA[t.key].nutrients.cholesterolMg, t.key).toBe(t.key === 'invert_syrup' ? null : 0);
    }
    // The migration keeps its own list (a later starter food gets its own migration): nothing in it may
    // claim 0 mg for a food the starter data does not.
    for (const k of STARTER_KEYS_WITHOUT_CHOLESTEROL) expect(STARTER_LABEL_DATA[k].nutrients.cholesterolMg, k).toBe(0);
  });

  it('says in words that additives are pure substances, with their E-number and class', () => {
    // Source: Regulation (EC) 1333/2008 Annex II Part B (E330 citric acid, E333 calcium citrates,
    // E202 potassium sorbate, E440 pectins) and Annex I (functional classes).
    const cases = [['citric_acid_anhydrous', 'E330', 'acid'], ['calcium_citrate', 'E333', 'firming_agent'], ['potassium_sorbate', 'E202', 'preservative']] as const;
    for (const [key, eNumber, functionalClass] of cases) {
      expect(STARTER_LABEL_DATA[key].additive).toEqual({ eNumber, functionalClass });
      expect(STARTER_LABEL_DATA[key].source).toMatch(/^Pure substance: composition by definition\./);
      expect(missingNutrients(STARTER_LABEL_DATA[key])).toEqual([]);
    }
    expect(STARTER_LABEL_DATA.pectin_hm_rapid_150.additive).toEqual({ eNumber: 'E440', functionalClass: 'gelling_agent' });
    // Anhydrous citric acid is all organic acid: 13 kJ / 3 kcal per g (Regulation (EU) 1169/2011 Annex XIV).
    expect(STARTER_LABEL_DATA.citric_acid_anhydrous.nutrients).toMatchObject({ organicAcidsG: 100, energyKj: 1300, energyKcal: 300, carbohydrateG: 0, sodiumMg: 0 });
    // Sorbic acid 112.13 g/mol over potassium sorbate 150.22 g/mol (IUPAC standard atomic weights).
    expect(STARTER_LABEL_DATA.potassium_sorbate.nutrients.organicAcidsG).toBeCloseTo((112.13 / 150.22) * 100, 2);
    expect(STARTER_LABEL_DATA.water.isAddedWater).toBe(true);
  });

  it('keeps provenance notes out of the texts a screen shows', () => {
    for (const [key, d] of Object.entries(STARTER_LABEL_DATA)) {
      expect(`${d.source} ${d.labelName}`, key).not.toMatch(/memory|recalled/i);
    }
  });

  it('knows which entries are incomplete: the nutrients SR28 lacks', () => {
    expect(missingNutrients(STARTER_LABEL_DATA.strawberry)).toEqual([]);
    expect(missingNutrients(STARTER_LABEL_DATA.blackcurrant)).toEqual(['sugarsG', 'fibreG']);
    expect(missingNutrients(STARTER_LABEL_DATA.pectin_hm_rapid_150)).toEqual(['sugarsG']);
    expect(missingNutrients(emptyLabelFields())).toHaveLength(10);
  });
});

describe('toLabelData', () => {
  it('maps the library view to the label: label name, class in words, allergens in list order', () => {
    const labelData = { ...STARTER_LABEL_DATA.pectin_hm_rapid_150, euAllergens: ['sulphites', 'milk'] as const, usAllergens: ['milk'] as const };
    const out = toLabelData({ name: 'HM pectin 150', kind: 'pectin', labelData: { ...labelData, euAllergens: [...labelData.euAllergens], usAllergens: [...labelData.usAllergens] } });
    expect(out).toMatchObject({ labelName: 'pectin', kind: 'pectin', additive: { eNumber: 'E440', className: 'gelling agent' }, euAllergens: ['milk', 'sulphites'], usAllergens: ['milk'], isAddedWater: false });
    expect(out.nutrients.sugarsG).toBeNull();
    expect(Object.keys(out.nutrients).sort()).toEqual([...NUTRIENT_KEYS].sort());
  });

  it('falls back to the ingredient name when no label name is set', () => {
    expect(toLabelData({ name: 'Morello cherries', kind: 'fruit', labelData: emptyLabelFields() }).labelName).toBe('Morello cherries');
  });
});

describe('labelDataSchema', () => {
  const base = { name: 'Test fruit', kind: 'fruit', solidsPct: 10 };
  const accepted = (labelData: unknown) => ingredientInputSchema.safeParse({ ...base, labelData }).success;

  it('refuses hostile text, unknown and prototype-named allergen keys, bad E-numbers, huge numbers', () => {
    const cases: unknown[] = [
      { labelName: 'straw\u0000berries' },
      { labelName: 'straw\u202Eberries' },
      { labelName: 'straw\uD800berries' },
      { source: 'SR28\u0007' },
      { euAllergens: ['__proto__'] },
      { euAllergens: ['constructor'] },
      { euAllergens: ['gluten'] },
      { usAllergens: ['sulphites'] },
      { euAllergens: ['milk', 'milk'] },
      { euAllergens: 'milk' },
      { additive: { eNumber: 'E44', functionalClass: 'gelling_agent' } },
      { additive: { eNumber: 'E44000', functionalClass: 'gelling_agent' } },
      { additive: { eNumber: '440', functionalClass: 'gelling_agent' } },
      { additive: { eNumber: 'E440(xx)', functionalClass: 'gelling_agent' } },
      { additive: { eNumber: 'E440', functionalClass: 'flavour' } },
      { additive: { eNumber: 'E440' } },
      { nutrients: { waterG: 2 ** 53 } },
      { nutrients: { sodiumMg: 2 ** 31 } },
      { nutrients: { cholesterolMg: 100_001 } },
      { nutrients: { cholesterolMg: -1 } },
      { nutrients: { cholesterolMg: '0' } },
      { nutrients: { energyKj: 4001 } },
      { nutrients: { energyKcal: 951 } },
      { nutrients: { fatG: -0.1 } },
      { nutrients: { fatG: Number.NaN } },
      { nutrients: { fatG: Infinity } },
      { nutrients: { fatG: '3' } },
      { nutrients: { __proto__: { fatG: 1 }, valueOf: 1 } },
      { nutrients: JSON.parse('{"__proto__": 1}') },
      { sulphiteMgPerKg: 1e308 },
      { isAddedWater: 'yes' },
      { colour: 'red' },
    ];
    for (const c of cases) expect(accepted(c), JSON.stringify(c)).toBe(false);
  });

  it('accepts E-numbers as the EU writes them, and normalises what people type', () => {
    // Source: Regulation (EC) 1333/2008 Annex II Part B numbering (E160a, E472(ii)-style sub-numbers, E1422).
    for (const e of ['E440', 'E160a', 'E472(ii)', 'E160a(iv)', 'E1422']) expect(e).toMatch(E_NUMBER_PATTERN);
    const parsed = labelDataSchema.parse({ additive: { eNumber: ' e 330 ', functionalClass: 'acid' } });
    expect(parsed.additive?.eNumber).toBe('E330');
  });

  it('refuses parts larger than their whole, past the tolerance, naming the field', () => {
    const r = labelDataSchema.safeParse({ nutrients: { waterG: 90, proteinG: 5, fatG: 3, carbohydrateG: 5 } });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]).toMatchObject({ path: ['nutrients', 'waterG'] });
    expect(r.error?.issues[0].message).toMatch(/103 g, more than 100 g per 100 g/);
    expect(labelDataSchema.safeParse({ nutrients: { fatG: 1, saturatesG: 2.5 } }).success).toBe(false);
    expect(labelDataSchema.safeParse({ nutrients: { carbohydrateG: 10, sugarsG: 12 } }).success).toBe(false);
    expect(labelDataSchema.safeParse({ nutrients: { sugarsG: 4, sucroseG: 2, glucoseG: 2, fructoseG: 2 } }).success).toBe(false);
    // Within the 1 g tolerance (sources round each value on their own).
    expect(labelDataSchema.safeParse({ nutrients: { waterG: 90, proteinG: 5, fatG: 1, carbohydrateG: 4.9 } }).success).toBe(true);
  });

  it('leaves every nutrient it is not given unknown (null), never zero', () => {
    const parsed = labelDataSchema.parse({ nutrients: { waterG: 80 } });
    expect(parsed.nutrients.waterG).toBe(80);
    expect(parsed.nutrients.fatG).toBeNull();
    expect(parsed.euAllergens).toEqual([]);
  });
});
