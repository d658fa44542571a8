#!/usr/bin/env bash
# `npm run bench:api`: upload-to-verdict latency of POST /api/tests against `next start`.
# Services: the contributors' "dev" profile (scripts/dev-env.sh starts it if needed, migrates, and
# is left running; its data is throw-away). The bench makes its own shop in that database.
# Builds first when .next is absent or older than the sources; serves on 127.0.0.1:3300 and
# stops that server (only it) at the end. Loopback only.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
export NEXT_TELEMETRY_DISABLED=1
PORT=${BENCH_PORT:-3300}
ROOT=.data/bench
mkdir -p "$ROOT/run"

bash scripts/dev-env.sh >/dev/null
set -a; . .data/dev/env; set +a
export BETTER_AUTH_URL="http://127.0.0.1:$PORT" RISELINE_MODE=test

stale() {
  [ -f .next/BUILD_ID ] || return 0
  [ -n "$(find app lib db analysis components next.config.ts package-lock.json -newer .next/BUILD_ID -type f -print -quit 2>/dev/null)" ]
}
if stale; then
  say "Building (next build)…"
  flock /tmp/riseline-next-build.lock ./node_modules/.bin/next build >"$ROOT/build.log" 2>&1 || { tail -40 "$ROOT/build.log"; exit 1; }
fi

cleanup() { stop_group "$ROOT/run/next.pid"; }
trap cleanup EXIT
setsid ./node_modules/.bin/next start -H 127.0.0.1 -p "$PORT" >"$ROOT/next.log" 2>&1 &
echo $! >"$ROOT/run/next.pid"
wait_for_url "http://127.0.0.1:$PORT/api/health" 90 || { tail -30 "$ROOT/next.log"; exit 1; }

./node_modules/.bin/tsx scripts/bench-api.ts "http://127.0.0.1:$PORT"
