/** Price points as screens show them: amounts with the currency stated, pack sizes in the reader's units, per-kg and per-piece figures. Pure. */
import { formatMoney } from './money';
import type { PackagingPricePointView, PricePointView } from './schema';

const GRAMS_PER_LB = 453.59237;

export function packSizeText(grams: number, massUnits: 'metric' | 'imperial'): string {
  if (massUnits === 'imperial') return `${+(grams / GRAMS_PER_LB).toFixed(3)} lb`;
  return grams >= 1000 ? `${+(grams / 1000).toFixed(3)} kg` : `${+grams.toFixed(3)} g`;
}

/** At most this many digits past the minor unit: a price per kg of mains water (GBP 2.10 per 1000 kg) needs two. */
const MAX_EXTRA_DIGITS = 4;

/**
 * A price per unit (minor units, unrounded) for a screen: a price of 0 says "no cost"; one that the
 * currency's minor unit would round to 0.00 keeps two significant digits ("GBP 0.0021"), never a false zero.
 */
export function unitPriceText(minor: number, currency: string): string {
  if (minor === 0) return 'no cost';
  const extra = Math.abs(minor) >= 0.5 ? 0 : Math.min(MAX_EXTRA_DIGITS, Math.ceil(-Math.log10(Math.abs(minor))) + 1);
  return formatMoney(minor, currency, extra);
}

/** The price of 1 kg (or 1 lb) bought, from a pack's price and size. */
export function perMassText(packPriceMinor: number, packSizeG: number, currency: string, massUnits: 'metric' | 'imperial'): string {
  const per = massUnits === 'imperial' ? GRAMS_PER_LB : 1000;
  const price = unitPriceText((packPriceMinor / packSizeG) * per, currency);
  return packPriceMinor === 0 ? price : `${price} per ${massUnits === 'imperial' ? 'lb' : 'kg'}`;
}

export function perPieceText(packPriceMinor: number, piecesPerPack: number, currency: string): string {
  return `${formatMoney(packPriceMinor / piecesPerPack, currency, 2)} each`;
}

type Row = {
  id: string; validFrom: string; price: string; pack: string; unitPrice: string; supplier: string | null; entered: string; enteredByName: string;
  withdrawn: { at: string; by: string | null; reason: string | null } | null; current: boolean;
};

function base(p: Omit<PricePointView, 'packSizeG'>, currency: string, currentId: string | undefined) {
  return {
    id: p.id, validFrom: p.validFrom, price: formatMoney(p.packPriceMinor, currency), supplier: p.supplier, entered: p.enteredAt, enteredByName: p.enteredByName,
    withdrawn: p.withdrawnAt ? { at: p.withdrawnAt, by: p.withdrawnByName, reason: p.withdrawReason } : null, current: p.id === currentId,
  };
}

/** The point in force today among a history (newest first): the first one that counts and has begun. */
function currentOf(points: Array<{ id: string; validFrom: string; withdrawnAt: string | null }>, today: string): string | undefined {
  return points.find((p) => !p.withdrawnAt && p.validFrom <= today)?.id;
}

export function ingredientHistoryRows(points: PricePointView[], currency: string, massUnits: 'metric' | 'imperial', today: string): Row[] {
  const current = currentOf(points, today);
  return points.map((p) => ({ ...base(p, currency, current), pack: packSizeText(p.packSizeG, massUnits), unitPrice: perMassText(p.packPriceMinor, p.packSizeG, currency, massUnits) }));
}

export function packagingHistoryRows(points: PackagingPricePointView[], currency: string, today: string): Row[] {
  const current = currentOf(points, today);
  return points.map((p) => ({ ...base(p, currency, current), pack: `${p.piecesPerPack} pieces`, unitPrice: perPieceText(p.packPriceMinor, p.piecesPerPack, currency) }));
}
