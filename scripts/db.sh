#!/usr/bin/env bash
# Private MariaDB instance on loopback: scripts/db.sh start|stop|status
# DB_DIR (data folder, default .db), DB_PORT (default 3307), DB_NAME/DB_USER/DB_PASSWORD.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
DB_DIR=${DB_DIR:-$ROOT/.db}
case "$DB_DIR" in /*) ;; *) DB_DIR=$ROOT/$DB_DIR ;; esac
DB_PORT=${DB_PORT:-3307}
DB_NAME=${DB_NAME:-lagline}
DB_USER=${DB_USER:-lagline}
DB_PASSWORD=${DB_PASSWORD:-lagline-dev-password}
# Unix socket paths must stay short (about 107 bytes), so the socket lives in /tmp keyed by port.
SOCK=/tmp/lagline-db-$DB_PORT.sock
PIDFILE=$DB_DIR/mariadbd.pid

ensure_installed() {
  if [ ! -x /usr/sbin/mariadbd ]; then
    echo "Installing mariadb-server from Debian's packages…"
    apt-get update -qq >/dev/null
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq mariadb-server >/dev/null
  fi
}

running() {
  [ -f "$PIDFILE" ] && kill -0 "$(cat "$PIDFILE")" 2>/dev/null
}

client() { mariadb --no-defaults --socket="$SOCK" -uroot "$@"; }

start() {
  ensure_installed
  if running; then
    echo "MariaDB already running on 127.0.0.1:$DB_PORT (pid $(cat "$PIDFILE"))"
  else
    if [ ! -d "$DB_DIR/mysql" ]; then
      mkdir -p "$DB_DIR"
      mariadb-install-db --no-defaults --datadir="$DB_DIR/data" --user=root \
        --auth-root-authentication-method=normal --skip-test-db >"$DB_DIR/install.log" 2>&1
      mkdir -p "$DB_DIR/mysql"
    fi
    rm -f "$SOCK" "$PIDFILE"
    if (exec 3<>/dev/tcp/127.0.0.1/"$DB_PORT") 2>/dev/null; then
      echo "Port $DB_PORT on 127.0.0.1 is already taken by another program; set DB_PORT." >&2
      exit 1
    fi
    setsid /usr/sbin/mariadbd --no-defaults --datadir="$DB_DIR/data" --socket="$SOCK" \
      --pid-file="$PIDFILE" --port="$DB_PORT" --bind-address=127.0.0.1 --user=root \
      --log-error="$DB_DIR/error.log" --skip-log-bin --character-set-server=utf8mb4 \
      --collation-server=utf8mb4_unicode_ci --innodb-buffer-pool-size=64M \
      </dev/null >/dev/null 2>&1 &
    for _ in $(seq 1 100); do
      mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1 && break
      sleep 0.2
    done
    mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1 || {
      echo "MariaDB did not start; see $DB_DIR/error.log" >&2; tail -20 "$DB_DIR/error.log" >&2; exit 1; }
    echo "MariaDB started on 127.0.0.1:$DB_PORT (data in $DB_DIR)"
  fi
  client <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
CREATE USER IF NOT EXISTS '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'localhost';
GRANT ALL PRIVILEGES ON \`${DB_NAME}_%\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`${DB_NAME}_%\`.* TO '$DB_USER'@'localhost';
GRANT CREATE ON *.* TO '$DB_USER'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

stop() {
  if running; then
    mariadb-admin --no-defaults --socket="$SOCK" -uroot shutdown 2>/dev/null || kill "$(cat "$PIDFILE")" 2>/dev/null || true
    for _ in $(seq 1 50); do running || break; sleep 0.2; done
    echo "MariaDB stopped"
  fi
  rm -f "$SOCK"
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  status) if running; then echo "running (pid $(cat "$PIDFILE"))"; else echo "stopped"; exit 1; fi ;;
  *) echo "usage: scripts/db.sh start|stop|status" >&2; exit 2 ;;
esac
