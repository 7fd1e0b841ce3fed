#!/usr/bin/env bash
# `npm test`: installs what is missing, then runs every suite against a throwaway MariaDB.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
source scripts/ensure-node-modules.sh
exec node_modules/.bin/tsx scripts/test.ts "$@"
