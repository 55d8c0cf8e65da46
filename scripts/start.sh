#!/usr/bin/env bash
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-system.sh
bash scripts/ensure-npm.sh
exec node --import tsx scripts/start.ts
