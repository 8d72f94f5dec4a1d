#!/usr/bin/env bash
# npm run stop: stop whatever an earlier npm start / npm test left running.
source "$(dirname "$0")/lib.sh"
for f in "$DATA/start.pids" "$DATA/test.pids"; do
  [ -f "$f" ] || continue
  for pid in $(cat "$f"); do kill_group "$pid"; done
  rm -f "$f"
done
bash "$ROOT/scripts/pg.sh" down pg
bash "$ROOT/scripts/pg.sh" down pg-test
