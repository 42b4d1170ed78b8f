#!/usr/bin/env bash
# npm run dev: the same set-up as npm start, then Nuxt's dev server with hot reload.
source "$(dirname "$0")/setup.sh"
ensure_deps
setup_database emberline
export PORT="${PORT:-3000}"
exec npx nuxt dev --port "$PORT"
