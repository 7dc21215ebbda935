# Helpers shared by scripts/start and scripts/test. Source it; do not run it.
ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)
cd "$ROOT"

say() { printf '\033[1m[panelpass]\033[0m %s\n' "$*" >&2; }

as_root() {
  if [ "$(id -u)" -eq 0 ]; then "$@"; else sudo "$@"; fi
}

require_node() {
  command -v node >/dev/null || { say "Node.js 20 is needed (see .nvmrc)"; exit 1; }
  local major
  major=$(node -p 'process.versions.node.split(".")[0]')
  if [ "$major" -lt 20 ]; then say "Node.js $major is too old; Panelpass needs 20 (see .nvmrc)"; exit 1; fi
}

# npm packages: installed with `npm ci` when missing or when package-lock.json changed.
ensure_node_modules() {
  require_node
  local want have=""
  want=$(sha256sum package-lock.json | cut -c1-64)
  [ -f node_modules/.panelpass-lock ] && have=$(cat node_modules/.panelpass-lock)
  if [ "$want" != "$have" ] || [ ! -d node_modules/.bin ]; then
    say "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
    echo "$want" > node_modules/.panelpass-lock
  fi
}

apt_updated=""
apt_install() {
  if [ -z "$apt_updated" ]; then as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq; apt_updated=1; fi
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

# Debian's Chromium for the browser tests (never a browser download of a test tool).
ensure_chromium() {
  if [ ! -x "${CHROME_PATH:-/usr/bin/chromium}" ]; then
    say "installing Chromium from Debian's packages"
    apt_install chromium fonts-dejavu-core
  fi
  export CHROME_PATH=${CHROME_PATH:-/usr/bin/chromium}
}

# A JWT secret kept across restarts of scripts/start, so sessions survive them.
jwt_secret() {
  local f="$ROOT/.data/jwt-secret"
  mkdir -p "$ROOT/.data"
  [ -s "$f" ] || node -e 'process.stdout.write(require("crypto").randomBytes(48).toString("base64url"))' > "$f"
  chmod 600 "$f"
  cat "$f"
}

# Waits until an HTTP URL answers (any status), or fails after $2 seconds.
wait_for_http() {
  local url=$1 limit=${2:-60} i
  for ((i = 0; i < limit * 4; i++)); do
    if node -e "fetch('$url').then(()=>process.exit(0),()=>process.exit(1))" 2>/dev/null; then return 0; fi
    sleep 0.25
  done
  return 1
}
