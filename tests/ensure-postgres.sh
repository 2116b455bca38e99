#!/usr/bin/env bash
# The API suite runs a second time on a real PostgreSQL server: Debian's `postgresql`. Install it
# when missing, start a private throw-away cluster under a temp folder on a free loopback port
# (as a non-root user), run the given command with TEST_POSTGRES_URL pointing at it, then stop
# the cluster and delete its folder, whatever the command's outcome.
#
#   bash tests/ensure-postgres.sh npx vitest run --project node tests/api
set -euo pipefail

find_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

SUDO=""
if [ "$(id -u)" != "0" ]; then SUDO="sudo"; fi
PG_BIN="$(find_bin)"
if [ -z "$PG_BIN" ] || [ ! -x "$PG_BIN/initdb" ]; then
  echo "Installing Debian's postgresql for the PostgreSQL test run…"
  $SUDO apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq postgresql >/dev/null
  PG_BIN="$(find_bin)"
fi

# PostgreSQL refuses to run as root: run the cluster as the `postgres` user the package creates.
as_cluster_user() {
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

DIR="$(mktemp -d "${TMPDIR:-/tmp}/stormdraft-pg-XXXXXX")"
chmod 755 "$DIR"
if [ "$(id -u)" = "0" ]; then chown postgres "$DIR"; fi
PORT="$(node -e "const s=require('net').createServer();s.listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})")"

stop_cluster() {
  as_cluster_user "$PG_BIN/pg_ctl" -D "$DIR/data" -m immediate stop >/dev/null 2>&1 || true
  rm -rf "$DIR"
}
trap stop_cluster EXIT

# Trust authentication on loopback only: the cluster lives for one test run and holds test data.
as_cluster_user "$PG_BIN/initdb" -D "$DIR/data" -U stormdraft --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
as_cluster_user "$PG_BIN/pg_ctl" -D "$DIR/data" -l "$DIR/server.log" -w \
  -o "-p $PORT -k $DIR -c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200" start >/dev/null
echo "PostgreSQL $("$PG_BIN/postgres" --version | awk '{print $3}') test cluster on 127.0.0.1:$PORT"

export TEST_POSTGRES_URL="postgres://stormdraft@127.0.0.1:$PORT/postgres"
"$@"
