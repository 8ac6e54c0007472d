#!/usr/bin/env bash
# npm run bench — speed targets as ratios measured in one run (never in timed unit tests).
# Works on a fresh clone: installs npm packages, starts this checkout's PostgreSQL, creates,
# migrates and seeds the test database (as npm test does; it is not dropped: the benches make
# their own users), and runs the Chromium benches (tap, Lighthouse) only when Debian's Chromium is there (the path tests use).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
ensure_node_modules
say "machine: $(nproc) cores, $(awk '/MemTotal/ { printf "%.1f GB RAM", $2 / 1048576 }' /proc/meminfo), $(uname -sm), node $(node -v)"
say "task engine and contest scoring"
npx tsx bench/engine.bench.ts

bash scripts/db.sh up
ensure_env_file
ADMIN_URL="$(bash scripts/db.sh url postgres)"
export DATABASE_URL="$(bash scripts/db.sh url windowcall_test)"
if [ "$(psql "$ADMIN_URL" -tAc "select 1 from pg_database where datname = 'windowcall_test'")" != 1 ]; then
  psql "$ADMIN_URL" -qc "create database windowcall_test" >/dev/null
fi
npx tsx scripts/migrate.ts
# seeded like scripts/integration-local.sh does, before the benches add users of their own
psql "$DATABASE_URL" -tAc "select 1 from users limit 1" | grep -q 1 || npx tsx --conditions=react-server scripts/seed.ts

CHROMIUM="${CHROMIUM_PATH:-/usr/bin/chromium}"
for extra in bench/*.bench.ts; do
  case "$extra" in bench/engine.bench.ts) continue ;; esac
  [ -f "$extra" ] || continue
  if { [ "$extra" = bench/tap.bench.ts ] || [ "$extra" = bench/lighthouse.bench.ts ]; } && [ ! -x "$CHROMIUM" ]; then
    say "$extra skipped: no Chromium at $CHROMIUM (npm test installs Debian's chromium; or set CHROMIUM_PATH)"
    continue
  fi
  say "$extra"
  CHROMIUM_PATH="$CHROMIUM" npx tsx --conditions=react-server "$extra"
done
