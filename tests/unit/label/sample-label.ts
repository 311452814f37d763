/** A hand-made label for tests of the views, the exports and the comparison (figures invented). */
import { LABEL_FORMAT, type Label, type LabelNutrientRow } from '@/lib/label/label';

const row = (key: string, name: string, unit: string, unrounded: number | null, label: string | null, extra: Partial<LabelNutrientRow> = {}): LabelNutrientRow =>
  ({ key, name, unit, depth: 0, unrounded, label, incomplete: false, ...extra });

export function sampleLabel(): Label {
  return {
    format: LABEL_FORMAT,
    productClass: 'reduced_sugar_spread',
    ruleSet: 'eu',
    ingredients: {
      eu: { runs: [{ text: 'Strawberries, sugar, gelling agent (pectin), acid (citric acid), preservative (potassium sorbate), ', emphasis: false }, { text: 'sulphites', emphasis: true }], contains: null, notes: ['Added water is left out: it evaporates in the boil.'] },
      us: { runs: [{ text: 'Strawberries, sugar, pectin, citric acid, potassium sorbate', emphasis: false }], contains: null, notes: [] },
    },
    statements: [
      { kind: 'fruit', text: 'Prepared with 62 g of fruit per 100 g', gramsPer100g: 62.4, notes: [] },
      { kind: 'total_sugar', text: 'Total sugar content 45 g per 100 g', gramsPer100g: 45.2, notes: ['Refractometer value at 20 °C.'] },
    ],
    eu: {
      per: '100 g', energyBasis: 'Energy from carbohydrate other than polyols.',
      rows: [
        row('energyKj', 'Energy', 'kJ', 770.4, '770 kJ'),
        row('energyKcal', 'Energy', 'kcal', 181.6, '182 kcal'),
        row('fatG', 'Fat', 'g', 0.12, '<0.5 g'),
        row('saturatesG', 'of which saturates', 'g', null, null, { depth: 1 }),
        row('carbohydrateG', 'Carbohydrate', 'g', 44.9, '45 g', { incomplete: true }),
        row('sugarsG', 'of which sugars', 'g', 44.1, '44 g', { depth: 1 }),
        row('proteinG', 'Protein', 'g', 0.4, '0.4 g'),
        row('saltG', 'Salt', 'g', 0.011, '0.01 g'),
      ],
    },
    us: {
      serving: '1 tbsp (20 g)', servingG: 20, servingsPerJar: '12.5 servings per container', energyBasis: 'Calories from the general factors.', notes: [],
      rows: [
        { ...row('calories', 'Calories', '', 36.3, '35'), dailyValue: null },
        { ...row('totalSugars', 'Total sugars', 'g', 8.8, '9 g'), dailyValue: null },
        { ...row('addedSugars', 'Includes added sugars', 'g', null, null, { depth: 2 }), dailyValue: null },
      ],
    },
    claims: { reference: 'a typical jam (60 g sugars per 100 g)', items: [{ claim: 'Reduced sugar', holds: true, figures: '44.1 g against 60 g: 26 % less', rule: 'Regulation (EC) 1924/2006, Annex' }] },
    additives: [{ name: 'Sorbic acid and sorbates', status: 'over', amount: '1100 mg/kg as sorbic acid', limit: '1000 mg/kg', rule: 'Regulation (EC) 1333/2008, Annex II, 04.2.5', note: null }],
    incomplete: [{ part: 'Saturates', reason: 'Not known for pectin.' }],
  };
}
