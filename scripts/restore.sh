#!/usr/bin/env bash
# Restores a pg_dump archive into a fresh database (refuses to overwrite one
# that exists, so nothing is lost by a slip).
#   bash scripts/restore.sh file [database]
set -euo pipefail
source "$(dirname "$0")/common.sh"
PGBIN=$(bash scripts/pg.sh bin)
file=${1:?usage: scripts/restore.sh file [database]}
db=${2:-clockgraft_restored}
[[ -f $file ]] || { echo "no such backup file: $file" >&2; exit 2; }
[[ $db =~ ^[a-z_][a-z0-9_]*$ ]] || { echo "database name must be lower-case letters, digits, _" >&2; exit 2; }
if "$PGBIN/psql" -h 127.0.0.1 -p "${PGPORT:-54329}" -U postgres -tAc "select 1 from pg_database where datname='$db'" | grep -q 1; then
  echo "database $db exists; pick another name or drop it first" >&2
  exit 3
fi
"$PGBIN/createdb" -h 127.0.0.1 -p "${PGPORT:-54329}" -U postgres "$db"
"$PGBIN/pg_restore" -h 127.0.0.1 -p "${PGPORT:-54329}" -U postgres --no-owner --exit-on-error -d "$db" "$file"
echo "restored $file into database $db"
