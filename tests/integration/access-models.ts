/**
 * Authorisation-table rows for the models (merged into access-table.ts), and the fixture they need:
 * a product family in the workspace with ten cooked variants (a 2³ factorial over sugar, pectin and
 * acid with the base and a centre point), enough for a main-effects model of the lab measures.
 */
import type { RouteCase } from './access-table';
import type { WorkspaceFixture } from './harness';
import { actorOf } from './harness';
import type { Role } from '@/lib/permissions';
import { createFixtureFormula } from './fixtures';
import { createTrial, planVariants, recordCook } from '@/lib/trials/mutations';
import { listVariants } from '@/lib/trials/queries';
import { familyOfFormula, modelDataset } from '@/lib/modelling/queries';

const MODELS: Role[] = ['admin', 'developer', 'head_of_product'];

const families = new Map<string, Promise<{ slug: string; centre: Record<string, number>; ranges: Array<{ name: string; low: number; high: number }> }>>();

/** One cooked family per workspace (built once, shared by every row). */
export function modelFamily(a: WorkspaceFixture) {
  let family = families.get(a.workspaceId);
  if (!family) {
    family = (async () => {
      const actor = actorOf(a, 'developer');
      const formulaId = await createFixtureFormula(a);
      const { trialId } = await createTrial(actor, { title: 'Model fixture', question: 'How do sugar, pectin and acid move the pH and the set?', formulaId });
      await planVariants(actor, trialId, {
        kind: 'full_factorial',
        factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1 }, { factor: 'pectin_dose', low: 5, high: 9 }, { factor: 'acid_dose', low: 3, high: 7 }],
        centrePoint: true,
      });
      const variants = await listVariants(actor, trialId);
      for (const [i, v] of variants.entries()) {
        const acid = v.factorLevels.find((l) => l.factor === 'acid_dose')?.coded ?? 0;
        const pectin = v.factorLevels.find((l) => l.factor === 'pectin_dose')?.coded ?? 0;
        await recordCook(actor, trialId, {
          variantId: v.id, cookDate: '2026-10-01', brixReading: 64.5 + (i % 3) * 0.3, brixSampleTempC: 20,
          ph: Math.round((3.2 - 0.12 * acid + 0.02 * ((i * 7) % 5 - 2)) * 100) / 100, setTestScore: Math.max(1, Math.min(5, Math.round(3 + pectin + ((i * 3) % 3 - 1) * 0.4))),
        });
      }
      const info = (await familyOfFormula(actor, formulaId))!;
      const dataset = await modelDataset(actor, { family: info });
      const factors = ['sugarRatio', 'targetSolidsPct', 'pectinPct', 'acidPct'] as const;
      const ranges = factors
        .map((name) => ({ name, low: Math.min(...dataset.rows.map((r) => r.factors[name])), high: Math.max(...dataset.rows.map((r) => r.factors[name])) }))
        .filter((r) => r.high > r.low);
      const centre = Object.fromEntries(ranges.map((r) => [r.name, (r.low + r.high) / 2]));
      return { slug: info.slug, centre, ranges };
    })();
    families.set(a.workspaceId, family);
  }
  return family;
}

const params = async (a: WorkspaceFixture) => ({ family: (await modelFamily(a)).slug });

export const MODELS_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/models', allowed: MODELS, otherWorkspace: 'own-data' },
  { route: 'GET /api/v1/models/[family]/dataset', allowed: MODELS, otherWorkspace: 404, prepare: async (a) => ({ params: await params(a) }) },
  { route: 'GET /api/v1/models/[family]/dataset.csv', allowed: MODELS, otherWorkspace: 404, prepare: async (a) => ({ params: await params(a) }) },
  {
    route: 'GET /api/v1/models/[family]/coefficients.csv',
    allowed: MODELS,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: await params(a) }),
  },
  { route: 'POST /api/v1/models/[family]/fit', allowed: MODELS, otherWorkspace: 404, prepare: async (a) => ({ params: await params(a), body: { kind: 'main_effects' } }) },
  {
    route: 'POST /api/v1/models/[family]/predict',
    allowed: MODELS,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: await params(a), body: { point: (await modelFamily(a)).centre, options: { kind: 'main_effects' } } }),
  },
  {
    route: 'POST /api/v1/models/[family]/optimise',
    allowed: MODELS,
    otherWorkspace: 404,
    prepare: async (a) => {
      const family = await modelFamily(a);
      return {
        params: { family: family.slug },
        body: {
          factors: family.ranges,
          goals: [{ response: 'lab:setTest', goal: { kind: 'maximise', low: 2, high: 5 } }],
          constraints: { ph: { low: 2.8, high: 3.6 } },
          proposals: 1,
          options: { kind: 'main_effects' },
        },
      };
    },
  },
];
