/**
 * The taster soak (run by scripts/soak.sh, which starts the cluster and `next start`).
 *
 * 1. Sets up one open rated tasting with guest seats through lib/tastings (the organiser's side).
 * 2. Every simulated taster, concurrently, does what the phone does over HTTP: reads its seat,
 *    consents, answers every sample × attribute with random pauses (PUT …/answers with an
 *    idempotency key), then submits. 10 % of answers are sent twice with the same key, half as a
 *    double tap (both at once) and half as a resend after the first reply. Another 10 % are
 *    changed (a new key and value after the first was acknowledged), and the first request is then
 *    replayed late, 0.3–3 s on, as a network holding a copy would: it must be a 2xx and change nothing.
 *    Two app processes serve the one database, as behind a load balancer: tasters are spread over
 *    them, and every second copy and every retry goes to the other process, so a process that
 *    kept anything of its own would show here as a duplicate or a refusal.
 * 3. PostgreSQL is restarted once (pg_ctl restart -m fast) while requests are in flight. Clients
 *    retry a 5xx, a connection error or a timeout with backoff, as the phone's queue does; an
 *    answer counts as acknowledged only on a 2xx.
 * 4. The database must hold every acknowledged answer exactly once with its latest value and key,
 *    none set back by a stale replay, and nothing else; the app log must hold no seat token, token
 *    hash or idempotency key. 503s (the database away) are expected around the restart; a 500 is not.
 * Prints the counts and exits non-zero on any loss, duplicate, regression, HTTP 500, stray row or leak.
 */
import fs from 'node:fs';
import path from 'node:path';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { randomUUID, randomInt } from 'node:crypto';
import { Pool } from 'pg';
import { getEm, closeOrm } from '../lib/db';
import { Membership, User, Variant, Workspace, Ingredient } from '../entities';
import { addStarterLibrary } from '../lib/ingredients/mutations';
import { addDefaultAttributes, createTasting, openTasting, joinAsGuest } from '../lib/tastings/mutations';
import { listAttributes } from '../lib/tastings/queries';
import { createFormula } from '../lib/formulas/mutations';
import { createTrial, planVariants } from '../lib/trials/mutations';
import { hashSecret } from '../lib/secrets';
import type { Actor } from '../lib/permissions';
import type { TasterView } from '../lib/tastings/schema';

const SHORT = process.argv.includes('--short');
const PLAN = SHORT
  ? { tasters: 20, samples: 4, attributes: 3, pauseMs: [150, 900] as const }
  : { tasters: 200, samples: 6, attributes: 4, pauseMs: [50, 700] as const };
const DUPLICATE_SHARE = 0.1;
/** Share of answers changed once and then hit by a late replay of the first request. */
const STALE_REPLAY_SHARE = 0.1;
const STALE_REPLAY_DELAY_MS = [300, 3000] as const;
/** The restart starts once this share of answers is acknowledged. */
const RESTART_AT = 0.4;
const MAX_ATTEMPTS = 12;
const REQUEST_TIMEOUT_MS = 15_000;

const APPS = process.env.SOAK_APP_URLS!.split(',');
const PG_DATA = process.env.SETWELL_PG_DATA!;
const PG_BIN = process.env.SETWELL_PG_BIN!;
const APP_LOGS = (process.env.SOAK_APP_LOGS ?? '').split(',').filter(Boolean);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const pause = () => sleep(randomInt(PLAN.pauseMs[0], PLAN.pauseMs[1]));

// ---- 1. the session, set up through the organiser's code paths ----

async function setUpSession(): Promise<{ tastingId: string; seats: Array<{ token: string; seatId: string }> }> {
  const em = await getEm();
  const tag = randomUUID().slice(0, 8);
  const workspace = em.create(Workspace, { name: `Soak kitchen ${tag}`, slug: `soak-${tag}` });
  const user = em.create(User, { email: `organiser.${tag}@soak.example`, name: 'Soak organiser', passwordHash: null });
  em.create(Membership, { workspace, user, role: 'developer' });
  await em.flush();
  await addStarterLibrary(em, workspace.id);
  await addDefaultAttributes(em, workspace.id);
  const actor: Actor = {
    userId: user.id, email: user.email, name: 'Soak organiser', workspaceId: workspace.id, workspaceName: workspace.name,
    role: 'developer', via: 'session', massUnits: 'metric', temperatureUnit: 'C',
  };
  const ids = Object.fromEntries((await em.find(Ingredient, { workspace: workspace.id, typicalKey: { $ne: null } })).map((r) => [r.typicalKey!, r.id]));
  const { formulaId } = await createFormula(actor, {
    name: 'Soak strawberry jam',
    settings: { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-03-01', targetSolidsPct: 65, jarNetFillG: 340 },
    lines: [
      { ingredientId: ids.strawberry, quantity: 1000, unit: 'g' },
      { ingredientId: ids.sucrose, quantity: 1000, unit: 'g' },
      { ingredientId: ids.pectin_hm_rapid_150, quantity: 6, unit: 'g' },
      { ingredientId: ids.citric_acid_anhydrous, quantity: 5.5, unit: 'g' },
    ],
  });
  const { trialId } = await createTrial(actor, { title: 'Soak trial', question: 'Do answers survive a database restart?', formulaId });
  await planVariants(actor, trialId, {
    kind: 'full_factorial', centrePoint: false,
    factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.2 }, { factor: 'acid_dose', low: 3, high: 7 }, { factor: 'pectin_dose', low: 4, high: 8 }],
  });
  const variants = await em.fork().find(Variant, { trial: trialId }, { orderBy: { position: 'asc' } });
  const attributes = (await listAttributes(actor)).slice(0, PLAN.attributes);
  const { tastingId } = await createTasting(actor, trialId, {
    title: 'Soak tasting', method: 'rated', notice: 'Simulated tasters only.',
    variantIds: variants.slice(0, PLAN.samples).map((v) => v.id), attributeIds: attributes.map((a) => a.id),
  });
  const { joinCode } = await openTasting(actor, tastingId);
  // Joining through lib skips the per-address join limit, which 200 phones behind one address would hit.
  const tokens: string[] = [];
  for (let i = 0; i < PLAN.tasters; i++) tokens.push((await joinAsGuest({ joinCode, displayName: `Taster ${i + 1}` })).seatToken);
  const rows = await em.getConnection().execute<Array<{ id: string; token_hash: string }>>('select id, token_hash from panel_seats where session_id = ?', [tastingId]);
  const byHash = new Map(rows.map((r) => [r.token_hash, r.id]));
  return { tastingId, seats: tokens.map((token) => ({ token, seatId: byHash.get(hashSecret(token))! })) };
}

// ---- 2./3. the tasters and the restart ----

const counts = {
  requestsSent: 0,
  duplicatesSent: 0,
  retries: 0,
  failuresDuringRestart: 0,
  failuresOutsideRestart: 0,
  acknowledgedAnswers: 0,
  acknowledgedRequests: 0,
  refused: 0,
  gaveUp: 0,
  staleReplaysSent: 0,
  /** Stale replays whose 2xx reply said duplicate and stale, as it must. */
  staleReplaysRecognised: 0,
  http500: 0,
  http503: 0,
  /** Any other 5xx status. */
  httpOther5xx: 0,
};
/** Requests each app process answered (any status), to show both took their share. */
const answeredBy = APPS.map(() => 0);
/** Per kind of failure: how many, and when (ms after the load began) the first and last came. */
const failureKinds = new Map<string, { n: number; first: number; last: number }>();
const answerLatencies: number[] = [];
let loadStartedAt = 0;
let inFlight = 0;
/** From the restart's start until 10 s after pg_ctl returned, a failure counts as caused by it. */
const restart = { startedAt: 0, endedAt: 0, inFlightAtStart: 0, tookMs: 0, healthyAfterMs: -1, done: false };

function failureDuringRestart(now: number): boolean {
  return restart.startedAt > 0 && now >= restart.startedAt && (restart.endedAt === 0 || now <= restart.endedAt + 10_000);
}

function noteFailure(kind: string) {
  const t = Date.now() - loadStartedAt;
  const k = failureKinds.get(kind) ?? { n: 0, first: t, last: t };
  failureKinds.set(kind, { n: k.n + 1, first: Math.min(k.first, t), last: Math.max(k.last, t) });
  if (failureDuringRestart(Date.now())) counts.failuresDuringRestart++;
  else counts.failuresOutsideRestart++;
}

/**
 * One request with the phone's retry policy: 5xx, connection errors and timeouts are retried
 * with exponential backoff and jitter; anything else below 500 that is not 2xx is refused.
 * The first attempt goes to app process `home`; each retry moves on to the next process.
 */
async function call<T>(home: number, method: 'GET' | 'POST' | 'PUT', url: string, body?: unknown): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    if (attempt > 1) counts.retries++;
    counts.requestsSent++;
    inFlight++;
    let kind: string;
    const sentAt = Date.now();
    const app = (home + attempt - 1) % APPS.length;
    try {
      const res = await fetch(`${APPS[app]}${url}`, {
        method,
        headers: body === undefined ? {} : { 'content-type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
        signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
      });
      const text = await res.text();
      answeredBy[app]++;
      if (res.ok) {
        if (method === 'PUT') answerLatencies.push(Date.now() - sentAt);
        return JSON.parse(text) as T;
      }
      if (res.status < 500) {
        counts.refused++;
        throw Object.assign(new Error(`${method} ${url.replace(/sws_[\w-]+/, 'sws_…')} → ${res.status} ${text.slice(0, 200)}`), { final: true });
      }
      if (res.status === 500) counts.http500++;
      else if (res.status === 503) counts.http503++;
      else counts.httpOther5xx++;
      kind = `HTTP ${res.status}`;
    } catch (err) {
      if ((err as { final?: boolean }).final) throw err;
      kind = (err as Error).name === 'TimeoutError' ? 'timeout' : `connection (${((err as { cause?: { code?: string } }).cause?.code) ?? (err as Error).message})`;
    } finally {
      inFlight--;
    }
    noteFailure(kind);
    if (attempt >= MAX_ATTEMPTS) {
      counts.gaveUp++;
      throw new Error(`${method} ${url.replace(/sws_[\w-]+/, 'sws_…')}: gave up after ${attempt} attempts (last: ${kind})`);
    }
    await sleep(Math.min(3000, 100 * 2 ** (attempt - 1)) * (0.5 + Math.random()));
  }
}

interface Acknowledged { seatId: string; code: string; attributeId: string; value: number; key: string }
const acknowledged = new Map<string, Acknowledged>();
/** The first key of each changed answer, replayed late: the stored row must never carry it again. */
const staleKeys = new Map<string, string>();
const allKeys: string[] = [];

function randomValueOn(scale: TasterView['attributes'][number]['scale']): number {
  if (scale.kind === 'category') return scale.points[randomInt(scale.points.length)].value;
  const steps = Math.round((scale.max - scale.min) / scale.step);
  return Number((scale.min + randomInt(steps + 1) * scale.step).toFixed(6));
}

type AnswerReply = { stored: boolean; duplicate: boolean; stale: boolean };

async function taster(seat: { token: string; seatId: string }, home: number, doubled: Set<number>, changed: Set<number>, firstIndex: number): Promise<void> {
  const base = `/api/v1/tastings/seats/${seat.token}`;
  const other = home + 1;
  await pause();
  const view = await call<TasterView>(home, 'GET', base);
  await call(other, 'POST', `${base}/consent`);
  let index = firstIndex;
  const lateReplays: Array<Promise<void>> = [];
  for (const sample of view.samples) {
    for (const attribute of view.attributes) {
      await pause();
      const question = `${seat.seatId}|${sample.code}|${attribute.id}`;
      let answer = { idempotencyKey: randomUUID(), code: sample.code, attributeId: attribute.id, value: randomValueOn(attribute.scale) };
      allKeys.push(answer.idempotencyKey);
      const first = changed.has(index) ? answer : null;
      if (first) {
        // A change of mind: the first answer is acknowledged, then replaced; once the new one is
        // acknowledged too, a copy of the first arrives late.
        await call<AnswerReply>(home, 'PUT', `${base}/answers`, first);
        counts.acknowledgedRequests++;
        answer = { ...first, idempotencyKey: randomUUID(), value: randomValueOn(attribute.scale) };
        allKeys.push(answer.idempotencyKey);
        staleKeys.set(question, first.idempotencyKey);
      }
      const current = answer;
      const send = (app: number) => call<AnswerReply>(app, 'PUT', `${base}/answers`, current);
      const twice = doubled.has(index++);
      if (twice) counts.duplicatesSent++;
      if (twice && index % 2 === 0) {
        await Promise.all([send(home), send(other)]); // a double tap, one copy to each process
      } else {
        await send(home);
        if (twice) {
          await sleep(randomInt(20, 300));
          await send(other); // the reply was lost, so the phone sends it again, reaching the other process
        }
      }
      counts.acknowledgedRequests += twice ? 2 : 1;
      counts.acknowledgedAnswers++;
      if (first) {
        lateReplays.push((async () => {
          await sleep(randomInt(STALE_REPLAY_DELAY_MS[0], STALE_REPLAY_DELAY_MS[1]));
          counts.staleReplaysSent++;
          const reply = await call<AnswerReply>(other, 'PUT', `${base}/answers`, first);
          counts.acknowledgedRequests++;
          if (reply.duplicate && reply.stale) counts.staleReplaysRecognised++;
        })());
      }
      acknowledged.set(question, { seatId: seat.seatId, code: sample.code, attributeId: attribute.id, value: answer.value, key: answer.idempotencyKey });
    }
  }
  await Promise.all(lateReplays);
  await pause();
  await call(other, 'POST', `${base}/submit`);
}

const execFileAsync = promisify(execFile);

async function restartPostgresWhenDue(total: number, stop: () => boolean): Promise<void> {
  while (!stop()) {
    if (counts.acknowledgedAnswers >= total * RESTART_AT && inFlight > 0) break;
    await sleep(5);
  }
  if (stop()) return;
  restart.startedAt = Date.now();
  restart.inFlightAtStart = inFlight;
  const args = ['-D', PG_DATA, '-m', 'fast', '-w', '-t', '60', 'restart', '-l', path.join(path.dirname(PG_DATA), 'log', 'postgres.log')];
  const root = process.getuid?.() === 0;
  await execFileAsync(root ? 'runuser' : `${PG_BIN}/pg_ctl`, root ? ['-u', 'postgres', '--', `${PG_BIN}/pg_ctl`, ...args] : args);
  restart.endedAt = Date.now();
  restart.tookMs = restart.endedAt - restart.startedAt;
  restart.done = true;
  // The load balancer's view: how soon /api/health says ok again on every process.
  for (let i = 0; i < 300; i++) {
    const healthy = await Promise.all(APPS.map((app) => fetch(`${app}/api/health`, { signal: AbortSignal.timeout(5000) }).then((r) => r.ok, () => false)));
    if (healthy.every(Boolean)) {
      restart.healthyAfterMs = Date.now() - restart.startedAt;
      return;
    }
    await sleep(100);
  }
}

// ---- 4. the checks ----

async function checkDatabase(tastingId: string) {
  const pool = new Pool({ connectionString: process.env.DATABASE_URL, max: 1 });
  try {
    const { rows } = await pool.query<{ seat_id: string; item: string; attribute: string; value: number | null; idempotency_key: string; copies: number }>(
      `select seat_id, item, attribute, value::float8 as value, idempotency_key,
              count(*) over (partition by seat_id, item, attribute)::int as copies
         from panel_answers where session_id = $1`,
      [tastingId],
    );
    const seats = await pool.query<{ submitted: number }>('select count(*) filter (where submitted_at is not null)::int as submitted from panel_seats where session_id = $1', [tastingId]);
    let missing = 0;
    let wrongValue = 0;
    let regressed = 0;
    const stored = new Map<string, (typeof rows)[number]>();
    for (const r of rows) stored.set(`${r.seat_id}|${r.item}|${r.attribute}`, r);
    for (const [k, a] of acknowledged) {
      const r = stored.get(k);
      if (!r) missing++;
      else if (r.value !== a.value || r.idempotency_key !== a.key) wrongValue++;
      if (r && r.idempotency_key === staleKeys.get(k)) regressed++;
    }
    const duplicated = rows.filter((r) => r.copies > 1).length;
    const extra = [...stored.keys()].filter((k) => !acknowledged.has(k)).length;
    return { rowsStored: rows.length, missing, duplicated, wrongValue, regressed, extra, submitted: seats.rows[0].submitted };
  } finally {
    await pool.end();
  }
}

function scanAppLogs(seats: Array<{ token: string }>) {
  if (APP_LOGS.length !== APPS.length || !APP_LOGS.every((f) => fs.existsSync(f))) return { lines: 0, errors: 0, missing: true, leaks: [] as string[] };
  const text = APP_LOGS.map((f) => fs.readFileSync(f, 'utf8')).join('\n');
  const lines = text.split('\n').filter(Boolean);
  const errors = lines.filter((l) => l.includes('"level":50')).length;
  const leaks: string[] = [];
  for (const s of seats) {
    if (text.includes(s.token.slice(4))) leaks.push('a seat token');
    if (text.includes(hashSecret(s.token))) leaks.push('a seat token hash');
  }
  if (allKeys.some((k) => text.includes(k))) leaks.push('an idempotency key (so the answer with it)');
  return { lines: lines.length, errors, missing: false, leaks: [...new Set(leaks)] };
}

async function main() {
  const started = Date.now();
  const { tastingId, seats } = await setUpSession();
  await closeOrm();
  const perTaster = PLAN.samples * PLAN.attributes;
  const total = PLAN.tasters * perTaster;
  const pick = new Set<number>();
  while (pick.size < Math.round(total * DUPLICATE_SHARE)) pick.add(randomInt(total));
  const changed = new Set<number>();
  while (changed.size < Math.round(total * STALE_REPLAY_SHARE)) changed.add(randomInt(total));
  console.log(`soak: ${PLAN.tasters} tasters × ${PLAN.samples} samples × ${PLAN.attributes} attributes = ${total} answers${SHORT ? ' (short)' : ''}, over ${APPS.length} app processes`);

  let finished = false;
  const load = Date.now();
  loadStartedAt = load;
  const restarter = restartPostgresWhenDue(total, () => finished);
  const results = await Promise.allSettled(seats.map((s, i) => taster(s, i % APPS.length, pick, changed, i * perTaster)));
  finished = true;
  await restarter;
  const loadSeconds = (Date.now() - load) / 1000;
  const problems = results.flatMap((r) => (r.status === 'rejected' ? [String((r.reason as Error).message)] : []));

  const db = await checkDatabase(tastingId);
  const logScan = scanAppLogs(seats);
  const kinds = [...failureKinds].map(([k, f]) => `${k} ×${f.n}`).join(', ') || 'none';
  const when = [...failureKinds].map(([k, f]) => `${k} from +${(f.first / 1000).toFixed(1)} s to +${(f.last / 1000).toFixed(1)} s`).join(', ');
  const sorted = [...answerLatencies].sort((x, y) => x - y);
  const pct = (q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? 0;
  console.log(
    `soak: requests sent ${counts.requestsSent}, duplicates sent ${counts.duplicatesSent}, retries ${counts.retries}, ` +
      `failures seen during the restart ${counts.failuresDuringRestart} (outside it ${counts.failuresOutsideRestart}; ${kinds}), ` +
      `acknowledged ${counts.acknowledgedAnswers} answers (${counts.acknowledgedRequests} answer requests), ` +
      `rows stored ${db.rowsStored}, missing ${db.missing}, duplicated ${db.duplicated}, wrong value ${db.wrongValue}, extra ${db.extra}, ` +
      `seats submitted ${db.submitted}/${PLAN.tasters}`,
  );
  console.log(
    `soak: stale replays sent ${counts.staleReplaysSent} (answered duplicate and stale ${counts.staleReplaysRecognised}), regressed by stale replays ${db.regressed}; ` +
      `HTTP 500 ${counts.http500}, HTTP 503 ${counts.http503}, other 5xx ${counts.httpOther5xx}`,
  );
  console.log(
    restart.done
      ? `soak: PostgreSQL restart took ${(restart.tookMs / 1000).toFixed(1)} s with ${restart.inFlightAtStart} requests in flight; /api/health ok again ${restart.healthyAfterMs < 0 ? 'never' : `after ${(restart.healthyAfterMs / 1000).toFixed(1)} s`}`
      : 'soak: PostgreSQL was NOT restarted (the load ended first)',
  );
  console.log(
    `soak: timeline: ${restart.startedAt ? `restart began at +${((restart.startedAt - load) / 1000).toFixed(1)} s` : 'no restart'}${when ? `; failures: ${when}` : ''}; ` +
      `answer replies (2xx) took median ${pct(0.5)} ms, 95th percentile ${pct(0.95)} ms, longest ${sorted.at(-1) ?? 0} ms`,
  );
  console.log(`soak: replies per app process ${answeredBy.join(' / ')}`);
  console.log(`soak: app logs ${logScan.lines} lines, ${logScan.errors} errors logged; ${logScan.leaks.length ? `LEAKED: ${logScan.leaks.join(', ')}` : 'no seat token, token hash or idempotency key in it'}`);
  console.log(`soak: load ran ${loadSeconds.toFixed(1)} s, whole soak ${((Date.now() - started) / 1000).toFixed(1)} s`);

  const failed = [
    ...problems.slice(0, 5),
    ...(problems.length > 5 ? [`… and ${problems.length - 5} more tasters failed`] : []),
    ...(counts.acknowledgedAnswers !== total ? [`only ${counts.acknowledgedAnswers} of ${total} answers were acknowledged`] : []),
    ...(db.missing ? [`${db.missing} acknowledged answers are missing`] : []),
    ...(db.duplicated ? [`${db.duplicated} rows are duplicates`] : []),
    ...(db.wrongValue ? [`${db.wrongValue} rows hold another value or key than acknowledged`] : []),
    ...(db.regressed ? [`${db.regressed} answers were set back by a stale replay`] : []),
    ...(counts.staleReplaysRecognised !== counts.staleReplaysSent ? [`${counts.staleReplaysSent - counts.staleReplaysRecognised} stale replays were not answered as duplicate and stale`] : []),
    ...(counts.http500 ? [`${counts.http500} requests got HTTP 500 (the database being away is a 503)`] : []),
    ...(counts.httpOther5xx ? [`${counts.httpOther5xx} requests got a 5xx other than 503`] : []),
    ...(db.extra ? [`${db.extra} rows were never acknowledged`] : []),
    ...(db.rowsStored !== counts.acknowledgedAnswers ? [`${db.rowsStored} rows for ${counts.acknowledgedAnswers} acknowledged answers`] : []),
    ...(db.submitted !== PLAN.tasters ? [`${PLAN.tasters - db.submitted} seats are not submitted`] : []),
    ...(!restart.done ? ['the restart did not happen under load'] : []),
    ...(restart.done && restart.healthyAfterMs < 0 ? ['the app never reported healthy after the restart'] : []),
    ...(logScan.missing ? ['an app log is missing, so it could not be checked for leaks'] : []),
    ...logScan.leaks.map((l) => `the app log holds ${l}`),
    ...answeredBy.flatMap((n, i) => (n === 0 ? [`app process ${i + 1} answered nothing`] : [])),
  ];
  if (failed.length) {
    console.log(`soak: FAIL\n  - ${failed.join('\n  - ')}`);
    process.exit(1);
  }
  console.log('soak: PASS');
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
