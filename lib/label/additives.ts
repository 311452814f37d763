/**
 * Additive limits for fruit spreads, as data with the rule cited, checked against a formula's
 * finished product. PURE. Results use the compliance vocabulary (`RuleCheckResult`, pass / fail /
 * not evaluable / not applicable) so a formula over a limit fails like a compositional rule.
 *
 * Regulation (EC) No 1333/2008, Annex II, Part E, food category 04.2.5 "Jam, jellies,
 * marmalades and similar products":
 *   04.2.5.1 Extra jam and extra jelly as defined by Directive 2001/113/EC
 *   04.2.5.2 Jam, jellies and marmalades and sweetened chestnut purée as defined by Directive 2001/113/EC
 *   04.2.5.3 Other similar fruit or vegetable spreads
 * Read in the text: the group "E 200–213: Sorbic acid — sorbates; Benzoic acid — benzoates
 * (SA + BA)" of Annex II Part C(5)(c), whose members are E 200, E 202, E 210, E 211, E 212 and
 * E 213 (calcium sorbate E 203 struck out by Regulation (EU) 2018/98), and the footnotes
 * "(1): The additives may be added individually or in combination" and "(2): The maximum level is
 * applicable to the sum and the levels are expressed as the free acid" (legislation.gov.uk copy of
 * Annex II). Not reached in the text, so from memory: the rows of 04.2.5.2 and 04.2.5.3 giving
 * E 200–213 at 1 000 mg/kg with (1)(2) "only low-sugar and similar low calorie or sugar-free
 * products", no sorbate or benzoate row in 04.2.5.1, and pectins (E 440) and citric acid (E 330)
 * at quantum satis in all three sub-categories.
 */
import { overallStatus } from '@/lib/chemistry/compliance';
import type { OverallComplianceStatus, RuleCheckResult } from '@/lib/chemistry/compliance';
import type { ProductClass } from '@/lib/chemistry/types';
import type { LabelInput } from './types';
import { validateLabelInput } from './validate';
import { firstUpper } from '@/lib/format/words';

export type FoodCategory = '04.2.5.1' | '04.2.5.2' | '04.2.5.3';

export const FOOD_CATEGORY_NAMES: Record<FoodCategory, string> = {
  '04.2.5.1': 'Extra jam and extra jelly',
  '04.2.5.2': 'Jam, jellies and marmalades',
  '04.2.5.3': 'Other similar fruit or vegetable spreads',
};

/** Which sub-category a product class falls in. A reduced-sugar spread is outside the Directive's names, so 04.2.5.3. */
export function foodCategoryFor(productClass: ProductClass): FoodCategory {
  switch (productClass) {
    case 'extra_jam': return '04.2.5.1';
    case 'reduced_sugar_spread': return '04.2.5.3';
    default: return '04.2.5.2';
  }
}

/**
 * Standard atomic weights, conventional values (IUPAC Commission on Isotopic Abundances and Atomic
 * Weights, abridged table to five significant figures; recalled, memory).
 */
const ATOMIC_WEIGHT = { C: 12.011, H: 1.008, O: 15.999, Na: 22.990, K: 39.098, Ca: 40.078 } as const;
type Element = keyof typeof ATOMIC_WEIGHT;

export function formulaMass(formula: Partial<Record<Element, number>>): number {
  return (Object.keys(formula) as Element[]).reduce((t, el) => t + ATOMIC_WEIGHT[el] * (formula[el] ?? 0), 0);
}

const SORBIC_ACID = { C: 6, H: 8, O: 2 };
const BENZOIC_ACID = { C: 7, H: 6, O: 2 };

interface Substance {
  name: string;
  formula: Partial<Record<Element, number>>;
  /** The free acid it is counted as, and how many acid molecules one formula unit carries. */
  freeAcid?: { name: string; formula: Partial<Record<Element, number>>; perFormulaUnit: number };
}

/** Formulas: Regulation (EU) No 231/2012 specifications (chemical formulae; memory). */
const SUBSTANCES: Readonly<Record<string, Substance>> = {
  E200: { name: 'sorbic acid', formula: SORBIC_ACID, freeAcid: { name: 'sorbic acid', formula: SORBIC_ACID, perFormulaUnit: 1 } },
  E202: { name: 'potassium sorbate', formula: { C: 6, H: 7, K: 1, O: 2 }, freeAcid: { name: 'sorbic acid', formula: SORBIC_ACID, perFormulaUnit: 1 } },
  E203: { name: 'calcium sorbate', formula: { C: 12, H: 14, Ca: 1, O: 4 }, freeAcid: { name: 'sorbic acid', formula: SORBIC_ACID, perFormulaUnit: 2 } },
  E210: { name: 'benzoic acid', formula: BENZOIC_ACID, freeAcid: { name: 'benzoic acid', formula: BENZOIC_ACID, perFormulaUnit: 1 } },
  E211: { name: 'sodium benzoate', formula: { C: 7, H: 5, Na: 1, O: 2 }, freeAcid: { name: 'benzoic acid', formula: BENZOIC_ACID, perFormulaUnit: 1 } },
  E212: { name: 'potassium benzoate', formula: { C: 7, H: 5, K: 1, O: 2 }, freeAcid: { name: 'benzoic acid', formula: BENZOIC_ACID, perFormulaUnit: 1 } },
  E213: { name: 'calcium benzoate', formula: { C: 14, H: 10, Ca: 1, O: 4 }, freeAcid: { name: 'benzoic acid', formula: BENZOIC_ACID, perFormulaUnit: 2 } },
};

/** Grams of free acid per gram of the substance: acid molecules × M(acid) / M(substance). */
export function freeAcidFactor(eNumber: string): number | null {
  const substance = Object.hasOwn(SUBSTANCES, eNumber) ? SUBSTANCES[eNumber] : undefined;
  if (!substance?.freeAcid) return null;
  return (substance.freeAcid.perFormulaUnit * formulaMass(substance.freeAcid.formula)) / formulaMass(substance.formula);
}

export interface AdditiveRule {
  id: string;
  title: string;
  /** Members; a group's limit applies to their sum. */
  eNumbers: readonly string[];
  categories: readonly FoodCategory[];
  /** mg/kg of the finished product; null = quantum satis. */
  maxMgPerKg: number | null;
  expressedAsFreeAcid: boolean;
  /** The Annex's restriction within the category, when it has one. */
  onlyFor?: { productClasses: readonly ProductClass[]; text: string };
  source: string;
}

const ANNEX_II = 'Regulation (EC) No 1333/2008, Annex II, Part E';
const LOW_SUGAR_ONLY = {
  productClasses: ['reduced_sugar_spread'] as const,
  text: 'only low-sugar and similar low-calorie or sugar-free products',
};

export const ADDITIVE_RULES: readonly AdditiveRule[] = [
  {
    id: 'eu.additives.04_2_5.sorbates_benzoates',
    title: 'Sorbates and benzoates',
    eNumbers: ['E200', 'E202', 'E210', 'E211', 'E212', 'E213'],
    categories: ['04.2.5.2', '04.2.5.3'],
    maxMgPerKg: 1000,
    expressedAsFreeAcid: true,
    onlyFor: LOW_SUGAR_ONLY,
    source: `${ANNEX_II}, categories 04.2.5.2 and 04.2.5.3 (E 200–213, footnotes (1) and (2))`,
  },
  {
    id: 'eu.additives.04_2_5.pectins',
    title: 'Pectins',
    eNumbers: ['E440'],
    categories: ['04.2.5.1', '04.2.5.2', '04.2.5.3'],
    maxMgPerKg: null,
    expressedAsFreeAcid: false,
    source: `${ANNEX_II}, category 04.2.5 (E 440, quantum satis)`,
  },
  {
    id: 'eu.additives.04_2_5.citric_acid',
    title: 'Citric acid',
    eNumbers: ['E330'],
    categories: ['04.2.5.1', '04.2.5.2', '04.2.5.3'],
    maxMgPerKg: null,
    expressedAsFreeAcid: false,
    source: `${ANNEX_II}, category 04.2.5 (E 330, quantum satis)`,
  },
];

/** Additives the Union list no longer holds at all. */
const WITHDRAWN: Readonly<Record<string, string>> = {
  E203: 'Calcium sorbate (E 203) is no longer an authorised additive (Regulation (EU) 2018/98).',
};

export type AdditiveCheck = RuleCheckResult & {
  eNumbers: string[];
  category: FoodCategory | null;
};

export interface AdditiveReport {
  category: FoodCategory | null;
  overall: OverallComplianceStatus;
  checks: AdditiveCheck[];
}

function normaliseENumber(eNumber: string): string {
  return eNumber.replace(/\s+/g, '').toUpperCase();
}

function round1(value: number): number {
  return Math.round(value * 10) / 10;
}

/** mg per kg of finished product for each E number the formula uses (lines summed). */
function additiveMasses(input: LabelInput): Map<string, { mgPerKg: number; names: string[] }> {
  const finishedKg = input.massBalance.finishedMassG / 1000;
  const byENumber = new Map<string, { mgPerKg: number; names: string[] }>();
  for (const line of input.lines) {
    const additive = line.ingredient.additive;
    if (!additive || !(line.grams > 0)) continue;
    const eNumber = normaliseENumber(additive.eNumber);
    const entry = byENumber.get(eNumber) ?? { mgPerKg: 0, names: [] };
    entry.mgPerKg += (line.grams * 1000) / finishedKg;
    if (!entry.names.includes(line.ingredient.labelName)) entry.names.push(line.ingredient.labelName);
    byENumber.set(eNumber, entry);
  }
  return byENumber;
}

function result(fields: Omit<AdditiveCheck, 'passed' | 'status'> & { status: AdditiveCheck['status'] }): AdditiveCheck {
  const passed = fields.status === 'pass' ? true : fields.status === 'fail' ? false : null;
  return { ...fields, passed };
}

/**
 * One check per rule the formula touches, plus one per additive no rule covers. EU rule sets only;
 * in other markets each additive is reported as not applicable.
 */
export function additiveLimitChecks(input: LabelInput): AdditiveCheck[] {
  validateLabelInput(input);
  const masses = additiveMasses(input);
  if (masses.size === 0) return [];
  const settings = input.settings;
  if (settings.ruleSet !== 'eu') {
    return [...masses.entries()].map(([eNumber, m]) => result({
      ruleId: `additives.${eNumber}`,
      title: firstUpper(m.names.join(', ')),
      requirement: 'Additive limits are checked against the EU rules only',
      actual: `${round1(m.mgPerKg)} mg/kg`,
      actualValue: m.mgPerKg,
      requiredValue: null,
      status: 'not_applicable',
      source: 'Regulation (EC) No 1333/2008',
      eNumbers: [eNumber],
      category: null,
      note: 'Check the additive against the rules of the market the product is sold in.',
    }));
  }

  const category = foodCategoryFor(settings.productClass);
  const categoryName = `${category} ${FOOD_CATEGORY_NAMES[category]}`;
  const checks: AdditiveCheck[] = [];
  const covered = new Set<string>();

  for (const [eNumber, reason] of Object.entries(WITHDRAWN)) {
    const m = masses.get(eNumber);
    if (!m) continue;
    covered.add(eNumber);
    checks.push(result({
      ruleId: `eu.additives.withdrawn.${eNumber}`,
      title: firstUpper(m.names.join(', ')),
      requirement: 'Not authorised',
      actual: `${round1(m.mgPerKg)} mg/kg`,
      actualValue: m.mgPerKg,
      requiredValue: 0,
      status: 'fail',
      source: 'Regulation (EU) 2018/98, amending Annex II to Regulation (EC) No 1333/2008',
      eNumbers: [eNumber],
      category,
      note: reason,
    }));
  }

  for (const rule of ADDITIVE_RULES) {
    const present = rule.eNumbers.filter((e) => masses.has(e));
    if (present.length === 0) continue;
    present.forEach((e) => covered.add(e));
    const names = present.flatMap((e) => masses.get(e)?.names ?? []);
    const asUsed = present.reduce((t, e) => t + (masses.get(e)?.mgPerKg ?? 0), 0);
    const counted = rule.expressedAsFreeAcid
      ? present.reduce((t, e) => t + (masses.get(e)?.mgPerKg ?? 0) * (freeAcidFactor(e) ?? 1), 0)
      : asUsed;
    const permittedInCategory = rule.categories.includes(category);
    const conditionMet = !rule.onlyFor || rule.onlyFor.productClasses.includes(settings.productClass);
    const base = {
      ruleId: rule.id,
      title: rule.title,
      actual: `${round1(counted)} mg/kg${rule.expressedAsFreeAcid ? ' as free acid' : ''}`,
      actualValue: counted,
      source: rule.source,
      eNumbers: present,
      category,
    };
    if (!permittedInCategory || !conditionMet) {
      checks.push(result({
        ...base,
        requirement: `Not permitted in ${categoryName}${rule.onlyFor && permittedInCategory ? ` (${rule.onlyFor.text})` : ''}`,
        requiredValue: 0,
        status: 'fail',
        note: `${names.join(', ')} cannot be used in this product class.`,
      }));
      continue;
    }
    if (rule.maxMgPerKg === null) {
      checks.push(result({
        ...base,
        requirement: 'Quantum satis: no numerical maximum, no more than is needed',
        requiredValue: null,
        status: 'pass',
        note: undefined,
      }));
      continue;
    }
    const within = counted <= rule.maxMgPerKg + 1e-9;
    const summed = present.length > 1 ? ', summed' : '';
    checks.push(result({
      ...base,
      requirement: `≤ ${rule.maxMgPerKg} mg/kg${rule.expressedAsFreeAcid ? ' as free acid' : ''}${summed}`,
      requiredValue: rule.maxMgPerKg,
      status: within ? 'pass' : 'fail',
      note: rule.expressedAsFreeAcid
        ? `${round1(asUsed)} mg/kg as weighed (${names.join(', ')}), counted as the free acid.${rule.onlyFor ? ` Permitted ${rule.onlyFor.text}.` : ''}`
        : undefined,
    }));
  }

  for (const [eNumber, m] of masses) {
    if (covered.has(eNumber)) continue;
    checks.push(result({
      ruleId: `eu.additives.unknown.${eNumber}`,
      title: firstUpper(m.names.join(', ')),
      requirement: `The conditions of use in ${categoryName}`,
      actual: `${round1(m.mgPerKg)} mg/kg`,
      actualValue: m.mgPerKg,
      requiredValue: null,
      status: 'not_evaluable',
      source: `${ANNEX_II}, category ${category}`,
      eNumbers: [eNumber],
      category,
      note: `No limit for ${eNumber} is held here; check it against the category before use.`,
    }));
  }
  return checks;
}

/** The additive checks with one verdict, as the compliance report gives one. */
export function additiveReport(input: LabelInput): AdditiveReport {
  const checks = additiveLimitChecks(input);
  return {
    category: input.settings.ruleSet === 'eu' ? foodCategoryFor(input.settings.productClass) : null,
    overall: overallStatus(checks),
    checks,
  };
}
