#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL and the local mail
# catcher, migrate, seed the demo, build and serve on http://localhost:3000.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"

PORT="${PORT:-3000}"
SMTP_PORT="${FAKE_SMTP_PORT:-2525}"

ensure_node_modules
ensure_env_file

if [ -z "${DATABASE_URL:-}" ]; then
  DATABASE_URL="$(bash scripts/lib/pg.sh ensure plinthwise)"
fi
export DATABASE_URL
export PLINTH_DEMO="${PLINTH_DEMO:-1}"
export APP_URL="${APP_URL:-http://localhost:$PORT}"

FAKE_SMTP_PID=""
cleanup() { if [ -n "$FAKE_SMTP_PID" ]; then kill "$FAKE_SMTP_PID" 2>/dev/null || true; fi; }
trap cleanup EXIT INT TERM
if [ -z "${SMTP_URL:-}" ]; then
  start_fake_smtp "$SMTP_PORT" .local/fake-smtp.log
  export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
fi

node_modules/.bin/tsx scripts/db-migrate.mts
node_modules/.bin/tsx scripts/db-seed.mts
log "building the production bundle"
node_modules/.bin/next build >.local/build.log 2>&1 || { cat .local/build.log >&2; exit 1; }
log "Plinthwise is served on http://localhost:$PORT  (demo accounts are listed in README.md and on the sign-in page)"
node_modules/.bin/next start -H localhost -p "$PORT"
