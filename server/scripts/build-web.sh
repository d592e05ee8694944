#!/usr/bin/env bash
source "$(dirname "$0")/services.sh"
profile_env dev
build_web_if_stale "${1:-}"
