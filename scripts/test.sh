#!/usr/bin/env bash
# `npm test`: the same set-up as the start command (npm packages, Debian's
# PostgreSQL and Chromium when missing, a private test cluster), then lint,
# typecheck, production build, and the unit, database and browser tests.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib-setup.sh"
cd "$ROOT"

ensure_node_modules

if [ ! -x /usr/bin/chromium ] && [ -z "${CHROMIUM_PATH:-}" ]; then
  say "Installing Debian's chromium for the browser tests"
  apt_install chromium
fi

if ! command -v pdftotext >/dev/null 2>&1; then
  say "Installing Debian's poppler-utils (pdftotext) for the PDF report tests"
  apt_install poppler-utils
fi

say "Starting the test PostgreSQL cluster (separate data folder and port, fsync off)"
SAGLINE_PGDATA="$ROOT/.data/pg-test" SAGLINE_PGPORT="${SAGLINE_TEST_PGPORT:-54330}" SAGLINE_PG_FSYNC=off \
  bash scripts/db.sh start

say "Lint"
npx eslint .
say "Typecheck"
npx tsc --noEmit
say "Build"
npx next build >/tmp/sagline-build-$$.log 2>&1 || { cat /tmp/sagline-build-$$.log; exit 1; }
tail -n 3 /tmp/sagline-build-$$.log; rm -f /tmp/sagline-build-$$.log

say "Tests: unit, database, browser"
mkdir -p test-results
set +e
npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json
status=$?
set -e
# One plain closing line with the totals.
node -e '
  const r = JSON.parse(require("fs").readFileSync("test-results/vitest.json", "utf8"));
  console.log(`tests: ${r.numPassedTests} passed, ${r.numFailedTests} failed` + (r.numPendingTests ? `, ${r.numPendingTests} skipped` : ""));
' || true
exit $status
