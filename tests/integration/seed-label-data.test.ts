/** The demo seed gives every ingredient of its formulas a complete composition, and one spread near its sorbate limit. */
import { describe, it, expect, beforeAll } from 'vitest';
import './harness';
import { getEm } from '@/lib/db';
import { seedDemo, type SeedReport } from '@/lib/seed/demo';
import { Ingredient } from '@/entities';
import { labelDataOf } from '@/lib/ingredients/queries';
import { missingNutrients } from '@/lib/ingredients/label-data';
import { computeFormula } from '@/lib/formulas/compute';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';

let report: SeedReport;
type Latest = { name: string; settings: FormulaSettingsInput; lines: RevisionLine[] };
let latest: Latest[];

beforeAll(async () => {
  report = await seedDemo(await getEm());
  const em = await getEm();
  latest = await em.getConnection().execute(
    `select distinct on (r.formula_id) f.name, r.settings, r.lines from formula_revisions r join formulas f on f.id = r.formula_id where r.workspace_id = ? order by r.formula_id, r.number desc`,
    [report.workspaceId],
  );
}, 120_000);

describe('demo seed label data', () => {
  it('every ingredient used by a seeded formula has a complete composition', async () => {
    const ids = [...new Set(latest.flatMap((f) => f.lines.map((l) => l.ingredientId)))];
    expect(ids.length).toBeGreaterThan(8);
    const rows = await (await getEm()).find(Ingredient, { workspace: report.workspaceId, id: { $in: ids } });
    expect(rows).toHaveLength(ids.length);
    for (const row of rows) expect(missingNutrients(labelDataOf(row)), row.name).toEqual([]);
    // Cholesterol is optional for the EU but asked by the US panel: the demo's panels have it too.
    for (const row of rows) expect(labelDataOf(row).nutrients.cholesterolMg, row.name).not.toBeNull();
  });

  it('seeds one reduced-sugar spread with potassium sorbate close under 1,000 mg/kg as sorbic acid', () => {
    const spread = latest.find((f) => f.name === 'Strawberry spread, less sugar');
    expect(spread).toBeDefined();
    expect(spread!.settings).toMatchObject({ productClass: 'reduced_sugar_spread', preservation: 'preservative' });
    const outcome = computeFormula(spread!.settings, spread!.lines);
    if (!outcome.ok) throw new Error(outcome.message);
    const sorbate = spread!.lines.find((l) => l.ingredient.name.startsWith('Potassium sorbate'))!;
    // Sorbic acid 112.13 g/mol in potassium sorbate 150.22 g/mol (IUPAC standard atomic weights).
    const sorbicMgPerKg = (sorbate.quantity * (112.13 / 150.22) * 1000) / (outcome.computation.massBalance.finishedMassG / 1000);
    // Regulation (EC) 1333/2008 Annex II, low-sugar jams: E 200–213 at most 1,000 mg/kg as free acid (memory).
    expect(sorbicMgPerKg).toBeGreaterThan(850);
    expect(sorbicMgPerKg).toBeLessThan(1000);
  });

  it('places the closed demo tastings on their own day, in order, not at the time the seed ran', async () => {
    const rows: Array<{ title: string; starts_at: Date; closed_at: Date; first: Date; last: Date; late_submissions: string; open_after_submit: string }> = await (await getEm()).getConnection().execute(
      `select p.title, p.starts_at, p.closed_at, min(a.created_at) as first, max(a.updated_at) as last,
              count(*) filter (where s.submitted_at < a.updated_at) as late_submissions,
              count(*) filter (where s.submitted_at > p.closed_at) as open_after_submit
         from panel_sessions p join panel_answers a on a.session_id = p.id join panel_seats s on s.id = a.seat_id
        where p.workspace_id = ? and p.state = 'closed' and p.title in ('Spread tasting, 19 November', 'Three-cup test, 27 November') group by p.id, p.title, p.starts_at, p.closed_at order by p.starts_at`,
      [report.workspaceId],
    );
    expect(rows.map((r) => r.title)).toEqual(['Spread tasting, 19 November', 'Three-cup test, 27 November']);
    for (const r of rows) {
      expect(new Date(r.first).toISOString().slice(0, 10), r.title).toBe(new Date(r.starts_at).toISOString().slice(0, 10));
      expect(new Date(r.first).getTime()).toBeGreaterThanOrEqual(new Date(r.starts_at).getTime());
      expect(new Date(r.last).getTime()).toBeLessThanOrEqual(new Date(r.closed_at).getTime());
      expect(Number(r.late_submissions), r.title).toBe(0);
      expect(Number(r.open_after_submit), r.title).toBe(0);
    }
  });
});

