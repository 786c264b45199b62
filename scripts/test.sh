#!/usr/bin/env bash
# `npm test`: its own set-up (dependencies, a private PostgreSQL cluster), then every test suite.
# Each run gets a fresh database on the test cluster (created and dropped by tests/support), so
# several runs can share the cluster; the cluster stops when the last run using it ends.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules

users_dir=.rhomb/pg-test-users
if [ -z "${RHOMB_TEST_ADMIN_URL:-}" ]; then
  mkdir -p "$users_dir"
  touch "$users_dir/$$"
  RHOMB_TEST_ADMIN_URL=$(bash scripts/pg.sh up test)
  export RHOMB_TEST_ADMIN_URL
  release_cluster() {
    rm -f "$users_dir/$$"
    for f in "$users_dir"/*; do
      [ -e "$f" ] || continue
      kill -0 "$(basename "$f")" 2>/dev/null || rm -f "$f"
    done
    [ -n "$(ls -A "$users_dir" 2>/dev/null)" ] || bash scripts/pg.sh down test
  }
  trap release_cluster EXIT
fi

export NODE_ENV=test
# Without SMTP_URL, mail is caught by a fake SMTP server inside the process (see README).
export RHOMB_FAKE_SMTP=${RHOMB_FAKE_SMTP:-1}
node_modules/.bin/vitest run "$@"
