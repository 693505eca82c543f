#!/usr/bin/env bash
# PostgreSQL from Debian's packages on 127.0.0.1 with a private data directory
# and socket. Idempotent: `start` on a running server does nothing.
#   scripts/pg.sh start | stop | status | dir
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
PGPORT=${PGPORT:-54329}

pg_root() {
  # The server runs as the postgres user, which must be able to reach its data
  # directory. Under the project when it can; otherwise a folder of our own in
  # /var/tmp named after the project path (a clone under a root-only folder).
  local dir="$ROOT/.data/pg"
  mkdir -p "$ROOT/.data"
  if id postgres >/dev/null 2>&1 && runuser -u postgres -- test -x "$ROOT/.data" 2>/dev/null; then
    echo "$dir"
  else
    echo "/var/tmp/clockgraft-pg-$(echo -n "$ROOT" | sha256sum | cut -c1-12)"
  fi
}

ensure_installed() {
  if ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then
    echo "Installing PostgreSQL from Debian's packages..."
    (apt-get update -qq || true) >/dev/null
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq -o DPkg::Lock::Timeout=600 postgresql >/dev/null
  fi
  PGBIN=$(dirname "$(ls -d /usr/lib/postgresql/*/bin/initdb | sort -V | tail -1)")
}

is_running() {
  [[ -f "$1/data/postmaster.pid" ]] && runuser -u postgres -- "$PGBIN/pg_ctl" -D "$1/data" status >/dev/null 2>&1
}

cmd=${1:-status}
ensure_installed
PGROOT=$(pg_root)
case "$cmd" in
  start)
    if is_running "$PGROOT"; then exit 0; fi
    install -d -o postgres -g postgres -m 700 "$PGROOT"
    if [[ ! -f "$PGROOT/data/PG_VERSION" ]]; then
      runuser -u postgres -- "$PGBIN/initdb" -D "$PGROOT/data" -U postgres -E UTF8 \
        --locale=C.UTF-8 --auth-local=trust --auth-host=trust >/dev/null
    fi
    runuser -u postgres -- "$PGBIN/pg_ctl" -D "$PGROOT/data" -l "$PGROOT/server.log" -w \
      -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $PGROOT" start >/dev/null
    echo "PostgreSQL running on 127.0.0.1:$PGPORT (data in $PGROOT/data)"
    ;;
  stop)
    if is_running "$PGROOT"; then
      runuser -u postgres -- "$PGBIN/pg_ctl" -D "$PGROOT/data" -m fast -w stop >/dev/null
      echo "PostgreSQL stopped"
    fi
    ;;
  restart)
    runuser -u postgres -- "$PGBIN/pg_ctl" -D "$PGROOT/data" -m fast -w restart \
      -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $PGROOT" >/dev/null
    ;;
  status) is_running "$PGROOT" && echo running || { echo stopped; exit 3; } ;;
  dir) echo "$PGROOT" ;;
  bin) echo "$PGBIN" ;;
  *) echo "usage: scripts/pg.sh start|stop|restart|status|dir|bin" >&2; exit 2 ;;
esac
