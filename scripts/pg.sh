#!/usr/bin/env bash
# Project-local PostgreSQL clusters, on 127.0.0.1 only.
#   pg.sh up NAME PORT        init (once) and start the cluster NAME on PORT
#   pg.sh ensure-db NAME PORT DB [fresh]   create database DB (drop it first with "fresh")
#   pg.sh down NAME           stop it (fast)
#   pg.sh dir NAME            print its data folder
# As root, the server runs as the postgres OS user (PostgreSQL refuses root). The data folder is
# .data/NAME when postgres can reach it, else /tmp/quietfix-<hash of this checkout>-NAME.
source "$(dirname "$0")/lib.sh"

as_pg() { if is_root; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi; }
running() { as_pg "$bin/pg_ctl" -D "$dir" status >/dev/null 2>&1; }
ready() { "$bin/pg_isready" -q -t 2 -h 127.0.0.1 -p "$port"; }

data_dir() {
  local name=$1 rec="$DATA/$1.path"
  if [ -f "$rec" ]; then cat "$rec"; return; fi
  local dir="$DATA/$name"
  mkdir -p "$dir"
  if is_root; then
    chown postgres:postgres "$dir"
    if ! runuser -u postgres -- test -w "$dir" 2>/dev/null; then
      rmdir "$dir" 2>/dev/null || true
      dir="/tmp/quietfix-$(echo "$ROOT" | sha1sum | cut -c1-10)-$name"
      mkdir -p "$dir" && chown postgres:postgres "$dir" && chmod 700 "$dir"
    fi
  fi
  echo "$dir" >"$rec"
  echo "$dir"
}

cmd=${1:-}; name=${2:-}
[ -n "$cmd" ] && [ -n "$name" ] || die "usage: pg.sh up|down|ensure-db|dir NAME [PORT] [DB]"
case "$cmd" in
  dir) data_dir "$name" ;;
  up)
    port=${3:?port}
    bin=$(pg_bin)
    ensure_postgis "$bin"
    dir=$(data_dir "$name")
    if [ ! -s "$dir/PG_VERSION" ]; then
      say "creating the PostgreSQL cluster in $dir…"
      pw=$(mktemp); printf '%s' "${DB_PASSWORD:-quietfix-local}" >"$pw"; is_root && chown postgres "$pw"
      as_pg "$bin/initdb" -D "$dir" -U "${DB_USER:-quietfix}" --pwfile="$pw" --auth-host=scram-sha-256 --auth-local=scram-sha-256 \
        --encoding=UTF8 --locale=C.UTF-8 >"$DATA/$name-initdb.log" 2>&1 || { rm -f "$pw"; die "initdb failed (log: .data/$name-initdb.log)."; }
      rm -f "$pw"
    fi
    # A cluster that is still starting up or shutting down (e.g. right after npm run stop) is
    # waited for, up to 30 s, instead of being taken for a running one that then goes away.
    end=$((SECONDS + 30))
    while running && ! ready; do
      [ "$SECONDS" -lt "$end" ] || die "PostgreSQL ($name) neither answers nor stops (log: $dir/server.log); try npm run stop."
      sleep 0.25
    done
    if running && ready; then exit 0; fi
    wait_port_free "$port" 10 || die "port $port (PostgreSQL) is already in use on 127.0.0.1: stop what uses it (npm run stop) or set DB_PORT to a free port."
    as_pg "$bin/pg_ctl" -D "$dir" -l "$dir/server.log" -w -t 30 \
      -o "-c listen_addresses=127.0.0.1 -p $port -c unix_socket_directories=/tmp -c fsync=${PG_FSYNC:-on}" start >/dev/null \
      || die "PostgreSQL did not start (log: $dir/server.log)."
    end=$((SECONDS + 15))
    while [ "$SECONDS" -lt "$end" ]; do ready && exit 0; sleep 0.25; done
    die "PostgreSQL started but does not answer on 127.0.0.1:$port (log: $dir/server.log)."
    ;;
  ensure-db)
    port=${3:?port}; db=${4:?db}; bin=$(pg_bin)
    export PGPASSWORD="${DB_PASSWORD:-quietfix-local}" PGCONNECT_TIMEOUT=5
    q() { "$bin/psql" -X -q -h 127.0.0.1 -p "$port" -U "${DB_USER:-quietfix}" -d postgres -v ON_ERROR_STOP=1 -tAc "$1"; }
    if [ "${5:-}" = fresh ]; then q "DROP DATABASE IF EXISTS \"$db\" WITH (FORCE)" >/dev/null; fi
    [ "$(q "SELECT 1 FROM pg_database WHERE datname = '$db'")" = 1 ] || q "CREATE DATABASE \"$db\"" >/dev/null || die "could not create database $db."
    ;;
  down)
    bin=$(pg_bin)
    rec="$DATA/$name.path"
    [ -f "$rec" ] || exit 0
    dir=$(cat "$rec")
    [ -s "$dir/PG_VERSION" ] && running || exit 0
    # Returns only once the server is gone (-w, bounded by -t); a fast stop that hangs becomes an immediate one.
    if as_pg "$bin/pg_ctl" -D "$dir" -m fast -w -t 30 stop >/dev/null 2>&1 \
      || as_pg "$bin/pg_ctl" -D "$dir" -m immediate -w -t 15 stop >/dev/null 2>&1 || ! running; then
      say "stopped PostgreSQL ($name)."
    else
      die "PostgreSQL ($name) did not stop within 45 s (log: $dir/server.log)."
    fi
    ;;
  *) die "unknown command $cmd" ;;
esac
