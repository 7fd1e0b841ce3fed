#!/usr/bin/env bash
# Runs Rhotrace's private MariaDB server from Debian's mariadb-server package, bound to 127.0.0.1.
#   db/db.sh start | stop | status | backup [DIR] | restore FILE | env
# Honours DB_PORT (default 3307), DATA_DIR (default db/.data) and DB_NAME (default rhotrace).
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_DIR="${DATA_DIR:-$ROOT/db/.data}"
mkdir -p "$DATA_DIR"
DATA_DIR="$(cd "$DATA_DIR" && pwd)"
DB_PORT="${DB_PORT:-3307}"
DB_NAME="${DB_NAME:-rhotrace}"
DB_USER="${DB_USER:-rhotrace}"
DB_DIR="$DATA_DIR/mariadb"
SOCK="$DATA_DIR/mariadb.sock"
PID_FILE="$DATA_DIR/mariadb.pid"
ERR_LOG="$DATA_DIR/mariadb.err"
PASS_FILE="$DATA_DIR/db-password"
PATH="$PATH:/usr/sbin:/usr/local/sbin:/sbin"

log() { printf '[db] %s\n' "$*" >&2; }
die() { printf '[db] error: %s\n' "$*" >&2; exit 1; }

ensure_server_package() {
  if command -v mariadbd >/dev/null 2>&1 && command -v mariadb-install-db >/dev/null 2>&1; then
    return
  fi
  if [ "$(id -u)" = "0" ]; then
    log "mariadbd not found: installing Debian's mariadb-server package (about 15 s)"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >&2
    apt-get install -y -qq mariadb-server mariadb-client >&2
  else
    die "mariadbd was not found. Install Debian's 'mariadb-server' package as root
     (sudo apt-get install -y mariadb-server) or run this command once as root; Rhotrace then
     runs its own private server in $DATA_DIR and never touches the system one."
  fi
}

user_flag() { if [ "$(id -u)" = "0" ]; then echo "--user=root"; else echo "--user=$(id -un)"; fi; }

admin() { mariadb-admin --no-defaults --socket="$SOCK" -uroot "$@"; }
sql() { mariadb --no-defaults --socket="$SOCK" -uroot "$@"; }

is_up() { [ -S "$SOCK" ] && admin --connect-timeout=2 ping >/dev/null 2>&1; }

server_pid() {
  [ -f "$PID_FILE" ] || return 1
  local pid; pid="$(cat "$PID_FILE" 2>/dev/null || true)"
  [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null && grep -q mariadbd "/proc/$pid/cmdline" 2>/dev/null \
    && echo "$pid"
}

password() {
  if [ ! -s "$PASS_FILE" ]; then
    (umask 077; head -c 24 /dev/urandom | od -An -tx1 | tr -d ' \n' > "$PASS_FILE")
  fi
  cat "$PASS_FILE"
}

write_env() {
  (umask 077; cat > "$DATA_DIR/db.env" <<ENV
DB_HOST=127.0.0.1
DB_PORT=$DB_PORT
DB_NAME=$DB_NAME
DB_USER=$DB_USER
DB_PASSWORD=$(password)
ENV
)
}

start() {
  ensure_server_package
  if is_up; then
    log "already running on 127.0.0.1:$(cat "$DATA_DIR/mariadb.port" 2>/dev/null || echo "$DB_PORT") (data in $DATA_DIR)"
    [ -f "$DATA_DIR/mariadb.port" ] && DB_PORT="$(cat "$DATA_DIR/mariadb.port")"
    provision
    write_env
    return
  fi
  if [ -f "$PID_FILE" ] && ! server_pid >/dev/null; then
    log "removing a stale pid file left by an earlier crash"
    rm -f "$PID_FILE"
  fi
  if server_pid >/dev/null; then
    die "a mariadbd process ($(server_pid)) holds $DATA_DIR but does not answer; stop it first"
  fi
  rm -f "$SOCK" "$SOCK.lock"
  if [ ! -d "$DB_DIR/mysql" ]; then
    log "initialising a new data directory in $DB_DIR"
    mkdir -p "$DB_DIR"
    mariadb-install-db --no-defaults --datadir="$DB_DIR" "$(user_flag)" \
      --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve \
      > "$DATA_DIR/install-db.log" 2>&1 || { cat "$DATA_DIR/install-db.log" >&2; die "mariadb-install-db failed"; }
  fi
  log "starting MariaDB on 127.0.0.1:$DB_PORT"
  : > "$ERR_LOG"
  setsid mariadbd --no-defaults "$(user_flag)" --datadir="$DB_DIR" --port="$DB_PORT" \
    --bind-address=127.0.0.1 --socket="$SOCK" --pid-file="$PID_FILE" --log-error="$ERR_LOG" \
    --skip-name-resolve --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --innodb-buffer-pool-size=256M --max-connections=300 --max-allowed-packet=256M \
    --innodb-flush-log-at-trx-commit=1 < /dev/null > /dev/null 2>&1 &
  local i
  for i in $(seq 1 300); do
    if is_up; then break; fi
    if ! kill -0 $! 2>/dev/null; then
      tail -n 20 "$ERR_LOG" >&2 || true
      if grep -q "Address already in use" "$ERR_LOG" 2>/dev/null; then
        die "port $DB_PORT is already in use: set DB_PORT to a free port"
      fi
      die "mariadbd exited during start-up (log: $ERR_LOG)"
    fi
    sleep 0.1
  done
  is_up || die "MariaDB did not answer within 30 s (log: $ERR_LOG)"
  echo "$DB_PORT" > "$DATA_DIR/mariadb.port"
  provision
  write_env
  log "up (data in $DATA_DIR)"
}

provision() {
  local pw; pw="$(password)"
  sql <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
GRANT ALL PRIVILEGES ON \`${DB_NAME}%\`.* TO '$DB_USER'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

stop() {
  if ! server_pid >/dev/null && ! is_up; then
    rm -f "$PID_FILE" "$SOCK"
    log "not running"
    return
  fi
  local pid; pid="$(server_pid || true)"
  log "stopping MariaDB"
  admin shutdown >/dev/null 2>&1 || { [ -n "$pid" ] && kill -TERM "$pid" 2>/dev/null || true; }
  local i
  for i in $(seq 1 300); do
    if [ -z "$pid" ] || ! kill -0 "$pid" 2>/dev/null; then break; fi
    sleep 0.1
  done
  if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then
    log "MariaDB did not stop within 30 s; killing it"
    kill -KILL "$pid" 2>/dev/null || true
  fi
  rm -f "$PID_FILE" "$SOCK"
  log "stopped"
}

status() {
  if is_up; then echo "up on 127.0.0.1:$(cat "$DATA_DIR/mariadb.port" 2>/dev/null || echo "$DB_PORT")"; else echo "down"; return 1; fi
}

backup() {
  is_up || die "MariaDB is not running (npm run db:start)"
  local dir="${1:-${BACKUP_DIR:-$ROOT/db/backups}}"
  mkdir -p "$dir"
  local file; file="$dir/$DB_NAME-$(date -u +%Y%m%dT%H%M%SZ).sql"
  mariadb-dump --no-defaults --socket="$SOCK" -uroot --single-transaction --routines --triggers \
    --hex-blob --default-character-set=utf8mb4 --databases "$DB_NAME" > "$file.part"
  mv "$file.part" "$file"
  log "backup written"
  echo "$file"
}

restore() {
  local file="${1:-}"
  [ -n "$file" ] || die "usage: npm run db:restore FILE"
  [ -f "$file" ] || die "backup file not found: $file"
  is_up || die "MariaDB is not running (npm run db:start)"
  head -c 4096 "$file" | grep -q "MariaDB dump\|MySQL dump" || die "$file is not a mariadb-dump file"
  sql -e "DROP DATABASE IF EXISTS \`$DB_NAME\`; CREATE DATABASE \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
  sql --default-character-set=utf8mb4 "$DB_NAME" < "$file"
  provision
  log "restored $DB_NAME from $file"
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) status ;;
  backup) shift; backup "${1:-}" ;;
  restore) shift; restore "${1:-}" ;;
  env) write_env; cat "$DATA_DIR/db.env" ;;
  *) echo "usage: db/db.sh start|stop|status|backup [DIR]|restore FILE" >&2; exit 2 ;;
esac
