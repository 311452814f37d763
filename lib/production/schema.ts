/** Input schemas and shared shapes of the production feature. */
import { z } from 'zod';
import { boundedNumber, isoDate, longText, numberFromText, text, wholeNumber } from '@/lib/input';
import { formatDate, todayIso } from '@/lib/format/dates';
import { showNumber } from '@/lib/format/quantities';
import { qcSpecProblems, type QcSpec } from '@/lib/chemistry/qc';
import type { PreservationMethod } from '@/lib/chemistry/guidance';
import { DISPOSITIONS, LOT_CODE_PATTERN, PRODUCT_CODE_PATTERN, PROMOTION_STATUSES, PROMOTION_TARGETS } from './vocabulary';
import type { Caution, ComplianceReport, QcCheck } from '@/lib/chemistry';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import type { PromotionOutcome, RecipeIdentity, weighLines } from './review';
import type { BatchRetestReadings } from './holds';
import type { BatchDecisionKind, BatchOutcome, BatchStatus, Disposition, PromotionStatus, VersionStatus } from './vocabulary';

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
  predicted: {
    productClass: string; targetSolidsPct: number; plannedPh: number | null;
    /** Where the trial's water boils (its altitude or measured boiling point), not at sea level. */
    endPointC: number;
    finishedMassG: number; aw: number;
    /** Absent on requests made before it was captured. */ preservation?: PreservationMethod | null;
    /** Absent on requests made before it was captured. */ waterBoilingC?: number;
  };
}

const num = (what: string) => z.number({ error: `${what} must be a number.` }).refine(Number.isFinite, `${what} must be a finite number.`);

export const qcSpecSchema = z
  .object({
    solidsMinBrix: num('Solids minimum').min(20, 'Solids minimum must be at least 20 °Brix.').max(85, 'Solids minimum must be at most 85 °Brix.'),
    solidsMaxBrix: num('Solids maximum').min(20, 'Solids maximum must be at least 20 °Brix.').max(85, 'Solids maximum must be at most 85 °Brix.'),
    phMin: num('pH minimum').min(2, 'pH minimum must be at least 2.').max(4.6, 'pH minimum must be at most 4.6.'),
    phMax: num('pH maximum').min(2, 'pH maximum must be at least 2.').max(7, 'pH maximum must be at most 7.'),
    minFillTempC: num('Minimum fill temperature').min(60, 'A fill below 60 °C is not a hot fill.').max(100, 'Fill temperature must be at most 100 °C.'),
    netFillG: num('Net fill').min(1, 'Net fill must be at least 1 g.').max(10_000, 'Net fill must be at most 10 kg.'),
    netFillToleranceG: num('Fill tolerance').min(0, 'Fill tolerance cannot be negative.').max(1000, 'Fill tolerance must be at most 1 kg.'),
    setMinScore: wholeNumber('Set score', 1, 5),
    setDescription: text({ min: 3, max: 200, required: 'Describe the expected set.' }),
    shelfLifeMonths: wholeNumber('Shelf life in months', 1, 60),
    storageNotes: longText(500, { min: 3, required: 'Give the storage instructions.' }),
  })
  .strict()
  .superRefine((spec, ctx) => {
    for (const p of qcSpecProblems(spec as QcSpec)) ctx.addIssue({ code: 'custom', path: [p.field], message: p.message });
  });

export const processSchema = z
  .object({
    endPointSeaLevelC: num('End point').min(100, 'The end point must be at least 100 °C at sea level.').max(112, 'The end point must be at most 112 °C.'),
    fillTempC: num('Fill temperature').min(60, 'A fill below 60 °C is not a hot fill.').max(100, 'Fill temperature must be at most 100 °C.'),
    cookNotes: longText(4000),
  })
  .strict();

export const requestPromotionSchema = z
  .object({
    trialId: z.uuid('Unknown trial.'),
    variantId: z.uuid('Choose a variant.'),
    /** Chosen by the developer, never defaulted: a new product, or a new version of an existing one. */
    target: z.enum(PROMOTION_TARGETS, { error: 'Choose whether this is a new product or a new version of an existing one.' }),
    productId: z.uuid('Choose a product.').optional(),
    newProductName: text({ min: 2, max: 120, required: 'Name the new product, in at least 2 characters.' }).optional(),
    newProductCode: z.string().trim().regex(PRODUCT_CODE_PATTERN, 'Use 2–5 capital letters, e.g. QMJ.').optional(),
    rationale: longText(4000, { min: 10, required: 'Say why, in a sentence or two.' }),
    process: processSchema,
    spec: qcSpecSchema,
  })
  .strict()
  .superRefine((r, ctx) => {
    if (r.target === 'existing_product') {
      if (!r.productId) ctx.addIssue({ code: 'custom', path: ['productId'], message: 'Choose the product this becomes a new version of.' });
      if (r.newProductName || r.newProductCode) {
        ctx.addIssue({ code: 'custom', path: ['newProductName'], message: 'A new version of an existing product takes no new name or code.' });
      }
      return;
    }
    if (r.productId) ctx.addIssue({ code: 'custom', path: ['productId'], message: 'A new product is not a version of an existing one: leave the product out.' });
    // Only when left out: a name or code given but refused already carries its field's own message.
    if (r.newProductName === undefined) ctx.addIssue({ code: 'custom', path: ['newProductName'], message: 'Name the new product.' });
    if (r.newProductCode === undefined) ctx.addIssue({ code: 'custom', path: ['newProductCode'], message: 'Give the new product a code.' });
  });
export type RequestPromotionInput = z.infer<typeof requestPromotionSchema>;

export const decisionSchema = z
  .object({
    decision: z.enum(['approve', 'send_back'], { error: 'Approve or send back.' }),
    comment: longText(4000).default(''),
  })
  .strict()
  .superRefine((d, ctx) => {
    if (d.decision === 'send_back' && d.comment.length < 5) {
      ctx.addIssue({ code: 'custom', path: ['comment'], message: 'Say what needs to change before it can be approved.' });
    }
  });
export type DecisionInput = z.infer<typeof decisionSchema>;

export const withdrawSchema = z.object({ comment: longText(2000).default('') }).strict();

const optionalNum = (what: string, min: number, max: number) => num(what).min(min, `${what} must be at least ${min}.`).max(max, `${what} must be at most ${max}.`).nullable().optional();

export const batchRecordSchema = z
  .object({
    lotCode: z.string().trim().toUpperCase().regex(LOT_CODE_PATTERN, 'Use the lot code scheme: product code, year and day of year, batch of the day — e.g. QMJ-26336-1.'),
    batchDate: isoDate,
    batchSizeG: num('Batch size').min(1, 'Batch size must be at least 1 g.').max(5_000_000, 'Batch size must be at most 5 t.'),
    brixReading: num('Refractometer reading').min(10, 'The correction table covers 10–70 °Brix.').max(70, 'The correction table covers 10–70 °Brix.'),
    brixSampleTempC: num('Sample temperature').min(10, 'Bring the sample to 10–25 °C before reading.').max(25, 'Bring the sample to 10–25 °C before reading.'),
    ph: num('pH').min(1, 'pH must be at least 1.').max(8, 'pH must be at most 8.'),
    fillTempC: num('Fill temperature').min(20, 'Fill temperature must be at least 20 °C.').max(105, 'Fill temperature must be at most 105 °C.'),
    netFillMeanG: optionalNum('Mean net fill', 1, 20_000),
    netFillMinG: optionalNum('Lightest jar', 1, 20_000),
    setTestScore: wholeNumber('The set-test score', 1, 5).nullable().optional(),
    jarsFilled: wholeNumber('Jars filled', 0, 1_000_000),
    jarsRejected: wholeNumber('Jars rejected', 0, 1_000_000),
    notes: longText(4000).nullable().optional(),
    disposition: z.enum(DISPOSITIONS, { error: 'Choose rework, hold or discard.' }).nullable().optional(),
    dispositionComment: longText(2000).nullable().optional(),
  })
  .strict()
  .superRefine((b, ctx) => {
    if (b.netFillMeanG != null && b.netFillMinG != null && b.netFillMinG > b.netFillMeanG) {
      ctx.addIssue({ code: 'custom', path: ['netFillMinG'], message: 'The lightest jar cannot weigh more than the mean.' });
    }
    if (b.jarsRejected > b.jarsFilled) ctx.addIssue({ code: 'custom', path: ['jarsRejected'], message: 'More jars rejected than filled.' });
  });
export type BatchRecordInput = z.infer<typeof batchRecordSchema>;

/** A clock or a time zone a day ahead of the server's: a batch may be dated one day past the server's today. */
export const BATCH_DATE_SLACK_DAYS = 1;
/**
 * Jars filled may exceed what the batch can fill at the lightest accepted jar (net fill less its
 * tolerance) by this share: short-filled jars that were then rejected. Common practice, no published source.
 */
export const JAR_COUNT_ALLOWANCE = 0.05;

/** What a batch is checked against besides its own fields: the day, and the version it was made to. */
export interface BatchRecordContext {
  /** The server's today, YYYY-MM-DD (UTC). */
  today: string;
  version: number;
  /** The day the version was approved, YYYY-MM-DD (UTC). */
  approvedOn: string;
  netFillG: number;
  netFillToleranceG: number;
}

function addDays(isoDay: string, days: number): string {
  const d = new Date(`${isoDay}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return todayIso(d);
}

/** The most jars a batch of this mass can fill (the batch size is the kettle or the finished mass: either bounds what went into jars). */
export function mostJarsFor(batchSizeG: number, netFillG: number, netFillToleranceG: number): number {
  const lightestG = netFillG - netFillToleranceG > 0 ? netFillG - netFillToleranceG : netFillG;
  return Math.floor((batchSizeG * (1 + JAR_COUNT_ALLOWANCE)) / lightestG + 1e-9);
}

/**
 * The one rule for a batch that cannot have happened: dated after today (with a day of slack) or
 * before its version was approved (the same day of slack, for time zones), or more jars than its mass
 * fills. recordBatch() applies it to the form's and the API's batches alike; field → messages.
 */
export function batchRecordProblems(b: Pick<BatchRecordInput, 'batchDate' | 'batchSizeG' | 'jarsFilled'>, c: BatchRecordContext): Record<string, string[]> {
  const problems: Record<string, string[]> = {};
  if (b.batchDate > addDays(c.today, BATCH_DATE_SLACK_DAYS)) {
    problems.batchDate = [`The batch date ${formatDate(b.batchDate)} is in the future (today is ${formatDate(c.today)}): record a batch once it is made.`];
  } else if (b.batchDate < addDays(c.approvedOn, -BATCH_DATE_SLACK_DAYS)) {
    problems.batchDate = [`v${c.version} was approved on ${formatDate(c.approvedOn)}: a batch made to it cannot be dated ${formatDate(b.batchDate)}, before that.`];
  }
  const most = mostJarsFor(b.batchSizeG, c.netFillG, c.netFillToleranceG);
  if (b.jarsFilled > most) {
    problems.jarsFilled = [
      `A batch of ${formatKg(b.batchSizeG)} fills at most ${showNumber(most, 0)} jars of ${c.netFillG} g (at the lightest accepted fill, with ${JAR_COUNT_ALLOWANCE * 100} % to spare); ${showNumber(b.jarsFilled, 0)} were entered. Check the jars and the batch size.`,
    ];
  }
  return problems;
}

function formatKg(g: number): string {
  return g >= 1000 ? `${Number((g / 1000).toFixed(3))} kg` : `${Number(g.toFixed(1))} g`;
}

/** The finest scale resolution a batch sheet rounds to, in the chosen unit (finer is no kitchen scale, and only drives the arithmetic). */
export const SHEET_STEP_MIN = 0.001;

const decisionComment = longText(2000, { min: 5, required: 'Say what was found or decided, in a few words.' });

/** A re-test of a held batch: the readings taken again (at least one); the rest keep their recorded values. */
export const batchRetestSchema = z
  .object({
    brixReading: optionalNum('Refractometer reading', 10, 70),
    brixSampleTempC: optionalNum('Sample temperature', 10, 25),
    ph: optionalNum('pH', 1, 8),
    fillTempC: optionalNum('Fill temperature', 20, 105),
    netFillMeanG: optionalNum('Mean net fill', 1, 20_000),
    netFillMinG: optionalNum('Lightest jar', 1, 20_000),
    setTestScore: wholeNumber('The set-test score', 1, 5).nullable().optional(),
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
    amount: numberFromText('The amount', z.number().positive('The amount must be more than 0.').max(5_000_000, 'The amount is implausibly large.')).optional(),
    unit: z.enum(['g', 'kg', 'lb', 'oz'], { error: 'Use g, kg, lb or oz.' }).default('kg'),
    step: numberFromText('The scale resolution', boundedNumber('The scale resolution', SHEET_STEP_MIN, 10_000)).default(5),
    stepUnit: z.enum(['g', 'kg', 'lb', 'oz'], { error: 'Use g, kg, lb or oz.' }).default('g'),
    altitudeM: numberFromText('Altitude', boundedNumber('Altitude', -500, 5000)).optional(),
  })
  .strict()
  .superRefine((q, ctx) => {
    if (q.target === 'jar_count' && q.amount !== undefined && (!Number.isInteger(q.amount) || q.amount < 1)) {
      ctx.addIssue({ code: 'custom', path: ['amount'], message: 'Count whole jars, at least one.' });
    }
  });
export type BatchSheetQuery = z.infer<typeof batchSheetQuerySchema>;

export const promotionListQuerySchema = z.object({ status: z.enum(PROMOTION_STATUSES, { error: 'Unknown status.' }).optional() }).strict();

// What the production pages and the API read (lib/production/queries.ts builds them).

/** A few degrees above the hot-fill minimum, so the last jars of a batch still fill hot. Common practice, no published source. */
export const DEFAULT_FILL_TEMP_C = 88;

export interface PromotionSummary {
  id: string;
  code: string;
  status: PromotionStatus;
  trial: { id: string; code: string; title: string };
  variantLabel: string;
  productLabel: string;
  requestedBy: string;
  requestedAt: string;
  decidedAt: string | null;
}

export interface PromotionView extends PromotionSummary {
  variantId: string;
  product: { id: string; code: string; name: string } | null;
  newProduct: { name: string; code: string } | null;
  rationale: string;
  process: ProductionProcess;
  spec: QcSpec;
  evidence: PromotionEvidence;
  requestedById: string;
  decidedBy: string | null;
  decisionComment: string | null;
  productVersionId: string | null;
  /** The sent-back request this one was filed after, with the reason it was sent back. */
  previousRequest: { id: string; code: string; sentBackBecause: string } | null;
  /** The permissions module decides; the page only shows what it allows. */
  canDecide: boolean;
  /** The viewer holds the deciding role but made this request: another head of product decides it. */
  awaitsAnotherDecider: boolean;
  canWithdraw: boolean;
  history: PromotionSummary[];
  audit: AuditView[];
  /** What approval does (or did): make a new product, or a new version superseding the one in production. */
  outcome: PromotionOutcome;
  /** The formula that goes (or went) to production: the variant's lines while pending, the version's once approved. */
  formula: { settings: FormulaSettingsInput; lines: RevisionLine[]; weighed: ReturnType<typeof weighLines> } | null;
  /** The version it is compared against: the one in production now, or (once approved) the one it superseded. */
  baseline: { id: string; version: number; productName: string; settings: FormulaSettingsInput; lines: RevisionLine[] } | null;
}

export interface AuditView {
  id: string;
  at: string;
  actorName: string;
  actorRole: string;
  action: string;
  summary: string;
  subjectType: string;
  subjectId: string;
  promotionRequestId: string | null;
}

export interface ProductSummary {
  id: string;
  code: string;
  name: string;
  current: { id: string; version: number; approvedAt: string } | null;
  versionCount: number;
  batchCount: number;
  failedCount: number;
  lastBatchDate: string | null;
}

/** A re-test, release or reject of a held batch. */
export interface BatchDecisionView {
  id: string;
  kind: BatchDecisionKind;
  readings: BatchRetestReadings | null;
  checks: QcCheck[] | null;
  outcome: BatchOutcome | null;
  comment: string;
  decidedBy: string;
  at: string;
}

export interface VersionSummary {
  id: string;
  version: number;
  status: VersionStatus;
  approvedAt: string;
  approvedBy: string;
  supersededAt: string | null;
  supersededByVersion: number | null;
  source: { trialId: string; trialCode: string; variantLabel: string };
  promotionRequestId: string;
}

export interface VersionView extends VersionSummary {
  product: { id: string; code: string; name: string };
  settings: FormulaSettingsInput;
  lines: RevisionLine[];
  process: ProductionProcess;
  compliance: ComplianceReport;
  spec: QcSpec;
  trialTitle: string;
  audit: AuditView[];
  batches: BatchView[];
}

/** A version as its batch sheet shows it. */
export type SheetVersion = Pick<VersionView, 'id' | 'version' | 'status' | 'product' | 'settings' | 'lines' | 'process' | 'spec'>;

export interface BatchView {
  id: string;
  lotCode: string;
  batchDate: string;
  version: number;
  versionId: string;
  batchSizeG: number;
  brixReading: number;
  brixSampleTempC: number;
  brix20: number;
  ph: number;
  fillTempC: number;
  netFillMeanG: number | null;
  netFillMinG: number | null;
  setTestScore: number | null;
  jarsFilled: number;
  jarsRejected: number;
  /** Jars that can be sold: none for a rejected or discarded batch (goodJarsOf). */
  goodJars: number;
  notes: string | null;
  checks: QcCheck[];
  /** The outcome at recording: a missing required check shows as incomplete, even on rows stored before that rule. */
  outcome: BatchOutcome;
  disposition: Disposition | null;
  dispositionComment: string | null;
  recordedBy: string;
  /** Where the batch stands now, the latest checks (after any re-test), and what may follow. */
  status: BatchStatus;
  latestOutcome: BatchOutcome;
  latestChecks: QcCheck[];
  canRetest: boolean;
  canRelease: boolean;
  canReject: boolean;
  /** A batch kept for rework: the checks not measured again since the rework (empty otherwise). */
  staleSinceRework: string[];
  decisions: BatchDecisionView[];
  /** The spec this batch was checked against, for the trend chart's limits. */
  limits: { solidsMin: number; solidsMax: number; phMin: number; phMax: number };
}

/** A product a variant could become the next version of, with what is in production now. */
export interface PromotionTargetProduct {
  id: string;
  code: string;
  name: string;
  /** The version in production; null if none is (then the next version is `nextVersion`). */
  current: ({ version: number } & RecipeIdentity) | null;
  nextVersion: number;
}

export interface PromotionDraftVariant {
  id: string;
  label: string;
  description: string;
  complianceOverall: string | null;
  productClass: string;
  /** How the variant is preserved besides sugar, when stated (it grades the reduced-sugar caution). */
  preservation: PreservationMethod | null;
  fruits: string[];
  /** Null when the variant's chemistry cannot be computed. */
  defaults: { spec: QcSpec; process: ProductionProcess; cautions: Caution[] } | null;
}

/** A sent-back request the next request of its trial starts from. */
export interface PromotionResubmission {
  id: string;
  code: string;
  sentBackBecause: string;
  variantId: string;
  productId: string | null;
  newProductName: string | null;
  newProductCode: string | null;
  rationale: string;
  process: ProductionProcess;
  spec: QcSpec;
}

export interface BatchWorkItem {
  id: string;
  lotCode: string;
  batchDate: string;
  productId: string;
  productName: string;
  /** Where the batch stands after its re-tests and decisions (a released batch is no longer held). */
  status: BatchView['status'];
  latestOutcome: BatchView['latestOutcome'];
}
