# Shared by scripts/start.sh and scripts/test.sh (sourced, bash). Everything here must work before
# node_modules exists.

log() { printf '\033[1m[bandwright]\033[0m %s\n' "$*"; }
die() { printf '[bandwright] error: %s\n' "$*" >&2; exit 1; }

# npm ci when node_modules is missing or older than package-lock.json. npm itself writes
# node_modules/.package-lock.json at the end of an install, so that file (not the folder's mtime, which any
# package touches) tells whether the install is current. One install at a time per checkout (fd 8).
ensure_node_modules() {
  [ -f node_modules/.package-lock.json ] && [ ! package-lock.json -nt node_modules/.package-lock.json ] && return 0
  mkdir -p .data
  exec 8>.data/npm-install.lock
  flock 8
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund
  fi
  flock -u 8
}

# Prints the value of KEY in a dotenv file (last assignment wins), without surrounding quotes.
dotenv_value() {
  local file=$1 key=$2 line value=
  [ -f "$file" ] || return 0
  while IFS= read -r line || [ -n "$line" ]; do
    case $line in "$key="*) value=${line#"$key="} ;; esac
  done <"$file"
  value=${value%$'\r'}
  if [[ ${#value} -ge 2 && ( $value == \"*\" || $value == \'*\' ) ]]; then value=${value:1:${#value}-2}; fi
  printf '%s' "$value"
}

# Exports every KEY=VALUE of a dotenv file that is not already set in the environment: the environment
# always wins (as in Next's own loader). Values are taken literally, never run through the shell;
# comments, blank lines and malformed lines are skipped; surrounding quotes are removed.
load_dotenv_defaults() {
  local file=$1 line key
  [ -f "$file" ] || return 0
  while IFS= read -r line || [ -n "$line" ]; do
    [[ $line =~ ^[A-Za-z_][A-Za-z0-9_]*= ]] || continue
    key=${line%%=*}
    [ -n "${!key+set}" ] && continue
    export "$key=$(dotenv_value "$file" "$key")"
  done <"$file"
}

# ensure_local_secret FILE KEY WHAT: a KEY given in the environment is used as it is. Otherwise FILE
# provides it; 32 random bytes (64 hex digits) are generated into that file the first time (an empty or
# too short value counts as missing).
ensure_local_secret() {
  local file=$1 key=$2 what=$3
  if [ -z "${!key:-}" ] && [ "$(dotenv_value "$file" "$key" | wc -c)" -lt 32 ]; then
    log "generating $what into $file"
    # Never glue the new line onto a last line that has no newline.
    if [ -s "$file" ] && [ -n "$(tail -c1 "$file")" ]; then echo >>"$file"; fi
    printf '%s=%s\n' "$key" "$(od -An -tx1 -N32 /dev/urandom | tr -d ' \n')" >>"$file"
  fi
}

# The session secret and the mail sink's token (see ensure_local_secret), then the rest of .env.local
# fills in whatever the environment leaves unset.
ensure_local_env() {
  local file=${1:-.env.local}
  ensure_local_secret "$file" BETTER_AUTH_SECRET "a development session secret"
  ensure_local_secret "$file" MAIL_SINK_TOKEN "a token for the local mail sink"
  load_dotenv_defaults "$file"
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
# socket lives inside DATA_DIR. Sets PG_STARTED_HERE=1 only when this call started it, so a caller never
# stops a server somebody else is using.
start_postgres() {
  local data=$1 port=$2 parent
  PG_STARTED_HERE=
  find_postgres_bin
  parent=$(dirname "$data")
  if [ ! -d "$parent" ]; then
    mkdir -p "$parent"
    # Only a folder created here is touched, and only by adding traverse rights for the postgres user.
    [ "$(id -u)" = 0 ] && chmod o+x "$parent"
  fi
  if [ "$(id -u)" = 0 ] && ! runuser -u postgres -- test -x "$parent"; then
    die "the postgres system user cannot reach $parent (a folder above it is private, e.g. /root); move the clone elsewhere or set DATABASE_URL."
  fi
  if [ ! -f "$data/PG_VERSION" ]; then
    log "initialising PostgreSQL in $data"
    mkdir -p "$data"
    [ "$(id -u)" = 0 ] && chown postgres:postgres "$data"
    chmod 700 "$data"
    as_postgres "$PG_BIN/initdb" -D "$data" --username=postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if as_postgres "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    log "PostgreSQL already running in $data (left running at the end)"
  else
    log "starting PostgreSQL on 127.0.0.1:$port"
    # 8>&- 9>&-: the server must not inherit our lock files' descriptors, or a server left behind by a
    # killed run would hold the lock and refuse every later run.
    as_postgres "$PG_BIN/pg_ctl" -D "$data" -l "$data/server.log" -w -o "-p $port -c listen_addresses=127.0.0.1 -k $data" start >/dev/null 8>&- 9>&- \
      || die "PostgreSQL did not start; see $data/server.log"
    PG_STARTED_HERE=1
  fi
}

stop_postgres() {
  local data=$1
  if [ -n "${PG_BIN:-}" ] && as_postgres "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    log "stopping PostgreSQL"
    as_postgres "$PG_BIN/pg_ctl" -D "$data" -m fast -w stop >/dev/null || true
  fi
}

# take_lock FILE WHAT [DETAIL]: an exclusive lock on FILE for the rest of the script (fd 9), or a stop with
# a message naming the process that holds it (its pid and DETAIL, e.g. its URL). The lock goes away with the process, even after a crash.
take_lock() {
  local file=$1 what=$2 detail=${3:-} holder
  mkdir -p "$(dirname "$file")"
  exec 9<>"$file"
  if ! flock -n 9; then
    holder=$(cat "$file" 2>/dev/null || true)
    die "$what is already running in this folder (${holder:-pid unknown}); stop it first (Ctrl-C in its terminal)."
  fi
  printf 'pid %s%s' "$$" "${detail:+, $detail}" >"$file"
}

# Stops with a clear message when something already listens on 127.0.0.1:PORT.
require_free_port() {
  local port=$1 what=$2
  if node -e 'const s=require("net").createServer();s.once("error",()=>process.exit(1));s.listen(+process.argv[1],"127.0.0.1",()=>s.close())' "$port"; then
    return 0
  fi
  die "port $port ($what) is already in use on 127.0.0.1; stop what uses it or choose another port."
}

# Exit status 0 once GET URL answers 2xx (node's fetch: curl is not on every minimal image).
http_ok() {
  node -e 'fetch(process.argv[1],{signal:AbortSignal.timeout(8000)}).then(r=>process.exit(r.ok?0:1),()=>process.exit(1))' "$1"
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
