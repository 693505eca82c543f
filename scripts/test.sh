#!/usr/bin/env bash
# One command that does all set-up and runs every test: type-check, lint,
# format check, unit and integration tests against a fresh PostgreSQL test
# database, then browser tests in Debian's chromium against a production build.
set -euo pipefail
source "$(dirname "$0")/common.sh"

install_node_modules
bash scripts/ensure-tools.sh

export DATABASE_URL=postgres://postgres@127.0.0.1:${PGPORT:-54329}/clockgraft_test
# Ports picked free at run time (scripts/free-ports.mjs) so that two runs can
# share a machine; TEST_PORT, TEST_SMTP_PORT, TEST_MAIL_HTTP_PORT given by the
# caller win (not SMTP_PORT: a sourced dev .env sets that for its own catcher).
read -r FREE_WEB FREE_SMTP FREE_HTTP < <(node scripts/free-ports.mjs 3)
export TEST_PORT=${TEST_PORT:-$FREE_WEB}
export SMTP_PORT=${TEST_SMTP_PORT:-$FREE_SMTP} MAIL_HTTP_PORT=${TEST_MAIL_HTTP_PORT:-$FREE_HTTP}
export NEXTAUTH_URL=http://127.0.0.1:$TEST_PORT
export TEST_BASE_URL=$NEXTAUTH_URL
export NEXTAUTH_SECRET=test-secret-not-for-production-000000000000
export SMTP_HOST=127.0.0.1 MAIL_HTTP_URL=http://127.0.0.1:$MAIL_HTTP_PORT
export MAIL_FROM="Clockgraft <clockgraft@localhost>"

echo "== type-check, lint, format"
npx tsc --noEmit -p .
npx eslint . --max-warnings=0
npx prettier --check . --log-level=warn

echo "== database"
prepare_database --fresh
npx tsx scripts/seed.ts

echo "== build and serve on $TEST_BASE_URL"
mkdir -p .data/run
npx next build >.data/run/test-build.log 2>&1 || { cat .data/run/test-build.log; exit 1; }
stop_bg test-server
stop_bg test-mail
stop_bg test-worker
start_bg test-mail npx tsx scripts/mail-catcher.ts --smtp "$SMTP_PORT" --http "$MAIL_HTTP_PORT"
# Generation and mail run as jobs: without a worker nothing is ever built or sent.
start_bg test-worker npx tsx scripts/worker.ts
start_bg test-server node node_modules/next/dist/bin/next start -p "$TEST_PORT"
trap 'stop_bg test-server; stop_bg test-mail; stop_bg test-worker' EXIT
wait_for_url "$TEST_BASE_URL/api/health"
wait_for_url "$MAIL_HTTP_URL/messages.json"
wait_for_log .data/run/test-worker.log "ready"

echo "== unit and integration tests"
npx vitest run
# STOP_AFTER=integration ends the run here (a quick check of the set-up).
if [[ ${STOP_AFTER:-} == integration ]]; then exit 0; fi

echo "== browser tests"
npx vitest run --config vitest.browser.config.mts

echo "== serial tests (PostgreSQL restart under load; server log checks, after everything else)"
SERVER_LOG=.data/run/test-server.log npx vitest run --config vitest.serial.config.mts

echo "== mutation sample (a few mutants per folder, seeded by the commit; scripts/mutation/run.sh --ci)"
bash scripts/mutation/run.sh --ci
