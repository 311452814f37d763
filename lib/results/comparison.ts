/**
 * A trial's variants side by side with their sensory means, factor effects and the
 * correlation of lab measurements with what tasters said. Pure: built on lib/stats.
 */
import { estimateFactorEffects, pearsonCorrelation, type CorrelationResult, type FactorEffectsResult } from '@/lib/stats';

export interface ComparedVariant {
  label: string;
  factorLevels: Record<string, number>;
  /** Lab values of the latest cook, where measured. */
  lab: { ph: number | null; brix20: number | null; yieldRatio: number | null };
}

export interface SensoryMean {
  attribute: string;
  label: string;
  mean: number;
}

export interface FactorEffectsByAttribute {
  attribute: string;
  result: FactorEffectsResult;
}

export interface LabCorrelation {
  attribute: string;
  measure: 'ph' | 'brix20' | 'yieldRatio';
  result: CorrelationResult;
}

export const LAB_MEASURE_LABELS = { ph: 'pH', brix20: 'Brix at 20 °C', yieldRatio: 'Yield ÷ predicted' } as const;

function joinNames(names: string[]): string {
  return names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

/**
 * One sentence per alias group, in the page's words: which factors moved together, that their effects
 * cannot be split, and what would split them. `nameOf` turns a factor key into its label.
 */
export function describeAliasing(groups: readonly string[][], nameOf: (factor: string) => string): string[] {
  return groups.map((group) => {
    const names = group.map((factor, i) => (i === 0 ? nameOf(factor) : nameOf(factor).toLowerCase()));
    return `${joinNames(names)} changed together in the variants tasted, so their effects cannot be separated: taste a variant that changes one of them alone to tell them apart.`;
  });
}

export function compareVariants(variants: ComparedVariant[], means: SensoryMean[]): { effects: FactorEffectsByAttribute[]; correlations: LabCorrelation[] } {
  const attributes = [...new Set(means.map((m) => m.attribute))];
  const factors = [...new Set(variants.flatMap((v) => Object.keys(v.factorLevels)))];
  const mean = (attribute: string, label: string) => means.find((m) => m.attribute === attribute && m.label === label)?.mean;
  const effects = factors.length
    ? attributes.map((attribute) => ({
        attribute,
        result: estimateFactorEffects(
          factors,
          variants.flatMap((v) => {
            const y = mean(attribute, v.label);
            return y === undefined || factors.some((f) => v.factorLevels[f] === undefined) ? [] : [{ label: v.label, levels: v.factorLevels, responses: [y] }];
          }),
        ),
      }))
    : [];
  const correlations: LabCorrelation[] = [];
  for (const attribute of attributes) {
    for (const measure of ['ph', 'brix20', 'yieldRatio'] as const) {
      const pairs = variants.map((v) => ({ x: v.lab[measure], y: mean(attribute, v.label) ?? null }));
      if (pairs.filter((p) => p.x !== null && p.y !== null).length < 3) continue;
      correlations.push({ attribute, measure, result: pearsonCorrelation(pairs) });
    }
  }
  return { effects, correlations };
}
