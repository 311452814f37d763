/** Input schemas and shared shapes of the production feature. */
import { z } from 'zod';
import { isoDate } from '@/lib/formulas/schema';
import { qcSpecProblems, type QcSpec } from '@/lib/chemistry/qc';
import { DISPOSITIONS, LOT_CODE_PATTERN, PRODUCT_CODE_PATTERN, PROMOTION_STATUSES } from './vocabulary';

/** How the kitchen makes it: frozen into every production version. Temperatures in °C. */
export interface ProductionProcess {
  /** End point at sea level; the batch sheet corrects it for the kitchen's altitude. */
  endPointSeaLevelC: number;
  fillTempC: number;
  cookNotes: string;
}

/** What the head of product reviews, captured when the request was made. */
export interface PromotionEvidence {
  trial: { code: string; title: string; question: string };
  variant: { label: string; description: string; factorLevels: Array<{ factor: string; value: number }> };
  recommendation: { rationale: string; byName: string; at: string } | null;
  /** Sensory means of every variant, per attribute, from the comparison. */
  means: Array<{ attribute: string; label: string; mean: number }>;
  verdicts: Array<{ session: string; method: string; attribute: string; verdict: string }>;
  lab: Array<{ label: string; cookDate: string; ph: number | null; brix20: number | null; endPointTempC: number | null; setTestScore: number | null }>;
  compliance: { overall: string; edition: string; failing: string[] };
  cautions: Array<{ code: string; severity: string; title: string }>;
  predicted: { productClass: string; targetSolidsPct: number; plannedPh: number | null; endPointC: number; finishedMassG: number; aw: number };
}

const num = (what: string) => z.number({ error: `${what} must be a number.` }).refine(Number.isFinite, `${what} must be a finite number.`);

export const qcSpecSchema = z
  .object({
    solidsMinBrix: num('Solids minimum').min(20, 'Solids minimum must be at least 20 °Brix.').max(85, 'Solids minimum must be at most 85 °Brix.'),
    solidsMaxBrix: num('Solids maximum').min(20, 'Solids maximum must be at least 20 °Brix.').max(85, 'Solids maximum must be at most 85 °Brix.'),
    phMin: num('pH minimum').min(2, 'pH minimum must be at least 2.').max(4.6, 'pH minimum must be at most 4.6.'),
    phMax: num('pH maximum').min(2, 'pH maximum must be at least 2.').max(7, 'pH maximum must be at most 7.'),
    minFillTempC: num('Minimum fill temperature').min(60, 'A fill below 60 °C is not a hot fill.').max(100, 'Fill temperature must be at most 100 °C.'),
    netFillG: num('Net fill').positive('Net fill must be more than 0 g.').max(10_000, 'Net fill must be at most 10 kg.'),
    netFillToleranceG: num('Fill tolerance').min(0, 'Fill tolerance cannot be negative.').max(1000, 'Fill tolerance must be at most 1 kg.'),
    setMinScore: z.number({ error: 'Set score must be a number.' }).int('Use a whole score.').min(1, 'Score from 1 to 5.').max(5, 'Score from 1 to 5.'),
    setDescription: z.string().trim().min(3, 'Describe the expected set.').max(200, 'Use at most 200 characters.'),
    shelfLifeMonths: z.number({ error: 'Shelf life must be a number.' }).int('Use whole months.').min(1, 'Shelf life must be at least 1 month.').max(60, 'Shelf life must be at most 60 months.'),
    storageNotes: z.string().trim().min(3, 'Give the storage instructions.').max(500, 'Use at most 500 characters.'),
  })
  .strict()
  .superRefine((spec, ctx) => {
    for (const p of qcSpecProblems(spec as QcSpec)) ctx.addIssue({ code: 'custom', path: [p.field], message: p.message });
  });

export const processSchema = z
  .object({
    endPointSeaLevelC: num('End point').min(100, 'The end point must be at least 100 °C at sea level.').max(112, 'The end point must be at most 112 °C.'),
    fillTempC: num('Fill temperature').min(60, 'A fill below 60 °C is not a hot fill.').max(100, 'Fill temperature must be at most 100 °C.'),
    cookNotes: z.string().trim().max(4000, 'Use at most 4000 characters.'),
  })
  .strict();

export const requestPromotionSchema = z
  .object({
    trialId: z.uuid('Unknown trial.'),
    variantId: z.uuid('Choose a variant.'),
    /** Either an existing product (a new version) or a new product's name and code. */
    productId: z.uuid('Choose a product.').optional(),
    newProductName: z.string().trim().min(2, 'Name the product.').max(120, 'Use at most 120 characters.').optional(),
    newProductCode: z.string().trim().regex(PRODUCT_CODE_PATTERN, 'Use 2–5 capital letters, e.g. QMJ.').optional(),
    rationale: z.string().trim().min(10, 'Say why, in a sentence or two.').max(4000, 'Use at most 4000 characters.'),
    process: processSchema,
    spec: qcSpecSchema,
  })
  .strict()
  .superRefine((r, ctx) => {
    if (r.productId && (r.newProductName || r.newProductCode)) {
      ctx.addIssue({ code: 'custom', path: ['productId'], message: 'Choose an existing product or name a new one, not both.' });
    }
    if (!r.productId && !(r.newProductName && r.newProductCode)) {
      ctx.addIssue({ code: 'custom', path: [r.newProductName ? 'newProductCode' : 'newProductName'], message: 'Name the new product and give it a code, or choose an existing product.' });
    }
  });
export type RequestPromotionInput = z.infer<typeof requestPromotionSchema>;

export const decisionSchema = z
  .object({
    decision: z.enum(['approve', 'send_back'], { error: 'Approve or send back.' }),
    comment: z.string().trim().max(4000, 'Use at most 4000 characters.').default(''),
  })
  .strict()
  .superRefine((d, ctx) => {
    if (d.decision === 'send_back' && d.comment.length < 5) {
      ctx.addIssue({ code: 'custom', path: ['comment'], message: 'Say what needs to change before it can be approved.' });
    }
  });
export type DecisionInput = z.infer<typeof decisionSchema>;

export const withdrawSchema = z.object({ comment: z.string().trim().max(2000).default('') }).strict();

const optionalNum = (what: string, min: number, max: number) => num(what).min(min, `${what} must be at least ${min}.`).max(max, `${what} must be at most ${max}.`).nullable().optional();

export const batchRecordSchema = z
  .object({
    lotCode: z.string().trim().toUpperCase().regex(LOT_CODE_PATTERN, 'Use the lot code scheme: product code, year and day of year, batch of the day — e.g. QMJ-26336-1.'),
    batchDate: isoDate,
    batchSizeG: num('Batch size').positive('Batch size must be more than 0.').max(5_000_000, 'Batch size must be at most 5 t.'),
    brixReading: num('Refractometer reading').min(10, 'The correction table covers 10–70 °Brix.').max(70, 'The correction table covers 10–70 °Brix.'),
    brixSampleTempC: num('Sample temperature').min(10, 'Bring the sample to 10–25 °C before reading.').max(25, 'Bring the sample to 10–25 °C before reading.'),
    ph: num('pH').min(1, 'pH must be at least 1.').max(8, 'pH must be at most 8.'),
    fillTempC: num('Fill temperature').min(20, 'Fill temperature must be at least 20 °C.').max(105, 'Fill temperature must be at most 105 °C.'),
    netFillMeanG: optionalNum('Mean net fill', 1, 20_000),
    netFillMinG: optionalNum('Lightest jar', 1, 20_000),
    setTestScore: z.number().int('Use a whole score.').min(1, 'Score from 1 to 5.').max(5, 'Score from 1 to 5.').nullable().optional(),
    jarsFilled: z.number({ error: 'Jars filled must be a number.' }).int('Count whole jars.').min(0, 'Jars cannot be negative.').max(1_000_000),
    jarsRejected: z.number({ error: 'Jars rejected must be a number.' }).int('Count whole jars.').min(0, 'Jars cannot be negative.').max(1_000_000),
    notes: z.string().trim().max(4000, 'Use at most 4000 characters.').nullable().optional(),
    disposition: z.enum(DISPOSITIONS, { error: 'Choose rework, hold or discard.' }).nullable().optional(),
    dispositionComment: z.string().trim().max(2000, 'Use at most 2000 characters.').nullable().optional(),
  })
  .strict()
  .superRefine((b, ctx) => {
    if (b.netFillMeanG != null && b.netFillMinG != null && b.netFillMinG > b.netFillMeanG) {
      ctx.addIssue({ code: 'custom', path: ['netFillMinG'], message: 'The lightest jar cannot weigh more than the mean.' });
    }
    if (b.jarsRejected > b.jarsFilled) ctx.addIssue({ code: 'custom', path: ['jarsRejected'], message: 'More jars rejected than filled.' });
  });
export type BatchRecordInput = z.infer<typeof batchRecordSchema>;

const decisionComment = z.string().trim().min(5, 'Say what was found or decided, in a few words.').max(2000, 'Use at most 2000 characters.');

/** A re-test of a held batch: the readings taken again (at least one); the rest keep their recorded values. */
export const batchRetestSchema = z
  .object({
    brixReading: optionalNum('Refractometer reading', 10, 70),
    brixSampleTempC: optionalNum('Sample temperature', 10, 25),
    ph: optionalNum('pH', 1, 8),
    fillTempC: optionalNum('Fill temperature', 20, 105),
    netFillMeanG: optionalNum('Mean net fill', 1, 20_000),
    netFillMinG: optionalNum('Lightest jar', 1, 20_000),
    setTestScore: z.number().int('Use a whole score.').min(1, 'Score from 1 to 5.').max(5, 'Score from 1 to 5.').nullable().optional(),
    comment: decisionComment,
  })
  .strict()
  .superRefine((r, ctx) => {
    const taken = (['brixReading', 'ph', 'fillTempC', 'netFillMeanG', 'netFillMinG', 'setTestScore'] as const).filter((k) => r[k] != null);
    if (!taken.length) ctx.addIssue({ code: 'custom', path: ['brixReading'], message: 'Enter at least one reading taken again.' });
    if ((r.brixReading == null) !== (r.brixSampleTempC == null)) {
      ctx.addIssue({ code: 'custom', path: [r.brixReading == null ? 'brixReading' : 'brixSampleTempC'], message: 'A refractometer reading needs its sample temperature, and the other way round.' });
    }
    if (r.netFillMeanG != null && r.netFillMinG != null && r.netFillMinG > r.netFillMeanG) {
      ctx.addIssue({ code: 'custom', path: ['netFillMinG'], message: 'The lightest jar cannot weigh more than the mean.' });
    }
  });
export type BatchRetestInput = z.infer<typeof batchRetestSchema>;

/** Release or reject a held batch. */
export const batchDecisionSchema = z
  .object({
    decision: z.enum(['release', 'reject'], { error: 'Release or reject.' }),
    comment: decisionComment,
  })
  .strict();
export type BatchDecisionInput = z.infer<typeof batchDecisionSchema>;

export const batchSheetQuerySchema = z
  .object({
    target: z.enum(['finished_mass', 'total_charge', 'jar_count'], { error: 'Scale by kettle charge, finished mass or jar count.' }).default('total_charge'),
    /** Absent: the formula at its developed size. */
    amount: z.coerce.number({ error: 'Give the amount as a number.' }).positive('The amount must be more than 0.').max(5_000_000, 'The amount is implausibly large.').optional(),
    unit: z.enum(['g', 'kg', 'lb', 'oz'], { error: 'Use g, kg, lb or oz.' }).default('kg'),
    step: z.coerce.number({ error: 'Give the scale resolution as a number.' }).positive('The scale resolution must be more than 0.').max(10_000, 'The scale resolution is implausibly coarse.').default(5),
    stepUnit: z.enum(['g', 'kg', 'lb', 'oz'], { error: 'Use g, kg, lb or oz.' }).default('g'),
    altitudeM: z.coerce.number({ error: 'Altitude must be a number.' }).min(-500, 'Altitude must be at least −500 m.').max(5000, 'Altitude must be at most 5000 m.').optional(),
  })
  .strict();
export type BatchSheetQuery = z.infer<typeof batchSheetQuerySchema>;

export const promotionListQuerySchema = z.object({ status: z.enum(PROMOTION_STATUSES, { error: 'Unknown status.' }).optional() }).strict();
