/**
 * Where the tasting results page spends its server time, piece by piece, on a seeded demo
 * database (not a test, no targets: `npm run bench` holds those). It times the reads, the analysis
 * and the whole load for the demo's largest tasting, and counts the queries one load sends.
 * Usage: DATABASE_URL=… (plus the app's other settings) node --require ./scripts/outside-next.cjs --import tsx scripts/profile-results.ts
 */
import { performance } from 'node:perf_hooks';
import { getOrm, closeOrm } from '../lib/db';
import { TastingAnswer, TastingSeat, Tasting, User, Workspace } from '../entities';
import type { Actor } from '../lib/permissions';
import { getTasting } from '../lib/tastings/queries';
import { getTastingResults, loadTastingData } from '../lib/results/queries';
import { analyseTasting } from '../lib/results/analysis';
import { DEMO_USERS, DEMO_WORKSPACE } from '../lib/seed/demo';

const RUNS = Number(process.env.PROFILE_RUNS ?? 20);

async function timed(name: string, run: () => unknown) {
  for (let i = 0; i < 3; i++) await run();
  const ms: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    await run();
    ms.push(performance.now() - start);
  }
  ms.sort((a, b) => a - b);
  const at = (p: number) => ms[Math.min(ms.length - 1, Math.ceil(p * ms.length) - 1)].toFixed(1);
  console.log(`${name.padEnd(32)} p50 ${at(0.5)} ms, p95 ${at(0.95)} ms`);
}

async function main() {
  const orm = await getOrm();
  const em = orm.em.fork();
  const workspace = await em.findOneOrFail(Workspace, { slug: DEMO_WORKSPACE.slug });
  const developer = DEMO_USERS.find((u) => u.role === 'developer')!;
  const user = await em.findOneOrFail(User, { email: developer.email });
  const actor: Actor = { userId: user.id, email: user.email, name: user.name, workspaceId: workspace.id, workspaceName: workspace.name, role: 'developer', via: 'session', massUnits: 'metric', temperatureUnit: 'C' };
  let largest = { id: '', seats: -1, answers: -1 };
  for (const s of await em.find(Tasting, { workspace: workspace.id })) {
    // The most seats, then the most answers (the demo's rated tasting over its triangle test of as many seats).
    const seats = await em.count(TastingSeat, { session: s.id });
    const answers = await em.count(TastingAnswer, { session: s.id });
    if (seats > largest.seats || (seats === largest.seats && answers > largest.answers)) largest = { id: s.id, seats, answers };
  }
  if (!largest.id) throw new Error('the database has no demo tasting: run npm run db:seed first');
  const { data } = await loadTastingData(actor, largest.id);
  let queries = 0;
  orm.em.getConnection().getKnex().on('query', () => queries++);
  await getTastingResults(actor, largest.id);
  console.log(`tasting ${largest.id}: ${largest.seats} seats, ${data.answers.length} answers, ${data.attributes.length} attributes, ${data.samples.length} samples; ${queries} queries per load`);
  await timed('session view (getTasting)', () => getTasting(actor, largest.id));
  await timed('reads (loadTastingData)', () => loadTastingData(actor, largest.id));
  await timed('analysis (analyseTasting)', () => analyseTasting(data));
  await timed('analysis with pooled penalty', () => analyseTasting(data, { pooledPenalty: true }));
  await timed('whole load (getTastingResults)', () => getTastingResults(actor, largest.id));
  await closeOrm();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
