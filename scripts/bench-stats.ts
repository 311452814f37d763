/**
 * Statistics benchmark (part of `npm run bench`): a rated session of T tasters × S samples ×
 * A attributes is written straight into the bench database, at the base size and at twice the
 * tasters; then the raw fetch and the full analysis are timed side by side (after one untimed round),
 * the two sizes in turns. Each ratio is the median of its per-turn ratios.
 * Prints one line per figure with its target and writes them to bench-results/stats.json.
 */
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { getOrm, closeOrm } from '../lib/db';
import { loadTastingData } from '../lib/results/queries';
import { analyseTasting } from '../lib/results/analysis';
import type { Actor } from '../lib/permissions';

const SAMPLES = 12;
const ATTRIBUTES = 8;
const REPEATS = 9;

async function buildSession(tasters: number): Promise<{ actor: Actor; tastingId: string }> {
  const orm = await getOrm();
  const conn = orm.em.getConnection();
  const ws = randomUUID();
  const user = randomUUID();
  const formula = randomUUID();
  const trial = randomUUID();
  const session = randomUUID();
  await conn.execute(`insert into workspaces (id, name, slug, created_at) values (?, 'Bench kitchen', ?, now())`, [ws, `bench-${ws.slice(0, 8)}`]);
  await conn.execute(`insert into users (id, email, name, mass_units, temperature_unit, created_at) values (?, ?, 'Bench', 'metric', 'C', now())`, [user, `bench-${ws.slice(0, 8)}@bench.example`]);
  await conn.execute(`insert into formulas (id, workspace_id, name, latest_revision, created_by_id, updated_by_id, created_at, updated_at) values (?, ?, 'Bench formula', 1, ?, ?, now(), now())`, [formula, ws, user, user]);
  await conn.execute(`insert into trials (id, workspace_id, number, title, question, owner_id, base_formula_id, base_revision, status, created_at, updated_at) values (?, ?, 1, 'Bench', 'Bench', ?, ?, 1, 'tasting', now(), now())`, [trial, ws, user, formula]);
  const attrs = Array.from({ length: ATTRIBUTES }, () => randomUUID());
  for (const [i, a] of attrs.entries()) {
    const scale = { kind: 'category', id: `b${i}`, name: 'Hedonic', purpose: 'liking', points: Array.from({ length: 9 }, (_, k) => ({ value: 9 - k, label: `p${9 - k}` })) };
    await conn.execute(`insert into sensory_attributes (id, workspace_id, name, instruction, modality, scale, created_at) values (?, ?, ?, 'x', 'liking', ?, now())`, [a, ws, `Attribute ${i + 1}`, JSON.stringify(scale)]);
  }
  await conn.execute(`insert into panel_sessions (id, workspace_id, trial_id, title, method, state, notice, attribute_ids, design, created_by_id, created_at) values (?, ?, ?, 'Bench', 'rated', 'closed', 'x', ?, '{}', ?, now())`, [session, ws, trial, JSON.stringify(attrs), user]);
  const samples: Array<{ id: string; code: string }> = [];
  for (let s = 0; s < SAMPLES; s++) {
    const variant = randomUUID();
    await conn.execute(`insert into variants (id, workspace_id, trial_id, label, is_base, description, factor_levels, settings, lines, summary, position, created_by_id, created_at, updated_at) values (?, ?, ?, ?, false, 'v', '[]', '{}', '[]', '{}', ?, ?, now(), now())`, [variant, ws, trial, String.fromCharCode(65 + s), s, user]);
    const id = randomUUID();
    const code = String(201 + s * 7);
    await conn.execute(`insert into panel_samples (id, workspace_id, session_id, variant_id, code, position) values (?, ?, ?, ?, ?, ?)`, [id, ws, session, variant, code, s]);
    samples.push({ id, code });
  }
  for (let t = 0; t < tasters; t++) {
    const seat = randomUUID();
    await conn.execute(`insert into panel_seats (id, workspace_id, session_id, seat_index, kind, display_name, token_hash, serving_order, design_row, submitted_at, created_at) values (?, ?, ?, ?, 'guest', ?, ?, ?, 'x', now(), now())`, [
      seat, ws, session, t, `T${t}`, randomUUID().replace(/-/g, '') + randomUUID().replace(/-/g, ''), JSON.stringify(samples.map((s) => ({ code: s.code, sampleId: s.id }))),
    ]);
    const values: unknown[] = [];
    const rows: string[] = [];
    for (const [si, s] of samples.entries()) {
      for (const a of attrs) {
        const key = randomUUID();
        rows.push(`(gen_random_uuid(), ?, ?, ?, 'rating', ?, ?, ?, ?, ?, array[?]::uuid[], now(), now())`);
        values.push(ws, session, seat, s.code, a, s.id, 1 + ((t * 7 + si * 3 + a.charCodeAt(0)) % 9), key, key);
      }
    }
    await conn.execute(`insert into panel_answers (id, workspace_id, session_id, seat_id, kind, item, attribute, sample_id, value, idempotency_key, idempotency_keys, created_at, updated_at) values ${rows.join(',')}`, values);
  }
  const actor: Actor = { userId: user, email: '', name: 'Bench', workspaceId: ws, workspaceName: 'Bench', role: 'developer', via: 'session', massUnits: 'metric', temperatureUnit: 'C' };
  return { actor, tastingId: session };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** One timed round of a session: the raw fetch, then the analysis of what it fetched. */
async function round(actor: Actor, tastingId: string): Promise<{ fetchMs: number; analyseMs: number }> {
  const t0 = performance.now();
  const { data } = await loadTastingData(actor, tastingId);
  const t1 = performance.now();
  analyseTasting(data);
  return { fetchMs: t1 - t0, analyseMs: performance.now() - t1 };
}

async function main() {
  try {
    const sessions = [await buildSession(60), await buildSession(120)];
    // One untimed round of each first: the app's server is long-lived, so compiling the code paths
    // (the JIT) and opening pooled connections are paid once, not per results page.
    for (const s of sessions) await round(s.actor, s.tastingId);
    // Then the two sizes in turns, and each ratio within a turn: a figure and the one it is divided
    // by are measured moments apart, so a slower stretch of the shared machine moves both.
    const turns: Array<{ base: { fetchMs: number; analyseMs: number }; double: { fetchMs: number; analyseMs: number } }> = [];
    for (let r = 0; r < REPEATS; r++) {
      const base = await round(sessions[0].actor, sessions[0].tastingId);
      const double = await round(sessions[1].actor, sessions[1].tastingId);
      turns.push({ base, double });
    }
    const summary = (tasters: number, of: 'base' | 'double') => ({
      tasters, answers: tasters * SAMPLES * ATTRIBUTES, fetchMs: median(turns.map((t) => t[of].fetchMs)), analyseMs: median(turns.map((t) => t[of].analyseMs)),
    });
    const base = summary(60, 'base');
    const double = summary(120, 'double');
    const figures = [
      { name: 'stats.analysis_ms_60x12x8', measured: base.analyseMs, target: '< 1000 ms' },
      { name: 'stats.fetch_ms_60x12x8', measured: base.fetchMs, target: '(reference)' },
      { name: 'stats.analysis_over_fetch', measured: median(turns.map((t) => t.base.analyseMs / t.base.fetchMs)), target: '<= 2.0' },
      { name: 'stats.growth_at_twice_the_data', measured: median(turns.map((t) => t.double.analyseMs / t.base.analyseMs)), target: '<= 2.2' },
    ];
    for (const f of figures) console.log(`${f.name.padEnd(34)} ${f.measured.toFixed(f.name.endsWith('ms_60x12x8') ? 1 : 2).padStart(9)}   target ${f.target}`);
    fs.mkdirSync('bench-results', { recursive: true });
    fs.writeFileSync(path.join('bench-results', 'stats.json'), JSON.stringify({ measuredAt: new Date().toISOString(), repeats: REPEATS, base, double, turns, figures }, null, 2));
  } finally {
    await closeOrm();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
