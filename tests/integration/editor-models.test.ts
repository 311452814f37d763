/**
 * The formula editor's models are kept per workspace and refitted only when their data change
 * (lib/modelling/editor-models.ts): a second load reuses the fit, and any change to a row the data
 * set is built from (a cook recorded or withdrawn, an answer changed, a variant removed) gives a fit
 * of the new data, equal to one made from scratch. Another workspace's changes leave the fit alone.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { seedDemo, DEMO_USERS } from '@/lib/seed/demo';
import { Formula, User, Variant } from '@/entities';
import { editorModels } from '@/lib/modelling/editor-models';
import { familyModel, familyOfFormula, modelDataset, modelDataVersion } from '@/lib/modelling/queries';
import { recordCook } from '@/lib/trials/mutations';
import type { Actor } from '@/lib/permissions';
import { editorModelOf } from '@/lib/modelling/editor-predictions';
import type { FamilyInfo } from '@/lib/modelling/schema';

let workspaceId: string;
let otherWorkspaceId: string;
let apricot: FamilyInfo;
let developer: Actor;

/** The apricot family's editor model fitted from scratch on today's data. */
const freshApricot = async () => editorModelOf((await familyModel({ workspaceId }, apricot))!);

beforeAll(async () => {
  const report = await seedDemo((await getEm()).fork());
  workspaceId = report.workspaceId;
  otherWorkspaceId = report.otherWorkspaceId;
  const em = (await getEm()).fork();
  const formula = await em.findOneOrFail(Formula, { workspace: workspaceId, name: 'Apricot spread, reduced sugar' });
  apricot = (await familyOfFormula({ workspaceId }, formula.id))!;
  const person = DEMO_USERS.find((u) => u.role === 'developer')!;
  const user = await em.findOneOrFail(User, { email: person.email });
  developer = { userId: user.id, email: user.email, name: user.name, workspaceId, workspaceName: '', role: 'developer', via: 'session', massUnits: 'metric', temperatureUnit: 'C' };
}, 600_000);

/** A variant of the apricot family that is in its data set already (cooked and tasted). */
async function apricotVariant() {
  const { rows } = await modelDataset({ workspaceId }, { family: apricot });
  return (await getEm()).fork().findOneOrFail(Variant, { workspace: workspaceId, id: rows[0].variantId }, { populate: ['trial'] });
}

describe('the editor’s models', () => {
  it('are fitted once and reused while nothing changes', async () => {
    const first = await editorModels(developer);
    const second = await editorModels(developer);
    expect(second).toBe(first);
    expect(first.map((m) => m.family.slug)).toContain(apricot.slug);
    // What is kept is the fit of today's data: the same as a fit from scratch.
    expect(first.find((m) => m.family.slug === apricot.slug)).toEqual(await freshApricot());
    // Only what a prediction needs goes to the browser: no per-run diagnostics.
    const sent = JSON.stringify(first);
    for (const field of ['residuals', 'leverages', 'codedRuns', 'anova', 'fruitContent']) expect(sent).not.toContain(`"${field}"`);
  });

  it('share one object for each equal part of their surfaces, so the page sends it once', async () => {
    const model = (await familyModel({ workspaceId }, apricot))!;
    const cut = editorModelOf(model);
    const surfaces = cut.responses.map((r) => r.surface);
    // Still the full cut, value for value.
    model.responses.forEach(({ surface: s }, i) => expect(surfaces[i]).toEqual({ factors: s.factors, coding: s.coding, dataBox: s.dataBox, terms: s.terms, fit: { basis: s.fit.basis } }));
    // As many objects as distinct values: the demo's responses were not all measured on the same runs.
    const distinct = (parts: unknown[]) => [new Set(parts).size, new Set(parts.map((x) => JSON.stringify(x))).size];
    const matrices = distinct(surfaces.map((x) => x.fit.basis.inverseR));
    expect(matrices[0]).toBe(matrices[1]);
    expect(matrices[0]).toBeLessThan(surfaces.length);
    expect(distinct(surfaces.map((x) => x.terms))).toEqual([1, 1]);
    const ranges = distinct(surfaces.flatMap((x) => [x.coding, x.dataBox]));
    expect(ranges[0]).toBe(ranges[1]);
    // Coefficients are each response's own.
    expect(new Set(surfaces.map((x) => x.fit.basis.coefficients)).size).toBe(surfaces.length);
  });

  it('are refitted after a cook is recorded, and again once it is gone', async () => {
    const before = await editorModels(developer);
    const versionBefore = await modelDataVersion(developer);
    const variant = await apricotVariant();
    const { cookId } = await recordCook(developer, variant.trial.id, { variantId: variant.id, cookDate: '2026-11-30', brixReading: 47.5, ph: 3.4 });
    try {
      const versionAfter = await modelDataVersion(developer);
      expect(versionAfter).not.toBe(versionBefore);
      const after = await editorModels(developer);
      expect(after).not.toBe(before);
      expect(after).not.toEqual(before);
      expect(after.find((m) => m.family.slug === apricot.slug)).toEqual(await freshApricot());
    } finally {
      // The demo workspace is shared with other files, so the test's cook goes again (withdrawing
      // would leave it on record, with its history).
      await sql(`delete from measurements where id = $1`, [cookId]);
    }
    const gone = await editorModels(developer);
    // Without the cook the data are as before, and so is the fit (a refit: recording it also
    // touched the trial's row, which the fingerprint reads too).
    expect(gone).not.toBe(before);
    expect(gone).toEqual(before);
  });

  it('are refitted when an answer is changed outside the application (the fingerprint reads the rows themselves)', async () => {
    const before = await editorModels(developer);
    const [answer] = await sql<{ id: string; value: number }>(
      `select a.id, a.value from panel_answers a join panel_samples s on s.id = a.sample_id where a.workspace_id = $1 and a.kind = 'rating' and a.value is not null and s.variant_id in (select id from variants where workspace_id = $1) order by a.id limit 1`,
      [workspaceId],
    );
    await sql(`update panel_answers set value = $2 where id = $1`, [answer.id, answer.value + 0.5]);
    try {
      const after = await editorModels(developer);
      expect(after).not.toBe(before);
    } finally {
      await sql(`update panel_answers set value = $2 where id = $1`, [answer.id, answer.value]);
    }
    const restored = await editorModels(developer);
    expect(restored).toEqual(before);
  });

  it('are left alone by another workspace’s changes', async () => {
    const version = await modelDataVersion(developer);
    const kept = await editorModels(developer);
    const otherVersion = await modelDataVersion({ workspaceId: otherWorkspaceId });
    // Every workspace starts with the sensory attribute library; rename one of the other's.
    const [attribute] = await sql<{ id: string; name: string }>(`select id, name from sensory_attributes where workspace_id = $1 order by id limit 1`, [otherWorkspaceId]);
    await sql(`update sensory_attributes set name = $2 where id = $1`, [attribute.id, `${attribute.name} (renamed)`]);
    try {
      expect(await modelDataVersion({ workspaceId: otherWorkspaceId })).not.toBe(otherVersion);
      expect(await modelDataVersion(developer)).toBe(version);
      expect(await editorModels(developer)).toBe(kept);
    } finally {
      await sql(`update sensory_attributes set name = $2 where id = $1`, [attribute.id, attribute.name]);
    }
  });
});
