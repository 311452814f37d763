#!/usr/bin/env bash
# `npm run bench`: measurements, not tests. Starts its own throw-away PostgreSQL (bench profile),
# migrates, builds the production app, starts two servers on loopback with the bench-only floor
# route switched on, and prints each figure beside its target. Results land in bench-results/
# (git-ignored): stats.json, notebook.json, models.json, label.json, costs.json, load.json, pages.json and bench.json (all figures).
# The demo seed is loaded too, for the staff pages and the phone (scripts/bench-pages.ts).
# Ports: SETWELL_BENCH_APP_PORT (default 3200) and SETWELL_BENCH_APP_PORT_B (default the next one up),
# SETWELL_BENCH_PG_PORT (54349),
# SETWELL_BENCH_S3_PORT (4599, the S3 fake the seed's photos go to). The build goes to .next-bench,
# so a bench run never replaces the .next of a running test server. Inherited app settings
# (DATABASE_URL, SMTP_URL, S3_*, APP_URL, …) are dropped by env.sh's test profile: the bench writes,
# so it must never reach the demo's database.
source "$(dirname "$0")/lib.sh"
export SETWELL_PROFILE=test SETWELL_TEST_HOME="${SETWELL_BENCH_HOME:-/var/tmp/setwell-bench}" SETWELL_TEST_PG_PORT="${SETWELL_BENCH_PG_PORT:-54349}" SETWELL_TEST_S3_PORT="${SETWELL_BENCH_S3_PORT:-4599}"
export SETWELL_NEXT_DIST_DIR=.next-bench
source "$(dirname "$0")/env.sh"
cd "$REPO_ROOT"
ensure_node_modules
ensure_postgres_installed
APP_A="${SETWELL_BENCH_APP_PORT:-3200}"
APP_B="${SETWELL_BENCH_APP_PORT_B:-$((APP_A + 1))}"
PIDS=()
cleanup() {
  set +e
  # Each server runs in its own process group (setsid): next start forks its worker, and both must go.
  for pid in "${PIDS[@]}"; do kill -- "-$pid" 2>/dev/null; wait "$pid" 2>/dev/null; done
  stop_background "$SETWELL_RUN/s3-fake.pid"
  pg_cluster_stop "$SETWELL_PG_DATA"
}
trap cleanup EXIT
pg_cluster_stop "$SETWELL_PG_DATA" 2>/dev/null || true
rm -rf "$SETWELL_HOME"
pg_cluster_start "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_PG_DURABLE"
pg_ensure_database "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_DB_NAME" setwell "$SETWELL_DB_PASSWORD"
export NEXTAUTH_SECRET=bench-only-secret-bench-only-secret-0000 LOG_LEVEL=silent
npm run --silent db:migrate >/dev/null
log "statistics: 60 tasters × 12 samples × 8 attributes, then twice the tasters, in turns (median of 9)"
node --require ./scripts/outside-next.cjs --import tsx scripts/bench-stats.ts
log "notebook: the largest accepted entry rendered read-only on the server (production React, median of 7)"
NODE_ENV=production node --require ./scripts/outside-next.cjs --import tsx scripts/bench-notebook.ts
log "models: full quadratic fit (4 features × 200 variants), prediction per keystroke beside the chemistry recompute, optimisation"
node --require ./scripts/outside-next.cjs --import tsx scripts/bench-models.ts
log "label: the formula editor's recompute for a 40-line formula, chemistry alone and with the label (median and p95)"
node --require ./scripts/outside-next.cjs --import tsx scripts/bench-label.ts
log "costs: a trial of 12 variants and a product of 24 versions against 3 years of daily prices, beside fetching those rows (median of 7)"
node --require ./scripts/outside-next.cjs --import tsx scripts/bench-costs.ts

mkdir -p "$SETWELL_LOGS"
log "load: building the production app"
NODE_ENV=production node node_modules/next/dist/bin/next build >"$SETWELL_LOGS/bench-build.log" 2>&1 || { tail -40 "$SETWELL_LOGS/bench-build.log"; exit 1; }
node --require ./scripts/outside-next.cjs --import tsx scripts/bench-setup.ts "$SETWELL_HOME/seats.json"
mkdir -p "$SETWELL_RUN"
if [[ "${S3_ENDPOINT:-}" == "$S3_FAKE_ENDPOINT" ]]; then
  start_background "S3 fake" "$SETWELL_RUN/s3-fake.pid" "$SETWELL_LOGS/s3-fake.log" node --require ./scripts/outside-next.cjs --import tsx scripts/s3-fake.ts
  wait_for_port 127.0.0.1 "$S3_FAKE_PORT" 30
fi
npm run --silent db:seed >/dev/null
for port in "$APP_A" "$APP_B"; do
  APP_URL="http://127.0.0.1:$port" NEXTAUTH_URL="http://127.0.0.1:$port" SETWELL_BENCH_FLOOR=1 NODE_ENV=production \
    setsid node node_modules/next/dist/bin/next start -p "$port" -H 127.0.0.1 >"$SETWELL_LOGS/bench-app-$port.log" 2>&1 &
  PIDS+=($!)
done
wait_for_port 127.0.0.1 "$APP_A" 60
wait_for_port 127.0.0.1 "$APP_B" 60
log "load: $(nproc) cores, load average $(cut -d' ' -f1-3 /proc/loadavg) before the run"
log "load: 100 connections, floor and taster alternating (2 × 10 s each), then two processes; then the phone page's JS"
BENCH_APP_PGIDS="$(IFS=,; echo "${PIDS[*]}")" BENCH_PG_PID_FILE="$SETWELL_PG_DATA/postmaster.pid" \
  node --require ./scripts/outside-next.cjs --import tsx scripts/bench-load.ts "$SETWELL_HOME/seats.json" "http://127.0.0.1:$APP_A" "http://127.0.0.1:$APP_B"
log "pages: six staff pages × 10 users against the empty page; the tasting page on a throttled phone in chromium"
ensure_chromium_installed
node --require ./scripts/outside-next.cjs --import tsx scripts/bench-pages.ts "$SETWELL_HOME/seats.json" "http://127.0.0.1:$APP_A"
node -e '
  const fs = require("fs");
  const read = (name) => JSON.parse(fs.readFileSync(`bench-results/${name}.json`, "utf8")).figures;
  fs.writeFileSync("bench-results/bench.json", JSON.stringify({ measuredAt: new Date().toISOString(), figures: [...read("stats"), ...read("notebook"), ...read("models"), ...read("label"), ...read("costs"), ...read("load"), ...read("pages")] }, null, 2));
'
log "all figures in bench-results/bench.json"
