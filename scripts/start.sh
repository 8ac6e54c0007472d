#!/usr/bin/env bash
# npm start — install what is missing, start PostgreSQL on loopback, migrate, seed the demo club,
# build and serve on http://localhost:3000 (PORT overrides). Ctrl-C stops the app and the database.
# Listens on 127.0.0.1 only, unless HOST says otherwise (HOST=0.0.0.0 to reach it from a phone on the LAN).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

export PORT="${PORT:-3000}"
export HOST="${HOST:-127.0.0.1}"
ensure_node_modules
bash scripts/db.sh up
ensure_env_file
export DATABASE_URL="$(bash scripts/db.sh url windowcall)"
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:$PORT}"
# Mail goes to the local SMTP fake unless SMTP_URL (environment or .env) names a real server.
[ -z "${SMTP_URL:-}" ] && mail_up
payments_up # entry fees go to the local payments fake unless STRIPE_API_URL or a live key says otherwise
s3_up # altimeter logs go to the local object server unless S3_ENDPOINT names a real one
trap fakes_stop_if_started EXIT # also when a step below fails
npx tsx scripts/migrate.ts
npx tsx --conditions=react-server scripts/seed.ts
port_in_use "$PORT" && die "port $PORT is already taken: stop what runs there or run PORT=3100 npm start"
# The server runs in a session of its own: on Ctrl-C Next.js ends its whole process group, which
# must not take this script with it before the database is stopped. Stopping ignores further signals.
stop() {
  trap '' INT TERM
  say "stopping"
  if [ -n "${APP_PID:-}" ]; then
    kill -TERM -- "-$APP_PID" 2>/dev/null || true
    wait "$APP_PID" 2>/dev/null || true # the server's own exit status must not end this (set -e)
  fi
  fakes_stop_if_started
  bash scripts/db.sh stop
  exit 0
}
trap stop INT TERM

# Rebuild only when a source file is newer than the last build.
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib worker db public next.config.mjs tailwind.config.ts package-lock.json \
     -type f -newer .next/BUILD_ID ! -name 'sw.js*' ! -name 'swe-worker-*' 2>/dev/null | head -1)" ]; then
  say "building the app (next build --webpack, about a minute)"
  npx next build --webpack >.data-build.log 2>&1 || { tail -40 .data-build.log; die "build failed (full log: .data-build.log)"; }
  rm -f .data-build.log
fi
setsid npx next start -H "$HOST" -p "$PORT" &
APP_PID=$!
say "Windowcall is on http://localhost:$PORT (listening on $HOST) — demo accounts are in the README. Ctrl-C stops it."
status=0
wait "$APP_PID" || status=$? # the server ended on its own: stop the database too, keep its status
fakes_stop_if_started
bash scripts/db.sh stop
exit "$status"
