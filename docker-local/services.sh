#!/usr/bin/env bash
# Start the services a single test file needs and leave them running:
#   bash docker-local/services.sh test     (then: npx vitest run tests/integration/x.test.ts)
#   bash docker-local/services.sh stop     (stops the database, Redis, mail catcher and payments fake)
# No campaign worker is started here: tests start their own (tests/integration/support/campaign-worker.ts).
. "$(dirname "$0")/lib.sh"
case "${1:-test}" in
  test)
    PROFILE=test; load_env test
    ensure_node_modules; start_mariadb; start_redis; ensure_database; migrate_and_seed
    write_test_env
    start_mail; start_payments
    say "services left running; stop them with: bash docker-local/services.sh stop" ;;
  stop)
    PROFILE=test; load_env test
    for f in "$RUN"/*.pid; do [ -e "$f" ] || continue; n="$(basename "$f" .pid)"; [ "$n" = mariadb ] || stop_bg "$n"; done
    stop_redis; stop_mariadb ;;
  *) fail "usage: services.sh test|stop" ;;
esac
