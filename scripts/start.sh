#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL (loopback), migrate, seed the demo once,
# start the mail catcher, build and serve the app. Ctrl-C stops everything this script started.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export PORT="${PORT:-3000}"
export DB_PORT="${DB_PORT:-54329}"
export DB_NAME="${DB_NAME:-quietfix}"
export APP_URL="${APP_URL:-http://localhost:$PORT}"
export NEXTAUTH_URL="${NEXTAUTH_URL:-$APP_URL}"
export CATCHER_SMTP_PORT="${CATCHER_SMTP_PORT:-1025}" CATCHER_HTTP_PORT="${CATCHER_HTTP_PORT:-8025}"
export SMTP_HOST="${SMTP_HOST:-127.0.0.1}" SMTP_PORT="${SMTP_PORT:-$CATCHER_SMTP_PORT}"
export MAIL_CATCHER_URL="${MAIL_CATCHER_URL-http://127.0.0.1:$CATCHER_HTTP_PORT}"
# NODE_ENV stays unset here: npm ci must install the build tools (dev dependencies); the server runs as production.
HOSTNAME_BIND="${HOST:-127.0.0.1}"

catcher_pid=""; app_pid=""; worker_pid=""; pg_started=0
cleanup() {
  local rc=$?
  trap - INT TERM EXIT
  quiet_if_failed "$rc"
  say "stopping…"
  # Returns once the app, catcher, worker and (if started here) the cluster are gone.
  # shellcheck disable=SC2086
  stop_groups 10 $app_pid $catcher_pid $worker_pid || true
  [ "$pg_started" = 1 ] && bash "$ROOT/scripts/pg.sh" down pg || true
  rm -f "$DATA/start.pids"
  exit "$rc"
}

# An earlier npm start still running: say so. One that died may have left processes: stop them and wait until they are gone.
if [ -f "$DATA/start.pids" ] && pid_alive "$(sed -n 1p "$DATA/start.pids")"; then
  die "Quietfix is already running (pid $(sed -n 1p "$DATA/start.pids")): stop it with Ctrl-C or npm run stop first."
fi
stop_from_pids "$DATA/start.pids"
trap cleanup INT TERM EXIT
write_pids "$DATA/start.pids"  # from now on npm run stop can find and stop this run

need_free_port "$PORT" "the web app" "PORT"
ensure_node_modules
ensure_secret
db_env "$DB_NAME" "$DB_PORT"

pgdir=$(bash scripts/pg.sh dir pg)
if ! { [ -f "$pgdir/postmaster.pid" ] && port_taken "$DB_PORT"; }; then pg_started=1; fi
bash scripts/pg.sh up pg "$DB_PORT"
bash scripts/pg.sh ensure-db pg "$DB_PORT" "$DB_NAME"
say "migrating $DB_NAME…"; migrate
node --import tsx scripts/seed.ts || die "seeding the demo failed."

if [ -n "$MAIL_CATCHER_URL" ]; then
  need_free_port "$CATCHER_SMTP_PORT" "mail catcher SMTP" "CATCHER_SMTP_PORT"
  need_free_port "$CATCHER_HTTP_PORT" "mail catcher API" "CATCHER_HTTP_PORT"
  catcher_pid=$(spawn "$DATA/mail-catcher.log" node --import tsx scripts/mail-catcher.ts)
  write_pids "$DATA/start.pids" "$catcher_pid"
  wait_http "$MAIL_CATCHER_URL/" 20 || die "the mail catcher did not start (log: .data/mail-catcher.log)."
fi

ensure_build
app_pid=$(spawn "$DATA/app.log" env NODE_ENV=production node --import tsx scripts/serve.ts -p "$PORT" -H "$HOSTNAME_BIND")
# Delivers queued notices and alerts (retries, reminders); see lib/notices/README.md.
worker_pid=$(spawn "$DATA/outbox-worker.log" node --import tsx scripts/outbox-worker.ts)
write_pids "$DATA/start.pids" "$app_pid" "$catcher_pid" "$worker_pid"
wait_http "http://127.0.0.1:$PORT/api/health" 60 || { tail -n 20 "$DATA/app.log" >&2; die "the app did not become healthy (log: .data/app.log)."; }

cat <<TXT

  Quietfix is running at $APP_URL
  Mail catcher:   ${MAIL_CATCHER_URL:-(off: mail goes to $SMTP_HOST:$SMTP_PORT)}
  Demo sign-ins (password: quietfix-demo)
    chair@example.test        admin
    coordinator@example.test  coordinator
    hunter@example.test       hunter
    member@example.test       member
  Logs in .data/*.log. Press Ctrl-C to stop.

TXT
# Keep running until the app exits, Ctrl-C or npm run stop (the one wait without a bound: the server's life).
while group_alive "$app_pid"; do sleep 1; done
say "the app stopped (see .data/app.log)."
