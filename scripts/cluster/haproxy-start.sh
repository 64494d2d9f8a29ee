#!/usr/bin/env bash
# Writes the HAProxy configuration for 127.0.0.1:$1 over the app ports $2... and runs HAProxy in
# the foreground (exec: the caller's pid is HAProxy's). With CLUSTER_DIR set; for the tests.
set -euo pipefail
cd "$(dirname "$0")/../.."
source scripts/lib/common.sh
source scripts/lib/galera.sh
source scripts/cluster/haproxy.sh
: "${CLUSTER_DIR:?CLUSTER_DIR must name the cluster directory}"
galera_env "$CLUSTER_DIR"
haproxy_config "$@"
exec haproxy -db -f "$CLUSTER_DIR/run/haproxy.cfg"
