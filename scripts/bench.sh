#!/usr/bin/env bash
# npm run bench — speed targets as ratios measured in one run (never in timed unit tests).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
ensure_node_modules
say "task engine and contest scoring"
npx tsx bench/engine.bench.ts
for extra in bench/*.bench.ts; do
  case "$extra" in bench/engine.bench.ts) continue ;; esac
  [ -f "$extra" ] || continue
  say "$extra"
  bash scripts/db.sh up
  ensure_env_file
  DATABASE_URL="$(bash scripts/db.sh url windowcall_test)" npx tsx --conditions=react-server "$extra"
done
