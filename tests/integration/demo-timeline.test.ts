/**
 * The demo reads as one story: no trial starts after its own cooks, it moves to the stove on its
 * first cook day and to the panel after its last, and the formula revision it cooks was saved before
 * it started; a version is requested after its trial's cooks and approved, with its cost of that day,
 * before its first batch. The story's days are fixed while the rows are written on the day of the seed.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { getEm } from '@/lib/db';
import { seedDemo } from '@/lib/seed/demo';
import { sql } from '@/lib/sql';

let workspaceId: string;

beforeAll(async () => {
  workspaceId = (await seedDemo((await getEm()).fork())).workspaceId;
}, 600_000);

describe('the demo timeline', () => {
  it('starts every cooked trial before its first cook, with the revision it cooks saved before that', async () => {
    const rows = await sql<{ code: number; started: string; first_cook: string; revision_saved: string }>(
      `SELECT t.number AS code, t.created_at::date::text AS started, min(m.cook_date)::text AS first_cook, r.created_at::date::text AS revision_saved
         FROM trials t JOIN variants v ON v.trial_id = t.id JOIN measurements m ON m.variant_id = v.id
         JOIN formula_revisions r ON r.formula_id = t.base_formula_id AND r.number = t.base_revision
        WHERE t.workspace_id = $1 GROUP BY t.id, r.created_at`,
      [workspaceId],
    );
    expect(rows.length).toBeGreaterThanOrEqual(3);
    for (const r of rows) {
      expect(r.started < r.first_cook, `T-${r.code} started ${r.started}, first cook ${r.first_cook}`).toBe(true);
      expect(r.revision_saved < r.started, `T-${r.code}'s revision saved ${r.revision_saved}`).toBe(true);
    }
  });

  it('moves a trial to the stove no later than its first cook and to the panel no earlier than its last', async () => {
    const rows = await sql<{ code: number; to_status: string; changed: string; first_cook: string; last_cook: string }>(
      `SELECT t.number AS code, s.to_status, s.changed_at::date::text AS changed, c.first_cook::text, c.last_cook::text
         FROM trial_status_changes s JOIN trials t ON t.id = s.trial_id
         JOIN (SELECT v.trial_id, min(m.cook_date) AS first_cook, max(m.cook_date) AS last_cook
                 FROM measurements m JOIN variants v ON v.id = m.variant_id GROUP BY v.trial_id) c ON c.trial_id = t.id
        WHERE t.workspace_id = $1 AND s.to_status IN ('cooking', 'tasting')`,
      [workspaceId],
    );
    expect(rows.some((r) => r.to_status === 'cooking')).toBe(true);
    for (const r of rows) {
      if (r.to_status === 'cooking') expect(r.changed <= r.first_cook, `T-${r.code} to the stove ${r.changed}`).toBe(true);
      else expect(r.changed >= r.last_cook, `T-${r.code} to the panel ${r.changed}`).toBe(true);
    }
  });

  it('approves a version, costed that day, after its trial was cooked and before its first batch', async () => {
    const rows = await sql<{ code: string; version: number; last_cook: string; requested: string; approved: string; costed: string | null; first_batch: string }>(
      `SELECT p.code, v.version, (SELECT max(m.cook_date) FROM measurements m JOIN variants x ON x.id = m.variant_id WHERE x.trial_id = v.source_trial_id)::text AS last_cook,
              r.requested_at::date::text AS requested, v.approved_at::date::text AS approved, v.cost_at_approval->>'asOf' AS costed,
              min(b.batch_date)::text AS first_batch
         FROM production_formulas v JOIN products p ON p.id = v.product_id JOIN promotion_requests r ON r.id = v.promotion_request_id
         JOIN batch_records b ON b.production_formula_id = v.id
        WHERE v.workspace_id = $1 GROUP BY p.code, v.id, r.requested_at`,
      [workspaceId],
    );
    expect(rows.length).toBeGreaterThanOrEqual(1);
    for (const r of rows) {
      const where = `${r.code} v${r.version}`;
      expect(r.last_cook < r.requested, `${where} requested ${r.requested}, last cook ${r.last_cook}`).toBe(true);
      expect(r.requested <= r.approved, `${where} approved ${r.approved}`).toBe(true);
      expect(r.approved < r.first_batch, `${where} first batch ${r.first_batch}`).toBe(true);
      if (r.costed !== null) expect(r.costed, where).toBe(r.approved);
    }
  });

  it('records each batch on its own day and decides about it on or after that day', async () => {
    const rows = await sql<{ lot_code: string; batch_date: string; recorded: string; decided: string | null }>(
      `SELECT b.lot_code, b.batch_date::text, b.created_at::date::text AS recorded, min(d.created_at)::date::text AS decided
         FROM batch_records b LEFT JOIN batch_decisions d ON d.batch_id = b.id
        WHERE b.workspace_id = $1 GROUP BY b.id`,
      [workspaceId],
    );
    expect(rows.length).toBeGreaterThanOrEqual(5);
    expect(rows.some((r) => r.decided !== null)).toBe(true);
    for (const r of rows) {
      expect(r.recorded, `${r.lot_code} recorded`).toBe(r.batch_date);
      if (r.decided !== null) expect(r.decided >= r.batch_date, `${r.lot_code} decided ${r.decided}`).toBe(true);
    }
  });
});
