#!/usr/bin/env bash
# npm test: the same set-up as npm start on a private test database (own data folder and port),
# then type-check, lint, unit/API/reference tests and browser tests. Ends with "N passed, N failed".
set -uo pipefail
cd "$(dirname "$0")/.."
set -e
bash scripts/setup.sh --with-browser
export NODE_ENV=test
export DB_DIR=$PWD/.db-test
export DB_PORT=${TEST_DB_PORT:-3317}
bash scripts/db.sh start
trap 'bash scripts/db.sh stop >/dev/null 2>&1 || true' EXIT
bash scripts/build-web.sh
set +e

mkdir -p test-output
checks_passed=0; checks_failed=0
run_check() {
  local name=$1; shift
  echo "── $name"
  if "$@" > "test-output/$name.log" 2>&1; then
    checks_passed=$((checks_passed + 1)); echo "   ok"
  else
    checks_failed=$((checks_failed + 1)); echo "   FAILED (test-output/$name.log):"; tail -40 "test-output/$name.log"
  fi
}
run_check typecheck npx tsc --noEmit -p .
run_check lint npx eslint . --max-warnings=1000

echo "── jest (calc, reference, api, web, e2e)"
rm -f jest-results.json
npx jest --ci --json --outputFile=jest-results.json "$@"
jest_rc=$?
node scripts/test-summary.js jest-results.json "$checks_passed" "$checks_failed" "$jest_rc"
