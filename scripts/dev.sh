#!/usr/bin/env bash
# `npm run dev`: the API with reload on change, and Vite with hot module reload proxied to it.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules
ensure_session_secret
if [ -z "${DATABASE_URL:-}" ]; then
  admin=$(bash scripts/pg.sh up dev)
  export DATABASE_URL=$(ensure_database rhomb "$admin")
fi
node_modules/.bin/tsx server/db/migrate.ts
node_modules/.bin/tsx server/db/seed.ts

export NODE_ENV=development HOST=127.0.0.1
export PORT=${PORT:-$(free_port 5180)}
export VITE_PORT=${VITE_PORT:-$(free_port 5173)}
export PUBLIC_URL=${PUBLIC_URL:-http://127.0.0.1:$VITE_PORT}
export RHOMB_STATIC_DIR=.rhomb/no-static
# Without SMTP_URL, mail is caught by a fake SMTP server inside the web process: see /dev/outbox.
export RHOMB_FAKE_SMTP=${RHOMB_FAKE_SMTP:-1}

node_modules/.bin/tsx watch --clear-screen=false server/index.ts &
api_pid=$!
trap 'kill $api_pid 2>/dev/null || true' EXIT INT TERM
say "API on http://127.0.0.1:$PORT; open the app at $PUBLIC_URL"
node_modules/.bin/vite
