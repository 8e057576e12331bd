#!/usr/bin/env bash
# npm run restore FILE: restores a `npm run backup` archive into a fresh PostgreSQL
# cluster. By default that is .data/pg: `npm start` must not be running; the current
# cluster is kept, moved aside to .data/pg.before-restore-<UTC time>, never deleted.
# RINGSIDE_RESTORE_DIR / _PORT / _PASSWORD_FILE restore elsewhere instead (the backup test
# does), and RINGSIDE_RESTORE_KEEP_RUNNING=1 leaves that cluster running afterwards.
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

FILE="${1:-}"
[ -n "$FILE" ] || die "usage: npm run restore FILE (an archive written by npm run backup)"
[ -s "$FILE" ] || die "$FILE does not exist or is empty"
FILE="$(cd "$(dirname "$FILE")" && pwd)/$(basename "$FILE")"
ensure_postgres
"$PG_BIN/pg_restore" --list "$FILE" >/dev/null 2>&1 || die "$FILE is not a pg_dump archive that pg_restore $("$PG_BIN/pg_restore" --version | sed -E 's/.* ([0-9.]+).*/\1/') can read"

TARGET="${RINGSIDE_RESTORE_DIR:-$DATA/pg}"
PORT="${RINGSIDE_RESTORE_PORT:-${RINGSIDE_PG_PORT:-54329}}"
PWFILE="${RINGSIDE_RESTORE_PASSWORD_FILE:-$DATA/pg-password}"
ensure_data_dir

if [ "$TARGET" = "$DATA/pg" ]; then
  exec 9>"$DATA/start.lock"
  flock -n 9 || die "npm start is running for this folder: stop it before restoring"
fi
if [ -e "$TARGET" ]; then
  ASIDE="$TARGET.before-restore-$(date -u +%Y%m%dT%H%M%SZ)"
  pg_down "$TARGET"
  mv "$TARGET" "$ASIDE"
  log "the previous cluster is kept in ${ASIDE#$ROOT/}"
fi

stop_ours() { if [ "${RINGSIDE_RESTORE_KEEP_RUNNING:-0}" != 1 ]; then pg_down "$TARGET"; fi; }
trap stop_ours EXIT
pg_up "$TARGET" "$PORT" "$PWFILE"
DB_NAME="${RINGSIDE_RESTORE_DB:-ringside}"
ensure_database "$PORT" "$PWFILE" "$DB_NAME"
URL="$(database_url "$PORT" "$PWFILE" "$DB_NAME")"
"$PG_BIN/pg_restore" --exit-on-error --no-password --dbname="$URL" "$FILE" || die "pg_restore failed; the fresh cluster in ${TARGET#$ROOT/} is incomplete"
log "restored $FILE into ${TARGET#$ROOT/} (database $DB_NAME)"
