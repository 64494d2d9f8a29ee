#!/usr/bin/env bash
# npm run screenshots: the README's screenshots (editor, board list, proof page at 1280×720 and
# 390×844) written to docs/screenshots/ by the browser test tests/e2e/screenshots.test.ts, on the
# same throwaway stack `npm test` uses (demo shop, built server). Commit the PNGs it writes.
set -uo pipefail
cd "$(dirname "$0")/.."
SCREENSHOTS_DIR="$PWD/docs/screenshots" exec bash scripts/test.sh e2e/screenshots
