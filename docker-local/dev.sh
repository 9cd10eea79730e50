#!/usr/bin/env bash
# `npm run dev`: the demo services, then `next dev` with hot reload on :3000.
. "$(dirname "$0")/lib.sh"
PROFILE=demo
load_env demo
trap 'stop_started' EXIT
trap 'exit 0' INT TERM
ensure_node_modules
start_mariadb
start_redis
ensure_database
migrate_and_seed
start_mail
start_payments
start_worker "worker-$PROFILE"
node node_modules/next/dist/bin/next dev -p "$APP_PORT"
