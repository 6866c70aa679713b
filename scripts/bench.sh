#!/usr/bin/env bash
# npm run bench [-- --json]: the browser figure needs a database for the server it opens, so a private
# benchmark instance runs on its own port and data folder for the duration.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh --with-browser >&2
export DB_DIR=$PWD/.db-bench DB_PORT=${BENCH_DB_PORT:-3327}
bash scripts/db.sh start >&2
trap 'bash scripts/db.sh stop >/dev/null 2>&1 || true' EXIT
[ -d dist ] || bash scripts/build-web.sh >&2
node_modules/.bin/tsx scripts/bench.ts "$@"
