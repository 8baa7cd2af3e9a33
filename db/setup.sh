#!/usr/bin/env bash
# Local PostgreSQL for Needlemap, from Debian's `postgresql` package, on 127.0.0.1 only.
#   bash db/setup.sh start   install if missing, create the cluster once, start (safe to run twice)
#   bash db/setup.sh stop    stop the server (NEEDLEMAP_PG_STOP_MODE=immediate for a crash-like stop)
#   bash db/setup.sh status
# The data directory lives inside the project (.pgdata/, git-ignored). The server runs as the
# `postgres` OS user; the app connects as role `needlemap` over TCP with a password. The socket
# (trusted without a password) is for the server's own OS user only: its folder and the socket are
# mode 0700, and this script's own psql runs as that user.
# NEEDLEMAP_PG_PORT and NEEDLEMAP_PGDATA (an absolute folder) run a second, separate cluster, e.g.
# for the fault tests, which stop and start their own server.
set -euo pipefail

cd "$(dirname "$0")/.."
ROOT="$PWD"
PGPORT="${NEEDLEMAP_PG_PORT:-54329}"
PGROOT="${NEEDLEMAP_PGDATA:-$ROOT/.pgdata}"
DATA="$PGROOT/data"
RUN="$PGROOT/run"
LOG="$PGROOT/postgres.log"
APP_ROLE="needlemap"
APP_PASSWORD="needlemap"

as_postgres() {
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

. db/pg-tools.sh
find_bin() { pg_bin_dir initdb; }

ensure_installed() {
  if find_bin >/dev/null; then return 0; fi
  echo "PostgreSQL server binaries not found; installing Debian's postgresql package..."
  if [ "$(id -u)" != "0" ]; then echo "Installing needs root (apt-get)." >&2; exit 1; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq postgresql >/dev/null
  # Debian starts its own cluster on 5432; we do not use it.
  find_bin >/dev/null || { echo "initdb still missing after installing postgresql" >&2; exit 1; }
}

check_traversable() {
  # The postgres OS user must be able to reach the data directory through every parent folder.
  local p="$PGROOT"
  while [ "$p" != "/" ]; do
    if ! as_postgres test -x "$p"; then
      echo "The postgres OS user cannot enter $p (its mode is $(stat -c %a "$p"))." >&2
      echo "Move the checkout somewhere readable, or run: chmod o+x $p" >&2
      exit 1
    fi
    p="$(dirname "$p")"
  done
}

is_running() {
  local bin; bin="$(find_bin)"
  [ -f "$DATA/PG_VERSION" ] && as_postgres "$bin/pg_ctl" -D "$DATA" status >/dev/null 2>&1
}

# The port the running server listens on (line 4 of postmaster.pid), or nothing.
running_port() {
  [ -f "$DATA/postmaster.pid" ] && sed -n 4p "$DATA/postmaster.pid"
}

psql_admin() {
  local bin; bin="$(find_bin)"
  as_postgres "$bin/psql" -h "$RUN" -p "$PGPORT" -U postgres -v ON_ERROR_STOP=1 -qAt "$@"
}

start() {
  ensure_installed
  local bin; bin="$(find_bin)"
  mkdir -p "$PGROOT" "$RUN"
  id postgres >/dev/null 2>&1 || { echo "OS user postgres missing (is the postgresql package installed?)" >&2; exit 1; }
  [ "$(id -u)" = "0" ] && chown -R postgres "$PGROOT"
  chmod 0700 "$RUN"
  check_traversable
  if [ ! -f "$DATA/PG_VERSION" ]; then
    echo "Creating a PostgreSQL cluster in $DATA"
    as_postgres "$bin/initdb" -D "$DATA" -U postgres --auth-local=trust --auth-host=scram-sha-256 \
      --encoding=UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if is_running && [ "$(running_port)" != "$PGPORT" ]; then
    # One cluster listens on one port: a server started from this folder with another
    # NEEDLEMAP_PG_PORT is moved to the port asked for now.
    echo "PostgreSQL in $DATA is running on port $(running_port); restarting it on $PGPORT"
    as_postgres "$bin/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null
  fi
  if is_running; then
    echo "PostgreSQL already running on 127.0.0.1:$PGPORT"
  else
    as_postgres "$bin/pg_ctl" -D "$DATA" -l "$LOG" -w -t 60 \
      -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $RUN -c unix_socket_permissions=0700 -c max_connections=200 -c fsync=${NEEDLEMAP_PG_FSYNC:-on}" start >/dev/null
    echo "PostgreSQL started on 127.0.0.1:$PGPORT"
  fi
  # The application role (idempotent).
  if [ "$(psql_admin -d postgres -c "select 1 from pg_roles where rolname = '$APP_ROLE'")" != "1" ]; then
    psql_admin -d postgres -c "create role $APP_ROLE login createdb password '$APP_PASSWORD'"
  fi
}

create_db() {
  local name="$1"
  if [ "$(psql_admin -d postgres -c "select 1 from pg_database where datname = '$name'")" != "1" ]; then
    psql_admin -d postgres -c "create database \"$name\" owner $APP_ROLE"
  fi
}

drop_db() {
  psql_admin -d postgres -c "drop database if exists \"$1\" with (force)"
}

stop() {
  local bin; bin="$(find_bin)" || { echo "PostgreSQL not installed"; return 0; }
  if is_running; then
    as_postgres "$bin/pg_ctl" -D "$DATA" -m "${NEEDLEMAP_PG_STOP_MODE:-fast}" -w stop >/dev/null
    echo "PostgreSQL stopped"
  else
    echo "PostgreSQL is not running"
  fi
}

case "${1:-}" in
  start) start; create_db "${NEEDLEMAP_DB:-needlemap}" ;;
  stop) stop ;;
  status) if is_running; then echo "running on 127.0.0.1:$(running_port)"; else echo "stopped"; fi ;;
  create-db) create_db "$2" ;;
  drop-db) drop_db "$2" ;;
  *) echo "usage: bash db/setup.sh start|stop|status|create-db NAME|drop-db NAME" >&2; exit 2 ;;
esac
