#!/usr/bin/env bash
# npm run stop: stop whatever an earlier npm start / npm test left running, and return only once
# it is gone (the scripts, app, catcher, worker and clusters), so a start right after it cannot
# race their shutdown. Every wait is bounded; a process that ignores TERM gets KILL.
source "$(dirname "$0")/lib.sh"
for f in "$DATA/start.pids" "$DATA/test.pids"; do stop_from_pids "$f"; done
bash "$ROOT/scripts/pg.sh" down pg
bash "$ROOT/scripts/pg.sh" down pg-test
say "stopped."
