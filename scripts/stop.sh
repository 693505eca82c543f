#!/usr/bin/env bash
# Stops what `npm start` and `npm test` started: servers, mail catchers, PostgreSQL.
set -euo pipefail
source "$(dirname "$0")/common.sh"
for f in .data/run/*.pid; do
  [[ -e $f ]] && stop_bg "$(basename "$f" .pid)"
done
bash scripts/pg.sh stop
