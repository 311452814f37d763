/**
 * Where the slow staff pages spend their server time before React: the trial page, the formula
 * editor and the tasting results, piece by piece, on a seeded demo database (not a test, no
 * targets: `npm run bench` holds those). Times each read and computation and counts the queries
 * one whole load sends, and the size of the props each page hands to its client components.
 * Usage: DATABASE_URL=… (plus the app's other settings) node --require ./scripts/outside-next.cjs --import tsx scripts/profile-pages.ts
 */
import { performance } from 'node:perf_hooks';
import { getOrm, closeOrm } from '../lib/db';
import { Formula, TastingAnswer, TastingSeat, Tasting, Trial, User, Workspace } from '../entities';
import type { Actor } from '../lib/permissions';
import { getTrialOverview } from '../lib/trials/queries';
import { getEntry } from '../lib/notebook/queries';
import { listUploads } from '../lib/uploads/queries';
import { listTrialTastings } from '../lib/tastings/queries';
import { getFormula } from '../lib/formulas/queries';
import { listIngredients } from '../lib/ingredients/queries';
import { getTastingResults } from '../lib/results/queries';
import { trialCosts, editorCostBasis } from '../lib/costs/queries';
import { packFormatOfFormulas } from '../lib/pricing/queries';
import { computeFormula } from '../lib/formulas/compute';
import { DEMO_USERS, DEMO_WORKSPACE } from '../lib/seed/demo';

const RUNS = Number(process.env.PROFILE_RUNS ?? 20);
let queries = 0;

async function timed(name: string, run: () => Promise<unknown>) {
  for (let i = 0; i < 3; i++) await run();
  const before = queries;
  const value = await run();
  const perLoad = queries - before;
  const ms: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    await run();
    ms.push(performance.now() - start);
  }
  ms.sort((a, b) => a - b);
  const at = (p: number) => ms[Math.min(ms.length - 1, Math.ceil(p * ms.length) - 1)].toFixed(1);
  const kb = (JSON.stringify(value ?? null).length / 1024).toFixed(1);
  console.log(`${name.padEnd(40)} p50 ${at(0.5).padStart(7)} ms, p95 ${at(0.95).padStart(7)} ms, ${String(perLoad).padStart(3)} queries, ${kb.padStart(7)} kB as JSON`);
}

async function main() {
  const orm = await getOrm();
  orm.em.getConnection().getKnex().on('query', () => queries++);
  const em = orm.em.fork();
  const workspace = await em.findOneOrFail(Workspace, { slug: DEMO_WORKSPACE.slug });
  const developer = DEMO_USERS.find((u) => u.role === 'developer')!;
  const user = await em.findOneOrFail(User, { email: developer.email });
  const actor: Actor = { userId: user.id, email: user.email, name: user.name, workspaceId: workspace.id, workspaceName: workspace.name, role: 'developer', via: 'session', massUnits: 'metric', temperatureUnit: 'C' };
  let largest = { id: '', trialId: '', seats: -1, answers: -1 };
  for (const s of await em.find(Tasting, { workspace: workspace.id })) {
    // The most seats, then the most answers (the demo's rated tasting over its triangle test of as many seats).
    const seats = await em.count(TastingSeat, { session: s.id });
    const answers = await em.count(TastingAnswer, { session: s.id });
    if (seats > largest.seats || (seats === largest.seats && answers > largest.answers)) largest = { id: s.id, trialId: s.trial.id, seats, answers };
  }
  if (!largest.id) throw new Error('the database has no demo tasting: run npm run db:seed first');
  const trial = await em.findOneOrFail(Trial, { id: largest.trialId });
  const formulaId = trial.baseFormula.id;
  await em.findOneOrFail(Formula, { id: formulaId });
  console.log(`trial ${largest.trialId}, formula ${formulaId}, tasting ${largest.id} (${largest.seats} seats)`);
  await timed('trial: getTrialOverview', () => getTrialOverview(actor, largest.trialId));
  await timed('trial: getEntry (notebook)', () => getEntry(actor, largest.trialId, null));
  await timed('trial: listUploads', () => listUploads(actor, largest.trialId));
  await timed('trial: listTrialTastings', () => listTrialTastings(actor, largest.trialId));
  await timed('trial: trialCosts', () => trialCosts(actor, largest.trialId));
  const overview = await getTrialOverview(actor, largest.trialId);
  await timed(`trial: computeFormula × ${overview.variants.length} variants`, async () => overview.variants.map((v) => computeFormula(v.settings, v.lines)).length);
  await timed('formula editor: getFormula', () => getFormula(actor, formulaId));
  await timed('formula editor: editorCostBasis', () => editorCostBasis(actor));
  await timed('formula editor: packFormatOfFormulas', () => packFormatOfFormulas(workspace.id, [formulaId]));
  await timed('formula editor: listIngredients (incl. archived)', () => listIngredients(actor, { archived: 'include' }));
  await timed('results: getTastingResults', () => getTastingResults(actor, largest.id));
  await closeOrm();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
