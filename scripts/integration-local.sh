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
npx tsx scripts/migrate.ts >/dev/null
# always: the seed is idempotent (each part adds only what is missing), so a seed that failed halfway
# is finished here instead of being taken for done, and a part added since the last run is added
npx tsx --conditions=react-server scripts/seed.ts
npx vitest run --project integration "$@"
