#!/usr/bin/env bash
# Writes .env.local with a generated development secret on first start (never
# committed), then prints nothing. Existing values are kept.
set -euo pipefail
cd "$(dirname "$0")/.."
if [[ ! -f .env.local ]]; then
  secret=$(node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))')
  cat > .env.local <<ENV
DATABASE_URL=postgres://postgres@127.0.0.1:${PGPORT:-54329}/clockgraft
NEXTAUTH_URL=http://localhost:3000
NEXTAUTH_SECRET=$secret
SMTP_HOST=127.0.0.1
SMTP_PORT=1025
MAIL_FROM="Clockgraft <clockgraft@localhost>"
ENV
  chmod 600 .env.local
fi
