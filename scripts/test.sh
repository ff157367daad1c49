#!/usr/bin/env bash
# npm test: the same set-up as npm start on separate ports and a fresh test
# database, then the unit, integration and browser suites. Ends with one line
# "N passed, N failed" summed over the suites' own counts.
set -uo pipefail
source "$(dirname "$0")/lib/common.sh"
set -e

APP_PORT="${PLINTH_TEST_APP_PORT:-3100}"
# A second `next start` on the same build and database for the two-server browser test.
APP_PORT_2="${PLINTH_TEST_APP_PORT_2:-$((APP_PORT + 1))}"
# nginx (Debian's package, deploy/nginx/plinthwise.conf) in front of both, for the balancer test.
BALANCER_PORT="${PLINTH_TEST_BALANCER_PORT:-$((APP_PORT + 2))}"
SMTP_PORT="${PLINTH_TEST_SMTP_PORT:-2535}"
ART="$ROOT/test-artifacts"
rm -rf "$ART" && mkdir -p "$ART"

ensure_node_modules
ensure_env_file
bash scripts/lib/ensure-chromium.sh
bash scripts/lib/ensure-libreoffice.sh
# Installed when missing (root); if that is impossible the run goes on and says so loudly.
NGINX_PROBLEM=""
bash scripts/lib/ensure-nginx.sh || NGINX_PROBLEM="nginx is missing and could not be installed (apt-get install nginx)"

# Tests never run against DATABASE_URL (it may be production): TEST_DATABASE_URL or the local
# cluster. Each phase gets a fresh, freshly seeded database so no suite sees another's leftovers.
fresh_database() { # name
  if [ -n "${TEST_DATABASE_URL:-}" ]; then
    DATABASE_URL="$TEST_DATABASE_URL"
  else
    DATABASE_URL="$(bash scripts/lib/pg.sh ensure "$1" --fresh)"
  fi
  export DATABASE_URL
  node_modules/.bin/tsx scripts/db-migrate.mts
  node_modules/.bin/tsx scripts/db-seed.mts
}
export PLINTH_DEMO=1
export APP_URL="http://127.0.0.1:$APP_PORT"
export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
export PLINTH_TEST_SMTP_PORT="$SMTP_PORT"
export PLINTH_TEST_APP_URL="$APP_URL"
export PLINTH_TEST_APP_URL_2="http://127.0.0.1:$APP_PORT_2"

# Another checkout's test run on the same machine would want the same ports: say so in one line.
for p in "$APP_PORT:PLINTH_TEST_APP_PORT" "$APP_PORT_2:PLINTH_TEST_APP_PORT_2" "$BALANCER_PORT:PLINTH_TEST_BALANCER_PORT" "$SMTP_PORT:PLINTH_TEST_SMTP_PORT"; do
  if (echo >"/dev/tcp/127.0.0.1/${p%%:*}") >/dev/null 2>&1; then
    log "port ${p%%:*} on 127.0.0.1 is taken (another checkout's test run?): set ${p#*:} to a free port"
    exit 1
  fi
done

# Stop at the end what this run started: the servers, and the local cluster unless it was
# already up before (a developer's own) or PLINTH_KEEP_PG=1 asks to keep it.
PG_STARTED_HERE=0
if [ -z "${TEST_DATABASE_URL:-}" ] && ! bash scripts/lib/pg.sh running; then PG_STARTED_HERE=1; fi
FAKE_SMTP_PID=""
SERVER_PID=""
SERVER_2_PID=""
NGINX_PID=""
cleanup() {
  [ -n "$NGINX_PID" ] && kill -QUIT "$NGINX_PID" 2>/dev/null || true
  [ -n "$SERVER_PID" ] && kill "$SERVER_PID" 2>/dev/null || true
  [ -n "$SERVER_2_PID" ] && kill "$SERVER_2_PID" 2>/dev/null || true
  [ -n "$FAKE_SMTP_PID" ] && kill "$FAKE_SMTP_PID" 2>/dev/null || true
  if [ "$PG_STARTED_HERE" = 1 ] && [ "${PLINTH_KEEP_PG:-0}" != 1 ]; then bash scripts/lib/pg.sh stop || true; fi
}
trap cleanup EXIT INT TERM

fresh_database plinthwise_test
start_fake_smtp "$SMTP_PORT" "$ART/fake-smtp.log"

# nginx in front of the two test servers; PLINTH_TEST_BALANCER_URL tells the balancer test
# where. Any failure here is reported (NGINX_PROBLEM) instead of failing the run: that test
# then says it did not run, loudly, in its own output and at the end of this script.
start_balancer() {
  [ -n "$NGINX_PROBLEM" ] && return 0
  local conf
  if ! conf="$(node_modules/.bin/tsx scripts/lib/balancer-config.mts "$BALANCER_PORT" "127.0.0.1:$APP_PORT" "127.0.0.1:$APP_PORT_2" 2>"$ART/nginx.log")"; then
    NGINX_PROBLEM="nginx refused its config: $(tail -3 "$ART/nginx.log")"
    return 0
  fi
  /usr/sbin/nginx -e "$(dirname "$conf")/error.log" -c "$conf" >>"$ART/nginx.log" 2>&1 &
  NGINX_PID=$!
  if wait_for_port 127.0.0.1 "$BALANCER_PORT" 10; then
    export PLINTH_TEST_BALANCER_URL="http://127.0.0.1:$BALANCER_PORT"
    log "nginx on $PLINTH_TEST_BALANCER_URL in front of both test servers"
  else
    NGINX_PROBLEM="nginx did not start on port $BALANCER_PORT: see $ART/nginx.log and $(dirname "$conf")/error.log"
  fi
}

set +e
log "unit suite"
node_modules/.bin/vitest run --project unit --reporter=default --reporter=json --outputFile.json="$ART/unit.json"
log "integration suite"
node_modules/.bin/vitest run --project integration --reporter=default --reporter=json --outputFile.json="$ART/integration.json"

log "building the production bundle for the browser suite"
kill "$FAKE_SMTP_PID" 2>/dev/null; wait "$FAKE_SMTP_PID" 2>/dev/null || true
fresh_database plinthwise_e2e
start_fake_smtp "$SMTP_PORT" "$ART/fake-smtp-e2e.log"
if node_modules/.bin/next build >"$ART/build.log" 2>&1; then
  node_modules/.bin/next start -H localhost -p "$APP_PORT" >"$ART/server.log" 2>&1 &
  SERVER_PID=$!
  node_modules/.bin/next start -H localhost -p "$APP_PORT_2" >"$ART/server-2.log" 2>&1 &
  SERVER_2_PID=$!
  if wait_for_port 127.0.0.1 "$APP_PORT" 60 && wait_for_port 127.0.0.1 "$APP_PORT_2" 60; then
    start_balancer
    log "browser suite"
    node_modules/.bin/vitest run --project e2e --reporter=default --reporter=json --outputFile.json="$ART/e2e.json"
  else
    log "the server did not start; see $ART/server.log"
  fi
else
  log "next build failed:"; tail -40 "$ART/build.log" >&2
fi
set -e

if [ -n "$NGINX_PROBLEM" ]; then
  log "WARNING: the balancer test did not run: $NGINX_PROBLEM"
fi
node_modules/.bin/tsx scripts/test-summary.mts "$ART/unit.json" "$ART/integration.json" "$ART/e2e.json"
