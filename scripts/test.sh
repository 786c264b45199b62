#!/usr/bin/env bash
# `npm test`: its own set-up (dependencies, a private PostgreSQL cluster), then every test suite
# (unit and API first, then the browser journeys of tests/e2e).
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

# The browser tests need Debian's chromium (playwright-core drives it; no browser download).
ensure_chromium() {
  [ -x "${RHOMB_CHROMIUM:-/usr/bin/chromium}" ] && return
  if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
    say "installing chromium for the browser tests…"
    apt-get update -qq >&2 && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >&2
  else
    say "the browser tests need Chromium at /usr/bin/chromium: install the Debian package (sudo apt-get install chromium), or set RHOMB_CHROMIUM to a Chromium binary"
    exit 1
  fi
}

if [ $# -gt 0 ]; then
  # A chosen file, project or filter: one vitest run; the browser is needed only if e2e may run.
  case " $* " in *e2e*) ensure_chromium ;; *--project* | *" tests/"*) ;; *) ensure_chromium ;; esac
  node_modules/.bin/vitest run "$@"
else
  # Everything: the fast projects first, the browser journeys last.
  node_modules/.bin/vitest run --project unit --project api
  ensure_chromium
  node_modules/.bin/vitest run --project e2e
fi
