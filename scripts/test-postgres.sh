#!/usr/bin/env bash
# Runs the API test suite against a throwaway PostgreSQL 15 server instead of PGlite.
# initdb refuses to run as root, so the cluster belongs to the "postgres" user; it lives in a
# temporary folder, listens only on 127.0.0.1 at a free port, and is removed on exit.
set -euo pipefail
cd "$(dirname "$0")/.."

PG_BIN="${PG_BIN:-/usr/lib/postgresql/15/bin}"
if [ ! -x "$PG_BIN/initdb" ]; then
  echo "PostgreSQL server binaries not found in $PG_BIN (apt-get install postgresql)" >&2
  exit 1
fi

# First free port from 54329 upwards.
PORT="${PG_TEST_PORT:-54329}"
while (exec 3<>"/dev/tcp/127.0.0.1/$PORT") 2>/dev/null; do PORT=$((PORT + 1)); done

WORK="$(mktemp -d /tmp/tl-pg-XXXXXX)"
DATA="$WORK/data"
run_pg() {
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}
cleanup() {
  run_pg "$PG_BIN/pg_ctl" -D "$DATA" -m immediate stop >/dev/null 2>&1 || true
  rm -rf "$WORK"
}
trap cleanup EXIT INT TERM

if [ "$(id -u)" = "0" ]; then chown postgres:postgres "$WORK"; fi
run_pg "$PG_BIN/initdb" -D "$DATA" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >"$WORK/initdb.log" 2>&1 \
  || { cat "$WORK/initdb.log"; exit 1; }
run_pg "$PG_BIN/pg_ctl" -D "$DATA" -l "$WORK/server.log" -w \
  -o "-p $PORT -c listen_addresses=127.0.0.1 -k $WORK -c fsync=off -c max_connections=200" start >/dev/null \
  || { cat "$WORK/server.log"; exit 1; }
echo "PostgreSQL $("$PG_BIN/postgres" --version | awk '{print $3}') on 127.0.0.1:$PORT"

run_pg "$PG_BIN/createdb" -h 127.0.0.1 -p "$PORT" -U postgres thermoledger_test
# Each test file creates (and drops) its own database next to this one.
DATABASE_URL="postgres://postgres@127.0.0.1:$PORT/thermoledger_test" npx vitest run tests/server "$@"
