# Sourced by start.sh and test.sh: `npm ci` when node_modules is missing or older than the lock file.
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "[setup] installing packages (npm ci)"
  npm ci --no-audit --no-fund
fi
