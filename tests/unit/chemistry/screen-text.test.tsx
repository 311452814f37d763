// @vitest-environment jsdom
/**
 * What the caution and compliance panels put on a screen is for practitioners: no enum keys
 * ("extra_jam", "PH_ABOVE_4_6") and no provenance notes meant for developers ("(memory)", "recalled",
 * "was not read"). Those belong in code comments and tests. This renders the panels for every
 * product class, rule set, rule date and pH case, and scans the text.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render } from '@testing-library/react';
import { ResultsPanel } from '@/components/formulas/ResultsPanel';
import { CautionList as SpecCautionList } from '@/components/ui/CautionList';
import { computeBatch, defaultQcSpec, qcSpecCautions, RULES, OUT_OF_SCOPE, TYPICAL_INGREDIENTS, PRESERVATION_METHODS, type FormulaLineInput, type FormulaSettings } from '@/lib/chemistry';
import { PRODUCT_CLASSES, RULE_SETS } from '@/lib/formulas/schema';

afterEach(cleanup);

const PROVENANCE = /\(memory|\bmemory\b|recalled|was not read|were not read|not checked against/i;
/** snake_case or SCREAMING_CASE words: enum keys and caution codes. */
const ENUM_KEY = /\b[a-z]+_[a-z0-9_]+\b|\b[A-Z][A-Z0-9]*_[A-Z0-9_]+\b/;

function problemsIn(text: string): string[] {
  const found: string[] = [];
  const p = text.match(PROVENANCE);
  if (p) found.push(`provenance “${p[0]}” in: …${text.slice(Math.max(0, (p.index ?? 0) - 60), (p.index ?? 0) + 60)}…`);
  const k = text.match(ENUM_KEY);
  if (k) found.push(`enum key “${k[0]}” in: …${text.slice(Math.max(0, (k.index ?? 0) - 60), (k.index ?? 0) + 60)}…`);
  return found;
}

const byKey = (key: string) => TYPICAL_INGREDIENTS.find((i) => i.key === key)!;
/** Two US groups of fruit, sugar, HM pectin and acid, so the mixed-group and fruit-ratio notes appear too. */
const LINES: FormulaLineInput[] = [
  { ingredient: byKey('strawberry'), quantity: 500, unit: 'g' },
  { ingredient: byKey('apricot'), quantity: 500, unit: 'g' },
  { ingredient: byKey('sucrose'), quantity: 900, unit: 'g' },
  { ingredient: byKey('pectin_hm_rapid_150'), quantity: 6, unit: 'g' },
  { ingredient: byKey('citric_acid_anhydrous'), quantity: 5, unit: 'g' },
];

describe('text on screens carries no enum keys or provenance notes', () => {
  it('the formula results (cautions, compliance, end point) for every product class, market, rule date and pH', () => {
    const problems: string[] = [];
    for (const productClass of PRODUCT_CLASSES) {
      for (const ruleSet of RULE_SETS) {
        for (const ruleDate of ['2026-01-15', '2026-07-01']) {
          for (const plannedPh of [undefined, 3.2, 4.8]) {
            for (const targetSolidsPct of [45, 65]) {
              const settings: FormulaSettings = { productClass, ruleSet, ruleDate, targetSolidsPct, jarNetFillG: 340, ...(plannedPh ? { plannedPh } : {}) };
              const { container } = render(<ResultsPanel outcome={{ ok: true, computation: computeBatch(LINES, settings) }} massUnits="metric" temperatureUnit="C" />);
              problems.push(...problemsIn(container.textContent ?? '').map((p) => `${productClass}/${ruleSet}/${ruleDate}/pH ${plannedPh}/${targetSolidsPct} %: ${p}`));
              cleanup();
            }
          }
        }
      }
    }
    expect([...new Set(problems)]).toEqual([]);
  });

  it('the QC spec cautions on the batch sheet and the review, with and without a stated preservation', () => {
    const spec = defaultQcSpec(computeBatch(LINES, { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-01-15', targetSolidsPct: 65, jarNetFillG: 340, plannedPh: 3.2 }));
    const problems: string[] = [];
    for (const preservation of [undefined, ...PRESERVATION_METHODS]) {
      const cautions = qcSpecCautions({ ...spec, solidsMinBrix: 44, minFillTempC: 80, phMax: 4.8 }, 'reduced_sugar_spread', preservation);
      const { container } = render(<SpecCautionList cautions={cautions} />);
      // One caution list everywhere: the spec's cautions name their source like the formula's do.
      expect(container.querySelectorAll('li').length).toBe(cautions.length);
      expect(container.textContent).toContain(`Source: ${cautions[0].source}`);
      problems.push(...problemsIn(container.textContent ?? ''));
      cleanup();
    }
    expect(problems).toEqual([]);
  });

  it('the rule notes, out-of-scope reasons and starter-ingredient sources shown in the library', () => {
    const texts = [
      ...RULES.flatMap((r) => [r.title, r.source, r.note ?? '']),
      ...OUT_OF_SCOPE.flatMap((o) => [o.source, o.reason]),
      ...TYPICAL_INGREDIENTS.map((i) => i.source),
    ];
    expect(texts.flatMap(problemsIn)).toEqual([]);
  });

  it('the scan itself catches what the issue saw', () => {
    expect(problemsIn('Applies to extra_jam, not jam.')).toHaveLength(1);
    expect(problemsIn('(memory) Exception-fruit minimums kept as in 2001/113/EC')).toHaveLength(1);
    expect(problemsIn('the table rows used are from memory')).toHaveLength(1);
    expect(problemsIn('Applies to extra jam, not to jam. Source: 21 CFR 150.160(b)(1), pH 4.6')).toEqual([]);
  });
});
