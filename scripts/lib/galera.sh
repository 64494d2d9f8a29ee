# A three-node MariaDB Galera cluster on loopback, run by the project's own scripts (no systemd):
# three mariadbd processes with their own data directories and ports, bootstrapped in order.
# Used by `npm run cluster` (scripts/cluster.sh), `npm run test:cluster` and the fault tests
# (scripts/cluster/galera-node.sh). Source common.sh first, then call galera_env DIR.
#
# Layout under $CLUSTER_DIR: ports.env (the ports, chosen once), nN/ (data of node N, owned by
# the unprivileged user the nodes run as), run/ (sockets, pid files, logs), sst-bin/ (the state
# transfer scripts).

GALERA_PROVIDER=/usr/lib/galera/libgalera_smm.so
GALERA_NODES=(1 2 3)
# The nodes run unprivileged: rsync's state transfer daemon, started by the node, drops root to
# "nobody" and could not write a root-owned data directory.
GALERA_USER=${GALERA_USER:-nobody}

# Installs Galera, HAProxy and rsync (the state transfer) from Debian's packages when missing.
ensure_cluster_packages() {
  local missing=()
  [ -f "$GALERA_PROVIDER" ] || missing+=(galera-4)
  command -v haproxy >/dev/null 2>&1 || [ -x /usr/sbin/haproxy ] || missing+=(haproxy)
  command -v rsync >/dev/null 2>&1 || missing+=(rsync)
  if [ ${#missing[@]} -gt 0 ]; then
    say "installing ${missing[*]} from Debian's packages (the cluster)"
    apt_install "${missing[@]}"
  fi
}

# The state transfer scripts (wsrep_sst_rsync and what it sources) ship in Debian's full
# mariadb-server package, whose install scripts would stop every MariaDB on the machine: take
# only the two scripts out of the package file, into $1.
ensure_sst_scripts() {
  local bin=$1 deb
  [ -x "$bin/wsrep_sst_rsync" ] && [ -f "$bin/wsrep_sst_common" ] && return 0
  mkdir -p "$bin/deb"
  (cd "$bin/deb" && apt-get download -q mariadb-server >/dev/null 2>&1) \
    || fail "could not download Debian's mariadb-server package (for wsrep_sst_rsync); check access to the package mirror"
  deb=$(ls "$bin"/deb/mariadb-server_*.deb | head -n 1)
  dpkg-deb --fsys-tarfile "$deb" | tar -x -C "$bin/deb" ./usr/bin/wsrep_sst_rsync ./usr/bin/wsrep_sst_common \
    || fail "could not unpack wsrep_sst_rsync from $deb"
  mv "$bin/deb/usr/bin/wsrep_sst_rsync" "$bin/deb/usr/bin/wsrep_sst_common" "$bin/"
  rm -rf "$bin/deb"
}

# Sets CLUSTER_DIR and each node's ports (NODE_PORT_n, GCOMM_PORT_n, IST_PORT_n, SST_PORT_n),
# choosing free ones the first time and keeping them in ports.env after that.
galera_env() {
  export CLUSTER_DIR=$(realpath -m "$1")
  mkdir -p "$CLUSTER_DIR/run"
  if [ ! -f "$CLUSTER_DIR/ports.env" ]; then
    local n
    for n in "${GALERA_NODES[@]}"; do
      echo "NODE_PORT_$n=$(free_port) GCOMM_PORT_$n=$(free_port) IST_PORT_$n=$(free_port) SST_PORT_$n=$(free_port)"
    done >"$CLUSTER_DIR/ports.env"
  fi
  set -a; source "$CLUSTER_DIR/ports.env"; set +a
  # The nodes' user must reach its files: every directory above them lets others pass.
  local d=$CLUSTER_DIR
  while [ "$d" != / ]; do chmod o+x "$d" 2>/dev/null || true; d=$(dirname "$d"); done
  chown "$GALERA_USER" "$CLUSTER_DIR/run"
}

node_var() { local name="$1_$2"; echo "${!name}"; }
node_sock() { echo "$CLUSTER_DIR/run/n$1.sock"; }
node_pid() { cat "$CLUSTER_DIR/run/n$1.pid" 2>/dev/null; }
node_sql() { local n=$1; shift; mariadb --no-defaults --socket="$(node_sock "$n")" -uroot "$@"; }

# The DATABASE_URL host list: every node, in order.
galera_hosts() {
  local n out=()
  for n in "${GALERA_NODES[@]}"; do out+=("127.0.0.1:$(node_var NODE_PORT "$n")"); done
  (IFS=,; echo "${out[*]}")
}

# The DATABASE_URL of `npm run cluster`'s app (also what npm run backup/restore -- --cluster use
# when DATABASE_URL is not set).
galera_app_url() { echo "mysql://kerfline:kerfline-local@$(galera_hosts)/kerfline"; }

# Prints the node's wsrep_local_state_comment (Synced, Donor/Desynced, Joining…), or "down".
node_state() {
  node_sql "$1" -Nse "SHOW GLOBAL STATUS LIKE 'wsrep_local_state_comment'" 2>/dev/null | cut -f2 || true
}

node_is_running() { local p; p=$(node_pid "$1"); [ -n "$p" ] && kill -0 "$p" 2>/dev/null; }

# Starts node $1 in the background; `--bootstrap` makes it form a new cluster.
galera_node_start() {
  local n=$1 bootstrap=${2:-} data="$CLUSTER_DIR/n$1" run="$CLUSTER_DIR/run" m address=()
  node_is_running "$n" && return 0
  for m in "${GALERA_NODES[@]}"; do address+=("127.0.0.1:$(node_var GCOMM_PORT "$m")"); done
  local extra=()
  [ "$bootstrap" = --bootstrap ] && extra+=(--wsrep-new-cluster)
  mkdir -p "$data"; chown "$GALERA_USER" "$data"
  PATH="$CLUSTER_DIR/sst-bin:$PATH" /usr/sbin/mariadbd --no-defaults --user="$GALERA_USER" --datadir="$data" \
    --socket="$(node_sock "$n")" --port="$(node_var NODE_PORT "$n")" --bind-address=127.0.0.1 --skip-name-resolve \
    --pid-file="$run/n$n.mariadbd.pid" --log-error="$run/n$n.log" \
    --innodb-buffer-pool-size=64M --innodb-log-file-size=16M --character-set-server=utf8mb4 \
    --collation-server=utf8mb4_unicode_ci --binlog-format=ROW --innodb-autoinc-lock-mode=2 \
    --wsrep-on=ON --wsrep-provider="$GALERA_PROVIDER" --wsrep-cluster-name=kerfline \
    --wsrep-cluster-address="gcomm://$(IFS=,; echo "${address[*]}")" --wsrep-node-name="node$n" \
    --wsrep-node-address="127.0.0.1:$(node_var GCOMM_PORT "$n")" \
    --wsrep-node-incoming-address="127.0.0.1:$(node_var NODE_PORT "$n")" \
    --wsrep-sst-receive-address="127.0.0.1:$(node_var SST_PORT "$n")" --wsrep-sst-method=rsync \
    --wsrep-provider-options="gmcast.listen_addr=tcp://127.0.0.1:$(node_var GCOMM_PORT "$n");ist.recv_addr=127.0.0.1:$(node_var IST_PORT "$n");gcache.size=32M;evs.suspect_timeout=PT3S;evs.inactive_timeout=PT8S" \
    "${extra[@]}" >/dev/null 2>&1 &
  echo $! >"$run/n$n.pid"
}

# Waits up to $2 seconds (default 90) until node $1 is Synced with the cluster.
galera_node_wait_synced() {
  local n=$1 seconds=${2:-90} i
  for ((i = 0; i < seconds * 5; i++)); do
    [ "$(node_state "$n")" = Synced ] && return 0
    node_is_running "$n" || break
    sleep 0.2
  done
  tail -n 15 "$CLUSTER_DIR/run/n$n.log" >&2 || true
  fail "Galera node $n did not join the cluster (log: $CLUSTER_DIR/run/n$n.log)"
}

# Stops node $1: `stop` shuts it down cleanly (it leaves the cluster), `kill` is SIGKILL (a crash).
galera_node_stop() {
  local n=$1 how=${2:-stop} p i
  p=$(node_pid "$n"); [ -n "$p" ] || return 0
  kill "-$([ "$how" = kill ] && echo KILL || echo TERM)" "$p" 2>/dev/null || return 0
  for ((i = 0; i < 300; i++)); do kill -0 "$p" 2>/dev/null || return 0; sleep 0.2; done
  kill -KILL "$p" 2>/dev/null || true
}

# The node to bootstrap a stopped cluster from: the one Galera marked safe (the last to leave),
# else node 1 made safe (a local cluster whose nodes all crashed; acceptable for this loopback
# cluster, see docs/operations.md for a real one).
galera_bootstrap_node() {
  local n
  for n in "${GALERA_NODES[@]}"; do
    grep -q '^safe_to_bootstrap: 1' "$CLUSTER_DIR/n$n/grastate.dat" 2>/dev/null && { echo "$n"; return; }
  done
  sed -i 's/^safe_to_bootstrap: 0/safe_to_bootstrap: 1/' "$CLUSTER_DIR/n1/grastate.dat" 2>/dev/null || true
  echo 1
}

# Starts the whole cluster in order: the first node forms it, the others join one at a time
# (a fresh node gets a full copy by rsync, a known one only what it missed, IST).
galera_start_all() {
  ensure_sst_scripts "$CLUSTER_DIR/sst-bin"
  local first n
  if [ ! -d "$CLUSTER_DIR/n1/mysql" ]; then
    mkdir -p "$CLUSTER_DIR/n1"; chown "$GALERA_USER" "$CLUSTER_DIR/n1"
    mariadb-install-db --no-defaults --user="$GALERA_USER" --datadir="$CLUSTER_DIR/n1" \
      --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve >"$CLUSTER_DIR/run/install.log" 2>&1 \
      || fail "could not initialise the first node's data directory; see $CLUSTER_DIR/run/install.log"
    first=1
  else
    first=$(galera_bootstrap_node)
  fi
  for n in "${GALERA_NODES[@]}"; do require_free_port "$(node_var NODE_PORT "$n")" "needed by Galera node $n" "the cluster directory's ports.env"; done
  galera_node_start "$first" --bootstrap
  galera_node_wait_synced "$first"
  for n in "${GALERA_NODES[@]}"; do
    [ "$n" = "$first" ] && continue
    galera_node_start "$n"
    galera_node_wait_synced "$n"
  done
}

# Stops the nodes one after the other, node 1 last (so it is the one safe to bootstrap from).
galera_stop_all() {
  local i
  for ((i = ${#GALERA_NODES[@]} - 1; i >= 0; i--)); do galera_node_stop "${GALERA_NODES[$i]}"; done
}

# Creates the app's database and user on the cluster (replicated to every node).
galera_create_app_db() {
  eval "$(node_modules/.bin/tsx scripts/db/database-url.ts --shell)"
  app_db_sql | node_sql 1
}
