/** Trials end to end through the real handlers: plan, variants, cooks, CSV in and out, status moves. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture } from './harness';
import { createFixtureFormula, strawberryJamInput } from './fixtures';
import { createFormula } from '@/lib/formulas/mutations';
import * as trialsRoute from '@/app/api/v1/trials/route';
import * as trialRoute from '@/app/api/v1/trials/[trialId]/route';
import * as statusRoute from '@/app/api/v1/trials/[trialId]/status/route';
import * as planRoute from '@/app/api/v1/trials/[trialId]/plan/route';
import * as importRoute from '@/app/api/v1/trials/[trialId]/cooks/import/route';
import * as cooksRoute from '@/app/api/v1/trials/[trialId]/cooks/route';
import * as exportRoute from '@/app/api/v1/trials/[trialId]/export/route';
import { getEm } from '@/lib/db';
import { Cook, Variant } from '@/entities';
import { diffRevisions } from '@/lib/formulas/diff';
import { readCsv } from '@/lib/csv';
import { OVERALL_STATUS_LABELS } from '@/lib/chemistry';

let a: WorkspaceFixture;
const dev = () => ({ kind: 'session' as const, person: a.people.developer });

beforeAll(async () => {
  a = await createWorkspace('Trials');
});

async function newTrial() {
  const formulaId = await createFixtureFormula(a);
  const res = await callRoute(trialsRoute.POST, { method: 'POST', path: '/api/v1/trials', caller: dev(), body: { title: 'Sugar and acid', question: 'Can we cut sugar by a fifth and keep the set?', formulaId } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.trialId as string;
}

const overview = async (trialId: string) => (await callRoute(trialRoute.GET, { method: 'GET', path: '', caller: dev(), params: { trialId } })).body.trial;

describe('planning variants', () => {
  it('a 2^2 factorial with a centre point makes five variants with their factor levels stored', async () => {
    const trialId = await newTrial();
    const res = await callRoute(planRoute.POST, {
      method: 'POST', path: '', caller: dev(), params: { trialId },
      body: { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.0 }, { factor: 'acid_dose', low: 3, high: 7 }], centrePoint: true },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.created).toEqual(['B', 'C', 'D', 'E', 'F']);
    const t = await overview(trialId);
    expect(t.code).toMatch(/^T-\d{3}$/);
    const levels = t.variants.slice(1).map((v: any) => v.factorLevels.map((l: any) => [l.factor, l.coded, l.value]));
    expect(levels).toEqual([
      [['sugar_ratio', -1, 0.8], ['acid_dose', -1, 3]],
      [['sugar_ratio', 1, 1.0], ['acid_dose', -1, 3]],
      [['sugar_ratio', -1, 0.8], ['acid_dose', 1, 7]],
      [['sugar_ratio', 1, 1.0], ['acid_dose', 1, 7]],
      [['sugar_ratio', 0, 0.9], ['acid_dose', 0, 5]],
    ]);
    // The fixture base is 1000 g fruit, 1000 g sugar, 5.5 g citric acid: ratio 1.0, 5.5 g/kg.
    expect(t.variants[0].factorLevels.map((l: any) => l.value)).toEqual([1, 5.5]);
    const b = t.variants[1];
    const sugarLine = b.lines.find((l: any) => l.ingredient.kind === 'sweetener');
    expect(sugarLine.quantity).toBeCloseTo(800, 9);
    expect(b.lines.find((l: any) => l.ingredient.kind === 'acid').quantity).toBeCloseTo(3, 9);
    // Each variant has its own chemistry: less sugar, lower finished mass at the same target solids.
    expect(b.computation.massBalance.finishedMassG).toBeLessThan(t.variants[0].computation.massBalance.finishedMassG);
    // The difference from the base, by the same diff the formula history uses.
    const diff = diffRevisions(
      { formulaId: '', number: 0, name: 'A', settings: t.variants[0].settings, lines: t.variants[0].lines, note: null, createdAt: '', createdBy: { id: '', name: '' } },
      { formulaId: '', number: 1, name: 'B', settings: b.settings, lines: b.lines, note: null, createdAt: '', createdBy: { id: '', name: '' } },
    );
    expect(diff.lines.filter((l) => l.status === 'changed').map((l) => l.ingredientName).sort()).toEqual(['Citric acid (anhydrous powder)', 'Sucrose (white sugar)']);
  });

  it('"Add these variants" twice adds no exact duplicates: a repeat is refused with the labels it repeats', async () => {
    const trialId = await newTrial();
    const body = { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.1 }] };
    const first = await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body).toMatchObject({ created: ['B', 'C'], skipped: [] });
    const again = await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body });
    expect(again.status).toBe(422);
    expect(again.body.error.message).toBe('These variants are already in the trial (B, C): nothing was added.');
    expect((await overview(trialId)).variants.map((v: any) => v.label)).toEqual(['A', 'B', 'C']);
    // A wider plan adds only the runs that are new.
    const wider = await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { ...body, centrePoint: true } });
    expect(wider.status).toBe(201);
    expect(wider.body).toMatchObject({ created: ['D'], skipped: ['B', 'C'] });
  });

  it('a face-centred central composite over sugar ratio and target soluble solids adds its replicated centre runs once', async () => {
    const trialId = await newTrial();
    const body = { kind: 'central_composite_face_centred', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.0 }, { factor: 'target_solids', low: 58, high: 64 }], centreRuns: 3 };
    const first = await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    // 4 corners + 4 face runs + 3 centre runs (Montgomery ch. 11, CCD for k = 2 (memory)).
    expect(first.body.created).toHaveLength(11);
    const t = await overview(trialId);
    const added = t.variants.slice(1);
    expect(added.map((v: any) => v.settings.targetSolidsPct)).toEqual([58, 58, 64, 64, 61, 61, 58, 64, 61, 61, 61]);
    expect(added.slice(8).map((v: any) => v.description)).toEqual(['centre point (1 of 3)', 'centre point (2 of 3)', 'centre point (3 of 3)']);
    // Target solids is a setting: the corners at the same sugar ratio share their lines.
    const sugarOf = (v: any) => v.lines.find((l: any) => l.ingredient.kind === 'sweetener').quantity;
    expect(sugarOf(added[0])).toBeCloseTo(sugarOf(added[2]), 9);
    const again = await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body });
    expect(again.status).toBe(422);
    expect((await overview(trialId)).variants).toHaveLength(12);
    // Five centre runs where three exist: two more replicates.
    const more = await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { ...body, centreRuns: 5 } });
    expect(more.status, JSON.stringify(more.body)).toBe(201);
    expect(more.body.created).toEqual(['M', 'N']);
  });

  it('refuses a factor the base formula cannot carry, and writes nothing', async () => {
    const trialId = await newTrial();
    const before = (await overview(trialId)).variants.length;
    const res = await callRoute(planRoute.POST, {
      method: 'POST', path: '', caller: dev(), params: { trialId },
      body: { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 1.2, high: 0.8 }] },
    });
    expect(res.status).toBe(422);
    expect((await overview(trialId)).variants.length).toBe(before);
  });
});

describe('status moves', () => {
  it('records every transition and refuses a jump that is not allowed', async () => {
    const trialId = await newTrial();
    const move = (to: string) => callRoute(statusRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { to } });
    expect((await move('tasting')).status).toBe(409);
    expect((await move('cooking')).status).toBe(200);
    expect((await move('tasting')).status).toBe(200);
    const t = await overview(trialId);
    expect(t.status).toBe('tasting');
    expect(t.history.map((h: any) => [h.from, h.to])).toEqual([[null, 'planning'], ['planning', 'cooking'], ['cooking', 'tasting']]);
    // Variants are fixed once the panel starts.
    const plan = await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { kind: 'full_factorial', factors: [{ factor: 'acid_dose', low: 2, high: 4 }] } });
    expect(plan.status).toBe(409);
  });
});

describe('cooks and CSV', () => {
  it('imports good rows, and a file with one bad row imports nothing and names the row and column', async () => {
    const trialId = await newTrial();
    await callRoute(planRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.0 }] } });
    const em = await getEm();
    const count = () => em.fork().count(Cook, { workspace: a.workspaceId, variant: { trial: trialId } });

    const bad = 'variant,cook_date,brix_reading,brix_sample_temp_c,ph,yield_g\nB,2026-11-18,64.8,18,3.15,1480\nC,2026-11-18,sixty,18,3.2,1500\nZ,2026-11-19,65,20,3.1,1490\n';
    const refused = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { csv: bad } });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields).toEqual({
      'row 3, brix_reading': ['“sixty” is not a number.'],
      'row 4, variant': ['No variant “Z” in this trial.'],
    });
    expect(await count()).toBe(0);

    const good = 'variant,cook_date,brix_reading,brix_sample_temp_c,ph,end_point_c,set_test_score,set_test_method,yield_jars,yield_g\nB,2026-11-18,64.8,18,3.15,104.1,4,cold_plate,4,1480\nC,2026-11-18,65.2,21,3.25,103.8,4,spoon,5,1720\n';
    const ok = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { csv: good } });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(ok.body.imported).toBe(2);
    expect(await count()).toBe(2);

    const cooks = await callRoute(cooksRoute.GET, { method: 'GET', path: '', caller: dev(), params: { trialId } });
    const b = cooks.body.cooks.find((m: any) => m.variantLabel === 'B');
    // Stored raw; shown corrected to 20 °C. Source: OIV-MA-AS2-02 Table I — below 20 °C a sucrose
    // refractometer reads high, so the correction is subtracted (−0.38 at 15 °C / 65 %).
    expect(b.brixReading).toBe(64.8);
    expect(b.comparison.correctedBrix).toBeLessThan(64.8);
    expect(b.comparison.correctedBrix).toBeGreaterThan(64.8 - 0.38);
    const solids = b.comparison.rows.find((r: any) => r.key === 'solids');
    expect(solids.predicted).toBe(65);
    expect(solids.flag).toBe('ok');
  });

  it('a pH above 4.6 is flagged as a danger on the cook', async () => {
    const trialId = await newTrial();
    const t = await overview(trialId);
    const res = await callRoute(cooksRoute.POST, {
      method: 'POST', path: '', caller: dev(), params: { trialId },
      body: { variantId: t.variants[0].id, cookDate: '2026-11-20', ph: 4.8 },
    });
    expect(res.status).toBe(201);
    const after = await overview(trialId);
    const ph = after.variants[0].cooks[0].comparison.rows.find((r: any) => r.key === 'ph');
    expect(ph.flag).toBe('danger');
    expect(ph.note).toContain('Local food-safety codes and licensed practice govern.');
  });

  it('refuses a reading without its sample temperature, and a cook of another trial’s variant', async () => {
    const trialId = await newTrial();
    const other = await newTrial();
    const t = await overview(other);
    const r1 = await callRoute(cooksRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { variantId: t.variants[0].id, cookDate: '2026-11-20', brixReading: 64 } });
    expect(r1.status).toBe(422);
    expect(r1.body.error.fields).toHaveProperty(['brixSampleTempC']);
    const r2 = await callRoute(cooksRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { variantId: t.variants[0].id, cookDate: '2026-11-20', ph: 3.2 } });
    expect(r2.status).toBe(422);
    expect(r2.body.error.fields).toHaveProperty(['variantId']);
  });

  it('exports variants and cooks as CSV, one row per cook', async () => {
    const trialId = await newTrial();
    const t = await overview(trialId);
    await callRoute(cooksRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { variantId: t.variants[0].id, cookDate: '2026-11-21', yieldG: 1600, ph: 3.1 } });
    const res = await exportRoute.GET(new Request('http://127.0.0.1/x', { headers: { cookie: a.people.developer.sessionCookie } }), { params: Promise.resolve({ trialId }) });
    const lines = (await res.text()).trim().split('\n');
    expect(lines[0]).toContain('variant,description,sugar_ratio');
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain('2026-11-21');
    // The compliance outcome in the words the editor shows, never its key (compliant, non_compliant, ...).
    expect(Object.values(OVERALL_STATUS_LABELS)).toContain(readCsv(lines.join('\n')).data[0].compliance);
  });
});

describe('the trial list', () => {
  it('filters by status and owner from the query string', async () => {
    const trialId = await newTrial();
    await callRoute(statusRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { to: 'cooking' } });
    const cooking = await callRoute(trialsRoute.GET, { method: 'GET', path: '/api/v1/trials?status=cooking', caller: dev() });
    expect(cooking.body.trials.map((x: any) => x.id)).toContain(trialId);
    expect(cooking.body.trials.every((x: any) => x.status === 'cooking')).toBe(true);
    const nobody = await callRoute(trialsRoute.GET, { method: 'GET', path: `/api/v1/trials?owner=${a.people.admin.userId}`, caller: dev() });
    expect(nobody.body.trials).toEqual([]);
    const mine = await callRoute(trialsRoute.GET, { method: 'GET', path: `/api/v1/trials?owner=${actorOf(a, 'developer').userId}`, caller: dev() });
    expect(mine.body.trials.length).toBeGreaterThan(0);
  });
});

describe('the trial list’s product class without a base variant', () => {
  // The walk's T-004..T-006: every variant a reduced-sugar spread, none the base; they were listed as
  // "(Jam)" and dropped out of ?product=reduced_sugar_spread.
  const listed = async (product: string) => (await callRoute(trialsRoute.GET, { method: 'GET', path: `/api/v1/trials?product=${product}`, caller: dev() })).body.trials as Array<{ id: string; productClass: string | null }>;

  it('takes the variants’ common class', async () => {
    const trialId = await newTrial();
    const em = (await getEm()).fork();
    const base = await em.findOneOrFail(Variant, { trial: trialId, isBase: true });
    base.isBase = false;
    base.settings = { ...base.settings, productClass: 'reduced_sugar_spread' };
    await em.flush();
    const spreads = await listed('reduced_sugar_spread');
    expect(spreads.find((t) => t.id === trialId)?.productClass).toBe('reduced_sugar_spread');
    expect((await listed('jam')).map((t) => t.id)).not.toContain(trialId);
  });

  it('takes the base formula revision’s class when the variants do not say', async () => {
    const input = await strawberryJamInput(a, { name: 'Apricot spread, reduced sugar' });
    const { formulaId } = await createFormula(actorOf(a, 'developer'), { ...input, settings: { ...input.settings, productClass: 'reduced_sugar_spread', targetSolidsPct: 45 } });
    const res = await callRoute(trialsRoute.POST, { method: 'POST', path: '/api/v1/trials', caller: dev(), body: { title: 'Spread without base', question: 'Which pectin?', formulaId } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const trialId = res.body.trialId as string;
    const em = (await getEm()).fork();
    const base = await em.findOneOrFail(Variant, { trial: trialId, isBase: true });
    base.removedAt = new Date();
    base.isBase = false;
    await em.flush();
    expect((await listed('reduced_sugar_spread')).find((t) => t.id === trialId)?.productClass).toBe('reduced_sugar_spread');
  });
});
