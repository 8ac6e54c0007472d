# Shared shell helpers for start.sh, test.sh and db.sh. Sourced, not run.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
export NEXT_TELEMETRY_DISABLED=1

say() { printf '\033[1m[windowcall]\033[0m %s\n' "$*"; }
die() { printf '\033[31m[windowcall] %s\033[0m\n' "$*" >&2; exit 1; }

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

# apt-get install only what is missing; `apt-get update` once per run.
APT_UPDATED=0
apt_install() {
  command -v apt-get >/dev/null || die "apt-get not found: install $* by hand"
  if [ "$APT_UPDATED" = 0 ]; then as_root apt-get update -qq; APT_UPDATED=1; fi
  DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -qq "$@" >/dev/null
}

# npm ci when node_modules is missing or older than the lockfile.
ensure_node_modules() {
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    say "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

ensure_postgres_installed() {
  if ! ls -d /usr/lib/postgresql/*/bin >/dev/null 2>&1; then
    say "installing PostgreSQL from Debian"
    apt_install postgresql
  fi
  PGBIN="$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)"
  export PGBIN
}

ensure_chromium_installed() {
  if [ -z "${CHROMIUM_PATH:-}" ] && [ ! -x /usr/bin/chromium ]; then
    say "installing Chromium from Debian"
    apt_install chromium
  fi
  export CHROMIUM_PATH="${CHROMIUM_PATH:-/usr/bin/chromium}"
}

port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# First free TCP port on 127.0.0.1 from $1 upwards.
free_port() {
  local p="$1"
  while port_in_use "$p"; do p=$((p + 1)); done
  echo "$p"
}

# .env holds the local secret and addresses; made once, never committed.
ensure_env_file() {
  if [ ! -f .env ]; then
    say "writing .env with a new NEXTAUTH_SECRET"
    {
      echo "NEXTAUTH_SECRET=$(node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))')"
      echo "NEXTAUTH_URL=http://localhost:${PORT:-3000}"
    } > .env
  fi
  # Object storage (altimeter logs): the bucket and region; an older .env gets them added once.
  # S3_ENDPOINT and keys come from s3_up (the local fake) unless this file names a real service.
  grep -q '^S3_BUCKET=' .env || printf 'S3_BUCKET=windowcall-logs\nS3_REGION=us-east-1\n' >> .env
  # Entry fees: a test key and a fresh webhook secret shared by the app and the local payments fake (payments_up).
  # Production sets STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET of the real account and no STRIPE_API_URL.
  grep -q '^STRIPE_SECRET_KEY=' .env || printf 'STRIPE_SECRET_KEY=sk_test_windowcall_local\nSTRIPE_WEBHOOK_SECRET=whsec_%s\n' \
    "$(node -e 'console.log(require("crypto").randomBytes(24).toString("hex"))')" >> .env
  set -a; . ./.env; set +a
}

# The local SMTP fake (scripts/mail-server.ts) for this checkout, on 127.0.0.1: started once and
# reused while it runs (its pid and ports are in .data/mail). Exports SMTP_URL (the app sends there)
# and DEV_MAILBOX_URL (its message list: /dev/mailbox and the tests read it). MAIL_STARTED=1 when this
# call started it, so the caller stops it again with mail_stop_if_started.
MAIL_DIR="$ROOT/.data/mail"
MAIL_STARTED=0
mail_running() {
  [ -f "$MAIL_DIR/server.pid" ] && [ -f "$MAIL_DIR/ports" ] && kill -0 "$(cat "$MAIL_DIR/server.pid")" 2>/dev/null &&
    port_in_use "$(cut -d' ' -f2 "$MAIL_DIR/ports")"
}
mail_up() {
  mkdir -p "$MAIL_DIR"
  if ! mail_running; then
    local smtp http i
    smtp="$(free_port "${WINDOWCALL_SMTP_PORT:-2525}")"
    http="$(free_port "${WINDOWCALL_MAILBOX_PORT:-8025}")"
    [ "$http" = "$smtp" ] && http="$(free_port $((smtp + 1)))"
    MAIL_SMTP_PORT="$smtp" MAIL_HTTP_PORT="$http" MAIL_DIR="$MAIL_DIR" \
      setsid node --import tsx scripts/mail-server.ts >"$MAIL_DIR/server.log" 2>&1 </dev/null 9>&- &
    echo $! > "$MAIL_DIR/server.pid"
    echo "$smtp $http" > "$MAIL_DIR/ports"
    for i in $(seq 1 100); do port_in_use "$http" && break; sleep 0.1; done
    port_in_use "$http" || { cat "$MAIL_DIR/server.log" >&2; die "the local mail server did not start"; }
    MAIL_STARTED=1
    say "local mail server: SMTP on 127.0.0.1:$smtp, messages on http://127.0.0.1:$http"
  fi
  local ports; ports="$(cat "$MAIL_DIR/ports")"
  export SMTP_URL="smtp://127.0.0.1:${ports%% *}"
  export DEV_MAILBOX_URL="http://127.0.0.1:${ports##* }"
}
mail_stop_if_started() {
  if [ "$MAIL_STARTED" = 1 ] && [ -f "$MAIL_DIR/server.pid" ]; then
    kill -TERM "$(cat "$MAIL_DIR/server.pid")" 2>/dev/null || true
    rm -f "$MAIL_DIR/server.pid" "$MAIL_DIR/ports"
    MAIL_STARTED=0
  fi
}

# The local object-storage fake (scripts/s3-server.ts, s3rver) for this checkout, on 127.0.0.1, with its
# objects in .data/s3 and the private bucket $S3_BUCKET created at start: started once and reused while it
# runs (pid and port in .data/s3-server). Exports S3_ENDPOINT and the fake's keys unless S3_ENDPOINT is
# already set (a real service). S3_STARTED=1 when this call started it (stop it with s3_stop_if_started).
S3_RUN="$ROOT/.data/s3-server"
S3_STARTED=0
s3_running() {
  [ -f "$S3_RUN/server.pid" ] && [ -f "$S3_RUN/port" ] && kill -0 "$(cat "$S3_RUN/server.pid")" 2>/dev/null &&
    port_in_use "$(cat "$S3_RUN/port")"
}
s3_up() {
  [ -n "${S3_ENDPOINT:-}" ] && return 0
  mkdir -p "$S3_RUN"
  export S3_BUCKET="${S3_BUCKET:-windowcall-logs}" S3_REGION="${S3_REGION:-us-east-1}"
  if ! s3_running; then
    local port i
    port="$(free_port "${WINDOWCALL_S3_PORT:-4569}")"
    S3_PORT="$port" S3_DIR="$ROOT/.data/s3" \
      setsid node --import tsx scripts/s3-server.ts >"$S3_RUN/server.log" 2>&1 </dev/null 9>&- &
    echo $! > "$S3_RUN/server.pid"
    echo "$port" > "$S3_RUN/port"
    for i in $(seq 1 100); do grep -q 's3rver on' "$S3_RUN/server.log" && break; sleep 0.1; done
    grep -q 's3rver on' "$S3_RUN/server.log" || { cat "$S3_RUN/server.log" >&2; die "the local object server did not start"; }
    S3_STARTED=1
    say "local object server: http://127.0.0.1:$port, bucket $S3_BUCKET"
  fi
  export S3_ENDPOINT="http://127.0.0.1:$(cat "$S3_RUN/port")"
  export S3_ACCESS_KEY_ID="${S3_ACCESS_KEY_ID:-S3RVER}" S3_SECRET_ACCESS_KEY="${S3_SECRET_ACCESS_KEY:-S3RVER}"
}
s3_stop_if_started() {
  if [ "$S3_STARTED" = 1 ] && [ -f "$S3_RUN/server.pid" ]; then
    kill -TERM "$(cat "$S3_RUN/server.pid")" 2>/dev/null || true
    rm -f "$S3_RUN/server.pid" "$S3_RUN/port"
    S3_STARTED=0
  fi
}
# The local payments fake (scripts/payments-server.ts) for this checkout, on 127.0.0.1, with its state in
# .data/payments: started once and reused while it runs (pid and port in .data/payments-server). Exports
# STRIPE_API_URL (the SDK's host, port and protocol come from it) unless it is already set or the key is a
# live one (the real service). PAYMENTS_STARTED=1 when this call started it (stop it with payments_stop_if_started).
PAY_RUN="$ROOT/.data/payments-server"
PAYMENTS_STARTED=0
payments_running() {
  [ -f "$PAY_RUN/server.pid" ] && [ -f "$PAY_RUN/port" ] && kill -0 "$(cat "$PAY_RUN/server.pid")" 2>/dev/null &&
    port_in_use "$(cat "$PAY_RUN/port")"
}
payments_up() {
  [ -n "${STRIPE_API_URL:-}" ] && return 0
  case "${STRIPE_SECRET_KEY:-}" in sk_live_*) return 0 ;; esac
  [ -n "${STRIPE_SECRET_KEY:-}" ] && [ -n "${STRIPE_WEBHOOK_SECRET:-}" ] || die "STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET are not set (ensure_env_file writes local ones)"
  mkdir -p "$PAY_RUN"
  if ! payments_running; then
    local port i
    port="$(free_port "${WINDOWCALL_PAYMENTS_PORT:-4580}")"
    PAYMENTS_PORT="$port" PAYMENTS_DIR="$ROOT/.data/payments" \
      setsid node --import tsx scripts/payments-server.ts >"$PAY_RUN/server.log" 2>&1 </dev/null 9>&- &
    echo $! > "$PAY_RUN/server.pid"
    echo "$port" > "$PAY_RUN/port"
    for i in $(seq 1 100); do port_in_use "$port" && break; sleep 0.1; done
    port_in_use "$port" || { cat "$PAY_RUN/server.log" >&2; die "the local payments fake did not start"; }
    PAYMENTS_STARTED=1
    say "local payments fake: http://127.0.0.1:$port"
  fi
  export STRIPE_API_URL="http://127.0.0.1:$(cat "$PAY_RUN/port")"
}
payments_stop_if_started() {
  if [ "$PAYMENTS_STARTED" = 1 ] && [ -f "$PAY_RUN/server.pid" ]; then
    kill -TERM "$(cat "$PAY_RUN/server.pid")" 2>/dev/null || true
    rm -f "$PAY_RUN/server.pid" "$PAY_RUN/port"
    PAYMENTS_STARTED=0
  fi
}
# Stops the local fakes this script started (an EXIT trap).
fakes_stop_if_started() { mail_stop_if_started; s3_stop_if_started; payments_stop_if_started; }
