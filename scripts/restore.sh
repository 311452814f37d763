#!/usr/bin/env bash
# `npm run restore -- <dump-file> [database] [--force]`: restores a scripts/backup.sh dump into a
# FRESH database on the server of $DATABASE_URL (default: the demo cluster).
#   no database named → a new one, <current db>_restored_<UTC time>
#   a database that does not exist or is empty → created / used
#   a database that holds tables → refused, unless --force: then that database is first backed up
#     with scripts/backup.sh (path printed), dropped and re-created. Nothing is lost silently.
# The restore runs in one transaction (all or nothing); a database this script created is dropped
# again when the restore fails. Prints the restored database's name on stdout; point DATABASE_URL
# at it (and run npm run db:migrate if the dump is older than the code).
source "$(dirname "$0")/lib.sh"
explicit_url="${DATABASE_URL:-}"
source "$(dirname "$0")/env.sh"
# The test profile drops inherited settings; an explicit database is what these scripts are pointed at.
[ -n "$explicit_url" ] && export DATABASE_URL="$explicit_url"

usage() { echo "usage: npm run restore -- <dump-file> [database] [--force]" >&2; exit 2; }
file="" target="" force=0
for arg in "$@"; do
  case "$arg" in
    --force) force=1 ;;
    -h|--help) sed -n '2,11p' "$0" | sed 's/^# \{0,1\}//'; exit 0 ;;
    -*) usage ;;
    *) if [ -z "$file" ]; then file="$arg"; elif [ -z "$target" ]; then target="$arg"; else usage; fi ;;
  esac
done
[ -n "$file" ] || usage
[ -f "$file" ] && [ -r "$file" ] || { log "no readable file at $file"; exit 1; }
if [ -n "$target" ] && ! [[ "$target" =~ ^[a-z_][a-z0-9_]{0,62}$ ]]; then
  log "database name '$target' is not allowed: use lower-case letters, digits and _ (at most 63), starting with a letter or _"; exit 2
fi

ensure_demo_cluster_for "$explicit_url"
created=0
cleanup() {
  local rc=$?
  set +e
  if [ "$rc" -ne 0 ] && [ "$created" = 1 ]; then
    psql_at "$maintenance_url" "DROP DATABASE IF EXISTS \"$target\"" >/dev/null 2>&1 && log "dropped the half-restored database $target again"
  fi
  [ "$DEMO_CLUSTER_STARTED" = 1 ] && pg_cluster_stop "$SETWELL_PG_DATA"
  return 0
}
trap cleanup EXIT

bin="${SETWELL_PG_BIN:-$(pg_bindir)}"
psql_at() { "$bin/psql" "$1" -v ON_ERROR_STOP=1 -qAtc "$2"; }
"$bin/pg_restore" --list "$file" >/dev/null 2>&1 || { log "$file is not a custom-format pg_dump file (made by npm run backup)"; exit 1; }

maintenance_url="$(url_with_db "$DATABASE_URL" postgres)"
[ -n "$target" ] || target="$(url_db_name "$DATABASE_URL")_restored_$(date -u +%Y%m%d%H%M%S)"
target_url="$(url_with_db "$DATABASE_URL" "$target")"

if [ -n "$(psql_at "$maintenance_url" "SELECT 1 FROM pg_database WHERE datname = '$target'")" ]; then
  relations="$(psql_at "$target_url" "SELECT count(*) FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
    WHERE n.nspname NOT IN ('pg_catalog', 'information_schema') AND n.nspname NOT LIKE 'pg_toast%' AND c.relkind IN ('r', 'p', 'v', 'm', 'S', 'f')")"
  if [ "$relations" -gt 0 ]; then
    if [ "$force" != 1 ]; then
      log "database $target is not empty ($relations tables, views or sequences); nothing was changed."
      log "restore into a new database (name another, or none for a fresh name), or add --force to back it up, drop it and restore"
      exit 1
    fi
    log "--force: backing up $target before replacing it"
    safety="$(DATABASE_URL="$target_url" bash "$REPO_ROOT/scripts/backup.sh")"
    log "the previous contents of $target are in $safety"
    psql_at "$maintenance_url" "DROP DATABASE \"$target\" WITH (FORCE)"
    psql_at "$maintenance_url" "CREATE DATABASE \"$target\""
    created=1
  fi
else
  psql_at "$maintenance_url" "CREATE DATABASE \"$target\""
  created=1
fi

log "restoring $(basename "$file") into $target"
"$bin/pg_restore" --dbname="$target_url" --no-owner --no-privileges --exit-on-error --single-transaction "$file"
psql_at "$target_url" "SET client_min_messages = error; ANALYZE" >/dev/null
log "restored into database $target on the server of DATABASE_URL"
printf '%s\n' "$target"
