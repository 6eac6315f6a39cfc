# Shared by start.sh and test.sh: install what is missing, run a PostgreSQL cluster of our own.
# Sourced, not run. Expects ROOT to be the repo root.

PG_BIN=""
say() { printf '[assay] %s\n' "$*"; }
die() { printf '[assay] error: %s\n' "$*" >&2; exit 1; }

find_pg_bin() {
  local d
  for d in /usr/lib/postgresql/*/bin; do
    [ -x "$d/initdb" ] && PG_BIN="$d"
  done
  [ -n "$PG_BIN" ]
}

ensure_system_packages() {
  local missing=()
  find_pg_bin || missing+=(postgresql)
  command -v ngspice >/dev/null 2>&1 || missing+=(ngspice)
  if [ "${ASSAY_E2E:-0}" = "1" ] && [ ! -x /usr/bin/chromium ]; then missing+=(chromium); fi
  [ ${#missing[@]} -eq 0 ] && return 0
  if [ "$(id -u)" -ne 0 ]; then
    die "missing system packages: please run 'sudo apt-get install -y ${missing[*]}' and start again"
  fi
  say "installing ${missing[*]} from Debian's packages"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null || die "apt-get update failed"
  apt-get install -y -qq "${missing[@]}" >/dev/null || die "apt-get install ${missing[*]} failed"
  find_pg_bin || die "postgresql installed but initdb not found under /usr/lib/postgresql"
}

ensure_node_modules() {
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    say "npm ci"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed"
  fi
}

port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

free_port() {
  node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})'
}

# initdb refuses root: as root the cluster belongs to the 'postgres' OS user (created by Debian's package).
pg_as_owner() {
  if [ "$(id -u)" -eq 0 ]; then
    su postgres -s /bin/sh -c "$*"
  else
    sh -c "$*"
  fi
}

pg_start() { # DIR PORT
  local dir="$1" port="$2"
  if [ ! -s "$dir/PG_VERSION" ]; then
    mkdir -p "$dir"
    [ "$(id -u)" -eq 0 ] && chown postgres:postgres "$dir" && chmod 700 "$dir"
    say "creating a PostgreSQL cluster in $dir"
    pg_as_owner "'$PG_BIN/initdb' -D '$dir' -U postgres -A trust -E UTF8 --no-locale" >"$dir.initdb.log" 2>&1 \
      || die "initdb failed, see $dir.initdb.log"
  fi
  if pg_as_owner "'$PG_BIN/pg_ctl' -D '$dir' status" >/dev/null 2>&1; then
    say "PostgreSQL already running in $dir"
    return 0
  fi
  port_in_use "$port" && die "port $port is already in use: set ASSAY_DB_PORT to another port"
  pg_as_owner "'$PG_BIN/pg_ctl' -D '$dir' -l '$dir/server.log' -o \"-p $port -c listen_addresses=127.0.0.1 -k '$dir'\" -w -t 60 start" >/dev/null \
    || die "PostgreSQL did not start on 127.0.0.1:$port, see $dir/server.log"
  pg_as_owner "'$PG_BIN/psql' -h 127.0.0.1 -p $port -U postgres -tAc \"SELECT 1 FROM pg_database WHERE datname='assay'\"" | grep -q 1 \
    || pg_as_owner "'$PG_BIN/createdb' -h 127.0.0.1 -p $port -U postgres assay" || die "could not create database assay"
}

pg_stop() { # DIR
  [ -n "$PG_BIN" ] && [ -s "$1/PG_VERSION" ] && pg_as_owner "'$PG_BIN/pg_ctl' -D '$1' -m fast -w stop" >/dev/null 2>&1 || true
}

# The database must answer before migrations; a clear line instead of a stack trace.
db_reachable() {
  (cd "$ROOT" && node --import tsx scripts/db-ping.ts) || die "database at ${DATABASE_URL:-127.0.0.1:${ASSAY_DB_PORT:-54329}} is not reachable"
}
