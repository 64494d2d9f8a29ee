#!/usr/bin/env bash
# npm run bench: starts a throwaway MariaDB (own data directory, free port), the fake SMTP, the
# demo seed and the built server, all on 127.0.0.1; runs every bench/*.ts and bench/*.mjs; prints
# one table and writes it to bench/results/<time>.json. Always tears down. Whole run < 5 min.
#
# Contract for bench scripts (also in bench/README.md). Each script runs from the repository
# root, one at a time, with these variables set:
#   BASE_URL, TEST_APP_URL, APP_ORIGIN  origin of the built server, e.g. http://127.0.0.1:41234
#   DATABASE_URL                      the app's (throwaway, demo-seeded) database; writes allowed
#   DB_DATA_DIR, DB_PORT              for `bash scripts/db/mariadb.sh sql|dump|status`
#   SMTP_URL, OUTBOX_DIR              the fake SMTP server and where it keeps mail
#   KERFLINE_MODE=demo                demo users exist (password in README)
#   ARTIFACTS_DIR                     where a script may leave screenshots or logs
#   BENCH_SECONDS                     suggested length of one load run (default 5)
#   BENCH_SCRIPT_TIMEOUT              seconds before the script is stopped (default 90)
# and prints one JSON object per line on stdout:
#   {"figure": string, "value": number, "unit": string, "goal": string, "met"?: boolean}
# Other stdout lines are ignored; stderr is shown only when the script fails. A script fails
# when it exits non-zero, runs out of time or prints no figure; then `npm run bench` exits 1.
# Unmet goals are shown in the table (and the JSON) but do not change the exit status.
# `npm run bench -- WORD...` runs only the scripts whose file names contain one of the words.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/common.sh
source scripts/lib/build.sh
source scripts/lib/throwaway-stack.sh
source scripts/lib/galera.sh

TOTAL_BUDGET_S=${BENCH_TOTAL_BUDGET:-280}
export BENCH_SECONDS=${BENCH_SECONDS:-5}
export BENCH_SCRIPT_TIMEOUT=${BENCH_SCRIPT_TIMEOUT:-90}
started=$SECONDS

ensure_node_modules
ensure_mariadb
ensure_chromium
# bench/export-spread.ts puts HAProxy in front of two app processes.
ensure_cluster_packages

throwaway_env bench
export BASE_URL="$APP_ORIGIN"
export ARTIFACTS_DIR="$PWD/test-results/bench"
mkdir -p "$work/out" "$ARTIFACTS_DIR" bench/results

start_throwaway_services || fail "could not prepare the bench database (see above)"
# The bench fires thousands of requests a second from 127.0.0.1, far past the real per-address
# budgets; this throwaway server scales them (docs/operations.md). Every request still goes
# through the shared limiter, so its cost is in the figures.
export RATE_LIMIT_SCALE=${RATE_LIMIT_SCALE:-1000}
(build_if_changed) || fail "the build failed; nothing was measured"
start_throwaway_server || fail "the built server did not answer on $APP_ORIGIN"

shopt -s nullglob
scripts=(bench/*.ts bench/*.mjs)
if [ $# -gt 0 ]; then
  chosen=()
  for script in "${scripts[@]}"; do
    for word in "$@"; do [[ "$(basename "$script")" == *"$word"* ]] && { chosen+=("$script"); break; }; done
  done
  [ ${#chosen[@]} -gt 0 ] || fail "no bench script name contains any of: $*"
  scripts=("${chosen[@]}")
  say "only bench scripts matching: $*"
fi
[ ${#scripts[@]} -gt 0 ] || fail "no bench scripts found under bench/"
for script in "${scripts[@]}"; do
  name=$(basename "$script")
  left=$((TOTAL_BUDGET_S - (SECONDS - started)))
  if [ "$left" -lt 10 ]; then
    echo "skipped: the run's ${TOTAL_BUDGET_S} s budget is spent" >"$work/out/$name.status"
    continue
  fi
  limit=$((left < BENCH_SCRIPT_TIMEOUT ? left : BENCH_SCRIPT_TIMEOUT))
  say "running $script (at most ${limit} s)"
  runner=(node_modules/.bin/tsx); [[ "$script" == *.mjs ]] && runner=(node)
  t0=$SECONDS
  timeout --kill-after=5 "$limit" "${runner[@]}" "$script" >"$work/out/$name.out" 2>"$work/out/$name.err"
  code=$?
  if [ "$code" = 124 ] || [ "$code" = 137 ]; then status="timed out after ${limit} s"; else status="exit $code"; fi
  echo "$status; $((SECONDS - t0)) s" >"$work/out/$name.status"
done

node_modules/.bin/tsx scripts/bench-report.ts "$work/out" bench/results $((SECONDS - started))
