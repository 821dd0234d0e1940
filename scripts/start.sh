#!/usr/bin/env bash
# npm start: sets everything up on this machine and serves Bandwright on http://127.0.0.1:$PORT.
# A process that dies is started again (scripts/supervise.ts); Ctrl-C stops everything this script started
# (PostgreSQL included when it started it). See README.md.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib/common.sh

export NEXT_TELEMETRY_DISABLED=1
# The environment wins over .env.local, which only fills in what is unset.
ensure_node_modules
ensure_local_env

PORT=${PORT:-3000}
PG_PORT=${PG_PORT:-54329}
PG_DATA="$PWD/.data/postgres"
MAIL_SINK_SMTP_PORT=${MAIL_SINK_SMTP_PORT:-2525}
MAIL_SINK_HTTP_PORT=${MAIL_SINK_HTTP_PORT:-2526}
export PORT MAIL_SINK_SMTP_PORT MAIL_SINK_HTTP_PORT
# One host name everywhere: better-auth compares request origins with APP_URL.
export APP_URL=${APP_URL:-http://127.0.0.1:$PORT}

# A second `npm start` in this folder would rebuild the .next folder the first one serves and fight over
# its ports and PostgreSQL: refuse before touching anything.
take_lock .data/start.lock "npm start" "$APP_URL"
require_free_port "$PORT" "the app, PORT"

OWN_POSTGRES=
SUPERVISOR=
cleanup() {
  trap - INT TERM EXIT
  # The supervisor passes the stop on to every child and exits once they all have.
  if [ -n "$SUPERVISOR" ]; then kill -TERM "$SUPERVISOR" 2>/dev/null || true; wait "$SUPERVISOR" 2>/dev/null || true; fi
  if [ -n "$OWN_POSTGRES" ]; then stop_postgres "$PG_DATA"; fi
  log "stopped"
}
# Ctrl-C ends the script (the EXIT trap cleans up) instead of carrying on with the next step.
trap 'exit 130' INT TERM
trap cleanup EXIT

if [ -z "${DATABASE_URL:-}" ]; then
  start_postgres "$PG_DATA" "$PG_PORT"
  OWN_POSTGRES=$PG_STARTED_HERE
  ensure_database "$PG_DATA" "$PG_PORT" bandwright
  export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/bandwright"
  SEED_DEMO=${SEED_DEMO:-1}
else
  log "using the PostgreSQL server in DATABASE_URL"
  # Demo accounts with a published password never appear on somebody else's server unless asked for.
  SEED_DEMO=${SEED_DEMO:-0}
fi

export SMTP_URL=${SMTP_URL:-smtp://127.0.0.1:$MAIL_SINK_SMTP_PORT}
if [ "$SMTP_URL" = "smtp://127.0.0.1:$MAIL_SINK_SMTP_PORT" ]; then
  require_free_port "$MAIL_SINK_SMTP_PORT" "the mail sink, MAIL_SINK_SMTP_PORT"
  require_free_port "$MAIL_SINK_HTTP_PORT" "the mail sink, MAIL_SINK_HTTP_PORT"
  export MAIL_SINK_URL=http://127.0.0.1:$MAIL_SINK_HTTP_PORT
fi

node_modules/.bin/tsx scripts/migrate.ts
if [ "$SEED_DEMO" = 1 ]; then node_modules/.bin/tsx scripts/seed.ts; else log "not seeding the demo (SEED_DEMO=1 to seed)"; fi

log "building (next build)"
BUILD_LOG="$PWD/.data/build.log"
node "$(next_bin)" build >"$BUILD_LOG" 2>&1 || { tail -n 40 "$BUILD_LOG"; die "next build failed (full log: $BUILD_LOG)"; }

# The app, the worker and the sink run under scripts/supervise.ts, which starts a child again when it exits
# (with back-off) and, when PostgreSQL is ours, starts it again too if it stops.
children=(app worker)
if [ -n "${MAIL_SINK_URL:-}" ]; then children+=(mail-sink); fi
supervise=(node --import tsx scripts/supervise.ts --port "$PORT")
if [ -n "$OWN_POSTGRES" ]; then supervise+=(--postgres-data "$PG_DATA" --postgres-port "$PG_PORT"); fi
"${supervise[@]}" "${children[@]}" & SUPERVISOR=$!

healthy=
for _ in $(seq 1 90); do
  kill -0 "$SUPERVISOR" 2>/dev/null || die "the supervisor stopped during start-up (see its messages above)"
  if http_ok "http://127.0.0.1:$PORT/api/health"; then healthy=1; break; fi
  sleep 1
done
[ -n "$healthy" ] || die "the app did not report healthy at http://127.0.0.1:$PORT/api/health within 90 s"

node_modules/.bin/tsx scripts/print-welcome.ts "$SEED_DEMO"
# Runs until Ctrl-C (the traps stop the supervisor, then PostgreSQL); a child that dies is restarted.
wait "$SUPERVISOR" || true
