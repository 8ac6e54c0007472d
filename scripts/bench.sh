#!/usr/bin/env bash
# npm run bench — speed targets as ratios measured in one run (never in timed unit tests).
# Works on a fresh clone: installs npm packages, starts this checkout's PostgreSQL, creates, migrates and
# seeds the benches' own database (windowcall_bench; never the integration tests' windowcall_test), drops it
# at the end (also when a bench fails or the run is interrupted), and runs the Chromium benches (tap,
# Lighthouse) only when Debian's Chromium is there (the path tests use).
# Arguments pick benches by name: `npm run bench -- season sync` runs bench/season.bench.ts and bench/sync.bench.ts.
# A path runs that one script on the same fresh database with the arguments after it:
# `npm run bench -- bench/sync-push-cpu.ts long` (the profile scripts refuse any other database).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
ensure_node_modules
say "machine: $(nproc) cores, $(awk '/MemTotal/ { printf "%.1f GB RAM", $2 / 1048576 }' /proc/meminfo), $(uname -sm), node $(node -v)"
# picked: no arguments, or the bench's name among them
picked() { [ ${#BENCHES[@]} -eq 0 ] && return 0; local b; for b in "${BENCHES[@]}"; do [ "$b" = "$1" ] && return 0; done; return 1; }
BENCHES=("$@")
SCRIPT=()
if [ $# -gt 0 ] && [[ "$1" == bench/*.ts ]]; then
  [ -f "$1" ] || die "no $1"
  SCRIPT=("$@")
  BENCHES=(none)
fi
for b in "${BENCHES[@]}"; do [ ${#SCRIPT[@]} -gt 0 ] || [ -f "bench/$b.bench.ts" ] || die "no bench/$b.bench.ts"; done
if picked engine; then
  say "task engine and contest scoring"
  npx tsx bench/engine.bench.ts
fi
[ ${#BENCHES[@]} -eq 1 ] && [ "${BENCHES[0]}" = engine ] && exit 0

bash scripts/db.sh up
ensure_env_file
ADMIN_URL="$(bash scripts/db.sh url postgres)"
BENCH_DB=windowcall_bench
export DATABASE_URL="$(bash scripts/db.sh url "$BENCH_DB")"
drop_bench_db() { psql "$ADMIN_URL" -qc "drop database if exists $BENCH_DB with (force)" >/dev/null 2>&1 || true; }
trap drop_bench_db EXIT
trap 'exit 130' INT
trap 'exit 143' TERM
drop_bench_db # a database left by a run that was killed outright
psql "$ADMIN_URL" -qc "create database $BENCH_DB" >/dev/null
npx tsx scripts/migrate.ts
# the demo (the Lighthouse bench signs in as its pilot); the other benches add users of their own
npx tsx --conditions=react-server scripts/seed.ts

CHROMIUM="${CHROMIUM_PATH:-/usr/bin/chromium}"
if [ ${#SCRIPT[@]} -gt 0 ]; then
  say "${SCRIPT[0]}"
  CHROMIUM_PATH="$CHROMIUM" npx tsx --conditions=react-server "${SCRIPT[@]}"
  exit
fi
for extra in bench/*.bench.ts; do
  case "$extra" in bench/engine.bench.ts) continue ;; esac
  [ -f "$extra" ] || continue
  name="$(basename "$extra" .bench.ts)"
  picked "$name" || continue
  if { [ "$extra" = bench/tap.bench.ts ] || [ "$extra" = bench/lighthouse.bench.ts ]; } && [ ! -x "$CHROMIUM" ]; then
    say "$extra skipped: no Chromium at $CHROMIUM (npm test installs Debian's chromium; or set CHROMIUM_PATH)"
    continue
  fi
  say "$extra"
  CHROMIUM_PATH="$CHROMIUM" npx tsx --conditions=react-server "$extra"
done
