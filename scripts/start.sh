#!/usr/bin/env bash
# npm start: everything from a fresh clone to a running app on http://127.0.0.1:3000.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

export DB_NAME="${DB_NAME:-windowsill}"
export SMTP_PORT="${SMTP_PORT:-2525}"
export HOST="${HOST:-127.0.0.1}"
export PORT="${PORT:-3000}"
# adapter-node refuses bodies above 512 KB unless told otherwise; spectrum files may be up to UPLOAD_LIMIT_MB.
# Base URL written into e-mailed links (adapter-node would otherwise assume https).
export PUBLIC_ORIGIN="${PUBLIC_ORIGIN:-http://$HOST:$PORT}"
export BODY_SIZE_LIMIT="${BODY_SIZE_LIMIT:-$(( ${UPLOAD_LIMIT_MB:-20} + 5 ))M}"

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
