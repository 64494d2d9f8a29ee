#!/usr/bin/env bash
# npm run backup [-- --cluster]: a consistent dump (mariadb-dump --single-transaction) of the
# app's database to backups/kerfline-<UTC time>.sql. Prints the file's path as the last line on
# stdout (messages go to stderr). BACKUP_DIR (default backups/) chooses another folder.
#
# Without --cluster: the start command's database. Works whether or not `npm start` is running: a
# stopped database is started for the dump and stopped again. DB_DATA_DIR, DB_PORT and
# DATABASE_URL choose another one.
# With --cluster (or a DATABASE_URL listing several hosts): a running Galera cluster, dumped from
# ONE node over TCP as DATABASE_URL's user: the first listed node that is Synced. Without
# DATABASE_URL, the loopback cluster of `npm run cluster` (CLUSTER_DIR, default .data/cluster).
# See docs/operations.md ("Backups").
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh

cluster=0
for arg in "$@"; do
  case "$arg" in
    --cluster) cluster=1 ;;
    *) fail "unknown argument $arg; usage: npm run backup [-- --cluster]" ;;
  esac
done
[[ "${DATABASE_URL:-}" == *@*,* ]] && cluster=1
if [ "$cluster" = 1 ] && [ -z "${DATABASE_URL:-}" ]; then
  source scripts/lib/galera.sh
  galera_env "${CLUSTER_DIR:-.data/cluster}"
  export DATABASE_URL=$(galera_app_url)
fi
[ "$cluster" = 1 ] || source scripts/lib/local-db-env.sh

ensure_mariadb
ensure_mariadb_dump
db_vars=$(node_modules/.bin/tsx scripts/db/database-url.ts --shell) || exit 1
eval "$db_vars"
dir=${BACKUP_DIR:-backups}
mkdir -p "$dir"
file="$dir/kerfline-$(date -u +%Y%m%dT%H%M%SZ).sql"
partial="$file.partial"
credentials=""
trap 'rm -f "$partial" ${credentials:+"$credentials"}' EXIT

# One transaction gives a consistent snapshot of InnoDB tables without locking out the app.
dump_options=(--hex-blob --default-character-set=utf8mb4)
if [ "$cluster" = 1 ]; then
  node=$(node_modules/.bin/tsx scripts/db/cluster-node.ts ready) || fail "no node of the cluster can be backed up (see above); no backup was written"
  read -r node_host node_port <<<"$node"
  credentials=$(mktemp /tmp/kerfline-backup.XXXXXX.cnf)
  chmod 600 "$credentials"
  printf '[client]\nuser=%s\npassword="%s"\nhost=%s\nport=%s\nprotocol=tcp\n' "$DB_USER" "$DB_PASSWORD" "$node_host" "$node_port" >"$credentials"
  say "dumping database $DB_NAME from the cluster node $node_host:$node_port (Synced)" >&2
  # No LOCK TABLES in the file: Galera does not replicate table locks, and a restore does not need them.
  dump() { mariadb-dump --defaults-file="$credentials" --single-transaction --routines --skip-add-locks "${dump_options[@]}" "$DB_NAME"; }
else
  if ! bash scripts/db/mariadb.sh status >/dev/null 2>&1; then
    [ -d "$DB_DATA_DIR/mysql" ] || fail "there is no database in $DB_DATA_DIR to back up (run npm start once, or set DB_DATA_DIR)"
    say "MariaDB is not running; starting it on 127.0.0.1:$DB_PORT for the dump" >&2
    bash scripts/db/mariadb.sh start >&2
    trap 'rm -f "$partial"; bash scripts/db/mariadb.sh stop >/dev/null 2>&1 || true' EXIT
  fi
  dump() { bash scripts/db/mariadb.sh dump "${dump_options[@]}" "$DB_NAME"; }
fi

if ! dump >"$partial"; then
  fail "mariadb-dump failed for database $DB_NAME (see the message above); no backup was written"
fi
tail -n 1 "$partial" | grep -q '^-- Dump completed' || fail "the dump of $DB_NAME is incomplete; no backup was written"
mv "$partial" "$file"
say "backed up database $DB_NAME ($(du -h "$file" | cut -f1)) to:" >&2
echo "$file"
