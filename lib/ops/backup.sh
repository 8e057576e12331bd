#!/usr/bin/env bash
# npm run backup [FILE]: writes a pg_dump archive (custom format, restorable with
# `npm run restore FILE`) of Ringside's database. Without DATABASE_URL it backs up the
# private cluster in .data/pg, starting it for the dump when `npm start` is not running.
# pg_dump is Debian's, from the same major version as the cluster (PostgreSQL 15).
# Default FILE: .data/backups/ringside-<UTC time>.dump (folder 700, file 600).
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

ensure_postgres
OUT="${1:-$DATA/backups/ringside-$(date -u +%Y%m%dT%H%M%SZ).dump}"

stop_ours() { if [ "$PG_STARTED_BY_US" = 1 ]; then log "stopping PostgreSQL (started for the backup)"; pg_down "$DATA/pg"; fi; }
if [ -n "${DATABASE_URL:-}" ]; then
  URL="$DATABASE_URL"
else
  [ -s "$DATA/pg/PG_VERSION" ] || die "no database to back up: .data/pg does not exist (run npm start once)"
  PG_PORT="${RINGSIDE_PG_PORT:-54329}"
  trap stop_ours EXIT
  pg_up "$DATA/pg" "$PG_PORT" "$DATA/pg-password"
  URL="$(database_url "$PG_PORT" "$DATA/pg-password" ringside)"
fi

# pg_dump refuses a newer server; say plainly which versions met.
SERVER_MAJOR="$("$PG_BIN/psql" "$URL" -Atc 'SHOW server_version_num' | cut -c1-2)" || die "cannot connect to the database"
DUMP_MAJOR="$("$PG_BIN/pg_dump" --version | sed -E 's/.* ([0-9]+)\..*/\1/')"
[ "$SERVER_MAJOR" = "$DUMP_MAJOR" ] || die "pg_dump $DUMP_MAJOR cannot back up a PostgreSQL $SERVER_MAJOR server"

install -d -m 700 "$(dirname "$OUT")"
(umask 077 && "$PG_BIN/pg_dump" --format=custom --no-password --file="$OUT.partial" --dbname="$URL") \
  || { rm -f "$OUT.partial"; die "pg_dump failed"; }
# A readable table of contents is the least a backup must have before it replaces nothing.
"$PG_BIN/pg_restore" --list "$OUT.partial" >/dev/null || { rm -f "$OUT.partial"; die "the archive pg_dump wrote cannot be read back"; }
mv "$OUT.partial" "$OUT"
log "backup written: $OUT ($(stat -c %s "$OUT") bytes, PostgreSQL $SERVER_MAJOR)"
