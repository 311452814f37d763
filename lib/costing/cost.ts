/**
 * The cost of a formula on a date: raw materials per batch, per kg of finished product (after
 * evaporation, from the mass balance) and per jar with its packaging, each line's share, and how
 * much a 10 % price rise of each line moves the cost. Pure; figures are unrounded minor units
 * (money.ts rounds once, for display).
 *
 * A line whose price is not known on the date is unknown: it adds nothing to the known part of a
 * total, and the total says it is incomplete and names the line. Never a silent zero.
 */
import { priceOn } from './price-history';
import type { CostLineInput, IngredientPricePoint, PackagingPricePoint, PackFormatData } from './types';

export class CostingInputError extends Error {
  constructor(readonly field: string, message: string) {
    super(message);
    this.name = 'CostingInputError';
  }
}

export interface CostingInput {
  /** YYYY-MM-DD: the day whose prices apply. */
  asOf: string;
  lines: CostLineInput[];
  /** The charge's total mass and the finished mass after evaporation (lib/chemistry mass balance). */
  chargeG: number;
  finishedMassG: number;
  /** Without a pack format there is no cost per jar. */
  packFormat: PackFormatData | null;
  /**
   * The formula's own jar net fill (its settings), which the label's jar and serving counts use.
   * The cost per jar is for the pack format's jar; when the two differ the cost says so.
   */
  formulaJarFillG?: number;
  /** Filling overfill, % of the net fill (the workspace's setting). */
  overfillPct: number;
  /** Histories sorted by day (price-history.ts historiesBy), by ingredient id / packaging item id. */
  ingredientPrices: ReadonlyMap<string, readonly IngredientPricePoint[]>;
  packagingPrices: ReadonlyMap<string, readonly PackagingPricePoint[]>;
  /** The price rise the sensitivity rows show, % (default 10). */
  sensitivityStepPct?: number;
}

export interface PriceUsed {
  validFrom: string;
  supplier: string | null;
}

export interface IngredientCost {
  ingredientId: string;
  name: string;
  grams: number;
  refusePct: number;
  /** Mass to buy: grams ÷ (1 − refuse/100). */
  boughtG: number;
  price: (PriceUsed & { perKgMinor: number }) | null;
  batchMinor: number | null;
  perKgMinor: number | null;
  perJarMinor: number | null;
  /** % of the known cost per jar (per kg without a pack format). */
  sharePct: number | null;
}

export interface PackagingCost {
  packagingItemId: string;
  name: string;
  perJar: number;
  price: (PriceUsed & { unitMinor: number }) | null;
  perJarMinor: number | null;
  sharePct: number | null;
}

/** A total: the sum of the lines whose price is known, and whether that is all of them. */
export interface CostTotal {
  minor: number;
  complete: boolean;
}

export interface SensitivityRow {
  name: string;
  kind: 'ingredient' | 'packaging';
  /** What the cost per jar (per kg without a pack format) rises by when this line's price rises by stepPct. */
  deltaMinor: number;
}

export interface FillMismatch {
  packFormatNetFillG: number;
  formulaJarFillG: number;
}

export interface FormulaCost {
  asOf: string;
  ingredients: IngredientCost[];
  packaging: PackagingCost[];
  complete: boolean;
  /** Names of the lines without a price on the date, in formula order. */
  missing: string[];
  batch: CostTotal;
  perKg: CostTotal;
  /** Null without a pack format. */
  perJar: CostTotal | null;
  /** Product in one jar: net fill × (1 + overfill/100). */
  filledPerJarG: number | null;
  /** Jars (not rounded) from one batch at that fill. */
  jarsPerBatch: number | null;
  /** The pack format's net fill against the formula's jar fill, when they differ; otherwise null. */
  fillMismatch: FillMismatch | null;
  chargeG: number;
  finishedMassG: number;
  stepPct: number;
  /** Largest effect first; only priced lines. */
  sensitivity: SensitivityRow[];
}

function positive(value: number, field: string): number {
  if (!Number.isFinite(value) || value <= 0) throw new CostingInputError(field, `${field} must be a positive number`);
  return value;
}

function percent(value: number, field: string, max: number): number {
  if (!Number.isFinite(value) || value < 0 || value >= max) throw new CostingInputError(field, `${field} must be at least 0 and below ${max} %`);
  return value;
}

/** The mass to buy for `grams` after trimming away refusePct of it. */
export function boughtMassG(grams: number, refusePct: number): number {
  return grams / (1 - refusePct / 100);
}

export function costFormula(input: CostingInput): FormulaCost {
  const finishedMassG = positive(input.finishedMassG, 'finishedMassG');
  const chargeG = positive(input.chargeG, 'chargeG');
  const overfillPct = percent(input.overfillPct, 'overfillPct', 100);
  const stepPct = input.sensitivityStepPct ?? 10;
  const finishedKg = finishedMassG / 1000;
  const filledPerJarG = input.packFormat ? positive(input.packFormat.netFillG, 'packFormat.netFillG') * (1 + overfillPct / 100) : null;
  const missing: string[] = [];

  const ingredients: IngredientCost[] = input.lines.map((line, i) => {
    const grams = line.grams;
    if (!Number.isFinite(grams) || grams < 0) throw new CostingInputError(`lines.${i}.grams`, 'grams must be 0 or more');
    const refusePct = percent(line.refusePct, `lines.${i}.refusePct`, 100);
    const boughtG = boughtMassG(grams, refusePct);
    const point = priceOn(input.ingredientPrices.get(line.ingredientId) ?? [], input.asOf);
    if (!point || !(point.packSizeG > 0) || !Number.isFinite(point.packPriceMinor) || point.packPriceMinor < 0) {
      missing.push(line.name);
      return { ingredientId: line.ingredientId, name: line.name, grams, refusePct, boughtG, price: null, batchMinor: null, perKgMinor: null, perJarMinor: null, sharePct: null };
    }
    const perGramMinor = point.packPriceMinor / point.packSizeG;
    const batchMinor = boughtG * perGramMinor;
    const perKgMinor = batchMinor / finishedKg;
    return {
      ingredientId: line.ingredientId,
      name: line.name,
      grams,
      refusePct,
      boughtG,
      price: { validFrom: point.validFrom, supplier: point.supplier, perKgMinor: perGramMinor * 1000 },
      batchMinor,
      perKgMinor,
      perJarMinor: filledPerJarG === null ? null : (batchMinor / finishedMassG) * filledPerJarG,
      sharePct: null,
    };
  });

  const packaging: PackagingCost[] = (input.packFormat?.items ?? []).map((item, i) => {
    const perJar = item.perJar;
    if (!Number.isFinite(perJar) || perJar < 0) throw new CostingInputError(`packFormat.items.${i}.perJar`, 'pieces per jar must be 0 or more');
    const point = priceOn(input.packagingPrices.get(item.packagingItemId) ?? [], input.asOf);
    if (!point || !Number.isFinite(point.unitPriceMinor) || point.unitPriceMinor < 0) {
      missing.push(item.name);
      return { packagingItemId: item.packagingItemId, name: item.name, perJar, price: null, perJarMinor: null, sharePct: null };
    }
    return {
      packagingItemId: item.packagingItemId,
      name: item.name,
      perJar,
      price: { validFrom: point.validFrom, supplier: point.supplier, unitMinor: point.unitPriceMinor },
      perJarMinor: point.unitPriceMinor * perJar,
      sharePct: null,
    };
  });

  const complete = missing.length === 0;
  const batchMinor = sum(ingredients.map((l) => l.batchMinor));
  const batch: CostTotal = { minor: batchMinor, complete: ingredients.every((l) => l.price !== null) };
  const perKg: CostTotal = { minor: batchMinor / finishedKg, complete: batch.complete };
  const perJar: CostTotal | null =
    filledPerJarG === null ? null : { minor: sum(ingredients.map((l) => l.perJarMinor)) + sum(packaging.map((p) => p.perJarMinor)), complete };

  // Shares and sensitivity are of the figure a buyer looks at: per jar when there is a jar.
  const basis = perJar ? perJar.minor : perKg.minor;
  const lineFigure = (l: IngredientCost) => (perJar ? l.perJarMinor : l.perKgMinor);
  for (const l of ingredients) l.sharePct = share(lineFigure(l), basis);
  for (const p of packaging) p.sharePct = perJar ? share(p.perJarMinor, basis) : null;

  const sensitivity: SensitivityRow[] = [
    ...ingredients.flatMap((l) => {
      const figure = lineFigure(l);
      return figure === null ? [] : [{ name: l.name, kind: 'ingredient' as const, deltaMinor: (figure * stepPct) / 100 }];
    }),
    ...(perJar ? packaging : []).flatMap((p) => (p.perJarMinor === null ? [] : [{ name: p.name, kind: 'packaging' as const, deltaMinor: (p.perJarMinor * stepPct) / 100 }])),
  ].sort((a, b) => b.deltaMinor - a.deltaMinor);

  return {
    asOf: input.asOf,
    ingredients,
    packaging,
    complete,
    missing,
    batch,
    perKg,
    perJar,
    filledPerJarG,
    jarsPerBatch: filledPerJarG === null ? null : finishedMassG / filledPerJarG,
    fillMismatch: fillMismatchOf(input.packFormat, input.formulaJarFillG),
    chargeG,
    finishedMassG,
    stepPct,
    sensitivity,
  };
}

// Fills are entered in whole grams or converted from ounces: a difference under 0.05 g is the same jar.
const SAME_FILL_G = 0.05;

/** The pack format's fill against the formula's jar fill when they differ (see CostingInput.formulaJarFillG). */
export function fillMismatchOf(packFormat: Pick<PackFormatData, 'netFillG'> | null, formulaJarFillG: number | undefined): FillMismatch | null {
  if (!packFormat || formulaJarFillG === undefined || !Number.isFinite(formulaJarFillG)) return null;
  if (Math.abs(packFormat.netFillG - formulaJarFillG) < SAME_FILL_G) return null;
  return { packFormatNetFillG: packFormat.netFillG, formulaJarFillG };
}

/** The warning beside every cost per jar whose pack format fills another jar than the formula's. */
export function fillMismatchText(m: FillMismatch): string {
  const g = (v: number) => `${Number(v.toFixed(1))} g`;
  return `The pack format fills ${g(m.packFormatNetFillG)} jars, but the formula’s jar net fill is ${g(m.formulaJarFillG)} (the label and the jar count use ${g(m.formulaJarFillG)}). This cost per jar is for a ${g(m.packFormatNetFillG)} jar: pick a pack format that fills ${g(m.formulaJarFillG)}, or change the formula’s jar net fill.`;
}

function sum(values: Array<number | null>): number {
  let total = 0;
  for (const v of values) if (v !== null) total += v;
  return total;
}

function share(part: number | null, whole: number): number | null {
  return part === null || whole <= 0 ? null : (part / whole) * 100;
}

/**
 * What a recorded batch actually cost per good jar: the formula's raw materials scaled to the
 * batch's kettle charge, packaging for every jar filled (rejected jars used theirs too), divided by
 * the jars that passed. Null when no jar passed or without a pack format.
 */
export function batchActualCostPerJar(
  cost: FormulaCost,
  batch: { chargeG: number; jarsFilled: number; jarsRejected: number },
): CostTotal | null {
  const goodJars = batch.jarsFilled - batch.jarsRejected;
  if (!cost.perJar || goodJars <= 0 || !(batch.chargeG > 0)) return null;
  const rawMinor = cost.batch.minor * (batch.chargeG / cost.chargeG);
  const packagingMinor = sum(cost.packaging.map((p) => p.perJarMinor)) * batch.jarsFilled;
  return { minor: (rawMinor + packagingMinor) / goodJars, complete: cost.complete };
}

/** Relative change from `before` to `after`, % (null when `before` is not positive). */
export function changePct(before: number, after: number): number | null {
  return before > 0 ? ((after - before) / before) * 100 : null;
}
