/** Pricing's fixed words and limits, shared by entities, schemas and screens. Pure. */

/** What a packaging item is; screens show PACKAGING_KIND_LABELS. */
export const PACKAGING_KINDS = ['jar', 'lid', 'label', 'case', 'other'] as const;
export type PackagingKind = (typeof PACKAGING_KINDS)[number];
export const PACKAGING_KIND_LABELS: Record<PackagingKind, string> = {
  jar: 'Jar or container',
  lid: 'Lid or closure',
  label: 'Label',
  case: 'Case or tray',
  other: 'Other',
};

/** Mass units a pack size may be typed in; stored in grams. */
export const PACK_UNITS = ['g', 'kg', 'lb'] as const;
export type PackUnit = (typeof PACK_UNITS)[number];
/** Source: the international avoirdupois pound, defined as exactly 0.453 592 37 kg (International Yard and Pound Agreement, 1959). */
export const GRAMS_PER_UNIT: Record<PackUnit, number> = { g: 1, kg: 1000, lb: 453.59237 };

export const PRICE_LIMITS = {
  /** A pack price in minor units (ten million euros in cents); far below 2^53 and PostgreSQL's bigint. */
  maxPackPriceMinor: 1_000_000_000,
  /** 100 t: a bulk tanker, the largest pack a small producer buys. */
  maxPackSizeG: 100_000_000,
  minPackSizeG: 0.001,
  maxRefusePct: 95,
  maxOverfillPct: 50,
  maxWarningPct: 1000,
  maxPiecesPerPack: 1_000_000,
  maxNetFillG: 100_000,
  /** "1 per 12 jars"; a pallet share is the largest we expect. */
  maxJarsPerPiece: 10_000,
  maxPiecesPerJar: 100,
  maxItemsPerFormat: 20,
  maxCsvRows: 5000,
  maxSupplierLength: 120,
  maxReasonLength: 500,
} as const;
