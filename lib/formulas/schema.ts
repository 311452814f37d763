/** Formulas and their revisions: zod schemas shared by the editor, the server actions and the API. */
import { z } from 'zod';
import type { BatchComputation, IngredientComposition } from '@/lib/chemistry';
import { PRESERVATION_METHODS } from '@/lib/chemistry/guidance';
import { toGrams } from '@/lib/chemistry/units';
import { ingredientInputSchema } from '@/lib/ingredients/schema';
import { calendarDateProblem, isoDate, longText, name, noTinyAmount, searchText, SMALLEST_AMOUNT, versionNumber } from '@/lib/input';

export const PRODUCT_CLASSES = ['jam', 'extra_jam', 'jelly', 'marmalade', 'reduced_sugar_spread'] as const;
export const RULE_SETS = ['eu', 'us', 'codex'] as const;
/** Units a line may be entered in. Storage keeps grams ('g') or percent of fruit ('pct_fruit'). */
export const LINE_UNITS = ['g', 'kg', 'lb', 'oz', 'pct_fruit'] as const;

export const PRODUCT_CLASS_LABELS: Record<(typeof PRODUCT_CLASSES)[number], string> = {
  jam: 'Jam',
  extra_jam: 'Extra jam',
  jelly: 'Jelly',
  marmalade: 'Marmalade',
  reduced_sugar_spread: 'Reduced-sugar spread',
};
export const RULE_SET_LABELS: Record<(typeof RULE_SETS)[number], string> = {
  eu: 'EU (Directive 2001/113/EC, as amended)',
  us: 'US (21 CFR 150)',
  codex: 'Codex (CXS 296-2009)',
};

/** Calendar dates come from lib/input.ts (real dates in the years it states); re-exported for older imports. */
export { isoDate };

/**
 * The rule date's window. The rules held start with Directive 2001/113/EC and any earlier day was
 * judged by it (1850 showed the 2001 edition); a day after 2099 is a slip. Project limits, no published source.
 */
export const RULE_DATE_MIN = '2000-01-01';
export const RULE_DATE_MAX = '2099-12-31';
const ruleDateSchema = isoDate.refine(
  (day) => calendarDateProblem(day) !== null || (day >= RULE_DATE_MIN && day <= RULE_DATE_MAX),
  'Choose a rule date from 1 Jan 2000 to 31 Dec 2099.',
);

export const formulaSettingsSchema = z
  .object({
    productClass: z.enum(PRODUCT_CLASSES, { error: 'Choose a product class.' }),
    ruleSet: z.enum(RULE_SETS, { error: 'Choose a market rule set.' }),
    ruleDate: ruleDateSchema,
    targetSolidsPct: z.number({ error: 'Target solids must be a number.' }).min(SMALLEST_AMOUNT, `Target solids must be at least ${SMALLEST_AMOUNT} %.`).lt(100, 'Target solids must be below 100 %.'),
    // At least 1 g, as a pack format's net fill (lib/pricing/schema.ts).
    jarNetFillG: z.number({ error: 'Jar fill must be a number.' }).min(1, 'Jar fill must be at least 1 g.').max(50_000, 'Jar fill must be at most 50 kg.'),
    altitudeM: z.number({ error: 'Altitude must be a number.' }).min(-500, 'Altitude must be at least −500 m.').max(5000, 'Altitude must be at most 5000 m.').nullable().optional(),
    measuredWaterBoilingC: z.number({ error: 'Boiling point must be a number.' }).min(60, 'A water boiling point below 60 °C is not plausible.').max(105, 'A water boiling point above 105 °C is not plausible.').nullable().optional(),
    plannedPh: z.number({ error: 'pH must be a number.' }).min(1, 'pH must be at least 1.').max(8, 'pH must be at most 8.').nullable().optional(),
    preservation: z.enum(PRESERVATION_METHODS, { error: 'Choose how the product is preserved.' }).nullable().optional(),
    sucroseInversionPct: noTinyAmount(z.number({ error: 'The inverted share must be a number.' }).min(0, 'The inverted share runs from 0 to 100 %.').max(100, 'The inverted share runs from 0 to 100 %.'), 'The inverted share', ' %').nullable().optional(),
  })
  .strict();

/** The most one formula line may hold: 10 t, or ten times the fruit. */
export const MAX_LINE_G = 10_000_000;
export const MAX_PCT_OF_FRUIT = 1000;

export const formulaLineSchema = z
  .object({
    ingredientId: z.uuid('Choose an ingredient from the library.'),
    quantity: z.number({ error: 'Quantity must be a number.' }).min(SMALLEST_AMOUNT, `Quantity must be at least ${SMALLEST_AMOUNT}.`).max(10_000_000, 'Quantity is implausibly large.'),
    unit: z.enum(LINE_UNITS, { error: 'Use g, kg, lb, oz or % of fruit.' }),
  })
  .strict()
  .superRefine((line, ctx) => {
    // The bound holds in grams whatever the unit (10,000,000 kg got through a bound on the number alone),
    // and a share of the fruit stays within ten times the fruit. Generous: common practice, no published source.
    if (line.unit === 'pct_fruit') {
      if (line.quantity > MAX_PCT_OF_FRUIT) ctx.addIssue({ code: 'custom', path: ['quantity'], message: `More than ${MAX_PCT_OF_FRUIT} % of the fruit (ten times its mass) is not plausible for one line.` });
    } else if (toGrams(line.quantity, line.unit) > MAX_LINE_G) {
      ctx.addIssue({ code: 'custom', path: ['quantity'], message: 'More than 10 t in one line is not plausible for a batch.' });
    }
  });

const linesSchema = z.array(formulaLineSchema).min(1, 'Add at least one line.').max(60, 'A formula has at most 60 lines.');
const nameSchema = name('Give the formula a name.');
const noteSchema = longText(500);

export const createFormulaSchema = z
  .object({
    name: nameSchema,
    description: longText(2000).optional(),
    settings: formulaSettingsSchema,
    lines: linesSchema,
    note: noteSchema.optional(),
  })
  .strict();

export const reviseFormulaSchema = z
  .object({
    /** The revision the editor started from; a newer one on the server means someone else saved (409). */
    baseRevision: versionNumber,
    /** Save on top of a newer revision anyway; the other person's revision stays in the history. */
    force: z.boolean().optional(),
    name: nameSchema.optional(),
    settings: formulaSettingsSchema,
    lines: linesSchema,
    note: noteSchema.optional(),
  })
  .strict();

/** The stateless calculator takes library ingredients by id or a composition inline. */
export const calcBatchSchema = z
  .object({
    settings: formulaSettingsSchema,
    lines: z
      .array(
        z
          .object({
            ingredientId: z.uuid().optional(),
            ingredient: ingredientInputSchema.optional(),
            quantity: formulaLineSchema.shape.quantity,
            unit: formulaLineSchema.shape.unit,
          })
          .strict()
          .refine((l) => (l.ingredientId ? 1 : 0) + (l.ingredient ? 1 : 0) === 1, 'Give either ingredientId or ingredient, not both.'),
      )
      .min(1, 'Add at least one line.')
      .max(60),
  })
  .strict();

/** GET /api/v1/formulas and the formulas page: ?q= searches names. */
export const formulaListQuerySchema = z.object({ q: searchText.optional() });

export type FormulaSettingsInput = z.infer<typeof formulaSettingsSchema>;
export type FormulaLineInputData = z.infer<typeof formulaLineSchema>;
export type CreateFormulaInput = z.infer<typeof createFormulaSchema>;
export type ReviseFormulaInput = z.infer<typeof reviseFormulaSchema>;
export type CalcBatchInput = z.infer<typeof calcBatchSchema>;

/** A stored line: the ingredient as it was when the revision was saved, so history never shifts. */
export interface RevisionLine {
  ingredientId: string;
  ingredient: IngredientComposition;
  quantity: number;
  unit: 'g' | 'pct_fruit';
}

/** Headline results stored with each revision so lists need not recompute. */
export interface RevisionSummary {
  complianceOverall: string | null;
  dangerCount: number;
  warningCount: number;
  finishedMassG: number | null;
}

export interface FormulaRevisionView {
  formulaId: string;
  number: number;
  name: string;
  settings: FormulaSettingsInput;
  lines: RevisionLine[];
  note: string | null;
  createdAt: string;
  createdBy: { id: string; name: string };
}

export interface FormulaSummary {
  id: string;
  name: string;
  productClass: (typeof PRODUCT_CLASSES)[number];
  ruleSet: (typeof RULE_SETS)[number];
  revision: number;
  updatedAt: string;
  updatedByName: string;
  /** From the current revision's computation; null when it cannot be computed. */
  complianceOverall: string | null;
  dangerCount: number;
  warningCount: number;
  finishedMassG: number | null;
}

export interface FormulaDetail {
  id: string;
  name: string;
  description: string | null;
  current: FormulaRevisionView;
  computation: BatchComputation | null;
  computationError: string | null;
}
