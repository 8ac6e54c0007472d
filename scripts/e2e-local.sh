#!/usr/bin/env bash
# For developers: rebuild and run Playwright specs against its own database (windowcall_e2e), one at a time on this
# machine (a lock serialises builds: they share .next and public/sw.js). Args go to `playwright test`.
#   bash scripts/e2e-local.sh tests/e2e/field.spec.ts
#   SKIP_BUILD=1 bash scripts/e2e-local.sh -g "offline"
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
exec 9>/tmp/windowcall-e2e.lock
say "waiting for the e2e lock…"; flock 9
ensure_chromium_installed
# Servers started here must not inherit the lock (fd 9), or they hold it after this script ends.
bash scripts/db.sh up 9>&-
ensure_env_file
mail_up 9>&-
s3_up 9>&-
payments_up 9>&-
trap fakes_stop_if_started EXIT
export DATABASE_URL="$(bash scripts/db.sh url windowcall_e2e)"
export E2E_PORT="${E2E_PORT:-$(free_port 3410)}"
export NEXTAUTH_URL="http://localhost:$E2E_PORT"
if [ "${RESET_DB:-1}" = 1 ]; then
  psql "$(bash scripts/db.sh url postgres)" -qc "drop database if exists windowcall_e2e with (force)" -c "create database windowcall_e2e" >/dev/null
  npx tsx scripts/migrate.ts && npx tsx --conditions=react-server scripts/seed.ts
fi
if [ -z "${SKIP_BUILD:-}" ]; then npx next build --webpack >/tmp/windowcall-e2e-build.log 2>&1 || { tail -40 /tmp/windowcall-e2e-build.log; die "build failed"; }; fi
npx playwright test "$@"
