#!/usr/bin/env bash
# Installs the npm dependencies from the lock file when they are missing or older than the lock.
set -euo pipefail
cd "$(dirname "$0")/.."
if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing dependencies (npm ci)…"
  npm ci --no-audit --no-fund --loglevel=error
fi
