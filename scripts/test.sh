#!/usr/bin/env bash
# npm test: the same set-up as npm start, against the test database, then svelte-check, vitest and Playwright.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

TEST_DB_NAME="${DB_TEST_NAME:-windowsill_test}"
export SMTP_PORT="${TEST_SMTP_PORT:-2535}"
export E2E_PORT="${E2E_PORT:-4173}"
# Its own build folder (npm start serves build/): running npm test beside a live npm start never touches it.
export BUILD_DIR="${TEST_BUILD_DIR:-.build-test}"
export PUBLIC_ORIGIN="http://127.0.0.1:$E2E_PORT"
export NODE_ENV=test
export WINDOWSILL_DEMO=1
started_at=$(date +%s)

ensure_node_modules
if [ ! -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ]; then
  if [ "$(id -u)" -eq 0 ] && command -v apt-get >/dev/null; then
    step "installing Debian's chromium for the browser tests"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "Chromium is missing: install Debian's chromium (sudo apt-get install chromium) or set CHROMIUM_PATH." >&2; exit 1
  fi
fi

step "private MariaDB and a fresh test database ($TEST_DB_NAME)"
bash scripts/db.sh start
bash scripts/db.sh recreate-test-db
export DB_NAME="$TEST_DB_NAME"
npm run --silent db:migrate
npm run --silent db:seed
step "local fake SMTP server"
start_fake_smtp
trap stop_fake_smtp EXIT

step "svelte-check"
npm run --silent check
step "vitest (unit + integration against MariaDB)"
npx vitest run
step "build"
npm run --silent build
step "Playwright (Debian chromium, built app)"
npx playwright test
echo
echo "npm test finished in $(( $(date +%s) - started_at )) s"
