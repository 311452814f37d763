/** Cost views: plain objects for pages, the API and client components. Prices live in lib/pricing. */
import { z } from 'zod';
import { isoDate } from '@/lib/input';
import type { FormulaCost } from '@/lib/costing';
import type { IngredientPricePoint, PackagingPricePoint, PackFormatData } from '@/lib/costing/types';

/** `?asOf=YYYY-MM-DD` on cost reads; absent = today. */
export const costQuerySchema = z.object({ asOf: isoDate.optional() }).strict();
export type CostQuery = z.infer<typeof costQuerySchema>;

/** What the formula editor costs with, in the browser, on every keystroke: the prices on one day. */
export interface EditorCostBasis {
  /** Null until an admin picks the workspace's currency: then nothing is costed. */
  currency: string | null;
  asOf: string;
  overfillPct: number;
  ingredientPrices: IngredientPricePoint[];
  packagingPrices: PackagingPricePoint[];
  /** Refuse/trim % per ingredient id. */
  refuse: Array<[string, number]>;
  packFormats: PackFormatData[];
}

/** A cost or why there is none. */
export type CostResult = { ok: true; cost: FormulaCost } | { ok: false; message: string };

export interface VariantCost {
  variantId: string;
  label: string;
  result: CostResult;
}

export interface TrialCosts {
  currency: string | null;
  asOf: string;
  packFormat: { id: string; name: string } | null;
  variants: VariantCost[];
}

/** A version's cost as stored at approval: frozen, never recomputed. */
export interface FrozenCost {
  asOf: string;
  currency: string;
  packFormatName: string | null;
  batchMinor: number;
  perKgMinor: number;
  perJarMinor: number | null;
  complete: boolean;
  missing: string[];
}

export interface VersionCost {
  versionId: string;
  version: number;
  status: string;
  approvedAt: string;
  atApproval: FrozenCost | null;
  today: CostResult;
  /** Today's cost per jar against the one at approval, %; null when either is unknown or incomplete. */
  movedPct: number | null;
  /** True when |movedPct| exceeds the workspace threshold. */
  warn: boolean;
}

export interface ProductCosts {
  currency: string | null;
  asOf: string;
  warningPct: number;
  versions: VersionCost[];
}

export interface BatchCost {
  currency: string | null;
  /** The formula costed with the prices on the batch's day. */
  planned: CostResult;
  /** Jars that can be sold: none once the batch is rejected or discarded. */
  goodJars: number;
  /** Per good jar from the batch's charge and jars; null without a pack format or good jars. */
  actualPerJar: { minor: number; complete: boolean } | null;
}
