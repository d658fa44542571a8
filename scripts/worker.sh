#!/usr/bin/env bash
# `npm run worker`: the background jobs on their own (scripts/worker.ts). Reads .env when there is
# one (the demo's, say); in a deployment the settings come from the environment.
set -euo pipefail
cd "$(dirname "$0")/.."
if [ -f .env ]; then set -a; . ./.env; set +a; fi
export ENGINE_WORKER_ENTRY=source
exec ./node_modules/.bin/tsx scripts/worker.ts
