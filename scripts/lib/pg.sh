#!/usr/bin/env bash
# Local PostgreSQL cluster for development and tests.
# Usage: scripts/lib/pg.sh ensure DBNAME [--fresh]
#        scripts/lib/pg.sh restart   (fast restart of the running cluster: the fault tests use it)
#        scripts/lib/pg.sh running   (exit 0 when this checkout's cluster is up)
#        scripts/lib/pg.sh stop      (stop this checkout's cluster if it is up)
# Runs its own cluster on 127.0.0.1:${PLINTH_PG_PORT:-54329} with its own socket folder.
# initdb refuses to run as root, so as root the cluster belongs to the postgres user.
set -euo pipefail

CMD="${1:-ensure}"
case "$CMD" in
  ensure|restart|running|stop) ;;
  *) echo "usage: $0 ensure DBNAME [--fresh] | $0 restart | $0 running | $0 stop" >&2; exit 2 ;;
esac

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
PORT="${PLINTH_PG_PORT:-54329}"
DBNAME="${2:-plinthwise}"
FRESH="${3:-}"

find_bin() {
  local b
  if command -v pg_ctl >/dev/null 2>&1 && command -v initdb >/dev/null 2>&1; then
    dirname "$(readlink -f "$(command -v pg_ctl)")"; return 0
  fi
  for b in /usr/lib/postgresql/*/bin; do
    if [ -x "$b/pg_ctl" ] && [ -x "$b/initdb" ]; then echo "$b"; return 0; fi
  done
  return 1
}

BIN="$(find_bin || true)"
if [ -z "$BIN" ]; then
  echo "[pg] PostgreSQL server binaries missing: installing Debian's postgresql package" >&2
  if [ "$(id -u)" -ne 0 ]; then echo "[pg] need root to install postgresql (or set DATABASE_URL)" >&2; exit 1; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null
  apt-get install -y -qq postgresql >/dev/null
  BIN="$(find_bin)"
fi

# The data folder lives in the git-ignored .local; if the postgres user cannot reach
# it (a checkout under a private home folder), fall back to /var/tmp.
DATA_PARENT="$ROOT/.local"
mkdir -p "$DATA_PARENT"
AS=()
if [ "$(id -u)" -eq 0 ]; then
  AS=(runuser -u postgres --)
  if ! runuser -u postgres -- test -x "$DATA_PARENT"; then
    DATA_PARENT="/var/tmp/plinthwise-$(echo -n "$ROOT" | sha256sum | cut -c1-12)"
    mkdir -p "$DATA_PARENT"
  fi
fi
DATA="$DATA_PARENT/pg-$PORT"
SOCK="$DATA_PARENT/pg-$PORT-sock"
LOG="$DATA_PARENT/pg-$PORT.log"
mkdir -p "$DATA" "$SOCK"
touch "$LOG"
if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$DATA" "$SOCK" "$LOG"; chmod 700 "$DATA"; fi

if [ ! -f "$DATA/PG_VERSION" ]; then
  echo "[pg] initialising a cluster in $DATA" >&2
  "${AS[@]}" "$BIN/initdb" -D "$DATA" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
fi

PG_OPTS="-c listen_addresses=127.0.0.1 -p $PORT -k $SOCK -c fsync=off -c max_connections=200"

is_up() { "${AS[@]}" "$BIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; }
port_taken() { (echo >"/dev/tcp/127.0.0.1/$PORT") >/dev/null 2>&1; }

if [ "$CMD" = "running" ]; then is_up; exit $?; fi
if [ "$CMD" = "stop" ]; then
  if is_up; then
    echo "[pg] stopping PostgreSQL on 127.0.0.1:$PORT" >&2
    "${AS[@]}" "$BIN/pg_ctl" -D "$DATA" -w -t 60 -m fast stop >/dev/null
  fi
  exit 0
fi

if [ "$CMD" = "restart" ]; then
  # Fast shutdown (open sessions are disconnected, as in a real server restart), then
  # start again with the same options; waits until the cluster accepts connections.
  echo "[pg] restarting PostgreSQL on 127.0.0.1:$PORT" >&2
  "${AS[@]}" "$BIN/pg_ctl" -D "$DATA" -l "$LOG" -w -t 60 -m fast -o "$PG_OPTS" restart >/dev/null
  exit 0
fi

if ! is_up; then
  if port_taken; then
    # Another checkout's cluster (or another program) holds the port: say so once, clearly.
    echo "[pg] port $PORT on 127.0.0.1 is taken by another program (another checkout's cluster?): set PLINTH_PG_PORT to a free port" >&2
    exit 1
  fi
  echo "[pg] starting PostgreSQL on 127.0.0.1:$PORT" >&2
  "${AS[@]}" "$BIN/pg_ctl" -D "$DATA" -l "$LOG" -w -t 60 -o "$PG_OPTS" start >/dev/null
fi

export PGOPTIONS="--client-min-messages=warning"
PSQL=("$BIN/psql" -h 127.0.0.1 -p "$PORT" -U postgres -v ON_ERROR_STOP=1 -qtA)
"${PSQL[@]}" -d postgres -c "DO \$\$BEGIN IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname='plinthwise') THEN CREATE ROLE plinthwise LOGIN SUPERUSER; END IF; END\$\$;"
if [ "$FRESH" = "--fresh" ]; then
  "${PSQL[@]}" -d postgres -c "DROP DATABASE IF EXISTS \"$DBNAME\" WITH (FORCE);"
fi
if [ -z "$("${PSQL[@]}" -d postgres -c "SELECT 1 FROM pg_database WHERE datname='$DBNAME'")" ]; then
  "${PSQL[@]}" -d postgres -c "CREATE DATABASE \"$DBNAME\" OWNER plinthwise;"
fi
echo "postgres://plinthwise@127.0.0.1:$PORT/$DBNAME"
