#!/usr/bin/env bash
# For contributors: one shared `next dev` on 127.0.0.1:3200 (moved by RISELINE_PORT_OFFSET) with the dev services (scripts/dev-env.sh).
# Journeys in development: APP env from .data/dev/env, then
#   ./node_modules/.bin/vitest run --config tests/journeys/vitest.config.ts tests/journeys/x.test.ts
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
PORT=$(app_port dev)
exec 9>"/tmp/riseline-dev-server-$PORT.lock"
flock 9
pidfile=.data/dev/run/next.pid
if [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; then echo "dev server already running"; exit 0; fi
set -a; . .data/dev/env; set +a
export NEXT_TELEMETRY_DISABLED=1
# The engine runs inline under `next dev`, so edits to analysis/ take effect without a restart.
export ENGINE_WORKERS=0
setsid ./node_modules/.bin/next dev -H 127.0.0.1 -p "$PORT" >.data/dev/next.log 2>&1 &
echo $! >"$pidfile"
for _ in $(seq 1 120); do curl -sf -o /dev/null "http://127.0.0.1:$PORT/api/health" && { echo "dev server on http://127.0.0.1:$PORT"; exit 0; }; sleep 1; done
echo "dev server did not answer; see .data/dev/next.log" >&2; exit 1
