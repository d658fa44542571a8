#!/usr/bin/env bash
# Start or stop Riseline's local services for one profile, all on loopback.
#   scripts/services.sh start demo|test|dev|bench|faults     scripts/services.sh stop PROFILE
#   scripts/services.sh env PROFILE                   (prints the connection settings)
#   scripts/services.sh reset PROFILE                 (stops it and deletes its data)
#   scripts/services.sh pg-stop|pg-start|pg-pids|fakes-stop|fakes-start|fakes-pid PROFILE
#                                                     (one part at a time, for the fault tests)
# PostgreSQL comes from Debian's package; s3rver and the SMTP catcher run in scripts/fakes.mjs.
#
# RISELINE_PORT_OFFSET (default 0, a multiple of 1000) moves every port of every profile, so two
# checkouts on one machine can run their suites side by side.
#
# Where PostgreSQL keeps its data: PostgreSQL refuses to run as root. Run as root, the server runs
# as Debian's `postgres` user, which cannot enter a checkout in a private folder (mode 0700, as
# `mktemp -d` makes and as root's home is); so its data directory, socket and log then live under
# that user's own home, /var/lib/postgresql/riseline/<checkout id>/<profile>. Run as anyone else,
# the server runs as that user, with its data inside the checkout (.data/<profile>/pg).
set -euo pipefail
cd "$(dirname "$0")/.."
action=${1:?start|stop}
profile=${2:?demo|test|dev|bench|faults}

case "$profile" in
  demo) PG_PORT=54329; S3_PORT=4569; SMTP_PORT=2525 ;;
  test) PG_PORT=54339; S3_PORT=4579; SMTP_PORT=2535 ;;
  dev) PG_PORT=54349; S3_PORT=4589; SMTP_PORT=2545 ;;
  bench) PG_PORT=54359; S3_PORT=4599; SMTP_PORT=2555 ;;
  faults) PG_PORT=54369; S3_PORT=4609; SMTP_PORT=2565 ;;
  *) echo "unknown profile $profile" >&2; exit 2 ;;
esac
OFFSET=${RISELINE_PORT_OFFSET:-0}
PG_PORT=$((PG_PORT + OFFSET)); S3_PORT=$((S3_PORT + OFFSET)); SMTP_PORT=$((SMTP_PORT + OFFSET))
ROOT="$PWD/.data/$profile"
PGBIN=/usr/lib/postgresql/15/bin
BUCKET="riseline-$profile"
if [ "$(id -u)" = 0 ]; then
  PG_HOME="/var/lib/postgresql/riseline/$(printf '%s' "$PWD" | sha256sum | cut -c1-12)/$profile"
else
  PG_HOME="$ROOT"
fi
PGDATA="$PG_HOME/pg"
SOCKDIR="$PG_HOME/run"
PGLOG="$PG_HOME/pg.log"

# Runs a PostgreSQL binary as the user the server runs as (see the top of this file).
# As root it starts from / : the postgres user cannot enter a private checkout, which would make
# each PostgreSQL tool warn "could not change directory" (every path it gets is absolute).
as_pg() { if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi; }

ensure_postgres_installed() {
  if [ ! -x "$PGBIN/postgres" ]; then
    echo "• Installing PostgreSQL from Debian's packages…"
    if [ "$(id -u)" = 0 ]; then
      apt-get update -qq
      DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
    elif sudo -n true 2>/dev/null; then
      sudo apt-get update -qq
      sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
    else
      echo "PostgreSQL 15 is not installed and this user cannot install it: run 'apt-get install postgresql' as root once." >&2
      exit 1
    fi
  fi
  # Debian's package starts a cluster of its own; we use a private one, so stop that.
  if command -v pg_lsclusters >/dev/null && pg_lsclusters -h 2>/dev/null | grep -q online; then
    pg_ctlcluster --force 15 main stop >/dev/null 2>&1 || true
  fi
}

pg_running() { [ -f "$PGDATA/postmaster.pid" ] && as_pg "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; }

start_pg() {
  ensure_postgres_installed
  mkdir -p "$ROOT"
  if [ "$(id -u)" = 0 ]; then
    install -d -o postgres -g postgres -m 700 "$PG_HOME" "$PGDATA" "$SOCKDIR"
    touch "$PGLOG" && chown postgres "$PGLOG"
    ln -sfn "$PG_HOME" "$ROOT/postgres" # where to look for the server's data and log
  else
    install -d -m 700 "$PGDATA" "$SOCKDIR"
  fi
  if [ ! -f "$PGDATA/PG_VERSION" ]; then
    as_pg "$PGBIN/initdb" -D "$PGDATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if ! pg_running; then
    as_pg "$PGBIN/pg_ctl" -D "$PGDATA" -l "$PGLOG" -w \
      -o "-c listen_addresses=127.0.0.1 -c port=$PG_PORT -c unix_socket_directories=$SOCKDIR -c fsync=off" start >/dev/null
  fi
  for _ in $(seq 1 30); do pg_isready -q -h 127.0.0.1 -p "$PG_PORT" -U postgres && break; sleep 0.5; done
  psql -h 127.0.0.1 -p "$PG_PORT" -U postgres -tAc "SELECT 1 FROM pg_database WHERE datname='riseline'" | grep -q 1 \
    || psql -h 127.0.0.1 -p "$PG_PORT" -U postgres -qc "CREATE DATABASE riseline" >/dev/null
}

stop_pg() {
  if pg_running; then as_pg "$PGBIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null || true; fi
}

start_fakes() {
  mkdir -p "$ROOT/run"
  if [ -f "$ROOT/run/fakes.pid" ] && kill -0 "$(cat "$ROOT/run/fakes.pid")" 2>/dev/null; then return; fi
  # s3rver pages a long listing with a DES continuation token: DES is in OpenSSL 3's legacy provider.
  setsid node --openssl-legacy-provider scripts/fakes.mjs --s3-dir "$ROOT/s3" --s3-port "$S3_PORT" --bucket "$BUCKET" \
    --smtp-port "$SMTP_PORT" --mail-dir "$ROOT/mail" >"$ROOT/fakes.log" 2>&1 &
  echo $! >"$ROOT/run/fakes.pid"
  for _ in $(seq 1 40); do grep -q "smtp catcher" "$ROOT/fakes.log" 2>/dev/null && return; sleep 0.25; done
  echo "The S3 fake or the SMTP catcher did not start; see $ROOT/fakes.log" >&2; cat "$ROOT/fakes.log" >&2; exit 1
}

stop_fakes() {
  if [ -f "$ROOT/run/fakes.pid" ]; then
    pid=$(cat "$ROOT/run/fakes.pid")
    kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
    for _ in $(seq 1 20); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    kill -KILL -- "-$pid" 2>/dev/null || true
    rm -f "$ROOT/run/fakes.pid"
  fi
}

case "$action" in
  start) start_pg; start_fakes ;;
  stop) stop_fakes; stop_pg ;;
  env)
    cat <<ENV
DATABASE_URL=postgres://postgres@127.0.0.1:$PG_PORT/riseline
S3_ENDPOINT=http://127.0.0.1:$S3_PORT
S3_BUCKET=$BUCKET
S3_ACCESS_KEY_ID=S3RVER
S3_SECRET_ACCESS_KEY=S3RVER
SMTP_HOST=127.0.0.1
SMTP_PORT=$SMTP_PORT
MAILBOX_DIR=$ROOT/mail
ENV
    ;;
  pgdata) echo "$PGDATA" ;;
  # The postmaster and its backends (for the fault tests' SIGSTOP/SIGCONT: a frozen database).
  pg-pids) if pg_running; then pm=$(head -1 "$PGDATA/postmaster.pid"); echo "$pm" $(pgrep -P "$pm"); fi ;;
  pg-stop) if pg_running; then as_pg "$PGBIN/pg_ctl" -D "$PGDATA" -m immediate -w stop >/dev/null; fi ;;
  pg-start) start_pg ;;
  fakes-stop) stop_fakes ;;
  fakes-start) start_fakes ;;
  fakes-pid) cat "$ROOT/run/fakes.pid" ;;
  reset) stop_fakes; stop_pg; rm -rf "$PG_HOME" "$ROOT" ;;
  *) echo "unknown action $action" >&2; exit 2 ;;
esac
