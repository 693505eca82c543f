#!/usr/bin/env bash
# Stops what `npm start` and `npm test` started: servers, mail catchers, PostgreSQL.
set -euo pipefail
source "$(dirname "$0")/common.sh"
for f in .data/run/*.pid; do
  [[ -e $f ]] && stop_bg "$(basename "$f" .pid)"
done
pkill -f "$ROOT/node_modules/next/dist/bin/next start" 2>/dev/null || true
pkill -f "next/dist/bin/next start -p 3000" 2>/dev/null || true
bash scripts/pg.sh stop
