#!/usr/bin/env bash
# npm run backup: a consistent dump (mariadb-dump --single-transaction) of the start command's
# database to backups/kerfline-<UTC time>.sql. Prints the file's path as the last line on stdout
# (messages go to stderr). Works whether or not `npm start` is running: a stopped database is
# started for the dump and stopped again. DB_DATA_DIR, DB_PORT, DATABASE_URL and BACKUP_DIR
# (default backups/) choose another database or folder.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh
source scripts/lib/local-db-env.sh

ensure_mariadb
ensure_mariadb_dump
db_vars=$(node_modules/.bin/tsx scripts/db/database-url.ts --shell) || exit 1
eval "$db_vars"
dir=${BACKUP_DIR:-backups}
mkdir -p "$dir"

if ! bash scripts/db/mariadb.sh status >/dev/null 2>&1; then
  [ -d "$DB_DATA_DIR/mysql" ] || fail "there is no database in $DB_DATA_DIR to back up (run npm start once, or set DB_DATA_DIR)"
  say "MariaDB is not running; starting it on 127.0.0.1:$DB_PORT for the dump" >&2
  bash scripts/db/mariadb.sh start >&2
  trap 'bash scripts/db/mariadb.sh stop >/dev/null 2>&1 || true' EXIT
fi

file="$dir/kerfline-$(date -u +%Y%m%dT%H%M%SZ).sql"
partial="$file.partial"
# One transaction gives a consistent snapshot of InnoDB tables without locking out the app.
if ! bash scripts/db/mariadb.sh dump --hex-blob --default-character-set=utf8mb4 "$DB_NAME" >"$partial"; then
  rm -f "$partial"
  fail "mariadb-dump failed for database $DB_NAME (see the message above); no backup was written"
fi
tail -n 1 "$partial" | grep -q '^-- Dump completed' || { rm -f "$partial"; fail "the dump of $DB_NAME is incomplete; no backup was written"; }
mv "$partial" "$file"
say "backed up database $DB_NAME ($(du -h "$file" | cut -f1)) to:" >&2
echo "$file"
