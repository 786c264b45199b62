#!/usr/bin/env bash
# `npm start`: everything from a fresh clone to a running Rhomb on http://127.0.0.1:5180.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules
ensure_session_secret

we_started_pg=0
if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/pg.sh status dev || we_started_pg=1
  admin=$(bash scripts/pg.sh up dev)
  export DATABASE_URL=$(ensure_database rhomb "$admin")
else
  say "using DATABASE_URL from the environment"
fi

node_modules/.bin/tsx server/db/migrate.ts
node_modules/.bin/tsx server/db/seed.ts
ensure_client_build

export NODE_ENV=${NODE_ENV:-production}
export HOST=${HOST:-127.0.0.1}
export PORT=${PORT:-$(free_port 5180)}
export COOKIE_SECURE=${COOKIE_SECURE:-auto}
export PUBLIC_URL=${PUBLIC_URL:-http://$HOST:$PORT}
# Without SMTP_URL, mail is caught by a fake SMTP server inside the web process: see /dev/outbox.
export RHOMB_FAKE_SMTP=${RHOMB_FAKE_SMTP:-1}
if [ -n "${SMTP_URL:-}" ]; then mail_line="E-mail goes out through SMTP_URL."; else mail_line="E-mail is not sent out: read it in the development outbox, $PUBLIC_URL/dev/outbox"; fi

stop_all() {
  trap - INT TERM
  [ -n "${server_pid:-}" ] && kill -TERM "$server_pid" 2>/dev/null && wait "$server_pid" 2>/dev/null || true
  if [ "$we_started_pg" = 1 ]; then bash scripts/pg.sh down dev; fi
  say "stopped"
  exit 0
}
trap stop_all INT TERM

node_modules/.bin/tsx server/index.ts &
server_pid=$!

for _ in $(seq 1 100); do
  if curl -fsS "http://$HOST:$PORT/api/health" >/dev/null 2>&1; then break; fi
  kill -0 "$server_pid" 2>/dev/null || { say "the server exited during start-up (see the log above)"; exit 1; }
  sleep 0.2
done

password=$(node_modules/.bin/tsx -e 'import("./server/db/seeds/demoAccounts.ts").then(m => process.stdout.write(m.DEMO_PASSWORD))')
cat <<MSG

  Rhomb is running at  $PUBLIC_URL

  Demo sign-ins (invented lab "Quantum Light Group", Larkspur Institute), password: $password
    owner@larkspur.example     lab owner
    member@larkspur.example    member (batch uploads)
    student@larkspur.example   member (enters counts by hand)
    guest@partner.example      collaborator (sees only what is shared)

  $mail_line

  Press Ctrl-C to stop the server and the database.

MSG
wait "$server_pid" || true
stop_all
