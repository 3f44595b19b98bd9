#!/usr/bin/env bash
# Installs what is missing and starts the whole product with demo data on http://127.0.0.1:${PORT:-3000}:
# PostgreSQL + PostGIS, the local SMTP capture server, the local payments fake, and the app.
# Ctrl-C stops everything it started (the database keeps running; `npm run db:stop` stops it).
set -euo pipefail
cd "$(dirname "$0")/../.."

export PORT=${PORT:-3000}
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:${DB_PORT:-54329}/browseline}
export SMTP_PORT=${SMTP_PORT:-1025}
export MAIL_CAPTURE_HTTP_PORT=${MAIL_CAPTURE_HTTP_PORT:-1081}
export PAYMENTS_FAKE_PORT=${PAYMENTS_FAKE_PORT:-12111}
export PUBLIC_URL=${PUBLIC_URL:-http://127.0.0.1:$PORT}
export PAYMENTS_WEBHOOK_URL=${PAYMENTS_WEBHOOK_URL:-http://127.0.0.1:$PORT/api/webhooks/payments}

step() { printf '\n\033[1m▸ %s\033[0m\n' "$*"; }

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  step "Installing npm packages"
  npm ci --no-audit --no-fund
fi

step "Starting PostgreSQL + PostGIS"
bash server/scripts/db.sh start dev

step "Migrating and seeding the demo data"
NODE_ENV=development node_modules/.bin/tsx server/scripts/seed-demo.ts

step "Building the web client"
node_modules/.bin/vite build --logLevel warn

pids=()
cleanup() {
  for pid in "${pids[@]}"; do kill "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
}
trap cleanup EXIT INT TERM

step "Starting the local SMTP capture server (SMTP $SMTP_PORT, reader $MAIL_CAPTURE_HTTP_PORT)"
node_modules/.bin/tsx server/scripts/smtp-capture.ts &
pids+=($!)

if [ -f server/scripts/payments-fake/main.ts ]; then
  step "Starting the local payments fake on $PAYMENTS_FAKE_PORT"
  node_modules/.bin/tsx server/scripts/payments-fake/main.ts &
  pids+=($!)
fi

step "Starting Browseline on http://127.0.0.1:$PORT"
cat <<MSG
  Demo accounts (password demo-browseline):
    owner@browseline.test · consultant@browseline.test · crew@browseline.test · client@browseline.test
MSG
# Production mode unless the captured-mail reader is asked for explicitly (DEV_MAIL_READER=true, development only).
if [ "${DEV_MAIL_READER:-}" = true ]; then server_env=development; else server_env=production; fi
NODE_ENV=${NODE_ENV:-$server_env} node_modules/.bin/tsx server/index.ts &
pids+=($!)
wait "${pids[-1]}"
