#!/usr/bin/env bash
# npm start: install, start PostgreSQL, migrate, load the demo lab, build when needed, serve.
source "$(dirname "$0")/setup.sh"
started=$(date +%s)
ensure_deps
setup_database emberline
ensure_build
export PORT="${PORT:-3000}"
export NITRO_HOST="${HOST:-0.0.0.0}"
cat <<MSG

  Emberline is ready in $(( $(date +%s) - started )) s:  http://localhost:$PORT

  Demo accounts (password ember-demo-2026 — change it before real use):
    analyst@emberline.test      plans batches, records firings
    analyst2@emberline.test     a second analyst
    supervisor@emberline.test   signs exceptions and results
    technician@emberline.test   services vessels
    admin@emberline.test        users, vessels, policy

MSG
exec node "$ROOT/.output/server/index.mjs"
