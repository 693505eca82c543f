# Shared by start.sh, test.sh and stop.sh (sourced, not run).
ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$ROOT"
export NEXT_TELEMETRY_DISABLED=1

install_node_modules() {
  if [[ ! -d node_modules || package-lock.json -nt node_modules/.package-lock.json ]]; then
    echo "Installing npm packages..."
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

# apt-get install only what is missing (Debian's packages).
apt_ensure() {
  local missing=() extra=()
  for spec in "$@"; do
    local pkg=${spec%%:*}
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q "ok installed" || missing+=("$pkg")
  done
  ((${#missing[@]})) || return 0
  echo "Installing Debian packages: ${missing[*]}"
  (apt-get update -qq || true) >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends -o DPkg::Lock::Timeout=600 "${missing[@]}" >/dev/null
}

# The toolchains that build the bundles' firmware images (firmware.md), from Debian's packages.
FIRMWARE_TOOLCHAINS=(make python3 gcc-avr avr-libc binutils-avr gcc-arm-none-eabi clang lld llvm msp430mcu gputils)

# Start a background process once, in a session of its own so that stopping
# it also stops its children (npx and tsx run the real program as a child);
# its pid goes to .data/run/<name>.pid.
start_bg() {
  local name=$1
  shift
  mkdir -p .data/run
  local pidfile=".data/run/$name.pid"
  if [[ -f $pidfile ]] && kill -0 "$(cat "$pidfile")" 2>/dev/null; then return 0; fi
  setsid nohup "$@" >".data/run/$name.log" 2>&1 &
  echo $! >"$pidfile"
}

stop_bg() {
  local pidfile=".data/run/$1.pid"
  if [[ -f $pidfile ]]; then
    local pid
    pid=$(cat "$pidfile")
    kill -TERM -- "-$pid" 2>/dev/null || kill "$pid" 2>/dev/null || true
    rm -f "$pidfile"
  fi
}

wait_for_url() {
  local url=$1 tries=${2:-120}
  for ((i = 0; i < tries; i++)); do
    curl -fsS -o /dev/null "$url" 2>/dev/null && return 0
    sleep 0.5
  done
  echo "Timed out waiting for $url" >&2
  return 1
}

# Waits until a background process's log shows a line (a worker says "ready").
wait_for_log() {
  local log=$1 text=$2 tries=${3:-240}
  for ((i = 0; i < tries; i++)); do
    grep -q "$text" "$log" 2>/dev/null && return 0
    sleep 0.5
  done
  echo "Timed out waiting for \"$text\" in $log" >&2
  tail -n 20 "$log" >&2 || true
  return 1
}

prepare_database() {
  bash scripts/pg.sh start
  npx tsx scripts/ensure-db.ts "$@"
  npx tsx scripts/migrate.ts
}

# `next build` / `next dev` with a NEXT_DIST_DIR of their own add that folder's
# types to tsconfig.json; keep the committed file as it is.
save_tsconfig() { cp tsconfig.json .data/run/tsconfig.json.saved; }
restore_tsconfig() { [[ -f .data/run/tsconfig.json.saved ]] && cp .data/run/tsconfig.json.saved tsconfig.json || true; }
