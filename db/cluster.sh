#!/usr/bin/env bash
# A three-node MariaDB Galera cluster on 127.0.0.1 from Debian's mariadb-server and galera-4.
#   db/cluster.sh start | stop | status | env | kill N | restart N
# Honours CLUSTER_DIR (default db/.cluster), CLUSTER_BASE_PORT (default 3600), DB_NAME (rhotrace).
# Node i (1..3) listens for SQL on BASE+i-1, group communication on BASE+10+i-1, incremental state
# transfer on BASE+20+i-1 and full state transfer (rsync) on BASE+30+i-1.
# Run as root, the servers run as the `mysql` system user (the rsync state transfer fails as
# root); run as another user, they run as that user.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
CLUSTER_DIR="${CLUSTER_DIR:-$ROOT/db/.cluster}"
mkdir -p "$CLUSTER_DIR"
CLUSTER_DIR="$(cd "$CLUSTER_DIR" && pwd)"
BASE="${CLUSTER_BASE_PORT:-3600}"
DB_NAME="${DB_NAME:-rhotrace}"
DB_USER="${DB_USER:-rhotrace}"
NAME="rhotrace-$BASE"
PROVIDER=/usr/lib/galera/libgalera_smm.so
PASS_FILE="$CLUSTER_DIR/db-password"
PATH="$PATH:/usr/sbin:/usr/local/sbin:/sbin"
NODES=(1 2 3)

log() { printf '[cluster] %s\n' "$*" >&2; }
die() { printf '[cluster] error: %s\n' "$*" >&2; exit 1; }

sql_port() { echo $((BASE + $1 - 1)); }
gcomm_port() { echo $((BASE + 10 + $1 - 1)); }
ist_port() { echo $((BASE + 20 + $1 - 1)); }
sst_port() { echo $((BASE + 30 + $1 - 1)); }
node_dir() { echo "$CLUSTER_DIR/node$1"; }
sock() { echo "$CLUSTER_DIR/node$1.sock"; }
pid_file() { echo "$CLUSTER_DIR/node$1.pid"; }
err_log() { echo "$CLUSTER_DIR/node$1.err"; }

run_user() { if [ "$(id -u)" = "0" ]; then echo mysql; else id -un; fi; }

ensure_packages() {
  if command -v mariadbd >/dev/null 2>&1 && [ -f "$PROVIDER" ] && command -v rsync >/dev/null 2>&1; then
    return
  fi
  if [ "$(id -u)" = "0" ]; then
    log "installing Debian's mariadb-server, galera-4 and rsync"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >&2
    apt-get install -y -qq mariadb-server mariadb-client galera-4 rsync >&2
  else
    die "the cluster needs Debian's mariadb-server, galera-4 and rsync packages: install them as
     root (sudo apt-get install -y mariadb-server galera-4 rsync) or run this command once as root"
  fi
}

admin() { mariadb-admin --no-defaults --socket="$(sock "$1")" -uroot "${@:2}"; }
sql() { mariadb --no-defaults --socket="$(sock "$1")" -uroot "${@:2}"; }
is_up() { [ -S "$(sock "$1")" ] && admin "$1" --connect-timeout=2 ping >/dev/null 2>&1; }

node_pid() {
  local f; f="$(pid_file "$1")"
  [ -f "$f" ] || f="$CLUSTER_DIR/node$1.launched"
  [ -f "$f" ] || return 1
  local pid; pid="$(cat "$f" 2>/dev/null || true)"
  [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null && grep -q mariadbd "/proc/$pid/cmdline" 2>/dev/null \
    && echo "$pid"
}

status_of() { sql "$1" -N -e "SHOW STATUS LIKE '$2'" 2>/dev/null | awk '{print $2}'; }

password() {
  if [ ! -s "$PASS_FILE" ]; then
    (umask 077; head -c 24 /dev/urandom | od -An -tx1 | tr -d ' \n' > "$PASS_FILE")
  fi
  cat "$PASS_FILE"
}

addresses() {
  local out="" i
  for i in "${NODES[@]}"; do out="$out${out:+,}127.0.0.1:$(gcomm_port "$i")"; done
  echo "$out"
}

# Starts node $1; a second argument `new` bootstraps a new cluster from it.
launch() {
  local i="$1" mode="${2:-}" extra=()
  [ "$mode" = new ] && extra=(--wsrep-new-cluster)
  rm -f "$(sock "$i")" "$(sock "$i").lock"
  : > "$(err_log "$i")"
  chown "$(run_user)" "$(err_log "$i")" 2>/dev/null || true
  setsid mariadbd --no-defaults --user="$(run_user)" --datadir="$(node_dir "$i")" \
    --port="$(sql_port "$i")" --bind-address=127.0.0.1 --socket="$(sock "$i")" \
    --pid-file="$(pid_file "$i")" --log-error="$(err_log "$i")" --skip-name-resolve \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --innodb-buffer-pool-size=128M --max-connections=300 --max-allowed-packet=256M \
    --binlog-format=ROW --default-storage-engine=InnoDB --innodb-autoinc-lock-mode=2 \
    --wsrep-on=ON --wsrep-provider="$PROVIDER" --wsrep-cluster-name="$NAME" \
    --wsrep-cluster-address="gcomm://$(addresses)" \
    --wsrep-node-address="127.0.0.1:$(gcomm_port "$i")" --wsrep-node-name="node$i" \
    --wsrep-sst-method=rsync --wsrep-sst-receive-address="127.0.0.1:$(sst_port "$i")" \
    --wsrep-provider-options="gmcast.listen_addr=tcp://127.0.0.1:$(gcomm_port "$i");ist.recv_addr=127.0.0.1:$(ist_port "$i");gcache.size=256M" \
    "${extra[@]}" < /dev/null > /dev/null 2>&1 &
  echo $! > "$CLUSTER_DIR/node$i.launched"
}

wait_synced() {
  local i="$1" t
  for t in $(seq 1 600); do
    if is_up "$i" && [ "$(status_of "$i" wsrep_local_state_comment)" = "Synced" ]; then return 0; fi
    if ! kill -0 "$(cat "$CLUSTER_DIR/node$i.launched" 2>/dev/null || echo 0)" 2>/dev/null; then
      tail -n 20 "$(err_log "$i")" >&2 || true
      die "node $i exited during start-up (log: $(err_log "$i"))"
    fi
    sleep 0.1
  done
  die "node $i was not synced within 60 s (log: $(err_log "$i"))"
}

provision() {
  local pw; pw="$(password)"
  sql 1 <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
GRANT ALL PRIVILEGES ON \`${DB_NAME}%\`.* TO '$DB_USER'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

write_env() {
  local hosts="" i
  for i in "${NODES[@]}"; do hosts="$hosts${hosts:+,}127.0.0.1:$(sql_port "$i")"; done
  (umask 077; cat > "$CLUSTER_DIR/db.env" <<ENV
DB_HOSTS=$hosts
DB_NAME=$DB_NAME
DB_USER=$DB_USER
DB_PASSWORD=$(password)
ENV
)
}

stop_node() {
  local i="$1" pid
  pid="$(node_pid "$i" || true)"
  if [ -z "$pid" ] && ! is_up "$i"; then return; fi
  admin "$i" shutdown >/dev/null 2>&1 || { [ -n "$pid" ] && kill -TERM "$pid" 2>/dev/null || true; }
  local t
  for t in $(seq 1 300); do
    if [ -z "$pid" ] || ! kill -0 "$pid" 2>/dev/null; then break; fi
    sleep 0.1
  done
  if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then kill -KILL "$pid" 2>/dev/null || true; fi
  rm -f "$(pid_file "$i")" "$(sock "$i")"
}

# The first start: node 1 is initialised and bootstrapped once, given the database and user, shut
# down cleanly and copied to the other nodes, so they join by incremental transfer, not a full one.
initialise() {
  local d1; d1="$(node_dir 1)"
  log "initialising node 1 in $d1"
  mkdir -p "$d1"
  mariadb-install-db --no-defaults --datadir="$d1" --user="$(run_user)" \
    --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve \
    > "$CLUSTER_DIR/install-db.log" 2>&1 || { cat "$CLUSTER_DIR/install-db.log" >&2; die "mariadb-install-db failed"; }
  chown -R "$(run_user)" "$CLUSTER_DIR"
  launch 1 new
  wait_synced 1
  provision
  stop_node 1
  local i
  for i in 2 3; do
    rm -rf "$(node_dir "$i")"
    cp -a "$d1" "$(node_dir "$i")"
    sed -i 's/^safe_to_bootstrap:.*/safe_to_bootstrap: 0/' "$(node_dir "$i")/grastate.dat"
  done
}

start() {
  ensure_packages
  local i any=0
  for i in "${NODES[@]}"; do if is_up "$i"; then any=1; fi; done
  if [ "$any" = 1 ]; then
    log "already running (data in $CLUSTER_DIR)"
    write_env
    return
  fi
  [ "$(run_user)" = mysql ] && chown mysql "$CLUSTER_DIR"
  [ -d "$(node_dir 1)/mysql" ] || initialise
  log "bootstrapping node 1 on 127.0.0.1:$(sql_port 1)"
  # a clean stop leaves every node's safe_to_bootstrap at its own value; node 1 is the one we trust
  sed -i 's/^safe_to_bootstrap:.*/safe_to_bootstrap: 1/' "$(node_dir 1)/grastate.dat" 2>/dev/null || true
  launch 1 new
  wait_synced 1
  for i in 2 3; do
    log "starting node $i on 127.0.0.1:$(sql_port "$i")"
    launch "$i"
  done
  for i in 2 3; do wait_synced "$i"; done
  provision
  write_env
  log "up: $(status_of 1 wsrep_cluster_size) nodes synced (env in $CLUSTER_DIR/db.env)"
}

stop() {
  local i
  for i in 3 2 1; do stop_node "$i"; done
  log "stopped"
}

status() {
  local i down=0
  for i in "${NODES[@]}"; do
    if is_up "$i"; then
      printf 'node%s 127.0.0.1:%s cluster_size=%s state=%s\n' "$i" "$(sql_port "$i")" \
        "$(status_of "$i" wsrep_cluster_size)" "$(status_of "$i" wsrep_local_state_comment)"
    else
      printf 'node%s 127.0.0.1:%s down\n' "$i" "$(sql_port "$i")"
      down=1
    fi
  done
  return "$down"
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) status ;;
  env) write_env; cat "$CLUSTER_DIR/db.env" ;;
  kill) pid="$(node_pid "${2:?node number}")" && kill -KILL "$pid" && log "node $2 killed" ;;
  restart) launch "${2:?node number}"; wait_synced "$2"; log "node $2 rejoined" ;;
  *) echo "usage: db/cluster.sh start|stop|status|env|kill N|restart N" >&2; exit 2 ;;
esac
