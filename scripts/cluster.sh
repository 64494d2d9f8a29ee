#!/usr/bin/env bash
# npm run cluster: on loopback, a three-node MariaDB Galera cluster, CLUSTER_APPS (default 2)
# app processes (each under the supervisor npm start uses) and HAProxy in front of them; prints
# the URL and returns, leaving them running. `npm run cluster -- stop` stops what it started
# (data kept in CLUSTER_DIR); `npm run cluster -- status` shows each part. Not needed for
# `npm start`. See docs/operations.md.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh
source scripts/lib/build.sh
source scripts/lib/galera.sh
source scripts/cluster/haproxy.sh

galera_env "${CLUSTER_DIR:-.data/cluster}"
run="$CLUSTER_DIR/run"
export CLUSTER_PORT=${CLUSTER_PORT:-4330}
export DATABASE_URL=$(galera_app_url)
export APP_ORIGIN=${APP_ORIGIN:-http://127.0.0.1:$CLUSTER_PORT}
export SMTP_PORT=${SMTP_PORT:-2526}
export SMTP_URL=${SMTP_URL:-smtp://127.0.0.1:$SMTP_PORT}
# One outbox for every process: the fake SMTP writes it, each process's Outbox page reads it.
export OUTBOX_DIR=${OUTBOX_DIR:-$CLUSTER_DIR/outbox}
export KERFLINE_MODE=${KERFLINE_MODE:-demo}
# HAProxy is the only client the app processes see; its X-Forwarded-For names the real one.
export TRUSTED_PROXIES=${TRUSTED_PROXIES:-loopback}
export HOST=127.0.0.1
apps=${CLUSTER_APPS:-2}
# The processes share this machine's cores: each is sized for its share, cores ÷ processes, at
# least 1 (APP_PROCESS_CORES): PDF worker threads for it (one core of the share left to the
# request thread, at least 1, at most 4; EXPORT_THREADS overrides) and, for one core, V8's garbage
# collector kept on each thread's own core (scripts/lib/process-cores.mjs; docs/operations.md).
share=$(($(nproc) / apps))
export APP_PROCESS_CORES=${APP_PROCESS_CORES:-$((share < 1 ? 1 : share))}

# Stops the processes named by pid files in run/ (HAProxy, apps, fake SMTP), then the nodes.
stop_cluster() {
  local f p
  for f in "$run"/haproxy.pid "$run"/app*.pid "$run"/smtp.pid; do
    [ -f "$f" ] || continue
    p=$(cat "$f"); kill -TERM "$p" 2>/dev/null || true
    for _ in $(seq 50); do kill -0 "$p" 2>/dev/null || break; sleep 0.2; done
    rm -f "$f"
  done
  galera_stop_all
  say "cluster stopped; data kept in $CLUSTER_DIR"
}

status_cluster() {
  local n f
  for n in "${GALERA_NODES[@]}"; do
    echo "node $n  127.0.0.1:$(node_var NODE_PORT "$n")  $(node_is_running "$n" && node_state "$n" || echo down)"
  done
  for f in "$run"/app*.pid; do
    [ -f "$f" ] && echo "$(basename "$f" .pid)  pid $(cat "$f")  $(kill -0 "$(cat "$f")" 2>/dev/null && echo running || echo down)"
  done
  [ -f "$run/haproxy.pid" ] && kill -0 "$(cat "$run/haproxy.pid")" 2>/dev/null && echo "haproxy  http://127.0.0.1:$CLUSTER_PORT" || echo "haproxy  down"
}

case "${1:-start}" in
  stop) stop_cluster; exit 0 ;;
  status) status_cluster; exit 0 ;;
  start) ;;
  *) fail "usage: npm run cluster [-- stop|status]" ;;
esac

ensure_node_modules
ensure_mariadb
ensure_cluster_packages
[ -f "$run/haproxy.pid" ] && kill -0 "$(cat "$run/haproxy.pid")" 2>/dev/null && fail "the cluster is already running (npm run cluster -- status)"
require_free_port "$CLUSTER_PORT" "needed by HAProxy" CLUSTER_PORT
require_free_port "$SMTP_PORT" "needed by the cluster's fake SMTP server" SMTP_PORT

say "starting the Galera cluster (data in $CLUSTER_DIR)"
galera_start_all
galera_create_app_db
node_modules/.bin/tsx scripts/db/setup.ts --seed
build_if_changed

setsid node_modules/.bin/tsx scripts/mail/fake-smtp.ts >"$run/smtp.log" 2>&1 &
echo $! >"$run/smtp.pid"
ports=()
for ((i = 1; i <= apps; i++)); do
  port=$(free_port); ports+=("$port")
  PORT=$port setsid node scripts/supervise-server.mjs >"$run/app$i.log" 2>&1 &
  echo $! >"$run/app$i.pid"
done
for port in "${ports[@]}"; do
  wait_http "http://127.0.0.1:$port/api/health" 60 || fail "an app process did not answer on 127.0.0.1:$port (log in $run)"
done
haproxy_config "$CLUSTER_PORT" "${ports[@]}"
setsid haproxy -db -f "$run/haproxy.cfg" >"$run/haproxy.log" 2>&1 &
echo $! >"$run/haproxy.pid"
wait_http "http://127.0.0.1:$CLUSTER_PORT/api/health" 30 || fail "HAProxy did not answer on 127.0.0.1:$CLUSTER_PORT (log: $run/haproxy.log)"
say "cluster up: $apps app processes over 3 Galera nodes ($(galera_hosts))"
say "open http://127.0.0.1:$CLUSTER_PORT   (stop with: npm run cluster -- stop)"
