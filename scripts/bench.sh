#!/usr/bin/env bash
# npm run bench: the same set-up as npm test against its own fresh database (emberline_bench, or EMBERLINE_BENCH_DB),
# loaded with a large lab (scripts/bench-seed.ts), then the built server on a free port and scripts/bench.ts, which
# prints one markdown table. The server is stopped at the end.
source "$(dirname "$0")/setup.sh"
ensure_deps
EMBERLINE_USE_GIVEN_DB=0 setup_database "${EMBERLINE_BENCH_DB:-emberline_bench}" fresh
say "loading the large lab (50 vessels, 100,000 firings, 20,000 materials, 200,000 audit rows)"
npx tsx "$ROOT/scripts/bench-seed.ts"

cd "$ROOT"
if [ -n "${EMBERLINE_BUILD_DIR:-}" ]; then
  # A build of one's own (a parallel worktree): ensure_build only knows the default .output.
  OUTPUT="$EMBERLINE_BUILD_DIR/.output"
  [ -f "$OUTPUT/server/index.mjs" ] || { say "building the app into $EMBERLINE_BUILD_DIR"; npx nuxt build >"$DATA/bench-build.log" 2>&1 || { tail -40 "$DATA/bench-build.log"; exit 1; }; }
else
  ensure_build
  OUTPUT="$ROOT/.output"
fi

PORT=$(node -e "const s = require('net').createServer(); s.listen(0, '127.0.0.1', () => { console.log(s.address().port); s.close() })")
say "starting the built server on 127.0.0.1:$PORT"
PORT=$PORT NITRO_HOST=127.0.0.1 NODE_ENV=production NUXT_PUBLIC_SITE_URL="http://127.0.0.1:$PORT" EMBERLINE_SERVER_ENTRY="$OUTPUT/server/index.mjs" node "$ROOT/scripts/serve.mjs" >"$DATA/bench-server.log" 2>&1 &
SERVER_PID=$!
trap 'kill "$SERVER_PID" 2>/dev/null || true; wait "$SERVER_PID" 2>/dev/null || true' EXIT
healthy() { node -e "fetch('http://127.0.0.1:$PORT/api/health').then(r => process.exit(r.ok ? 0 : 1), () => process.exit(1))"; }
for _ in $(seq 1 100); do
  healthy && break
  kill -0 "$SERVER_PID" 2>/dev/null || { tail -20 "$DATA/bench-server.log"; exit 1; }
  sleep 0.3
done
healthy || { say "the server did not start"; tail -20 "$DATA/bench-server.log"; exit 1; }

EMBERLINE_BENCH_URL="http://127.0.0.1:$PORT" EMBERLINE_BENCH_SERVER_PID="$SERVER_PID" npx tsx scripts/bench.ts
