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
import { randomUUID } from 'node:crypto';
import autocannon from 'autocannon';

interface Setup { attributeIds: string[]; values: Record<string, number[]>; seats: Array<{ token: string; codes: string[] }> }
interface LoadResult { requests: number; seconds: number; rps: number; p95Ms: number; non2xx: number; errors: number }

const [seatsFile, urlA, urlB] = process.argv.slice(2);
const setup = JSON.parse(fs.readFileSync(seatsFile, 'utf8')) as Setup;
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 100);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const WARMUP_SECONDS = 3;

let counter = 0;
function tasterRequest(seats: Setup['seats']) {
  return (req: Record<string, unknown>) => {
    const seat = seats[counter++ % seats.length];
    const attributeId = setup.attributeIds[counter % setup.attributeIds.length];
    const values = setup.values[attributeId];
    req.path = `/api/v1/tasting/${seat.token}/answers`;
    req.body = JSON.stringify({ idempotencyKey: randomUUID(), code: seat.codes[counter % seat.codes.length], attributeId, value: values[counter % values.length] });
    return req;
  };
}

function floorRequest(seats: Setup['seats']) {
  return (req: Record<string, unknown>) => {
    const seat = seats[counter++ % seats.length];
    req.path = '/api/bench/floor';
    req.headers = { ...(req.headers as object), 'x-bench-seat': seat.token.slice(0, 12) };
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
  const runs = urls.map((url, i) => {
    const seats = setup.seats.slice(i * perUrl, (i + 1) * perUrl);
    const setupRequest = kind === 'taster' ? tasterRequest(seats) : floorRequest(seats);
    return new Promise<void>((resolve, reject) => {
      const instance = autocannon({
        url, connections: perUrl, duration: seconds, pipelining: 1,
        requests: [{ method: kind === 'taster' ? 'PUT' : 'POST', headers: { 'content-type': 'application/json' }, setupRequest: setupRequest as never }],
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
  latencies.sort((a, b) => a - b);
  return { requests, seconds, rps: requests / seconds, p95Ms: percentile(latencies, 95), non2xx, errors };
}

function merge(a: LoadResult, b: LoadResult): LoadResult {
  return { requests: a.requests + b.requests, seconds: a.seconds + b.seconds, rps: (a.requests + b.requests) / (a.seconds + b.seconds), p95Ms: (a.p95Ms + b.p95Ms) / 2, non2xx: a.non2xx + b.non2xx, errors: a.errors + b.errors };
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
