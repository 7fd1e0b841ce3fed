#!/usr/bin/env bash
# `npm start`: installs what is missing, then runs Rhotrace (database, mail stand-in, server).
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
source scripts/ensure-node-modules.sh
exec node_modules/.bin/tsx scripts/start.ts "$@"
