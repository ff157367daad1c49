#!/usr/bin/env bash
# Shared set-up for scripts/start.sh and scripts/test.sh.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
mkdir -p .local

log() { echo "[plinthwise] $*" >&2; }

ensure_node_modules() {
  # Install when node_modules is missing or older than the lock file.
  if [ ! -x node_modules/.bin/next ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error >&2
  fi
}

ensure_env_file() {
  node_modules/.bin/tsx scripts/ensure-env.mts >&2
  # Make the generated secret visible to the scripts and tests too (Next reads .env.local itself).
  if [ -z "${SESSION_SECRET:-}" ]; then
    SESSION_SECRET="$(grep -E '^SESSION_SECRET=' .env.local | tail -1 | cut -d= -f2-)"
    export SESSION_SECRET
  fi
}

wait_for_port() { # host port seconds
  local i
  for ((i = 0; i < $3 * 10; i++)); do
    if (echo >"/dev/tcp/$1/$2") >/dev/null 2>&1; then return 0; fi
    sleep 0.1
  done
  return 1
}

start_fake_smtp() { # port logfile
  log "starting the local fake SMTP server on 127.0.0.1:$1"
  FAKE_SMTP_PORT="$1" node_modules/.bin/tsx scripts/fake-smtp.mts >"$2" 2>&1 &
  FAKE_SMTP_PID=$!
  wait_for_port 127.0.0.1 "$1" 30 || { log "fake SMTP server did not start; see $2"; cat "$2" >&2; exit 1; }
}
