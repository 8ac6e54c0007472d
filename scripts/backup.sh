#!/usr/bin/env bash
# npm run db:backup [FILE] — a pg_dump custom-format copy of the `windowcall` database (WINDOWCALL_DB
# names another), written to FILE or .data/backups/windowcall-<UTC time>.dump; prints the path.
# Safe while the app runs: pg_dump reads one consistent snapshot.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

DB="${WINDOWCALL_DB:-windowcall}"
[[ "$DB" =~ ^[a-z_][a-z0-9_]*$ ]] || die "not a database name: $DB"
bash scripts/db.sh up
ensure_postgres_installed # sets PGBIN: the pg_dump of the same PostgreSQL install as the server
FILE="${1:-.data/backups/$DB-$(date -u +%Y%m%dT%H%M%SZ).dump}"
mkdir -p "$(dirname "$FILE")"
"$PGBIN/pg_dump" --format=custom --no-owner --no-privileges --file="$FILE" "$(bash scripts/db.sh url "$DB")" \
  || { rm -f "$FILE"; die "backup of $DB failed"; }
say "backup of $DB written to $FILE"
echo "$FILE"
