#!/usr/bin/env bash
# `npm test`: the same bootstrap against a separate test database and ports, then every test:
# vitest unit + integration (real MariaDB, mail catcher, payments fake) and Playwright in Debian's chromium.
. "$(dirname "$0")/lib.sh"
PROFILE=test
load_env test
trap 'stop_started' EXIT
trap 'exit 130' INT TERM
T0=$(date +%s)

ensure_node_modules
apt_install chromium /usr/bin/chromium
# pdftotext / pdftoppm: the PDF tests read the study and quote PDFs back as text and pages.
apt_install poppler-utils /usr/bin/pdftotext
start_mariadb
start_redis
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" flushall >/dev/null
ensure_database fresh
migrate_and_seed
# Integration tests and single-file runs read the test environment from here.
write_test_env
start_mail
start_payments

results=()
status=0
say "type check (tsc --noEmit, tests included)"
if node node_modules/typescript/bin/tsc --noEmit -p tsconfig.json; then results+=("types: ok"); else results+=("types: FAILED"); status=1; fi
# Errors and warnings both fail: the tree is at zero of each, so a warning is a new finding to fix
# (or configure in eslint.config.mjs with the reason written there), not noise to accumulate.
say "eslint (eslint.config.mjs; errors and warnings fail)"
if node node_modules/eslint/bin/eslint.js . --max-warnings=0; then results+=("lint: ok"); else results+=("lint: FAILED"); status=1; fi
say "vitest: unit and integration tests"
if node node_modules/vitest/vitest.mjs run; then results+=("vitest: passed"); else results+=("vitest: FAILED"); status=1; fi

build_if_needed
start_app
# The browser specs submit campaigns: one worker computes them.
start_worker "worker-$PROFILE"
say "playwright: browser tests in /usr/bin/chromium"
if PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD=1 node node_modules/@playwright/test/cli.js test; then results+=("playwright: passed"); else results+=("playwright: FAILED"); status=1; fi

say "summary: ${results[*]} — $( [ $status = 0 ] && echo ALL TESTS PASSED || echo SOME TESTS FAILED ) in $(( $(date +%s) - T0 ))s"
exit $status
