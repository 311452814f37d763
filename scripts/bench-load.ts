/**
 * Load benchmark (part of `npm run bench`): measurements side by side in one run against the
 * production build, printed beside their targets and written to bench-results/load.json.
 *   1. answer submission — 100 connections PUT answers to the real taster endpoint, against the
 *      floor route (one plain INSERT through pg) on the same server, alternating;
 *   2. scale-out — the same load spread over two app processes against one PostgreSQL;
 *   3. the phone page — first-load JavaScript (gzip) of the taster page against an empty page.
 * Usage: bench-load.ts <seats.json> <urlA> <urlB>
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import os from 'node:os';
import { randomUUID } from 'node:crypto';
import autocannon from 'autocannon';

interface Setup { attributeIds: string[]; values: Record<string, number[]>; seats: Array<{ token: string; codes: string[] }> }
interface LoadResult { requests: number; seconds: number; rps: number; p95Ms: number; non2xx: number; errors: number; cpu: CpuUse }
/** Cores kept busy during a run (CPU seconds per wall second), by who used them. */
interface CpuUse { appA: number; appB: number; postgres: number; generator: number; machine: number }

const [seatsFile, urlA, urlB] = process.argv.slice(2);
const setup = JSON.parse(fs.readFileSync(seatsFile, 'utf8')) as Setup;
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 100);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const WARMUP_SECONDS = 3;

// Where the CPU goes: the two servers are process groups (bench.sh starts each with setsid and
// passes their ids), PostgreSQL is the postmaster and its children, the generator is this process.
const APP_GROUPS = (process.env.BENCH_APP_PGIDS ?? '').split(',').filter(Boolean).map(Number);
const POSTMASTER = Number(fs.existsSync(process.env.BENCH_PG_PID_FILE ?? '') ? fs.readFileSync(process.env.BENCH_PG_PID_FILE!, 'utf8').split('\n')[0] : NaN);
const TICKS_PER_SECOND = 100; // USER_HZ on Linux (getconf CLK_TCK)

interface CpuTicks { appA: number; appB: number; postgres: number; generator: number; machine: number }

function cpuTicks(): CpuTicks {
  const out: CpuTicks = { appA: 0, appB: 0, postgres: 0, generator: 0, machine: 0 };
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    let stat: string;
    try { stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8'); } catch { continue; } // gone meanwhile
    // Fields after "(comm)": state ppid pgrp … utime(14) stime(15), counted from 1 over the whole line.
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const pid = Number(entry), ppid = Number(f[1]), pgrp = Number(f[2]);
    const ticks = Number(f[11]) + Number(f[12]);
    if (pgrp === APP_GROUPS[0]) out.appA += ticks;
    else if (pgrp === APP_GROUPS[1]) out.appB += ticks;
    else if (pid === POSTMASTER || ppid === POSTMASTER) out.postgres += ticks;
    else if (pid === process.pid) out.generator += ticks;
  }
  const cpu = fs.readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
  out.machine = cpu.slice(0, 8).reduce((a, b) => a + b, 0) - cpu[3] - cpu[4]; // all but idle and iowait
  return out;
}

function cpuUse(before: CpuTicks, after: CpuTicks, seconds: number): CpuUse {
  const cores = (k: keyof CpuTicks) => (after[k] - before[k]) / TICKS_PER_SECOND / seconds;
  return { appA: cores('appA'), appB: cores('appB'), postgres: cores('postgres'), generator: cores('generator'), machine: cores('machine') };
}

let counter = 0;
function tasterRequest(seats: Setup['seats']) {
  return (req: autocannon.Request): autocannon.Request => {
    const seat = seats[counter++ % seats.length];
    const attributeId = setup.attributeIds[counter % setup.attributeIds.length];
    const values = setup.values[attributeId];
    req.path = `/api/v1/tastings/seats/${seat.token}/answers`;
    req.body = JSON.stringify({ idempotencyKey: randomUUID(), code: seat.codes[counter % seat.codes.length], attributeId, value: values[counter % values.length] });
    return req;
  };
}

function floorRequest(seats: Setup['seats']) {
  return (req: autocannon.Request): autocannon.Request => {
    const seat = seats[counter++ % seats.length];
    req.path = '/api/bench/floor';
    req.headers = { ...req.headers, 'x-bench-seat': seat.token.slice(0, 12) };
    req.body = JSON.stringify({ idempotencyKey: randomUUID(), code: seat.codes[0], value: counter % 9 });
    return req;
  };
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/** One autocannon instance per URL, connections split evenly, run at the same time; latencies from every response. */
async function load(kind: 'taster' | 'floor', urls: string[], seconds: number): Promise<LoadResult> {
  const latencies: number[] = [];
  let non2xx = 0;
  let errors = 0;
  let requests = 0;
  const perUrl = Math.floor(CONNECTIONS / urls.length);
  // A process that exits during the run drops out of the sum. Only idle pool connections do (pg's
  // 10 s idle timeout), so what they used is negligible.
  const ticksBefore = cpuTicks();
  const startedAt = process.hrtime.bigint();
  const runs = urls.map((url, i) => {
    const seats = setup.seats.slice(i * perUrl, (i + 1) * perUrl);
    const setupRequest = kind === 'taster' ? tasterRequest(seats) : floorRequest(seats);
    return new Promise<void>((resolve, reject) => {
      const instance = autocannon({
        url, connections: perUrl, duration: seconds, pipelining: 1,
        requests: [{ method: kind === 'taster' ? 'PUT' : 'POST', headers: { 'content-type': 'application/json' }, setupRequest }],
      }, (err) => (err ? reject(err) : resolve()));
      instance.on('response', (_client, status, _bytes, ms) => {
        requests += 1;
        latencies.push(ms);
        if (status < 200 || status >= 300) non2xx += 1;
      });
      instance.on('reqError', () => { errors += 1; });
    });
  });
  await Promise.all(runs);
  const cpu = cpuUse(ticksBefore, cpuTicks(), Number(process.hrtime.bigint() - startedAt) / 1e9);
  latencies.sort((a, b) => a - b);
  return { requests, seconds, rps: requests / seconds, p95Ms: percentile(latencies, 95), non2xx, errors, cpu };
}

function merge(a: LoadResult, b: LoadResult): LoadResult {
  const mean = (k: keyof CpuUse) => (a.cpu[k] + b.cpu[k]) / 2;
  return {
    requests: a.requests + b.requests, seconds: a.seconds + b.seconds, rps: (a.requests + b.requests) / (a.seconds + b.seconds),
    p95Ms: (a.p95Ms + b.p95Ms) / 2, non2xx: a.non2xx + b.non2xx, errors: a.errors + b.errors,
    cpu: { appA: mean('appA'), appB: mean('appB'), postgres: mean('postgres'), generator: mean('generator'), machine: mean('machine') },
  };
}

/** Every script the page's HTML loads, fetched and gzip-compressed (default level), summed. */
async function firstLoadJsGzip(base: string, pagePath: string): Promise<{ bytes: number; scripts: number }> {
  const res = await fetch(`${base}${pagePath}`);
  if (!res.ok) throw new Error(`${pagePath} answered ${res.status}`);
  const html = await res.text();
  const srcs = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)) srcs.add(m[1]);
  for (const m of html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"/g)) srcs.add(m[1]);
  for (const m of html.matchAll(/<link[^>]*href="([^"]+\.js[^"]*)"[^>]*rel="modulepreload"/g)) srcs.add(m[1]);
  let bytes = zlib.gzipSync(Buffer.from([...html.matchAll(/<script(?![^>]*\ssrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]).join(''))).length;
  for (const src of srcs) {
    const body = Buffer.from(await (await fetch(new URL(src, base))).arrayBuffer());
    bytes += zlib.gzipSync(body).length;
  }
  return { bytes, scripts: srcs.size };
}

async function main() {
  const figures: Array<{ name: string; measured: number; target: string; decimals: number }> = [];
  const line = (name: string, measured: number, target: string, decimals = 2) => {
    figures.push({ name, measured, target, decimals });
    console.log(`${name.padEnd(38)} ${measured.toFixed(decimals).padStart(10)}   target ${target}`);
  };

  // Warm both servers and both code paths; nothing measured.
  await load('floor', [urlA], WARMUP_SECONDS);
  await load('taster', [urlA], WARMUP_SECONDS);
  await load('taster', [urlB], WARMUP_SECONDS);

  const floor1 = await load('floor', [urlA], SECONDS);
  const taster1 = await load('taster', [urlA], SECONDS);
  const floor2 = await load('floor', [urlA], SECONDS);
  const taster2 = await load('taster', [urlA], SECONDS);
  const floor = merge(floor1, floor2);
  const taster = merge(taster1, taster2);
  const two = await load('taster', [urlA, urlB], SECONDS);

  line('submission.floor_req_per_s', floor.rps, '(reference)', 0);
  line('submission.taster_req_per_s', taster.rps, '(reference)', 0);
  line('submission.floor_p95_ms', floor.p95Ms, '(reference)', 1);
  line('submission.taster_p95_ms', taster.p95Ms, '(reference)', 1);
  line('submission.throughput_ratio', taster.rps / floor.rps, '>= 0.6');
  line('submission.p95_ratio', taster.p95Ms / floor.p95Ms, '<= 1.5');
  line('scaleout.two_processes_req_per_s', two.rps, '(reference)', 0);
  line('scaleout.throughput_ratio', two.rps / taster.rps, '> 1.0 (well above)');
  // Why the scale-out ratio is what it is: which processes kept the cores busy in each run.
  for (const [label, run] of [['one_process', taster], ['two_processes', two]] as const) {
    line(`cpu.${label}.app_cores`, run.cpu.appA + run.cpu.appB, '(reference)');
    line(`cpu.${label}.postgres_cores`, run.cpu.postgres, '(reference)');
    line(`cpu.${label}.load_generator_cores`, run.cpu.generator, '(reference)');
    line(`cpu.${label}.machine_busy_cores`, run.cpu.machine, `(of ${os.cpus().length})`);
  }
  const failures = floor.non2xx + floor.errors + taster.non2xx + taster.errors + two.non2xx + two.errors;
  line('load.non_2xx_or_errors', failures, '0', 0);

  const phone = await firstLoadJsGzip(urlA, `/t/${setup.seats[0].token}`);
  const blank = await firstLoadJsGzip(urlA, '/bench-blank');
  line('phone.taster_page_js_gzip_bytes', phone.bytes, '(reference)', 0);
  line('phone.empty_page_js_gzip_bytes', blank.bytes, '(reference)', 0);
  line('phone.js_ratio', phone.bytes / blank.bytes, '<= 1.25');

  fs.mkdirSync('bench-results', { recursive: true });
  fs.writeFileSync(path.join('bench-results', 'load.json'), JSON.stringify({
    measuredAt: new Date().toISOString(), connections: CONNECTIONS, seconds: SECONDS, floor, taster, twoProcesses: two, phone, blank,
    figures: figures.map((f) => ({ name: f.name, measured: f.measured, target: f.target })),
  }, null, 2));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
