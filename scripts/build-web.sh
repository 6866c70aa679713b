#!/usr/bin/env bash
# Exports the Expo web app to dist/ (static output), served by the API process.
set -euo pipefail
cd "$(dirname "$0")/.."
export CI=1 EXPO_OFFLINE=1 EXPO_NO_TELEMETRY=1
mkdir -p /tmp/metro-cache
npx expo export --platform web --output-dir dist >/tmp/lagline-export.log 2>&1 || {
  tail -40 /tmp/lagline-export.log >&2; echo "Web export failed (log: /tmp/lagline-export.log)" >&2; exit 1; }
echo "Web app exported to dist/"
