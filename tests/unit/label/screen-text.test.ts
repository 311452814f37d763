/**
 * The label modules' words are shown to practitioners: no enum keys and no provenance notes meant
 * for developers ("(memory)", "recalled", "was not read"), as tests/unit/chemistry/screen-text.test.tsx
 * checks for the chemistry panels. This runs every module over each product class, market and rule
 * date and scans every field meant for display.
 */
import { describe, expect, it } from 'vitest';
import { PRODUCT_CLASSES, RULE_SETS } from '@/lib/formulas/schema';
import { additiveLimitChecks } from '@/lib/label/additives';
import { TYPICAL_JAM_REFERENCE, sugarClaimChecks } from '@/lib/label/claims';
import { ingredientList } from '@/lib/label/ingredient-list';
import { compareStatedSugar, jamStatements } from '@/lib/label/statements';
import { computeBatch } from '@/lib/chemistry';
import type { FinishedNutrients } from '@/lib/label/types';
import {
  BENZOATE, CITRIC, LABEL, PECTIN, SORBATE, STRAWBERRY, SUCROSE, WATER, labelData, labelInputFrom, labelSettings, nutrients,
} from './text-fixtures';

const PROVENANCE = /\(memory|\bmemory\b|recalled|was not read|were not read|not checked against|unverified/i;
const ENUM_KEY = /\b[a-z]+_[a-z0-9_]+\b|\b[A-Z][A-Z0-9]*_[A-Z0-9_]+\b/;

function problemsIn(text: string): string[] {
  return [PROVENANCE, ENUM_KEY].flatMap((re) => {
    const m = text.match(re);
    return m ? [`“${m[0]}” in: ${text}`] : [];
  });
}

describe('label text carries no enum keys or provenance notes', () => {
  it('in the list, statements, claims, additive checks and the water-activity model', () => {
    const texts: string[] = [];
    const glaze = labelData('glaze', { euAllergens: ['eggs', 'sulphites'], usAllergens: ['eggs'], sulphiteMgPerKg: null });
    const finished: FinishedNutrients = { ...nutrients({ sugarsG: 30 }), unknownFrom: { sugarsG: ['glaze'] } };
    for (const productClass of PRODUCT_CLASSES) {
      for (const ruleSet of RULE_SETS) {
        for (const ruleDate of ['2026-01-15', '2026-07-01']) {
          const settings = labelSettings({ productClass, ruleSet, ruleDate, targetSolidsPct: productClass === 'reduced_sugar_spread' ? 30 : 65 });
          const input = labelInputFrom([
            { composition: STRAWBERRY, label: LABEL.strawberry, grams: 1000 },
            { composition: SUCROSE, label: LABEL.sugar, grams: productClass === 'reduced_sugar_spread' ? 300 : 1000 },
            { composition: WATER, label: LABEL.water, grams: 300 },
            { composition: PECTIN, label: LABEL.pectin, grams: 8 },
            { composition: CITRIC, label: LABEL.citric, grams: 4 },
            { composition: SORBATE, label: LABEL.sorbate, grams: 1 },
            { composition: BENZOATE, label: LABEL.benzoate, grams: 1 },
            { composition: { kind: 'other', name: 'Glaze', solidsPct: 0 }, label: glaze, grams: 2 },
            { composition: { kind: 'other', name: 'Colour', solidsPct: 100 }, label: labelData('colour', { additive: { eNumber: 'E163', className: 'colour' } }), grams: 0.2 },
          ], settings);
          for (const market of ['eu', 'us'] as const) {
            const list = ingredientList(input, market);
            texts.push(list.text, ...list.notes, list.containsStatement ?? '', list.addedWater?.reason ?? '', list.fruitIndication.text ?? '', ...list.fruitIndication.alternatives);
          }
          const statements = jamStatements(input, { extractionWaterG: 10 });
          texts.push(statements.edition, ...statements.notes);
          for (const s of [statements.fruit, statements.totalSugar]) if (s) texts.push(s.text, s.reason, s.source);
          for (const c of sugarClaimChecks(input, { nutrients: finished, energyKj: 700 }, TYPICAL_JAM_REFERENCE)) {
            texts.push(c.title, c.requirement, c.source, c.note ?? '', c.accompanyingStatement ?? '', ...c.figures.map((f) => `${f.label} ${f.unit}`));
          }
          for (const a of additiveLimitChecks(input)) texts.push(a.title, a.requirement, a.actual ?? '', a.source, a.note ?? '');
        }
      }
    }
    texts.push(compareStatedSugar(65, 69).message, compareStatedSugar(65, 65).message);
    texts.push(computeBatch([
      { ingredient: STRAWBERRY, quantity: 1000, unit: 'g' },
      { ingredient: { ...SUCROSE, sugars: { sucroseG: 99.8, glucoseG: 0, fructoseG: 0 } }, quantity: 1000, unit: 'g' },
    ], labelSettings({ sucroseInversionPct: 20 })).waterActivity.model);
    const problems = [...new Set(texts.filter(Boolean).flatMap(problemsIn))];
    expect(problems).toEqual([]);
    expect(texts.length).toBeGreaterThan(500);
  });
});
