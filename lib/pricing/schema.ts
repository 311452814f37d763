/** Prices and packaging: the zod schemas shared by forms, actions, the API and the CSV import, and the plain types pages receive. */
import { z } from 'zod';
import { boundedNumber, id, isoDate, longText, name, noTinyAmount, text, wholeNumber } from '@/lib/input';
import { PACK_UNITS, PACKAGING_KINDS, PRICE_LIMITS, type PackagingKind } from './vocabulary';

/** A typed amount ("24.50"); whether its decimals suit the workspace currency is checked by lib/pricing/money.ts. */
const amount = text({ min: 1, max: 20, required: 'Give the price.' }).superRefine((value, ctx) => {
  if (value.startsWith('-')) ctx.addIssue({ code: 'custom', message: 'A price cannot be negative.' });
  else if (value && !/^\d+(?:[.,]\d+)?$/.test(value)) ctx.addIssue({ code: 'custom', message: 'Give the price as a number, e.g. 24.50.' });
});
const refusePct = noTinyAmount(boundedNumber('The refuse/trim share', 0, PRICE_LIMITS.maxRefusePct), 'The refuse/trim share', ' %');
const supplier = text({ max: PRICE_LIMITS.maxSupplierLength }).nullable().optional();

export const costSettingsSchema = z
  .object({
    currency: z.string({ error: 'Choose a currency.' }).regex(/^[A-Z]{3}$/, 'Choose a currency from the list.'),
    overfillPct: noTinyAmount(boundedNumber('The overfill', 0, PRICE_LIMITS.maxOverfillPct), 'The overfill', ' %'),
    costWarningPct: boundedNumber('The warning threshold', 0.1, PRICE_LIMITS.maxWarningPct),
  })
  .strict();
export type CostSettingsInput = z.infer<typeof costSettingsSchema>;

export const ingredientPriceSchema = z
  .object({
    ingredientId: id('Unknown ingredient.'),
    packPrice: amount,
    packSize: boundedNumber('The pack size', PRICE_LIMITS.minPackSizeG, PRICE_LIMITS.maxPackSizeG),
    packUnit: z.enum(PACK_UNITS, { error: 'Choose g, kg or lb.' }),
    supplier,
    validFrom: isoDate,
  })
  .strict();
export type IngredientPriceInput = z.infer<typeof ingredientPriceSchema>;

export const refuseSchema = z
  .object({
    ingredientId: id('Unknown ingredient.'),
    refusePct,
  })
  .strict();

/** The refuse/trim share alone, for the API path that names the ingredient. */
export const refuseBodySchema = z.object({ refusePct }).strict();

export const withdrawSchema = z
  .object({
    reason: longText(PRICE_LIMITS.maxReasonLength, { min: 3, required: 'Say why this price is withdrawn.' }),
  })
  .strict();

export const packagingItemSchema = z
  .object({
    name: name('Give the packaging item a name.'),
    kind: z.enum(PACKAGING_KINDS, { error: 'Choose what kind of packaging this is.' }),
  })
  .strict();
export type PackagingItemInput = z.infer<typeof packagingItemSchema>;

export const packagingPriceSchema = z
  .object({
    packagingItemId: id('Unknown packaging item.'),
    packPrice: amount,
    piecesPerPack: wholeNumber('Pieces per pack', 1, PRICE_LIMITS.maxPiecesPerPack),
    supplier,
    validFrom: isoDate,
  })
  .strict();
export type PackagingPriceInput = z.infer<typeof packagingPriceSchema>;

export const packFormatSchema = z
  .object({
    name: name('Give the pack format a name.'),
    netFillG: boundedNumber('The net fill', 1, PRICE_LIMITS.maxNetFillG),
    items: z
      .array(
        z
          .object({
            packagingItemId: id('Unknown packaging item.'),
            pieces: wholeNumber('Pieces', 1, PRICE_LIMITS.maxPiecesPerJar),
            perJars: wholeNumber('Jars', 1, PRICE_LIMITS.maxJarsPerPiece),
          })
          .strict(),
      )
      .max(PRICE_LIMITS.maxItemsPerFormat, `A pack format has at most ${PRICE_LIMITS.maxItemsPerFormat} packaging items.`)
      .superRefine((items, ctx) => {
        const seen = new Set<string>();
        items.forEach((item, i) => {
          if (seen.has(item.packagingItemId)) ctx.addIssue({ code: 'custom', path: [i, 'packagingItemId'], message: 'Each packaging item appears once; change its pieces instead.' });
          seen.add(item.packagingItemId);
        });
      }),
  })
  .strict();
export type PackFormatInput = z.infer<typeof packFormatSchema>;

/** Which pack format a formula or a production version is costed in (null: none). */
export const packFormatChoiceSchema = z.object({ packFormatId: id('Unknown pack format.').nullable() }).strict();

/** The price lists' query: the day whose prices to show (default today). */
export const priceListQuerySchema = z.object({ asOf: isoDate.optional() });

export const priceImportSchema = z.object({ csv: z.string().max(1_000_000, 'The file is too large (1 MB at most).') }).strict();

export interface CostSettingsView {
  /** null until an admin chooses it; no price can be entered before. */
  currency: string | null;
  overfillPct: number;
  costWarningPct: number;
}

export interface PricePointView {
  id: string;
  validFrom: string;
  packPriceMinor: number;
  packSizeG: number;
  supplier: string | null;
  enteredAt: string;
  enteredByName: string;
  withdrawnAt: string | null;
  withdrawnByName: string | null;
  withdrawReason: string | null;
}

export interface PackagingPricePointView extends Omit<PricePointView, 'packSizeG'> {
  piecesPerPack: number;
}

export interface IngredientPriceRow {
  ingredientId: string;
  name: string;
  kind: string;
  refusePct: number;
  archived: boolean;
  /** The point in force today, or null when none is known. */
  current: { validFrom: string; packPriceMinor: number; packSizeG: number; supplier: string | null } | null;
  points: number;
}

export interface PackagingItemRow {
  id: string;
  name: string;
  kind: PackagingKind;
  archived: boolean;
  current: { validFrom: string; packPriceMinor: number; piecesPerPack: number; supplier: string | null } | null;
  points: number;
}

export interface PackFormatView {
  id: string;
  name: string;
  netFillG: number;
  archived: boolean;
  items: { packagingItemId: string; name: string; kind: PackagingKind; pieces: number; perJars: number }[];
}
