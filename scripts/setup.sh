#!/usr/bin/env bash
# Installs what a fresh machine lacks: Debian packages (MariaDB, and Chromium and poppler-utils for browser tests)
# and the npm dependencies from the committed lockfile. Safe to run again; it skips what is there.
# Usage: scripts/setup.sh [--with-browser]
set -euo pipefail
cd "$(dirname "$0")/.."

need=()
{ [ -x /usr/sbin/mariadbd ] && command -v mariadb-admin >/dev/null && command -v mariadb-install-db >/dev/null; } || need+=(mariadb-server mariadb-client)
if [ "${1:-}" = "--with-browser" ]; then
  [ -x /usr/bin/chromium ] || need+=(chromium)
  # pdftoppm renders report pages to images for the browser tests' screenshots.
  command -v pdftoppm >/dev/null || need+=(poppler-utils)
fi
if [ ${#need[@]} -gt 0 ]; then
  echo "Installing from Debian's packages: ${need[*]}"
  apt-get update -qq >/dev/null
  # One apt-get call: parallel calls would clash on the dpkg lock.
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${need[@]}" >/dev/null
fi

stamp=node_modules/.lagline-lock.sha256
want=$(sha256sum package-lock.json | cut -d' ' -f1)
if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
  echo "Installing npm dependencies from package-lock.json…"
  npm ci --no-audit --no-fund --loglevel=error
  echo "$want" > "$stamp"
fi
