#!/usr/bin/env bash
# `npm start`: installs what is missing, then runs Rhotrace (database, mail stand-in, server).
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
source scripts/ensure-node-modules.sh
# node itself, not the tsx launcher: on Ctrl-C the launcher SIGKILLs a child that does not confirm
# the signal within 30 ms, which cut the shutdown short and left MariaDB running.
exec node --import tsx scripts/start.ts "$@"
