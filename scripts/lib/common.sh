# Shared shell pieces for scripts/start.sh, scripts/test.sh and scripts/bench.sh.
# Each function prints one clear line on failure; callers decide whether to exit.

say()  { printf '\033[1mkerfline:\033[0m %s\n' "$*"; }
fail() { printf '\033[1;31mkerfline: %s\033[0m\n' "$*" >&2; exit 1; }

# Runs apt-get as root; explains what to do when we are not root.
apt_install() {
  if [ "$(id -u)" != 0 ]; then
    fail "needs Debian packages ($*): run as root, or install them with: sudo apt-get install -y $*"
  fi
  if [ ! -f /var/lib/apt/periodic/kerfline-updated ] || [ -z "$(ls -A /var/lib/apt/lists 2>/dev/null | grep -v lock)" ]; then
    apt-get update -qq >/dev/null || fail "apt-get update failed; check the machine's access to Debian's package mirror"
    mkdir -p /var/lib/apt/periodic && touch /var/lib/apt/periodic/kerfline-updated
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null \
    || fail "apt-get install $* failed; see the message above"
}

# Installs npm dependencies when node_modules is missing or older than package-lock.json.
ensure_node_modules() {
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    say "installing npm dependencies (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error || fail "npm ci failed; see the message above"
  fi
}

ensure_mariadb() {
  if [ ! -x /usr/sbin/mariadbd ] || ! command -v mariadb >/dev/null 2>&1; then
    say "installing MariaDB from Debian's packages"
    apt_install mariadb-server-core mariadb-client-core
  fi
}

# mariadb-dump (backups) is in Debian's full client package, not in mariadb-client-core.
ensure_mariadb_dump() {
  command -v mariadb-dump >/dev/null 2>&1 || { say "installing mariadb-client (mariadb-dump)"; apt_install mariadb-client; }
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    say "installing Chromium from Debian's packages (browser tests)"
    apt_install chromium
  fi
}

ensure_poppler() {
  command -v pdftoppm >/dev/null 2>&1 || { say "installing poppler-utils (PDF checks)"; apt_install poppler-utils; }
}

# Prints a free TCP port on 127.0.0.1.
free_port() {
  node -e "const s=require('net').createServer();s.listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})"
}

# Fails when something already listens on 127.0.0.1:$1.
require_free_port() {
  if node -e "const s=require('net').connect($1,'127.0.0.1');s.on('connect',()=>process.exit(0));s.on('error',()=>process.exit(1))"; then
    fail "port $1 on 127.0.0.1 is already in use ($2). Stop whatever uses it, or choose another port with $3=<port>."
  fi
}

# Waits up to $2 seconds for an HTTP URL to answer 200.
wait_http() {
  local url=$1 seconds=$2 i
  for ((i = 0; i < seconds * 4; i++)); do
    node -e "fetch('$url').then(r=>process.exit(r.ok?0:1),()=>process.exit(1))" && return 0
    sleep 0.25
  done
  return 1
}

# The SQL that makes the app's database and its user (from DB_NAME, DB_USER, DB_PASSWORD, as
# scripts/db/database-url.ts --shell sets them), for one server or one Galera node alike.
app_db_sql() {
  cat <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
CREATE USER IF NOT EXISTS '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'localhost';
SQL
}
