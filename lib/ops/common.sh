# Shared set-up steps for start.sh and test.sh (sourced, not run).
# Every function is idempotent: it checks before it acts.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
PG_BIN=/usr/lib/postgresql/15/bin
DATA="$ROOT/.data"

log() { printf '[ringside] %s\n' "$*" >&2; }
die() { printf '[ringside] error: %s\n' "$*" >&2; exit 1; }

APT_UPDATED=0
apt_install() {
  # apt_install PACKAGE...: one `apt-get update` per run, then install.
  [ "$(id -u)" = 0 ] || die "installing $* needs root (apt-get); install it yourself or run as root"
  if [ "$APT_UPDATED" = 0 ]; then
    log "apt-get update"
    apt-get update -qq >/dev/null || die "apt-get update failed"
    APT_UPDATED=1
  fi
  log "apt-get install $*"
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null || die "apt-get install $* failed"
}

ensure_postgres() {
  [ -x "$PG_BIN/initdb" ] || apt_install postgresql
  [ -x "$PG_BIN/initdb" ] || die "PostgreSQL 15 binaries not found in $PG_BIN after installing"
}

ensure_node_modules() {
  # npm ci when node_modules is missing or older than package-lock.json.
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    log "npm ci"
    (cd "$ROOT" && npm ci --no-audit --no-fund) || die "npm ci failed"
  fi
}

ensure_data_dir() {
  # .data must be traversable by the postgres user; secrets inside are mode 600.
  install -d -m 755 "$DATA"
}

secret_file() {
  # secret_file PATH: prints the secret stored at PATH, generating it first if missing.
  local f="$1"
  if [ ! -s "$f" ]; then
    (umask 077 && head -c 32 /dev/urandom | base64 | tr -d '/+=\n' >"$f")
  fi
  chmod 600 "$f"
  cat "$f"
}

run_pg() { runuser -u postgres -- "$@"; }

# pg_up DIR PORT PASSWORD_FILE [EXTRA_OPTS]: creates the cluster in DIR when missing
# (scram-sha-256, password from PASSWORD_FILE), starts it on 127.0.0.1:PORT unless it is
# already running, and sets PG_STARTED_BY_US=1 when this call started it.
PG_STARTED_BY_US=0
pg_up() {
  local dir="$1" port="$2" pwfile="$3" extra="${4:-}"
  local sock="$dir.sock"
  install -d -o postgres -g postgres -m 755 "$sock"
  run_pg test -x "$sock" 2>/dev/null \
    || die "the postgres user cannot reach ${sock%/*}: every folder above it must be traversable (chmod o+x)"
  if [ ! -s "$dir/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in ${dir#$ROOT/}"
    install -d -o postgres -g postgres -m 700 "$dir"
    local tmp
    tmp="$(mktemp)"
    secret_file "$pwfile" >"$tmp"
    chown postgres "$tmp"
    run_pg "$PG_BIN/initdb" -D "$dir" -U postgres --auth=scram-sha-256 --pwfile="$tmp" \
      -E UTF8 --locale=C.UTF-8 >"$dir.initdb.log" 2>&1 || { rm -f "$tmp"; die "initdb failed: see $dir.initdb.log"; }
    rm -f "$tmp"
  fi
  if run_pg "$PG_BIN/pg_ctl" -D "$dir" status >/dev/null 2>&1; then
    log "PostgreSQL already running in ${dir#$ROOT/}"
  else
    log "starting PostgreSQL on 127.0.0.1:$port"
    run_pg "$PG_BIN/pg_ctl" -D "$dir" -l "$dir/server.log" -w -t 60 \
      -o "-c listen_addresses=127.0.0.1 -c port=$port -c unix_socket_directories=$sock $extra" start >/dev/null \
      || die "PostgreSQL did not start: see ${dir#$ROOT/}/server.log (is port $port taken?)"
    PG_STARTED_BY_US=1
  fi
}

pg_down() {
  local dir="$1"
  run_pg "$PG_BIN/pg_ctl" -D "$dir" -m fast -w -t 60 stop >/dev/null 2>&1 || true
}

# ensure_database PORT PASSWORD_FILE NAME: creates database NAME when it does not exist.
ensure_database() {
  local port="$1" pwfile="$2" name="$3"
  local exists
  exists="$(PGPASSWORD="$(cat "$pwfile")" "$PG_BIN/psql" -h 127.0.0.1 -p "$port" -U postgres -d postgres -Atc \
    "SELECT 1 FROM pg_database WHERE datname = '$name'")" || die "cannot connect to PostgreSQL on port $port"
  if [ "$exists" != 1 ]; then
    log "creating database $name"
    PGPASSWORD="$(cat "$pwfile")" "$PG_BIN/createdb" -h 127.0.0.1 -p "$port" -U postgres "$name" || die "createdb $name failed"
  fi
}

database_url() {
  local port="$1" pwfile="$2" name="$3"
  printf 'postgres://postgres:%s@127.0.0.1:%s/%s' "$(cat "$pwfile")" "$port" "$name"
}

# serve_web PORT &: the production server on 127.0.0.1:PORT (lib/ops/web-server.ts: Next's
# handler behind node:http, so the client address comes from the socket). Call it in the
# background only: the background subshell becomes node (exec), so $! is the server's own
# PID and stopping it stops the server rather than a shell left waiting for it.
serve_web() { cd "$ROOT" && exec node --import tsx lib/ops/web-server.ts --host 127.0.0.1 --port "$1"; }

node_ts() { (cd "$ROOT" && node --import tsx "$@"); }

# detail_dir: where large values' details are kept (lib/compute/large-values.ts
# detailDirectory, the same rule): RINGSIDE_DETAIL_DIR, else .data/details.
detail_dir() { printf '%s' "${RINGSIDE_DETAIL_DIR:-${RINGSIDE_ROOT:-$ROOT}/.data/details}"; }

# build_if_stale: `next build` unless .next holds a build of exactly the current sources
# (a hash over every tracked and untracked, not ignored, file outside tests/); fails
# (status 1) when the build fails.
source_hash() {
  (cd "$ROOT" && git ls-files -z -co --exclude-standard 2>/dev/null | grep -zv '^tests/' \
    | { xargs -0 -r sha256sum 2>/dev/null || true; } | sha256sum | cut -d' ' -f1)
}
build_if_stale() {
  local stamp="$ROOT/.next/.ringside-source-hash" want=""
  # One build at a time per folder: a second run waits, then usually finds the build current.
  exec 8>"$DATA/build.lock"
  flock 8
  if git -C "$ROOT" rev-parse --git-dir >/dev/null 2>&1; then want="$(source_hash)"; fi
  if [ -n "$want" ] && [ -f "$ROOT/.next/BUILD_ID" ] && [ "$(cat "$stamp" 2>/dev/null)" = "$want" ]; then
    log "production build is current"
    flock -u 8
    return 0
  fi
  log "next build"
  if ! (cd "$ROOT" && NEXT_TELEMETRY_DISABLED=1 node node_modules/next/dist/bin/next build); then
    flock -u 8
    log "next build failed"
    return 1
  fi
  # Hashed again after the build: next build itself may rewrite tsconfig.json.
  [ -n "$want" ] && source_hash >"$stamp"
  flock -u 8
  return 0
}

# wait_http URL SECONDS PID: waits until URL answers, failing early if PID dies.
wait_http() {
  local url="$1" limit="$2" pid="$3" i=0
  until curl -s -o /dev/null "$url"; do
    kill -0 "$pid" 2>/dev/null || die "process $pid exited before $url answered"
    i=$((i + 1))
    [ "$i" -le $((limit * 4)) ] || die "$url did not answer within ${limit}s"
    sleep 0.25
  done
}

# wait_port PORT SECONDS PID: waits until something listens on 127.0.0.1:PORT.
wait_port() {
  local port="$1" limit="$2" pid="$3" i=0
  until (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; do
    kill -0 "$pid" 2>/dev/null || die "process $pid exited before port $port opened"
    i=$((i + 1))
    [ "$i" -le $((limit * 4)) ] || die "nothing listened on port $port within ${limit}s"
    sleep 0.25
  done
}

# stop_pid PID: TERM, then wait for it (no-op for an empty or finished PID).
stop_pid() {
  local pid="${1:-}"
  if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then
    kill "$pid" 2>/dev/null || true
    wait "$pid" 2>/dev/null || true
  fi
}

port_free() { ! (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }
