#!/usr/bin/env bash
# Shared bootstrap for `npm start`, `npm test` and `npm run dev`: everything idempotent, every step printed.
# Processes we start are recorded by PID in .local/run/ and stopped by stop_started on exit.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
LOCAL="$ROOT/.local"
RUN="$LOCAL/run"
mkdir -p "$RUN"
STARTED=()   # names of services this invocation started (and must stop)

say()  { printf '\033[1;36m[fadeledger]\033[0m %s\n' "$*"; }
fail() { printf '\033[1;31m[fadeledger] %s\033[0m\n' "$*" >&2; exit 1; }

# load_env PROFILE — defaults, then the profile's overrides, then generated secrets, then the user's .env.
load_env() {
  local profile="$1"
  set -a
  # shellcheck disable=SC1091
  . "$ROOT/docker-local/defaults.env"
  [ "$profile" = test ] && . "$ROOT/docker-local/test.env"
  ensure_secrets
  . "$LOCAL/secrets.env"
  [ "$profile" != test ] && [ -f "$ROOT/.env" ] && . "$ROOT/.env"
  export NEXT_TELEMETRY_DISABLED=1
  apply_port_offset
  set +a
  MARIADB_DIR="$LOCAL/mariadb"
  MARIADB_SOCK="$RUN/mariadb.sock"
  MARIADB_PID="$RUN/mariadb.pid"
  REDIS_DIR="$LOCAL/redis-$profile"
  REDIS_PID="$RUN/redis-$profile.pid"
}

# FADELEDGER_PORT_OFFSET=N moves every port of the profile by N, so a second checkout (a fresh
# clone checked next to a running one) can run its own services side by side.
apply_port_offset() {
  local n="${FADELEDGER_PORT_OFFSET:-0}"
  [[ "$n" =~ ^[0-9]+$ ]] || fail "FADELEDGER_PORT_OFFSET must be a whole number; got '$n'"
  [ "$n" = 0 ] && return 0
  APP_PORT=$((APP_PORT + n)); DATABASE_PORT=$((DATABASE_PORT + n)); SMTP_PORT=$((SMTP_PORT + n))
  MAIL_WEB_PORT=$((MAIL_WEB_PORT + n)); STRIPE_API_PORT=$((STRIPE_API_PORT + n)); STRIPE_FAKE_PORT=$((STRIPE_FAKE_PORT + n))
  REDIS_PORT=$((REDIS_PORT + n))
  APP_URL="$(printf '%s' "$APP_URL" | sed -E "s#:[0-9]+\$#:$APP_PORT#")"
  REDIS_URL="$(printf '%s' "$REDIS_URL" | sed -E "s#:[0-9]+(/[0-9]*)?\$#:$REDIS_PORT\1#")"
  say "ports moved by $n (FADELEDGER_PORT_OFFSET): app $APP_PORT, MariaDB $DATABASE_PORT, Redis $REDIS_PORT, mail $SMTP_PORT/$MAIL_WEB_PORT, payments $STRIPE_FAKE_PORT"
}

# require_port_free PORT WHAT — a port held by something that is not ours gets a clear message
# (typically another checkout's `npm start` or `npm test`), not a confusing start-up failure.
require_port_free() {
  local port="$1" what="$2"
  if (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; then
    fail "port $port ($what) is already taken by another process — probably another FadeLedger checkout's \`npm start\` or \`npm test\`. Stop it (Ctrl-C in its terminal, or \`bash docker-local/services.sh stop\` there), or run this one with FADELEDGER_PORT_OFFSET=200 to move every port."
  fi
}

ensure_secrets() {
  if [ ! -f "$LOCAL/secrets.env" ]; then
    say "generating local secrets in .local/secrets.env (git-ignored)"
    local pw wh
    pw="$(node -e "process.stdout.write(require('crypto').randomBytes(18).toString('base64url'))")"
    wh="$(node -e "process.stdout.write(require('crypto').randomBytes(24).toString('hex'))")"
    printf 'DATABASE_PASSWORD=%s\nSTRIPE_WEBHOOK_SECRET=whsec_%s\n' "$pw" "$wh" > "$LOCAL/secrets.env"
    chmod 600 "$LOCAL/secrets.env"
  fi
  # Added later than the others: older checkouts get it on their next start.
  if ! grep -q '^WEBHOOK_SECRET_KEY=' "$LOCAL/secrets.env"; then
    printf 'WEBHOOK_SECRET_KEY=%s\n' "$(node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))")" >> "$LOCAL/secrets.env"
  fi
  # Checkouts whose secrets predate the link key get one added (existing values are kept).
  if ! grep -q '^SHARE_LINK_KEY=' "$LOCAL/secrets.env"; then
    printf 'SHARE_LINK_KEY=%s\n' "$(node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64'))")" >> "$LOCAL/secrets.env"
  fi
}

# The test profile's settings for single-file runs (`set -a; . .local/test.env; set +a`): every
# variable the app, the workers and the tests read, values quoted for the shell.
write_test_env() {
  env | grep -E '^(APP_|DATABASE_|SMTP_|MAIL_|STRIPE_|SHARE_LINK_KEY|REDIS_|CAMPAIGN_|WEBHOOK|TRUST_PROXY)' | sed 's/^\([^=]*\)=\(.*\)$/\1='"'"'\2'"'"'/' > "$LOCAL/test.env"
}

ensure_node_modules() {
  cd "$ROOT"
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ] || [ package.json -nt node_modules/.package-lock.json ]; then
    say "installing npm dependencies (npm ci)"
    PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD=1 npm ci --no-audit --no-fund
    touch node_modules/.package-lock.json
  else
    say "npm dependencies are up to date"
  fi
}

# apt_install PACKAGE CHECK_PATH — install a Debian package once, as root; otherwise say how.
apt_install() {
  local pkg="$1" check="$2"
  if [ -x "$check" ]; then return 0; fi
  if [ "$(id -u)" != 0 ]; then
    fail "$pkg is not installed and this is not root. Run: sudo apt-get update && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y $pkg   — then run this command again."
  fi
  say "installing $pkg from Debian's packages (apt-get)"
  if [ ! -f "$LOCAL/.apt-updated" ] || [ -n "$(find "$LOCAL/.apt-updated" -mmin +720 2>/dev/null)" ]; then
    apt-get update -qq && touch "$LOCAL/.apt-updated"
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$pkg" >/dev/null
  [ -x "$check" ] || fail "$pkg installed but $check is still missing"
}

db_ping() { mariadb-admin --no-defaults --socket="$MARIADB_SOCK" -uroot ping >/dev/null 2>&1; }
db_root() { mariadb --no-defaults --socket="$MARIADB_SOCK" -uroot "$@"; }

start_mariadb() {
  apt_install mariadb-server /usr/sbin/mariadbd
  if [ ! -d "$MARIADB_DIR/mysql" ]; then
    say "initialising a private MariaDB data folder in .local/mariadb"
    mkdir -p "$MARIADB_DIR"
    mariadb-install-db --no-defaults --user="$(id -un)" --datadir="$MARIADB_DIR" --auth-root-authentication-method=normal --skip-test-db >"$RUN/mariadb-install.log" 2>&1 \
      || { cat "$RUN/mariadb-install.log"; fail "mariadb-install-db failed"; }
  fi
  if db_ping; then
    say "MariaDB already running on 127.0.0.1:$DATABASE_PORT (reusing it)"
    return 0
  fi
  require_port_free "$DATABASE_PORT" "MariaDB"
  say "starting MariaDB on 127.0.0.1:$DATABASE_PORT"
  setsid /usr/sbin/mariadbd --no-defaults --user="$(id -un)" --datadir="$MARIADB_DIR" --socket="$MARIADB_SOCK" \
    --pid-file="$MARIADB_PID" --bind-address=127.0.0.1 --port="$DATABASE_PORT" --log-error="$RUN/mariadb.err" \
    --skip-name-resolve --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci </dev/null >/dev/null 2>&1 &
  for _ in $(seq 1 100); do db_ping && break; sleep 0.2; done
  db_ping || { tail -20 "$RUN/mariadb.err" || true; fail "MariaDB did not start (log: .local/run/mariadb.err)"; }
  STARTED+=(mariadb)
}

stop_mariadb() {
  if db_ping; then
    say "stopping MariaDB"
    mariadb-admin --no-defaults --socket="$MARIADB_SOCK" -uroot shutdown >/dev/null 2>&1 || true
    local pid; pid="$(cat "$MARIADB_PID" 2>/dev/null || true)"
    for _ in $(seq 1 50); do [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null || break; sleep 0.2; done
  fi
}

redis_ping() { redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping 2>/dev/null | grep -q PONG; }

# Redis holds the campaign job queue (BullMQ). Its own data folder per profile, append-only file on,
# so queued chunks survive a restart; loopback only.
start_redis() {
  apt_install redis-server /usr/bin/redis-server
  mkdir -p "$REDIS_DIR"
  if redis_ping; then
    say "Redis already running on 127.0.0.1:$REDIS_PORT (reusing it)"
    return 0
  fi
  require_port_free "$REDIS_PORT" "Redis"
  say "starting Redis on 127.0.0.1:$REDIS_PORT (data in ${REDIS_DIR#"$ROOT/"}, append-only)"
  /usr/bin/redis-server --port "$REDIS_PORT" --bind 127.0.0.1 --dir "$REDIS_DIR" --appendonly yes \
    --daemonize yes --pidfile "$REDIS_PID" --logfile "$RUN/redis-$PROFILE.log" --save "" \
    >/dev/null 2>&1 || { tail -20 "$RUN/redis-$PROFILE.log" 2>/dev/null || true; fail "Redis did not start (log: .local/run/redis-$PROFILE.log)"; }
  for _ in $(seq 1 50); do redis_ping && break; sleep 0.1; done
  redis_ping || { tail -20 "$RUN/redis-$PROFILE.log" 2>/dev/null || true; fail "Redis did not answer on 127.0.0.1:$REDIS_PORT (log: .local/run/redis-$PROFILE.log)"; }
  STARTED+=(redis)
}

stop_redis() {
  if redis_ping; then
    say "stopping Redis"
    redis-cli -h 127.0.0.1 -p "$REDIS_PORT" shutdown >/dev/null 2>&1 || true
    local pid; pid="$(cat "$REDIS_PID" 2>/dev/null || true)"
    for _ in $(seq 1 50); do [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
  fi
}

# start_worker NAME — one campaign worker process (server/campaigns/worker-main.ts); more can run
# on any machine with `npm run worker` pointed at the same Redis and MariaDB.
start_worker() {
  start_bg "$1" node --conditions=react-server "$ROOT/scripts/run-bundled.mjs" server/campaigns/worker-main.ts
  sleep 0.5
  kill -0 "$(cat "$RUN/$1.pid")" 2>/dev/null || { tail -20 "$RUN/$1.log"; fail "the campaign worker exited (log: .local/run/$1.log)"; }
  say "campaign worker started (log: .local/run/$1.log)"
}

# ensure_database [fresh] — the app's database and user; "fresh" drops the database first (tests).
# The test profile also gets <name>_scratch, where the migrations test runs everything down and up.
ensure_database() {
  local names=("$DATABASE_NAME")
  [ "$PROFILE" = test ] && names+=("${DATABASE_NAME}_scratch")
  if [ "${1:-}" = fresh ]; then
    say "recreating database ${names[*]}"
    for n in "${names[@]}"; do db_root -e "DROP DATABASE IF EXISTS \`$n\`"; done
  fi
  say "ensuring database ${names[*]} and user $DATABASE_USER"
  db_root -e "CREATE USER IF NOT EXISTS '$DATABASE_USER'@'127.0.0.1' IDENTIFIED BY '$DATABASE_PASSWORD'; ALTER USER '$DATABASE_USER'@'127.0.0.1' IDENTIFIED BY '$DATABASE_PASSWORD';"
  for n in "${names[@]}"; do
    db_root -e "CREATE DATABASE IF NOT EXISTS \`$n\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON \`$n\`.* TO '$DATABASE_USER'@'127.0.0.1';"
  done
  db_root -e "FLUSH PRIVILEGES;"
}

migrate_and_seed() {
  cd "$ROOT"
  say "running migrations"
  MIGRATE_QUIET=1 node node_modules/tsx/dist/cli.mjs db/migrate.ts up
  say "seeding the demo scenario (once)"
  MIGRATE_QUIET=1 node node_modules/tsx/dist/cli.mjs db/migrate.ts seed
}

# start_bg NAME CMD... — start a background process in its own group, PID in .local/run/NAME.pid.
start_bg() {
  local name="$1"; shift
  local pidfile="$RUN/$name.pid"
  if [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; then
    say "$name already running (pid $(cat "$pidfile")), reusing it"
    return 0
  fi
  setsid "$@" >"$RUN/$name.log" 2>&1 </dev/null &
  echo $! > "$pidfile"
  STARTED+=("$name")
}

# service_running NAME — a service of this checkout is already up (start_bg will reuse it).
service_running() {
  local pidfile="$RUN/$1.pid"
  [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null
}

stop_bg() {
  local name="$1" pidfile="$RUN/$1.pid"
  [ -f "$pidfile" ] || return 0
  local pid; pid="$(cat "$pidfile")"
  if kill -0 "$pid" 2>/dev/null; then
    say "stopping $name (pid $pid)"
    kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
    for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    kill -KILL -- "-$pid" 2>/dev/null || true
  fi
  rm -f "$pidfile"
}

# wait_http URL SECONDS NAME — until the URL answers (any HTTP status).
wait_http() {
  local url="$1" secs="$2" name="$3"
  local pidfile="$RUN/$name.pid"
  for _ in $(seq 1 $((secs * 5))); do
    if curl -s -o /dev/null "$url"; then return 0; fi
    if [ -f "$pidfile" ] && ! kill -0 "$(cat "$pidfile")" 2>/dev/null; then break; fi
    sleep 0.2
  done
  tail -30 "$RUN/$name.log" 2>/dev/null || true
  fail "$name did not answer at $url (exited, or not within ${secs}s) (log: .local/run/$name.log)"
}

start_mail() {
  service_running "mail-$PROFILE" || { require_port_free "$SMTP_PORT" "mail catcher SMTP"; require_port_free "$MAIL_WEB_PORT" "mail catcher inbox"; }
  start_bg "mail-$PROFILE" node "$ROOT/node_modules/maildev/dist/bin/maildev.js" --ip 127.0.0.1 --web-ip 127.0.0.1 -s "$SMTP_PORT" -w "$MAIL_WEB_PORT" --silent
  wait_http "http://127.0.0.1:$MAIL_WEB_PORT/api/email" 20 "mail-$PROFILE"
  say "mail catcher: smtp 127.0.0.1:$SMTP_PORT, inbox http://127.0.0.1:$MAIL_WEB_PORT/"
}

start_payments() {
  service_running "payments-$PROFILE" || require_port_free "$STRIPE_FAKE_PORT" "payments fake"
  STRIPE_FAKE_WEBHOOK_URL="$APP_URL/api/webhooks/stripe" STRIPE_FAKE_PUBLIC_URL="http://127.0.0.1:$STRIPE_FAKE_PORT" \
    start_bg "payments-$PROFILE" node "$ROOT/node_modules/tsx/dist/cli.mjs" "$ROOT/docker-local/stripe-fake/server.ts"
  wait_http "http://127.0.0.1:$STRIPE_FAKE_PORT/_fake/health" 30 "payments-$PROFILE"
  say "payments fake (Stripe-compatible): http://127.0.0.1:$STRIPE_FAKE_PORT"
}

build_if_needed() {
  cd "$ROOT"
  local stamp=".next/BUILD_ID"
  if [ ! -f "$stamp" ] || [ -n "$(find app components server db public fonts next.config.mjs tailwind.config.ts postcss.config.mjs package.json tsconfig.json instrumentation.ts proxy.ts -newer "$stamp" -type f 2>/dev/null | head -1)" ]; then
    say "building the app (next build)"
    node node_modules/next/dist/bin/next build
  else
    say "build is up to date"
  fi
}

# The web process's V8 old-space cap (MB). Far above what it uses (about 50 MB live when idle), but
# V8 grows the heap up to 4x its live size between full collections when the cap is 2 GB or more
# (Node's default on this machine) and only 1.3-2x below that: with 1 024 MB a million-site campaign
# upload peaks near 200 MB resident instead of about 340 MB (npm run bench:campaign -- --million-upload).
WEB_HEAP_MB="${WEB_HEAP_MB:-1024}"

start_app() {
  service_running "app-$PROFILE" || require_port_free "$APP_PORT" "app"
  start_bg "app-$PROFILE" node --max-old-space-size="$WEB_HEAP_MB" "$ROOT/node_modules/next/dist/bin/next" start -p "$APP_PORT"
  wait_http "http://127.0.0.1:$APP_PORT/api/health" 60 "app-$PROFILE"
}

stop_started() {
  local i
  for (( i=${#STARTED[@]}-1; i>=0; i-- )); do
    case "${STARTED[$i]}" in
      mariadb) stop_mariadb ;;
      redis) stop_redis ;;
      *) stop_bg "${STARTED[$i]}" ;;
    esac
  done
  STARTED=()
}
