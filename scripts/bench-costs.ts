/**
 * Costing benchmark (part of `npm run bench`): an invented kitchen whose ingredients and packaging
 * each have three years of daily prices (one point per day). Times the cost reads the pages use —
 * a trial of 12 variants (trialCosts) and a product of 24 versions, each with its cost frozen at
 * approval and today's (productCosts) — against fetching those price rows outright (every point of
 * the three years for the same ingredients and packaging). Median of 7 runs; target: costing at
 * most twice the fetch. Writes bench-results/costs.json.
 */
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { getOrm, closeOrm } from '../lib/db';
import { sql } from '../lib/sql';
import { Membership, User, Workspace } from '../entities';
import { addStarterLibrary } from '../lib/ingredients/mutations';
import { starterIdsByKey } from '../lib/ingredients/queries';
import { createFormula } from '../lib/formulas/mutations';
import { createTrial } from '../lib/trials/mutations';
import { costOn, loadCostBasis, productCosts, trialCosts } from '../lib/costs/queries';
import { todayIso } from '../lib/format/dates';
import type { Actor } from '../lib/permissions';

const VARIANTS = 12;
const VERSIONS = 24;
const DAYS = 3 * 365 + 1;
const REPEATS = 7;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

async function build() {
  const orm = await getOrm();
  const em = orm.em.fork();
  const conn = em.getConnection();
  const tag = randomUUID().slice(0, 8);
  const ws = em.create(Workspace, { name: `Bench costing ${tag}`, slug: `bench-cost-${tag}` });
  const user = em.create(User, { email: `bench.cost.${tag}@bench.example`, name: 'Bench developer', passwordHash: null });
  em.create(Membership, { workspace: ws, user, role: 'developer' });
  await em.flush();
  await addStarterLibrary(em, ws.id);
  const actor: Actor = { userId: user.id, email: '', name: 'Bench developer', workspaceId: ws.id, workspaceName: ws.name, role: 'developer', via: 'session', massUnits: 'metric', temperatureUnit: 'C' };
  const ids = await starterIdsByKey(em, ws.id);
  const used = [ids.strawberry, ids.sucrose, ids.pectin_hm_rapid_150, ids.citric_acid_anhydrous];
  const { formulaId } = await createFormula(actor, {
    name: 'Bench jam', settings: { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-03-01', targetSolidsPct: 65, jarNetFillG: 340 },
    lines: [{ ingredientId: ids.strawberry, quantity: 1000, unit: 'g' }, { ingredientId: ids.sucrose, quantity: 1000, unit: 'g' }, { ingredientId: ids.pectin_hm_rapid_150, quantity: 6, unit: 'g' }, { ingredientId: ids.citric_acid_anhydrous, quantity: 5, unit: 'g' }],
  });
  const { trialId } = await createTrial(actor, { title: 'Bench costing trial', question: 'Cost', formulaId });
  const [base] = await conn.execute<Array<{ id: string; settings: unknown; lines: Array<{ quantity: number }> }>>(`select id, settings, lines from variants where trial_id = ?`, [trialId]);
  // Variants B… differ in sugar, 800 g to 1,350 g.
  for (let i = 1; i < VARIANTS; i++) {
    const lines = base.lines.map((l, k) => (k === 1 ? { ...l, quantity: 800 + i * 50 } : l));
    await conn.execute(
      `insert into variants (id, workspace_id, trial_id, label, is_base, description, factor_levels, settings, lines, summary, position, created_by_id, created_at, updated_at)
       values (?, ?, ?, ?, false, 'sugar', '[]', ?, ?, '{}', ?, ?, now(), now())`,
      [randomUUID(), ws.id, trialId, String.fromCharCode(65 + i), JSON.stringify(base.settings), JSON.stringify(lines), i, user.id],
    );
  }
  await conn.execute(`insert into cost_settings (id, workspace_id, currency, overfill_pct, cost_warning_pct, updated_by_id, updated_at) values (?, ?, 'GBP', 2, 5, ?, now())`, [randomUUID(), ws.id, user.id]);
  // Packaging: four items, one pack format.
  const items = ['jar', 'lid', 'label', 'case'].map(() => randomUUID());
  const packFormat = randomUUID();
  await conn.execute(`insert into pack_formats (id, workspace_id, name, net_fill_g, created_at) values (?, ?, '340 g jar', 340, now())`, [packFormat, ws.id]);
  for (const [i, item] of items.entries()) {
    await conn.execute(`insert into packaging_items (id, workspace_id, name, kind, created_at) values (?, ?, ?, ?, now())`, [item, ws.id, `Bench ${['jar', 'lid', 'label', 'case'][i]}`, ['jar', 'lid', 'label', 'case'][i]]);
    await conn.execute(`insert into pack_format_items (id, workspace_id, pack_format_id, packaging_item_id, pieces, per_jars, position) values (?, ?, ?, ?, 1, ?, ?)`, [randomUUID(), ws.id, packFormat, item, i === 3 ? 12 : 1, i]);
  }
  await conn.execute(`update formulas set pack_format_id = ? where id = ?`, [packFormat, formulaId]);
  // Three years of daily prices, ending today: a small drift so every day differs.
  const start = `current_date - ${DAYS - 1}`;
  for (const [i, ingredient] of used.entries()) {
    await conn.execute(
      `insert into ingredient_prices (id, workspace_id, ingredient_id, valid_from, pack_price_minor, pack_size_g, supplier, entered_by_id, entered_at)
       select gen_random_uuid(), ?, ?, ${start} + d, ? + (d % 97), 25000, 'Bench supplier', ?, now() from generate_series(0, ${DAYS - 1}) d`,
      [ws.id, ingredient, 2000 + i * 500, user.id],
    );
  }
  for (const item of items) {
    await conn.execute(
      `insert into packaging_prices (id, workspace_id, packaging_item_id, valid_from, pack_price_minor, pieces_per_pack, supplier, entered_by_id, entered_at)
       select gen_random_uuid(), ?, ?, ${start} + d, 3000 + (d % 53), 100, 'Bench supplier', ?, now() from generate_series(0, ${DAYS - 1}) d`,
      [ws.id, item, user.id],
    );
  }
  // A product with 24 versions approved over the three years, each with its frozen cost.
  const product = randomUUID();
  await conn.execute(`insert into products (id, workspace_id, code, name, created_by_id, created_at) values (?, ?, 'BCH', 'Bench product', ?, now())`, [product, ws.id, user.id]);
  const variants = await conn.execute<Array<{ id: string; label: string; settings: unknown; lines: unknown }>>(`select id, label, settings, lines from variants where trial_id = ? order by position`, [trialId]);
  for (let v = 1; v <= VERSIONS; v++) {
    const source = variants[v % variants.length];
    const daysAgo = Math.round(((VERSIONS - v) / VERSIONS) * (DAYS - 1));
    const frozen = { asOf: 'x', currency: 'GBP', packFormatName: '340 g jar', batchMinor: 500, perKgMinor: 250, perJarMinor: 120 + v, complete: true, missing: [] };
    await conn.execute(
      `insert into production_formulas (id, workspace_id, product_id, version, status, settings, lines, process, compliance, spec, source_trial_id, source_variant_id, source_variant_label, promotion_request_id, approved_by_id, approved_at, superseded_at, superseded_by_version, pack_format_id, cost_at_approval)
       values (?, ?, ?, ?, ?, ?, ?, '{}', '{}', '{}', ?, ?, ?, ?, ?, now() - (? || ' days')::interval, ?, ?, ?, ?)`,
      [randomUUID(), ws.id, product, v, v === VERSIONS ? 'current' : 'superseded', JSON.stringify(source.settings), JSON.stringify(source.lines), trialId, source.id, source.label, randomUUID(), user.id, String(daysAgo),
        v === VERSIONS ? null : new Date(), v === VERSIONS ? null : v + 1, packFormat, JSON.stringify({ ...frozen, asOf: todayIso(new Date(Date.now() - daysAgo * 86_400_000)) })],
    );
  }
  return { actor, trialId, productId: product, ingredientIds: used, itemIds: items };
}

async function main() {
  try {
    const b = await build();
    const conn = (await getOrm()).em.fork().getConnection();
    const fetchMs: number[] = [];
    const costMs: number[] = [];
    const computeMs: number[] = [];
    let rows = 0;
    // The arithmetic alone: the same 36 formulas costed from prices already in memory (the full three years).
    const formulas = await conn.execute<Array<{ settings: never; lines: never; pack_format_id: string | null }>>(
      `select v.settings, v.lines, f.pack_format_id from variants v join trials t on t.id = v.trial_id join formulas f on f.id = t.base_formula_id where v.trial_id = ?
       union all select settings, lines, pack_format_id from production_formulas where product_id = ?`, [b.trialId, b.productId]);
    const basis = await loadCostBasis(b.actor.workspaceId, { ingredientIds: b.ingredientIds, packFormatIds: [...new Set(formulas.map((f) => f.pack_format_id!))], from: todayIso(new Date(Date.now() - DAYS * 86_400_000)), to: todayIso() });
    for (let r = 0; r < REPEATS; r++) {
      const t0 = performance.now();
      // Through the same pool (lib/sql) the cost reads use, so the ratio compares work, not drivers.
      const ing = await sql(`select ingredient_id, valid_from, pack_price_minor, pack_size_g, supplier from ingredient_prices where workspace_id = $1 and ingredient_id = any($2::uuid[]) and withdrawn_at is null order by ingredient_id, valid_from`, [b.actor.workspaceId, b.ingredientIds]);
      const pkg = await sql(`select packaging_item_id, valid_from, pack_price_minor, pieces_per_pack, supplier from packaging_prices where workspace_id = $1 and packaging_item_id = any($2::uuid[]) and withdrawn_at is null order by packaging_item_id, valid_from`, [b.actor.workspaceId, b.itemIds]);
      const t1 = performance.now();
      const trial = await trialCosts(b.actor, b.trialId);
      const product = await productCosts(b.actor, b.productId);
      const t2 = performance.now();
      if (trial.variants.length !== VARIANTS || product.versions.length !== VERSIONS || !trial.variants.every((v) => v.result.ok && v.result.cost.complete)) throw new Error('the bench data did not cost completely');
      const t3 = performance.now();
      for (const f of formulas) costOn(basis, f.settings, f.lines, f.pack_format_id, todayIso());
      computeMs.push(performance.now() - t3);
      rows = ing.length + pkg.length;
      fetchMs.push(t1 - t0);
      costMs.push(t2 - t1);
    }
    const fetch = median(fetchMs);
    const cost = median(costMs);
    const figures = [
      { name: 'costs.fetch_ms_3y_daily_rows', measured: fetch, target: `(reference: ${rows} price rows)` },
      { name: 'costs.cost_ms_12_variants_24_versions', measured: cost, target: '(reference)' },
      { name: 'costs.cost_over_fetch', measured: cost / fetch, target: '<= 2.0' },
      { name: 'costs.arithmetic_ms_36_formulas', measured: median(computeMs), target: '(reference: prices in memory)' },
    ];
    for (const f of figures) console.log(`${f.name.padEnd(40)} ${f.measured.toFixed(f.name.includes('_ms_') ? 1 : 2).padStart(9)}   target ${f.target}`);
    fs.mkdirSync('bench-results', { recursive: true });
    fs.writeFileSync(path.join('bench-results', 'costs.json'), JSON.stringify({ measuredAt: new Date().toISOString(), rows, fetchMs, costMs, computeMs, figures }, null, 2));
  } finally {
    await closeOrm();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
