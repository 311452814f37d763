import { describeAliasing, type FactorEffectsByAttribute } from '@/lib/results/comparison';
import { formatP } from '@/lib/results/words';
import { FACTOR_LABELS, type TrialFactor } from '@/lib/trials/vocabulary';
import { CountChart } from './Charts';

const n2 = (x: number | null) => (x === null || !Number.isFinite(x) ? '—' : x.toFixed(2));
const factorName = (factor: string) => FACTOR_LABELS[factor as TrialFactor]?.name ?? factor;

/**
 * Main effects of the trial's factors on one attribute. Factors that moved together are not given an
 * effect each: the card says which ones cannot be separated.
 */
export function FactorEffectsCard({ effect }: { effect: FactorEffectsByAttribute }) {
  const { result } = effect;
  const estimable = result.effects.filter((x) => x.effectOverRange !== null);
  const aliasing = describeAliasing(result.aliasGroups, factorName);
  return (
    <div className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300" data-testid="factor-effects">
      <p className="font-medium">{effect.attribute}</p>
      {estimable.length ? (
        <CountChart label="Effect over the range" labels={estimable.map((x) => factorName(x.factor))} values={estimable.map((x) => x.effectOverRange ?? 0)} ariaLabel={`Factor effects on ${effect.attribute}`} />
      ) : null}
      <ul className="mt-2 space-y-0.5 text-xs text-rind-600">
        {result.effects.map((x) => (
          <li key={x.factor}>
            <span className="font-medium text-rind-800">{factorName(x.factor)}:</span>{' '}
            {x.aliasedWith.length
              ? `cannot be separated from ${x.aliasedWith.map((f) => factorName(f).toLowerCase()).join(' and ')}`
              : x.constant
                ? 'the same level in every variant tasted'
                : `${n2(x.effectOverRange)} ± ${n2(x.standardErrorOverRange)}${x.p !== null ? ` (${formatP(x.p)})` : ''}`}
          </li>
        ))}
      </ul>
      {aliasing.map((sentence) => <p key={sentence} className="mt-2 text-sm text-amberline-700" data-testid="aliasing">{sentence}</p>)}
      {result.message && !aliasing.length ? <p className="mt-1 text-xs text-amberline-700">{result.message}</p> : null}
    </div>
  );
}
