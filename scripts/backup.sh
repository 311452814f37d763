#!/usr/bin/env bash
# `npm run backup [-- --dir DIR]`: a consistent dump of the demo database, or of $DATABASE_URL.
# pg_dump reads every table in one snapshot (one repeatable-read transaction), so the dump is
# consistent while the app keeps writing. Custom format (compressed; restore with
# scripts/restore.sh). The file is written as <db>-<UTC time>.dump under $SETWELL_BACKUP_DIR
# (default $SETWELL_HOME/backups, outside the repo), mode 600 (it holds password hashes), checked
# with pg_restore --list before it gets its final name. Prints the path on stdout.
# Photos and files live in object storage, not in the database: back the bucket up separately.
source "$(dirname "$0")/lib.sh"
explicit_url="${DATABASE_URL:-}"
source "$(dirname "$0")/env.sh"
# The test profile drops inherited settings; an explicit database is what these scripts are pointed at.
[ -n "$explicit_url" ] && export DATABASE_URL="$explicit_url"

dir="${SETWELL_BACKUP_DIR:-$SETWELL_HOME/backups}"
while [ $# -gt 0 ]; do
  case "$1" in
    --dir) [ $# -ge 2 ] || { echo "--dir needs a folder" >&2; exit 2; }; dir="$2"; shift 2 ;;
    -h|--help) sed -n '2,9p' "$0" | sed 's/^# \{0,1\}//'; exit 0 ;;
    *) echo "usage: npm run backup [-- --dir DIR]   (DATABASE_URL=… to back up another database)" >&2; exit 2 ;;
  esac
done

ensure_demo_cluster_for "$explicit_url"
trap '[ "$DEMO_CLUSTER_STARTED" = 1 ] && pg_cluster_stop "$SETWELL_PG_DATA"; rm -f "${partial:-}"' EXIT

bin="${SETWELL_PG_BIN:-$(pg_bindir)}"
[ -x "$bin/pg_dump" ] || { log "pg_dump not found (looked in $bin)"; exit 1; }
db="$(url_db_name "$DATABASE_URL")"
mkdir -p "$dir"
chmod 700 "$dir"
file="$dir/$db-$(date -u +%Y%m%dT%H%M%SZ).dump"
[ -e "$file" ] && { log "$file already exists; not overwriting it"; exit 1; }
partial="$file.partial"

umask 077
"$bin/pg_dump" --dbname="$DATABASE_URL" --format=custom --lock-wait-timeout=60000 --file="$partial"
"$bin/pg_restore" --list "$partial" >/dev/null || { log "the dump could not be read back; no backup written"; exit 1; }
mv "$partial" "$file"
partial=""
log "backed up database $db ($(du -h "$file" | cut -f1))"
printf '%s\n' "$file"
