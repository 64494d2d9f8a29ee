# Builds the app only when its sources changed since the last build.
source_hash() {
  { find src public drizzle -type f -print0 | sort -z | xargs -0 sha256sum;
    sha256sum astro.config.mjs tailwind.config.mjs tsconfig.json package-lock.json scripts/lib/export-worker-bundle.mjs; } | sha256sum | cut -d' ' -f1
}

build_if_changed() {
  local want; want=$(source_hash)
  if [ -f dist/server/entry.mjs ] && [ -f dist/workers/export-worker.mjs ] && [ "$(cat dist/.source-hash 2>/dev/null)" = "$want" ]; then
    say "build is up to date"
    return 0
  fi
  say "building the app (astro build, then the export worker bundle)"
  npx astro build >/tmp/kerfline-build.$$.log 2>&1 || { tail -n 30 /tmp/kerfline-build.$$.log >&2; fail "astro build failed; see the lines above"; }
  rm -f /tmp/kerfline-build.$$.log
  echo "$want" > dist/.source-hash
}

# Runs the built server on HOST:PORT (security headers on static files too). Call it in the
# background (`start_app_server & pid=$!`): exec makes $! the server itself, so TERM reaches it.
# APP_PROCESS_CORES, when set, adds its node flags (scripts/lib/process-cores.mjs).
start_app_server() {
  local flags
  flags=$(node scripts/lib/process-cores.mjs) || exit 1
  # shellcheck disable=SC2086 # one flag a word, none with spaces
  exec node $flags scripts/serve-built-app.mjs
}
