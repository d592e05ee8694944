#!/usr/bin/env bash
# `npm test`: the same installs as `npm start`, then private MariaDB/Redis instances on other
# ports and data folders (profile "test"), then every jest project. Non-zero exit on any failure.
source "$(dirname "$0")/services.sh"
profile_env test
mkdir -p "$ROOT/.data"
ensure_debian_packages
ensure_node_modules
build_sim_kernels
build_web_if_stale

cleanup() { trap - INT TERM EXIT; stop_redis; stop_mariadb; }
trap cleanup INT TERM EXIT
start_mariadb
start_redis

cd "$ROOT"
export NODE_ENV=test CI="${CI:-}"
# Two workers suit the 2-core machines; e2e and api suites share services, so they run serially.
extra=(); [ $# -gt 0 ] && extra=(--passWithNoTests)
# The whole project type-checks under strict (jest itself only transpiles).
if [ $# -eq 0 ]; then
  say "type-checking (tsc --noEmit)…"
  npx tsc --noEmit -p tsconfig.json || fail "type errors (above); fix them before the tests run"
fi
set +e
npx jest "$@" "${extra[@]}" --maxWorkers=2 --selectProjects unit components
status=$?
npx jest "$@" "${extra[@]}" --runInBand --selectProjects api e2e
status2=$?
set -e
if [ $status -ne 0 ] || [ $status2 -ne 0 ]; then say "tests failed"; exit 1; fi
say "all test projects passed"
