#!/usr/bin/env bash
# `npm start`: everything from a fresh clone to the app serving the demo scenario on :3000.
# Ctrl-C stops what this run started (by PID) and keeps the data in .local/.
. "$(dirname "$0")/lib.sh"
PROFILE=demo
load_env demo
trap 'stop_started' EXIT
trap 'echo; say "stopping…"; exit 0' INT TERM

ensure_node_modules
start_mariadb
start_redis
ensure_database
migrate_and_seed
start_mail
start_payments
build_if_needed
start_app
start_worker "worker-$PROFILE"

node node_modules/tsx/dist/cli.mjs docker-local/print-demo.ts
say "FadeLedger is running at $APP_URL  (Ctrl-C stops it; data stays in .local/)"
# Stay in the foreground until the app exits or Ctrl-C.
while kill -0 "$(cat "$RUN/app-demo.pid")" 2>/dev/null; do sleep 1; done
say "the app exited (log: .local/run/app-demo.log)"
exit 1
