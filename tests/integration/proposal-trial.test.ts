/** One click from the optimiser: a trial of the proposal and the points around it, through the server action. */
import { describe, it, expect, beforeAll } from 'vitest';
import { asCaller, createWorkspace, type WorkspaceFixture } from './harness';
import { createFixtureFormula } from './fixtures';
import { createProposalTrialAction } from '@/lib/trials/actions';
import { getEm } from '@/lib/db';
import { AuditEvent, Trial, Variant } from '@/entities';
import { formulaFeatures } from '@/lib/modelling/features';

let fx: WorkspaceFixture;
let formulaId: string;
const dev = () => ({ kind: 'session' as const, person: fx.people.developer });

beforeAll(async () => {
  fx = await createWorkspace('Proposal kitchen');
  formulaId = await createFixtureFormula(fx);
});

const count = async () => {
  const em = (await getEm()).fork();
  return { trials: await em.count(Trial, { workspace: fx.workspaceId }), variants: await em.count(Variant, { workspace: fx.workspaceId }) };
};

describe('a trial from a proposal', () => {
  it('makes the base, the proposal and the points around it, each at its point, and audits it', async () => {
    const points = [
      { sugarRatio: 0.8, targetSolidsPct: 60, pectinPct: 0.4, acidPct: 0.3 },
      { sugarRatio: 0.75, targetSolidsPct: 60, pectinPct: 0.4, acidPct: 0.3 },
    ];
    const result = await asCaller(dev(), () => createProposalTrialAction({ formulaId, title: 'Proposal run', question: 'Does it set?', points }));
    expect(result.ok, JSON.stringify(result)).toBe(true);
    if (!result.ok) return;
    const em = (await getEm()).fork();
    const variants = await em.find(Variant, { trial: result.data.trialId }, { orderBy: { position: 'asc' } });
    expect(variants.map((v) => v.label)).toEqual(['A', 'B', 'C']);
    expect(variants[0].isBase).toBe(true);
    expect(variants[1].description).toMatch(/^Proposal: sugar ratio 0\.800, target soluble solids 60\.0/);
    expect(variants[2].description).toMatch(/^Near the proposal: sugar ratio 0\.750/);
    // Each variant's own features are its point: the lines were written back from the point.
    points.forEach((point, i) => {
      const f = formulaFeatures(variants[i + 1].settings, variants[i + 1].lines);
      expect(f.ok).toBe(true);
      if (!f.ok) return;
      expect(f.features.factors.sugarRatio).toBeCloseTo(point.sugarRatio, 9);
      expect(f.features.factors.targetSolidsPct).toBe(point.targetSolidsPct);
      expect(f.features.factors.pectinPct).toBeCloseTo(point.pectinPct, 4);
      expect(f.features.factors.acidPct).toBeCloseTo(point.acidPct, 4);
    });
    const audit = await em.find(AuditEvent, { workspace: fx.workspaceId, subjectId: result.data.trialId });
    expect(audit.map((a) => a.action)).toEqual(['trial.from_proposal']);
  });

  it('refuses bad input with 422 and writes nothing', async () => {
    const before = await count();
    const bad = [
      { formulaId, title: 'X', question: 'Q', points: [] },
      { formulaId, title: 'X', question: 'Q', points: [{ sugarRatio: Number.NaN }] },
      { formulaId, title: 'X', question: 'Q', points: [{ sugarRatio: 1e300 }] },
      { formulaId, title: 'X', question: 'Q', points: [{ pectinPct: 0.5, __proto__: { x: 1 } }] },
      { formulaId, title: 'X', question: 'Q', points: [{ brix: 60 }] },
      { formulaId, title: 'X\u0000', question: 'Q', points: [{ sugarRatio: 0.8 }] },
      // The fixture has no sweetener-free line to hold a zero ratio against; a pectin share of 100 % cannot be made.
      { formulaId, title: 'X', question: 'Q', points: [{ pectinPct: 100 }] },
    ];
    for (const input of bad) {
      const result = await asCaller(dev(), () => createProposalTrialAction(input));
      expect(result.ok, JSON.stringify(input)).toBe(false);
      if (!result.ok) expect(result.status).toBeGreaterThanOrEqual(400);
      if (!result.ok) expect(result.status).toBeLessThan(500);
    }
    expect(await count()).toEqual(before);
  });

  it('is refused to a head of product (no trials.write)', async () => {
    const before = await count();
    const result = await asCaller({ kind: 'session', person: fx.people.head_of_product }, () =>
      createProposalTrialAction({ formulaId, title: 'X', question: 'Q', points: [{ sugarRatio: 0.8 }] }),
    );
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.status).toBe(403);
    expect(await count()).toEqual(before);
  });
});
