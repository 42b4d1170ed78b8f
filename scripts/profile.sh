#!/usr/bin/env bash
# CPU profile of the built server (one worker) under load on one route, signed in as the analyst of the demo lab:
#   EMBERLINE_PG_PORT=… bash scripts/profile.sh /api/settings [seconds] [connections]
# Needs the demo lab (npm start once) and a build. Writes .data/profiles/<route>-<time>.cpuprofile and prints its
# summary (scripts/profile-summary.mjs).
source "$(dirname "$0")/lib.sh"
route=${1:?name a route, e.g. /api/settings or /}
seconds=${2:-6}
connections=${3:-10}
load_secrets
export NUXT_DATABASE_URL
NUXT_DATABASE_URL=$(local_db_url "${EMBERLINE_PROFILE_DB:-emberline}")
out="$DATA/profiles"
mkdir -p "$out"
PORT=$(node -e "const s = require('net').createServer(); s.listen(0, '127.0.0.1', () => { console.log(s.address().port); s.close() })")
dir=$(mktemp -d "$out/run.XXXX")
launched=$(date +%s%3N)
PORT=$PORT NITRO_HOST=127.0.0.1 NODE_ENV=production NUXT_PUBLIC_SITE_URL="http://127.0.0.1:$PORT" \
  node --cpu-prof --cpu-prof-dir="$dir" "${EMBERLINE_BUILD_DIR:-$ROOT}/.output/server/index.mjs" >"$dir/server.log" 2>&1 &
pid=$!
trap 'kill "$pid" 2>/dev/null || true' EXIT
for _ in $(seq 1 100); do
  node -e "fetch('http://127.0.0.1:$PORT/api/health').then(r => process.exit(r.ok ? 0 : 1), () => process.exit(1))" && break
  sleep 0.3
done
read -r requests from to < <(EMBERLINE_LOAD_URL="http://127.0.0.1:$PORT" node "$ROOT/scripts/profile-load.mjs" "$route" "$seconds" "$connections")
kill -INT "$pid"
wait "$pid" 2>/dev/null || true
trap - EXIT
name=$(echo "$route" | tr '/' '_' | sed 's/^_//; s/^$/today/')
file="$out/${name:-today}-$(date +%H%M%S).cpuprofile"
mv "$dir"/*.cpuprofile "$file"
echo "$requests requests in $seconds s with $connections connections → $file"
# Only the measured part counts: start-up, sign-in and warm-up are left out.
node "$ROOT/scripts/profile-summary.mjs" "$file" --requests "$requests" --from-ms $((from - launched)) --to-ms $((to - launched)) --top "${EMBERLINE_PROFILE_TOP:-25}"
