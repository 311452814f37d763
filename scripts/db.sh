#!/usr/bin/env bash
# The demo cluster: `bash scripts/db.sh start|stop|status`. Idempotent.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/env.sh"

case "${1:-status}" in
  start)
    ensure_postgres_installed
    pg_cluster_start "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_PG_DURABLE"
    pg_ensure_database "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_DB_NAME" setwell "$SETWELL_DB_PASSWORD"
    log "PostgreSQL is up on 127.0.0.1:$SETWELL_PG_PORT (data in $SETWELL_PG_DATA)"
    ;;
  stop)
    pg_cluster_stop "$SETWELL_PG_DATA"
    log "PostgreSQL stopped"
    ;;
  status)
    pg_cluster_status "$SETWELL_PG_DATA" || true
    ;;
  *)
    echo "usage: scripts/db.sh start|stop|status" >&2; exit 2 ;;
esac
