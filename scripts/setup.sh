# Prepares everything the app needs against one database: dependencies, PostgreSQL, secrets,
# migrations, the demo lab and a fresh build. Sourced by start.sh, dev.sh and test.sh with DB_NAME set.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

setup_database() {
  local name=$1 mode=${2:-keep}
  load_secrets
  if [ -n "${NUXT_DATABASE_URL:-}" ] && [ "${EMBERLINE_USE_GIVEN_DB:-1}" = 1 ] && [ "$mode" = keep ]; then
    say "using the PostgreSQL given in NUXT_DATABASE_URL"
  else
    say "starting the project's PostgreSQL (127.0.0.1:$EMBERLINE_PG_PORT)"
    if [ "$mode" = fresh ]; then bash "$ROOT/scripts/pg.sh" reset-db "$name" >/dev/null; else bash "$ROOT/scripts/pg.sh" ensure-db "$name" >/dev/null; fi
    export NUXT_DATABASE_URL
    NUXT_DATABASE_URL=$(local_db_url "$name")
  fi
  say "applying migrations"
  (cd "$ROOT" && npx tsx scripts/migrate.ts)
  say "loading the demo lab"
  (cd "$ROOT" && npx tsx scripts/seed.ts && npx tsx scripts/seed-care.ts && npx tsx scripts/seed-bench.ts && npx tsx scripts/seed-receipt.ts)
}
