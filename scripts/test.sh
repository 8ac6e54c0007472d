#!/usr/bin/env bash
# npm test — the same provisioning as npm start (plus Chromium), a fresh test database, then
# typecheck, lint, unit, integration (real PostgreSQL), production build and end-to-end (Chromium).
# Ends with one line per suite and a closing count. Exit status is non-zero when any suite fails.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

ensure_node_modules
ensure_chromium_installed
WAS_RUNNING=0; bash scripts/db.sh running && WAS_RUNNING=1
bash scripts/db.sh up
ensure_env_file
mail_up # tests always send to the local SMTP fake
s3_up
payments_up # entry fees go to the local payments fake
trap fakes_stop_if_started EXIT

ADMIN_URL="$(bash scripts/db.sh url postgres)"
export DATABASE_URL="$(bash scripts/db.sh url windowcall_test)"
# A freshly migrated and seeded test database, so each suite that writes starts from the demo.
fresh_test_db() {
  psql "$ADMIN_URL" -qc "drop database if exists windowcall_test with (force)" -c "create database windowcall_test" >/dev/null &&
    npx tsx scripts/migrate.ts && npx tsx --conditions=react-server scripts/seed.ts
}
fresh_test_db || die "could not prepare the test database"

declare -a NAMES=() RESULTS=()
run_suite() {
  local name="$1"; shift
  say "── $name: $*"
  local start=$SECONDS status=passed
  "$@" || status=FAILED
  NAMES+=("$name"); RESULTS+=("$status ($((SECONDS - start)) s)")
}

run_suite typecheck npx tsc --noEmit
run_suite lint npx eslint . --max-warnings=0
run_suite unit npx vitest run --project unit
run_suite integration npx vitest run --project integration
run_suite build npx next build --webpack
if [ "${RESULTS[-1]%% *}" = passed ]; then
  # Chosen just before use, so another checkout's server cannot take it in between.
  export E2E_PORT="${E2E_PORT:-$(free_port 3310)}"
  export NEXTAUTH_URL="http://localhost:$E2E_PORT"
  fresh_test_db || die "could not prepare the test database"
  run_suite e2e npx playwright test
else
  NAMES+=(e2e); RESULTS+=("FAILED (not run: the build failed)")
fi

[ "$WAS_RUNNING" = 1 ] || bash scripts/db.sh stop

echo
passed=0; failed=0
for i in "${!NAMES[@]}"; do
  printf '%-12s %s\n' "${NAMES[$i]}" "${RESULTS[$i]}"
  case "${RESULTS[$i]}" in passed*) passed=$((passed + 1)) ;; *) failed=$((failed + 1)) ;; esac
done
echo "suites: $passed passed, $failed failed"
[ "$failed" = 0 ]
