#!/usr/bin/env bash
# npm test: the same set-up as npm start against a separate, freshly created test database,
# then lint, typecheck, unit, API (built server + real PostgreSQL) and browser (Chromium) tests.
# Lint and typecheck run in the background beside the database set-up, the unit tests and the build
# (each is one process on one core); their verdict is awaited before the server tests start.
source "$(dirname "$0")/setup.sh"
# The test database only: cheap scrypt for its seeded accounts and its servers (server/utils/password-cost.ts).
export EMBERLINE_PASSWORD_HASH_COST=${EMBERLINE_PASSWORD_HASH_COST:-test}
started=$(date +%s)
ensure_deps
cd "$ROOT"
checks="$DATA/test-checks"; rm -rf "$checks"; mkdir -p "$checks"
say "lint (eslint) and typecheck (vue-tsc) in the background"
(npx eslint . --max-warnings 0 >"$checks/lint.log" 2>&1; echo $? >"$checks/lint.rc") &
lint_pid=$!
(npx vue-tsc -b --noEmit >"$checks/typecheck.log" 2>&1; echo $? >"$checks/typecheck.rc") &
typecheck_pid=$!
trap 'kill $lint_pid $typecheck_pid 2>/dev/null || true' EXIT

if [ -n "${EMBERLINE_TEST_DATABASE_URL:-}" ]; then
  export NUXT_DATABASE_URL=$EMBERLINE_TEST_DATABASE_URL
  setup_database emberline_test keep
else
  EMBERLINE_USE_GIVEN_DB=0 setup_database emberline_test fresh
fi
# The test database gets its own test mail server, apart from the demo lab's on 2525.
SMTP_PORT="${EMBERLINE_TEST_SMTP_PORT:-2526}"
EMBERLINE_FAKE_SMTP_PORT=$SMTP_PORT bash "$ROOT/scripts/mail.sh" start
trap 'kill $lint_pid $typecheck_pid 2>/dev/null || true; EMBERLINE_FAKE_SMTP_PORT=$SMTP_PORT bash "$ROOT/scripts/mail.sh" stop >/dev/null 2>&1 || true' EXIT
export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT=$SMTP_PORT

if [ ! -x /usr/bin/chromium ]; then
  say "installing Debian's chromium for the browser tests"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq && apt-get install -y -qq --no-install-recommends chromium >/dev/null
fi

say "unit and component tests"; npx vitest run --project unit --project nuxt
ensure_build
wait $lint_pid $typecheck_pid || true
for check in lint typecheck; do
  if [ "$(cat "$checks/$check.rc" 2>/dev/null)" != 0 ]; then cat "$checks/$check.log"; say "$check failed"; exit 1; fi
  say "$check passed"
done
# The browser tests get a database of their own, prepared while the API tests run: a lab the API tests have filled
# with hundreds of vessels and runs makes every page slower and changes what a day plan can hold.
own_browser_db=0
if [ -z "${EMBERLINE_TEST_DATABASE_URL:-}" ]; then
  own_browser_db=1
  (EMBERLINE_USE_GIVEN_DB=0 setup_database emberline_browser fresh >"$checks/browser-db.log" 2>&1; echo $? >"$checks/browser-db.rc") &
  browser_db_pid=$!
fi
say "API tests (built server, PostgreSQL)"; npx vitest run --project api
if [ "$own_browser_db" = 1 ]; then
  wait $browser_db_pid || true
  if [ "$(cat "$checks/browser-db.rc" 2>/dev/null)" != 0 ]; then cat "$checks/browser-db.log"; say "preparing the browser tests' database failed"; exit 1; fi
  NUXT_DATABASE_URL=$(local_db_url emberline_browser)
  export NUXT_DATABASE_URL
fi
EMBERLINE_FAKE_SMTP_PORT=$SMTP_PORT bash "$ROOT/scripts/mail.sh" start
say "browser tests (Chromium)"; npx vitest run --project browser
say "all checks passed in $(( $(date +%s) - started )) s"
