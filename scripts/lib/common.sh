# Shared by scripts/start.sh and scripts/test.sh (sourced, bash). Everything here must work before
# node_modules exists.

log() { printf '\033[1m[bandwright]\033[0m %s\n' "$*"; }
die() { printf '[bandwright] error: %s\n' "$*" >&2; exit 1; }

# npm ci when node_modules is missing or older than package-lock.json.
ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund
    touch node_modules
  fi
}

# A development secret in the git-ignored .env.local, created once; an existing value is kept.
ensure_local_secret() {
  if [ ! -f .env.local ] || ! grep -q '^BETTER_AUTH_SECRET=' .env.local; then
    log "generating a development session secret into .env.local"
    printf 'BETTER_AUTH_SECRET=%s\n' "$(od -An -tx1 -N32 /dev/urandom | tr -d ' \n')" >> .env.local
  fi
  set -a
  # shellcheck disable=SC1091
  . ./.env.local
  set +a
}

# Picks PostgreSQL's server binaries, installing Debian's package as root when none are found.
find_postgres_bin() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
  if [ -z "$dir" ] || [ ! -x "$dir/initdb" ]; then
    if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
      log "PostgreSQL not found; installing Debian's postgresql package"
      DEBIAN_FRONTEND=noninteractive apt-get update -qq
      DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
      dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
    else
      die "PostgreSQL server binaries not found. Install the Debian package 'postgresql' (apt-get install -y postgresql), or set DATABASE_URL to an existing server."
    fi
  fi
  [ -x "$dir/initdb" ] || die "PostgreSQL install did not provide initdb in /usr/lib/postgresql/*/bin"
  PG_BIN=$dir
}

# PostgreSQL refuses to run as root: as root, run its tools as the postgres system user.
as_postgres() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# start_postgres DATA_DIR PORT: initialises (first time) and starts a private server on 127.0.0.1 whose
# socket lives inside DATA_DIR.
start_postgres() {
  local data=$1 port=$2
  find_postgres_bin
  mkdir -p "$(dirname "$data")"
  chmod 755 "$(dirname "$data")"
  if [ ! -f "$data/PG_VERSION" ]; then
    log "initialising PostgreSQL in $data"
    mkdir -p "$data"
    [ "$(id -u)" = 0 ] && chown postgres:postgres "$data"
    chmod 700 "$data"
    as_postgres "$PG_BIN/initdb" -D "$data" --username=postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if as_postgres "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    log "PostgreSQL already running in $data"
  else
    log "starting PostgreSQL on 127.0.0.1:$port"
    as_postgres "$PG_BIN/pg_ctl" -D "$data" -l "$data/server.log" -w -o "-p $port -c listen_addresses=127.0.0.1 -k $data" start >/dev/null \
      || die "PostgreSQL did not start; see $data/server.log"
  fi
}

stop_postgres() {
  local data=$1
  if [ -n "${PG_BIN:-}" ] && as_postgres "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    log "stopping PostgreSQL"
    as_postgres "$PG_BIN/pg_ctl" -D "$data" -m fast -w stop >/dev/null || true
  fi
}

# ensure_database DATA_DIR PORT NAME [recreate]: creates the database (dropping it first when asked).
ensure_database() {
  local data=$1 port=$2 name=$3 recreate=${4:-}
  if [ "$recreate" = recreate ]; then
    as_postgres "$PG_BIN/dropdb" -h "$data" -p "$port" -U postgres --if-exists --force "$name"
  fi
  if ! as_postgres "$PG_BIN/psql" -h "$data" -p "$port" -U postgres -tAc "select 1 from pg_database where datname='$name'" postgres | grep -q 1; then
    as_postgres "$PG_BIN/createdb" -h "$data" -p "$port" -U postgres "$name"
  fi
}

next_bin() { printf '%s' node_modules/next/dist/bin/next; }
