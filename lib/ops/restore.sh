#!/usr/bin/env bash
# npm run restore FILE: restores a `npm run backup` archive into a fresh PostgreSQL cluster,
# and its large values' details into the detail folder (RINGSIDE_DETAIL_DIR, else
# .data/details). By default the cluster is .data/pg: `npm start` must not be running; the
# current cluster and detail folder are kept, moved aside to <name>.before-restore-<UTC
# time>, never deleted. RINGSIDE_RESTORE_DIR / _PORT / _PASSWORD_FILE / _DB / _DETAIL_DIR
# restore elsewhere instead (the backup test does), and RINGSIDE_RESTORE_KEEP_RUNNING=1
# leaves that cluster running afterwards.
# FILE is either a backup of format 2 (a .tar.gz holding ringside-backup.txt, database.dump
# and details/) or a bare pg_dump archive as `npm run backup` wrote before it kept details:
# that one restores the database alone and leaves the detail folder as it is (it holds no
# details; values stored as summaries then answer "not stored on this server" until the
# folder that was backed up some other way is put back).
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

FILE="${1:-}"
[ -n "$FILE" ] || die "usage: npm run restore FILE (an archive written by npm run backup)"
[ -s "$FILE" ] || die "$FILE does not exist or is empty"
FILE="$(cd "$(dirname "$FILE")" && pwd)/$(basename "$FILE")"
ensure_postgres
ensure_data_dir
PG_RESTORE_VERSION="$("$PG_BIN/pg_restore" --version | sed -E 's/.* ([0-9.]+).*/\1/')"

TARGET="${RINGSIDE_RESTORE_DIR:-$DATA/pg}"
PORT="${RINGSIDE_RESTORE_PORT:-${RINGSIDE_PG_PORT:-54329}}"
PWFILE="${RINGSIDE_RESTORE_PASSWORD_FILE:-$DATA/pg-password}"
DETAILS="${RINGSIDE_RESTORE_DETAIL_DIR:-$(detail_dir)}"
STAMP="$(date -u +%Y%m%dT%H%M%SZ)"

UNPACKED=""
cleanup() {
  [ -z "$UNPACKED" ] || rm -rf "$UNPACKED"
  if [ -n "${CLUSTER_UP:-}" ] && [ "${RINGSIDE_RESTORE_KEEP_RUNNING:-0}" != 1 ]; then pg_down "$TARGET"; fi
}
trap cleanup EXIT

# Which kind of archive: a format-2 backup, or a bare pg_dump archive (before format 2).
if "$PG_BIN/pg_restore" --list "$FILE" >/dev/null 2>&1; then
  KIND=dump
  DUMP="$FILE"
elif tar -tzf "$FILE" ringside-backup.txt database.dump >/dev/null 2>&1; then
  KIND=backup
  UNPACKED="$(mktemp -d "$DATA/.restore-XXXXXX")"
  chmod 700 "$UNPACKED"
  tar -C "$UNPACKED" --no-same-owner -xzf "$FILE" || die "$FILE cannot be unpacked"
  grep -qx 'format: 2' "$UNPACKED/ringside-backup.txt" || die "$FILE is a backup of a format this restore does not know: $(head -n1 "$UNPACKED/ringside-backup.txt")"
  DUMP="$UNPACKED/database.dump"
  "$PG_BIN/pg_restore" --list "$DUMP" >/dev/null 2>&1 || die "the database in $FILE is not a pg_dump archive that pg_restore $PG_RESTORE_VERSION can read"
  # Only the three parts, and only plain detail files named as the server names them.
  install -d -m 700 "$UNPACKED/details"
  BAD="$(find "$UNPACKED" -mindepth 1 -maxdepth 1 ! -name ringside-backup.txt ! -name database.dump ! -name details -print -quit)"
  [ -z "$BAD" ] || die "$FILE holds something that is not part of a Ringside backup: ${BAD#$UNPACKED/}"
  BAD="$(find "$UNPACKED/details" -mindepth 1 ! \( -type f -regextype posix-extended -regex '.*/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\.json' \) -print -quit)"
  [ -z "$BAD" ] || die "$FILE holds something that is not a value's detail: ${BAD#$UNPACKED/}"
else
  die "$FILE is not a Ringside backup: not a pg_dump archive that pg_restore $PG_RESTORE_VERSION can read, nor a backup tar holding one"
fi

if [ "$TARGET" = "$DATA/pg" ]; then
  exec 9>"$DATA/start.lock"
  flock -n 9 || die "npm start is running for this folder: stop it before restoring"
fi
if [ -e "$TARGET" ]; then
  ASIDE="$TARGET.before-restore-$STAMP"
  pg_down "$TARGET"
  mv "$TARGET" "$ASIDE"
  log "the previous cluster is kept in ${ASIDE#$ROOT/}"
fi

CLUSTER_UP=1
pg_up "$TARGET" "$PORT" "$PWFILE"
DB_NAME="${RINGSIDE_RESTORE_DB:-ringside}"
ensure_database "$PORT" "$PWFILE" "$DB_NAME"
URL="$(database_url "$PORT" "$PWFILE" "$DB_NAME")"
"$PG_BIN/pg_restore" --exit-on-error --no-password --dbname="$URL" "$DUMP" || die "pg_restore failed; the fresh cluster in ${TARGET#$ROOT/} is incomplete"
log "restored the database of $FILE into ${TARGET#$ROOT/} (database $DB_NAME)"

if [ "$KIND" = dump ]; then
  log "$FILE is a database archive from before backups held values' details: the detail folder ${DETAILS#$ROOT/} is left as it is"
  exit 0
fi
# The details the database refers to, in place of the folder there was (kept aside).
if [ -e "$DETAILS" ]; then
  DETAILS_ASIDE="$DETAILS.before-restore-$STAMP"
  mv "$DETAILS" "$DETAILS_ASIDE"
  log "the previous detail folder is kept in ${DETAILS_ASIDE#$ROOT/}"
fi
mkdir -p "$(dirname "$DETAILS")"
chmod 700 "$UNPACKED/details"
find "$UNPACKED/details" -type f -exec chmod 600 {} +
mv "$UNPACKED/details" "$DETAILS" 2>/dev/null || { cp -a "$UNPACKED/details" "$DETAILS" && rm -rf "$UNPACKED/details"; } \
  || die "the details could not be put in ${DETAILS#$ROOT/}"
log "restored $(find "$DETAILS" -type f | wc -l) value detail(s) into ${DETAILS#$ROOT/}"
