#!/usr/bin/env bash
# npm run restore -- <file> [--force] [--cluster]: loads a dump made by `npm run backup`.
#
# Without --cluster: into an EMPTY data directory (the start command's .data/mariadb unless
# DB_DATA_DIR says otherwise), creating the database and user of DATABASE_URL. A non-empty data
# directory is refused; with --force it is moved aside to <dir>.before-restore-<time> (never
# deleted). The database must not be running.
# With --cluster: into a FRESH Galera cluster, through one node (Galera copies every statement to
# the others), then checks that every node holds the same tables:
#   - DATABASE_URL set (a real cluster): the cluster is running, DATABASE_URL's database and user
#     exist on it and the database has no tables yet; the dump is loaded through the first listed
#     node that is Synced.
#   - DATABASE_URL not set: the loopback cluster of `npm run cluster` in CLUSTER_DIR (default
#     .data/cluster), which must hold no data (with --force an existing one, stopped, is moved
#     aside to <dir>.before-restore-<time>). Three nodes are bootstrapped afresh, the database and
#     user made, the dump loaded; the nodes are left running (`npm run cluster` starts the app on
#     them, `npm run cluster -- stop` stops them).
# See docs/operations.md ("Backups").
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh

usage="usage: npm run restore -- <backup.sql> [--force] [--cluster]"
file="" force=0 cluster=0
for arg in "$@"; do
  case "$arg" in
    --force) force=1 ;;
    --cluster) cluster=1 ;;
    -*) fail "unknown option $arg; $usage" ;;
    *) [ -z "$file" ] || fail "only one backup file at a time; $usage"; file=$arg ;;
  esac
done
[ -n "$file" ] || fail "name the backup file to restore; $usage"
[ -f "$file" ] && [ -r "$file" ] || fail "cannot read the backup file $file"
head -c 4096 "$file" | grep -Eq '^-- (MariaDB|MySQL) dump' || fail "$file does not look like a dump made by npm run backup (mariadb-dump)"
tail -n 1 "$file" | grep -q '^-- Dump completed' || fail "$file is incomplete (it does not end with mariadb-dump's completion line)"
ensure_mariadb

# Moves $1 aside to $1.before-restore-<time> (kept, never deleted) and says so.
move_aside() {
  local aside
  aside="$1.before-restore-$(date -u +%Y%m%dT%H%M%SZ)"
  mv "$1" "$aside"
  say "moved the existing $2 aside to $aside (delete it once the restore is checked)"
}

if [ "$cluster" = 1 ]; then
  started=$SECONDS
  if [ -z "${DATABASE_URL:-}" ]; then
    source scripts/lib/galera.sh
    ensure_cluster_packages
    target=$(realpath -m "${CLUSTER_DIR:-.data/cluster}")
    if [ -d "$target/n1" ] || [ -d "$target/n2" ] || [ -d "$target/n3" ]; then
      galera_env "$target"
      for n in "${GALERA_NODES[@]}"; do
        node_is_running "$n" && fail "the cluster in $target is running; stop it first (npm run cluster -- stop), then restore into a fresh one"
      done
      [ "$force" = 1 ] || fail "$target already holds a cluster; restore only fills a fresh one. Choose another with CLUSTER_DIR=<new dir>, or pass --force to move this one aside (kept as $target.before-restore-<time>)."
      move_aside "$target" "cluster directory"
    fi
    galera_env "$target"
    export DATABASE_URL=$(galera_app_url)
    say "bootstrapping a fresh three-node cluster in $CLUSTER_DIR"
    galera_start_all
    galera_create_app_db
  fi
  db_vars=$(node_modules/.bin/tsx scripts/db/database-url.ts --shell) || exit 1
  eval "$db_vars"
  node=$(node_modules/.bin/tsx scripts/db/cluster-node.ts ready) || fail "no node of the cluster can take the restore (see above); create the database $DB_NAME and its user first"
  read -r node_host node_port <<<"$node"
  before=$(node_modules/.bin/tsx scripts/db/cluster-node.ts tables | grep "^$node_host:$node_port " | cut -d' ' -f2)
  [ "$before" = 0 ] || fail "database $DB_NAME on $node_host:$node_port already has $before tables; restore only fills a fresh (empty) database"
  credentials=$(mktemp /tmp/kerfline-restore.XXXXXX.cnf)
  trap 'rm -f "$credentials"' EXIT
  chmod 600 "$credentials"
  printf '[client]\nuser=%s\npassword="%s"\nhost=%s\nport=%s\nprotocol=tcp\n' "$DB_USER" "$DB_PASSWORD" "$node_host" "$node_port" >"$credentials"
  say "restoring $file into database $DB_NAME through the cluster node $node_host:$node_port"
  mariadb --defaults-file="$credentials" --default-character-set=utf8mb4 "$DB_NAME" <"$file" \
    || fail "loading $file failed (see the message above); the database $DB_NAME is incomplete: drop its tables before trying again"
  counts=$(node_modules/.bin/tsx scripts/db/cluster-node.ts tables)
  echo "$counts" | sed 's/^/  tables on /'
  [ "$(echo "$counts" | cut -d' ' -f2 | sort -u | wc -l)" = 1 ] || fail "the nodes do not hold the same tables after the restore (see above)"
  say "restored $(echo "$counts" | head -n 1 | cut -d' ' -f2) tables into database $DB_NAME on every node in $((SECONDS - started)) s"
  exit 0
fi

source scripts/lib/local-db-env.sh
db_vars=$(node_modules/.bin/tsx scripts/db/database-url.ts --shell) || exit 1
eval "$db_vars"

if bash scripts/db/mariadb.sh status >/dev/null 2>&1; then
  fail "MariaDB is running on $DB_DATA_DIR; stop the app (npm start) first, then restore into an empty data directory"
fi
if [ -d "$DB_DATA_DIR" ] && [ -n "$(ls -A "$DB_DATA_DIR")" ]; then
  if [ "$force" = 1 ]; then
    move_aside "$DB_DATA_DIR" "data directory"
  else
    fail "$DB_DATA_DIR is not empty; restore only fills an empty data directory. Choose another with DB_DATA_DIR=<empty dir>, or pass --force to move this one aside (kept as $DB_DATA_DIR.before-restore-<time>)."
  fi
fi

trap 'bash scripts/db/mariadb.sh stop >/dev/null 2>&1 || true' EXIT
say "restoring $file into $DB_DATA_DIR (database $DB_NAME, MariaDB on 127.0.0.1:$DB_PORT)"
bash scripts/db/mariadb.sh start
bash scripts/db/mariadb.sh create-app-db
bash scripts/db/mariadb.sh sql --default-character-set=utf8mb4 "$DB_NAME" <"$file" || fail "loading $file failed (see the message above); the data directory $DB_DATA_DIR is incomplete"
tables=$(bash scripts/db/mariadb.sh sql -N -e "SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = '$DB_NAME'")
say "restored $tables tables into database $DB_NAME in $DB_DATA_DIR; start the app with npm start"
