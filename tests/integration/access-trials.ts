/** Authorisation-table rows for trials, variants and cooks (merged into access-table.ts). */
import type { ActionCase, RouteCase } from './access-table';
import { createFixtureFormula } from './fixtures';
import { createTrial, planVariants } from '@/lib/trials/mutations';
import { getEm } from '@/lib/db';
import { Variant } from '@/entities';
import { actorOf, type WorkspaceFixture } from './harness';
import type { Role } from '@/lib/permissions';

const READ: Role[] = ['admin', 'developer', 'head_of_product'];
const WRITE: Role[] = ['admin', 'developer'];

export async function trialWithVariants(a: WorkspaceFixture): Promise<{ trialId: string; baseId: string; otherId: string }> {
  const formulaId = await createFixtureFormula(a);
  const actor = actorOf(a, 'developer');
  const { trialId } = await createTrial(actor, { title: 'Matrix trial', question: 'Who may see this?', formulaId });
  await planVariants(actor, trialId, { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1 }], centrePoint: false });
  const em = await getEm();
  const variants = await em.find(Variant, { trial: trialId }, { orderBy: { position: 'asc' } });
  return { trialId, baseId: variants[0].id, otherId: variants[1].id };
}

const cook = (variantId: string) => ({ variantId, cookDate: '2026-11-20', brixReading: 64.5, brixSampleTempC: 18, ph: 3.2, yieldG: 1500 });

/** A trial with one cook recorded, as the params of the cook's routes. */
async function recordedCook(a: WorkspaceFixture): Promise<{ trialId: string; cookId: string }> {
  const t = await trialWithVariants(a);
  const { recordCook } = await import('@/lib/trials/mutations');
  const { cookId } = await recordCook(actorOf(a, 'developer'), t.trialId, cook(t.otherId));
  return { trialId: t.trialId, cookId };
}

export const TRIALS_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/trials', allowed: READ, otherWorkspace: 'own-data' },
  {
    route: 'POST /api/v1/trials',
    allowed: WRITE,
    otherWorkspace: 422,
    prepare: async (a) => ({ body: { title: 'Matrix', question: 'Q', formulaId: await createFixtureFormula(a) } }),
  },
  { route: 'GET /api/v1/trials/[trialId]', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId } }) },
  {
    route: 'POST /api/v1/trials/[trialId]/status',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId }, body: { to: 'cooking' } }),
  },
  {
    route: 'POST /api/v1/trials/[trialId]/plan',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => ({
      params: { trialId: (await trialWithVariants(a)).trialId },
      body: { kind: 'full_factorial', factors: [{ factor: 'acid_dose', low: 2, high: 6 }], centrePoint: false },
    }),
  },
  { route: 'GET /api/v1/trials/[trialId]/variants', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId } }) },
  {
    route: 'POST /api/v1/trials/[trialId]/variants',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => {
      const t = await trialWithVariants(a);
      const em = await getEm();
      const base = await em.findOneOrFail(Variant, { id: t.baseId });
      return { params: { trialId: t.trialId }, body: { description: 'hand-made', lines: base.lines.map((l) => ({ ingredientId: l.ingredientId, quantity: l.quantity, unit: l.unit })) } };
    },
  },
  {
    route: 'DELETE /api/v1/trials/[trialId]/variants/[variantId]',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => {
      const t = await trialWithVariants(a);
      return { params: { trialId: t.trialId, variantId: t.otherId } };
    },
  },
  {
    route: 'GET /api/v1/trials/[trialId]/variants/[variantId]/label',
    allowed: READ,
    otherWorkspace: 404,
    prepare: async (a) => {
      const t = await trialWithVariants(a);
      return { params: { trialId: t.trialId, variantId: t.otherId } };
    },
  },
  { route: 'GET /api/v1/trials/[trialId]/cooks', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId } }) },
  {
    route: 'POST /api/v1/trials/[trialId]/cooks',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => {
      const t = await trialWithVariants(a);
      return { params: { trialId: t.trialId }, body: cook(t.otherId) };
    },
  },
  {
    route: 'PATCH /api/v1/trials/[trialId]/cooks/[cookId]',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: await recordedCook(a), body: { ph: 3.3, reason: 'Re-read after calibrating the meter.' } }),
  },
  {
    route: 'POST /api/v1/trials/[trialId]/cooks/[cookId]/withdraw',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: await recordedCook(a), body: { reason: 'Measured the wrong jar.' } }),
  },
  {
    route: 'POST /api/v1/trials/[trialId]/cooks/import',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId }, body: { csv: 'variant,cook_date,ph\nB,2026-11-20,3.2\n' } }),
  },
  { route: 'GET /api/v1/trials/[trialId]/export', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId } }) },
];

export const TRIALS_ACTION_CASES: ActionCase[] = [
  { action: 'lib/trials/actions.ts#createTrialAction', allowed: WRITE, otherWorkspace: 422, argsAsync: async (a) => [{ title: 'Matrix', question: 'Q', formulaId: await createFixtureFormula(a) }] },
  {
    action: 'lib/trials/actions.ts#createProposalTrialAction',
    allowed: WRITE,
    otherWorkspace: 422,
    argsAsync: async (a) => [{ formulaId: await createFixtureFormula(a), title: 'Matrix proposal', question: 'Q', points: [{ sugarRatio: 0.9, targetSolidsPct: 62 }] }],
  },
  { action: 'lib/trials/actions.ts#transitionTrialAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => [(await trialWithVariants(a)).trialId, { to: 'cooking' }] },
  {
    action: 'lib/trials/actions.ts#planVariantsAction',
    allowed: WRITE,
    otherWorkspace: 404,
    argsAsync: async (a) => [(await trialWithVariants(a)).trialId, { kind: 'full_factorial', factors: [{ factor: 'pectin_dose', low: 4, high: 8 }] }],
  },
  {
    action: 'lib/trials/actions.ts#addVariantAction',
    allowed: WRITE,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const t = await trialWithVariants(a);
      const base = await (await getEm()).findOneOrFail(Variant, { id: t.baseId });
      return [t.trialId, { description: 'hand-made', lines: base.lines.map((l) => ({ ingredientId: l.ingredientId, quantity: l.quantity, unit: l.unit })) }];
    },
  },
  { action: 'lib/trials/actions.ts#removeVariantAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => { const t = await trialWithVariants(a); return [t.trialId, t.otherId]; } },
  { action: 'lib/trials/actions.ts#recordCookAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => { const t = await trialWithVariants(a); return [t.trialId, cook(t.otherId)]; } },
  {
    action: 'lib/trials/actions.ts#correctCookAction',
    allowed: WRITE,
    otherWorkspace: 404,
    argsAsync: async (a) => { const c = await recordedCook(a); return [c.trialId, c.cookId, { ph: 3.3, reason: 'Re-read after calibrating the meter.' }]; },
  },
  {
    action: 'lib/trials/actions.ts#withdrawCookAction',
    allowed: WRITE,
    otherWorkspace: 404,
    argsAsync: async (a) => { const c = await recordedCook(a); return [c.trialId, c.cookId, { reason: 'Measured the wrong jar.' }]; },
  },
  { action: 'lib/trials/actions.ts#importCooksAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => [(await trialWithVariants(a)).trialId, 'variant,cook_date,ph\nB,2026-11-20,3.2\n'] },
];

