#!/usr/bin/env bash
# npm run test:cluster (also a step of npm test): a throwaway three-node Galera cluster on free
# loopback ports (installing galera-4, haproxy and rsync from Debian when missing), migrated and
# seeded, the built app and the fake SMTP; then the cluster tests (tests/cluster), which start
# their own app processes and HAProxy and stop and kill nodes (the backup round trip also
# bootstraps a second, fresh cluster of its own). Always tears down.
# `test-cluster.sh RESULTS_DIR [WORD...]` writes cluster.json there (npm test adds it to its
# closing line); run alone, it prints its own "N passed, N failed".
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh
source scripts/lib/build.sh
source scripts/lib/galera.sh

ensure_node_modules
ensure_mariadb
ensure_cluster_packages

own_results=0
if [ $# -gt 0 ] && [ -d "$1" ]; then results=$1; shift; else results=$(mktemp -d /tmp/kerfline-cluster-results.XXXXXX); own_results=1; fi
work=$(mktemp -d /tmp/kerfline-cluster.XXXXXX)
cleanup() {
  for p in "${pids[@]}"; do kill -TERM "$p" 2>/dev/null || true; done
  for p in "${pids[@]}"; do wait "$p" 2>/dev/null || true; done
  galera_stop_all >/dev/null 2>&1 || true
  rm -rf "$work"
  [ "$own_results" = 1 ] && rm -rf "$results"
}
pids=()
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

galera_env "$work/cluster"
export DATABASE_URL="mysql://kerfline_cluster:kerfline-cluster@$(galera_hosts)/kerfline_cluster"
export SMTP_PORT=$(free_port)
export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
export OUTBOX_DIR="$work/outbox"
export KERFLINE_MODE=demo
export HOST=127.0.0.1

started=$(date +%s)
say "throwaway Galera cluster (3 nodes) in $CLUSTER_DIR"
if ! (galera_start_all && galera_create_app_db && node_modules/.bin/tsx scripts/db/setup.ts --seed); then
  say "could not start the cluster (see above)"; echo fail >"$results/cluster-setup.status"
else
  say "cluster ready in $(($(date +%s) - started)) s"
  node_modules/.bin/tsx scripts/mail/fake-smtp.ts >/dev/null & pids+=($!)
  if (build_if_changed); then
    say "cluster tests (two app processes, conflicts, faults)"
    npx vitest run --project cluster --passWithNoTests "$@" --reporter=default --reporter=json --outputFile.json="$results/cluster.json"
  else
    echo fail >"$results/cluster-build.status"
  fi
fi
say "cluster step took $(($(date +%s) - started)) s"
if [ "$own_results" = 1 ]; then
  node_modules/.bin/tsx scripts/test-summary.ts "$results" --expect=cluster.json
fi
