#!/usr/bin/env bash
# Local PostgreSQL 15 + PostGIS on 127.0.0.1 for development and tests.
#   server/scripts/db.sh start [dev|test]   install when missing, init the cluster once, start (idempotent)
#   server/scripts/db.sh stop  [dev|test]   clean shutdown (idempotent)
#   server/scripts/db.sh status [dev|test]
# The dev cluster keeps data in .data/pg-dev; the test cluster (.data/pg-test) runs with fsync off.
set -euo pipefail

cmd=${1:-start}
flavour=${2:-dev}
root=$(cd "$(dirname "$0")/../.." && pwd)
PGBIN=${PGBIN:-/usr/lib/postgresql/15/bin}

if [ "$flavour" = test ]; then
  port=${TEST_DB_PORT:-54330}; dbname=browseline_test
else
  port=${DB_PORT:-54329}; dbname=browseline
fi

install_packages() {
  local need=()
  [ -x "$PGBIN/postgres" ] || need+=(postgresql-15)
  [ -f /usr/share/postgresql/15/extension/postgis.control ] || need+=(postgresql-15-postgis-3)
  if [ ${#need[@]} -gt 0 ]; then
    echo "db: installing ${need[*]} from Debian" >&2
    if [ "$(id -u)" -ne 0 ]; then echo "db: run as root (or install ${need[*]} first)" >&2; exit 1; fi
    apt-get update -qq >/dev/null
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${need[@]}" >/dev/null
  fi
}

# The postgres user must traverse every parent of the data folder; fall back to /tmp when it cannot.
pick_base() {
  local base="$root/.data"
  mkdir -p "$base"
  if [ "$(id -u)" -eq 0 ] && ! runuser -u postgres -- test -x "$base" 2>/dev/null; then
    base="/tmp/browseline-$(printf '%s' "$root" | md5sum | cut -c1-8)"
    mkdir -p "$base"
  fi
  printf '%s' "$base"
}

base=$(pick_base)
data="$base/pg-$flavour"
sock="$base/pg-$flavour-sock"

as_pg() {
  if [ "$(id -u)" -eq 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

running() { [ -f "$data/postmaster.pid" ] && as_pg "$PGBIN/pg_ctl" -D "$data" status >/dev/null 2>&1; }

case "$cmd" in
  start)
    install_packages
    mkdir -p "$data" "$sock"
    [ "$(id -u)" -eq 0 ] && chown postgres:postgres "$data" "$sock" && chmod 700 "$data"
    if [ ! -f "$data/PG_VERSION" ]; then
      as_pg "$PGBIN/initdb" -D "$data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
    fi
    if ! running; then
      opts="-c listen_addresses=127.0.0.1 -p $port -k $sock"
      [ "$flavour" = test ] && opts="$opts -c fsync=off -c synchronous_commit=off -c full_page_writes=off"
      as_pg "$PGBIN/pg_ctl" -D "$data" -l "$data/server.log" -w -o "$opts" start >/dev/null
    fi
    if ! psql -h 127.0.0.1 -p "$port" -U postgres -tAc "select 1 from pg_database where datname='$dbname'" postgres | grep -q 1; then
      psql -h 127.0.0.1 -p "$port" -U postgres -qc "create database $dbname" postgres
    fi
    echo "db: $flavour PostgreSQL on 127.0.0.1:$port database $dbname" >&2
    ;;
  stop)
    if running; then as_pg "$PGBIN/pg_ctl" -D "$data" -m fast -w stop >/dev/null; fi
    echo "db: $flavour stopped" >&2
    ;;
  status)
    if running; then echo "running on 127.0.0.1:$port"; else echo "stopped"; exit 3; fi
    ;;
  url)
    echo "postgres://postgres@127.0.0.1:$port/$dbname"
    ;;
  *) echo "usage: db.sh start|stop|status|url [dev|test]" >&2; exit 2 ;;
esac
