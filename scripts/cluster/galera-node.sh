#!/usr/bin/env bash
# One node of a cluster made by scripts/lib/galera.sh, for the fault tests and by hand:
#   galera-node.sh start|stop|kill|wait|state N     with CLUSTER_DIR set.
# start: start node N (it rejoins: IST, or a full copy when it has no data); stop: shut it down
# cleanly; kill: SIGKILL (a crash); wait: until it is Synced; state: print its state or "down".
set -euo pipefail
cd "$(dirname "$0")/../.."
source scripts/lib/common.sh
source scripts/lib/galera.sh
: "${CLUSTER_DIR:?CLUSTER_DIR must name the cluster directory}"
galera_env "$CLUSTER_DIR"
n=${2:?which node (1, 2 or 3)}
case "${1:-}" in
  start) galera_node_start "$n" ;;
  stop) galera_node_stop "$n" stop ;;
  kill) galera_node_stop "$n" kill ;;
  wait) galera_node_wait_synced "$n" "${3:-120}" ;;
  state) node_is_running "$n" && node_state "$n" || echo down ;;
  *) fail "usage: galera-node.sh start|stop|kill|wait|state N" ;;
esac
