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

# The local fakes of outside services (e-mail, object storage, payments), one per checkout on 127.0.0.1: each
# is started once and reused while it runs; its pid, ports and log are in its run folder (.data/<name>-server,
# .data/mail for e-mail). A script stops on exit only the fakes it started itself (fakes_stop_if_started).
FAKES_STARTED=""
# fake_running DIR: its process is alive and its first port answers.
fake_running() {
  [ -f "$1/server.pid" ] && [ -f "$1/ports" ] && kill -0 "$(cat "$1/server.pid")" 2>/dev/null &&
    port_in_use "$(cut -d' ' -f1 "$1/ports")"
}
# fake_start DIR SCRIPT READY "PORTS" [VAR=value…]: runs `node scripts/SCRIPT` with the variables, detached
# (it must not hold the e2e lock, fd 9), records its pid and PORTS, waits up to 10 s for the shell test READY.
# Fails (status 1, its log kept) when it does not get ready, e.g. another checkout took the port in between.
fake_start() {
  local dir="$1" script="$2" ready="$3" ports="$4" i
  shift 4
  mkdir -p "$dir"
  env "$@" setsid node --import tsx "scripts/$script" >"$dir/server.log" 2>&1 </dev/null 9>&- &
  echo $! > "$dir/server.pid"
  echo "$ports" > "$dir/ports"
  for i in $(seq 1 100); do eval "$ready" && break; kill -0 "$(cat "$dir/server.pid")" 2>/dev/null || break; sleep 0.1; done
  if ! eval "$ready"; then kill -TERM "$(cat "$dir/server.pid")" 2>/dev/null || true; rm -f "$dir/server.pid" "$dir/ports"; return 1; fi
  FAKES_STARTED="$FAKES_STARTED $dir"
}
# fake_up WHAT DIR TRY: unless the fake in DIR runs, calls the shell function TRY with 1, 2, 3 until one start
# succeeds (TRY N picks free ports from its base + N - 1 and calls fake_start): a port another checkout took between
# the check and the listen (seen here: EADDRINUSE) moves on to the next ones. Stops with the log when all fail.
fake_up() {
  local what="$1" dir="$2" n
  fake_running "$dir" && return 0
  for n in 1 2 3; do "$3" "$n" && break; done
  fake_running "$dir" || { cat "$dir/server.log" >&2; die "the local $what did not start"; }
  say "local $what on 127.0.0.1, ports $(cat "$dir/ports")"
}
# fake_port DIR [N]: the Nth (default first) port the fake in DIR listens on.
fake_port() { cut -d' ' -f"${2:-1}" "$1/ports"; }
# Stops the local fakes this script started (an EXIT trap).
fakes_stop_if_started() {
  local dir
  for dir in $FAKES_STARTED; do
    [ -f "$dir/server.pid" ] && kill -TERM "$(cat "$dir/server.pid")" 2>/dev/null || true
    rm -f "$dir/server.pid" "$dir/ports"
  done
  FAKES_STARTED=""
}

# E-mail: scripts/mail-server.ts (SMTP in, messages kept in .data/mail). Exports SMTP_URL (the app sends there)
# and DEV_MAILBOX_URL (its message list: /dev/mailbox and the tests read it).
MAIL_DIR="$ROOT/.data/mail"
mail_try() {
  local smtp http
  smtp="$(free_port $((${WINDOWCALL_SMTP_PORT:-2525} + $1 - 1)))"
  http="$(free_port $((${WINDOWCALL_MAILBOX_PORT:-8025} + $1 - 1)))"
  [ "$http" = "$smtp" ] && http="$(free_port $((smtp + 1)))"
  # ready once it says so in its own log: a port answering may be another checkout's fake
  fake_start "$MAIL_DIR" mail-server.ts "grep -q 'mailbox on' '$MAIL_DIR/server.log'" "$smtp $http" \
    MAIL_SMTP_PORT="$smtp" MAIL_HTTP_PORT="$http" MAIL_DIR="$MAIL_DIR"
}
mail_up() {
  fake_up "mail server (SMTP, message list)" "$MAIL_DIR" mail_try
  export SMTP_URL="smtp://127.0.0.1:$(fake_port "$MAIL_DIR")"
  export DEV_MAILBOX_URL="http://127.0.0.1:$(fake_port "$MAIL_DIR" 2)"
}

# Object storage: scripts/s3-server.ts (s3rver, objects in .data/s3, the private bucket $S3_BUCKET created at
# start). Exports S3_ENDPOINT and the fake's keys unless S3_ENDPOINT is already set (a real service).
S3_RUN="$ROOT/.data/s3-server"
s3_try() {
  local port
  port="$(free_port $((${WINDOWCALL_S3_PORT:-4569} + $1 - 1)))"
  # ready once it says so: the bucket is made after the port opens
  fake_start "$S3_RUN" s3-server.ts "grep -q 's3rver on' '$S3_RUN/server.log'" "$port" S3_PORT="$port" S3_DIR="$ROOT/.data/s3"
}
s3_up() {
  [ -n "${S3_ENDPOINT:-}" ] && return 0
  export S3_BUCKET="${S3_BUCKET:-windowcall-logs}" S3_REGION="${S3_REGION:-us-east-1}"
  fake_up "object server" "$S3_RUN" s3_try
  export S3_ENDPOINT="http://127.0.0.1:$(fake_port "$S3_RUN")"
  export S3_ACCESS_KEY_ID="${S3_ACCESS_KEY_ID:-S3RVER}" S3_SECRET_ACCESS_KEY="${S3_SECRET_ACCESS_KEY:-S3RVER}"
}

# Payments: scripts/payments-server.ts (state in .data/payments). Exports STRIPE_API_URL (the SDK's host, port and
# protocol come from it) unless it is already set or the key is a live one (the real service).
PAY_RUN="$ROOT/.data/payments-server" PAY_STATE="$ROOT/.data/payments"
payments_try() {
  local port
  port="$(free_port $((${WINDOWCALL_PAYMENTS_PORT:-4580} + $1 - 1)))"
  # ready once it says so in its own log: a port answering may be another checkout's fake
  fake_start "$PAY_RUN" payments-server.ts "grep -q 'fake payments API on' '$PAY_RUN/server.log'" "$port" PAYMENTS_PORT="$port" PAYMENTS_DIR="$PAY_STATE"
}
payments_up() {
  [ -n "${STRIPE_API_URL:-}" ] && return 0
  case "${STRIPE_SECRET_KEY:-}" in sk_live_*) return 0 ;; esac
  [ -n "${STRIPE_SECRET_KEY:-}" ] && [ -n "${STRIPE_WEBHOOK_SECRET:-}" ] || die "STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET are not set (ensure_env_file writes local ones)"
  fake_up "payments fake" "$PAY_RUN" payments_try
  export STRIPE_API_URL="http://127.0.0.1:$(fake_port "$PAY_RUN")"
}
