#!/usr/bin/env bash
# Private PostgreSQL clusters for development and tests, on 127.0.0.1 only.
#   bash scripts/pg.sh up <name>    ensure the cluster runs; prints its admin URL on stdout
#   bash scripts/pg.sh down <name>  stop it (fast shutdown)
#   bash scripts/pg.sh status <name> exit 0 when the cluster is running
#   bash scripts/pg.sh dir <name>   print where its data lives
# Clusters live in .rhomb/pg-<name> (git-ignored). When the script runs as root (CI), PostgreSQL
# refuses to run as root, so it runs as the `postgres` system user; if that user cannot reach the
# checkout (e.g. a clone inside a private mktemp folder), the cluster goes to
# /var/tmp/rhomb-<hash>/pg-<name> instead and we say so.
set -euo pipefail

cmd=${1:?usage: pg.sh up|down|dir <name>}
name=${2:?usage: pg.sh up|down|dir <name>}
repo=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
log() { echo "[rhomb:pg] $*" >&2; }

case "$name" in
  dev) default_port=${RHOMB_PG_PORT:-54329} ;;
  test) default_port=${RHOMB_TEST_PG_PORT:-54339} ;;
  *) default_port=${RHOMB_PG_PORT:-54349} ;;
esac

is_root() { [ "$(id -u)" = "0" ]; }

find_pgbin() {
  local bin
  bin=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  if [ -z "$bin" ] && command -v pg_ctl >/dev/null 2>&1; then bin=$(dirname "$(command -v pg_ctl)"); fi
  echo "$bin"
}

ensure_installed() {
  PGBIN=$(find_pgbin)
  if [ -n "$PGBIN" ] && [ -x "$PGBIN/pg_ctl" ]; then return; fi
  if is_root && command -v apt-get >/dev/null 2>&1; then
    log "PostgreSQL server not found; installing the Debian package 'postgresql' (one-time)…"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >&2
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >&2
    PGBIN=$(find_pgbin)
  fi
  if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/pg_ctl" ]; then
    log "PostgreSQL 13 or newer is required but was not found."
    log "Install it (Debian/Ubuntu: sudo apt-get install postgresql), or set DATABASE_URL to an existing server."
    exit 1
  fi
}

# Run a PostgreSQL server binary as the right user, from a directory that user can enter.
as_pg() {
  if is_root; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

can_postgres_reach() {
  is_root || return 0
  runuser -u postgres -- test -x "$1" 2>/dev/null && runuser -u postgres -- test -r "$1" 2>/dev/null
}

cluster_dir() {
  local local_dir="$repo/.rhomb/pg-$name"
  mkdir -p "$repo/.rhomb"
  if [ -d "$local_dir/data" ] || can_postgres_reach "$repo/.rhomb"; then
    echo "$local_dir"
  else
    local hash
    hash=$(printf '%s' "$repo" | sha1sum | cut -c1-10)
    echo "/var/tmp/rhomb-$hash/pg-$name"
  fi
}

port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

running_port() {
  # postmaster.pid line 4 is the port; only trust it if the server answers.
  local pidfile="$DIR/data/postmaster.pid"
  [ -f "$pidfile" ] || return 1
  as_pg "$PGBIN/pg_ctl" -D "$DIR/data" status >/dev/null 2>&1 || return 1
  sed -n 4p "$pidfile"
}

up() {
  ensure_installed
  DIR=$(cluster_dir)
  [ "$DIR" = "$repo/.rhomb/pg-$name" ] || log "the postgres user cannot enter $repo; using $DIR for the '$name' cluster"
  mkdir -p "$DIR"
  if is_root; then chown postgres:postgres "$DIR"; [ "$DIR" = "${DIR#/var/tmp/}" ] || chown postgres:postgres "$(dirname "$DIR")"; fi
  if [ ! -f "$DIR/data/PG_VERSION" ]; then
    log "creating the '$name' cluster in $DIR/data"
    as_pg "$PGBIN/initdb" -D "$DIR/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >"$DIR/initdb.log" 2>&1 \
      || as_pg "$PGBIN/initdb" -D "$DIR/data" -U postgres --auth=trust -E UTF8 >"$DIR/initdb.log" 2>&1 \
      || { log "initdb failed; see $DIR/initdb.log"; cat "$DIR/initdb.log" >&2; exit 1; }
  fi
  local port
  if port=$(running_port); then
    log "'$name' cluster already running on 127.0.0.1:$port"
  else
    port=$default_port
    local tries=0
    while port_in_use "$port"; do
      tries=$((tries + 1))
      [ $tries -lt 30 ] || { log "no free port found from $default_port to $port"; exit 1; }
      log "port $port is taken by another program; trying $((port + 1))"
      port=$((port + 1))
    done
    if ! as_pg "$PGBIN/pg_ctl" -D "$DIR/data" -l "$DIR/server.log" -w -t 60 \
      -o "-h 127.0.0.1 -p $port -k $DIR -c max_connections=200" start >/dev/null; then
      log "PostgreSQL did not start; last lines of $DIR/server.log:"
      tail -n 20 "$DIR/server.log" >&2 || true
      exit 1
    fi
    log "'$name' cluster started on 127.0.0.1:$port"
  fi
  echo "postgres://postgres@127.0.0.1:$port/postgres"
}

down() {
  PGBIN=$(find_pgbin)
  DIR=$(cluster_dir)
  [ -n "$PGBIN" ] && [ -f "$DIR/data/PG_VERSION" ] || return 0
  if as_pg "$PGBIN/pg_ctl" -D "$DIR/data" status >/dev/null 2>&1; then
    as_pg "$PGBIN/pg_ctl" -D "$DIR/data" -m fast -w stop >/dev/null && log "'$name' cluster stopped"
  fi
}

case "$cmd" in
  up) up ;;
  down) down ;;
  status) PGBIN=$(find_pgbin); DIR=$(cluster_dir); [ -n "$PGBIN" ] && running_port >/dev/null ;;
  dir) cluster_dir ;;
  *) echo "usage: pg.sh up|down|dir <name>" >&2; exit 2 ;;
esac
