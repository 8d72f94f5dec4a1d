# Shared shell helpers for start.sh, test.sh, stop.sh and pg.sh. Source, don't run.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA="$ROOT/.data"
mkdir -p "$DATA"
export NEXT_TELEMETRY_DISABLED=1

say() { printf '\033[1;36mquietfix\033[0m %s\n' "$*"; }
# A failed step ends with this one line (a cleanup trap stays quiet after it: see quiet_if_failed).
die() { printf '\033[1;31mquietfix: %s\033[0m\n' "$*" >&2; exit 1; }
# In an EXIT trap: after a failure, send the trap's own chatter to a log so the failure line stays last.
quiet_if_failed() { # exit code
  if [ "$1" != 0 ]; then exec >>"$DATA/cleanup.log" 2>&1; fi
}
is_root() { [ "$(id -u)" = 0 ]; }

# true when something already listens on 127.0.0.1:$1
port_taken() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }
need_free_port() { # port, what, env var
  if port_taken "$1"; then die "port $1 ($2) is already in use on 127.0.0.1: stop what uses it (npm run stop) or set $3 to a free port."; fi
}

ensure_node_modules() {
  if [ ! -f "$ROOT/node_modules/.package-lock.json" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    say "installing npm dependencies (npm ci)…"
    (cd "$ROOT" && npm ci --include=dev --no-audit --no-fund --loglevel=error) || die "npm ci failed: check the network to the npm registry, then run npm start again."
  fi
}

apt_install() { # packages...
  is_root || die "$* missing and not root: install them with 'sudo apt-get install -y $*' and run again."
  say "installing $* from Debian's packages…"
  { apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@"; } >"$DATA/apt.log" 2>&1 \
    || die "apt-get install $* failed (see .data/apt.log)."
}

pg_bin() {
  local d
  d=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  if [ -z "$d" ] || [ ! -x "$d/pg_ctl" ]; then
    # Debian's package would also start its own cluster on 5432; ours is separate and on loopback only.
    apt_install postgresql
    d=$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1)
  fi
  echo "$d"
}

# PostGIS for the server in $1 (its bin folder): Debian's postgresql-<version>-postgis-3, like the server itself.
ensure_postgis() {
  local v
  v=$(basename "$(dirname "$1")")
  [ -f "/usr/share/postgresql/$v/extension/postgis.control" ] || apt_install "postgresql-$v-postgis-3"
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then apt_install chromium; fi
}

# The NextAuth secret: from the environment, or made once and kept in .data.
ensure_secret() {
  if [ -z "${NEXTAUTH_SECRET:-}" ]; then
    [ -s "$DATA/nextauth-secret" ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" >"$DATA/nextauth-secret"
    NEXTAUTH_SECRET=$(cat "$DATA/nextauth-secret"); export NEXTAUTH_SECRET
  fi
}

# Builds the app unless the last build was made from exactly these sources.
ensure_build() {
  local stamp
  # Fingerprint of every source file the build reads (tests and scripts excluded).
  stamp=$(cd "$ROOT" && { git ls-files -co --exclude-standard -z -- . ':!tests' ':!scripts' ':!.ci' ':!*.md' \
    | xargs -0 sha1sum 2>/dev/null || true; } | sha1sum | cut -c1-16)
  if [ -f "$ROOT/.next/BUILD_ID" ] && [ "$(cat "$DATA/build-stamp" 2>/dev/null)" = "$stamp" ]; then return 0; fi
  say "building the app (next build, then the service worker: serwist build)…"
  (cd "$ROOT" && node node_modules/next/dist/bin/next build >"$DATA/build.log" 2>&1) || { tail -n 30 "$DATA/build.log" >&2; die "next build failed (full log: .data/build.log)."; }
  # The field app's service worker (serwist.config.js -> public/sw.js): precaches this build's static output.
  (cd "$ROOT" && node node_modules/@serwist/cli/cli.js build >>"$DATA/build.log" 2>&1) || { tail -n 30 "$DATA/build.log" >&2; die "serwist build failed (full log: .data/build.log)."; }
  echo "$stamp" >"$DATA/build-stamp"
}

# Waits until $1 answers 200, up to $2 seconds in all. Each try is bounded too (--max-time), so a
# service that accepts the connection and never answers cannot hang the wait.
wait_http() {
  local end=$((SECONDS + $2))
  while [ "$SECONDS" -lt "$end" ]; do
    curl -fsS -o /dev/null --connect-timeout 1 --max-time 2 "$1" 2>/dev/null && return 0
    sleep 0.25
  done
  return 1
}

# Waits until nothing listens on 127.0.0.1:$1 any more, up to $2 seconds.
wait_port_free() { # port seconds
  local end=$((SECONDS + $2))
  while port_taken "$1"; do
    [ "$SECONDS" -lt "$end" ] || return 1
    sleep 0.2
  done
}

# Starts a command in its own process group, output to a log; prints its pid.
spawn() { # log, command...
  local log=$1; shift
  setsid "$@" >"$log" 2>&1 < /dev/null &
  echo $!
}
kill_group() { [ -n "${1:-}" ] && kill -TERM -- "-$1" 2>/dev/null || true; }
group_alive() { [ -n "${1:-}" ] && kill -0 -- "-$1" 2>/dev/null; }
pid_alive() { [ -n "${1:-}" ] && kill -0 "$1" 2>/dev/null; }

# Stops process groups and waits until they are gone: TERM, up to $1 seconds, then KILL.
stop_groups() { # seconds pgid...
  local end=$((SECONDS + $1)) g left; shift
  for g in "$@"; do kill_group "$g"; done
  while :; do
    left=""
    for g in "$@"; do group_alive "$g" && left="$left $g"; done
    [ -z "$left" ] && return 0
    if [ "$SECONDS" -ge "$end" ]; then
      for g in $left; do kill -KILL -- "-$g" 2>/dev/null || true; done
      sleep 0.5
      for g in $left; do group_alive "$g" && return 1; done
      return 0
    fi
    sleep 0.2
  done
}

# Runs a long step (a test runner) so that a TERM from npm run stop reaches this script's trap at
# once instead of after the step; the trap stops the step with stop_step.
FG_PID=""
run_step() { "$@" & FG_PID=$!; local rc=0; wait "$FG_PID" || rc=$?; FG_PID=""; return "$rc"; }
stop_step() {
  pid_alive "$FG_PID" || return 0
  kill -TERM "$FG_PID" 2>/dev/null || true
  local end=$((SECONDS + 10))
  while pid_alive "$FG_PID" && [ "$SECONDS" -lt "$end" ]; do sleep 0.2; done
  kill -KILL "$FG_PID" 2>/dev/null || true
}

# The pids file of a running start.sh or test.sh: line 1 the script itself, line 2 its process groups.
write_pids() { # file groups...
  local f=$1; shift
  printf '%s\n%s\n' "$$" "$*" >"$f"
}

# Stops what a pids file names and waits until it is gone: the script first (its own cleanup
# stops its services and cluster), then whatever is left. A script that does not finish its
# cleanup in time is killed, so no late cleanup can stop the services of a newer start.
stop_from_pids() { # file
  local f=$1 sup groups end
  [ -f "$f" ] || return 0
  sup=$(sed -n 1p "$f"); groups=$(sed -n 2p "$f")
  # (a file of the older one-line form names only the groups)
  if [ -z "$groups" ]; then groups=$sup; sup=""; fi
  if pid_alive "$sup"; then
    kill -TERM "$sup" 2>/dev/null || true
    end=$((SECONDS + 60))
    while pid_alive "$sup" && [ "$SECONDS" -lt "$end" ]; do sleep 0.2; done
    pid_alive "$sup" && kill -KILL "$sup" 2>/dev/null || true
  fi
  # shellcheck disable=SC2086
  stop_groups 10 $groups || die "processes of an earlier run ($groups) did not stop, even after KILL."
  rm -f "$f"
}

db_env() { # name port
  export DB_HOST=127.0.0.1 DB_PORT="$2" DB_NAME="$1" DB_USER="${DB_USER:-quietfix}" DB_PASSWORD="${DB_PASSWORD:-quietfix-local}"
}

migrate() {
  (cd "$ROOT" && node --import tsx node_modules/knex/bin/cli.js --knexfile knexfile.ts migrate:latest >"$DATA/migrate.log" 2>&1) \
    || { tail -n 20 "$DATA/migrate.log" >&2; die "database migration failed (log: .data/migrate.log)."; }
}
