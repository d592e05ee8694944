#!/usr/bin/env bash
# Private MariaDB and Redis instances for Spinyard (sourced by start.sh and test.sh).
# Each profile (dev, test) has its own ports and data folder under .data/<profile>, so
# `npm start` and `npm test` never share state. Nothing here touches system services.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"

profile_env() {
  local profile="$1"
  export SPINYARD_PROFILE="$profile"
  export DATA_DIR="$ROOT/.data/$profile"
  if [ "$profile" = "test" ]; then
    export DB_PORT="${TEST_DB_PORT:-3317}" REDIS_PORT="${TEST_REDIS_PORT:-6391}"
    export SMTP_PORT="${TEST_SMTP_PORT:-1026}" MAIL_API_PORT="${TEST_MAIL_API_PORT:-1081}"
    export PAYMENTS_PORT="${TEST_PAYMENTS_PORT:-12112}" PORT="${TEST_PORT:-3100}"
    export DB_NAME="${DB_NAME:-spinyard_test}"
  else
    export DB_PORT="${DB_PORT:-3307}" REDIS_PORT="${REDIS_PORT:-6390}"
    export SMTP_PORT="${SMTP_PORT:-1025}" MAIL_API_PORT="${MAIL_API_PORT:-1080}"
    export PAYMENTS_PORT="${PAYMENTS_PORT:-12111}" PORT="${PORT:-3000}"
    export DB_NAME="${DB_NAME:-spinyard}"
  fi
  export DB_HOST=127.0.0.1 DB_USER="${DB_USER:-spinyard}" DB_PASSWORD="${DB_PASSWORD:-spinyard-local}"
  export REDIS_URL="redis://127.0.0.1:$REDIS_PORT"
  export RUN_DIR="$DATA_DIR/run"
  # Keep tool caches inside the project (metro, jest, tsx, expo, chromium).
  export TMPDIR="$ROOT/.data/tmp" XDG_CACHE_HOME="$ROOT/.data/cache" XDG_CONFIG_HOME="$ROOT/.data/config"
  export __UNSAFE_EXPO_HOME_DIRECTORY="$ROOT/.data/expo-home"
  export EXPO_OFFLINE=1 EXPO_NO_TELEMETRY=1
  mkdir -p "$RUN_DIR" "$TMPDIR" "$XDG_CACHE_HOME" "$XDG_CONFIG_HOME" "$__UNSAFE_EXPO_HOME_DIRECTORY"
}

fail() { echo "spinyard: $*" >&2; exit 1; }
say() { echo "spinyard: $*"; }

port_busy() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null && { exec 3>&- 3<&-; return 0; } || return 1; }

ensure_debian_packages() {
  local missing=()
  command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ] || missing+=(mariadb-server mariadb-client)
  command -v redis-server >/dev/null 2>&1 || missing+=(redis-server)
  command -v chromium >/dev/null 2>&1 || missing+=(chromium fonts-dejavu-core)
  [ ${#missing[@]} -eq 0 ] && return 0
  say "installing Debian packages: ${missing[*]}"
  if [ "$(id -u)" != 0 ]; then fail "missing ${missing[*]}; run as root or: sudo apt-get install -y ${missing[*]}"; fi
  mkdir -p "$ROOT/.data"
  { apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${missing[@]}"; } >"$ROOT/.data/apt.log" 2>&1 \
    || fail "could not install ${missing[*]} (see .data/apt.log); check the Debian package mirror and run again"
}

ensure_node_modules() {
  local stamp="$ROOT/node_modules/.spinyard-lock"
  if [ -f "$stamp" ] && cmp -s "$ROOT/package-lock.json" "$stamp"; then return 0; fi
  say "installing npm packages (npm ci)…"
  (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || fail "npm ci failed; check the registry connection and run again"
  cp "$ROOT/package-lock.json" "$stamp"
}

export PATH="$PATH:/usr/sbin:/sbin"

# Runs a long-lived service without the caller's open files beyond stdin/out/err. A caller that
# holds a lock through an open file (for example `flock some.lock npm test`) would otherwise pass that file
# to MariaDB and Redis, which outlive the caller and keep the lock held for everyone.
# Started in the background (one process: the subshell closes the files, then becomes the service).
detached() {
  (
    for fd in /proc/$BASHPID/fd/*; do
      fd="${fd##*/}"
      if [ "$fd" -gt 2 ] 2>/dev/null; then eval "exec $fd>&-" 2>/dev/null || true; fi
    done
    exec "$@"
  ) &
}

start_mariadb() {
  local dir="$DATA_DIR/mariadb" sock="$RUN_DIR/mariadb.sock" pidf="$RUN_DIR/mariadb.pid"
  local admin=(mariadb-admin --no-defaults -S "$sock" -uroot)
  if [ -S "$sock" ] && "${admin[@]}" ping >/dev/null 2>&1; then say "MariaDB already running on port $DB_PORT"; return 0; fi
  rm -f "$sock" "$pidf"
  port_busy "$DB_PORT" && fail "port $DB_PORT (MariaDB) is in use by another program; stop it or set ${SPINYARD_PROFILE^^}_DB_PORT / DB_PORT"
  if [ ! -d "$dir/mysql" ]; then
    mkdir -p "$dir"
    mariadb-install-db --no-defaults --datadir="$dir" --user=root --skip-test-db \
      --auth-root-authentication-method=socket >"$RUN_DIR/mariadb-install.log" 2>&1 \
      || { rm -rf "$dir"; fail "mariadb-install-db failed (see $RUN_DIR/mariadb-install.log)"; }
  fi
  # max_allowed_packet: the largest networks inside the import limits are stored as one JSON
  # document of up to about 30 MB (README "Limits"); MariaDB's default of 16 MB is too small.
  detached mariadbd --no-defaults --datadir="$dir" --socket="$sock" --pid-file="$pidf" --port="$DB_PORT" \
    --max-allowed-packet=64M \
    --bind-address=127.0.0.1 --skip-name-resolve --user=root --innodb-buffer-pool-size=64M \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --log-error="$RUN_DIR/mariadbd.err" >/dev/null 2>&1
  local i
  for i in $(seq 1 100); do
    "${admin[@]}" ping >/dev/null 2>&1 && break
    sleep 0.2
  done
  "${admin[@]}" ping >/dev/null 2>&1 || fail "MariaDB did not come up within 20 s (see $RUN_DIR/mariadbd.err)"
  mariadb --no-defaults -S "$sock" -uroot -e "
    CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
    GRANT ALL PRIVILEGES ON *.* TO '$DB_USER'@'127.0.0.1';
    CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;" \
    || fail "could not create the database user (see $RUN_DIR/mariadbd.err)"
  say "MariaDB up on 127.0.0.1:$DB_PORT (data in ${dir#$ROOT/})"
}

stop_mariadb() {
  local sock="$RUN_DIR/mariadb.sock" pidf="$RUN_DIR/mariadb.pid"
  [ -S "$sock" ] || return 0
  mariadb-admin --no-defaults -S "$sock" -uroot shutdown >/dev/null 2>&1 || true
  if [ -f "$pidf" ]; then
    local pid; pid=$(cat "$pidf" 2>/dev/null || true)
    for _ in $(seq 1 50); do [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null || break; sleep 0.2; done
  fi
  rm -f "$sock" "$pidf"
}

start_redis() {
  local dir="$DATA_DIR/redis"
  mkdir -p "$dir"
  if redis-cli -p "$REDIS_PORT" ping 2>/dev/null | grep -q PONG; then
    say "Redis already running on port $REDIS_PORT"; return 0
  fi
  rm -f "$dir/redis.pid"
  port_busy "$REDIS_PORT" && fail "port $REDIS_PORT (Redis) is in use by another program; stop it or set REDIS_PORT"
  detached redis-server --bind 127.0.0.1 --port "$REDIS_PORT" --save '' --appendonly no --dir "$dir" \
    --daemonize yes --pidfile "$dir/redis.pid" --logfile "$dir/redis.log" >/dev/null
  for _ in $(seq 1 50); do redis-cli -p "$REDIS_PORT" ping 2>/dev/null | grep -q PONG && break; sleep 0.1; done
  redis-cli -p "$REDIS_PORT" ping 2>/dev/null | grep -q PONG || fail "Redis did not answer within 5 s (see ${dir#$ROOT/}/redis.log)"
  say "Redis up on 127.0.0.1:$REDIS_PORT"
}

stop_redis() {
  redis-cli -p "$REDIS_PORT" shutdown nosave >/dev/null 2>&1 || true
  rm -f "$DATA_DIR/redis/redis.pid"
}

# Assemble the simulator's WebAssembly kernels (server/wasm/sim-kernels.wat → .wasm, git-ignored)
# when stale. Not fatal: without the .wasm the engine runs its JavaScript kernels.
build_sim_kernels() {
  (cd "$ROOT" && npx tsx server/scripts/build-wasm.ts) || say "simulator kernels not built; the JavaScript kernels will run"
}

# Rebuild the exported web app when any client source is newer than the build.
build_web_if_stale() {
  local out="$ROOT/dist/web" marker="$ROOT/dist/web/index.html"
  if [ "${1:-}" != "--force" ] && [ -f "$marker" ] && [ -z "$(cd "$ROOT" && find app components shared assets app.json package-lock.json babel.config.js metro.config.js -newer "$marker" -type f -print -quit 2>/dev/null)" ]; then
    return 0
  fi
  say "building the web app (expo export)…"
  (cd "$ROOT" && BROWSER=none npx expo export --platform web --source-maps --output-dir dist/web >"$ROOT/.data/expo-export.log" 2>&1) \
    || { tail -30 "$ROOT/.data/expo-export.log" >&2; fail "web build failed (full log: .data/expo-export.log)"; }
  # Source maps out of the served folder (dist/web-maps), brotli and gzip copies beside the files.
  (cd "$ROOT" && npx tsx server/scripts/finish-web-build.ts dist/web dist/web-maps >>"$ROOT/.data/expo-export.log" 2>&1) \
    || { tail -30 "$ROOT/.data/expo-export.log" >&2; fail "finishing the web build failed (full log: .data/expo-export.log)"; }
}
