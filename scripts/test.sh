#!/usr/bin/env bash
# npm test: the same set-up as npm start, on a separate PostgreSQL (own data folder and port, so both can
# run at once) with a freshly created database; then builds and runs every vitest project.
# Ends with one line "N passed, N failed" and a non-zero exit status on any failure.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib/common.sh

export NEXT_TELEMETRY_DISABLED=1
PG_PORT=${TEST_PG_PORT:-54339}
PG_DATA=${TEST_PG_DATA:-$PWD/.data/postgres-test}
# A build of its own, so a running `npm start` keeps serving its .next folder.
export NEXT_DIST_DIR=${NEXT_DIST_DIR:-.next-test}
RESULTS=${TEST_RESULTS_DIR:-$PWD/test-results}

ensure_node_modules
ensure_local_env
# Two runs on one data folder would drop each other's database.
take_lock "$PG_DATA.lock" "npm test" "data folder $PG_DATA"

if [ ! -x /usr/bin/chromium ]; then
  if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
    log "installing Debian's chromium for the browser tests"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    die "/usr/bin/chromium is missing; install the Debian package 'chromium' (apt-get install -y chromium)."
  fi
fi

OWN_POSTGRES=
cleanup() {
  trap - INT TERM EXIT
  if [ -n "$OWN_POSTGRES" ]; then stop_postgres "$PG_DATA"; fi
}
trap 'exit 130' INT TERM
trap cleanup EXIT

if [ -z "${TEST_DATABASE_URL:-}" ]; then
  start_postgres "$PG_DATA" "$PG_PORT"
  OWN_POSTGRES=$PG_STARTED_HERE
  ensure_database "$PG_DATA" "$PG_PORT" bandwright_test recreate
  export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/bandwright_test"
  # The fault tests stop and restart this server (tests/support/test-postgres.ts); only this private one.
  export TEST_PG_CONTROL_DATA=$PG_DATA TEST_PG_CONTROL_PORT=$PG_PORT
else
  log "using TEST_DATABASE_URL (its tables are dropped and re-created)"
  export DATABASE_URL=$TEST_DATABASE_URL
  node_modules/.bin/tsx scripts/reset-database.ts
fi

# Abandoned fits are handed back after 6 s instead of 15 s (every process of the run reads it).
export FIT_HEARTBEAT_STALE_SECONDS=${FIT_HEARTBEAT_STALE_SECONDS:-6}
# The global set-up replaces these with the addresses of the processes it starts; the build needs values.
export APP_URL=http://127.0.0.1:3999
export SMTP_URL=smtp://127.0.0.1:2599
node_modules/.bin/tsx scripts/migrate.ts

mkdir -p "$RESULTS"
rm -f "$RESULTS/vitest.json"
if [ "${SKIP_BUILD:-}" = 1 ] && [ -f "$NEXT_DIST_DIR/BUILD_ID" ]; then
  log "reusing the build in $NEXT_DIST_DIR (SKIP_BUILD=1)"
else
  log "building (next build)"
  node "$(next_bin)" build >"$RESULTS/build.log" 2>&1 || { tail -n 40 "$RESULTS/build.log"; die "next build failed (log: $RESULTS/build.log)"; }
fi

status=0
# Arguments narrow the run, e.g. `npm test -- tests/integration/datasets` (set SKIP_BUILD=1 to reuse the build).
node_modules/.bin/vitest run "$@" --reporter=default --reporter=json --outputFile.json="$RESULTS/vitest.json" || status=$?
node_modules/.bin/tsx scripts/summarise-test-results.ts "$RESULTS/vitest.json" || status=1
exit "$status"
