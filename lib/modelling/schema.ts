/**
 * The vocabulary of response-surface modelling on the workspace's own trials: factors, responses,
 * product families, the data set and the fitted models as they cross to components and the API,
 * and the request shapes (zod) the optimiser, the fit and the prediction endpoints accept.
 * PURE (zod only): the formula editor imports it in the browser.
 *
 * A **product family** is a product class plus its main fruit (the fruit line with the largest mass,
 * by its library ingredient): "reduced-sugar spread of apricot". Variants of one family respond to
 * sugar, solids, pectin and acid alike, so their trials pool into one data set; a jam and a
 * reduced-sugar spread of the same fruit do not (different pectin chemistry, different solids).
 */
import { firstUpper } from '@/lib/format/words';
import { z } from 'zod';
import type { PredictionSurface, ResponseSurface } from '@/lib/models';
import { PRODUCT_CLASSES } from '@/lib/formulas/schema';
import { boundedNumber, id, wholeNumber } from '@/lib/input';

/* ---------- factors ---------- */

/** Words for a factor key wherever one appears in a term name or a message ("pectinPct×acidPct"). */
export function inFactorWords(text: string): string {
  return text.replace(/\b(sugarRatio|targetSolidsPct|pectinPct|acidPct|fruitPer1000g)\b/g, (key) => FACTOR_INFO[key as ModelFactor].name.toLowerCase());
}

/** A model term for people: "1" is the intercept, factor keys become names. */
export function termInWords(term: string): string {
  if (term === '1') return 'Intercept';
  const words = inFactorWords(term);
  return firstUpper(words);
}

/** Factors computed from a variant's formula (features.ts). */
export const MODEL_FACTORS = ['sugarRatio', 'targetSolidsPct', 'pectinPct', 'acidPct', 'fruitPer1000g'] as const;
export type ModelFactor = (typeof MODEL_FACTORS)[number];

export const FACTOR_INFO: Record<ModelFactor, { name: string; unit: string; decimals: number; help: string }> = {
  sugarRatio: { name: 'Sugar ratio', unit: 'g sweetener per g fruit', decimals: 3, help: 'All sweetener lines as weighed, over the fruit mass.' },
  targetSolidsPct: { name: 'Target soluble solids', unit: '°Brix', decimals: 1, help: 'The soluble solids the cook is taken to.' },
  pectinPct: { name: 'Pectin', unit: '% of finished product', decimals: 3, help: 'All pectin lines over the finished mass.' },
  acidPct: { name: 'Added acid', unit: '% of finished product, as citric acid', decimals: 3, help: 'Acid lines counted as citric acid (lemon juice by its acidity) over the finished mass.' },
  fruitPer1000g: { name: 'Fruit', unit: 'g per 1000 g of finished product', decimals: 0, help: 'Fruit as weighed per 1000 g of finished product.' },
};

/**
 * The factors a family model uses by default. Fruit per 1000 g is left out: with the fruit's own
 * solids fixed it follows from the sugar ratio and the target solids, so it would alias them; it
 * stays in the data set and serves the legal fruit minimum as a computed constraint.
 */
export const DEFAULT_MODEL_FACTORS: readonly ModelFactor[] = ['sugarRatio', 'targetSolidsPct', 'pectinPct', 'acidPct'];

export const modelFactorSchema = z.enum(MODEL_FACTORS, { error: 'Unknown factor.' });

export type FactorValues = Record<ModelFactor, number>;

/** Pectin as the family's data knows it: high-methoxyl, low-methoxyl (with calcium), a mix, or none. */
export type PectinFamily = 'hm' | 'lm' | 'mixed' | 'none' | 'unstated';
export const PECTIN_FAMILY_LABELS: Record<PectinFamily, string> = {
  hm: 'High-methoxyl', lm: 'Low-methoxyl', mixed: 'High- and low-methoxyl', none: 'No added pectin', unstated: 'Type not stated',
};

/* ---------- responses ---------- */

/**
 * Lab measures come from the variant's cooks (mean of the cooks not withdrawn). Measured soluble
 * solids and pH are responses, not factors: they are what the cook gave, known only afterwards, so
 * the editor could not supply them for a formula being typed.
 */
export const LAB_RESPONSES = ['measuredSolids', 'measuredPh', 'setTest', 'syneresis'] as const;
export type LabResponse = (typeof LAB_RESPONSES)[number];

/** `range`: the values a measure can take, where a prediction interval is cut on screen. */
export const LAB_RESPONSE_INFO: Record<LabResponse, { name: string; unit: string; decimals: number; range: { min: number; max: number } }> = {
  measuredSolids: { name: 'Measured soluble solids', unit: '°Brix at 20 °C', decimals: 1, range: { min: 0, max: 100 } },
  measuredPh: { name: 'Measured pH', unit: 'pH', decimals: 2, range: { min: 0, max: 14 } },
  setTest: { name: 'Set test score', unit: 'score 1–5', decimals: 1, range: { min: 1, max: 5 } },
  syneresis: { name: 'Weeping (syneresis)', unit: '0 none, 1 slight, 2 marked', decimals: 2, range: { min: 0, max: 2 } },
};

/** `lab:<measure>` or `attribute:<attribute id>` (a sensory attribute's variant mean). */
export type ResponseKey = `lab:${LabResponse}` | `attribute:${string}`;

export const responseKeySchema = z
  .string({ error: 'Choose a response.' })
  .max(60, 'Choose a response.')
  .refine((v) => /^lab:(measuredSolids|measuredPh|setTest|syneresis)$/.test(v) || /^attribute:[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v), 'Choose a response.')
  .transform((v) => v as ResponseKey);

export type ResponseKind = 'sensory' | 'lab';

export interface ResponseInfo {
  key: ResponseKey;
  name: string;
  unit: string;
  kind: ResponseKind;
  decimals: number;
  /** The default library's key of a sensory attribute (e.g. "overall-liking"), null otherwise. */
  libraryKey: string | null;
  /** Scale ends of a sensory attribute, for goals and axes; null for lab measures. */
  scale: { min: number; max: number } | null;
}

/** A variant's value of one response: the mean of its cooks or its tasters, with their count and spread. */
export interface ResponseValue {
  mean: number;
  n: number;
  /** Sample standard deviation; null with fewer than two values. */
  sd: number | null;
}

/* ---------- families ---------- */

export const productClassSchema = z.enum(PRODUCT_CLASSES, { error: 'Unknown product class.' });
export type ProductClassKey = (typeof PRODUCT_CLASSES)[number];

export interface FamilyKey {
  productClass: ProductClassKey;
  /** The main fruit's library ingredient. */
  fruitIngredientId: string;
}

/** In URLs and the API: `<product class>.<fruit ingredient id>`. */
export function familySlug(family: FamilyKey): string {
  return `${family.productClass}.${family.fruitIngredientId}`;
}

export const familySlugSchema = z
  .string({ error: 'Choose a product family.' })
  .max(80, 'Choose a product family.')
  .transform((value, ctx): FamilyKey => {
    const dot = value.indexOf('.');
    const productClass = productClassSchema.safeParse(value.slice(0, dot));
    const fruit = id().safeParse(value.slice(dot + 1));
    if (dot < 0 || !productClass.success || !fruit.success) {
      ctx.addIssue({ code: 'custom', message: 'Choose a product family.' });
      return z.NEVER;
    }
    return { productClass: productClass.data, fruitIngredientId: fruit.data.toLowerCase() };
  });

export interface FamilyInfo extends FamilyKey {
  slug: string;
  /** "Apricot reduced-sugar spread". */
  name: string;
  fruitName: string;
}

/** A family on the models page: how much of the workspace's history it pools. */
export interface FamilySummary extends FamilyInfo {
  trials: number;
  variants: number;
  lastCook: string | null;
}

/* ---------- the data set ---------- */

export interface DatasetRow {
  trialId: string;
  /** T-004 */
  trialCode: string;
  trialTitle: string;
  /** ISO date of the trial's first cook (the order the history refits in). */
  trialDate: string;
  variantId: string;
  variantLabel: string;
  pectinFamily: PectinFamily;
  factors: FactorValues;
  responses: Partial<Record<ResponseKey, ResponseValue>>;
}

export interface Dataset {
  family: FamilyInfo | null;
  rows: DatasetRow[];
  /** Responses with a value in at least one row, lab measures first. */
  responses: ResponseInfo[];
  /** Variants of the selection left out, and why (no usable formula, another family, not cooked or tasted). */
  excluded: Array<{ variantId: string; trialCode: string; variantLabel: string; reason: string }>;
}

/* ---------- selections and options ---------- */

export const MAX_SELECTED_TRIALS = 50;

export type DatasetSelection = { family: FamilyKey } | { trialIds: string[] };

export const modelKindSchema = z.enum(['main_effects', 'two_factor_interactions', 'full_quadratic'], { error: 'Unknown model kind.' });
export type ModelKindKey = z.infer<typeof modelKindSchema>;
export const MODEL_KIND_LABELS: Record<ModelKindKey, string> = {
  main_effects: 'Main effects',
  two_factor_interactions: 'Main effects and two-factor interactions',
  full_quadratic: 'Full quadratic',
};

export const factorListSchema = z
  .array(modelFactorSchema, { error: 'Choose the factors.' })
  .min(1, 'Choose at least one factor.')
  .max(MODEL_FACTORS.length, 'Choose each factor once.')
  .refine((list) => new Set(list).size === list.length, 'Choose each factor once.');

export const trialIdsSchema = z
  .array(id('Unknown trial.'), { error: 'Choose trials.' })
  .min(1, 'Choose at least one trial.')
  .max(MAX_SELECTED_TRIALS, `Choose at most ${MAX_SELECTED_TRIALS} trials.`);

/** Fit options shared by the page and the API. */
export const fitOptionsSchema = z
  .object({
    factors: factorListSchema.optional(),
    kind: modelKindSchema.optional(),
    /** Only these trials of the family (else every trial of the family). */
    trialIds: trialIdsSchema.optional(),
  })
  .strict();
export type FitOptions = z.infer<typeof fitOptionsSchema>;

/* ---------- the fitted family model ---------- */

/** A response with its fitted model. */
export interface ResponseModel extends ResponseInfo {
  /** Plain JSON: serialisable to the client, where predictResponse() runs on it. */
  surface: ResponseSurface;
  /** How the runs were weighted, in words for the page. */
  weighting: string;
  /** Weight of a new variant's mean (a typical panel), for prediction intervals; null when unweighted. */
  newRunWeight: number | null;
}

export interface UnfittedResponse {
  key: ResponseKey;
  name: string;
  /** Why there is no model, e.g. "12 runs; a main-effects model in 4 factors needs 7, so 0 more" */
  reason: string;
  /** Runs still needed for the simplest model; 0 when the reason is something else. */
  runsNeeded: number;
}

export interface FamilyModel {
  family: FamilyInfo;
  factors: ModelFactor[];
  runs: number;
  responses: ResponseModel[];
  /**
   * Fruit per 1000 g of finished product over the same factors (a computed feature, not a measured
   * response: a near-exact surface), for the legal fruit minimum as a constraint; null when unfitted.
   */
  fruitContent: ResponseSurface | null;
  unfitted: UnfittedResponse[];
  /** ISO date-time. */
  fittedAt: string;
}

/** What predicting one response needs (a ResponseModel is one): predictOne() takes this. */
export interface PredictionModel extends Pick<ResponseModel, 'key' | 'name' | 'unit' | 'decimals' | 'newRunWeight'> {
  surface: PredictionSurface;
}

/**
 * A family model as the formula editor receives it: per response only what a prediction and its
 * label need, none of the per-run diagnostics (residuals, ANOVA, runs) the model page shows.
 */
export interface EditorFamilyModel {
  family: FamilyInfo;
  factors: ModelFactor[];
  responses: Array<PredictionModel & Pick<ResponseModel, 'scale' | 'libraryKey'>>;
}

/* ---------- prediction and optimisation requests ---------- */

/** Wide enough for any preserve, narrow enough that no number past 2^53 or a rendering size gets in. */
const FACTOR_LIMITS: Record<ModelFactor, [number, number]> = {
  sugarRatio: [0, 10],
  targetSolidsPct: [0, 100],
  pectinPct: [0, 100],
  acidPct: [0, 100],
  fruitPer1000g: [0, 100_000],
};

export const factorPointSchema = z
  .object(
    Object.fromEntries(MODEL_FACTORS.map((f) => [f, boundedNumber(FACTOR_INFO[f].name, FACTOR_LIMITS[f][0], FACTOR_LIMITS[f][1]).optional()])) as Record<
      ModelFactor,
      z.ZodOptional<z.ZodNumber>
    >,
  )
  .strict();

/** POST /api/v1/models/{family}/predict (the family is in the path). */
export const predictRequestSchema = z.object({ point: factorPointSchema, options: fitOptionsSchema.optional() }).strict();
export type PredictRequest = z.infer<typeof predictRequestSchema>;

const goalLimit = boundedNumber('A goal limit', -1e6, 1e6);
const shape = boundedNumber('A shape exponent', 0.1, 10);

/** Derringer–Suich goals (lib/models/desirability.ts) as the optimiser form posts them. */
export const goalSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('maximise'), low: goalLimit, high: goalLimit, shape: shape.optional() }).strict(),
    z.object({ kind: z.literal('minimise'), low: goalLimit, high: goalLimit, shape: shape.optional() }).strict(),
    z.object({ kind: z.literal('target'), low: goalLimit, target: goalLimit, high: goalLimit, lowerShape: shape.optional(), upperShape: shape.optional() }).strict(),
    z
      .object({ kind: z.literal('band'), low: goalLimit, bandLow: goalLimit, bandHigh: goalLimit, high: goalLimit, lowerShape: shape.optional(), upperShape: shape.optional() })
      .strict(),
  ],
  { error: 'Choose a goal.' },
);

export const MAX_GOALS = 8;

/** POST /api/v1/models/{family}/optimise (the family is in the path). */
export const optimiseRequestSchema = z
  .object({
    /** Factors to vary with the bounds allowed (natural units); each must be a factor of the models. */
    factors: z
      .array(z.object({ name: modelFactorSchema, low: boundedNumber('A lower bound', 0, 100_000), high: boundedNumber('An upper bound', 0, 100_000) }).strict())
      .min(1, 'Choose at least one factor to vary.')
      .max(MODEL_FACTORS.length, 'Choose each factor once.')
      .refine((list) => new Set(list.map((f) => f.name)).size === list.length, 'Choose each factor once.')
      .refine((list) => list.every((f) => f.high >= f.low), 'Each lower bound must not exceed its upper bound.'),
    goals: z
      .array(z.object({ response: responseKeySchema, goal: goalSchema, importance: boundedNumber('Importance', 0.1, 10).optional() }).strict())
      .min(1, 'State at least one goal.')
      .max(MAX_GOALS, `State at most ${MAX_GOALS} goals.`)
      .refine((list) => new Set(list.map((g) => g.response)).size === list.length, 'State one goal per response.'),
    constraints: z
      .object({
        /** The legal fruit minimum of the chosen rule set, g per 1000 g of finished product. */
        fruitMinimumPer1000g: boundedNumber('The fruit minimum', 0, 1000).optional(),
        /** The pH window, on the model of measured pH. */
        ph: z.object({ low: boundedNumber('The lowest pH', 0, 14), high: boundedNumber('The highest pH', 0, 14) }).strict().optional(),
        /**
         * The highest cost per jar of the base formula moved to a point, in minor units of the workspace
         * currency (as the Propose screen's ceiling): needs baseFormulaId, its pack format and a price for
         * every line and packaging item on the day; at most 1,000,000 in major units.
         */
        costCeilingPerJarMinor: wholeNumber('The cost ceiling per jar (minor units)', 1, 1_000_000_000).optional(),
      })
      .strict()
      .optional(),
    proposals: z.number({ error: 'Ask for 1 to 5 proposals.' }).int('Ask for 1 to 5 proposals.').min(1, 'Ask for 1 to 5 proposals.').max(5, 'Ask for 1 to 5 proposals.').optional(),
    /** A formula of the family whose exact mass balance gives the fruit content (else the fitted surface). */
    baseFormulaId: id('Unknown formula.').optional(),
    options: fitOptionsSchema.optional(),
  })
  .strict();
export type OptimiseRequest = z.infer<typeof optimiseRequestSchema>;

/** The query of the CSV exports and the data set: ?trials=<id>&trials=<id>&response=<key>&kind=<kind>. */
export const exportQuerySchema = z
  .object({
    trials: trialIdsSchema.optional(),
    response: responseKeySchema.optional(),
    kind: modelKindSchema.optional(),
  })
  .strict();
export type ExportQuery = z.infer<typeof exportQuerySchema>;

/** Reads the export query from a URL's search parameters (the same key may repeat for trials). */
export function readExportQuery(params: URLSearchParams): z.ZodSafeParseResult<ExportQuery> {
  // No prototype: a "__proto__" key is an own (unknown) key the strict schema refuses, not a prototype set.
  const raw: Record<string, unknown> = Object.create(null);
  for (const key of new Set(params.keys())) raw[key] = key === 'trials' ? params.getAll(key) : params.get(key);
  return exportQuerySchema.safeParse(raw);
}
