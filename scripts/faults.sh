#!/usr/bin/env bash
# The fault tests (tests/faults/): on a "faults" profile of their own (PostgreSQL, the S3 fake and
# the catcher on their own ports, fresh data), which the tests stop, freeze and kill part by part;
# the server-kill test serves the production build in .next, so run `next build` first (npm test
# does). Short timeouts make each fault show within seconds. Writes its output to .data/faults/faults.log.
#   bash scripts/faults.sh [vitest args…]
set -uo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
export NEXT_TELEMETRY_DISABLED=1
ROOT=.data/faults
cleanup() { bash scripts/services.sh stop faults >/dev/null 2>&1 || true; }
trap cleanup EXIT
trap 'exit 130' INT TERM

bash scripts/services.sh reset faults >/dev/null 2>&1 || true
bash scripts/services.sh start faults || exit 1
set -a
eval "$(bash scripts/services.sh env faults)"
RISELINE_MODE=test
BETTER_AUTH_SECRET=$(random_secret)
BETTER_AUTH_URL=http://127.0.0.1:$(app_port faults)
AUTH_RATE_LIMIT=off
PG_CONNECT_TIMEOUT_MS=1500
PG_STATEMENT_TIMEOUT_MS=5000
S3_CONNECT_TIMEOUT_MS=1000
S3_REQUEST_TIMEOUT_MS=2000
SMTP_CONNECT_TIMEOUT_MS=2000
SMTP_SOCKET_TIMEOUT_MS=2000
FAULTS_PROFILE_ROOT=$PWD/$ROOT
set +a
./node_modules/.bin/tsx scripts/migrate.ts || exit 1
mkdir -p "$ROOT"
./node_modules/.bin/vitest run --config tests/faults/vitest.config.ts "$@" 2>&1 | tee "$ROOT/faults.log"
status=${PIPESTATUS[0]}
# No secret in these logs either (the servers' own logs and the tests' output).
logs=$(ls "$ROOT"/faults.log "$ROOT"/server-*.log 2>/dev/null | paste -sd, -)
LOG_SECRETS_FILES=$logs ./node_modules/.bin/vitest run --config tests/secrets/vitest.config.ts || status=1
exit "$status"
