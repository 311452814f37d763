/**
 * The modelling reads on the seeded demo: the apricot spread family's data set (the three history
 * trials plus the open reduced-sugar trial), its default models, and workspace scoping (the other
 * workspace sees none of it, and a formula of another workspace is a 404).
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { getEm } from '@/lib/db';
import { seedDemo } from '@/lib/seed/demo';
import { Formula, Cook, Trial } from '@/entities';
import { baseFormulaOfFamily, familyModel, familyOfFormula, listFamilies, modelDataset, proposalCostingOf } from '@/lib/modelling/queries';
import { costPerJarAt, formulaAtPoint } from '@/lib/modelling/proposals';
import { createFormula } from '@/lib/formulas/mutations';
import { createIngredient } from '@/lib/ingredients/mutations';
import { setFormulaPackFormat } from '@/lib/pricing/mutations';
import { packFormatOfFormulas } from '@/lib/pricing/queries';
import { fitFamilyModel, modelHistory } from '@/lib/modelling/fit';
import { predictResponse } from '@/lib/models';
import type { FamilyInfo } from '@/lib/modelling/schema';
import { optimiseFamily } from '@/lib/modelling/optimise';
import { User } from '@/entities';
import { DEMO_USERS } from '@/lib/seed/demo';
import { callRoute, sessionCookieFor, type Person } from './harness';
import * as predictRoute from '@/app/api/v1/models/[family]/predict/route';
import * as optimiseRoute from '@/app/api/v1/models/[family]/optimise/route';
import * as coefficientsRoute from '@/app/api/v1/models/[family]/coefficients.csv/route';

let workspaceId: string;
let otherWorkspaceId: string;
let apricot: FamilyInfo;

beforeAll(async () => {
  const report = await seedDemo((await getEm()).fork());
  workspaceId = report.workspaceId;
  otherWorkspaceId = report.otherWorkspaceId;
  const em = await getEm();
  const formula = await em.findOneOrFail(Formula, { workspace: workspaceId, name: 'Apricot spread, reduced sugar' });
  apricot = (await familyOfFormula({ workspaceId }, formula.id))!;
}, 600_000);

describe('the apricot spread family', () => {
  it('is the reduced-sugar spread of apricot, named for people', () => {
    expect(apricot.productClass).toBe('reduced_sugar_spread');
    expect(apricot.name).toBe('Apricot reduced-sugar spread');
    expect(apricot.slug).toBe(`reduced_sugar_spread.${apricot.fruitIngredientId}`);
  });

  it('pools the cooked variants of four trials, each with factors from its formula and its cooks and panel means', async () => {
    const dataset = await modelDataset({ workspaceId }, { family: apricot });
    // 3 history trials of 10 variants + the reduced-sugar trial's 5 cooked variants.
    expect(dataset.rows).toHaveLength(35);
    expect(new Set(dataset.rows.map((r) => r.trialId)).size).toBe(4);
    // Date order: the March screen first, the November trial last.
    expect(dataset.rows[0].trialDate).toBe('2026-03-11');
    expect(dataset.rows.at(-1)!.trialDate).toBe('2026-11-12');
    expect(dataset.rows.every((r) => r.pectinFamily === 'lm')).toBe(true);
    const centre = dataset.rows.find((r) => r.trialDate === '2026-03-11' && r.variantLabel === 'I')!;
    // Centre: 1000 g apricot, 400 g sugar, 10 g LM pectin, 1 g calcium citrate, 40 g lemon juice, 46 % target.
    expect(centre.factors.sugarRatio).toBeCloseTo(0.4, 12);
    expect(centre.factors.targetSolidsPct).toBe(46);
    const keys = dataset.responses.map((r) => r.key);
    expect(keys).toEqual(expect.arrayContaining(['lab:measuredSolids', 'lab:measuredPh', 'lab:setTest', 'lab:syneresis']));
    const liking = dataset.responses.find((r) => r.libraryKey === 'overall-liking')!;
    expect(liking.kind).toBe('sensory');
    expect(liking.scale).toEqual({ min: 1, max: 9 });
    // The unit names the scale and its ends; an intensity line, named after its attribute, only its ends.
    expect(liking.unit).toBe('9-point hedonic, 1–9');
    expect(dataset.responses.find((r) => r.libraryKey === 'set-firmness')?.unit).toBe('0–10');
    // Each history variant was tasted by ten; the November panel had 24 seats.
    expect(centre.responses[liking.key]!.n).toBe(10);
    expect(centre.responses[liking.key]!.sd).not.toBeNull();
  });

  it('fits a full quadratic in four factors for the tasted and measured responses, weighting panel means', async () => {
    const model = (await familyModel({ workspaceId }, apricot))!;
    expect(model.factors).toEqual(['sugarRatio', 'targetSolidsPct', 'pectinPct', 'acidPct']);
    expect(model.runs).toBe(35);
    const firmness = model.responses.find((r) => r.libraryKey === 'set-firmness')!;
    const liking = model.responses.find((r) => r.libraryKey === 'overall-liking')!;
    const ph = model.responses.find((r) => r.key === 'lab:measuredPh')!;
    for (const response of [firmness, liking, ph]) {
      expect(response.surface.kind).toBe('full_quadratic');
      expect(response.surface.fit.basis.hasAliasedTerms).toBe(false);
    }
    expect(firmness.surface.fit.weighted).toBe(true);
    expect(firmness.newRunWeight).toBeGreaterThan(0);
    expect(ph.surface.fit.weighted).toBe(false);
    // The invented truth has firmness rising with pectin: the pectin coefficient is clearly positive.
    const pectin = firmness.surface.fit.terms.find((t) => t.name === 'pectinPct')!;
    expect(pectin.estimate!).toBeGreaterThan(0);
    expect(pectin.p!).toBeLessThan(0.001);
    // Centre points replicated across trials: lack of fit can be tested.
    expect(ph.surface.fit.lackOfFit).not.toBeNull();
    // A point at the centre of the data predicts, with an interval; pectin far above the data does not.
    const middle = { sugarRatio: 0.4, targetSolidsPct: 46, pectinPct: 0.8, acidPct: 0.16 };
    const inside = predictResponse(liking.surface, middle, { newRunWeight: liking.newRunWeight ?? undefined });
    expect(inside.inRegion).toBe(true);
    if (inside.inRegion) {
      expect(inside.estimate).toBeGreaterThan(5);
      expect(inside.estimate).toBeLessThan(8);
      expect(inside.prediction!.high).toBeGreaterThan(inside.prediction!.low);
    }
    const outside = predictResponse(liking.surface, { ...middle, pectinPct: 3 });
    expect(outside.inRegion).toBe(false);
  });

  it('serialises the model to JSON and back without losing what predictions need', async () => {
    const model = (await familyModel({ workspaceId }, apricot))!;
    const copy = JSON.parse(JSON.stringify(model)) as typeof model;
    const point = { sugarRatio: 0.42, targetSolidsPct: 45, pectinPct: 0.85, acidPct: 0.15 };
    const original = predictResponse(model.responses[0].surface, point);
    const revived = predictResponse(copy.responses[0].surface, point);
    expect(revived).toEqual(original);
  });

  it('grows in the history: main effects after the first screen, a quadratic once the star points are in', async () => {
    const dataset = await modelDataset({ workspaceId }, { family: apricot });
    const ph = dataset.responses.find((r) => r.key === 'lab:measuredPh')!;
    const steps = modelHistory(dataset.rows, ph, ['sugarRatio', 'targetSolidsPct', 'pectinPct', 'acidPct']);
    expect(steps.map((s) => s.runs)).toEqual([10, 20, 30, 35]);
    expect(steps.map((s) => s.kind)).toEqual(['main_effects', 'two_factor_interactions', 'full_quadratic', 'full_quadratic']);
  });

  it('lists the family among the workspace’s families, and a trial pick gives the same rows as the family', async () => {
    const families = await listFamilies({ workspaceId });
    const entry = families.find((f) => f.slug === apricot.slug)!;
    expect(entry.trials).toBe(4);
    expect(entry.variants).toBe(35);
    const em = await getEm();
    const history = await em.find(Trial, { workspace: workspaceId, title: { $like: 'Apricot spread:%' } });
    const picked = await modelDataset({ workspaceId }, { trialIds: history.map((t) => t.id) });
    expect(picked.rows).toHaveLength(35);
    expect(picked.family?.slug).toBe(apricot.slug);
  });
});

describe('workspace scoping', () => {
  it('shows another workspace none of the family, even by trial ids or by the family key', async () => {
    const em = await getEm();
    const trials = await em.find(Trial, { workspace: workspaceId });
    const picked = await modelDataset({ workspaceId: otherWorkspaceId }, { trialIds: trials.map((t) => t.id) });
    expect(picked.rows).toEqual([]);
    const byFamily = await modelDataset({ workspaceId: otherWorkspaceId }, { family: apricot });
    expect(byFamily.rows).toEqual([]);
    expect(await familyModel({ workspaceId: otherWorkspaceId }, apricot)).toBeNull();
    expect(await listFamilies({ workspaceId: otherWorkspaceId })).toEqual([]);
  });

  it('answers a formula of another workspace as missing', async () => {
    const em = await getEm();
    const formula = await em.findOneOrFail(Formula, { workspace: workspaceId, name: 'Apricot spread, reduced sugar' });
    await expect(familyOfFormula({ workspaceId: otherWorkspaceId }, formula.id)).rejects.toMatchObject({ status: 404 });
  });

  it('leaves withdrawn cooks out of the lab means', async () => {
    const em = (await getEm()).fork();
    const dataset = await modelDataset({ workspaceId }, { family: apricot });
    const row = dataset.rows[0];
    const cook = await em.findOneOrFail(Cook, { workspace: workspaceId, variant: row.variantId });
    cook.withdrawnAt = new Date();
    await em.flush();
    try {
      const after = await modelDataset({ workspaceId }, { family: apricot });
      const same = after.rows.find((r) => r.variantId === row.variantId)!;
      expect(same.responses['lab:measuredPh']).toBeUndefined();
      const refit = fitFamilyModel({ ...after, family: after.family! });
      expect(refit.runs).toBe(35);
    } finally {
      cook.withdrawnAt = null;
      await em.flush();
    }
  });
});

async function demoPerson(index: number): Promise<Person> {
  const user = await (await getEm()).fork().findOneOrFail(User, { email: DEMO_USERS[index].email });
  return { userId: user.id, email: user.email, role: DEMO_USERS[index].role, sessionCookie: await sessionCookieFor(user.id), token: '' };
}

describe('predictions and proposals on the demo', () => {
  const REDUCED_SUGAR = { low: 0.3, high: 0.34 };

  it('proposes a reduced-sugar apricot spread that keeps the fruit minimum and the pH window', async () => {
    const model = (await familyModel({ workspaceId }, apricot))!;
    const box = (name: string) => model.responses[0].surface.dataBox.find((r) => r.name === name)!;
    const liking = model.responses.find((r) => r.libraryKey === 'overall-liking')!;
    const firmness = model.responses.find((r) => r.libraryKey === 'set-firmness')!;
    const result = optimiseFamily(model, {
      factors: [
        { name: 'sugarRatio', ...REDUCED_SUGAR },
        { name: 'targetSolidsPct', low: box('targetSolidsPct').low, high: box('targetSolidsPct').high },
        { name: 'pectinPct', low: box('pectinPct').low, high: box('pectinPct').high },
        { name: 'acidPct', low: box('acidPct').low, high: box('acidPct').high },
      ],
      goals: [
        { response: liking.key, goal: { kind: 'maximise', low: 5, high: 7.5 } },
        { response: firmness.key, goal: { kind: 'band', low: 3, bandLow: 5, bandHigh: 7, high: 9 } },
      ],
      // Source for 450 g: Directive (EU) 2024/1438 raising the jam fruit minimum (memory); used here only as a constraint value.
      constraints: { fruitMinimumPer1000g: 450, ph: { low: 3.35, high: 3.7 } },
      proposals: 2,
    });
    expect(result.message).toBeNull();
    expect(result.proposals.length).toBeGreaterThanOrEqual(1);
    for (const proposal of result.proposals) {
      expect(proposal.point.sugarRatio!).toBeLessThanOrEqual(REDUCED_SUGAR.high + 1e-9);
      expect(proposal.point.sugarRatio!).toBeGreaterThanOrEqual(REDUCED_SUGAR.low - 1e-9);
      expect(proposal.fruitPer1000g!).toBeGreaterThanOrEqual(450);
      const ph = proposal.responses.find((r) => r.key === 'lab:measuredPh')!;
      expect(ph.inRegion && ph.estimate >= 3.35 && ph.estimate <= 3.7).toBe(true);
      const liked = proposal.responses.find((r) => r.key === liking.key)!;
      expect(liked.inRegion).toBe(true);
      if (liked.inRegion) expect(liked.prediction!.low).toBeLessThan(liked.estimate);
      expect(proposal.desirability).toBeGreaterThan(0);
    }
  });

  it('predicts through the API with intervals, and withdraws the number outside the data with the reason in words', async () => {
    const head = await demoPerson(2);
    const point = { sugarRatio: 0.4, targetSolidsPct: 46, pectinPct: 0.8, acidPct: 0.16 };
    const inside = await callRoute(predictRoute.POST, { method: 'POST', path: `/api/v1/models/${apricot.slug}/predict`, caller: { kind: 'session', person: head }, params: { family: apricot.slug }, body: { point } });
    expect(inside.status).toBe(200);
    const liking = inside.body.predictions.find((p: { name: string }) => p.name === 'Overall liking');
    expect(liking.inRegion).toBe(true);
    expect(liking.prediction.low).toBeLessThan(liking.estimate);
    const outside = await callRoute(predictRoute.POST, { method: 'POST', path: `/api/v1/models/${apricot.slug}/predict`, caller: { kind: 'session', person: head }, params: { family: apricot.slug }, body: { point: { ...point, pectinPct: 2.5 } } });
    const withdrawn = outside.body.predictions.find((p: { name: string }) => p.name === 'Overall liking');
    expect(withdrawn.inRegion).toBe(false);
    expect(withdrawn.reason).toMatch(/^Pectin at 2\.500 % of finished product is above anything the trials covered/);
    expect(withdrawn.estimate).toBeUndefined();
  });

  it('refuses a bad optimise request with 422 and a taster with 403', async () => {
    const developer = await demoPerson(1);
    const call = (body: unknown, person = developer) =>
      callRoute(optimiseRoute.POST, { method: 'POST', path: `/api/v1/models/${apricot.slug}/optimise`, caller: { kind: 'session', person }, params: { family: apricot.slug }, body });
    const factors = [{ name: 'sugarRatio', low: 0.3, high: 0.5 }, { name: 'targetSolidsPct', low: 42, high: 50 }, { name: 'pectinPct', low: 0.5, high: 1.2 }, { name: 'acidPct', low: 0.05, high: 0.3 }];
    const goal = { response: 'lab:measuredPh', goal: { kind: 'target', low: 3.3, target: 3.5, high: 3.7 } };
    expect((await call({ factors, goals: [goal] })).status).toBe(200);
    expect((await call({ factors, goals: [{ ...goal, goal: { kind: 'target', low: 3.3, target: 3.9, high: 3.7 } }] })).status).toBe(422);
    expect((await call({ factors: factors.slice(0, 2), goals: [goal] })).status).toBe(422);
    expect((await call({ factors, goals: [{ ...goal, response: 'lab:colour' }] })).status).toBe(422);
    expect((await call(JSON.parse(`{"factors": ${JSON.stringify(factors)}, "goals": [${JSON.stringify(goal)}], "__proto__": {"polluted": true}}`))).status).toBe(422);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect((await call({ factors, goals: [goal] }, await demoPerson(4))).status).toBe(403);
  });

  it('optimises through the API on a base formula’s exact mass balance, and refuses a formula of another family or an unknown one', async () => {
    const developer = await demoPerson(1);
    const call = (body: unknown) =>
      callRoute(optimiseRoute.POST, { method: 'POST', path: `/api/v1/models/${apricot.slug}/optimise`, caller: { kind: 'session', person: developer }, params: { family: apricot.slug }, body });
    const em = (await getEm()).fork();
    const formula = await em.findOneOrFail(Formula, { workspace: workspaceId, name: 'Apricot spread, reduced sugar' });
    const model = (await familyModel({ workspaceId }, apricot))!;
    const box = (name: string) => model.responses[0].surface.dataBox.find((r) => r.name === name)!;
    const factors = (['sugarRatio', 'targetSolidsPct', 'pectinPct', 'acidPct'] as const).map((name) => ({ name, low: box(name).low, high: box(name).high }));
    const liking = model.responses.find((r) => r.libraryKey === 'overall-liking')!;
    const body = { factors, goals: [{ response: liking.key, goal: { kind: 'maximise', low: 5, high: 7.5 } }], constraints: { fruitMinimumPer1000g: 450 }, proposals: 2, baseFormulaId: formula.id };
    const res = await call(body);
    expect(res.status).toBe(200);
    expect(res.body.proposals.length).toBeGreaterThanOrEqual(1);
    const actor = { userId: developer.userId, email: developer.email, name: 'Developer', workspaceId, workspaceName: '', role: developer.role, via: 'session' as const, massUnits: 'metric' as const, temperatureUnit: 'C' as const };
    const base = await baseFormulaOfFamily(actor, apricot, formula.id);
    for (const proposal of res.body.proposals) {
      // The reported fruit content is the base formula's own mass balance moved to the point, and holds the minimum.
      const made = formulaAtPoint(base, proposal.point);
      expect(made.ok).toBe(true);
      if (made.ok) expect(proposal.fruitPer1000g).toBeCloseTo(made.computation.massBalance.fruitPer1000gFinishedG, 6);
      expect(proposal.fruitPer1000g).toBeGreaterThanOrEqual(450 - 1e-6);
    }
    let otherFamilyId: string | undefined;
    for (const f of await em.find(Formula, { workspace: workspaceId })) {
      const family = await familyOfFormula({ workspaceId }, f.id);
      if (family && family.slug !== apricot.slug) { otherFamilyId = f.id; break; }
    }
    expect(otherFamilyId).toBeDefined();
    expect((await call({ ...body, baseFormulaId: otherFamilyId })).status).toBe(422);
    // A formula this workspace does not have (the other workspace's ids are as unknown) is missing.
    expect((await call({ ...body, baseFormulaId: '00000000-0000-4000-8000-000000000000' })).status).toBe(404);
    expect((await call({ ...body, baseFormulaId: 'not-an-id' })).status).toBe(422);
  });

  describe('the cost ceiling per jar through the API', () => {
    // The formulas and the ingredient made here live in the shared demo workspace; other files
    // (tests/integration/demo-prices.test.ts, seed-label-data.test.ts) check that workspace's own
    // records, so they go again afterwards, whichever order the files run in. Revisions are
    // guarded against deletion; the guard is lifted for this one statement, in one transaction.
    afterAll(async () => {
      const names = ['Apricot spread, no pack format yet', 'Apricot spread, unpriced extract'];
      const em = (await getEm()).fork();
      await em.transactional(async (tx) => {
        const run = (statement: string, params: unknown[] = []) => tx.getConnection().execute(statement, params, 'run', tx.getTransactionContext());
        await run('alter table formula_revisions disable trigger formula_revisions_no_change');
        await run('delete from formula_revisions where formula_id in (select id from formulas where workspace_id = ? and name in (?, ?))', [workspaceId, ...names]);
        await run('alter table formula_revisions enable trigger formula_revisions_no_change');
        await run('delete from formulas where workspace_id = ? and name in (?, ?)', [workspaceId, ...names]);
        await run(`delete from ingredients where workspace_id = ? and name = 'Own-press apricot kernel extract'`, [workspaceId]);
      });
    });

    const ACTOR_OF = (person: Person) => ({ userId: person.userId, email: person.email, name: 'Developer', workspaceId, workspaceName: '', role: person.role, via: 'session' as const, massUnits: 'metric' as const, temperatureUnit: 'C' as const });
    async function setup() {
      const developer = await demoPerson(1);
      const em = (await getEm()).fork();
      const formula = await em.findOneOrFail(Formula, { workspace: workspaceId, name: 'Apricot spread, reduced sugar' });
      const model = (await familyModel({ workspaceId }, apricot))!;
      const box = (name: string) => model.responses[0].surface.dataBox.find((r) => r.name === name)!;
      const factors = (['sugarRatio', 'targetSolidsPct', 'pectinPct', 'acidPct'] as const).map((name) => ({ name, low: box(name).low, high: box(name).high }));
      const liking = model.responses.find((r) => r.libraryKey === 'overall-liking')!;
      const body = { factors, goals: [{ response: liking.key, goal: { kind: 'minimise', low: 4, high: 8 } }], proposals: 2, baseFormulaId: formula.id };
      const call = (b: unknown) =>
        callRoute(optimiseRoute.POST, { method: 'POST', path: `/api/v1/models/${apricot.slug}/optimise`, caller: { kind: 'session', person: developer }, params: { family: apricot.slug }, body: b });
      return { developer, formula, body, call };
    }

    it('holds every proposal at or under the ceiling, costed as the Propose screen costs it', async () => {
      const { developer, formula, body, call } = await setup();
      // A ceiling far above any jar: the free search, with each proposal's cost per jar.
      const free = await call({ ...body, constraints: { costCeilingPerJarMinor: 100_000_000 } });
      expect(free.status, JSON.stringify(free.body)).toBe(200);
      // The demo prices are in pounds sterling (lib/seed/prices.ts), its formulas in a 340 g jar.
      expect(free.body.cost).toMatchObject({ currency: 'GBP', packFormat: '340 g jar, case of 12', ceilingPerJarMinor: 100_000_000 });
      const freeCost: number = free.body.proposals[0].costPerJarMinor;
      expect(freeCost).toBeGreaterThan(0);
      const cap = Math.floor(freeCost) - 2;
      const held = await call({ ...body, constraints: { costCeilingPerJarMinor: cap } });
      expect(held.status, JSON.stringify(held.body)).toBe(200);
      expect(held.body.proposals.length).toBeGreaterThanOrEqual(1);
      const actor = ACTOR_OF(developer);
      const base = await baseFormulaOfFamily(actor, apricot, formula.id);
      const costing = await proposalCostingOf(actor, formula.id);
      for (const proposal of held.body.proposals) {
        expect(proposal.costPerJarMinor).toBeLessThanOrEqual(cap + 1e-9);
        // The same figure as the screen's own costing of the base formula moved to the point.
        expect(proposal.costPerJarMinor).toBeCloseTo(costPerJarAt(base, proposal.point, costing)!, 9);
      }
      // The ceiling bites: without it the best proposal costs more than the cap.
      expect(freeCost).toBeGreaterThan(cap);
    });

    it('answers an impossible ceiling with no proposal and the reason in words', async () => {
      const { body, call } = await setup();
      const res = await call({ ...body, constraints: { costCeilingPerJarMinor: 1 } });
      expect(res.status).toBe(200);
      expect(res.body.proposals).toEqual([]);
      // The ceiling is named with its amount, as the one constraint no setting met.
      expect(res.body.message).toMatch(/^No setting inside the data meets every constraint\. Not met at any setting tried: cost ceiling per jar \([A-Z]{3} 0\.01\)\.$/);
    });

    it('refuses a ceiling without a base formula, without a pack format, or with an unpriced line, by name (422)', async () => {
      const { developer, formula, body, call } = await setup();
      const withoutBase = { ...body, baseFormulaId: undefined };
      const noBase = await call({ ...withoutBase, constraints: { costCeilingPerJarMinor: 500 } });
      expect(noBase.status).toBe(422);
      expect(noBase.body.error.fields['constraints.costCeilingPerJarMinor'][0]).toMatch(/needs a base formula \(baseFormulaId\)/);

      // A formula of the same family without a pack format.
      const actor = ACTOR_OF(developer);
      const base = await baseFormulaOfFamily(actor, apricot, formula.id);
      const lines = base.lines.map((l) => ({ ingredientId: l.ingredientId, quantity: l.quantity, unit: l.unit }));
      const { formulaId: unpacked } = await createFormula(actor, { name: 'Apricot spread, no pack format yet', settings: base.settings, lines });
      const noPack = await call({ ...body, baseFormulaId: unpacked, constraints: { costCeilingPerJarMinor: 500 } });
      expect(noPack.status).toBe(422);
      expect(noPack.body.error.fields['constraints.costCeilingPerJarMinor'][0]).toMatch(/no pack format/);

      // The same family with a line nobody priced: named, never counted as zero.
      const { ingredientId } = await createIngredient(actor, { name: 'Own-press apricot kernel extract', kind: 'other', solidsPct: 5 });
      const { formulaId: unpriced } = await createFormula(actor, { name: 'Apricot spread, unpriced extract', settings: base.settings, lines: [...lines, { ingredientId, quantity: 2, unit: 'g' }] });
      await setFormulaPackFormat(actor, unpriced, (await packFormatOfFormulas(workspaceId, [formula.id])).get(formula.id)!);
      const noPrice = await call({ ...body, baseFormulaId: unpriced, constraints: { costCeilingPerJarMinor: 500 } });
      expect(noPrice.status, JSON.stringify(noPrice.body)).toBe(422);
      expect(noPrice.body.error.fields['constraints.costCeilingPerJarMinor'][0]).toMatch(/no price for Own-press apricot kernel extract/);
      // Without a ceiling the same formula is a fine base.
      expect((await call({ ...body, baseFormulaId: unpriced })).status).toBe(200);
    });

    it('refuses hostile ceilings with 422 and changes nothing', async () => {
      const { body, call } = await setup();
      const em = (await getEm()).fork();
      const before = { formulas: await em.count(Formula, { workspace: workspaceId }), trials: await em.count(Trial, { workspace: workspaceId }) };
      for (const ceiling of [0, -1, 1.5, 2 ** 31, 2 ** 53, 2 ** 53 + 2, 1e308, 5e-324, '500', null, [500], { value: 500 }, 'NaN', true]) {
        const res = await call({ ...body, constraints: { costCeilingPerJarMinor: ceiling } });
        expect(res.status, JSON.stringify(ceiling)).toBe(422);
        expect(res.body.error.fields).toHaveProperty(['constraints.costCeilingPerJarMinor']);
      }
      // Above 1,000,000 pounds (100,000,000 pence; GBP has two minor digits, ISO 4217) though inside the schema's bound.
      const tooHigh = await call({ ...body, constraints: { costCeilingPerJarMinor: 100_000_001 } });
      expect(tooHigh.status).toBe(422);
      expect(tooHigh.body.error.fields['constraints.costCeilingPerJarMinor'][0]).toBe('The cost ceiling per jar must be at most 1,000,000.');
      const fresh = (await getEm()).fork();
      expect({ formulas: await fresh.count(Formula, { workspace: workspaceId }), trials: await fresh.count(Trial, { workspace: workspaceId }) }).toEqual(before);
    });
  });

  it('exports the coefficients of every fitted response as CSV', async () => {
    const res = await callRoute(coefficientsRoute.GET, { method: 'GET', path: `/api/v1/models/${apricot.slug}/coefficients.csv`, caller: { kind: 'session', person: await demoPerson(1) }, params: { family: apricot.slug } });
    expect(res.status).toBe(200);
    const lines = String(res.body).trim().split(/\r?\n/);
    expect(lines[0]).toBe('response,term,estimate_per_coded_unit,standard_error,t,p,aliased_with');
    expect(lines.some((l) => l.startsWith('Overall liking,Pectin²,'))).toBe(true);
  });
});
