#!/usr/bin/env bash
# For contributors: start the "dev" services (separate ports and data from demo and test),
# migrate, and write .data/dev/env to source before running single tests:
#   bash scripts/dev-env.sh && set -a && . .data/dev/env && set +a
#   ./node_modules/.bin/vitest run --config tests/vitest.config.ts tests/some.test.ts
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
bash scripts/services.sh start dev
envfile=.data/dev/env
if [ ! -f "$envfile" ]; then
  {
    bash scripts/services.sh env dev
    echo "RISELINE_MODE=test"
    echo "BETTER_AUTH_SECRET=$(head -c 48 /dev/urandom | base64 | tr -d '/+=' | head -c 48)"
    echo "BETTER_AUTH_URL=http://127.0.0.1:$(app_port dev)"
    echo "AUTH_RATE_LIMIT=off"
  } >"$envfile"
fi
set -a; . "$envfile"; set +a
./node_modules/.bin/tsx scripts/migrate.ts
