#!/usr/bin/env bash
# A private MariaDB server, run by the project's own scripts (no systemd, loopback only).
# Usage: mariadb.sh start|stop|status  with DB_DATA_DIR and DB_PORT set.
#        mariadb.sh create-app-db       with DATABASE_URL set too (creates database + user).
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
source "$here/../lib/common.sh"

: "${DB_DATA_DIR:?DB_DATA_DIR must name the data directory}"
: "${DB_PORT:?DB_PORT must name the port}"
data=$(realpath -m "$DB_DATA_DIR")
run="$data-run"
sock="$run/mariadb.sock"
pid="$run/mariadb.pid"
log="$run/mariadb.log"

client() { mariadb --no-defaults --socket="$sock" -uroot "$@"; }

is_up() { client -e 'SELECT 1' >/dev/null 2>&1; }

start() {
  mkdir -p "$run"
  if is_up; then return 0; fi
  if [ ! -d "$data/mysql" ]; then
    mkdir -p "$data"
    mariadb-install-db --no-defaults --user=root --datadir="$data" \
      --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve >"$run/install.log" 2>&1 \
      || fail "could not initialise MariaDB's data directory $data; see $run/install.log"
  fi
  require_free_port "$DB_PORT" "needed by MariaDB" DB_PORT
  /usr/sbin/mariadbd --no-defaults --user=root --datadir="$data" --socket="$sock" --port="$DB_PORT" \
    --bind-address=127.0.0.1 --skip-name-resolve --pid-file="$pid" --log-error="$log" \
    --innodb-buffer-pool-size=64M --skip-log-bin --character-set-server=utf8mb4 \
    --collation-server=utf8mb4_unicode_ci >/dev/null 2>&1 &
  local i
  for ((i = 0; i < 120; i++)); do
    is_up && return 0
    sleep 0.25
  done
  tail -n 15 "$log" >&2 || true
  fail "MariaDB did not start within 30 s (log: $log). Check the port ($DB_PORT) and the disk, then try again."
}

stop() {
  if is_up; then client -e SHUTDOWN >/dev/null 2>&1 || true; fi
  local i
  for ((i = 0; i < 120; i++)); do
    [ -f "$pid" ] && kill -0 "$(cat "$pid")" 2>/dev/null || return 0
    sleep 0.25
  done
  kill -TERM "$(cat "$pid")" 2>/dev/null || true
}

create_app_db() {
  : "${DATABASE_URL:?DATABASE_URL must be set}"
  # The URL was validated by scripts/db/database-url.ts; this reads its parts as shell words.
  eval "$(cd "$here/../.." && node_modules/.bin/tsx scripts/db/database-url.ts --shell)"
  app_db_sql | client
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) is_up && echo up || { echo down; exit 1; } ;;
  create-app-db) create_app_db ;;
  dump) shift; mariadb-dump --no-defaults --socket="$sock" -uroot --single-transaction --routines "$@" ;;
  sql) shift; client "$@" ;;
  *) fail "usage: mariadb.sh start|stop|status|create-app-db|dump|sql" ;;
esac
