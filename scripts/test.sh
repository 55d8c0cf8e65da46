#!/usr/bin/env bash
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-system.sh --browser
bash scripts/ensure-npm.sh
exec node --import tsx scripts/test.ts "$@"
