#!/usr/bin/env bash
# Installs npm packages when node_modules is missing or older than the lock file.
set -euo pipefail
if [[ ! -f node_modules/.package-lock.json || package-lock.json -nt node_modules/.package-lock.json ]]; then
  echo "Installing npm packages…"
  npm ci --no-audit --no-fund
fi
