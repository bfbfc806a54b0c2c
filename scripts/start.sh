#!/usr/bin/env bash
# npm start: everything from a fresh clone to a running app on http://127.0.0.1:3000.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

export DB_NAME="${DB_NAME:-windowsill}"
export SMTP_PORT="${SMTP_PORT:-2525}"
export HOST="${HOST:-127.0.0.1}"
export PORT="${PORT:-3000}"

ensure_node_modules
step "private MariaDB"
bash scripts/db.sh start
step "migrations and seeds ($DB_NAME)"
npm run --silent db:migrate
npm run --silent db:seed
if [ "${NODE_ENV:-}" != "production" ] || [ -n "${SMTP_FAKE:-}" ]; then
  step "local fake SMTP server"
  start_fake_smtp
fi
step "building"
npm run --silent build
trap stop_fake_smtp EXIT
step "serving"
cat <<MSG

  Windowsill is running at http://$HOST:$PORT
  Sign in as lead@windowsill.test (or member@, viewer@, admin@, outsider@windowsill.test)
  with the demo password "${DEMO_PASSWORD:-sunlit-bench-demo}" — change DEMO_PASSWORD before real use.
  Stop with Ctrl-C; stop the database with: npm run db:down

MSG
node build
