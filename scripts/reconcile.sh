#!/usr/bin/env bash
# npm run reconcile [-- --json]: read-only check that every vessel's firing counters equal the firings recorded
# (scripts/reconcile.ts). Uses NUXT_DATABASE_URL, else the project's own cluster and its `emberline` database.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/pg-tools.sh"
NUXT_DATABASE_URL=$(database_url)
export NUXT_DATABASE_URL
cd "$ROOT"
exec npx tsx scripts/reconcile.ts "$@"
