#!/usr/bin/env bash
# For developers: run integration tests against the (already seeded) test database. Args go to vitest.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
bash scripts/db.sh up
ensure_env_file
mail_up
s3_up
payments_up
trap fakes_stop_if_started EXIT
export DATABASE_URL="$(bash scripts/db.sh url windowcall_test)"
psql "$DATABASE_URL" -tAc "select 1 from users limit 1" 2>/dev/null | grep -q 1 || { npx tsx scripts/migrate.ts && npx tsx --conditions=react-server scripts/seed.ts; }
npx tsx scripts/migrate.ts >/dev/null
npx vitest run --project integration "$@"
