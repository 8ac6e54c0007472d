#!/usr/bin/env bash
# A private PostgreSQL cluster for this checkout, on 127.0.0.1, run as the `postgres` user.
#   db.sh up     install if missing, initdb once, start, create databases; prints nothing else
#   db.sh stop   stop this checkout's cluster
#   db.sh url [db]  print the connection URL
# The data lives outside the checkout (its parents may be closed to `postgres`):
# $WINDOWCALL_PGDATA, default /var/tmp/windowcall-pg/<hash of this checkout's path>.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

HASH="$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)"
DATA="${WINDOWCALL_PGDATA:-/var/tmp/windowcall-pg/$HASH}"
PORT_FILE="$DATA/windowcall.port"

pg() { runuser -u postgres -- "$PGBIN/$1" "${@:2}"; }

running() { [ -f "$DATA/postmaster.pid" ] && pg pg_ctl -D "$DATA" status >/dev/null 2>&1; }

db_port() { cat "$PORT_FILE"; }

db_url() { echo "postgresql://postgres@127.0.0.1:$(db_port)/${1:-windowcall}"; }

db_up() {
  ensure_postgres_installed
  id postgres >/dev/null 2>&1 || die "no 'postgres' user: is Debian's postgresql package installed?"
  if [ ! -f "$DATA/PG_VERSION" ]; then
    say "creating a PostgreSQL cluster in $DATA"
    mkdir -p "$DATA"
    chown postgres:postgres "$DATA"; chmod 700 "$DATA"
    # every parent must be traversable by postgres
    local d; d="$(dirname "$DATA")"
    while [ "$d" != "/" ]; do chmod o+x "$d" 2>/dev/null || true; d="$(dirname "$d")"; done
    pg initdb -D "$DATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if ! running; then
    local want="${WINDOWCALL_PG_PORT:-$(cat "$PORT_FILE" 2>/dev/null || echo 54329)}"
    if port_in_use "$want"; then
      [ -n "${WINDOWCALL_PG_PORT:-}" ] && die "port $want is already taken (WINDOWCALL_PG_PORT); choose another"
      local was="$want"; want="$(free_port "$want")"
      say "port $was is taken; using $want for PostgreSQL"
    fi
    echo "$want" > "$PORT_FILE"
    pg pg_ctl -D "$DATA" -l "$DATA/server.log" -w -t 60 \
      -o "-h 127.0.0.1 -p $want -k $DATA -c listen_addresses=127.0.0.1" start >/dev/null \
      || { tail -20 "$DATA/server.log" >&2; die "PostgreSQL did not start"; }
    say "PostgreSQL running on 127.0.0.1:$want"
  fi
  local name
  for name in windowcall windowcall_test; do
    if ! psql "$(db_url postgres)" -tAc "select 1 from pg_database where datname='$name'" | grep -q 1; then
      psql "$(db_url postgres)" -qc "create database $name" >/dev/null
    fi
  done
}

db_stop() {
  ensure_postgres_installed
  if running; then pg pg_ctl -D "$DATA" -m fast -w stop >/dev/null && say "PostgreSQL stopped"; fi
}

case "${1:-}" in
  up) db_up ;;
  stop) db_stop ;;
  url) db_url "${2:-windowcall}" ;;
  running) running ;;
  *) die "usage: db.sh up|stop|url [db]|running" ;;
esac
