/** Everything the head of product weighs for one trial, assembled from the trial, its cooks and its tastings. */
import { getEm } from '@/lib/db';
import { Trial, User } from '@/entities';
import { inWorkspace, type Actor } from '@/lib/permissions';
import { getTrialOverview } from '@/lib/trials/queries';
import { listTrialTastings } from '@/lib/tastings/queries';
import { getTastingResults } from './queries';
import { compareVariants, type ComparedVariant, type SensoryMean } from './comparison';
import type { Verdict } from './analysis';

export interface TrialComparison {
  trial: Awaited<ReturnType<typeof getTrialOverview>>;
  sessions: Array<{ id: string; title: string; method: string; verdicts: Array<{ attribute: string; verdict: Verdict }> }>;
  means: SensoryMean[];
  variants: ComparedVariant[];
  effects: ReturnType<typeof compareVariants>['effects'];
  correlations: ReturnType<typeof compareVariants>['correlations'];
  recommendation: { variantId: string; label: string; rationale: string; byName: string; at: string } | null;
}

export async function getTrialComparison(actor: Actor, trialId: string): Promise<TrialComparison> {
  const trial = await getTrialOverview(actor, trialId);
  const sessions = (await listTrialTastings(actor, trialId)).filter((s) => s.seats > 0);
  const candidates: Array<SensoryMean & { n: number }> = [];
  const verdicts: TrialComparison['sessions'] = [];
  for (const s of sessions) {
    const { analysis } = await getTastingResults(actor, s.id);
    verdicts.push({
      id: s.id, title: s.title, method: s.method,
      verdicts: [
        ...analysis.attributes.map((a) => ({ attribute: a.attribute.name, verdict: a.verdict })),
        ...(analysis.triangle ? [{ attribute: 'Triangle test', verdict: analysis.triangle.verdict }] : []),
        ...(analysis.ranking ? [{ attribute: 'Ranking', verdict: analysis.ranking.verdict }] : []),
      ],
    });
    for (const a of analysis.attributes) {
      for (const d of a.descriptive) if (d.mean !== null) candidates.push({ attribute: a.attribute.name, label: d.label, mean: d.mean, n: d.n });
    }
  }
  // Across sessions, the mean from the most assessors wins: a quick look by two people does not
  // overrule a full panel.
  const means: SensoryMean[] = [];
  for (const c of [...candidates].sort((x, y) => y.n - x.n)) {
    if (!means.some((m) => m.attribute === c.attribute && m.label === c.label)) means.push({ attribute: c.attribute, label: c.label, mean: c.mean });
  }
  const variants: ComparedVariant[] = trial.variants.map((v) => {
    const cook = v.cooks.at(-1);
    const mass = cook?.comparison.rows.find((r) => r.key === 'finished_mass');
    return {
      label: v.label,
      factorLevels: Object.fromEntries(v.factorLevels.map((l) => [l.factor, l.value])),
      lab: {
        ph: cook?.ph ?? null,
        brix20: cook?.comparison.correctedBrix ?? cook?.brixReading ?? null,
        yieldRatio: mass && mass.measured !== null && mass.predicted ? mass.measured / mass.predicted : null,
      },
    };
  });
  const { effects, correlations } = compareVariants(variants, means);
  const em = await getEm();
  const row = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  let recommendation: TrialComparison['recommendation'] = null;
  if (row?.recommendedVariantId) {
    const v = trial.variants.find((x) => x.id === row.recommendedVariantId);
    const by = row.recommendedBy ? await em.findOne(User, { id: row.recommendedBy.id }) : null;
    if (v) recommendation = { variantId: v.id, label: v.label, rationale: row.recommendationRationale ?? '', byName: by?.name ?? '', at: row.recommendedAt?.toISOString() ?? '' };
  }
  return { trial, sessions: verdicts, means, variants, effects, correlations, recommendation };
}

