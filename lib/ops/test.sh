#!/usr/bin/env bash
# npm test: a throw-away PostgreSQL cluster, SMTP sink and production server of its own,
# then the type check, every vitest suite under tests/ and the browser tests.
# Ends with one line "N passed, N failed"; exits non-zero on any failure.
# `npm test -- FILTER…` runs only the vitest files matching the filters and skips the
# browser tests unless RINGSIDE_BROWSER_ONLY names some (comma-separated file names).
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

# first_free_port BASE: BASE or the next free port above it (parallel runs do not collide).
first_free_port() {
  local p="$1"
  while ! port_free "$p"; do p=$((p + 1)); [ "$p" -lt $(($1 + 100)) ] || die "no free port near $1"; done
  printf '%s' "$p"
}

ensure_data_dir
T="$DATA/test-$$"
PASSED=0
FAILED=0
SETUP_DONE=0
SINK_PID=""
WEB_PID=""
finish() {
  local code=$?
  trap - EXIT INT TERM
  stop_pid "$WEB_PID"
  stop_pid "$SINK_PID"
  [ -d "$T/pg" ] && pg_down "$T/pg"
  if { [ "$FAILED" -gt 0 ] || [ "$code" -ne 0 ]; } && [ -s "$T/web.log" ]; then
    log "last lines of the test server's log:"
    tail -n 30 "$T/web.log" >&2
  fi
  rm -rf "$T"
  if [ "$SETUP_DONE" = 0 ]; then
    log "set-up failed before the tests could run"
    FAILED=$((FAILED + 1))
  fi
  printf '%s passed, %s failed\n' "$PASSED" "$FAILED"
  if [ "$FAILED" -gt 0 ] || [ "$code" -ne 0 ]; then exit 1; fi
  exit 0
}
trap finish EXIT
trap 'exit 130' INT TERM

ensure_postgres
/usr/bin/python3 -c 'import sympy' 2>/dev/null || apt_install python3-sympy
[ -x /usr/bin/chromium ] || apt_install chromium
ensure_node_modules

PG_PORT="$(first_free_port "${RINGSIDE_TEST_PG_PORT:-54339}")"
pg_up "$T/pg" "$PG_PORT" "$T/pg-password" "-c fsync=off -c synchronous_commit=off -c full_page_writes=off"
ensure_database "$PG_PORT" "$T/pg-password" ringside_test

export DATABASE_URL
DATABASE_URL="$(database_url "$PG_PORT" "$T/pg-password" ringside_test)"
log "applying migrations to the test database"
node_ts db/migrate.ts

SMTP_PORT="$(first_free_port "${RINGSIDE_TEST_SMTP_PORT:-2535}")"
export RINGSIDE_SMTP_PORT="$SMTP_PORT"
export RINGSIDE_MAIL_DIR="$T/mail"
export RINGSIDE_SYMPY_PYTHON=/usr/bin/python3
export RINGSIDE_BCRYPT_COST=4
# A short cell time limit so the API test of the limit finishes quickly.
export RINGSIDE_CELL_TIME_LIMIT_MS=8000
export NEXT_TELEMETRY_DISABLED=1
# Large values' details (lib/compute/large-values.ts) of this run, removed with it; the
# suites plant and check files there (tests/api/value-details.test.ts).
export RINGSIDE_DETAIL_DIR="$T/details"
# The suites connect from 127.0.0.1 and act as a proxy for invented client addresses
# (X-Forwarded-For: testAddress(n)), so each file has its own rate-limit bucket; a client
# connecting from any other loopback address (127.0.0.2 …) is untrusted, which is how
# tests/integration/sign-in-protection.test.ts shows that a spoofed header changes nothing.
export RINGSIDE_TRUSTED_PROXIES=127.0.0.1
export NEXTAUTH_SECRET
NEXTAUTH_SECRET="$(secret_file "$T/nextauth-secret")"

TYPECHECK=0
log "tsc --noEmit"
npx tsc --noEmit -p . || TYPECHECK=1

# The rules of DEVELOPERS.md (layers, no import cycles, hooks) and the formatter, checked
# by `npm run lint` (eslint.config.mjs, .prettierrc.json). A filtered run (`npm test --
# FILTER…`) checks one suite and skips it; a full run counts a lint failure as one failure.
LINT=0
if [ "$#" -eq 0 ]; then
  log "npm run lint"
  npm run --silent lint || LINT=1
fi

node --import tsx lib/ops/smtp-sink.ts 2>"$T/smtp.log" &
SINK_PID=$!
wait_port "$SMTP_PORT" 30 "$SINK_PID"

# Without a build the suites still run (the HTTP ones fail against no server), so one
# broken page does not hide the rest; the browser tests are skipped.
BUILD_OK=1
build_if_stale || BUILD_OK=0
WEB_PORT="$(first_free_port "${RINGSIDE_TEST_WEB_PORT:-3100}")"
export NEXTAUTH_URL="http://127.0.0.1:$WEB_PORT"
export RINGSIDE_TEST_BASE_URL="$NEXTAUTH_URL"
export RINGSIDE_TEST_SERVER_LOG="$T/web.log"
: >"$T/web.log"
if [ "$BUILD_OK" = 1 ]; then
  # No embedded experiment worker in the shared test server: the experiment suites start
  # their own workers and servers (tests/experiments/helpers.ts) and kill some of them.
  RINGSIDE_EMBEDDED_WORKER=0 serve_web "$WEB_PORT" >"$T/web.log" 2>&1 &
  WEB_PID=$!
  wait_http "$NEXTAUTH_URL/sign-in" 60 "$WEB_PID"
else
  log "without a build: counted as one failure, browser tests skipped"
  FAILED=$((FAILED + 1))
fi
SETUP_DONE=1

[ "$TYPECHECK" = 0 ] || { log "type check failed (counted as one failure)"; FAILED=$((FAILED + 1)); }
[ "$LINT" = 0 ] || { log "lint failed (counted as one failure)"; FAILED=$((FAILED + 1)); }

# count_json FILE: prints "passed failed" from a results file with numPassedTests/numFailedTests.
count_json() {
  node -e 'const r=JSON.parse(require("fs").readFileSync(process.argv[1],"utf8"));
    const failedSuites=(r.testResults||[]).filter(s=>s.status==="failed"&&!(s.assertionResults||[]).some(a=>a.status==="failed")).length;
    console.log(r.numPassedTests, r.numFailedTests + failedSuites)' "$1"
}

log "vitest"
VITEST_OK=0
npx vitest run "$@" --reporter=default --reporter=json --outputFile.json="$T/vitest.json" || VITEST_OK=1
if [ -s "$T/vitest.json" ]; then
  read -r p f < <(count_json "$T/vitest.json")
  PASSED=$((PASSED + p)); FAILED=$((FAILED + f))
  [ "$VITEST_OK" = 0 ] || [ "$f" -gt 0 ] || FAILED=$((FAILED + 1))
else
  log "vitest wrote no results"; FAILED=$((FAILED + 1))
fi

[ "$BUILD_OK" = 1 ] || exit 1
BROWSER_FILES=()
[ -z "${RINGSIDE_BROWSER_ONLY:-}" ] || IFS=, read -r -a BROWSER_FILES <<<"$RINGSIDE_BROWSER_ONLY"
if [ "$#" -gt 0 ] && [ "${#BROWSER_FILES[@]}" = 0 ]; then
  log "vitest filters given: browser tests skipped (RINGSIDE_BROWSER_ONLY=file.ts runs some)"
  exit 0
fi
log "browser tests"
BROWSER_OK=0
node --import tsx tests/helpers/browser-runner.ts "$T/browser.json" "${BROWSER_FILES[@]}" || BROWSER_OK=1
if [ -s "$T/browser.json" ]; then
  read -r p f < <(count_json "$T/browser.json")
  PASSED=$((PASSED + p)); FAILED=$((FAILED + f))
  [ "$BROWSER_OK" = 0 ] || [ "$f" -gt 0 ] || FAILED=$((FAILED + 1))
else
  log "the browser runner wrote no results"; FAILED=$((FAILED + 1))
fi
