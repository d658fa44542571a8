# Shared steps of scripts/demo.sh and scripts/test.sh (sourced, not run).

say() { printf '\033[1;36m•\033[0m %s\n' "$*"; }

# npm ci when node_modules is missing or older than package-lock.json.
ensure_node_modules() {
  local want have
  want=$(sha256sum package-lock.json | cut -d' ' -f1)
  have=$(cat node_modules/.riseline-lock 2>/dev/null || true)
  if [ ! -d node_modules ] || [ "$want" != "$have" ]; then
    say "Installing npm packages (npm ci)…"
    npm ci --no-audit --no-fund --loglevel=error
    echo "$want" > node_modules/.riseline-lock
  fi
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    say "Installing Chromium from Debian's packages (browser journeys)…"
    if [ "$(id -u)" = 0 ]; then
      apt-get update -qq
      DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
    elif sudo -n true 2>/dev/null; then
      sudo apt-get update -qq
      sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
    else
      echo "Chromium is not installed and this user cannot install it: run 'apt-get install chromium' as root once." >&2
      return 1
    fi
  fi
}

# The app's port for a profile (3000 demo, 3100 test, 3200 dev, 3300 bench, 3400 faults), moved by RISELINE_PORT_OFFSET.
app_port() {
  local base
  case "$1" in demo) base=3000 ;; test) base=3100 ;; dev) base=3200 ;; bench) base=3300 ;; faults) base=3400 ;; *) return 2 ;; esac
  echo $((base + ${RISELINE_PORT_OFFSET:-0}))
}

random_secret() { head -c 48 /dev/urandom | base64 | tr -d '/+=\n' | head -c 48; }

# Waits until the URL answers 200 (up to $2 seconds).
wait_for_url() {
  local url=$1 seconds=${2:-60}
  for _ in $(seq 1 $((seconds * 2))); do
    curl -sf -o /dev/null "$url" && return 0
    sleep 0.5
  done
  return 1
}

# Stops a process group started with setsid, whose leader's pid is in the file $1.
stop_group() {
  local pidfile=$1 pid
  [ -f "$pidfile" ] || return 0
  pid=$(cat "$pidfile")
  kill -TERM -- "-$pid" 2>/dev/null || true
  for _ in $(seq 1 30); do kill -0 "$pid" 2>/dev/null || break; sleep 0.2; done
  kill -KILL -- "-$pid" 2>/dev/null || true
  rm -f "$pidfile"
}

# Runs a command in its own process group (setsid) and starts it again whenever it exits, with a
# message and back-off (1 s, doubling up to 30 s; back to 1 s after a run of a minute or more),
# until the caller's INT/TERM trap sets SUPERVISING=0. Output is appended to the log file.
#   supervise NAME PIDFILE LOGFILE [--ready FUNCTION] -- COMMAND...
# FUNCTION, if given, runs once after the first start (e.g. to wait for the health check); if it
# fails the supervisor returns 1.
supervise() {
  local name=$1 pidfile=$2 logfile=$3 ready="" delay=1 started rc
  shift 3
  if [ "${1:-}" = "--ready" ]; then ready=$2; shift 2; fi
  [ "${1:-}" = "--" ] && shift
  SUPERVISING=1
  while [ "$SUPERVISING" = 1 ]; do
    started=$(date +%s)
    setsid "$@" >>"$logfile" 2>&1 &
    echo $! >"$pidfile"
    if [ -n "$ready" ]; then
      "$ready" || return 1
      ready=""
    fi
    rc=0
    wait "$(cat "$pidfile")" || rc=$?
    [ "$SUPERVISING" = 1 ] || break
    if [ $(($(date +%s) - started)) -ge 60 ]; then delay=1; fi
    say "$name stopped (exit $rc) at $(date +%H:%M:%S); starting it again in $delay s. The other services keep running. Its log: $logfile"
    sleep "$delay" &
    SUPERVISE_SLEEP_PID=$!
    wait "$SUPERVISE_SLEEP_PID" || true
    delay=$((delay * 2 > 30 ? 30 : delay * 2))
  done
}

# Stops what supervise started: the command's process group and a back-off sleep, if any.
stop_supervised() {
  SUPERVISING=0
  if [ -n "${SUPERVISE_SLEEP_PID:-}" ]; then kill "$SUPERVISE_SLEEP_PID" 2>/dev/null || true; fi
  stop_group "$1"
}
