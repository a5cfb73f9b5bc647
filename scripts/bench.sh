#!/usr/bin/env bash
# npm run bench: a benchmark, not a test. Starts a throwaway stack, generates a vessel, times the
# route handlers against a bare SELECT of the same rows, and writes bench-output/results.{json,md}.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
ensure_postgres_installed
stack_env bench
export KEELSON_DEMO=0
mkdir -p bench-output
trap stack_stop EXIT
trap 'exit 130' INT TERM

stack_database
stack_start_fakes bench-output
stack_start_app bench-output
# BENCH_ONLY="access" (or any of the parts, space-separated) runs only those parts; load runs on the
# fleet that fleet.ts leaves, or generates one when it runs alone.
for part in ${BENCH_ONLY:-run fleet load access import parts weight}; do
  node_modules/.bin/tsx --conditions=react-server "scripts/bench/$part.ts"
done
