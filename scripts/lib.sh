# Shared steps of start.sh, dev.sh and test.sh (sourced, not run).
repo=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$repo"
say() { echo "[rhomb] $*" >&2; }

# Install npm dependencies when node_modules is missing or older than package-lock.json.
# A fresh clone gets `npm ci`; an existing tree gets `npm install`, which never deletes
# node_modules under a process that is using it. A lock keeps concurrent runs from installing
# at the same time.
ensure_node_modules() {
  local stamp=node_modules/.rhomb-lock-hash want
  want=$(cat package-lock.json package.json | sha1sum | cut -c1-40)
  if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$want" ]; then return; fi
  mkdir -p .rhomb
  (
    flock -w 600 9 || { say "another install is still running"; exit 1; }
    if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$want" ]; then exit 0; fi
    if [ -d node_modules/.bin ]; then
      say "updating npm dependencies…"
      npm install --no-audit --no-fund --loglevel=error >&2
    else
      say "installing npm dependencies (first run takes about a minute)…"
      npm ci --no-audit --no-fund --loglevel=error >&2
    fi
    echo "$want" >"$stamp"
  ) 9>.rhomb/npm-install.lock
}

# A per-checkout session secret, so sign-ins survive restarts without one in the repo.
ensure_session_secret() {
  mkdir -p .rhomb
  [ -s .rhomb/session-secret ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("hex"))' >.rhomb/session-secret
  chmod 600 .rhomb/session-secret
  export SESSION_SECRET=${SESSION_SECRET:-$(cat .rhomb/session-secret)}
}

# Make sure `$1` exists on the cluster whose admin URL is `$2`; prints the database URL.
ensure_database() {
  local name=$1 admin=$2
  local exists
  exists=$(psql "$admin" -tAc "select 1 from pg_database where datname = '$name'")
  [ "$exists" = "1" ] || psql "$admin" -qc "create database \"$name\"" >&2
  echo "${admin%/postgres}/$name"
}

free_port() {
  local port=$1
  while (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; do port=$((port + 1)); done
  echo "$port"
}

# Build the client unless dist/ is newer than every source it depends on.
ensure_client_build() {
  local stamp=dist/client/.built
  if [ -f "$stamp" ] && [ -z "$(find src shared public index.html vite.config.ts tailwind.config.ts package-lock.json -newer "$stamp" -print -quit 2>/dev/null)" ]; then
    say "client build is up to date"
    return
  fi
  say "building the client…"
  node_modules/.bin/vite build --logLevel warn >&2
  touch "$stamp"
}
