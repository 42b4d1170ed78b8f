#!/usr/bin/env bash
# npm test: the same set-up as npm start against a separate, freshly created test database,
# then lint, typecheck, unit, API (built server + real PostgreSQL) and browser (Chromium) tests.
source "$(dirname "$0")/setup.sh"
started=$(date +%s)
ensure_deps
if [ -n "${EMBERLINE_TEST_DATABASE_URL:-}" ]; then
  export NUXT_DATABASE_URL=$EMBERLINE_TEST_DATABASE_URL
  setup_database emberline_test keep
else
  EMBERLINE_USE_GIVEN_DB=0 setup_database emberline_test fresh
fi
# The test database gets its own test mail server, apart from the demo lab's on 2525.
SMTP_PORT="${EMBERLINE_TEST_SMTP_PORT:-2526}"
EMBERLINE_FAKE_SMTP_PORT=$SMTP_PORT bash "$ROOT/scripts/mail.sh" start
trap 'EMBERLINE_FAKE_SMTP_PORT=$SMTP_PORT bash "$ROOT/scripts/mail.sh" stop >/dev/null 2>&1 || true' EXIT
export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT=$SMTP_PORT

if [ ! -x /usr/bin/chromium ]; then
  say "installing Debian's chromium for the browser tests"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq && apt-get install -y -qq --no-install-recommends chromium >/dev/null
fi

cd "$ROOT"
say "lint (eslint)";            npx eslint . --max-warnings 0
say "typecheck (vue-tsc)";      npx vue-tsc -b --noEmit
say "unit tests";               npx vitest run --project unit
ensure_build
say "API tests (built server, PostgreSQL)"; npx vitest run --project api
say "browser tests (Chromium)"; npx vitest run --project browser
say "all checks passed in $(( $(date +%s) - started )) s"
