#!/usr/bin/env bash
# Runs chosen test files against a fresh test database and the current build (rebuilt when sources changed).
# Usage: bash scripts/test-some.sh <vitest project> [files...]   e.g.  bash scripts/test-some.sh api tests/api/plans.test.ts
source "$(dirname "$0")/setup.sh"
# The test database only: cheap scrypt for its seeded accounts and its server (server/utils/password-cost.ts).
export EMBERLINE_PASSWORD_HASH_COST=${EMBERLINE_PASSWORD_HASH_COST:-test}
project=${1:?name the vitest project: unit, nuxt, api or browser}; shift
ensure_deps
EMBERLINE_USE_GIVEN_DB=0 setup_database emberline_test fresh
SMTP_PORT="${EMBERLINE_TEST_SMTP_PORT:-2526}"
EMBERLINE_FAKE_SMTP_PORT=$SMTP_PORT bash "$ROOT/scripts/mail.sh" start
trap 'EMBERLINE_FAKE_SMTP_PORT=$SMTP_PORT bash "$ROOT/scripts/mail.sh" stop >/dev/null 2>&1 || true' EXIT
export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT=$SMTP_PORT
cd "$ROOT"
case "$project" in api|browser) ensure_build ;; esac
npx vitest run --project "$project" "$@"
