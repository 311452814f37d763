/** The label over HTTP and in production: frozen at approval, compared on review, read as permissions allow. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture, type Caller } from './harness';
import { createFixtureFormula, starterIds, strawberryJamInput } from './fixtures';
import { createApprovedVersion, createPromotableTrial, promotionInput } from './production-fixtures';
import * as formulaLabelRoute from '@/app/api/v1/formulas/[formulaId]/label/route';
import * as variantLabelRoute from '@/app/api/v1/trials/[trialId]/variants/[variantId]/label/route';
import * as versionLabelRoute from '@/app/api/v1/production-versions/[versionId]/label/route';
import { getEm } from '@/lib/db';
import { Ingredient, ProductVersion, Variant } from '@/entities';
import { createFormula } from '@/lib/formulas/mutations';
import { addVariant } from '@/lib/trials/mutations';
import { requestPromotion } from '@/lib/production/mutations';
import { getPromotionRequest, getProductionVersion } from '@/lib/production/queries';
import { promotionLabelComparison } from '@/lib/label/queries';
import type { Label } from '@/lib/label/label';

let a: WorkspaceFixture;
let b: WorkspaceFixture;
const as = (fx: WorkspaceFixture, role: keyof WorkspaceFixture['people']): Caller => ({ kind: 'session', person: fx.people[role] });

beforeAll(async () => {
  a = await createWorkspace('Labels');
  b = await createWorkspace('Labels elsewhere');
});

const eu = (label: Label, key: string) => label.eu.rows.find((r) => r.key === key)!;

async function getVersionLabel(versionId: string, role: keyof WorkspaceFixture['people'] = 'production', query = '') {
  return callRoute(versionLabelRoute.GET, { method: 'GET', path: `/api/v1/production-versions/${versionId}/label${query}`, caller: as(a, role), params: { versionId } });
}

describe('freezing the label with a production version', () => {
  it('stores the label at approval and serves it unchanged after the library changes', async () => {
    const { versionId } = await createApprovedVersion(a);
    const em = await getEm();
    const row = await em.findOneOrFail(ProductVersion, { id: versionId });
    expect(row.label).not.toBeNull();
    const before = await getVersionLabel(versionId);
    expect(before.status).toBe(200);
    expect(before.body.kept).toBe('frozen');
    expect(before.body.label).toEqual(row.label);

    // The library's sugar now says 50 g sugars per 100 g: live labels change, the frozen one does not.
    const ids = await starterIds(a);
    const sugar = await em.findOneOrFail(Ingredient, { id: ids.sucrose });
    const original = sugar.sugarsG;
    await em.nativeUpdate(Ingredient, { id: ids.sucrose }, { sugarsG: 50 });
    try {
      const after = await getVersionLabel(versionId);
      expect(after.body.label).toEqual(before.body.label);
      const formulaId = await createFixtureFormula(a);
      const live = await callRoute(formulaLabelRoute.GET, { method: 'GET', path: `/api/v1/formulas/${formulaId}/label`, caller: as(a, 'developer'), params: { formulaId } });
      expect(live.body.kept).toBe('live');
      expect(eu(live.body.label, 'sugars').unrounded).toBeLessThan(eu(before.body.label, 'sugars').unrounded! - 10);
    } finally {
      await em.nativeUpdate(Ingredient, { id: ids.sucrose }, { sugarsG: original });
    }
  });

  it('computes the label on read for a version approved before labels were frozen, and says so', async () => {
    const { versionId } = await createApprovedVersion(a);
    const em = await getEm();
    // Such a version predates the column: set it back to null behind the immutability trigger, as the migration left old rows.
    await em.execute('alter table production_formulas disable trigger production_formulas_no_change');
    try {
      await em.execute('update production_formulas set label = null where id = ?', [versionId]);
    } finally {
      await em.execute('alter table production_formulas enable trigger production_formulas_no_change');
    }
    const res = await getVersionLabel(versionId);
    expect(res.status).toBe(200);
    expect(res.body.kept).toBe('not_frozen');
    expect(res.body.label.eu.rows.length).toBeGreaterThan(0);
  });

  it('cannot be changed afterwards: the version row refuses an update of its label', async () => {
    const { versionId } = await createApprovedVersion(a);
    const em = await getEm();
    await expect(em.execute(`update production_formulas set label = '{}'::jsonb where id = ?`, [versionId])).rejects.toThrow(/immutable/);
  });
});

describe('the review compares the proposed label with the version in production', () => {
  it('says the declaration changes and names the rows when the sugar changes', async () => {
    const { versionId } = await createApprovedVersion(a);
    const product = (await getProductionVersion(actorOf(a, 'production'), versionId)).product;
    const { trialId, variantId } = await createPromotableTrial(a);
    const em = await getEm();
    const base = await em.findOneOrFail(Variant, { id: variantId });
    const ids = await starterIds(a);
    const { variantId: lessSugar } = await addVariant(actorOf(a, 'developer'), trialId, {
      description: 'Less sugar',
      lines: base.lines.map((l) => ({ ingredientId: l.ingredientId, quantity: l.ingredientId === ids.sucrose ? 800 : l.quantity, unit: l.unit })),
    });
    const input = await promotionInput(a, trialId, lessSugar, { productId: product.id });
    const { requestId } = await requestPromotion(actorOf(a, 'developer'), input);
    const request = await getPromotionRequest(actorOf(a, 'head_of_product'), requestId);
    const comparison = await promotionLabelComparison(actorOf(a, 'head_of_product'), request);
    expect(comparison).not.toBeNull();
    expect(comparison!.baselineKept).toBe('frozen');
    expect(comparison!.changes.length).toBeGreaterThan(0);
    expect(comparison!.changes.map((c) => c.item)).toContain('Fruit');
    expect(comparison!.changes.some((c) => c.section.startsWith('EU declaration') && c.before !== c.after)).toBe(true);
  });

  it('finds no change when the proposed lines are those in production', async () => {
    const { versionId } = await createApprovedVersion(a);
    const product = (await getProductionVersion(actorOf(a, 'production'), versionId)).product;
    const { trialId, variantId } = await createPromotableTrial(a);
    const { requestId } = await requestPromotion(actorOf(a, 'developer'), await promotionInput(a, trialId, variantId, { productId: product.id }));
    const comparison = await promotionLabelComparison(actorOf(a, 'head_of_product'), await getPromotionRequest(actorOf(a, 'head_of_product'), requestId));
    expect(comparison!.changes).toEqual([]);
  });
});

describe('label endpoints', () => {
  it('answer JSON, a CSV download and a JSON download', async () => {
    const formulaId = await createFixtureFormula(a);
    const path = `/api/v1/formulas/${formulaId}/label`;
    const view = await callRoute(formulaLabelRoute.GET, { method: 'GET', path, caller: as(a, 'developer'), params: { formulaId } });
    expect(view.status).toBe(200);
    expect(view.body.subject).toMatchObject({ kind: 'formula', id: formulaId, state: expect.stringMatching(/^Revision 1, saved \d{1,2} \w{3} \d{4}$/), rules: { ruleSet: 'eu', ruleDate: '2026-03-01' } });
    expect(view.body.reference).toMatchObject({ choice: 'typical' });
    const csv = await callRoute(formulaLabelRoute.GET, { method: 'GET', path: `${path}?format=csv`, caller: as(a, 'developer'), params: { formulaId } });
    expect(csv.status).toBe(200);
    expect(String(csv.body).split('\n')[0].trim()).toBe('section,item,value,unrounded');
    const json = await callRoute(formulaLabelRoute.GET, { method: 'GET', path: `${path}?format=json`, caller: as(a, 'developer'), params: { formulaId } });
    expect(json.body).toEqual(view.body.label);
  });

  it('measures a claim against another formula of the workspace, and refuses one of another workspace or a malformed one', async () => {
    const formulaId = await createFixtureFormula(a);
    const { formulaId: heavier } = await createFormula(actorOf(a, 'developer'), await strawberryJamInput(a, { name: 'Heavier jam' }));
    const call = (reference: string) => callRoute(formulaLabelRoute.GET, { method: 'GET', path: `/api/v1/formulas/${formulaId}/label?reference=${encodeURIComponent(reference)}`, caller: as(a, 'developer'), params: { formulaId } });
    const ok = await call(heavier);
    expect(ok.status).toBe(200);
    expect(ok.body.reference).toEqual({ choice: heavier, name: 'Heavier jam' });
    expect(ok.body.label.claims.reference).toBe('Heavier jam');
    const elsewhere = await createFixtureFormula(b);
    expect((await call(elsewhere)).status).toBe(404);
    expect((await call('not-a-formula')).status).toBe(422);
    expect((await call('__proto__')).status).toBe(422);
  });

  it('follow the permissions of what they label', async () => {
    const formulaId = await createFixtureFormula(a);
    const formulaAs = (role: keyof WorkspaceFixture['people']) => callRoute(formulaLabelRoute.GET, { method: 'GET', path: `/api/v1/formulas/${formulaId}/label`, caller: as(a, role), params: { formulaId } });
    expect((await formulaAs('head_of_product')).status).toBe(200);
    expect((await formulaAs('production')).status).toBe(403);
    const { trialId, variantId } = await createPromotableTrial(a);
    const variantAs = (fx: WorkspaceFixture, role: keyof WorkspaceFixture['people']) => callRoute(variantLabelRoute.GET, { method: 'GET', path: `/api/v1/trials/${trialId}/variants/${variantId}/label`, caller: as(fx, role), params: { trialId, variantId } });
    expect((await variantAs(a, 'developer')).status).toBe(200);
    expect((await variantAs(a, 'production')).status).toBe(403);
    expect((await variantAs(b, 'developer')).status).toBe(404);
    const { versionId } = await createApprovedVersion(a);
    expect((await getVersionLabel(versionId, 'production')).status).toBe(200);
    expect((await getVersionLabel(versionId, 'taster')).status).toBe(403);
  });
});
