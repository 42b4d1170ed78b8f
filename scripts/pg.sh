#!/usr/bin/env bash
# The project's own PostgreSQL: a local cluster in .data/pg, 127.0.0.1 only, port 54329,
# its socket inside the project. Usage: scripts/pg.sh start|stop|status|ensure-db NAME|reset-db NAME
source "$(dirname "$0")/lib.sh"
load_secrets

find_bin() {
  local dir
  for dir in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    [ -x "$dir/initdb" ] && { echo "$dir"; return 0; }
  done
  return 1
}

PGBIN=$(find_bin || true)
if [ -z "$PGBIN" ]; then
  say "PostgreSQL server binaries are missing: installing the Debian package 'postgresql' (apt-get)"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq && apt-get install -y -qq --no-install-recommends postgresql >/dev/null
  PGBIN=$(find_bin)
fi

# PostgreSQL refuses to run as root: then the cluster belongs to the 'postgres' user.
as_owner() {
  if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

psql_super() { "$PGBIN/psql" -X -q -v ON_ERROR_STOP=1 -h "$PGRUN_DIR" -p "$EMBERLINE_PG_PORT" -U postgres -d postgres "$@"; }

init_cluster() {
  [ -f "$PGDATA_DIR/PG_VERSION" ] && return 0
  say "creating the project's PostgreSQL cluster in .data/pg"
  mkdir -p "$PGDATA_DIR" "$PGRUN_DIR"
  chmod 700 "$PGDATA_DIR"
  if [ "$(id -u)" = 0 ]; then
    chown -R postgres:postgres "$PGDATA_DIR" "$PGRUN_DIR"
    # The postgres user must be able to reach the project's folder.
    local d="$DATA"; while [ "$d" != / ]; do chmod o+x "$d" 2>/dev/null || true; d=$(dirname "$d"); done
  fi
  as_owner "$PGBIN/initdb" -D "$PGDATA_DIR" -U postgres --auth-local=trust --auth-host=scram-sha-256 -E UTF8 --locale=C.UTF-8 >/dev/null
  cat >> "$PGDATA_DIR/postgresql.conf" <<CONF
# Emberline: loopback only, own port, socket inside the project (only its owner may use it).
listen_addresses = '127.0.0.1'
port = $EMBERLINE_PG_PORT
unix_socket_directories = '$PGRUN_DIR'
unix_socket_permissions = 0700
max_connections = 200
shared_buffers = 128MB
timezone = 'UTC'
log_timezone = 'UTC'
CONF
}

start() {
  init_cluster
  mkdir -p "$PGRUN_DIR"; [ "$(id -u)" = 0 ] && chown postgres:postgres "$PGRUN_DIR"
  touch "$PGLOG"; [ "$(id -u)" = 0 ] && chown postgres:postgres "$PGLOG"
  if ! as_owner "$PGBIN/pg_ctl" -D "$PGDATA_DIR" status >/dev/null 2>&1; then
    as_owner "$PGBIN/pg_ctl" -D "$PGDATA_DIR" -l "$PGLOG" -w -t 60 start >/dev/null || { tail -20 "$PGLOG"; exit 1; }
  fi
  psql_super <<SQL
DO \$\$ BEGIN
  IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = 'emberline') THEN
    CREATE ROLE emberline LOGIN PASSWORD '$EMBERLINE_DB_PASSWORD';
  ELSE
    ALTER ROLE emberline LOGIN PASSWORD '$EMBERLINE_DB_PASSWORD';
  END IF;
END \$\$;
SQL
}

ensure_db() {
  local name=$1
  if [ -z "$(psql_super -tAc "SELECT 1 FROM pg_database WHERE datname = '$name'")" ]; then
    psql_super -c "CREATE DATABASE \"$name\" OWNER emberline"
  fi
}

reset_db() {
  local name=$1
  psql_super -c "DROP DATABASE IF EXISTS \"$name\" WITH (FORCE)"
  psql_super -c "CREATE DATABASE \"$name\" OWNER emberline"
}

case "${1:-status}" in
  start) start ;;
  stop) as_owner "$PGBIN/pg_ctl" -D "$PGDATA_DIR" status >/dev/null 2>&1 && as_owner "$PGBIN/pg_ctl" -D "$PGDATA_DIR" -m fast -w stop >/dev/null; say "PostgreSQL stopped" ;;
  status) as_owner "$PGBIN/pg_ctl" -D "$PGDATA_DIR" status ;;
  ensure-db) start; ensure_db "$2" ;;
  reset-db) start; reset_db "$2" ;;
  psql) shift; "$PGBIN/psql" -X -h "$PGRUN_DIR" -p "$EMBERLINE_PG_PORT" -U postgres "$@" ;;
  *) echo "usage: scripts/pg.sh start|stop|status|ensure-db NAME|reset-db NAME|psql [args]"; exit 2 ;;
esac
