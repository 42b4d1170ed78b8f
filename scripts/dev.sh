#!/usr/bin/env bash
# npm run dev: the same set-up as npm start, then Nuxt's dev server with hot reload.
source "$(dirname "$0")/setup.sh"
ensure_deps
setup_database emberline
# Without a real SMTP server (NUXT_SMTP_HOST), mail goes to the built-in test mail server (admin → Mail).
if [ -z "${NUXT_SMTP_HOST:-}" ]; then
  bash "$ROOT/scripts/mail.sh" start || say "continuing without the test mail server; e-mail waits in the outbox"
  export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT="${EMBERLINE_FAKE_SMTP_PORT:-2525}"
fi
export PORT="${PORT:-3000}"
export NUXT_PUBLIC_SITE_URL="${NUXT_PUBLIC_SITE_URL:-http://localhost:$PORT}"
exec npx nuxt dev --port "$PORT"
