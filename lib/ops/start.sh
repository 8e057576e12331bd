#!/usr/bin/env bash
# npm start: set up everything Ringside needs on this machine, then serve it.
# Idempotent; data lives in .data/ and survives restarts; Ctrl-C stops what it started.
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

PG_PORT="${RINGSIDE_PG_PORT:-54329}"
SMTP_PORT="${RINGSIDE_SMTP_PORT:-2525}"
WEB_PORT="${PORT:-3000}"
PG_DIR="$DATA/pg"
PG_PASSWORD_FILE="$DATA/pg-password"

ensure_data_dir
# A second `npm start` while one is running would fight over the ports and the cluster.
exec 9>"$DATA/start.lock"
flock -n 9 || die "another npm start is already running for this folder (lock: .data/start.lock)"

port_free "$WEB_PORT" || die "port $WEB_PORT is already in use (set PORT to serve elsewhere)"
port_free "$SMTP_PORT" || die "port $SMTP_PORT is already in use (set RINGSIDE_SMTP_PORT)"

SINK_PID=""
WEB_PID=""
stop_all() {
  trap - EXIT INT TERM
  stop_pid "$WEB_PID"
  stop_pid "$SINK_PID"
  if [ "$PG_STARTED_BY_US" = 1 ]; then log "stopping PostgreSQL"; pg_down "$PG_DIR"; fi
  log "stopped"
}
trap stop_all EXIT
trap 'exit 130' INT TERM

ensure_postgres
ensure_node_modules

pg_up "$PG_DIR" "$PG_PORT" "$PG_PASSWORD_FILE"
ensure_database "$PG_PORT" "$PG_PASSWORD_FILE" ringside

export DATABASE_URL
DATABASE_URL="$(database_url "$PG_PORT" "$PG_PASSWORD_FILE" ringside)"
export NEXTAUTH_URL="http://127.0.0.1:$WEB_PORT"
export NEXTAUTH_SECRET
NEXTAUTH_SECRET="$(secret_file "$DATA/nextauth-secret")"
export RINGSIDE_SMTP_PORT="$SMTP_PORT"
export RINGSIDE_MAIL_DIR="$DATA/mail"
export NEXT_TELEMETRY_DISABLED=1

log "applying migrations"
node_ts db/migrate.ts
log "seeding the demo group"
node_ts db/seed.ts

node --import tsx lib/ops/smtp-sink.ts &
SINK_PID=$!
wait_port "$SMTP_PORT" 30 "$SINK_PID"

build_if_stale || die "cannot serve without a production build"

# The web server is restarted if it dies (the database and the sink keep running); a server
# that dies again within 10 s of starting waits a little longer each time before the next try.
RESTART_PAUSE=1
while true; do
  STARTED_AT=$SECONDS
  node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$WEB_PORT" &
  WEB_PID=$!
  ( wait_http "http://127.0.0.1:$WEB_PORT/sign-in" 60 "$WEB_PID" ) || true
  log "Ringside is serving on http://127.0.0.1:$WEB_PORT (mailbox: /mailbox, Ctrl-C stops)"
  set +e
  wait "$WEB_PID"
  CODE=$?
  set -e
  WEB_PID=""
  if [ $((SECONDS - STARTED_AT)) -lt 10 ]; then RESTART_PAUSE=$((RESTART_PAUSE < 30 ? RESTART_PAUSE * 2 : 30)); else RESTART_PAUSE=1; fi
  log "the web server stopped (exit status $CODE); restarting it in ${RESTART_PAUSE}s (PostgreSQL keeps running)"
  sleep "$RESTART_PAUSE"
done
