/** Trials, variants and cooks: zod schemas shared by forms, actions and the API, and the plain views. */
import { z } from 'zod';
import { todayIso, addDaysIso } from '@/lib/format/dates';
import { isoDate, longText, name, noTinyAmount, searchText, text, versionNumber, wholeNumber } from '@/lib/input';
import { formulaLineSchema, formulaSettingsSchema, PRODUCT_CLASSES, type FormulaSettingsInput, type RevisionLine, type RevisionSummary } from '@/lib/formulas/schema';
import { FACTOR_LABELS, FACTOR_LEVEL_BOUNDS, SET_TEST_METHODS, SYNERESIS_LEVELS, TRIAL_FACTORS, TRIAL_STATUSES, type TrialStatus } from './vocabulary';
import { CENTRE_RUNS, DESIGN_KINDS, type FactorLevel } from './plan';
import { factorPointSchema } from '@/lib/modelling/schema';
import type { BatchComputation } from '@/lib/chemistry';
import type { CookComparison } from './compare';

const opt = (schema: z.ZodNumber) => schema.nullable().optional();
const num = (what: string) => z.number({ error: `${what} must be a number.` });

export const createTrialSchema = z
  .object({
    title: name('Give the trial a title.', 160),
    question: longText(4000, { min: 1, required: 'Say what the trial should find out.' }),
    formulaId: z.uuid('Choose a base formula.'),
    /** Defaults to the formula's latest revision. */
    baseRevision: versionNumber.optional(),
  })
  .strict();

export const transitionSchema = z.object({ to: z.enum(TRIAL_STATUSES, { error: 'Unknown status.' }), note: longText(500).optional() }).strict();

export const planSchema = z
  .object({
    kind: z.enum(DESIGN_KINDS, { error: 'Choose a design.' }),
    factors: z
      .array(
        z.object({
          factor: z.enum(TRIAL_FACTORS, { error: 'Unknown factor.' }),
          low: num('The low level').finite('The low level must be a number.').min(0, 'Levels cannot be negative.'),
          high: num('The high level').finite('The high level must be a number.').min(0, 'Levels cannot be negative.'),
        }).strict().superRefine((f, ctx) => {
          const { min, max } = FACTOR_LEVEL_BOUNDS[f.factor];
          const { name, unit } = FACTOR_LABELS[f.factor];
          for (const level of ['low', 'high'] as const) {
            if (f[level] < min || f[level] > max) ctx.addIssue({ code: 'custom', path: [level], message: `${name}: the ${level} level must be between ${min} and ${max} ${unit}.` });
          }
        }),
      )
      .min(1, 'Choose at least one factor.')
      .max(TRIAL_FACTORS.length, `At most ${TRIAL_FACTORS.length} factors.`),
    centrePoint: z.boolean().default(false),
    /** Replicated centre runs of a central composite or Box–Behnken design. */
    centreRuns: wholeNumber('The number of centre runs', CENTRE_RUNS.min, CENTRE_RUNS.max).optional(),
  })
  .strict();

/** The optimiser's proposal and the points around it, as a new trial on the formula they came from. */
export const proposalTrialSchema = z
  .object({
    formulaId: z.uuid('Choose a base formula.'),
    title: name('Give the trial a title.', 160),
    question: longText(4000, { min: 1, required: 'Say what the trial should find out.' }),
    points: z.array(factorPointSchema, { error: 'Choose the proposal.' }).min(1, 'Choose the proposal.').max(9, 'At most nine variants besides the base.'),
  })
  .strict();
export type ProposalTrialInput = z.infer<typeof proposalTrialSchema>;

export const manualVariantSchema = z
  .object({
    description: text({ min: 1, max: 200, required: 'Say what this variant changes.' }),
    settings: formulaSettingsSchema.optional(),
    lines: z.array(formulaLineSchema).min(1, 'Add at least one line.').max(60),
  })
  .strict();

/** The readings of a cook, as one shape for recording and correcting. */
const cookReadings = {
  cookDate: isoDate,
  batchSizeG: opt(num('Batch size').min(1, 'Batch size must be at least 1 g.').max(5_000_000)),
  brixReading: opt(noTinyAmount(num('The refractometer reading').min(0, 'A Brix reading cannot be negative.').max(95, 'A Brix reading above 95 is not plausible.'), 'A Brix reading')),
  brixSampleTempC: opt(num('The sample temperature').min(0, 'Sample temperature must be at least 0 °C.').max(60, 'Sample temperature must be at most 60 °C.')),
  // pH meters read 0–14, but no fruit preserve is below pH 1 (lemon juice is about 2.0–2.6;
  // values from memory, no published source cited): lower is a slip, or −0 or 1e-320 sent as a probe.
  ph: opt(num('pH').min(1, 'A preserve’s pH below 1 is not plausible: check the reading.').max(14, 'pH runs from 0 to 14.')),
  endPointTempC: opt(num('The end-point temperature').min(60, 'An end point below 60 °C is not plausible.').max(130, 'An end point above 130 °C is not plausible.')),
  boilTimeMin: opt(noTinyAmount(num('Boil time').min(0, 'Boil time cannot be negative.').max(600, 'Boil time must be at most 600 minutes.'), 'Boil time', ' minutes')),
  setTestScore: wholeNumber('The set-test score', 1, 5).nullable().optional(),
  setTestMethod: z.enum(SET_TEST_METHODS, { error: 'Use cold_plate, spoon or flake.' }).nullable().optional(),
  syneresis: z.enum(SYNERESIS_LEVELS, { error: 'Use none, slight or marked.' }).nullable().optional(),
  colourNotes: longText(500).nullable().optional(),
  yieldJars: wholeNumber('Jars', 0, 100_000).nullable().optional(),
  yieldG: opt(noTinyAmount(num('Yield').min(0, 'Yield cannot be negative.').max(5_000_000), 'Yield', ' g')),
  notes: longText(2000).nullable().optional(),
};

/** What was measured or observed at the stove. A batch size, a date or a note alone is not a cook. */
export const COOK_READING_FIELDS = ['brixReading', 'ph', 'endPointTempC', 'boilTimeMin', 'setTestScore', 'syneresis', 'yieldJars', 'yieldG', 'colourNotes'] as const;
export const NO_READING_MESSAGE = 'Record at least one reading: refractometer, pH, end point, boil time, set test, syneresis, yield or colour.';

type ReadingsLike = { [K in (typeof COOK_READING_FIELDS)[number]]?: unknown } & {
  brixReading?: number | null; brixSampleTempC?: number | null; cookDate?: string; batchSizeG?: number | null; yieldG?: number | null;
};

/** The cross-field rules of a cook, for a new one and for the result of a correction alike. `today` is the server's (or the browser's) date. */
export function cookReadingProblems(m: ReadingsLike, today: string = todayIso()): Array<{ path: string; message: string }> {
  const problems: Array<{ path: string; message: string }> = [];
  if (!COOK_READING_FIELDS.some((f) => m[f] != null && m[f] !== '')) problems.push({ path: 'readings', message: NO_READING_MESSAGE });
  if ((m.brixReading == null) !== (m.brixSampleTempC == null)) {
    problems.push({ path: 'brixSampleTempC', message: 'Give the sample temperature with the refractometer reading (it is corrected to 20 °C).' });
  }
  // A day of slack: the kitchen's calendar may be a time zone ahead of the server's.
  if (typeof m.cookDate === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(m.cookDate) && m.cookDate > addDaysIso(today, 1)) {
    problems.push({ path: 'cookDate', message: 'A cook cannot be dated in the future.' });
  }
  // Boiling only drives water off: a batch never weighs more after the cook than its charge did.
  if (m.batchSizeG != null && m.yieldG != null && m.yieldG > m.batchSizeG) {
    problems.push({ path: 'yieldG', message: 'The yield cannot be more than the batch size: boiling only takes water away. Check both.' });
  }
  return problems;
}

const checkCook = (m: ReadingsLike, ctx: z.RefinementCtx) => {
  for (const p of cookReadingProblems(m)) ctx.addIssue({ code: 'custom', path: [p.path], message: p.message });
};

export const cookSchema = z
  .object({ variantId: z.uuid('Choose the variant that was cooked.'), ...cookReadings })
  .strict()
  .superRefine(checkCook);

const changeReason = longText(500, { min: 1, required: 'Say why (it is kept with the cook’s history).' });

/**
 * PATCH a cook: the fields sent replace the stored ones (null clears one), the rest stay. The result
 * must still be a cook (checked in the mutation); the previous values are kept in measurement_changes.
 */
export const correctCookSchema = z
  .object(cookReadings)
  .partial()
  .extend({ reason: changeReason })
  .strict()
  .refine((c) => Object.keys(c).some((k) => k !== 'reason'), { path: ['readings'], message: 'Change at least one value.' });

export const withdrawCookSchema = z.object({ reason: changeReason }).strict();

/** POST /api/v1/trials/{trialId}/cooks/import: the CSV as text (the API's 1 MB body limit is the tighter bound). */
export const importCooksSchema = z.object({ csv: z.string().min(1, 'Send the CSV text.').max(2_000_000, 'At most 2 MB.') }).strict();

export const trialListQuerySchema = z.object({
  status: z.enum(TRIAL_STATUSES).optional(),
  owner: z.uuid('Unknown person.').optional(),
  product: z.enum(PRODUCT_CLASSES).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  q: searchText.optional(),
});

export type CreateTrialInput = z.infer<typeof createTrialSchema>;
export type PlanInput = z.infer<typeof planSchema>;
export type ManualVariantInput = z.infer<typeof manualVariantSchema>;
export type CookInput = z.infer<typeof cookSchema>;
export type CorrectCookInput = z.infer<typeof correctCookSchema>;
export type TrialListQuery = z.infer<typeof trialListQuerySchema>;

export interface TrialSummary {
  id: string;
  code: string;
  title: string;
  status: TrialStatus;
  ownerId: string;
  ownerName: string;
  baseFormulaName: string;
  /** The base variant's class, else the variants' common class, else the base formula revision's; null if none says. */
  productClass: (typeof PRODUCT_CLASSES)[number] | null;
  variantCount: number;
  createdAt: string;
  updatedAt: string;
}

export type CookReadings = Omit<CookInput, 'variantId'>;

/** Every stored value of a cook besides its date, in one list: storing, viewing and correcting copy exactly these. */
export const COOK_VALUE_FIELDS = Object.keys(cookReadings).filter((k) => k !== 'cookDate') as Array<Exclude<keyof CookReadings, 'cookDate'>>;
export type CookValues = { [K in (typeof COOK_VALUE_FIELDS)[number]]-?: NonNullable<CookReadings[K]> | null };

/** The cook's values from anything that holds them, absent ones as null. */
export function cookValues(m: Partial<Record<(typeof COOK_VALUE_FIELDS)[number], unknown>>): CookValues {
  const out: Record<string, unknown> = {};
  for (const f of COOK_VALUE_FIELDS) out[f] = m[f] ?? null;
  return out as CookValues;
}

/** One correction or withdrawal of a cook; `before` holds the values it replaced. */
export interface CookChangeView {
  kind: 'corrected' | 'withdrawn';
  reason: string;
  byName: string;
  at: string;
  /** Only the values that changed, as they were before. */
  before: Partial<CookReadings>;
}

export interface CookView extends CookReadings {
  id: string;
  variantId: string;
  recordedByName: string;
  createdAt: string;
  comparison: CookComparison;
  /** Set for a withdrawn cook: it stays on record but leaves every comparison and the promotion evidence. */
  withdrawn: { reason: string; byName: string; at: string } | null;
  changes: CookChangeView[];
}

export interface VariantView {
  id: string;
  label: string;
  isBase: boolean;
  description: string;
  factorLevels: FactorLevel[];
  settings: FormulaSettingsInput;
  lines: RevisionLine[];
  summary: RevisionSummary;
  computation: BatchComputation | null;
  computationError: string | null;
  /** Cooks that count: withdrawn ones are in `withdrawnCooks`. */
  cooks: CookView[];
  withdrawnCooks: CookView[];
}

export interface StatusChangeView {
  from: TrialStatus | null;
  to: TrialStatus;
  note: string | null;
  byName: string;
  at: string;
}

export interface TrialOverview {
  id: string;
  code: string;
  title: string;
  question: string;
  status: TrialStatus;
  owner: { id: string; name: string };
  baseFormula: { id: string; name: string; revision: number };
  createdAt: string;
  variants: VariantView[];
  history: StatusChangeView[];
}

/** A trial at the stove on the developer's home page. */
export interface StoveItem {
  id: string;
  code: string;
  title: string;
  /** Variants still in the trial with no cook that counts (withdrawn cooks do not). */
  uncooked: string[];
}
