#!/usr/bin/env bash
# `npm start`: install what is missing, start MariaDB, Redis, the local fakes, the API server
# and a solve worker, seed the demo organisation, print the URL. Ctrl-C stops all of it.
source "$(dirname "$0")/services.sh"
profile_env dev
mkdir -p "$ROOT/.data"
ensure_debian_packages
ensure_node_modules
build_sim_kernels
port_busy "$PORT" && fail "port $PORT is in use; stop the other program or start with PORT=3001 npm start"
build_web_if_stale

CHILDREN=()
cleanup() {
  trap - INT TERM EXIT
  say "stopping…"
  for pid in "${CHILDREN[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  for pid in "${CHILDREN[@]}"; do wait "$pid" 2>/dev/null || true; done
  stop_redis
  stop_mariadb
  say "stopped"
}
trap cleanup INT TERM EXIT

start_mariadb
start_redis

cd "$ROOT"
npx tsx server/fakes/run-fakes.ts & CHILDREN+=($!)
npx tsx server/index.ts --seed-demo & SERVER_PID=$!; CHILDREN+=($SERVER_PID)
if [ -f server/worker.ts ] && [ "${START_WORKER:-1}" = 1 ]; then
  npx tsx server/worker.ts & CHILDREN+=($!)
fi
wait "$SERVER_PID"
