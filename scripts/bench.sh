#!/usr/bin/env bash
# npm run bench: speed, memory and optimality figures with their targets.
# Builds the product into .next-bench, serves it on 127.0.0.1:3900 against
# its own database (clockgraft_bench), runs scripts/bench/main.ts (solver,
# engine, bundle, capture, pages, api), prints the table and writes
# bench-results.json. Every part is bounded; the server stops on exit.
#   BENCH_SKIP_BUILD=1   reuse an existing .next-bench build
#   BENCH_ONLY=solver,engine   run only these parts (no server unless api/pages)
set -euo pipefail
source "$(dirname "$0")/common.sh"

install_node_modules
export BENCH_PORT=3900
export DATABASE_URL=postgres://postgres@127.0.0.1:${PGPORT:-54329}/clockgraft_bench
export NEXTAUTH_URL=http://127.0.0.1:$BENCH_PORT
export NEXTAUTH_SECRET=bench-secret-not-for-production-0000000000000
export SMTP_HOST=127.0.0.1 SMTP_PORT=$((BENCH_PORT + 1)) MAIL_HTTP_URL=http://127.0.0.1:$((BENCH_PORT + 2))
export MAIL_FROM="Clockgraft <clockgraft@localhost>"
export NEXT_DIST_DIR=.next-bench
export BENCH_BASE_URL=$NEXTAUTH_URL
export NODE_ENV=production

ONLY=${BENCH_ONLY:-}
needs_server=1
if [[ -n $ONLY && ! $ONLY =~ (api|pages|queue) ]]; then needs_server=0; fi

cleanup() {
  stop_bg bench-server
  stop_bg bench-mail
}
trap cleanup EXIT INT TERM

if ((needs_server)); then
  echo "== database clockgraft_bench"
  prepare_database --fresh >/dev/null
  if [[ ${BENCH_SKIP_BUILD:-} != 1 || ! -f $NEXT_DIST_DIR/BUILD_ID ]]; then
    echo "== production build into $NEXT_DIST_DIR (a few minutes on two cores)"
    mkdir -p .data/run && save_tsconfig
    npx next build >/tmp/clockgraft-bench-build.log 2>&1 || { restore_tsconfig; tail -50 /tmp/clockgraft-bench-build.log; exit 1; }
    restore_tsconfig
  fi
  stop_bg bench-server
  stop_bg bench-mail
  start_bg bench-mail npx tsx scripts/mail-catcher.ts --smtp "$SMTP_PORT" --http "$((BENCH_PORT + 2))"
  start_bg bench-server node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$BENCH_PORT"
  wait_for_url "$BENCH_BASE_URL/api/health" 240
fi

echo "== figures"
npx tsx scripts/bench/main.ts ${ONLY:+--only=$ONLY}
