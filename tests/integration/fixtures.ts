/** Records that several integration tests build on. */
import { getEm } from '@/lib/db';
import { starterIdsByKey } from '@/lib/ingredients/queries';
import { createFormula } from '@/lib/formulas/mutations';
import type { CreateFormulaInput } from '@/lib/formulas/schema';
import { actorOf, type WorkspaceFixture } from './harness';

/** The workspace's starter-library ids by their handbook key (strawberry, sucrose, …). */
export async function starterIds(fx: WorkspaceFixture): Promise<Record<string, string>> {
  return starterIdsByKey(await getEm(), fx.workspaceId);
}

/** A plain strawberry jam: 1000 g fruit, 1000 g sugar, 6 g pectin, 5.5 g citric acid. */
export async function strawberryJamInput(fx: WorkspaceFixture, overrides: Partial<CreateFormulaInput> = {}): Promise<CreateFormulaInput> {
  const ids = await starterIds(fx);
  return {
    name: 'Test strawberry jam',
    settings: { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-03-01', targetSolidsPct: 65, jarNetFillG: 340 },
    lines: [
      { ingredientId: ids.strawberry, quantity: 1000, unit: 'g' },
      { ingredientId: ids.sucrose, quantity: 1000, unit: 'g' },
      { ingredientId: ids.pectin_hm_rapid_150, quantity: 6, unit: 'g' },
      { ingredientId: ids.citric_acid_anhydrous, quantity: 5.5, unit: 'g' },
    ],
    ...overrides,
  };
}

export async function createFixtureFormula(fx: WorkspaceFixture): Promise<string> {
  const { formulaId } = await createFormula(actorOf(fx, 'developer'), await strawberryJamInput(fx));
  return formulaId;
}

/** A trial on the fixture formula, inserted directly (for features that hang records on a trial). */
export async function createFixtureTrial(fx: WorkspaceFixture): Promise<{ trialId: string; formulaId: string }> {
  const formulaId = await createFixtureFormula(fx);
  const em = await getEm();
  const { Trial } = await import('@/entities');
  const max = (await em.find(Trial, { workspace: fx.workspaceId }, { orderBy: { number: 'desc' }, limit: 1 }))[0]?.number ?? 0;
  const trial = em.create(Trial, {
    workspace: fx.workspaceId,
    number: max + 1,
    title: 'Fixture trial',
    question: 'Does less sugar still set?',
    owner: fx.people.developer.userId,
    baseFormula: formulaId,
    baseRevision: 1,
  } as never) as unknown as { id: string };
  await em.flush();
  return { trialId: trial.id, formulaId };
}
