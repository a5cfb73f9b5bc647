#!/usr/bin/env bash
# npm run dev: the same set-up as npm start (packages, PostgreSQL, migrations, the demo, the mail and
# S3 fakes), then `next dev` and a worker that restarts when its code changes. No build: pages
# compile on first visit. Ctrl-C stops everything; data stays in .data/ (shared with npm start).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export NODE_ENV=development
local_env
local_prepare
trap local_stop INT TERM EXIT
local_fakes_start
local_database

node_modules/.bin/tsx watch --clear-screen=false --conditions=react-server workers/index.ts &
local_pids+=($!)
node_modules/.bin/next dev -H 127.0.0.1 -p "$PORT" &
local_pids+=($!)
wait_for_http "http://127.0.0.1:$PORT/sign-in" 600
local_banner "development"
wait -n "${local_pids[@]}"
