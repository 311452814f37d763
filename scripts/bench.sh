#!/usr/bin/env bash
# `npm run bench`: measurements, not tests. Starts its own throw-away PostgreSQL (bench profile),
# migrates, and prints each figure beside its target. Results land in bench-results/ (git-ignored).
# So far it holds the statistics benchmark; the load figures come with the load-testing work.
source "$(dirname "$0")/lib.sh"
export SETWELL_PROFILE=test SETWELL_TEST_HOME="${SETWELL_BENCH_HOME:-/var/tmp/setwell-bench}" SETWELL_TEST_PG_PORT="${SETWELL_BENCH_PG_PORT:-54349}"
source "$(dirname "$0")/env.sh"
cd "$REPO_ROOT"
ensure_node_modules
ensure_postgres_installed
cleanup() { pg_cluster_stop "$SETWELL_PG_DATA"; }
trap cleanup EXIT
pg_cluster_stop "$SETWELL_PG_DATA" 2>/dev/null || true
rm -rf "$SETWELL_HOME"
pg_cluster_start "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_PG_DURABLE"
pg_ensure_database "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_DB_NAME" setwell "$SETWELL_DB_PASSWORD"
export NEXTAUTH_SECRET=bench-only-secret-bench-only-secret-0000 LOG_LEVEL=silent
npm run --silent db:migrate >/dev/null
log "statistics: 60 tasters × 12 samples × 8 attributes, then twice the tasters (median of 5 runs)"
node --import tsx scripts/bench-stats.ts
