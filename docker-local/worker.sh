#!/usr/bin/env bash
# `npm run worker`: one more campaign worker in the foreground (Ctrl-C stops it after its chunk).
# On this machine it joins `npm start` (profile demo; FADELEDGER_PROFILE=test joins `npm test`'s services).
# On another machine: set DATABASE_*, REDIS_URL (and the rest of .env.example) to the shared MariaDB and
# Redis and run `npm run worker` there; run it N times (or on N machines) for N workers.
. "$(dirname "$0")/lib.sh"
PROFILE="${FADELEDGER_PROFILE:-demo}"
if [ -z "${REDIS_URL:-}" ] || [ -z "${DATABASE_HOST:-}" ]; then load_env "$PROFILE"; fi
cd "$ROOT"
say "campaign worker: Redis ${REDIS_URL}, MariaDB ${DATABASE_HOST}:${DATABASE_PORT}/${DATABASE_NAME}"
exec node --conditions=react-server scripts/run-bundled.mjs server/campaigns/worker-main.ts
