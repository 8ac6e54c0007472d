#!/usr/bin/env bash
# npm run db:restore FILE [DATABASE] — restore a backup made by `npm run db:backup` into DATABASE
# (default `windowcall`, or WINDOWCALL_DB). The backup goes into a new database first; only when
# that succeeds does it take the name, and a database it replaces is kept as
# <name>_before_restore_<UTC time> (nothing is dropped). The target must not be in use: stop
# `npm start` (Ctrl-C) first; the script refuses otherwise.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

FILE="${1:-}"
TARGET="${2:-${WINDOWCALL_DB:-windowcall}}"
[ -n "$FILE" ] || die "usage: npm run db:restore FILE [DATABASE]"
[ -f "$FILE" ] || die "no such backup file: $FILE"
[[ "$TARGET" =~ ^[a-z_][a-z0-9_]*$ ]] || die "not a database name: $TARGET"
bash scripts/db.sh up
ensure_postgres_installed # sets PGBIN: the pg_restore of the same PostgreSQL install as the server
ADMIN="$(bash scripts/db.sh url postgres)"
sql() { psql "$ADMIN" -v ON_ERROR_STOP=1 -qtAc "$1"; }
exists() { [ "$(sql "select count(*) from pg_database where datname = '$1'")" = 1 ]; }
in_use() { [ "$(sql "select count(*) from pg_stat_activity where datname = '$1'")" != 0 ]; }
refuse_if_busy() {
  if exists "$TARGET" && in_use "$TARGET"; then
    die "the database $TARGET is in use (is npm start running? stop it with Ctrl-C, then restore again)"
  fi
}

refuse_if_busy
STAGING="${TARGET}_restoring"
sql "drop database if exists $STAGING" && sql "create database $STAGING"
say "restoring $FILE into $STAGING"
if ! "$PGBIN/pg_restore" --no-owner --no-privileges --exit-on-error --dbname="$(bash scripts/db.sh url "$STAGING")" "$FILE"; then
  sql "drop database if exists $STAGING"
  die "restore failed; $TARGET is unchanged"
fi
refuse_if_busy
if exists "$TARGET"; then
  OLD="${TARGET}_before_restore_$(date -u +%Y%m%d%H%M%S)"
  sql "alter database $TARGET rename to $OLD"
  say "the database it replaces is kept as $OLD (when no longer needed: psql \"$ADMIN\" -c 'drop database $OLD')"
fi
sql "alter database $STAGING rename to $TARGET"
say "restored $FILE into $TARGET"
