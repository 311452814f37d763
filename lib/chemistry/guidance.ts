import type { MassBalance } from './mass-balance';
import type { FormulaSettings } from './types';

export type CautionSeverity = 'info' | 'warning' | 'danger';

export interface Caution {
  code: string;
  severity: CautionSeverity;
  title: string;
  message: string;
  source: string;
}

/** Closing sentence of every food-safety caution. */
export const SAFETY_GOVERNANCE_SENTENCE = 'Local food-safety codes and licensed practice govern.';

function safety(message: string): string {
  return `${message} ${SAFETY_GOVERNANCE_SENTENCE}`;
}

export const HM_GEL_MIN_SOLIDS_PCT = 55;
export const HM_GEL_MAX_PH = 3.5;
export const SET_PH_MIN = 2.8;
export const SET_PH_MAX = 3.5;
/** Low end of the low-methoxyl setting range: LM pectin gels with calcium at pH 2.5–6.5, as the project's reference notes give it (they name no published source). */
export const LM_SET_PH_MIN = 2.5;
export const ACID_FOOD_MAX_PH = 4.6;
export const LOW_ACID_AW_LIMIT = 0.85;
export const HM_OPTIMUM = { phMin: 2.8, phMax: 3.3, solidsMinPct: 65, solidsMaxPct: 69 } as const;
/** Below this the product cannot rely on sugar alone to keep (EU and Codex 60 % floor). */
export const REDUCED_SUGAR_BELOW_PCT = 60;
/** Hot-fill guidance: fill at 85 °C or above. Common practice, no published source (memory). */
export const HOT_FILL_MIN_C = 85;
/** How a caution that rests on a rule of thumb names its source on screen. */
export const TRADE_PRACTICE_SOURCE = 'Usual trade practice';

/** How a product that sugar does not preserve is kept safe, as the developer states it. */
export const PRESERVATION_METHODS = ['heat_processed', 'preservative', 'chilled'] as const;
export type PreservationMethod = (typeof PRESERVATION_METHODS)[number];
export const PRESERVATION_LABELS: Record<PreservationMethod, string> = {
  heat_processed: 'A validated heat process in sealed jars',
  preservative: 'A permitted preservative',
  chilled: 'Kept chilled from filling to eating',
};

export interface GuidanceInput {
  /** `settings.preservation` is how a reduced-sugar product is kept, when the developer has said. */
  massBalance: Pick<MassBalance, 'lines' | 'targetSolidsPct' | 'waterToEvaporateG' | 'pectinRatedSugarCapacityG' | 'solubleSolidsInG'>;
  settings: FormulaSettings;
  /** Estimated water activity of the finished batch, if known. */
  aw?: number;
  /** A measured pH wins over the planned pH. */
  measuredPh?: number;
}

/**
 * The pH window in which the formula's pectin sets. High-methoxyl pectin (and a fruit's own pectin,
 * which is mostly high-methoxyl) needs acid: 2.8–3.5. Low-methoxyl pectin sets with calcium instead,
 * from pH 2.5 up; above 4.6 the acid-food limit, not the set, is what matters.
 */
export function setPhWindow(lines: Pick<MassBalance, 'lines'>['lines']): { min: number; max: number; lowMethoxylOnly: boolean } {
  const pectins = lines.filter((l) => l.ingredient.kind === 'pectin' && l.massG > 0).map((l) => l.ingredient.pectinType ?? '');
  const lowMethoxylOnly = pectins.length > 0 && pectins.every((t) => t.startsWith('lm'));
  return lowMethoxylOnly ? { min: LM_SET_PH_MIN, max: ACID_FOOD_MAX_PH, lowMethoxylOnly } : { min: SET_PH_MIN, max: SET_PH_MAX, lowMethoxylOnly };
}

/** Set and safety cautions for a batch. Hot filling is always noted because every batch is filled. */
export function buildGuidance(input: GuidanceInput): Caution[] {
  const { massBalance, settings } = input;
  const cautions: Caution[] = [];
  const pectins = massBalance.lines.filter((l) => l.ingredient.kind === 'pectin' && l.massG > 0);
  const hmPectin = pectins.some((l) => l.ingredient.pectinType === 'hm_rapid_set' || l.ingredient.pectinType === 'hm_slow_set');
  const lmPectin = pectins.some((l) => l.ingredient.pectinType === 'lm_conventional' || l.ingredient.pectinType === 'lm_amidated');
  const hasCalcium = massBalance.lines.some((l) => l.ingredient.calciumSource === true && l.massG > 0);
  const ph = input.measuredPh ?? settings.plannedPh;
  const phLabel = input.measuredPh !== undefined ? 'Measured' : 'Planned';
  const solids = massBalance.targetSolidsPct;

  if (hmPectin && solids <= HM_GEL_MIN_SOLIDS_PCT) {
    cautions.push({
      code: 'HM_PECTIN_SOLIDS_TOO_LOW',
      severity: 'warning',
      title: 'High-methoxyl pectin will not gel at this sugar level',
      message: `Target solids ${solids.toFixed(1)} % are not above ${HM_GEL_MIN_SOLIDS_PCT} %, the lower edge of the HM gel window. Raise the solids or use a low-methoxyl pectin with calcium.`,
      source: 'HM pectin gels at soluble solids > 55 % and pH < 3.5; McGee, On Food and Cooking (2004): pH 2.8–3.5, sugar 60–65 %',
    });
  }
  if (hmPectin && ph !== undefined && ph >= HM_GEL_MAX_PH) {
    cautions.push({
      code: 'HM_PECTIN_PH_TOO_HIGH',
      severity: 'warning',
      title: 'pH too high for a high-methoxyl set',
      message: `${phLabel} pH ${ph.toFixed(2)} is not below ${HM_GEL_MAX_PH}. Add acid or the batch may not set.`,
      source: 'HM pectin gels at pH < 3.5; McGee, On Food and Cooking (2004)',
    });
  }
  if (hmPectin && solids > HM_GEL_MIN_SOLIDS_PCT &&
      (solids < HM_OPTIMUM.solidsMinPct || solids > HM_OPTIMUM.solidsMaxPct ||
       (ph !== undefined && (ph < HM_OPTIMUM.phMin || ph > HM_OPTIMUM.phMax)))) {
    cautions.push({
      code: 'HM_PECTIN_OUTSIDE_OPTIMUM',
      severity: 'info',
      title: 'Outside the usual HM optimum',
      message: `A set is most reliable at pH ${HM_OPTIMUM.phMin}–${HM_OPTIMUM.phMax} with ${HM_OPTIMUM.solidsMinPct}–${HM_OPTIMUM.solidsMaxPct} % final sugar.`,
      // Common practice, no published source.
      source: TRADE_PRACTICE_SOURCE,
    });
  }
  if (lmPectin && !hasCalcium) {
    cautions.push({
      code: 'LM_PECTIN_NO_CALCIUM',
      severity: 'warning',
      title: 'Low-methoxyl pectin without a calcium source',
      message: 'LM pectin gels with calcium, not with sugar and acid. Add a calcium salt unless the fruit or water is known to supply enough.',
      source: 'LM pectin gels with calcium from 10–80 % solids, pH 2.5–6.5',
    });
  }
  // One caution per cause: an HM pectin at too high a pH already has its own warning above.
  const window = setPhWindow(massBalance.lines);
  if (ph !== undefined && (ph < window.min || (ph > window.max && !window.lowMethoxylOnly && !(hmPectin && ph >= HM_GEL_MAX_PH)))) {
    cautions.push(window.lowMethoxylOnly
      ? {
          code: 'PH_OUTSIDE_SET_RANGE',
          severity: 'warning',
          title: 'pH below the setting range',
          message: `${phLabel} pH ${ph.toFixed(2)} is below ${window.min}, where even a low-methoxyl pectin with calcium sets poorly and the gel weeps (syneresis).`,
          source: 'LM pectin gels with calcium from 10–80 % solids, pH 2.5–6.5',
        }
      : {
          code: 'PH_OUTSIDE_SET_RANGE',
          severity: 'warning',
          title: 'pH outside the setting range',
          message: `${phLabel} pH ${ph.toFixed(2)} is outside ${window.min}–${window.max}. Below it the gel weeps (syneresis); above it the fruit's own and any high-methoxyl pectin will not set.`,
          source: 'McGee, On Food and Cooking (2004): HM pectin gels at pH 2.8–3.5',
        });
  }
  // Graded by what is known: DANGER only where a limit is crossed; an unknown pH is asked for, not alarmed on.
  if (ph === undefined) {
    cautions.push({
      code: 'PH_NOT_GIVEN',
      severity: 'info',
      title: 'Give a planned pH',
      message: safety(`Whether this product keeps depends on its acidity: at pH ${ACID_FOOD_MAX_PH} or below it is an acid food${input.aw !== undefined && input.aw > LOW_ACID_AW_LIMIT ? ` (its estimated water activity, ${input.aw.toFixed(3)}, is above ${LOW_ACID_AW_LIMIT}, so sugar alone does not keep it)` : ''}. Enter the planned pH to see the safety notes that apply, and measure it on every cook.`),
      source: '21 CFR 114.3 (acid foods: equilibrium pH 4.6 or below)',
    });
  } else if (ph > ACID_FOOD_MAX_PH) {
    cautions.push({
      code: 'PH_ABOVE_4_6',
      severity: 'danger',
      title: 'pH above 4.6: not an acid food',
      message: safety(`${phLabel} pH ${ph.toFixed(2)} is above 4.6. A food above pH 4.6 is treated as low-acid (where aw is above 0.85${input.aw !== undefined ? `; the estimate here is ${input.aw.toFixed(3)}` : ''}) and can support Clostridium botulinum; it needs acidification to pH 4.6 or below or a validated low-acid process.`),
      source: '21 CFR 114.3 (acid foods: equilibrium pH 4.6 or below)',
    });
  } else if (input.aw !== undefined && input.aw > LOW_ACID_AW_LIMIT) {
    cautions.push({
      code: 'ACID_PRESERVED',
      severity: 'info',
      title: 'Kept by its acidity, not by sugar alone',
      message: safety(`Estimated water activity ${input.aw.toFixed(3)} is above 0.85, so sugar alone does not make the product keep; at ${phLabel.toLowerCase()} pH ${ph.toFixed(2)} (4.6 or below) it is an acid food, kept safe by that acidity together with hot filling and sealing. Check the pH of every batch. Yeasts grow down to about aw 0.88 and most moulds to 0.80, so an opened jar spoils: keep it cool. The water activity is a model estimate, not a measurement.`),
      source: '21 CFR 114.3 (acid foods: pH 4.6 or below; low-acid foods: pH above 4.6 and aw above 0.85); Beuchat (1981) growth limits',
    });
  }
  if (settings.productClass === 'reduced_sugar_spread' || solids < REDUCED_SUGAR_BELOW_PCT) {
    const stated = settings.preservation;
    cautions.push(stated
      ? {
          code: 'REDUCED_SUGAR',
          severity: 'warning',
          title: 'Reduced sugar: refrigerate after opening',
          message: safety(`At ${solids.toFixed(1)} % solids sugar does not preserve the product. Stated preservation: ${PRESERVATION_LABELS[stated].toLowerCase()}. It still needs a "keep refrigerated after opening" label and a shorter shelf life.`),
          source: 'Council Directive 2001/113/EC, Annex I and CXS 296-2009 (60 % soluble solids floor); Beuchat (1981) growth limits',
        }
      : {
          code: 'REDUCED_SUGAR',
          severity: 'danger',
          title: 'Reduced sugar with no preservation stated',
          message: safety(`At ${solids.toFixed(1)} % solids sugar does not preserve the product, and no other preservation is stated. It needs a validated heat process in sealed jars (or a permitted preservative, or the chill chain) and must be kept refrigerated after opening. State the preservation in the formula settings.`),
          source: 'Council Directive 2001/113/EC, Annex I and CXS 296-2009 (60 % soluble solids floor); Beuchat (1981) growth limits',
        });
  }
  if (massBalance.waterToEvaporateG < 0) {
    cautions.push({
      code: 'TARGET_BELOW_CHARGE_SOLIDS',
      severity: 'info',
      title: 'The charge is already above the target solids',
      message: `The raw charge has more soluble solids than the target; about ${Math.abs(massBalance.waterToEvaporateG).toFixed(0)} g of water would have to be added, not boiled off.`,
      source: 'Mass balance: finished mass = soluble solids ÷ target solids fraction',
    });
  }
  if (massBalance.pectinRatedSugarCapacityG > 0 && massBalance.pectinRatedSugarCapacityG < massBalance.solubleSolidsInG) {
    cautions.push({
      code: 'PECTIN_BELOW_GRADE_DOSE',
      severity: 'info',
      title: 'Less pectin than its grade calls for',
      message: `The pectin is rated to set ${massBalance.pectinRatedSugarCapacityG.toFixed(0)} g of sugar; the batch holds ${massBalance.solubleSolidsInG.toFixed(0)} g of solids. Fruit pectin may make up the difference.`,
      source: 'Pectin grade: grade 150 means 1 g of pectin sets 150 g of sugar at 65 % solids and optimum pH',
    });
  }
  cautions.push({
    code: 'HOT_FILL',
    severity: 'info',
    title: 'Hot filling',
    message: safety(`Fill at ${HOT_FILL_MIN_C} °C or above into clean, hot jars and seal at once. Hot filling does not by itself sterilise the product or the headspace: use sound closures and, for home canning, a tested boiling-water process.`),
    // Common practice, no published source.
    source: TRADE_PRACTICE_SOURCE,
  });
  return cautions;
}
