#!/usr/bin/env bash
# npm run restore <file> [--force]: restores a dump made by `npm run backup` into an EMPTY data
# directory (the start command's .data/mariadb unless DB_DATA_DIR says otherwise), creating the
# database and user of DATABASE_URL. A non-empty data directory is refused; with --force it is
# moved aside to <dir>.before-restore-<time> (never deleted). The database must not be running.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh
source scripts/lib/local-db-env.sh

usage="usage: npm run restore -- <backup.sql> [--force]"
file="" force=0
for arg in "$@"; do
  case "$arg" in
    --force) force=1 ;;
    -*) fail "unknown option $arg; $usage" ;;
    *) [ -z "$file" ] || fail "only one backup file at a time; $usage"; file=$arg ;;
  esac
done
[ -n "$file" ] || fail "name the backup file to restore; $usage"
[ -f "$file" ] && [ -r "$file" ] || fail "cannot read the backup file $file"
head -c 4096 "$file" | grep -Eq '^-- (MariaDB|MySQL) dump' || fail "$file does not look like a dump made by npm run backup (mariadb-dump)"
tail -n 1 "$file" | grep -q '^-- Dump completed' || fail "$file is incomplete (it does not end with mariadb-dump's completion line)"

ensure_mariadb
db_vars=$(node_modules/.bin/tsx scripts/db/database-url.ts --shell) || exit 1
eval "$db_vars"

if bash scripts/db/mariadb.sh status >/dev/null 2>&1; then
  fail "MariaDB is running on $DB_DATA_DIR; stop the app (npm start) first, then restore into an empty data directory"
fi
if [ -d "$DB_DATA_DIR" ] && [ -n "$(ls -A "$DB_DATA_DIR")" ]; then
  if [ "$force" = 1 ]; then
    aside="$DB_DATA_DIR.before-restore-$(date -u +%Y%m%dT%H%M%SZ)"
    mv "$DB_DATA_DIR" "$aside"
    say "moved the existing data directory aside to $aside (delete it once the restore is checked)"
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
