/**
 * The label as one serialisable object: what the label view shows, the API returns, the CSV and
 * JSON exports carry and a production version freezes at approval. Pure; `buildLabel()` in
 * `./index.ts` fills it from the nutrition, text, claim and additive modules.
 *
 * Figures are kept as both the unrounded number (null when not known) and the text the label
 * would carry, so a frozen label reads the same whatever later rounding code does.
 */
/** Bump when the shape changes; a frozen label of an older format is recomputed for comparison. */
export const LABEL_FORMAT = 1 as const;

/** One run of the ingredient list; allergens are emphasised (EU 1169/2011 Art. 21(1)(b)). */
export interface LabelTextRun {
  text: string;
  emphasis: boolean;
}

export interface LabelIngredientList {
  runs: LabelTextRun[];
  /** The US "Contains:" statement of major food allergens; null when none (or for the EU). */
  contains: string | null;
  /** Plain sentences: added water left out, "contains" statement, mixed fruit … */
  notes: string[];
}

export interface LabelStatement {
  kind: 'fruit' | 'total_sugar';
  /** The sentence for the pack; null when it cannot be stated (a figure is unknown). */
  text: string | null;
  /** g per 100 g of finished product, unrounded; null when unknown. */
  gramsPer100g: number | null;
  notes: string[];
}

export interface LabelNutrientRow {
  key: string;
  name: string;
  /** Unit of the unrounded figure. */
  unit: string;
  /** Nested under the row above ("of which sugars"); 2 under that ("Includes added sugars"). */
  depth: 0 | 1 | 2;
  unrounded: number | null;
  /** The value as the label prints it, unit included ("0.6 g", "<0.5 g"); null when unknown. */
  label: string | null;
  /** Some ingredient's value is unknown, so the figure is a lower bound at best. */
  incomplete: boolean;
}

export interface LabelFactsRow extends LabelNutrientRow {
  /** % Daily Value as printed ("3%"); null where the row has none or it is unknown. */
  dailyValue: string | null;
}

export interface LabelClaim {
  claim: string;
  /** true: the claim may be made; false: it may not; null: a figure it needs is unknown. */
  holds: boolean | null;
  /** The figures behind the verdict, in words. */
  figures: string;
  rule: string;
}

export interface LabelAdditiveCheck {
  name: string;
  /** `not_applicable`: no limit of this market applies to the product. */
  status: 'within' | 'over' | 'unknown' | 'not_applicable';
  /** Amount in the finished product, in words with its unit; null when unknown. */
  amount: string | null;
  limit: string;
  rule: string;
  note: string | null;
}

export interface LabelIncomplete {
  part: string;
  reason: string;
}

export interface Label {
  format: typeof LABEL_FORMAT;
  productClass: string;
  ruleSet: string;
  ingredients: { eu: LabelIngredientList; us: LabelIngredientList };
  statements: LabelStatement[];
  eu: { per: string; energyBasis: string; rows: LabelNutrientRow[] };
  /** `servingsPerJar` as printed: "17 servings per container". */
  us: { serving: string; servingG: number; servingsPerJar: string | null; energyBasis: string; rows: LabelFactsRow[]; notes: string[] };
  claims: { reference: string | null; items: LabelClaim[] };
  additives: LabelAdditiveCheck[];
  incomplete: LabelIncomplete[];
}

/** One line of the label in words: the unit of the CSV export and of the label comparison. */
export interface LabelRow {
  /** Stable within a label: the section and the row's key (two energy rows share a name). */
  id: string;
  section: string;
  item: string;
  value: string;
  /** On the pack (lists, statements, declarations) rather than a check behind it (claims allowed, additive limits). */
  printed: boolean;
}

const UNKNOWN = 'unknown';

function runsText(list: LabelIngredientList): string {
  return list.runs.map((r) => r.text).join('');
}


const ADDITIVE_ROW_TEXT: Record<LabelAdditiveCheck['status'], (a: LabelAdditiveCheck) => string> = {
  within: (a) => `${a.amount ?? UNKNOWN} (within: ${a.limit})`,
  over: (a) => `${a.amount ?? UNKNOWN} (over: ${a.limit})`,
  unknown: () => UNKNOWN,
  not_applicable: () => 'does not apply',
};

/** The label flattened to rows, in the order the view shows it. */
export function labelRows(label: Label): LabelRow[] {
  const rows: LabelRow[] = [
    { id: 'ingredients.eu', section: 'Ingredients (EU)', item: 'List', value: runsText(label.ingredients.eu), printed: true },
    { id: 'ingredients.us', section: 'Ingredients (US)', item: 'List', value: runsText(label.ingredients.us), printed: true },
  ];
  if (label.ingredients.us.contains) rows.push({ id: 'ingredients.us.contains', section: 'Ingredients (US)', item: 'Contains', value: label.ingredients.us.contains, printed: true });
  for (const s of label.statements) {
    rows.push({ id: `statement.${s.kind}`, section: 'Statements', item: s.kind === 'fruit' ? 'Fruit' : 'Total sugar', value: s.text ?? UNKNOWN, printed: true });
  }
  for (const r of label.eu.rows) rows.push({ id: `eu.${r.key}`, section: `EU declaration, ${label.eu.per}`, item: r.name, value: r.label ?? UNKNOWN, printed: true });
  for (const r of label.us.rows) {
    rows.push({ id: `us.${r.key}`, section: `US facts, ${label.us.serving}`, item: r.name, value: `${r.label ?? UNKNOWN}${r.dailyValue ? `, ${r.dailyValue} DV` : ''}`, printed: true });
  }
  for (const c of label.claims.items) {
    rows.push({ id: `claim.${c.claim}`, section: 'Claims', item: c.claim, value: c.holds === null ? UNKNOWN : c.holds ? 'may be made' : 'may not be made', printed: false });
  }
  for (const a of label.additives) {
    rows.push({ id: `additive.${a.name}`, section: 'Additive limits', item: a.name, value: ADDITIVE_ROW_TEXT[a.status](a), printed: false });
  }
  return rows;
}

export interface LabelChange {
  section: string;
  item: string;
  before: string | null;
  after: string | null;
  /** A printed part of the pack changes (only these call for a new label); else a check behind it. */
  printed: boolean;
}

/**
 * What differs between two labels, row by row: what the pack says, not the unrounded figures
 * (a change that rounds to the same label text needs no new label).
 */
export function labelChanges(before: Label, after: Label): LabelChange[] {
  const old = new Map(labelRows(before).map((r) => [r.id, r]));
  const changes: LabelChange[] = [];
  const seen = new Set<string>();
  for (const r of labelRows(after)) {
    seen.add(r.id);
    const was = old.get(r.id);
    if (!was) changes.push({ section: r.section, item: r.item, before: null, after: r.value, printed: r.printed });
    else if (was.value !== r.value) changes.push({ section: r.section, item: r.item, before: was.value, after: r.value, printed: r.printed });
  }
  for (const [k, r] of old) if (!seen.has(k)) changes.push({ section: r.section, item: r.item, before: r.value, after: null, printed: r.printed });
  return changes;
}
