#!/usr/bin/env bash
# Runs every test on this machine, installing what is missing first:
#   npm packages, Debian's PostgreSQL and Chromium; a fresh test database is created by the tests.
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1

step() { printf '\n\033[1m== %s\033[0m\n' "$*"; }

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  step "Installing npm packages"
  npm ci --no-audit --no-fund
fi

apt_install() {
  if [ "$(id -u)" != "0" ]; then echo "Missing $1 and not root: install Debian's $1 package." >&2; exit 1; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get install -y -qq "$1" >/dev/null 2>&1 || { apt-get update -qq && apt-get install -y -qq "$1" >/dev/null; }
}
if [ ! -x /usr/bin/chromium ]; then step "Installing Chromium (Debian)"; apt_install chromium; fi

step "PostgreSQL"
bash db/setup.sh start

step "Lint and type check"
npx eslint -c .ci/eslint.config.mjs .
npx tsc --noEmit -p .

step "Production build"
npx next build

step "Tests"
npx vitest run --config tests/vitest.config.ts --project lib --project server

# After the others, not beside them: they stop and start a PostgreSQL of their own (about 1.5 min).
step "Fault tests"
npx vitest run --config tests/vitest.config.ts --project faults
