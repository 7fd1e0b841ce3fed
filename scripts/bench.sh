#!/usr/bin/env bash
# `npm run bench`: installs what is missing (as `npm test` does), then runs every benchmark.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
source scripts/ensure-node-modules.sh
exec node_modules/.bin/tsx scripts/bench.ts "$@"
