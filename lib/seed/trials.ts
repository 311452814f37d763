/**
 * Demo trials for Hollowmere Preserves, invented: a reduced-sugar apricot spread on the
 * panel and a blackcurrant jam still at the stove. Cook readings are made up near the
 * predictions, with the kind of scatter a small kitchen sees.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Formula } from '@/entities';
import { createTrial, planVariants, recordCook, transitionTrial } from '@/lib/trials/mutations';
import { listVariants } from '@/lib/trials/queries';
import type { Actor } from '@/lib/permissions';

/** Deterministic scatter so every seed run gives the same demo. */
function jitter(seed: number, spread: number): number {
  const x = Math.sin(seed * 12.9898) * 43758.5453;
  return (x - Math.floor(x) - 0.5) * 2 * spread;
}

export interface SeededTrial {
  trialId: string;
  variantIds: Record<string, string>;
}

async function cookAll(developer: Actor, trialId: string, labels: string[], day: string, setScores: Record<string, number>, phs: Record<string, number>) {
  const variants = await listVariants(developer, trialId);
  for (const [i, v] of variants.entries()) {
    if (!labels.includes(v.label) || !v.computation) continue;
    const mb = v.computation.massBalance;
    const batch = 3000;
    const scale = batch / mb.totalChargeG;
    await recordCook(developer, trialId, {
      variantId: v.id,
      cookDate: day,
      batchSizeG: batch,
      brixReading: Math.round((v.settings.targetSolidsPct + jitter(i + 1, 1.2)) * 10) / 10,
      brixSampleTempC: 18 + Math.round(jitter(i + 7, 2) * 10) / 10,
      ph: phs[v.label] ?? 3.2,
      endPointTempC: Math.round((v.computation.endPoint.endPointC + jitter(i + 3, 0.6)) * 10) / 10,
      boilTimeMin: Math.round(14 + jitter(i + 5, 4)),
      setTestScore: setScores[v.label] ?? 3,
      setTestMethod: 'cold_plate',
      syneresis: (setScores[v.label] ?? 3) <= 2 ? 'slight' : 'none',
      colourNotes: i % 2 ? 'Bright, clear' : 'Slightly darker at the edges of the pan',
      yieldJars: Math.floor((mb.finishedMassG * scale * (1 + jitter(i + 9, 0.03))) / v.settings.jarNetFillG),
      yieldG: Math.round(mb.finishedMassG * scale * (1 + jitter(i + 9, 0.03))),
      notes: null,
    });
  }
}

/**
 * The demo's cooks carry their story's days (12 Nov, 19 Nov, 2 Dec) but the rows are written today.
 * So that no trial starts after its own cooks, each trial is dated two days before its first cook,
 * with its variants; its move to the stove is dated the first cook day and its move to the panel the
 * last. Only ever earlier: a date already before its story day stays. (The formulas carry their
 * story's days from lib/seed/formulas.ts: revisions cannot be changed once written.)
 */
async function backdateToTheCooks(em: EntityManager, workspaceId: string) {
  const connection = em.getConnection();
  const cooks = `SELECT v.trial_id, min(m.cook_date) AS first_day, max(m.cook_date) AS last_day
                   FROM measurements m JOIN variants v ON v.id = m.variant_id
                  WHERE m.workspace_id = ? GROUP BY v.trial_id`;
  await connection.execute(
    `UPDATE trials t SET created_at = ((c.first_day - 2) + time '09:00') AT TIME ZONE 'UTC'
       FROM (${cooks}) c WHERE t.id = c.trial_id AND t.workspace_id = ? AND t.created_at > ((c.first_day - 2) + time '09:00') AT TIME ZONE 'UTC'`,
    [workspaceId, workspaceId],
  );
  await connection.execute(
    `UPDATE variants v SET created_at = t.created_at, updated_at = t.created_at
       FROM trials t WHERE v.trial_id = t.id AND t.workspace_id = ? AND v.created_at > t.created_at`,
    [workspaceId],
  );
  await connection.execute(
    `UPDATE trial_status_changes s
        SET changed_at = CASE WHEN s.to_status = 'cooking' THEN (c.first_day + time '08:00') AT TIME ZONE 'UTC'
                              WHEN s.to_status = 'tasting' THEN (c.last_day + time '17:00') AT TIME ZONE 'UTC'
                              ELSE t.created_at END
       FROM (${cooks}) c, trials t
      WHERE s.trial_id = c.trial_id AND t.id = c.trial_id AND t.workspace_id = ?
        AND (s.to_status IN ('cooking', 'tasting') OR s.from_status IS NULL)
        AND s.changed_at > t.created_at`,
    [workspaceId, workspaceId],
  );
}

export async function seedDemoTrials(em: EntityManager, developer: Actor): Promise<SeededTrial[]> {
  const formulas = await em.find(Formula, { workspace: developer.workspaceId });
  const byName = (name: string) => formulas.find((f) => f.name === name)!.id;
  const out: SeededTrial[] = [];

  const apricot = await createTrial(developer, {
    title: 'Apricot spread: how low can the sugar go?',
    question: 'Can the sugar ratio drop from 0.5 to 0.35 g per g of fruit and keep a spoonable set if the LM pectin goes up from 8 to 12 g per kg of fruit?',
    formulaId: byName('Apricot spread, reduced sugar'),
  });
  await planVariants(developer, apricot.trialId, {
    kind: 'full_factorial',
    factors: [{ factor: 'sugar_ratio', low: 0.35, high: 0.5 }, { factor: 'pectin_dose', low: 8, high: 12 }],
    centrePoint: false,
  });
  await transitionTrial(developer, apricot.trialId, 'cooking', 'All four corners cooked on one morning');
  await cookAll(developer, apricot.trialId, ['A', 'B', 'C', 'D', 'E'], '2026-11-12', { A: 4, B: 2, C: 3, D: 4, E: 5 }, { A: 3.6, B: 3.7, C: 3.6, D: 3.7, E: 3.6 });
  await transitionTrial(developer, apricot.trialId, 'tasting', 'Ready for the panel');

  const blackcurrant = await createTrial(developer, {
    title: 'Blackcurrant jam: firmer set with less pectin?',
    question: 'Blackcurrants carry their own pectin. Does dropping the added pectin to 2 g per kg of fruit, or raising the sugar ratio, change the set we get?',
    formulaId: byName('Blackcurrant jam'),
  });
  await planVariants(developer, blackcurrant.trialId, {
    kind: 'one_factor_at_a_time',
    factors: [{ factor: 'pectin_dose', low: 2, high: 5 }, { factor: 'sugar_ratio', low: 1.1, high: 1.3 }],
    centrePoint: false,
  });
  await transitionTrial(developer, blackcurrant.trialId, 'cooking');
  await cookAll(developer, blackcurrant.trialId, ['A', 'B', 'C'], '2026-11-19', { A: 4, B: 3, C: 4 }, { A: 3.0, B: 3.05, C: 2.95 });

  // At the stove: the base is cooked, the two variants are not yet (the developer's worklist shows them).
  const strawberry = await createTrial(developer, {
    title: 'Strawberry jam: less acid, same set?',
    question: 'Does cutting the citric acid to 3 g per kg of fruit keep a clean set and a brighter fruit flavour?',
    formulaId: byName('Hedgerow strawberry jam'),
  });
  await planVariants(developer, strawberry.trialId, { kind: 'one_factor_at_a_time', factors: [{ factor: 'acid_dose', low: 3, high: 5 }], centrePoint: false });
  await transitionTrial(developer, strawberry.trialId, 'cooking');
  await cookAll(developer, strawberry.trialId, ['A'], '2026-12-02', { A: 4 }, { A: 3.2 });

  await backdateToTheCooks(em, developer.workspaceId);

  for (const t of [apricot, blackcurrant]) {
    const variants = await listVariants(developer, t.trialId);
    out.push({ trialId: t.trialId, variantIds: Object.fromEntries(variants.map((v) => [v.label, v.id])) });
  }
  return out;
}
