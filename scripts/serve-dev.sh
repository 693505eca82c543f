#!/usr/bin/env bash
# A private development server for one contributor or test loop, beside others:
#   bash scripts/serve-dev.sh NAME PORT [--fresh]
# Own database (clockgraft_NAME, migrated and seeded), own build folder
# (.next-NAME), own mail catcher (SMTP PORT+1, HTTP PORT+2). Writes the
# variables the tests need to .data/run/NAME.env:
#   set -a; . .data/run/NAME.env; set +a; npx vitest run tests/integration/...
# Stop with: bash scripts/serve-dev.sh NAME PORT --stop
set -euo pipefail
source "$(dirname "$0")/common.sh"
NAME=$1 PORT=$2
[[ $NAME =~ ^[a-z0-9_]+$ ]] || { echo "NAME must be lower-case letters, digits, _" >&2; exit 2; }
if [[ ${3:-} == --stop ]]; then
  stop_bg "dev-$NAME"
  stop_bg "dev-mail-$NAME"
  stop_bg "dev-worker-$NAME"
  exit 0
fi
mkdir -p .data/run
cat >".data/run/$NAME.env" <<ENV
DATABASE_URL=postgres://postgres@127.0.0.1:${PGPORT:-54329}/clockgraft_$NAME
NEXTAUTH_URL=http://127.0.0.1:$PORT
TEST_BASE_URL=http://127.0.0.1:$PORT
NEXTAUTH_SECRET=dev-secret-$NAME-0000000000000000000000000000
SMTP_HOST=127.0.0.1
SMTP_PORT=$((PORT + 1))
MAIL_HTTP_URL=http://127.0.0.1:$((PORT + 2))
NEXT_DIST_DIR=.next-$NAME
ENV
set -a && source ".data/run/$NAME.env" && set +a
prepare_database ${3:-}
npx tsx scripts/seed.ts
stop_bg "dev-$NAME"
start_bg "dev-mail-$NAME" npx tsx scripts/mail-catcher.ts --smtp "$SMTP_PORT" --http "$((PORT + 2))"
save_tsconfig
stop_bg "dev-worker-$NAME"
start_bg "dev-worker-$NAME" npx tsx scripts/worker.ts # generation and mail run as jobs
start_bg "dev-$NAME" node node_modules/next/dist/bin/next dev -p "$PORT"
wait_for_url "$TEST_BASE_URL/api/health" 240
wait_for_log ".data/run/dev-worker-$NAME.log" "ready"
restore_tsconfig
echo "dev server $NAME on $TEST_BASE_URL (log .data/run/dev-$NAME.log)"
