#!/usr/bin/env bash
# `npm test`: the whole suite on its own services (separate database, bucket, ports, data dirs):
# type-check, lint, unit and integration tests (vitest), then the browser journeys against a
# production build, the fault tests (scripts/faults.sh: parts stopped, frozen and killed), two
# production servers over one database with faults (tests/cluster) and a check that no secret
# reached any log of the run. Stops everything it started; exits non-zero on any failure.
set -uo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
export NEXT_TELEMETRY_DISABLED=1 CI="${CI:-}"

ensure_node_modules || exit 1
ensure_chromium || exit 1

ROOT=.data/test
PORT=$(app_port test)
cleanup() {
  stop_group "$ROOT/run/next.pid"
  bash scripts/services.sh stop test
}
trap cleanup EXIT
trap 'exit 130' INT TERM

# A fresh start every run: empty database, bucket and mailbox.
bash scripts/services.sh stop test >/dev/null 2>&1 || true
rm -rf "$ROOT/s3" "$ROOT/mail" "$ROOT"/*.json
bash scripts/services.sh start test || exit 1
eval "$(bash scripts/services.sh env test)"
psql -q "${DATABASE_URL%/riseline}/postgres" -c "DROP DATABASE IF EXISTS riseline WITH (FORCE)" -c "CREATE DATABASE riseline" >/dev/null || exit 1

set -a
eval "$(bash scripts/services.sh env test)"
RISELINE_MODE=test
BETTER_AUTH_SECRET=$(random_secret)
BETTER_AUTH_URL=http://127.0.0.1:$PORT
AUTH_RATE_LIMIT=off
set +a

failed=()
step() {
  local name=$1; shift
  say "$name"
  if ! "$@"; then failed+=("$name"); fi
}

step "Migrations on an empty database" ./node_modules/.bin/tsx scripts/migrate.ts
step "Type-check" ./node_modules/.bin/tsc --noEmit -p .
step "Lint" ./node_modules/.bin/eslint -c scripts/eslint.config.mjs .
# Runs a command with its output also kept in a log file (the secrets check reads it).
logged() {
  local logfile=$1; shift
  "$@" 2>&1 | tee "$logfile"
  return "${PIPESTATUS[0]}"
}

step "Unit and integration tests" logged "$ROOT/unit.log" ./node_modules/.bin/vitest run --config tests/vitest.config.ts \
  --reporter=default --reporter=json --outputFile.json="$ROOT/unit.json"

say "Production build for the journeys"
if ./node_modules/.bin/next build >"$ROOT/build.log" 2>&1 && ./node_modules/.bin/serwist build serwist.config.mjs >>"$ROOT/build.log" 2>&1; then
  mkdir -p "$ROOT/run"
  setsid ./node_modules/.bin/next start -H 127.0.0.1 -p "$PORT" >"$ROOT/next.log" 2>&1 &
  echo $! >"$ROOT/run/next.pid"
  if wait_for_url "http://127.0.0.1:$PORT/api/health" 90; then
    step "Browser journeys (Chromium)" logged "$ROOT/journeys.log" ./node_modules/.bin/vitest run --config tests/journeys/vitest.config.ts \
      --reporter=default --reporter=json --outputFile.json="$ROOT/journeys.json"
    step "Fault tests (S3 stopped and frozen, PostgreSQL stopped, the server killed)" bash scripts/faults.sh \
      --reporter=default --reporter=json --outputFile.json="$PWD/$ROOT/faults.json"
    # The journeys' server stops first: the two servers of the next step start their own (ports
    # $PORT+1 and +2) and run the background jobs between them alone.
    stop_group "$ROOT/run/next.pid"
    step "Two servers, one database: a server killed, the mail server and the database down" \
      ./node_modules/.bin/vitest run --config tests/cluster/vitest.config.ts \
      --reporter=default --reporter=json --outputFile.json="$ROOT/cluster.json"
  else
    echo "The app did not start; last lines of $ROOT/next.log:"; tail -30 "$ROOT/next.log"
    failed+=("Start the app")
  fi
else
  tail -40 "$ROOT/build.log"
  failed+=("Production build")
fi

stop_group "$ROOT/run/next.pid" # its log is complete once it has stopped
step "No secret in any log of this run" env LOG_SECRETS_FILES="$ROOT/next.log,$ROOT/unit.log,$ROOT/journeys.log" \
  ./node_modules/.bin/vitest run --config tests/secrets/vitest.config.ts

node scripts/test-summary.mjs "$ROOT/unit.json" "$ROOT/journeys.json" "$ROOT/faults.json" "$ROOT/cluster.json"
if [ ${#failed[@]} -gt 0 ]; then
  printf 'Failed steps: %s\n' "${failed[*]}"
  exit 1
fi
echo "All steps passed."
