#!/usr/bin/env bash
# `npm run bench:api`: upload-to-verdict latency of POST /api/vacuum-tests against `next start`.
# Services: a "bench" profile of its own (PostgreSQL, the S3 fake and the mail catcher on
# loopback, fresh data each run), so nothing else on the machine shares its database and the CPU
# each process spends per upload can be read from /proc. Builds first when .next is absent or
# older than the sources; serves on 127.0.0.1:3300; stops the server and the bench services at
# the end (nothing is left running). Loopback only.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
ensure_node_modules
ensure_chromium || exit 1 # the first-load JavaScript is read in a real browser
export NEXT_TELEMETRY_DISABLED=1
PORT=${BENCH_PORT:-$(app_port bench)}
ROOT=.data/bench
bash scripts/services.sh reset bench >/dev/null 2>&1 || true # fresh data, and a run interrupted earlier
mkdir -p "$ROOT/run"

cleanup() {
  stop_group "$ROOT/run/next.pid"
  bash scripts/services.sh stop bench || true
}
trap cleanup EXIT
bash scripts/services.sh start bench
set -a
eval "$(bash scripts/services.sh env bench)"
RISELINE_MODE=test
BETTER_AUTH_SECRET=$(head -c 48 /dev/urandom | base64 | tr -d '/+=' | head -c 48)
BETTER_AUTH_URL="http://127.0.0.1:$PORT"
AUTH_RATE_LIMIT=off
set +a
./node_modules/.bin/tsx scripts/migrate.ts >/dev/null

stale() {
  [ -f .next/BUILD_ID ] || return 0
  [ -n "$(find app lib db analysis components next.config.ts package-lock.json -newer .next/BUILD_ID -type f -print -quit 2>/dev/null)" ]
}
if stale; then
  say "Building (next build)…"
  flock /tmp/riseline-next-build.lock sh -c "./node_modules/.bin/next build && ./node_modules/.bin/serwist build serwist.config.mjs" >"$ROOT/build.log" 2>&1 || { tail -40 "$ROOT/build.log"; exit 1; }
fi

# SERVER_NODE_FLAGS: node flags for the server only (profiling, e.g. --cpu-prof --cpu-prof-dir=DIR);
# node refuses most of them in NODE_OPTIONS, and NODE_OPTIONS would reach the fakes and the client too.
# shellcheck disable=SC2086
setsid node ${SERVER_NODE_FLAGS:-} ./node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$PORT" >"$ROOT/next.log" 2>&1 &
echo $! >"$ROOT/run/next.pid"
wait_for_url "http://127.0.0.1:$PORT/api/health" 90 || { tail -30 "$ROOT/next.log"; exit 1; }

BENCH_PG_PID_FILE="$(bash scripts/services.sh pgdata bench)/postmaster.pid" BENCH_FAKES_PID_FILE="$ROOT/run/fakes.pid" \
  ./node_modules/.bin/tsx scripts/bench-api.ts "http://127.0.0.1:$PORT"
