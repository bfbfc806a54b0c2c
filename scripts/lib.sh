#!/usr/bin/env bash
# Shared steps of scripts/start.sh and scripts/test.sh.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"

step() { printf '\n\033[1m== %s\033[0m\n' "$*"; }

# npm ci when node_modules is missing or older than package-lock.json (a stamp records the lock's hash).
ensure_node_modules() {
  local want have=""
  want="$(sha256sum package-lock.json | cut -d' ' -f1)"
  [ -f node_modules/.windowsill-lock ] && have="$(cat node_modules/.windowsill-lock)"
  if [ ! -d node_modules ] || [ "$want" != "$have" ]; then
    step "installing npm dependencies (npm ci)"
    npm ci --no-audit --no-fund
    echo "$want" > node_modules/.windowsill-lock
  fi
}

# The fake SMTP server (development and tests only): stores every message in the outbox table.
start_fake_smtp() {
  [ -f scripts/fake-smtp.ts ] || return 0
  # One pid file per SMTP port, so npm test (port 2535) never stops the server of a running npm start (2525).
  local log="$ROOT/.data/fake-smtp-${DB_NAME:-windowsill}.log"
  local pidfile="$ROOT/.data/fake-smtp-${SMTP_PORT:-2525}.pid"
  mkdir -p "$ROOT/.data"
  if [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; then
    kill "$(cat "$pidfile")" 2>/dev/null || true
    sleep 0.5
  fi
  node --import tsx scripts/fake-smtp.ts >"$log" 2>&1 &
  echo $! > "$pidfile"
  local i
  for i in $(seq 1 40); do
    if (exec 3<>"/dev/tcp/127.0.0.1/${SMTP_PORT:-2525}") 2>/dev/null; then echo "fake SMTP server on 127.0.0.1:${SMTP_PORT:-2525}"; return 0; fi
    kill -0 "$(cat "$pidfile")" 2>/dev/null || { cat "$log" >&2; echo "fake SMTP server failed to start" >&2; return 1; }
    sleep 0.25
  done
  echo "fake SMTP server did not open its port" >&2; cat "$log" >&2; return 1
}

stop_fake_smtp() {
  local pidfile="$ROOT/.data/fake-smtp-${SMTP_PORT:-2525}.pid"
  if [ -f "$pidfile" ]; then
    kill "$(cat "$pidfile")" 2>/dev/null || true
    rm -f "$pidfile"
  fi
}
