/**
 * The ingredient list of a finished product, for the EU and the US. PURE: no framework imports.
 *
 * Order: descending weight at the time of use (Regulation (EU) No 1169/2011 Art. 18(1);
 * 21 CFR 101.4(a)(1) "descending order of predominance by weight").
 */
import type { EuAllergen, LabelInput, LabelLine, UsAllergen } from './types';
import { validateLabelInput } from './validate';

export type LabelMarket = 'eu' | 'us';

/** A run of list text; `emphasis` marks an allergen name (EU 1169/2011 Art. 21(1)(b): set apart by typeset). */
export interface ListSegment {
  text: string;
  emphasis: boolean;
}

export interface IngredientListEntry {
  /** The name as printed (additives with their class, allergens spelled out). */
  name: string;
  /** Weight at the time of use, summed over lines with the same name; added water: see `addedWater`. */
  grams: number;
  /** Share of the finished product, %. */
  pctOfFinished: number;
  segments: ListSegment[];
  /** Indexes of the formula lines this entry stands for. */
  lineIndexes: number[];
}

export interface AddedWaterAccount {
  /** Water weighed into the charge. */
  addedG: number;
  /** EU: finished product minus the other ingredients used (1169/2011 Annex VII Part A(1)); may be negative. */
  remainingG: number;
  /** `remainingG` as % of the finished product. */
  pctOfFinished: number;
  /** Whether the list names water. */
  declared: boolean;
  reason: string;
}

export interface FruitIndication {
  /** Fruit names in descending order of raw-material weight. */
  fruits: string[];
  /** The indication to put beside the product name ("strawberry and raspberry", "mixed fruit"). */
  text: string | null;
  /** Other wordings the rule allows (three or more fruits: the full list, or the number of fruits). */
  alternatives: string[];
}

export interface IngredientList {
  market: LabelMarket;
  entries: IngredientListEntry[];
  /** The whole list, heading and separators included, ready to render with emphasis. */
  segments: ListSegment[];
  /** The same list as plain text (allergens in capitals so the emphasis survives without typesetting). */
  text: string;
  /** US only: the FALCPA "Contains:" statement; null when no major allergen is present or for the EU. */
  containsStatement: string | null;
  addedWater: AddedWaterAccount | null;
  fruitIndication: FruitIndication;
  /** Sulphur dioxide in the finished product, mg/kg; null when an ingredient's content is not known. */
  sulphiteMgPerKg: number | null;
  notes: string[];
}

/**
 * Regulation (EU) No 1169/2011, Annex VII, Part A, point 1 (the rule checked in the Lithuanian text
 * of the Regulation, quoted in full on a public newsgroup; the English wording below is recalled
 * and agrees with it): added water is
 * listed by its weight in the finished product; "the quantity of water added as an ingredient
 * in a food shall be calculated by subtracting from the total amount of the finished product the
 * total amount of the other ingredients used. This amount need not be taken into consideration
 * if it does not exceed 5 % by weight of the finished product."
 */
export const ADDED_WATER_THRESHOLD_PCT = 5;

/**
 * Regulation (EU) No 1169/2011 Annex II point 12 and Directive 2001/113/EC Art. 2(6): sulphur
 * dioxide / sulphites above 10 mg/kg (as total SO2) are declared. 21 CFR 101.100(a)(4) uses the
 * same 10 ppm line for sulfites in the US (memory).
 */
export const SULPHITE_DECLARATION_MG_PER_KG = 10;

const EU_ALLERGEN_WORDS: Record<EuAllergen, { name: string; words: string[] }> = {
  cereals_gluten: { name: 'gluten', words: ['wheat', 'rye', 'barley', 'oats', 'oat', 'spelt', 'kamut', 'gluten'] },
  crustaceans: { name: 'crustaceans', words: ['crustacean', 'shrimp', 'prawn', 'crab', 'lobster'] },
  eggs: { name: 'egg', words: ['eggs', 'egg'] },
  fish: { name: 'fish', words: ['fish'] },
  peanuts: { name: 'peanuts', words: ['peanuts', 'peanut'] },
  soybeans: { name: 'soya', words: ['soya', 'soybean', 'soy'] },
  milk: { name: 'milk', words: ['milk', 'butter', 'cream', 'cheese', 'yoghurt', 'whey', 'lactose'] },
  nuts: { name: 'nuts', words: ['almonds', 'almond', 'hazelnuts', 'hazelnut', 'walnuts', 'walnut', 'cashews', 'cashew', 'pecans', 'pecan', 'pistachios', 'pistachio', 'macadamia', 'brazil nuts', 'nuts'] },
  celery: { name: 'celery', words: ['celery', 'celeriac'] },
  mustard: { name: 'mustard', words: ['mustard'] },
  sesame: { name: 'sesame', words: ['sesame'] },
  sulphites: { name: 'sulphites', words: ['sulphites', 'sulphite', 'sulphur dioxide', 'metabisulphite'] },
  lupin: { name: 'lupin', words: ['lupin'] },
  molluscs: { name: 'molluscs', words: ['mollusc', 'mussel', 'oyster', 'squid', 'clam'] },
};

/** FALCPA as amended by the FASTER Act: the food-source names of the "Contains" statement. */
const US_ALLERGEN_NAMES: Record<UsAllergen, string> = {
  milk: 'milk', eggs: 'egg', fish: 'fish', crustacean_shellfish: 'crustacean shellfish', tree_nuts: 'tree nuts',
  peanuts: 'peanuts', wheat: 'wheat', soybeans: 'soy', sesame: 'sesame',
};

/**
 * Common names of the additives a preserve uses, for the US list (21 CFR 101.4(a)(1): common or
 * usual name) and for an EU entry whose library name is only the class. Names as in the EU
 * additive list (Regulation (EU) No 231/2012 specifications, memory).
 */
export const ADDITIVE_COMMON_NAMES: Readonly<Record<string, string>> = {
  E200: 'sorbic acid', E202: 'potassium sorbate', E203: 'calcium sorbate',
  E210: 'benzoic acid', E211: 'sodium benzoate', E212: 'potassium benzoate', E213: 'calcium benzoate',
  E296: 'malic acid', E330: 'citric acid', E331: 'sodium citrates', E333: 'calcium citrates', E334: 'tartaric acid',
  E440: 'pectin', E509: 'calcium chloride',
};

/** 21 CFR 101.22(j): a chemical preservative is named with a description of its function (memory). */
const US_PRESERVATIVE_FUNCTION = 'preservative';

function normaliseENumber(eNumber: string): string {
  return eNumber.replace(/\s+/g, '').toUpperCase();
}

function lineName(line: LabelLine): string {
  return line.ingredient.labelName.trim();
}

function isPreservative(className: string): boolean {
  return /preservative/i.test(className);
}

/**
 * The name of an additive in the list.
 * EU, Annex VII Part C of 1169/2011: additives of a listed category "must be designated by the
 * name of that category, followed by their specific name or, if appropriate, E number". We print
 * the category followed by the specific name in brackets — "gelling agent (pectin)" — and fall
 * back to the E number — "gelling agent (E440)" — when the library holds no specific name.
 * US: the common name; a chemical preservative adds its function (21 CFR 101.22(j)).
 */
export function additiveListName(line: LabelLine, market: LabelMarket): string {
  const additive = line.ingredient.additive;
  const name = lineName(line);
  if (!additive) return name;
  const eNumber = normaliseENumber(additive.eNumber);
  const className = additive.className.trim();
  const ownName = name.toLowerCase() !== className.toLowerCase() && name !== '' ? name : null;
  const specific = ownName ?? (Object.hasOwn(ADDITIVE_COMMON_NAMES, eNumber) ? ADDITIVE_COMMON_NAMES[eNumber] : null);
  if (market === 'us') {
    const common = specific ?? eNumber;
    return isPreservative(className) ? `${common} (${US_PRESERVATIVE_FUNCTION})` : common;
  }
  return `${className} (${specific ?? eNumber})`;
}

/** Splits `name` into segments, emphasising each allergen word it holds; adds the allergen name when the name holds none. */
function euSegments(name: string, allergens: readonly EuAllergen[]): ListSegment[] {
  if (allergens.length === 0) return [{ text: name, emphasis: false }];
  const lower = name.toLowerCase();
  const marks: { start: number; end: number }[] = [];
  const missing: string[] = [];
  for (const allergen of allergens) {
    const entry = EU_ALLERGEN_WORDS[allergen];
    // Whole words only, so "oat" is not found in "coated" nor "egg" in "nutmeg".
    const found = entry.words
      .map((w) => ({ w, at: lower.search(new RegExp(`(?<![a-z])${w}(?![a-z])`)) }))
      .find((f) => f.at >= 0);
    if (found) {
      marks.push({ start: found.at, end: found.at + found.w.length });
    } else {
      missing.push(entry.name);
    }
  }
  marks.sort((a, b) => a.start - b.start);
  const segments: ListSegment[] = [];
  let at = 0;
  for (const mark of marks) {
    if (mark.start < at) continue;
    if (mark.start > at) segments.push({ text: name.slice(at, mark.start), emphasis: false });
    segments.push({ text: name.slice(mark.start, mark.end), emphasis: true });
    at = mark.end;
  }
  if (at < name.length) segments.push({ text: name.slice(at), emphasis: false });
  if (missing.length > 0) {
    segments.push({ text: ' (', emphasis: false });
    missing.forEach((allergenName, i) => {
      if (i > 0) segments.push({ text: ', ', emphasis: false });
      segments.push({ text: allergenName, emphasis: true });
    });
    segments.push({ text: ')', emphasis: false });
  }
  return segments;
}

function isAddedWater(line: LabelLine): boolean {
  return line.ingredient.isAddedWater === true;
}

/**
 * Added water in the EU list (Annex VII Part A(1)): finished product − other ingredients used.
 * When the boil takes off more water than was added, the result is ≤ 0 and water drops out.
 */
export function addedWaterAccount(input: LabelInput, market: LabelMarket): AddedWaterAccount | null {
  const waterLines = input.lines.filter(isAddedWater);
  if (waterLines.length === 0) return null;
  const addedG = waterLines.reduce((t, l) => t + l.grams, 0);
  const otherG = input.lines.filter((l) => !isAddedWater(l)).reduce((t, l) => t + l.grams, 0);
  const finishedG = input.massBalance.finishedMassG;
  const remainingG = finishedG - otherG;
  const pctOfFinished = (remainingG / finishedG) * 100;
  if (market === 'us') {
    // 21 CFR 101.4(a)(1) (memory): added water is listed by its weight as added; it need not be
    // declared when all of it is removed again in processing.
    const declared = addedG > 0 && remainingG > 0;
    return {
      addedG, remainingG, pctOfFinished, declared,
      reason: declared
        ? 'Water added in making the food is listed by the weight added.'
        : 'The boil removes at least as much water as was added, so water need not be declared.',
    };
  }
  const declared = pctOfFinished > ADDED_WATER_THRESHOLD_PCT;
  return {
    addedG, remainingG, pctOfFinished, declared,
    reason: declared
      ? `Added water left in the product is ${round1(pctOfFinished)} % of it, above ${ADDED_WATER_THRESHOLD_PCT} %, so it is listed by that weight.`
      : `Added water left in the product is ${round1(Math.max(0, pctOfFinished))} % of it, not above ${ADDED_WATER_THRESHOLD_PCT} %, so it is not listed.`,
  };
}

function round1(value: number): number {
  return Math.round(value * 10) / 10;
}

/** The fruit's own name for the indication: `fruitName` when set, else the list name. */
function fruitLabel(line: LabelLine): string {
  return (line.fruitName ?? line.ingredient.labelName).trim();
}

function joinAnd(names: string[]): string {
  if (names.length <= 1) return names.join('');
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/**
 * Directive 2001/113/EC Art. 2(2) (consolidated text read in German; the rule is kept by
 * Directive (EU) 2024/1438 as far as the summaries read say, memory): the product name is
 * supplemented by the fruit(s) used, in descending order of the weight of the raw materials used;
 * for three or more fruits the list may be replaced by "mixed fruit", a similar indication or the
 * number of fruits used.
 */
export function fruitIndication(lines: readonly LabelLine[]): FruitIndication {
  const byName = new Map<string, { name: string; grams: number }>();
  for (const line of lines) {
    if (line.ingredient.kind !== 'fruit' || line.grams <= 0) continue;
    const name = fruitLabel(line);
    const key = name.toLowerCase();
    const entry = byName.get(key) ?? { name, grams: 0 };
    entry.grams += line.grams;
    byName.set(key, entry);
  }
  const fruits = [...byName.values()].sort((a, b) => b.grams - a.grams).map((f) => f.name);
  if (fruits.length === 0) return { fruits, text: null, alternatives: [] };
  if (fruits.length < 3) return { fruits, text: joinAnd(fruits), alternatives: [] };
  return { fruits, text: 'mixed fruit', alternatives: [joinAnd(fruits), `${fruits.length} fruits`] };
}

/** Sulphur dioxide in the finished product from each ingredient's content; null when any is unknown. */
export function finishedSulphiteMgPerKg(input: LabelInput): number | null {
  let mg = 0;
  for (const line of input.lines) {
    if (line.grams <= 0) continue;
    const content = line.ingredient.sulphiteMgPerKg;
    if (content === null || content === undefined) return null;
    mg += (line.grams / 1000) * content;
  }
  return mg / (input.massBalance.finishedMassG / 1000);
}

interface Group {
  key: string;
  name: string;
  grams: number;
  lineIndexes: number[];
  euAllergens: Set<EuAllergen>;
  usAllergens: Set<UsAllergen>;
}

/**
 * The ingredient list for `market`. Lines with the same printed name are one ingredient. Added
 * water is placed by its weight as the market counts it (EU: left in the finished product; US:
 * as added) and left out when the rule says so.
 */
export function ingredientList(input: LabelInput, market: LabelMarket): IngredientList {
  validateLabelInput(input);
  const finishedG = input.massBalance.finishedMassG;
  const notes: string[] = [];
  const water = addedWaterAccount(input, market);
  const sulphite = finishedSulphiteMgPerKg(input);
  const groups = new Map<string, Group>();

  input.lines.forEach((line, index) => {
    if (line.grams <= 0) return;
    let grams = line.grams;
    if (isAddedWater(line)) {
      if (!water?.declared) return;
      // EU: the water left in the product, shared over the water lines by their added weight.
      grams = market === 'eu' ? water.remainingG * (line.grams / water.addedG) : line.grams;
    }
    const name = isAddedWater(line) ? 'water' : additiveListName(line, market);
    const key = name.toLowerCase();
    const group = groups.get(key) ?? {
      key, name, grams: 0, lineIndexes: [], euAllergens: new Set<EuAllergen>(), usAllergens: new Set<UsAllergen>(),
    };
    group.grams += grams;
    group.lineIndexes.push(index);
    for (const allergen of line.ingredient.euAllergens ?? []) {
      // Sulphites are declared by the finished product's content, not by the flag (Annex II point 12).
      if (allergen !== 'sulphites') group.euAllergens.add(allergen);
    }
    for (const allergen of line.ingredient.usAllergens ?? []) group.usAllergens.add(allergen);
    groups.set(key, group);
  });

  const ordered = [...groups.values()].sort((a, b) => b.grams - a.grams || a.name.localeCompare(b.name));
  const entries: IngredientListEntry[] = ordered.map((group) => ({
    name: group.name,
    grams: group.grams,
    pctOfFinished: (group.grams / finishedG) * 100,
    segments: market === 'eu' ? euSegments(group.name, [...group.euAllergens]) : [{ text: group.name, emphasis: false }],
    lineIndexes: group.lineIndexes,
  }));

  const sulphitesDeclared = sulphite !== null && sulphite > SULPHITE_DECLARATION_MG_PER_KG;
  if (sulphitesDeclared) {
    const word = market === 'eu' ? 'sulphites' : 'sulfites';
    entries.push({
      name: word,
      grams: 0,
      pctOfFinished: 0,
      segments: [{ text: word, emphasis: market === 'eu' }],
      lineIndexes: [],
    });
    notes.push(`Sulphur dioxide in the product is ${round1(sulphite)} mg/kg, above ${SULPHITE_DECLARATION_MG_PER_KG} mg/kg, so sulphites are declared.`);
  } else if (sulphite === null) {
    notes.push('The sulphite content of at least one ingredient is not known, so whether sulphites must be declared cannot be told.');
  }
  if (water) notes.push(water.reason);

  let containsStatement: string | null = null;
  if (market === 'us') {
    const present = new Set<UsAllergen>();
    for (const group of ordered) for (const allergen of group.usAllergens) present.add(allergen);
    if (present.size > 0) {
      const names = [...present].map((a) => US_ALLERGEN_NAMES[a]);
      containsStatement = `Contains: ${names.join(', ')}.`;
      if (present.has('tree_nuts') || present.has('fish') || present.has('crustacean_shellfish')) {
        notes.push('Name the kind of tree nut, fish or shellfish in the "Contains" statement.');
      }
    }
  }

  const segments: ListSegment[] = [{ text: 'Ingredients: ', emphasis: false }];
  entries.forEach((entry, i) => {
    if (i > 0) segments.push({ text: ', ', emphasis: false });
    segments.push(...entry.segments);
  });
  segments.push({ text: '.', emphasis: false });

  return {
    market,
    entries,
    segments,
    text: plainText(segments),
    containsStatement,
    addedWater: water,
    fruitIndication: fruitIndication(input.lines),
    sulphiteMgPerKg: sulphite,
    notes,
  };
}

/** Plain text of segments; emphasised runs in capitals, one of the typesets Art. 21(1)(b) names. */
export function plainText(segments: readonly ListSegment[]): string {
  return segments.map((s) => (s.emphasis ? s.text.toUpperCase() : s.text)).join('');
}
