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
  set -a; . ./.env; set +a
}
