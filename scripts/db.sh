#!/usr/bin/env bash
# Start (or find running) the project's own PostgreSQL cluster on 127.0.0.1.
#
#   bash scripts/db.sh            ensure the cluster runs and the main database exists
#   bash scripts/db.sh stop       stop the cluster
#   bash scripts/db.sh create NAME   ensure a database NAME exists (used by the test command)
#   bash scripts/db.sh drop NAME     drop database NAME
#
# Debian's `postgresql` package is installed with apt-get when initdb is missing.
# initdb refuses to run as root, so as root the cluster belongs to the `postgres` user.
# Set DATABASE_URL to use a server of your own instead: this script then does nothing.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
# The cluster's folder (LOXODROME_PGDATA) is independent of the app's data folder, so a test
# run with its own temporary data folder still shares the one cluster.
PGDATA="${LOXODROME_PGDATA:-$ROOT/.data/postgres}"
DATA_DIR="$(dirname "$PGDATA")"
PORT_FILE="$PGDATA.port"
PGHOST=127.0.0.1
DB_NAME="${LOXODROME_DB_NAME:-loxodrome}"
DB_USER=loxodrome
CMD="${1:-start}"

log() { printf '[db] %s\n' "$*" >&2; }

if [ -n "${DATABASE_URL:-}" ] && [ "$CMD" = start ]; then
  log "DATABASE_URL is set: using that server, not starting one."
  exit 0
fi

find_bin() {
  local name="$1" dir
  if command -v "$name" >/dev/null 2>&1 && "$name" --version >/dev/null 2>&1; then
    command -v "$name"; return 0
  fi
  for dir in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    if [ -x "$dir/$name" ]; then echo "$dir/$name"; return 0; fi
  done
  return 1
}

ensure_postgres_installed() {
  if find_bin initdb >/dev/null && find_bin pg_ctl >/dev/null; then return 0; fi
  log "PostgreSQL server binaries not found: installing Debian's postgresql package."
  local sudo=""
  [ "$(id -u)" -ne 0 ] && sudo="sudo"
  $sudo apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq postgresql >/dev/null
  # Debian's package starts its own cluster on 5432; ours is separate, so stop theirs.
  ($sudo service postgresql stop >/dev/null 2>&1 || true)
  find_bin initdb >/dev/null || { log "initdb still missing after install"; exit 1; }
}

# Run a command as the cluster's owner (postgres when we are root, else ourselves).
as_owner() {
  if [ "$(id -u)" -eq 0 ]; then
    runuser -u postgres -- "$@"
  else
    "$@"
  fi
}

psql_admin() {
  as_owner "$(find_bin psql)" -h "$PGHOST" -p "$PGPORT" -U postgres -d postgres -v ON_ERROR_STOP=1 -qtA "$@"
}

is_running() {
  [ -f "$PGDATA/postmaster.pid" ] && as_owner "$PG_CTL" -D "$PGDATA" status >/dev/null 2>&1
}

port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# The cluster keeps the port it was first given (recorded beside it), so a second checkout
# on the same machine gets a cluster of its own on the next free port instead of a clash.
choose_port() {
  if [ -n "${LOXODROME_PG_PORT:-}" ]; then PGPORT="$LOXODROME_PG_PORT"; return; fi
  if [ -f "$PORT_FILE" ]; then PGPORT="$(cat "$PORT_FILE")"; return; fi
  if [ -f "$PGDATA/postmaster.pid" ]; then
    PGPORT="$(sed -n 4p "$PGDATA/postmaster.pid")"
    echo "$PGPORT" > "$PORT_FILE"
    return
  fi
  PGPORT=54329
  while port_in_use "$PGPORT"; do PGPORT=$((PGPORT + 1)); done
  mkdir -p "$(dirname "$PORT_FILE")"
  echo "$PGPORT" > "$PORT_FILE"
}

ensure_cluster() {
  ensure_postgres_installed
  INITDB="$(find_bin initdb)"; PG_CTL="$(find_bin pg_ctl)"
  mkdir -p "$DATA_DIR"
  if [ "$(id -u)" -eq 0 ]; then
    id postgres >/dev/null 2>&1 || useradd --system --home-dir /var/lib/postgresql --shell /bin/bash postgres
    # postgres must be able to traverse to the data folder.
    chmod o+x "$DATA_DIR"
    local p="$DATA_DIR"
    while [ "$p" != "/" ]; do chmod o+x "$p" 2>/dev/null || true; p="$(dirname "$p")"; done
  fi
  if [ ! -f "$PGDATA/PG_VERSION" ]; then
    log "creating cluster in $PGDATA"
    mkdir -p "$PGDATA"
    [ "$(id -u)" -eq 0 ] && chown postgres:postgres "$PGDATA"
    chmod 700 "$PGDATA"
    as_owner "$INITDB" -D "$PGDATA" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if is_running; then
    log "cluster already running on $PGHOST:$PGPORT"
  else
    log "starting cluster on $PGHOST:$PGPORT"
    as_owner "$PG_CTL" -D "$PGDATA" -l "$PGDATA/server.log" -w -t 60 \
      -o "-c listen_addresses=$PGHOST -c port=$PGPORT -c unix_socket_directories='$PGDATA' -c max_connections=200 -c fsync=off -c synchronous_commit=off" start >/dev/null
  fi
  if [ "$(psql_admin -c "SELECT 1 FROM pg_roles WHERE rolname='$DB_USER'")" != 1 ]; then
    psql_admin -c "CREATE ROLE $DB_USER LOGIN SUPERUSER PASSWORD '$DB_USER'"
  fi
}

ensure_database() {
  local name="$1"
  if [ "$(psql_admin -c "SELECT 1 FROM pg_database WHERE datname='$name'")" != 1 ]; then
    log "creating database $name"
    psql_admin -c "CREATE DATABASE \"$name\" OWNER $DB_USER"
  fi
}

choose_port

case "$CMD" in
  start)
    ensure_cluster
    ensure_database "$DB_NAME"
    echo "postgres://$DB_USER:$DB_USER@$PGHOST:$PGPORT/$DB_NAME"
    ;;
  create)
    ensure_cluster
    ensure_database "${2:?database name}"
    echo "postgres://$DB_USER:$DB_USER@$PGHOST:$PGPORT/$2"
    ;;
  drop)
    PG_CTL="$(find_bin pg_ctl)"
    if is_running; then psql_admin -c "DROP DATABASE IF EXISTS \"${2:?database name}\" WITH (FORCE)"; fi
    ;;
  stop)
    PG_CTL="$(find_bin pg_ctl)"
    if is_running; then as_owner "$PG_CTL" -D "$PGDATA" -m fast stop >/dev/null; log "stopped"; fi
    ;;
  *) echo "usage: $0 [start|stop|create NAME|drop NAME]" >&2; exit 64 ;;
esac
