#!/usr/bin/env bash
# Starts the project's private MariaDB on 127.0.0.1 with its data inside the project (never the system
# service) and makes sure the dev and test databases and the app's user exist. Idempotent; concurrent callers
# are serialised by flock, and liveness is judged by ping, not by looking for a process.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

DATADIR="$TACTUS_STATE/mariadb"
RUNDIR="$TACTUS_STATE/run"
SOCK="$RUNDIR/mariadb.sock"
# A socket path over 107 characters aborts the server: fall back to a short path keyed by the project folder.
if [ ${#SOCK} -gt 100 ]; then SOCK="/tmp/tactus-$(echo "$ROOT" | sha1sum | cut -c1-12).sock"; fi
export TACTUS_DB_SOCKET="$SOCK"
mkdir -p "$RUNDIR"

# Debian's mariadb-server is the only source; install it when it is missing (also done by ensure-deps.sh).
if ! command -v mariadbd >/dev/null 2>&1 && [ ! -x /usr/sbin/mariadbd ]; then
  log "installing Debian's mariadb-server"
  SUDO=""; [ "$(id -u)" -eq 0 ] || SUDO="sudo"
  exec 8>/tmp/tactus-apt.lock; flock 8
  $SUDO apt-get update -qq && DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq mariadb-server >/dev/null
  exec 8>&-
fi
MARIADBD="$(command -v mariadbd || echo /usr/sbin/mariadbd)"
ping_db() { mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1; }

exec 9>"$RUNDIR/mariadb.lock"
flock 9

if ! ping_db; then
  if [ ! -d "$DATADIR/mysql" ]; then
    log "initialising MariaDB data in $DATADIR"
    rm -rf "$DATADIR"; mkdir -p "$DATADIR"
    mariadb-install-db --no-defaults --user="$(id -un)" --datadir="$DATADIR" \
      --auth-root-authentication-method=socket --skip-test-db >"$TACTUS_STATE/logs/mariadb-install.log" 2>&1
  fi
  log "starting MariaDB on 127.0.0.1:$TACTUS_DB_PORT"
  errlog="$TACTUS_STATE/logs/mariadb.err"
  seen=$( [ -f "$errlog" ] && wc -l <"$errlog" || echo 0 )
  # The daemon must not keep the lock (or any other inherited descriptor) open: close all but 0-2.
  (
    for fd in /proc/self/fd/*; do fd="${fd##*/}"; [ "$fd" -gt 2 ] && eval "exec $fd>&-" 2>/dev/null; done
    exec setsid "$MARIADBD" --no-defaults --user="$(id -un)" --datadir="$DATADIR" \
      --bind-address=127.0.0.1 --port="$TACTUS_DB_PORT" --socket="$SOCK" \
      --pid-file="$RUNDIR/mariadb.pid" --log-error="$TACTUS_STATE/logs/mariadb.err" \
      --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
      --innodb-buffer-pool-size=128M --max-connections=300 </dev/null >/dev/null 2>&1
  ) &
  for _ in $(seq 1 150); do ping_db && break; sleep 0.1; done
  if ! ping_db; then
    if tail -n +"$((seen + 1))" "$errlog" 2>/dev/null | grep -q "Address already in use"; then
      log "port $TACTUS_DB_PORT is taken by another server (another checkout's MariaDB?): stop it or set TACTUS_DB_PORT"
    else
      log "MariaDB did not start; see $TACTUS_STATE/logs/mariadb.err"
      tail -20 "$TACTUS_STATE/logs/mariadb.err" >&2 || true
    fi
    exit 1
  fi
fi

mariadb --no-defaults --socket="$SOCK" -uroot <<SQL
CREATE DATABASE IF NOT EXISTS tactus_dev CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE DATABASE IF NOT EXISTS tactus_test CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$TACTUS_DB_USER'@'127.0.0.1' IDENTIFIED BY '$TACTUS_DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`tactus\_%\`.* TO '$TACTUS_DB_USER'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
