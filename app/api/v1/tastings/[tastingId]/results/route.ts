import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getTastingResults } from '@/lib/results/queries';

export const dynamic = 'force-dynamic';

/** The full analysis: descriptive statistics, blocked ANOVA, Tukey letters and each pair's p, penalty, triangle or Friedman, verdicts. */
export const GET = apiRoute<{ tastingId: string }>('tastings.read', async ({ actor, params }) => {
  const { analysis, session } = await getTastingResults(actor, uuidParam(params.tastingId, 'tasting'), { pairwiseP: true });
  return json({ session: { id: session.id, title: session.title, state: session.state, samples: session.samples }, analysis });
});
