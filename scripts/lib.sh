# Shared shell functions for scripts/demo.sh, scripts/test.sh and scripts/pg.sh.
# Everything here is idempotent: it installs only what is missing, reuses a running
# database, and stops only what it started itself.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_DIR="$ROOT/.data"
mkdir -p "$DATA_DIR"
export NEXT_TELEMETRY_DISABLED=1

log() { printf '\033[38;5;208m▸\033[0m %s\n' "$*"; }
die() { printf 'error: %s\n' "$*" >&2; exit 1; }

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

apt_updated=""
apt_install() {
  command -v apt-get >/dev/null || die "apt-get not found: install $* by hand"
  if [ -z "$apt_updated" ]; then as_root apt-get update -qq; apt_updated=1; fi
  DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -qq "$@" >/dev/null
}

ensure_node_modules() {
  local stamp="$ROOT/node_modules/.package-lock.json"
  if [ ! -f "$stamp" ] || [ "$ROOT/package-lock.json" -nt "$stamp" ]; then
    log "installing npm packages (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  fi
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    log "installing Debian's chromium for the browser tests (about a minute)"
    apt_install chromium
  fi
}

pg_bin() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  if [ -z "$dir" ]; then
    log "installing PostgreSQL (Debian package)"
    apt_install postgresql
    dir=$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1)
  fi
  echo "$dir"
}

# The server refuses to run as root: as root we run it as the `postgres` user.
pg_user_run() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

pg_data_dir() {
  local dir="$DATA_DIR/postgres"
  if [ "$(id -u)" = 0 ]; then
    # The postgres user must be able to enter every parent folder. A clone under a
    # mode-700 home cannot work: keep the cluster in /var/tmp instead and say so.
    if ! runuser -u postgres -- test -x "$DATA_DIR" 2>/dev/null; then
      local alt
      alt="/var/tmp/nightbreak-$(printf '%s' "$ROOT" | sha1sum | cut -c1-10)/postgres"
      log "the postgres user cannot enter $DATA_DIR (a parent folder is private); using $alt" >&2
      dir="$alt"
    fi
  fi
  echo "$dir"
}

free_port() {
  node -e '
    const net = require("node:net");
    const tryPort = (p) => { const s = net.createServer(); s.once("error", () => tryPort(p + 1));
      s.listen(p, "127.0.0.1", () => { s.close(() => console.log(p)); }); };
    tryPort(Number(process.argv[1]));' "$1"
}

# Starts the project-local cluster (or reuses it) and exports PG_ADMIN_URL.
# With DATABASE_URL already set by the caller, that database is used as it is.
pg_start() {
  if [ -n "${NIGHTBREAK_EXTERNAL_DB:-}" ]; then export PG_ADMIN_URL="$NIGHTBREAK_EXTERNAL_DB"; return; fi
  local bin data port pwfile opts
  bin=$(pg_bin)
  data=$(pg_data_dir)
  pwfile="$DATA_DIR/pg-password"
  [ -f "$pwfile" ] || (umask 077; node -e 'console.log(require("node:crypto").randomBytes(18).toString("hex"))' > "$pwfile")
  if [ ! -f "$data/PG_VERSION" ]; then
    log "creating the local PostgreSQL cluster in $data"
    mkdir -p "$data"
    chmod 700 "$data"
    local tmp_pw
    tmp_pw=$(mktemp)
    cp "$pwfile" "$tmp_pw"
    if [ "$(id -u)" = 0 ]; then chown -R postgres:postgres "$(dirname "$data")" "$tmp_pw"; fi
    pg_user_run "$bin/initdb" -D "$data" -U postgres --auth=scram-sha-256 --pwfile="$tmp_pw" -E UTF8 --locale=C.UTF-8 >/dev/null
    rm -f "$tmp_pw"
  fi
  if [ -f "$DATA_DIR/pg-port" ]; then port=$(cat "$DATA_DIR/pg-port"); else port=$(free_port 55432); echo "$port" > "$DATA_DIR/pg-port"; fi
  if ! pg_user_run "$bin/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    opts="-c listen_addresses=127.0.0.1 -p $port -c unix_socket_directories='' -c max_connections=200"
    # A throwaway cluster for tests may trade durability for speed; the demo keeps it.
    if [ "${NIGHTBREAK_PG_FAST:-}" = 1 ]; then opts="$opts -c fsync=off -c synchronous_commit=off -c full_page_writes=off"; fi
    log "starting PostgreSQL on 127.0.0.1:$port"
    pg_user_run "$bin/pg_ctl" -D "$data" -l "$data/server.log" -o "$opts" -w -t 60 start >/dev/null \
      || { tail -n 20 "$data/server.log" >&2; die "PostgreSQL did not start"; }
  fi
  export PG_ADMIN_URL="postgres://postgres:$(cat "$pwfile")@127.0.0.1:$port/postgres"
}

pg_stop() {
  local bin data
  bin=$(pg_bin); data=$(pg_data_dir)
  pg_user_run "$bin/pg_ctl" -D "$data" -m fast stop >/dev/null 2>&1 && log "PostgreSQL stopped" || log "PostgreSQL was not running"
}

# db_url NAME -> a URL for database NAME on the same server as PG_ADMIN_URL.
db_url() { printf '%s' "${PG_ADMIN_URL%/*}/$1"; }

# ensure_database NAME [fresh]: create it when missing; with `fresh`, drop it first.
ensure_database() {
  node "$ROOT/scripts/create-database.mjs" "$PG_ADMIN_URL" "$1" "${2:-}"
}

ensure_secret() {
  local file="$DATA_DIR/nextauth-secret"
  [ -f "$file" ] || (umask 077; node -e 'console.log(require("node:crypto").randomBytes(32).toString("base64url"))' > "$file")
  export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(cat "$file")}"
}

# wait_http URL SECONDS: wait until URL answers 2xx.
wait_http() {
  local url=$1 limit=${2:-60} i=0
  until curl -fsS -o /dev/null "$url" 2>/dev/null; do
    i=$((i + 1)); [ "$i" -gt "$((limit * 2))" ] && return 1; sleep 0.5
  done
}
