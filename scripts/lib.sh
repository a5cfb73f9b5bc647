#!/usr/bin/env bash
# Shared set-up steps for start, test and bench: dependencies, PostgreSQL, chromium.
# Each function does one thing and is safe to call again.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1

log() { printf '\033[1;34m[keelson]\033[0m %s\n' "$*"; }

as_root() {
  if [ "$(id -u)" = 0 ]; then "$@"; elif command -v sudo >/dev/null; then sudo "$@"; else
    log "need root for: $*"; return 1; fi
}

# Install node packages when node_modules is missing or older than the lock file.
ensure_node_modules() {
  local stamp="$ROOT/node_modules/.keelson-lock-hash"
  local want
  want="$(sha256sum "$ROOT/package-lock.json" | cut -d' ' -f1)"
  if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    log "installing packages (npm ci)…"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
    echo "$want" > "$stamp"
  fi
}

pg_bindir() {
  local d
  d="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1 || true)"
  [ -n "$d" ] && [ -x "$d/initdb" ] && echo "$d"
}

ensure_postgres_installed() {
  if [ -z "$(pg_bindir)" ]; then
    log "installing PostgreSQL from Debian's packages…"
    as_root apt-get update -qq
    DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -qq postgresql >/dev/null
  fi
}

ensure_chromium_installed() {
  if [ ! -x /usr/bin/chromium ]; then
    log "installing chromium from Debian's packages…"
    as_root apt-get update -qq
    DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -qq chromium >/dev/null
  fi
}

# Run a command as the cluster's owner: initdb refuses root, so root hands over to `postgres`.
as_pg_owner() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# The cluster lives under .data/ when the postgres user can reach it, else under /var/tmp.
pg_cluster_dir() {
  local name="$1" dir="$ROOT/.data/$name"
  if [ "$(id -u)" = 0 ] && ! runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
    dir="/var/tmp/keelson-$(echo "$ROOT" | sha256sum | cut -c1-8)/$name"
  fi
  echo "$dir"
}

# pg_up NAME PORT USER PASSWORD DB: create the cluster if absent, start it, create the database.
pg_up() {
  local name="$1" port="$2" user="$3" pass="$4" db="$5"
  local dir bin
  dir="$(pg_cluster_dir "$name")"
  bin="$(pg_bindir)"
  mkdir -p "$dir/run"
  if [ "$(id -u)" = 0 ]; then chown postgres:postgres "$dir" "$dir/run"; fi
  if [ ! -f "$dir/data/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in $dir/data"
    local pwfile="$dir/run/pwfile"
    printf '%s\n' "$pass" > "$pwfile"
    if [ "$(id -u)" = 0 ]; then chown postgres "$pwfile"; fi
    mkdir -p "$dir/data"; chmod 700 "$dir/data"
    if [ "$(id -u)" = 0 ]; then chown postgres:postgres "$dir/data"; fi
    as_pg_owner "$bin/initdb" -D "$dir/data" -U "$user" --pwfile="$pwfile" \
      --auth-local=trust --auth-host=scram-sha-256 -E UTF8 --locale=C.UTF-8 >/dev/null
    rm -f "$pwfile"
  fi
  if ! as_pg_owner "$bin/pg_ctl" -D "$dir/data" status >/dev/null 2>&1; then
    as_pg_owner "$bin/pg_ctl" -D "$dir/data" -l "$dir/run/pg.log" -w \
      -o "-h 127.0.0.1 -p $port -k $dir/run -c fsync=${PG_FSYNC:-on}" start >/dev/null
  fi
  if ! as_pg_owner "$bin/psql" -h "$dir/run" -p "$port" -U "$user" -d postgres -tAc \
      "select 1 from pg_database where datname = '$db'" | grep -q 1; then
    as_pg_owner "$bin/createdb" -h "$dir/run" -p "$port" -U "$user" "$db"
  fi
}

pg_down() {
  local name="$1" dir bin
  dir="$(pg_cluster_dir "$name")"
  bin="$(pg_bindir)"
  if [ -n "$bin" ] && [ -f "$dir/data/PG_VERSION" ]; then
    as_pg_owner "$bin/pg_ctl" -D "$dir/data" -m fast -w stop >/dev/null 2>&1 || true
  fi
}

pg_destroy() {
  local name="$1"
  pg_down "$name"
  rm -rf "$(pg_cluster_dir "$name")"
}

# A random free TCP port on loopback.
free_port() {
  node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})'
}

wait_for_http() {
  local url="$1" tries="${2:-120}"
  for _ in $(seq "$tries"); do
    if curl -fsS -o /dev/null "$url" 2>/dev/null; then return 0; fi
    sleep 0.5
  done
  log "timed out waiting for $url"; return 1
}
