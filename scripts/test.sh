#!/usr/bin/env bash
# npm test: installs what it needs, starts a throwaway MariaDB, fake SMTP and fake payment service on free loopback
# ports (never the start command's data), then runs type checks, unit and integration tests,
# the import-boundary lint, builds the app and runs the browser tests against the built server,
# then the cluster suite on a throwaway three-node Galera cluster (scripts/test-cluster.sh).
# Always tears down.
# The last line is "N passed, N failed" over all suites.
# `npm test -- FILE...` runs only the test files whose paths contain one of the words (the same
# stack, no type check): a quick loop while working on one feature.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh
source scripts/lib/build.sh
source scripts/lib/throwaway-stack.sh

ensure_node_modules
ensure_mariadb
ensure_mariadb_dump
ensure_chromium
ensure_poppler

throwaway_env test
results="$work/results"; mkdir -p "$results" test-results
export ARTIFACTS_DIR="$PWD/test-results"

start_throwaway_services \
  || { say "could not prepare the test database (see above)"; echo "0 passed, 1 failed"; exit 1; }

only=("$@")
if [ ${#only[@]} -gt 0 ]; then
  say "only test files matching: ${only[*]} (type check skipped)"
else
  say "type check (astro check)"
  if npx astro check >"$results/astro-check.log" 2>&1; then echo pass >"$results/astro-check.status"
  else tail -n 60 "$results/astro-check.log"; echo fail >"$results/astro-check.status"; fi
  say "lint: import boundaries (eslint)"
  if npx eslint . >"$results/lint.log" 2>&1; then echo pass >"$results/lint.status"
  else tail -n 60 "$results/lint.log"; echo fail >"$results/lint.status"; fi
fi

say "unit and integration tests"
npx vitest run --project unit --project integration --passWithNoTests "${only[@]}" \
  --reporter=default --reporter=json --outputFile.json="$results/vitest.json"

say "building the app"
if (build_if_changed); then
  if start_throwaway_server; then
    say "browser tests (Chromium) against $APP_ORIGIN"
    npx vitest run --project e2e --passWithNoTests "${only[@]}" --reporter=default --reporter=json --outputFile.json="$results/e2e.json"
  else
    echo fail >"$results/server.status"
  fi
else
  echo fail >"$results/build.status"
fi

# The cluster suite (tests/cluster) runs on its own throwaway Galera cluster: in a full run, or
# when one of the words given names it.
expected=vitest.json,e2e.json
if [ ${#only[@]} -eq 0 ] || printf '%s\n' "${only[@]}" | grep -q cluster; then
  cluster_words=(); for word in "${only[@]}"; do [[ "$word" == *cluster* ]] && cluster_words+=("$word"); done
  bash scripts/test-cluster.sh "$results" "${cluster_words[@]}"
  expected+=,cluster.json
fi

node_modules/.bin/tsx scripts/test-summary.ts "$results" "$ARTIFACTS_DIR" --expect="$expected"
