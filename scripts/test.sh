#!/usr/bin/env bash
# npm test: the same preparation as npm start, on a separate cluster and a fresh test database,
# then Vitest (unit, integration against the real PostgreSQL and a running app), then
# Playwright in Debian's chromium. Every runner runs; the exit code is non-zero if any failed.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export TEST_PORT="${TEST_PORT:-3100}"
# A second instance of the same app (same database, same secret), as behind a load balancer.
export TEST_PORT_B="${TEST_PORT_B:-$((TEST_PORT + 1))}" TEST_BASE_URL_B="http://127.0.0.1:${TEST_PORT_B:-$((TEST_PORT + 1))}"
export PORT="$TEST_PORT"
export DB_PORT="${TEST_DB_PORT:-54339}" DB_NAME="${TEST_DB_NAME:-quietfix_test}"
export APP_URL="http://127.0.0.1:$TEST_PORT" NEXTAUTH_URL="http://127.0.0.1:$TEST_PORT" TEST_BASE_URL="http://127.0.0.1:$TEST_PORT"
export CATCHER_SMTP_PORT="${TEST_SMTP_PORT:-1125}" CATCHER_HTTP_PORT="${TEST_CATCHER_HTTP_PORT:-8125}"
export SMTP_HOST=127.0.0.1 SMTP_PORT="$CATCHER_SMTP_PORT" MAIL_CATCHER_URL="http://127.0.0.1:$CATCHER_HTTP_PORT"
export CATCHER_STORE="$DATA/mail-test/messages.jsonl"
export S3_FAKE_PORT="${TEST_S3_PORT:-4570}" S3_FAKE_DIR="$DATA/s3-test" S3_BUCKET="${TEST_S3_BUCKET:-quietfix-test}"
export S3_ENDPOINT="http://127.0.0.1:$S3_FAKE_PORT"
export PG_FSYNC=off
export QUIETFIX_TEST_PG=pg-test

catcher_pid=""; app_pid=""; app_b_pid=""; worker_pid=""; s3_pid=""
cleanup() {
  local rc=$?
  trap - INT TERM EXIT
  quiet_if_failed "$rc"
  stop_step
  # shellcheck disable=SC2086
  stop_groups 10 $app_pid $app_b_pid $catcher_pid $worker_pid $s3_pid || true
  bash "$ROOT/scripts/pg.sh" down pg-test >/dev/null 2>&1 || true
  rm -f "$DATA/test.pids"
  exit "$rc"
}
if [ -f "$DATA/test.pids" ] && pid_alive "$(sed -n 1p "$DATA/test.pids")"; then
  die "a test run is already going on in this checkout (pid $(sed -n 1p "$DATA/test.pids")): wait for it or run npm run stop."
fi
stop_from_pids "$DATA/test.pids"
trap cleanup INT TERM EXIT
write_pids "$DATA/test.pids"  # from now on npm run stop can find and stop this run

need_free_port "$TEST_PORT" "the test app" "TEST_PORT"
need_free_port "$TEST_PORT_B" "the second test app instance" "TEST_PORT_B"
need_free_port "$CATCHER_SMTP_PORT" "the test mail catcher" "TEST_SMTP_PORT"
need_free_port "$CATCHER_HTTP_PORT" "the test mail catcher API" "TEST_CATCHER_HTTP_PORT"
need_free_port "$S3_FAKE_PORT" "the test object store" "TEST_S3_PORT"
ensure_node_modules
ensure_secret
db_env "$DB_NAME" "$DB_PORT"
bash scripts/pg.sh up pg-test "$DB_PORT"
bash scripts/pg.sh ensure-db pg-test "$DB_PORT" "$DB_NAME" fresh
say "migrating $DB_NAME…"; migrate
node --import tsx scripts/seed.ts || die "seeding the test database failed."

# TEST_ONLY="places fix" runs only the test files whose paths contain one of the words (every
# runner, none failing for want of a match); unset, everything runs, as in CI.
only=()
[ -n "${TEST_ONLY:-}" ] && read -r -a only <<<"$TEST_ONLY"
vitest_only=(); playwright_only=()
[ "${#only[@]}" -gt 0 ] && vitest_only=(--passWithNoTests "${only[@]}") && playwright_only=(--pass-with-no-tests "${only[@]}")

rc=0
say "unit tests (Vitest)…"
run_step npx vitest run --project unit "${vitest_only[@]}" || rc=1

rm -f "$CATCHER_STORE"
catcher_pid=$(spawn "$DATA/mail-catcher-test.log" node --import tsx scripts/mail-catcher.ts)
rm -rf "$S3_FAKE_DIR"
s3_pid=$(spawn "$DATA/s3-fake-test.log" node --import tsx scripts/s3-fake.ts)
write_pids "$DATA/test.pids" "$catcher_pid" "$s3_pid"
ensure_build
# The app trusts 127.0.0.9 as a reverse proxy (tests act as that proxy to check the right-most rule).
app_pid=$(spawn "$DATA/app-test.log" env NODE_ENV=production TRUSTED_PROXY=127.0.0.9 node --import tsx scripts/serve.ts -p "$TEST_PORT" -H 127.0.0.1)
app_b_pid=$(spawn "$DATA/app-test-b.log" env NODE_ENV=production TRUSTED_PROXY=127.0.0.9 node --import tsx scripts/serve.ts -p "$TEST_PORT_B" -H 127.0.0.1)
# The outbox worker, polling often so tests see mail quickly; short backoff and lease for outage tests.
worker_pid=$(spawn "$DATA/outbox-worker-test.log" env OUTBOX_POLL_MS=300 OUTBOX_BACKOFF_BASE_MS=500 OUTBOX_LEASE_MS=5000 node --import tsx scripts/outbox-worker.ts)
write_pids "$DATA/test.pids" "$app_pid" "$app_b_pid" "$catcher_pid" "$worker_pid" "$s3_pid"
wait_http "$S3_ENDPOINT/" 20 || die "the test object store did not start (log: .data/s3-fake-test.log)."
wait_http "$MAIL_CATCHER_URL/" 20 || die "the test mail catcher did not start (log: .data/mail-catcher-test.log)."
wait_http "$TEST_BASE_URL/api/health" 60 || { tail -n 20 "$DATA/app-test.log" >&2; die "the test app did not become healthy (log: .data/app-test.log)."; }
wait_http "$TEST_BASE_URL_B/api/health" 60 || { tail -n 20 "$DATA/app-test-b.log" >&2; die "the second test app instance did not become healthy (log: .data/app-test-b.log)."; }

say "integration tests (Vitest, real PostgreSQL and SMTP)…"
run_step npx vitest run --project integration "${vitest_only[@]}" || rc=1

ensure_chromium
say "end-to-end tests (Playwright, Debian's chromium)…"
run_step npx playwright test "${playwright_only[@]}" || rc=1

[ "$rc" = 0 ] && say "all suites passed." || say "some suites failed (see above)."
exit "$rc"
