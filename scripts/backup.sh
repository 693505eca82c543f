#!/usr/bin/env bash
# Writes a pg_dump archive (custom format) of the product database.
#   bash scripts/backup.sh [file] [database]
set -euo pipefail
source "$(dirname "$0")/common.sh"
PGBIN=$(bash scripts/pg.sh bin)
db=${2:-clockgraft}
out=${1:-.data/backups/$db-$(date -u +%Y%m%dT%H%M%SZ).dump}
mkdir -p "$(dirname "$out")"
"$PGBIN/pg_dump" -h 127.0.0.1 -p "${PGPORT:-54329}" -U postgres -Fc --no-owner -f "$out" "$db"
echo "backup written: $out"
