#!/usr/bin/env bash
# npm start: install what is missing, start MariaDB, the fake SMTP and (demo mode, unless payment
# settings are given) the fake payment service on loopback, migrate, seed the demo shop, build if
# needed, and serve the app. Safe to run again; Ctrl-C stops everything.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh
source scripts/lib/build.sh
source scripts/lib/payments.sh

source scripts/lib/local-db-env.sh
export HOST=127.0.0.1
export PORT=${PORT:-4321}
export APP_ORIGIN=${APP_ORIGIN:-http://127.0.0.1:$PORT}
export SMTP_PORT=${SMTP_PORT:-2525}
export SMTP_URL=${SMTP_URL:-smtp://127.0.0.1:$SMTP_PORT}
export OUTBOX_DIR=${OUTBOX_DIR:-.data/outbox}
# The app's own default is production; npm start is the demo, so it says demo unless told otherwise.
export KERFLINE_MODE=${KERFLINE_MODE:-demo}
export PAYMENTS_FAKE_PORT=${PAYMENTS_FAKE_PORT:-12111}

command -v node >/dev/null || fail "Node.js 20 or newer is needed (apt-get install nodejs npm)"
ensure_node_modules
node_modules/.bin/tsx scripts/db/database-url.ts || exit 1
ensure_mariadb

require_free_port "$PORT" "needed by the web server" PORT
require_free_port "$SMTP_PORT" "needed by the local fake SMTP server" SMTP_PORT
if [ "$KERFLINE_MODE" = demo ] && [ -z "${PAYMENTS_SECRET_KEY:-}" ]; then
  require_free_port "$PAYMENTS_FAKE_PORT" "needed by the local fake payment service" PAYMENTS_FAKE_PORT
fi

pids=()
stopping=0
stop_all() {
  [ "$stopping" = 1 ] && return; stopping=1
  say "stopping"
  for p in "${pids[@]}"; do kill -TERM "$p" 2>/dev/null || true; done
  for p in "${pids[@]}"; do wait "$p" 2>/dev/null || true; done
  bash scripts/db/mariadb.sh stop || true
  say "stopped; data kept in $DB_DATA_DIR"
}
trap stop_all EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

say "starting MariaDB on 127.0.0.1:$DB_PORT (data in $DB_DATA_DIR)"
bash scripts/db/mariadb.sh start
bash scripts/db/mariadb.sh create-app-db
node_modules/.bin/tsx scripts/db/setup.ts --seed

build_if_changed

node_modules/.bin/tsx scripts/mail/fake-smtp.ts & pids+=($!)
# Demo mode: deposits go to the local fake payment service (no real money). Production mode
# without PAYMENTS_SECRET_KEY and PAYMENTS_WEBHOOK_SECRET: deposits are off (docs/payments.md).
if [ "$KERFLINE_MODE" = demo ]; then
  start_fake_payments_unless_configured "$PAYMENTS_FAKE_PORT" || fail "the fake payment service did not start"
fi
# The supervisor starts the web server again (logged, with a back-off) if it ever dies.
node scripts/supervise-server.mjs & server=$!; pids+=("$server")
wait_http "http://127.0.0.1:$PORT/api/version" 30 || fail "the web server did not answer on 127.0.0.1:$PORT within 30 s"

node_modules/.bin/tsx scripts/print-welcome.ts
# Stay up while the supervisor runs. Also stop when the parent (npm) goes away: npm does not pass a
# SIGTERM on to this script, so without this check `kill <npm pid>` would orphan the services.
parent=$PPID
while kill -0 "$server" 2>/dev/null && kill -0 "$parent" 2>/dev/null; do sleep 1; done
