#!/usr/bin/env bash
# Stops what the run command started in the background: the mail and S3 fakes and PostgreSQL (not the
# app server, which runs in the foreground of `npm start`).
source "$(dirname "$0")/lib.sh"
export SETWELL_PROFILE=demo
source "$(dirname "$0")/env.sh"
stop_background "$SETWELL_RUN/mail-fake.pid"
stop_background "$SETWELL_RUN/s3-fake.pid"
pg_cluster_stop "$SETWELL_PG_DATA"
log "stopped"
