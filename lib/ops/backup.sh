#!/usr/bin/env bash
# npm run backup [FILE]: writes one backup of Ringside, restorable with `npm run restore FILE`:
# a gzip-compressed tar holding
#   ringside-backup.txt   what it is (format 2), when, and how many details it holds;
#   database.dump         a pg_dump archive (custom format) of the database;
#   details/<id>.json     every large value's detail (lib/compute/large-values.ts), from
#                         RINGSIDE_DETAIL_DIR or .data/details.
# Without DATABASE_URL it backs up the private cluster in .data/pg, starting it for the dump
# when `npm start` is not running. pg_dump is Debian's, from the same major version as the
# cluster (PostgreSQL 15). Default FILE: .data/backups/ringside-<UTC time>.tar.gz (folder
# 700, file 600). The details are copied before and again after the dump (files are named by
# their content and never change), so every detail a dumped row holds is in the archive even
# if a session is deleted, or a cell stored, while the backup runs.
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

ensure_postgres
OUT="${1:-$DATA/backups/ringside-$(date -u +%Y%m%dT%H%M%SZ).tar.gz}"
DETAILS="$(detail_dir)"

STAGE=""
cleanup() {
  [ -z "$STAGE" ] || rm -rf "$STAGE"
  if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then log "stopping PostgreSQL (started for the backup)"; pg_down "$DATA/pg"; fi
}
trap cleanup EXIT
if [ -n "${DATABASE_URL:-}" ]; then
  URL="$DATABASE_URL"
else
  [ -s "$DATA/pg/PG_VERSION" ] || die "no database to back up: .data/pg does not exist (run npm start once)"
  PG_PORT="${RINGSIDE_PG_PORT:-54329}"
  pg_up "$DATA/pg" "$PG_PORT" "$DATA/pg-password"
  URL="$(database_url "$PG_PORT" "$DATA/pg-password" ringside)"
fi

# pg_dump refuses a newer server; say plainly which versions met.
SERVER_MAJOR="$("$PG_BIN/psql" "$URL" -Atc 'SHOW server_version_num' | cut -c1-2)" || die "cannot connect to the database"
DUMP_MAJOR="$("$PG_BIN/pg_dump" --version | sed -E 's/.* ([0-9]+)\..*/\1/')"
[ "$SERVER_MAJOR" = "$DUMP_MAJOR" ] || die "pg_dump $DUMP_MAJOR cannot back up a PostgreSQL $SERVER_MAJOR server"

install -d -m 700 "$(dirname "$OUT")"
STAGE="$(mktemp -d "$(dirname "$OUT")/.backup-XXXXXX")"
chmod 700 "$STAGE"
install -d -m 700 "$STAGE/details"

# copy_details: stages every finished detail file (never a *.tmp being written) not staged
# yet — a hard link when the folders share a file system (details never change), else a copy;
# a file pruned meanwhile is skipped.
copy_details() {
  [ -d "$DETAILS" ] || return 0
  find "$DETAILS" -maxdepth 1 -type f -name '*.json' -print0 | while IFS= read -r -d '' f; do
    [ ! -e "$STAGE/details/${f##*/}" ] || continue
    ln "$f" "$STAGE/details/" 2>/dev/null || cp --preserve=timestamps "$f" "$STAGE/details/" 2>/dev/null || [ ! -e "$f" ] \
      || die "cannot copy the detail $f"
  done
}
copy_details
(umask 077 && "$PG_BIN/pg_dump" --format=custom --no-password --file="$STAGE/database.dump" --dbname="$URL") || die "pg_dump failed"
copy_details
# A readable table of contents is the least a backup must have before it replaces nothing.
"$PG_BIN/pg_restore" --list "$STAGE/database.dump" >/dev/null || die "the archive pg_dump wrote cannot be read back"
COUNT="$(find "$STAGE/details" -type f | wc -l)"
cat >"$STAGE/ringside-backup.txt" <<EOF
format: 2
written: $(date -u +%Y-%m-%dT%H:%M:%SZ)
postgresql: $SERVER_MAJOR
database: database.dump
details: $COUNT
EOF
chmod 600 "$STAGE/ringside-backup.txt"
(umask 077 && tar -C "$STAGE" -czf "$OUT.partial" ringside-backup.txt database.dump details) || { rm -f "$OUT.partial"; die "tar failed"; }
tar -tzf "$OUT.partial" database.dump >/dev/null || { rm -f "$OUT.partial"; die "the backup tar cannot be read back"; }
mv "$OUT.partial" "$OUT"
log "backup written: $OUT ($(stat -c %s "$OUT") bytes, PostgreSQL $SERVER_MAJOR, $COUNT value detail(s))"
