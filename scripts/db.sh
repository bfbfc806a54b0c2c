#!/usr/bin/env bash
# Private MariaDB for Windowsill: install (Debian), initialise, start, stop, reset.
#
#   bash scripts/db.sh start     install if missing, initialise if new, start (reuses a running one), provision
#   bash scripts/db.sh stop      clean shutdown
#   bash scripts/db.sh status    running or not
#   bash scripts/db.sh reset     stop, wipe the data directory, start again
#   bash scripts/db.sh recreate-test-db   drop and create the test database (used by npm test)
#   bash scripts/db.sh backup [FILE]      consistent dump of DB_NAME (gzip) into FILE [.data/backups/<db>-<time>.sql.gz]
#   bash scripts/db.sh restore FILE [--yes]   replace DB_NAME with a dump (asks first unless --yes)
#   (reset also asks first unless given --yes or DB_RESET_YES=1)
#
# Environment (defaults in brackets): DB_PORT [3307], DB_USER [windowsill],
# DB_PASSWORD [windowsill-dev], DB_NAME [windowsill], DB_TEST_NAME [windowsill_test],
# WINDOWSILL_DATA_DIR [<project>/.data]. The server binds to 127.0.0.1 only.
# Sizing (written to my.cnf on every start): DB_BUFFER_POOL_SIZE (e.g. 2G; default: DB_BUFFER_POOL_FRACTION
# [0.25] of the machine's RAM or of the cgroup memory limit, whichever is smaller, at least 128M),
# innodb redo log a quarter of the pool (64M–2G), DB_MAX_ALLOWED_PACKET [128M] for the server and for
# every client program (mariadb, mariadb-dump) alike.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_ROOT="${WINDOWSILL_DATA_DIR:-$ROOT/.data}"
PORT="${DB_PORT:-3307}"
APP_USER="${DB_USER:-windowsill}"
APP_PASSWORD="${DB_PASSWORD:-windowsill-dev}"
APP_DB="${DB_NAME:-windowsill}"
TEST_DB="${DB_TEST_NAME:-windowsill_test}"

DATADIR="$DATA_ROOT/mariadb"
RUNDIR="$DATA_ROOT/run"
CNF="$DATA_ROOT/my.cnf"
ERRLOG="$DATA_ROOT/mariadb.err"
PIDFILE="$RUNDIR/mariadbd.pid"
SOCKET="$RUNDIR/mariadbd.sock"
# Unix socket paths must stay below 108 bytes; fall back to a short per-project path.
if [ "${#SOCKET}" -ge 100 ]; then
  SOCKET="/tmp/windowsill-$(printf '%s' "$ROOT" | sha1sum | cut -c1-10).sock"
fi

say() { printf '[db] %s\n' "$*"; }
die() { printf '[db] ERROR: %s\n' "$*" >&2; exit 1; }

find_bin() { # first existing binary among the names given
  local n
  for n in "$@"; do
    if command -v "$n" >/dev/null 2>&1; then command -v "$n"; return 0; fi
    if [ -x "/usr/sbin/$n" ]; then echo "/usr/sbin/$n"; return 0; fi
    if [ -x "/usr/bin/$n" ]; then echo "/usr/bin/$n"; return 0; fi
  done
  return 1
}

ensure_installed() {
  if find_bin mariadbd >/dev/null && find_bin mariadb-install-db >/dev/null && find_bin mariadb-admin >/dev/null && find_bin mariadb >/dev/null; then
    return 0
  fi
  if [ "$(id -u)" -ne 0 ]; then
    die "MariaDB is not installed and this user is not root. Install it first, e.g. 'sudo apt-get install mariadb-server mariadb-client', then run this again."
  fi
  if ! command -v apt-get >/dev/null 2>&1; then
    die "MariaDB is not installed and apt-get is missing (not a Debian-like system). Install MariaDB server and client (10.11 or newer) with your package manager, then run this again."
  fi
  say "installing mariadb-server and mariadb-client from Debian (about a minute)…"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq || die "apt-get update failed; check the machine's package sources."
  apt-get install -y -qq mariadb-server mariadb-client >/dev/null || die "apt-get install mariadb-server mariadb-client failed."
  find_bin mariadbd >/dev/null || die "mariadbd still not found after installing."
}

# Bytes of RAM this server may plan for: MemTotal, or the cgroup limit when lower.
machine_ram_bytes() {
  local mem lim
  mem=$(( $(awk '/^MemTotal:/ {print $2}' /proc/meminfo 2>/dev/null || echo 1048576) * 1024 ))
  for f in /sys/fs/cgroup/memory.max /sys/fs/cgroup/memory/memory.limit_in_bytes; do
    if [ -r "$f" ]; then
      lim="$(cat "$f" 2>/dev/null || echo max)"
      if [[ "$lim" =~ ^[0-9]+$ ]] && [ "$lim" -gt 0 ] && [ "$lim" -lt "$mem" ]; then mem="$lim"; fi
    fi
  done
  echo "$mem"
}

# innodb_buffer_pool_size in MiB: DB_BUFFER_POOL_SIZE (K/M/G suffix) or a fraction of RAM, in 128 MiB steps.
buffer_pool_mb() {
  local v="${DB_BUFFER_POOL_SIZE:-}" frac="${DB_BUFFER_POOL_FRACTION:-0.25}" mb
  if [ -n "$v" ]; then
    case "$v" in
      *[gG]) mb=$(( ${v%[gG]} * 1024 )) ;;
      *[mM]) mb=${v%[mM]} ;;
      *[kK]) mb=$(( ${v%[kK]} / 1024 )) ;;
      *) [[ "$v" =~ ^[0-9]+$ ]] || die "DB_BUFFER_POOL_SIZE must be a size like 512M or 2G (got '$v')"; mb=$(( v / 1048576 )) ;;
    esac
  else
    [[ "$frac" =~ ^0?\.[0-9]+$|^1(\.0*)?$ ]] || die "DB_BUFFER_POOL_FRACTION must be a number between 0 and 1 (got '$frac')"
    mb=$(awk -v r="$(machine_ram_bytes)" -v f="$frac" 'BEGIN { printf "%d", r * f / 1048576 }')
  fi
  mb=$(( mb / 128 * 128 ))
  [ "$mb" -ge 128 ] || mb=128
  echo "$mb"
}

write_cnf() {
  mkdir -p "$DATA_ROOT" "$RUNDIR"
  local pool_mb log_mb packet="${DB_MAX_ALLOWED_PACKET:-128M}"
  [[ "$packet" =~ ^[0-9]+[KMG]?$ ]] || die "DB_MAX_ALLOWED_PACKET must be a size like 64M (got '$packet')"
  pool_mb="$(buffer_pool_mb)"
  log_mb=$(( pool_mb / 4 ))
  [ "$log_mb" -ge 64 ] || log_mb=64
  [ "$log_mb" -le 2048 ] || log_mb=2048
  cat > "$CNF" <<CNF
# Generated by scripts/db.sh: a private MariaDB for this project only.
[client]
port=$PORT
socket=$SOCKET
host=127.0.0.1

# only the programs that know the option (mariadb-admin would refuse it under [client])
[mysql]
max_allowed_packet=$packet

[mysqldump]
max_allowed_packet=$packet

[mysqld]
user=$(id -un)
datadir=$DATADIR
port=$PORT
socket=$SOCKET
pid-file=$PIDFILE
bind-address=127.0.0.1
skip-name-resolve
log-error=$ERRLOG
character-set-server=utf8mb4
collation-server=utf8mb4_unicode_ci
max_allowed_packet=$packet
# sized from the machine: DB_BUFFER_POOL_SIZE or DB_BUFFER_POOL_FRACTION of $(( $(machine_ram_bytes) / 1048576 )) MiB
innodb_buffer_pool_size=${pool_mb}M
innodb_log_file_size=${log_mb}M
skip-log-bin
CNF
}

server_pid() { # prints the pid when our mariadbd is alive (not a zombie)
  [ -f "$PIDFILE" ] || return 1
  local pid state
  pid="$(cat "$PIDFILE" 2>/dev/null || true)"
  [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null || return 1
  state="$(awk '{print $3}' "/proc/$pid/stat" 2>/dev/null || echo Z)"
  [ "$state" != "Z" ] || return 1
  echo "$pid"
}

ping_db() { "$(find_bin mariadb-admin)" --defaults-file="$CNF" --protocol=socket -uroot ping >/dev/null 2>&1; }

port_taken() { (exec 3<>"/dev/tcp/127.0.0.1/$PORT") 2>/dev/null; }

init_datadir() {
  [ -d "$DATADIR/mysql" ] && return 0
  say "initialising a private data directory in $DATADIR"
  rm -rf "$DATADIR"
  mkdir -p "$DATADIR"
  if ! "$(find_bin mariadb-install-db)" --defaults-file="$CNF" --auth-root-authentication-method=normal \
      --skip-test-db --datadir="$DATADIR" >"$DATA_ROOT/install-db.log" 2>&1; then
    cat "$DATA_ROOT/install-db.log" >&2 || true
    rm -rf "$DATADIR"   # never leave a half-initialised data directory behind
    die "mariadb-install-db failed (log above); the data directory was removed."
  fi
}

start_server() {
  local pid
  if pid="$(server_pid)" && ping_db; then
    say "MariaDB already running (pid $pid) on 127.0.0.1:$PORT"
    return 0
  fi
  if pid="$(server_pid)"; then
    # Alive but not answering yet (still starting or recovering): wait for it, never start a second one.
    say "MariaDB (pid $pid) is starting; waiting"
  else
    if port_taken; then
      die "port $PORT on 127.0.0.1 is taken by another program. Stop it or choose another port, e.g. DB_PORT=$(( PORT + 10 )) npm start"
    fi
    rm -f "$PIDFILE" "$SOCKET"
    : > "$ERRLOG"
    setsid "$(find_bin mariadbd)" --defaults-file="$CNF" >>"$ERRLOG" 2>&1 < /dev/null &
    pid=$!
    say "starting mariadbd (pid $pid) on 127.0.0.1:$PORT"
  fi
  local i
  for i in $(seq 1 240); do
    if ping_db; then say "MariaDB is ready"; return 0; fi
    if ! kill -0 "$pid" 2>/dev/null || [ "$(awk '{print $3}' "/proc/$pid/stat" 2>/dev/null || echo Z)" = "Z" ]; then
      echo "----- $ERRLOG (last 30 lines) -----" >&2
      tail -n 30 "$ERRLOG" >&2 || true
      die "mariadbd exited during start-up (see the log above)."
    fi
    sleep 0.25
  done
  tail -n 30 "$ERRLOG" >&2 || true
  die "MariaDB did not answer within 60 s."
}

sql_root() { "$(find_bin mariadb)" --defaults-file="$CNF" --protocol=socket -uroot "$@"; }

provision() {
  local pw="${APP_PASSWORD//\'/\'\'}"
  sql_root <<SQL
CREATE DATABASE IF NOT EXISTS \`$APP_DB\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE DATABASE IF NOT EXISTS \`$TEST_DB\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$APP_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
CREATE USER IF NOT EXISTS '$APP_USER'@'localhost' IDENTIFIED BY '$pw';
ALTER USER '$APP_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
ALTER USER '$APP_USER'@'localhost' IDENTIFIED BY '$pw';
GRANT ALL PRIVILEGES ON \`$APP_DB\`.* TO '$APP_USER'@'127.0.0.1', '$APP_USER'@'localhost';
GRANT ALL PRIVILEGES ON \`$TEST_DB\`.* TO '$APP_USER'@'127.0.0.1', '$APP_USER'@'localhost';
-- extra scratch databases for parallel test runs: ${TEST_DB}_<name>
GRANT ALL PRIVILEGES ON \`${TEST_DB}\\_%\`.* TO '$APP_USER'@'127.0.0.1', '$APP_USER'@'localhost';
FLUSH PRIVILEGES;
SQL
  say "databases '$APP_DB' and '$TEST_DB' and user '$APP_USER' ready"
}

stop_server() {
  local pid i
  if ! pid="$(server_pid)"; then say "MariaDB is not running"; rm -f "$PIDFILE"; return 0; fi
  say "stopping MariaDB (pid $pid)"
  "$(find_bin mariadb-admin)" --defaults-file="$CNF" --protocol=socket -uroot shutdown >/dev/null 2>&1 || kill -TERM "$pid" 2>/dev/null || true
  for i in $(seq 1 120); do
    kill -0 "$pid" 2>/dev/null || { say "stopped"; return 0; }
    sleep 0.25
  done
  kill -KILL "$pid" 2>/dev/null || true
  say "killed after 30 s"
}

# Dumps and restores use the server's max_allowed_packet on the client side too (a large row must fit in one packet).
DUMP_PACKET="${DB_MAX_ALLOWED_PACKET:-128M}"

confirm() { # confirm "question" "$@" — true when --yes is among the arguments, DB_RESET_YES=1, or the user types yes
  local q="$1"; shift
  local a
  for a in "$@"; do [ "$a" = "--yes" ] || [ "$a" = "-y" ] && return 0; done
  [ "${DB_RESET_YES:-}" = "1" ] && return 0
  if [ ! -t 0 ]; then die "$q — refusing without confirmation (no terminal). Pass --yes to go ahead."; fi
  local reply
  read -r -p "[db] $q Type 'yes' to go ahead: " reply
  [ "$reply" = "yes" ] || die "cancelled; nothing was changed."
}

backup_db() {
  local out="${1:-}"
  if [ -z "$out" ]; then
    mkdir -p "$DATA_ROOT/backups"
    out="$DATA_ROOT/backups/${APP_DB}-$(date -u +%Y%m%dT%H%M%SZ).sql.gz"
  fi
  local tmp="$out.partial"
  say "dumping database '$APP_DB' to $out"
  # --single-transaction: a consistent snapshot of InnoDB tables without locking writers out.
  "$(find_bin mariadb-dump mysqldump)" --defaults-file="$CNF" --protocol=socket -uroot \
    --single-transaction --quick --hex-blob --routines --triggers --events \
    --max-allowed-packet="$DUMP_PACKET" --default-character-set=utf8mb4 \
    --databases "$APP_DB" | gzip -c > "$tmp" || { rm -f "$tmp"; die "mariadb-dump failed; no backup was written."; }
  mv "$tmp" "$out"
  say "backup written: $out ($(du -h "$out" | cut -f1))"
}

restore_db() {
  local file="${1:-}"
  [ -n "$file" ] || die "usage: npm run db:restore -- FILE [--yes]"
  [ -f "$file" ] || die "no such backup file: $file"
  shift
  confirm "Restoring replaces every table of database '$APP_DB' with the contents of $file." "$@"
  local reader=(cat "$file")
  case "$file" in *.gz) reader=(gzip -dc "$file") ;; esac
  say "restoring '$APP_DB' from $file"
  sql_root -e "CREATE DATABASE IF NOT EXISTS \`$APP_DB\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
  # The dump names its source database; restore into APP_DB whatever it was called.
  "${reader[@]}" | sed -E '/^(CREATE DATABASE|USE) /d' | \
    "$(find_bin mariadb)" --defaults-file="$CNF" --protocol=socket -uroot --max-allowed-packet="$DUMP_PACKET" \
      --default-character-set=utf8mb4 "$APP_DB" || die "restore failed (the database may be partly restored; restore again or from another backup)."
  say "restored '$APP_DB' from $file"
}

case "${1:-start}" in
  start)
    ensure_installed; write_cnf; init_datadir; start_server; provision ;;
  stop)
    [ -f "$CNF" ] || { say "nothing to stop"; exit 0; }
    stop_server ;;
  config)
    # print the my.cnf this environment would write (nothing is started or changed)
    CNF="$(mktemp)"; write_cnf; cat "$CNF"; rm -f "$CNF" ;;
  status)
    if [ -f "$CNF" ] && pid="$(server_pid)" && ping_db; then say "running (pid $pid) on 127.0.0.1:$PORT"; else say "not running"; exit 3; fi ;;
  reset)
    shift || true
    confirm "This wipes every database of the private MariaDB in $DATADIR (all spectra, accounts and plans)." "$@"
    ensure_installed; write_cnf; stop_server; rm -rf "$DATADIR"; init_datadir; start_server; provision ;;
  recreate-test-db)
    [ -f "$CNF" ] || die "run 'bash scripts/db.sh start' first"
    sql_root -e "DROP DATABASE IF EXISTS \`$TEST_DB\`; CREATE DATABASE \`$TEST_DB\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
    provision ;;
  backup)
    [ -f "$CNF" ] && ping_db || die "MariaDB is not running: npm run db:up first"
    backup_db "${2:-}" ;;
  restore)
    [ -f "$CNF" ] && ping_db || die "MariaDB is not running: npm run db:up first"
    shift; restore_db "$@" ;;
  *)
    echo "usage: bash scripts/db.sh start|stop|status|config|reset [--yes]|recreate-test-db|backup [FILE]|restore FILE [--yes]" >&2; exit 2 ;;
esac
