#!/usr/bin/env bash
# npm start: install what is missing, start the private MariaDB, migrate, seed the demo once,
# build the web app and serve the product on 127.0.0.1:$PORT.
set -euo pipefail
cd "$(dirname "$0")/.."
export PORT=${PORT:-8080} DB_PORT=${DB_PORT:-3307} HOST=${HOST:-127.0.0.1}
export NODE_ENV=${NODE_ENV:-development}

bash scripts/setup.sh
bash scripts/db.sh start
server_pid=""
cleanup() {
  [ -n "$server_pid" ] && kill "$server_pid" 2>/dev/null && wait "$server_pid" 2>/dev/null
  bash scripts/db.sh stop || true
}
trap cleanup EXIT
trap 'exit 130' INT TERM

npx knex migrate:latest --knexfile knexfile.js
node scripts/seed-once.js
bash scripts/build-web.sh

node_modules/.bin/tsx server/index.ts &
server_pid=$!
wait "$server_pid"
