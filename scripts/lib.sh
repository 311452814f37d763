#!/usr/bin/env bash
# Shared helpers for the start, test, db and backup scripts. Source it; do not run it.
# Everything a fresh Debian machine lacks is installed here, so a clean clone just works.

set -euo pipefail

REPO_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1

log() { printf '\033[1;35m[setwell]\033[0m %s\n' "$*" >&2; }

apt_updated=0
apt_install() {
  if [ "$(id -u)" -ne 0 ]; then
    log "need root to install Debian packages: $*"; return 1
  fi
  if [ "$apt_updated" -eq 0 ]; then
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null
    apt_updated=1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

pg_bindir() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  printf '%s' "$dir"
}

ensure_postgres_installed() {
  if [ -z "$(pg_bindir)" ] || [ ! -x "$(pg_bindir)/initdb" ]; then
    log "installing PostgreSQL from Debian's packages"
    apt_install postgresql postgresql-client
    # The Debian package starts its own cluster on 5432; we never use it.
    if command -v pg_ctlcluster >/dev/null 2>&1; then
      for c in $(ls /etc/postgresql 2>/dev/null); do pg_ctlcluster "$c" main stop >/dev/null 2>&1 || true; done
    fi
  fi
}

ensure_chromium_installed() {
  if [ ! -x /usr/bin/chromium ]; then
    log "installing Debian's chromium for the browser tests"
    apt_install chromium fonts-liberation
  fi
}

ensure_node_modules() {
  cd "$REPO_ROOT"
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

# Run a PostgreSQL binary as the postgres user (the server refuses root).
as_pg() {
  if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# pg_cluster_start DATA_DIR PORT DURABLE(yes|no)
# Initialises the cluster on first use and starts it; safe to call when it already runs
# or after a crash (pg_ctl clears a stale postmaster.pid itself).
pg_cluster_start() {
  local data_dir="$1" port="$2" durable="$3"
  local base; base="$(dirname "$data_dir")"
  local sock="$base/run"
  local bin; bin="$(pg_bindir)"
  mkdir -p "$data_dir" "$sock" "$base/log"
  if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$base" "$data_dir" "$sock" "$base/log"; fi
  chmod 700 "$data_dir"
  if [ ! -f "$data_dir/PG_VERSION" ]; then
    log "initialising a private PostgreSQL cluster in $data_dir"
    as_pg "$bin/initdb" -D "$data_dir" -U postgres --auth-local=trust --auth-host=scram-sha-256 \
      --encoding=UTF8 --locale=C.UTF-8 >/dev/null
    {
      echo "listen_addresses = '127.0.0.1'"
      echo "port = $port"
      echo "unix_socket_directories = '$sock'"
      echo "max_connections = 200"
      echo "shared_buffers = 256MB"
      if [ "$durable" = "no" ]; then
        # Test clusters only: speed over crash safety.
        echo "fsync = off"; echo "synchronous_commit = off"; echo "full_page_writes = off"
      fi
    } >> "$data_dir/postgresql.conf"
  fi
  if as_pg "$bin/pg_ctl" -D "$data_dir" status >/dev/null 2>&1; then
    return 0
  fi
  as_pg "$bin/pg_ctl" -D "$data_dir" -l "$base/log/postgres.log" -w -t 60 start >/dev/null
}

pg_cluster_stop() {
  local data_dir="$1"
  local bin; bin="$(pg_bindir)"
  if [ -f "$data_dir/PG_VERSION" ] && as_pg "$bin/pg_ctl" -D "$data_dir" status >/dev/null 2>&1; then
    as_pg "$bin/pg_ctl" -D "$data_dir" -m fast -w stop >/dev/null
  fi
}

pg_cluster_status() {
  local data_dir="$1"
  local bin; bin="$(pg_bindir)"
  as_pg "$bin/pg_ctl" -D "$data_dir" status
}

# pg_psql DATA_DIR PORT SQL  — runs SQL as the superuser over the private socket.
pg_psql() {
  local data_dir="$1" port="$2" sql="$3"
  local sock; sock="$(dirname "$data_dir")/run"
  as_pg "$(pg_bindir)/psql" -h "$sock" -p "$port" -U postgres -d postgres -v ON_ERROR_STOP=1 -qAtc "$sql"
}

# pg_ensure_database DATA_DIR PORT DB USER PASSWORD
pg_ensure_database() {
  local data_dir="$1" port="$2" db="$3" user="$4" pass="$5"
  pg_psql "$data_dir" "$port" "DO \$\$ BEGIN
    IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = '$user') THEN
      CREATE ROLE $user LOGIN PASSWORD '$pass' CREATEDB;
    END IF; END \$\$;"
  if [ -z "$(pg_psql "$data_dir" "$port" "SELECT 1 FROM pg_database WHERE datname = '$db'")" ]; then
    pg_psql "$data_dir" "$port" "CREATE DATABASE $db OWNER $user"
  fi
}

# wait_for_port HOST PORT SECONDS
wait_for_port() {
  local host="$1" port="$2" secs="${3:-30}" i
  for ((i = 0; i < secs * 10; i++)); do
    if (exec 3<>"/dev/tcp/$host/$port") 2>/dev/null; then return 0; fi
    sleep 0.1
  done
  log "nothing answered on $host:$port after ${secs}s"; return 1
}

# start_background NAME PIDFILE LOGFILE CMD...  — starts a helper process once.
start_background() {
  local name="$1" pidfile="$2" logfile="$3"; shift 3
  if [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; then return 0; fi
  mkdir -p "$(dirname "$pidfile")" "$(dirname "$logfile")"
  nohup "$@" >"$logfile" 2>&1 &
  echo $! >"$pidfile"
  log "started $name (pid $(cat "$pidfile"))"
}

stop_background() {
  local pidfile="$1"
  if [ -f "$pidfile" ]; then
    local pid; pid="$(cat "$pidfile")"
    if kill -0 "$pid" 2>/dev/null; then
      kill "$pid" 2>/dev/null || true
      for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
      kill -9 "$pid" 2>/dev/null || true
    fi
    rm -f "$pidfile"
  fi
}

# The database name in a postgresql:// URL, and the same URL pointing at another database.
url_db_name() { local u="${1%%\?*}"; printf '%s' "${u##*/}"; }
url_with_db() {
  local u="$1" db="$2" q=""
  [[ "$u" == *\?* ]] && q="?${u#*\?}"
  u="${u%%\?*}"
  printf '%s/%s%s' "${u%/*}" "$db" "$q"
}

# For the backup and restore scripts: without an explicit DATABASE_URL they work on the demo
# database, starting its cluster for the duration when it is not running. Source env.sh first.
# Sets DEMO_CLUSTER_STARTED=1 when it started the cluster (stop it again with pg_cluster_stop).
DEMO_CLUSTER_STARTED=0
ensure_demo_cluster_for() {
  local explicit_url="$1"
  [ -n "$explicit_url" ] && return 0
  ensure_postgres_installed
  if ! as_pg "$(pg_bindir)/pg_ctl" -D "$SETWELL_PG_DATA" status >/dev/null 2>&1; then
    [ -f "$SETWELL_PG_DATA/PG_VERSION" ] || { log "no demo database in $SETWELL_PG_DATA yet (run npm start once, or set DATABASE_URL)"; return 1; }
    pg_cluster_start "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_PG_DURABLE"
    DEMO_CLUSTER_STARTED=1
  fi
}
