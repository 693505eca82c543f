#!/usr/bin/env bash
# One command from a fresh Debian machine with Node.js: installs what is
# missing, starts PostgreSQL and the mail catcher on loopback, migrates, seeds
# the demo data, builds and serves the product on http://localhost:3000.
set -euo pipefail
source "$(dirname "$0")/common.sh"

install_node_modules
apt_ensure postgresql curl "${FIRMWARE_TOOLCHAINS[@]}"
bash scripts/env-file.sh
set -a && source .env.local && set +a
prepare_database
npx tsx scripts/seed.ts
start_bg mail-catcher npx tsx scripts/mail-catcher.ts --smtp "${SMTP_PORT:-1025}" --http 1080
npx next build
start_bg worker npx tsx scripts/worker.ts # generation and mail run as jobs; `npm run worker` adds more
echo "Clockgraft: http://localhost:3000  (mail: http://127.0.0.1:1080)  stop with: npm run stop"
mkdir -p .data/run && echo $$ >.data/run/server.pid # exec keeps this pid; npm run stop uses it
exec node node_modules/next/dist/bin/next start -p 3000
