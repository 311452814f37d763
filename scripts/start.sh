#!/usr/bin/env bash
# The README's run command (`npm start`): installs what is missing, starts PostgreSQL and
# the mail and S3 fakes, migrates, seeds the demo, builds and serves on $PORT (default 3000).
# Re-running keeps the data.
source "$(dirname "$0")/lib.sh"
export SETWELL_PROFILE=demo
source "$(dirname "$0")/env.sh"
cd "$REPO_ROOT"

started=$(date +%s)
ensure_node_modules
ensure_postgres_installed
pg_cluster_start "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_PG_DURABLE"
pg_ensure_database "$SETWELL_PG_DATA" "$SETWELL_PG_PORT" "$SETWELL_DB_NAME" setwell "$SETWELL_DB_PASSWORD"

# One secret per installation, kept beside the data so sessions survive restarts.
if [ -z "${NEXTAUTH_SECRET:-}" ]; then
  secret_file="$SETWELL_HOME/nextauth-secret"
  [ -s "$secret_file" ] || { head -c 48 /dev/urandom | base64 | tr -d '\n' >"$secret_file"; chmod 600 "$secret_file"; }
  NEXTAUTH_SECRET="$(cat "$secret_file")"
  export NEXTAUTH_SECRET
fi

if [[ "$SMTP_URL" == "smtp://127.0.0.1:$MAIL_FAKE_SMTP_PORT" ]]; then
  MAIL_FAKE_STORE="$SETWELL_HOME/outbox.json" start_background "mail fake" "$SETWELL_RUN/mail-fake.pid" "$SETWELL_LOGS/mail-fake.log" \
    node --require ./scripts/outside-next.cjs --import tsx scripts/mail-fake.ts
  wait_for_port 127.0.0.1 "$MAIL_FAKE_HTTP_PORT" 30
fi

if [[ "${S3_ENDPOINT:-}" == "$S3_FAKE_ENDPOINT" ]]; then
  start_background "S3 fake" "$SETWELL_RUN/s3-fake.pid" "$SETWELL_LOGS/s3-fake.log" node --require ./scripts/outside-next.cjs --import tsx scripts/s3-fake.ts
  wait_for_port 127.0.0.1 "$S3_FAKE_PORT" 30
fi

npm run --silent db:migrate
npm run --silent db:seed

log "building the app"
NODE_ENV=production node node_modules/next/dist/bin/next build >"$SETWELL_LOGS/build.log" 2>&1 || { tail -50 "$SETWELL_LOGS/build.log"; exit 1; }

log "ready in $(( $(date +%s) - started ))s — open $APP_URL (demo sign-ins are in the README)"
exec node node_modules/next/dist/bin/next start -p "$PORT" -H 0.0.0.0
