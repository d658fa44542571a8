#!/usr/bin/env bash
# `npm run demo`: everything from a fresh clone to a running Riseline on http://127.0.0.1:3000.
# Installs what is missing, writes local secrets to .env (git-ignored) if absent, starts
# PostgreSQL, the S3 fake and the mail catcher on loopback, migrates, seeds the demo shop once,
# builds and serves. The app server is supervised: if it dies it is started again (with a message
# and back-off) while the other services keep running. Ctrl-C (or TERM) stops everything it
# started, and leaves no process behind.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
export NEXT_TELEMETRY_DISABLED=1

ensure_node_modules
PORT=$(app_port demo)

if [ ! -f .env ]; then
  say "Writing local configuration to .env (secrets generated here, never committed)"
  {
    echo "RISELINE_MODE=demo"
    bash scripts/services.sh env demo
    echo "BETTER_AUTH_SECRET=$(random_secret)"
    echo "BETTER_AUTH_URL=http://127.0.0.1:$PORT"
    echo "TRUSTED_ORIGINS=http://localhost:$PORT"
  } > .env
fi

ROOT=.data/demo
cleanup() {
  trap - EXIT INT TERM
  echo
  say "Stopping Riseline and its services…"
  stop_supervised "$ROOT/run/next.pid"
  bash scripts/services.sh stop demo
  say "Stopped. Nothing is left running; data stays in $ROOT for next time."
}
trap cleanup EXIT
trap 'SUPERVISING=0; exit 130' INT TERM

say "Starting PostgreSQL, the S3 fake and the mail catcher (loopback only)"
bash scripts/services.sh start demo
set -a; . ./.env; set +a

./node_modules/.bin/tsx scripts/migrate.ts
ENGINE_WORKER_ENTRY=source ./node_modules/.bin/tsx scripts/seed.ts

say "Building the app (next build)…"
{ ./node_modules/.bin/next build >"$ROOT/build.log" 2>&1 && ./node_modules/.bin/serwist build serwist.config.mjs >>"$ROOT/build.log" 2>&1; } || { tail -40 "$ROOT/build.log"; exit 1; }

mkdir -p "$ROOT/run"
: >"$ROOT/next.log"
app_ready() {
  wait_for_url "http://127.0.0.1:$PORT/api/health" 90 || { tail -30 "$ROOT/next.log"; return 1; }
  say "Riseline is running on http://127.0.0.1:$PORT  (caught e-mails: http://127.0.0.1:$PORT/dev/mailbox)"
  say "Press Ctrl-C to stop."
}
supervise "The Riseline app server" "$ROOT/run/next.pid" "$ROOT/next.log" --ready app_ready -- \
  ./node_modules/.bin/next start -H 127.0.0.1 -p "$PORT" || exit 1
