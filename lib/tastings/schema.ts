/** Tastings and taster answers: zod schemas shared by the API, actions and the phone flow. */
import { z } from 'zod';
import { TASTING_METHODS, TASTING_STATES } from './vocabulary';
import type { ServedCup, TastingMethod, TastingState } from './vocabulary';
import type { SensoryScale } from '@/lib/sensory';
import { isoDateTime, longText, name, text } from '@/lib/input';

const code = z.string().regex(/^\d{3}$/, 'A sample code has three digits.');

export const createTastingSchema = z
  .object({
    title: name('Give the tasting a title tasters may see (no variant names).'),
    place: text({ max: 120 }).optional(),
    startsAt: isoDateTime.optional(),
    method: z.enum(TASTING_METHODS, { error: 'Choose a method.' }),
    variantIds: z.array(z.uuid('Unknown variant.')).min(2, 'Choose at least two samples.').max(12, 'At most twelve samples.'),
    attributeIds: z.array(z.uuid('Unknown attribute.')).max(12, 'At most twelve attributes.').default([]),
    rankingAttributeId: z.uuid().optional(),
    notice: longText(3000, { min: 1, required: 'Write the allergen and consent notice tasters must accept.' }),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (new Set(v.variantIds).size !== v.variantIds.length) ctx.addIssue({ code: 'custom', path: ['variantIds'], message: 'Each variant once.' });
    if (v.method === 'rated' && v.attributeIds.length === 0) ctx.addIssue({ code: 'custom', path: ['attributeIds'], message: 'Choose the attributes tasters rate.' });
    if (v.method === 'triangle' && v.variantIds.length !== 2) ctx.addIssue({ code: 'custom', path: ['variantIds'], message: 'A triangle test compares exactly two variants.' });
  });

export const joinSchema = z
  .object({
    joinCode: z.string().trim().toUpperCase().regex(/^[A-Z0-9]{6}$/, 'The code has six letters and digits.'),
    displayName: name('Tell us what to call you.', 40),
  })
  .strict();

const key = z.uuid('idempotencyKey must be a UUID.');

export const answerSchema = z.union([
  z.object({ idempotencyKey: key, code, attributeId: z.uuid(), value: z.number({ error: 'The value must be a number.' }).finite() }).strict(),
  z.object({ idempotencyKey: key, attributeId: z.uuid().optional(), ranking: z.array(code).min(2).max(12) }).strict(),
  z.object({ idempotencyKey: key, oddCode: code, confidence: z.union([z.literal(1), z.literal(2), z.literal(3)]).optional(), comment: longText(500).optional() }).strict(),
]);

export const inviteTastersSchema = z.object({ userIds: z.array(z.uuid()).min(1, 'Choose at least one taster.').max(200) }).strict();

export const createAttributeSchema = z
  .object({
    name: name('Name the attribute.', 80),
    instruction: longText(600, { min: 1, required: 'Tell tasters what to do and attend to.' }),
    scale: z.enum(['intensity', 'hedonic', 'jar'], { error: 'Choose a scale.' }),
    lowAnchor: text({ max: 40 }).optional(),
    highAnchor: text({ max: 40 }).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.scale === 'intensity' && (!v.lowAnchor || !v.highAnchor)) {
      ctx.addIssue({ code: 'custom', path: [!v.lowAnchor ? 'lowAnchor' : 'highAnchor'], message: 'An intensity line needs words for both ends.' });
    }
  });

/** The tastings list's filters, from the URL; anything else is ignored. */
export const tastingListQuerySchema = z.object({ state: z.enum(TASTING_STATES).optional(), trial: z.uuid().optional() });

export type CreateAttributeInput = z.infer<typeof createAttributeSchema>;
export type CreateTastingInput = z.infer<typeof createTastingSchema>;
export type JoinInput = z.infer<typeof joinSchema>;
export type AnswerInput = z.infer<typeof answerSchema>;

/** What the phone receives. Only codes, attribute ids and the seat's own answers: nothing that maps to a variant. */
export interface TasterView {
  session: { title: string; notice: string; method: (typeof TASTING_METHODS)[number]; state: 'open' | 'closed'; place: string | null; startsAt: string | null };
  seat: { displayName: string; consented: boolean; submitted: boolean };
  samples: Array<{ code: string; position: number }>;
  attributes: Array<{ id: string; name: string; instruction: string; scale: TasterScale }>;
  ranking?: { attributeId: string | null; instruction: string };
  answers: Array<{ code?: string; attributeId?: string; value?: number; ranking?: string[]; oddCode?: string; confidence?: number; comment?: string }>;
}

export type TasterScale =
  | { kind: 'category'; points: Array<{ value: number; label: string }> }
  | { kind: 'line'; min: number; max: number; step: number; lowAnchor: string; highAnchor: string };

/* The organiser's views (lib/tastings/queries.ts reads them). */

export interface SeatProgress {
  seatIndex: number;
  displayName: string;
  kind: 'staff' | 'guest';
  answered: number;
  expected: number;
  consented: boolean;
  status: 'joined' | 'answering' | 'submitted' | 'partial';
  lastSeenAt: string | null;
}
export interface TastingView {
  id: string;
  trialId: string;
  title: string;
  place: string | null;
  startsAt: string | null;
  method: TastingMethod;
  state: TastingState;
  notice: string;
  joinCode: string | null;
  samples: Array<{ sampleId: string; variantId: string; variantLabel: string; variantDescription: string; code: string | null }>;
  attributes: Array<{ id: string; name: string }>;
  /** The set-up as chosen: the rated attributes and, for a ranking, the attribute ranked by. */
  ratedAttributeIds: string[];
  rankingAttributeId: string | null;
  seats: SeatProgress[];
  createdAt: string;
  openedAt: string | null;
  closedAt: string | null;
}
/**
 * A tasting's set-up as read in one statement (lib/tastings/queries.ts loadTastingRows): the session,
 * its samples with their variants, the attributes it uses and its seats. Times are ISO strings.
 */
export interface TastingRows {
  s: {
    id: string; trialId: string; title: string; place: string | null; startsAt: string | null; method: TastingMethod; state: TastingState;
    notice: string; joinCode: string | null; attributeIds: string[]; rankingAttributeId: string | null;
    createdAt: string; openedAt: string | null; closedAt: string | null;
  };
  samples: Array<{ id: string; variantId: string; code: string | null; variantLabel: string; variantDescription: string }>;
  attrs: Array<{ id: string; name: string; scale: SensoryScale }>;
  seats: Array<{
    id: string; seatIndex: number; kind: SeatProgress['kind']; displayName: string; servingOrder: ServedCup[];
    consentedAt: string | null; submittedAt: string | null; lastSeenAt: string | null;
  }>;
}
export interface TrialTastingRow {
  id: string; trialId: string; title: string; method: TastingMethod; state: TastingState; seats: number; submitted: number; createdAt: string;
}
export interface TastingSummary {
  id: string;
  title: string;
  method: TastingMethod;
  state: TastingState;
  trial: { id: string; code: string; title: string };
  place: string | null;
  startsAt: string | null;
  seats: number;
  submitted: number;
  createdAt: string;
}
export interface MySeat {
  tastingId: string;
  title: string;
  place: string | null;
  startsAt: string | null;
  state: TastingState;
  submitted: boolean;
  /** Open and not yet submitted: the taster still has answers to give. */
  waiting: boolean;
}
