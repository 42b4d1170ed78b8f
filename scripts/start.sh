#!/usr/bin/env bash
# npm start: install, start PostgreSQL, migrate, load the demo lab, build when needed, serve.
source "$(dirname "$0")/setup.sh"
started=$(date +%s)
ensure_deps
setup_database emberline
# Without a real SMTP server (NUXT_SMTP_HOST), mail goes to the built-in test mail server (admin → Mail).
if [ -z "${NUXT_SMTP_HOST:-}" ]; then
  bash "$ROOT/scripts/mail.sh" start || say "continuing without the test mail server; e-mail waits in the outbox"
  export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT="${EMBERLINE_FAKE_SMTP_PORT:-2525}"
fi
ensure_build
export PORT="${PORT:-3000}"
# The public origin: requests naming another host are refused; set it to the address people use on the LAN.
export NUXT_PUBLIC_SITE_URL="${NUXT_PUBLIC_SITE_URL:-http://localhost:$PORT}"
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
exec node "$ROOT/scripts/serve.mjs"
