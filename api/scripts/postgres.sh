#!/usr/bin/env bash
# PostgreSQL for development and tests: Debian's server, a cluster of our own on loopback.
# Usage: postgres.sh ensure-installed | start DATA_DIR PORT | stop DATA_DIR | status DATA_DIR
set -euo pipefail

pg_bin() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  [ -n "$dir" ] && [ -x "$dir/pg_ctl" ] && echo "$dir"
}

as_owner() {
  # initdb and every pg_ctl subcommand refuse root, so root runs them as the postgres user.
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

ensure_installed() {
  if pg_bin >/dev/null; then return 0; fi
  if [ "$(id -u)" != "0" ]; then
    echo "PostgreSQL is not installed. Install Debian's package first: sudo apt-get install -y postgresql postgresql-contrib" >&2
    exit 1
  fi
  echo "Installing PostgreSQL from Debian's packages (apt-get)..."
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql postgresql-contrib >/dev/null
  # Debian starts its own cluster on 5432; ours runs separately, so that one is not needed.
  (service postgresql stop >/dev/null 2>&1 || true)
}

start() {
  local data=$1 port=$2 bin
  bin=$(pg_bin)
  mkdir -p "$data"
  data=$(cd "$data" && pwd)
  if [ "$(id -u)" = "0" ]; then
    chown postgres:postgres "$data"
    # The postgres user must be able to reach the folder through its parents.
    local p=$data
    while [ "$p" != "/" ]; do p=$(dirname "$p"); chmod o+x "$p" 2>/dev/null || true; done
  fi
  chmod 700 "$data"
  if [ ! -f "$data/PG_VERSION" ]; then
    as_owner "$bin/initdb" -D "$data" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if as_owner "$bin/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    # The fourth line of postmaster.pid is the port the running server listens on.
    local running_port
    running_port=$(sed -n 4p "$data/postmaster.pid" 2>/dev/null || true)
    if [ "$running_port" = "$port" ]; then
      echo "PostgreSQL already running from $data on 127.0.0.1:$port"
      return 0
    fi
    echo "PostgreSQL in $data is running on port ${running_port:-unknown}; restarting it on $port"
    as_owner "$bin/pg_ctl" -D "$data" -m fast -w stop >/dev/null
  fi
  rm -f "$data/postmaster.pid"
  as_owner "$bin/pg_ctl" -D "$data" -l "$data/server.log" -w -t 60 start \
    -o "-c listen_addresses=127.0.0.1 -p $port -k $data -c max_connections=200 -c fsync=off" >/dev/null
  echo "PostgreSQL running on 127.0.0.1:$port (data in $data)"
}

stop() {
  local data=$1 bin
  bin=$(pg_bin) || return 0
  [ -f "$data/PG_VERSION" ] || return 0
  as_owner "$bin/pg_ctl" -D "$(cd "$data" && pwd)" -m fast -w stop >/dev/null 2>&1 || true
}

status() {
  local bin
  bin=$(pg_bin) || exit 1
  [ -f "$1/PG_VERSION" ] || exit 3
  as_owner "$bin/pg_ctl" -D "$(cd "$1" && pwd)" status
}

cmd=${1:-}
shift || true
case "$cmd" in
  ensure-installed) ensure_installed ;;
  start) start "$@" ;;
  stop) stop "$@" ;;
  status) status "$@" ;;
  *) echo "usage: postgres.sh ensure-installed | start DATA_DIR PORT | stop DATA_DIR | status DATA_DIR" >&2; exit 2 ;;
esac
