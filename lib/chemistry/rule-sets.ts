/**
 * Market composition rules, as data. Each rule names the legal text it comes from. Dates are ISO;
 * `validFrom` is inclusive and `validUntil` exclusive. `note` is shown on screen beside the result;
 * where the values were read and whether they were checked against the legal text ("(memory)")
 * stays in `provenance`, which is never shown.
 */
import type { EuFruitGroup, MarketRuleSetId, ProductClass, UsFruitGroup } from './types';

export type RuleMetric =
  | 'fruit_per_1000g_finished'
  | 'soluble_solids_pct'
  | 'fruit_parts_per_55_sweetener';

export interface ComplianceRule {
  id: string;
  ruleSet: MarketRuleSetId;
  title: string;
  productClasses: readonly ProductClass[];
  metric: RuleMetric;
  /** Plain minimum when it does not depend on the fruit. */
  minimum?: number;
  /** EU Annex I minimums by fruit group, g per 1000 g finished product. */
  minimumByEuGroup?: Partial<Record<EuFruitGroup, number>>;
  /** US minimums by 21 CFR 150.160 fruit group, parts fruit per 55 parts sweetener. */
  minimumByUsGroup?: Partial<Record<UsFruitGroup, number>>;
  unit: string;
  validFrom?: string;
  validUntil?: string;
  /** Exact legal text name and article / annex. */
  source: string;
  quote: string;
  note?: string;
  /** For developers and tests only: where the values were read, and "(memory)" where not checked. */
  provenance?: string;
}

/** Date from which the Directive (EU) 2024/1438 minimums apply. */
export const EU_2024_AMENDMENT_FROM = '2026-06-14';

const EU_2001 = 'Council Directive 2001/113/EC, Annex I';
const EU_2024 = 'Council Directive 2001/113/EC, Annex I, as amended by Directive (EU) 2024/1438';
/** Where the 2024 general minimums were read: the amending text itself was not reachable. */
const EU_2024_SUMMARIES = 'General minimums per the Food Safety Authority of Ireland summary of Directive (EU) 2024/1438 (jam 350 → 450 g; extra jam and extra jelly 450 → 500 g) and the Eurofins summary of the same amendment.';
/** The exception minimums after 2024 are carried over from 2001 without having been read in the amending text. */
const EU_2024_EXCEPTIONS_PROVENANCE = '(memory) Exception-fruit minimums kept as in 2001/113/EC: the FSAI and Eurofins summaries name only the general minimums, and a Polish press summary of the national transposition says the lower thresholds for currants, sea buckthorn, quince and the other exception fruits are kept; not checked against the amending text.';
/** What a reader of the result needs to know about the exception fruits after 2024. */
const EU_2024_EXCEPTIONS_NOTE = 'The lower minimums for currants, sea buckthorn, quince and the other exception fruits are carried over from the 2001 rules; check them against the amending directive before relying on them.';
const TRANSITION_NOTE = 'Products made and labelled under these rules before 14 June 2026 may be sold until stocks run out (Directive (EU) 2024/1438).';

export const RULES: readonly ComplianceRule[] = [
  // --- EU, before 14 June 2026 ---
  {
    id: 'eu.2001.jam.fruit',
    ruleSet: 'eu',
    title: 'Jam: minimum fruit',
    productClasses: ['jam'],
    metric: 'fruit_per_1000g_finished',
    minimumByEuGroup: { general: 350, reduced_minimum_fruits: 250, ginger: 150, cashew_apple: 160, passion_fruit: 60 },
    unit: 'g fruit per 1000 g',
    validUntil: EU_2024_AMENDMENT_FROM,
    source: `${EU_2001}, Part I ('Jam')`,
    quote: 'Pulp and/or purée per 1000 g of finished product not less than 350 g as a general rule; 250 g for redcurrants, rowanberries, sea-buckthorns, blackcurrants, rosehips and quinces; 150 g ginger; 160 g cashew apples; 60 g passion fruit.',
    note: TRANSITION_NOTE,
  },
  {
    id: 'eu.2001.extra_jam.fruit',
    ruleSet: 'eu',
    title: 'Extra jam: minimum fruit',
    productClasses: ['extra_jam'],
    metric: 'fruit_per_1000g_finished',
    minimumByEuGroup: { general: 450, reduced_minimum_fruits: 350, ginger: 250, cashew_apple: 230, passion_fruit: 80 },
    unit: 'g fruit per 1000 g',
    validUntil: EU_2024_AMENDMENT_FROM,
    source: `${EU_2001}, Part I ('Extra jam')`,
    quote: 'Unconcentrated pulp per 1000 g of finished product not less than 450 g as a general rule; 350 g for redcurrants, rowanberries, sea-buckthorns, blackcurrants, rosehips and quinces; 250 g ginger; 230 g cashew apples; 80 g passion fruit.',
    note: TRANSITION_NOTE,
  },
  {
    id: 'eu.2001.jelly.fruit',
    ruleSet: 'eu',
    title: 'Jelly: minimum fruit juice or extract',
    productClasses: ['jelly'],
    metric: 'fruit_per_1000g_finished',
    minimumByEuGroup: { general: 350, reduced_minimum_fruits: 250, ginger: 150, cashew_apple: 160, passion_fruit: 60 },
    unit: 'g juice/extract per 1000 g',
    validUntil: EU_2024_AMENDMENT_FROM,
    source: `${EU_2001}, Part I ('Jelly')`,
    quote: 'Juice and/or aqueous extracts per 1000 g of finished product not less than that laid down for the manufacture of jam, calculated after deduction of the water used in preparing the extracts.',
    note: 'Fruit lines are taken as juice or extract already net of added extraction water.',
  },
  // --- EU, from 14 June 2026 ---
  {
    id: 'eu.2024.jam.fruit',
    ruleSet: 'eu',
    title: 'Jam: minimum fruit (raised)',
    productClasses: ['jam'],
    metric: 'fruit_per_1000g_finished',
    minimumByEuGroup: { general: 450, reduced_minimum_fruits: 250, ginger: 150, cashew_apple: 160, passion_fruit: 60 },
    unit: 'g fruit per 1000 g',
    validFrom: EU_2024_AMENDMENT_FROM,
    source: `${EU_2024}, Part I ('Jam')`,
    quote: 'The general minimum for jam rises from 350 g to 450 g of fruit per 1000 g of finished product.',
    note: EU_2024_EXCEPTIONS_NOTE,
    provenance: `${EU_2024_SUMMARIES} ${EU_2024_EXCEPTIONS_PROVENANCE}`,
  },
  {
    id: 'eu.2024.extra_jam.fruit',
    ruleSet: 'eu',
    title: 'Extra jam: minimum fruit (raised)',
    productClasses: ['extra_jam'],
    metric: 'fruit_per_1000g_finished',
    minimumByEuGroup: { general: 500, reduced_minimum_fruits: 350, ginger: 250, cashew_apple: 230, passion_fruit: 80 },
    unit: 'g fruit per 1000 g',
    validFrom: EU_2024_AMENDMENT_FROM,
    source: `${EU_2024}, Part I ('Extra jam')`,
    quote: 'The general minimum for extra jam rises from 450 g to 500 g of fruit per 1000 g of finished product.',
    note: EU_2024_EXCEPTIONS_NOTE,
    provenance: `${EU_2024_SUMMARIES} ${EU_2024_EXCEPTIONS_PROVENANCE}`,
  },
  {
    id: 'eu.2024.jelly.fruit',
    ruleSet: 'eu',
    title: 'Jelly: minimum fruit juice or extract (raised)',
    productClasses: ['jelly'],
    metric: 'fruit_per_1000g_finished',
    minimumByEuGroup: { general: 450, reduced_minimum_fruits: 250, ginger: 150, cashew_apple: 160, passion_fruit: 60 },
    unit: 'g juice/extract per 1000 g',
    validFrom: EU_2024_AMENDMENT_FROM,
    source: `${EU_2024}, Part I ('Jelly')`,
    quote: 'Juice and/or aqueous extracts per 1000 g of finished product not less than that laid down for the manufacture of jam, so the general minimum rises with jam to 450 g.',
    note: `Jelly uses the jam minimums. ${EU_2024_EXCEPTIONS_NOTE}`,
    provenance: `Jelly refers to the jam minimums in Annex I, Part I ('Jelly'); the FSAI summary lists no separate change for jelly. ${EU_2024_EXCEPTIONS_PROVENANCE}`,
  },
  {
    id: 'eu.marmalade.citrus',
    ruleSet: 'eu',
    title: 'Marmalade: minimum citrus fruit',
    productClasses: ['marmalade'],
    metric: 'fruit_per_1000g_finished',
    minimum: 200,
    unit: 'g citrus per 1000 g',
    source: `${EU_2001}, Part I ('Marmalade')`,
    quote: 'The quantity of citrus fruit used in the manufacture of 1 000 g of finished product must not be less than 200 g of which at least 75 g must be obtained from the endocarp.',
    note: 'Directive (EU) 2024/1438 renames the product "citrus marmalade" without changing this minimum. The 75 g endocarp share is not computed.',
    provenance: 'Text as reproduced in the EFSA FoodEx2 description of "Marmalade" (term A01NJ) and in the Jam and Similar Products (England) Regulations 2003; the FSAI and Eurofins summaries of Directive (EU) 2024/1438 list no change to this minimum.',
  },
  {
    id: 'eu.soluble_dry_matter',
    ruleSet: 'eu',
    title: 'Soluble dry matter',
    productClasses: ['jam', 'extra_jam', 'jelly', 'marmalade'],
    metric: 'soluble_solids_pct',
    minimum: 60,
    unit: '% (refractometer)',
    source: `${EU_2001}, Part II (soluble dry matter content)`,
    quote: 'The products defined must have a soluble dry matter content of 60 % or more as determined by refractometer, except where sugars have been wholly or partially replaced by sweeteners.',
    note: 'Reduced-sugar spreads fall under national rules, not these reserved names.',
  },
  // --- US ---
  {
    id: 'us.150_160.soluble_solids',
    ruleSet: 'us',
    title: 'Preserves and jams: soluble solids',
    productClasses: ['jam', 'extra_jam'],
    metric: 'soluble_solids_pct',
    minimum: 65,
    unit: '% soluble solids',
    source: '21 CFR 150.160 (Fruit preserves and jams), paragraph (d)',
    quote: 'The soluble solids content of the finished food is not less than 65 percent.',
    note: 'The US standard has no separate "extra jam"; extra jam is checked as preserves/jams.',
  },
  {
    id: 'us.150_160.fruit_ratio',
    ruleSet: 'us',
    title: 'Preserves and jams: fruit to sweetener',
    productClasses: ['jam', 'extra_jam'],
    metric: 'fruit_parts_per_55_sweetener',
    minimumByUsGroup: { '1': 47, '2': 45 },
    unit: 'parts fruit per 55 parts sweetener',
    source: '21 CFR 150.160 (Fruit preserves and jams), paragraphs (b)(1) and (d)(1)',
    quote: 'In the case of a fruit ingredient consisting of a Group I fruit or a permitted combination exclusively of Group I fruits, 47 parts by weight of the fruit ingredient to each 55 parts by weight of the saccharine ingredient; Group II fruits, 45 parts.',
    note: 'Group I fruits need 47 parts, Group II fruits 45 parts per 55 parts of sweetener; a mix of both is weighted by fruit mass.',
    provenance: 'Group I at 47 parts: the text of 150.160(d)(1)(i) as quoted in an IFSQN forum thread (Feb 2025). Group II at 45 parts: Colorado State University, Colorado Farm to Market, "Jams and Jellies" (berry group 47:55, pome group 45:55). (memory) A mix of Group I and Group II fruits is weighted by fruit mass; the regulation clause for mixed groups was not read.',
  },
  {
    id: 'us.150_140.soluble_solids',
    ruleSet: 'us',
    title: 'Fruit jelly: soluble solids',
    productClasses: ['jelly'],
    metric: 'soluble_solids_pct',
    minimum: 65,
    unit: '% soluble solids',
    source: '21 CFR 150.140 (Fruit jelly), paragraph (d)',
    quote: 'The soluble solids content of the finished jelly is not less than 65 percent.',
  },
  {
    id: 'us.150_140.juice_ratio',
    ruleSet: 'us',
    title: 'Fruit jelly: juice to sweetener',
    productClasses: ['jelly'],
    metric: 'fruit_parts_per_55_sweetener',
    minimum: 45,
    unit: 'parts juice per 55 parts sweetener',
    source: '21 CFR 150.140 (Fruit jelly), paragraph (d)',
    quote: 'The fruit juice is not less than 45 parts by weight and the saccharine ingredients no more than 55 parts by weight.',
    note: 'One 45-part ratio for every juice, with no fruit groups. The juice is counted as single strength.',
    provenance: 'FDA Compliance Policy Guide Sec. 550.475 (Jellies, Nonstandardized), Finding 1 of the 1940 jelly standard; Colorado State University, Colorado Farm to Market, "Jams and Jellies" (jellies 45:55).',
  },
  // --- Codex ---
  {
    id: 'codex.296.soluble_solids',
    ruleSet: 'codex',
    title: 'Soluble solids',
    productClasses: ['jam', 'extra_jam', 'jelly', 'marmalade'],
    metric: 'soluble_solids_pct',
    minimum: 60,
    unit: '% soluble solids',
    source: 'Codex Standard for Jams, Jellies and Marmalades (CXS 296-2009), section 3 (composition)',
    quote: 'Soluble solids content of the finished product between 60 and 65 % or greater.',
    note: 'Check this minimum against the composition section of the standard before relying on it.',
    provenance: '(memory) Lower bound of 60 % recalled; the composition clause of CXS 296-2009 was not read (its scope clause 1.1 was).',
  },
];

/** Product classes a rule set leaves out of scope, with the reason shown to the user. */
export const OUT_OF_SCOPE: readonly { ruleSet: MarketRuleSetId; productClass: ProductClass; source: string; reason: string }[] = [
  {
    ruleSet: 'codex',
    productClass: 'reduced_sugar_spread',
    source: 'Codex Standard for Jams, Jellies and Marmalades (CXS 296-2009, amended 2017), section 1.1(c)',
    reason: 'The standard does not apply to reduced sugar products or those with a very low sugar content.',
  },
  {
    ruleSet: 'eu',
    productClass: 'reduced_sugar_spread',
    source: 'Council Directive 2001/113/EC, Annex I, Part II',
    reason: 'Reduced-sugar spreads are not among the reserved descriptions at 60 % soluble dry matter; national rules apply.',
  },
  {
    ruleSet: 'us',
    productClass: 'reduced_sugar_spread',
    source: '21 CFR 150.160 / 150.140',
    reason: 'Below 65 % soluble solids the food cannot bear the standardized names "jam", "preserves" or "jelly"; artificially sweetened versions are covered by 21 CFR 150.141 / 150.161.',
  },
  {
    ruleSet: 'us',
    productClass: 'marmalade',
    source: '21 CFR Part 150; FDA/CFSAN Q&A on fruit jams, jellies, fruit butters and marmalades',
    reason: 'There is no formal standard of identity for marmalade. FDA guidance: sweet orange marmalade at least 30 lb fruit (peel and juice) per 70 lb sweetener; bitter (Seville) orange, lemon and lime marmalade at least 25 lb per 75 lb.',
  },
];

export function isRuleInForce(rule: ComplianceRule, isoDate: string): boolean {
  const day = isoDate.slice(0, 10);
  if (rule.validFrom && day < rule.validFrom) return false;
  if (rule.validUntil && day >= rule.validUntil) return false;
  return true;
}

export function rulesInForce(ruleSet: MarketRuleSetId, isoDate: string): ComplianceRule[] {
  return RULES.filter((rule) => rule.ruleSet === ruleSet && isRuleInForce(rule, isoDate));
}

/**
 * Fruit groups of 21 CFR 150.160(b)(1), as printed in the Code of Federal Regulations (GPO text,
 * revised April 1, 2006, and the CFR as printed in Google Books). Group I and Group II up to "Plum"
 * were read; "Quince" and "Red currant, currant (other than black currant)" at the end of Group II
 * fell outside the passages read (memory).
 * A fruit in neither list (apple, blackcurrant…) is not a standardized preserve fruit.
 */
export const US_FRUIT_GROUPS: Readonly<Record<UsFruitGroup, readonly string[]>> = {
  '1': [
    'Blackberry (other than dewberry)', 'Black raspberry', 'Blueberry', 'Boysenberry', 'Cherry', 'Crabapple',
    'Dewberry (other than boysenberry, loganberry, and youngberry)', 'Elderberry', 'Grape', 'Grapefruit', 'Huckleberry',
    'Loganberry', 'Orange', 'Pineapple', 'Raspberry, red raspberry', 'Rhubarb', 'Strawberry', 'Tangerine', 'Tomato',
    'Yellow tomato', 'Youngberry',
  ],
  '2': [
    'Apricot', 'Cranberry', 'Damson, damson plum', 'Fig', 'Gooseberry', 'Greengage, greengage plum', 'Guava', 'Nectarine',
    'Peach', 'Pear', 'Plum (other than greengage plum and damson plum)', 'Quince', 'Red currant, currant (other than black currant)',
  ],
};
