# Helpers for benchmarks: a throwaway PostgreSQL cluster and a built server. Source it.
source "$(dirname "${BASH_SOURCE[0]}")/../lib/common.sh"

export PANELPASS_DB_PORT=${PANELPASS_BENCH_DB_PORT:-54349}
export PANELPASS_DB_FSYNC=${PANELPASS_BENCH_FSYNC:-on}
export PANELPASS_DB_DIR=${PANELPASS_BENCH_DB_DIR:-$(mktemp -d /var/tmp/panelpass-benchdb-XXXXXX)}
chmod 755 "$PANELPASS_DB_DIR"
BENCH_SERVER_PID=""

bench_cleanup() {
  set +e
  if [ -n "$BENCH_SERVER_PID" ]; then kill "$BENCH_SERVER_PID" 2>/dev/null; wait "$BENCH_SERVER_PID" 2>/dev/null; fi
  scripts/db destroy >/dev/null 2>&1 || true
  rm -rf "$PANELPASS_DB_DIR"
}
trap bench_cleanup EXIT

# bench_server PORT: migrates the throwaway database and starts the built server on PORT.
# PANELPASS_SERVER_DIST: another built server folder (default server/dist, built when missing);
# PANELPASS_BENCH_NO_INSTALL=1 skips the npm package check. PANELPASS_BENCH_SEED=1 loads the demo
# data first; PANELPASS_BENCH_PWA_DIST=<folder> also serves that built app at / (PWA_DIST);
# PANELPASS_BENCH_SERVER_NODE_ARGS gives the server's node extra flags (e.g. "--cpu-prof
# --cpu-prof-dir=/tmp/prof": the profile is written when the benchmark stops the server).
bench_server() {
  local port=$1 dist=${PANELPASS_SERVER_DIST:-server/dist}
  local log=/tmp/panelpass-bench-server-$port.log
  [ -n "${PANELPASS_BENCH_NO_INSTALL:-}" ] || ensure_node_modules
  scripts/db start >/dev/null
  export DATABASE_URL
  DATABASE_URL=$(scripts/db url)
  if [ ! -f "$dist/main.js" ]; then
    [ -z "${PANELPASS_SERVER_DIST:-}" ] || { echo "no built server in $dist" >&2; exit 1; }
    npm run --silent build -w shared -w server
  fi
  node "$dist/database/migrate.js" >/dev/null
  export JWT_SECRET=bench-secret-bench-secret-bench-secret-1
  [ -z "${PANELPASS_BENCH_SEED:-}" ] || node "$dist/database/seeds/run-seed.js" >/dev/null
  env ${PANELPASS_BENCH_PWA_DIST:+PWA_DIST=$PANELPASS_BENCH_PWA_DIST} ${FOLLOW_UPS:+FOLLOW_UPS=$FOLLOW_UPS} \
    NODE_ENV=production HOST=127.0.0.1 PORT=$port SIGN_IN_LIMIT=100000 node ${PANELPASS_BENCH_SERVER_NODE_ARGS:-} "$dist/main.js" >"$log" 2>&1 &
  BENCH_SERVER_PID=$!
  export BENCH_SERVER_PID
  wait_for_http "http://127.0.0.1:$port/api/health" 60 || { cat "$log"; exit 1; }
  export BENCH_URL="http://127.0.0.1:$port"
}
