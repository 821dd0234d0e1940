#!/usr/bin/env bash
# npm start: sets everything up on this machine and serves Bandwright on http://127.0.0.1:$PORT.
# Ctrl-C stops everything this script started, PostgreSQL included. See README.md.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib/common.sh

export NEXT_TELEMETRY_DISABLED=1
PORT=${PORT:-3000}
PG_PORT=${PG_PORT:-54329}
PG_DATA="$PWD/.data/postgres"
MAIL_SINK_SMTP_PORT=${MAIL_SINK_SMTP_PORT:-2525}
MAIL_SINK_HTTP_PORT=${MAIL_SINK_HTTP_PORT:-2526}
export PORT MAIL_SINK_SMTP_PORT MAIL_SINK_HTTP_PORT

ensure_node_modules
ensure_local_secret

OWN_POSTGRES=
children=()
cleanup() {
  trap - INT TERM EXIT
  for pid in "${children[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  for pid in "${children[@]}"; do wait "$pid" 2>/dev/null || true; done
  [ -n "$OWN_POSTGRES" ] && stop_postgres "$PG_DATA"
  log "stopped"
}
trap cleanup INT TERM EXIT

if [ -z "${DATABASE_URL:-}" ]; then
  start_postgres "$PG_DATA" "$PG_PORT"
  OWN_POSTGRES=1
  ensure_database "$PG_DATA" "$PG_PORT" bandwright
  export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/bandwright"
else
  log "using the PostgreSQL server in DATABASE_URL"
fi

# One host name everywhere: better-auth compares request origins with APP_URL.
export APP_URL=${APP_URL:-http://127.0.0.1:$PORT}
export SMTP_URL=${SMTP_URL:-smtp://127.0.0.1:$MAIL_SINK_SMTP_PORT}
if [ "$SMTP_URL" = "smtp://127.0.0.1:$MAIL_SINK_SMTP_PORT" ]; then
  export MAIL_SINK_URL=http://127.0.0.1:$MAIL_SINK_HTTP_PORT
fi

node_modules/.bin/tsx scripts/migrate.ts
node_modules/.bin/tsx scripts/seed.ts

log "building (next build)"
node "$(next_bin)" build >/tmp/bandwright-build.log 2>&1 || { tail -n 40 /tmp/bandwright-build.log; die "next build failed (full log: /tmp/bandwright-build.log)"; }

if [ -n "${MAIL_SINK_URL:-}" ]; then
  node_modules/.bin/tsx scripts/mail-sink.ts & children+=($!)
fi
node_modules/.bin/tsx workers/main.ts & children+=($!)
node "$(next_bin)" start -H 127.0.0.1 -p "$PORT" & children+=($!)

for _ in $(seq 1 60); do
  curl -fsS -o /dev/null "http://127.0.0.1:$PORT/api/health" 2>/dev/null && break
  sleep 1
done

node_modules/.bin/tsx scripts/print-welcome.ts
# Stop everything as soon as any one process ends (or on Ctrl-C, through the trap).
wait -n "${children[@]}" || true
