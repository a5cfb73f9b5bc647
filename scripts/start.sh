#!/usr/bin/env bash
# npm start: installs what is missing, starts PostgreSQL on loopback, migrates, seeds the demo,
# builds and serves Keelson with its worker. Ctrl-C stops everything; data stays in .data/.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export NODE_ENV=production
local_env
local_prepare
trap local_stop INT TERM EXIT
local_fakes_start
local_database
log "building the app…"
node_modules/.bin/next build >.data/build.log 2>&1 || { cat .data/build.log; exit 1; }

node_modules/.bin/tsx --conditions=react-server workers/index.ts &
local_pids+=($!)
KEELSON_STATEMENT_TIMEOUT_MS="${KEELSON_STATEMENT_TIMEOUT_MS:-30000}" node_modules/.bin/next start -H 127.0.0.1 -p "$PORT" --keepAliveTimeout 65000 &
local_pids+=($!)
wait_for_http "http://127.0.0.1:$PORT/sign-in"
local_banner
wait -n "${local_pids[@]}"
