# Shared set-up steps for start.sh, test.sh and dev.sh. Sourced, not run.
# Everything here is idempotent: a second run finds the work done and moves on.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PG_BIN=""

say() { printf '\033[1;33m[headroom]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[headroom] %s\033[0m\n' "$*" >&2; exit 1; }

as_root() {
  if [ "$(id -u)" = "0" ]; then "$@"; elif command -v sudo >/dev/null; then sudo "$@"; else
    die "need root to run: $* (install it by hand, then run again)"
  fi
}

APT_UPDATED=0
apt_install() {
  if [ "$APT_UPDATED" = "0" ]; then
    say "apt-get update"
    as_root apt-get update -qq || die "apt-get update failed"
    APT_UPDATED=1
  fi
  say "installing from Debian's packages: $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null ||
    die "apt-get install $* failed"
}

find_pg_bin() {
  local d
  for d in /usr/lib/postgresql/*/bin; do
    if [ -x "$d/initdb" ] && [ -x "$d/pg_ctl" ]; then PG_BIN="$d"; fi
  done
}

ensure_postgres() {
  find_pg_bin
  if [ -z "$PG_BIN" ]; then
    apt_install postgresql
    find_pg_bin
    [ -n "$PG_BIN" ] || die "PostgreSQL installed but initdb was not found under /usr/lib/postgresql"
  fi
}

ensure_chromium() {
  if [ -x /usr/lib/chromium/chromium ] || [ -x /usr/bin/chromium ]; then return; fi
  apt_install chromium
}

ensure_node_modules() {
  cd "$ROOT"
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ] ||
    [ ! -f node_modules/.package-lock.json ]; then
    say "npm ci (first run takes a minute)"
    npm ci --no-audit --no-fund || die "npm ci failed"
  fi
}

# Runs a PostgreSQL binary as the postgres user when we are root (initdb refuses root).
pg_run() {
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# pg_up DATADIR PORT [extra postgres -c options...] — create the cluster if new, then start it.
pg_up() {
  local dir="$1" port="$2"
  shift 2
  mkdir -p "$dir"
  if [ "$(id -u)" = "0" ]; then chown postgres:postgres "$dir"; chmod 700 "$dir"; fi
  if [ ! -f "$dir/PG_VERSION" ]; then
    say "creating a PostgreSQL cluster in $dir"
    pg_run "$PG_BIN/initdb" -D "$dir" -U headroom --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null ||
      die "initdb failed for $dir (is the folder readable by the postgres user?)"
  fi
  if pg_run "$PG_BIN/pg_ctl" -D "$dir" status >/dev/null 2>&1; then
    say "PostgreSQL already running in $dir"
    return
  fi
  local opts="-c listen_addresses=127.0.0.1 -p $port -k $dir $*"
  say "starting PostgreSQL on 127.0.0.1:$port"
  pg_run "$PG_BIN/pg_ctl" -D "$dir" -l "$dir/server.log" -o "$opts" -w -t 60 start >/dev/null ||
    { tail -20 "$dir/server.log" >&2; die "PostgreSQL did not start on port $port (is the port taken?)"; }
}

pg_down() {
  local dir="$1"
  [ -f "$dir/PG_VERSION" ] || return 0
  pg_run "$PG_BIN/pg_ctl" -D "$dir" -m fast -w stop >/dev/null 2>&1 || true
}

# createdb_if_missing PORT NAME
createdb_if_missing() {
  local port="$1" name="$2"
  if ! "$PG_BIN/psql" -h 127.0.0.1 -p "$port" -U headroom -d postgres -tAc \
    "select 1 from pg_database where datname='$name'" | grep -q 1; then
    "$PG_BIN/createdb" -h 127.0.0.1 -p "$port" -U headroom "$name" || die "createdb $name failed"
  fi
}

free_port() {
  node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})'
}
