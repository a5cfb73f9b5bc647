#!/usr/bin/env bash
# npm test: the same set-up as npm start on a throwaway cluster and ports, then lint, typecheck,
# unit, integration and browser tests. Stops everything it started, even on failure, and ends
# with one line "N passed, N failed". Arguments are passed to vitest (e.g. a folder).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
ensure_postgres_installed
ensure_chromium_installed

stack_env test
demo_env
export TEST_OUTPUT="${TEST_OUTPUT:-$ROOT/test-output}"
rm -rf "$TEST_OUTPUT"; mkdir -p "$TEST_OUTPUT"
trap stack_stop EXIT
trap 'exit 130' INT TERM

passed=0; failed=0
check() {
  local name="$1"; shift
  if "$@" >"$TEST_OUTPUT/$name.log" 2>&1; then passed=$((passed + 1)); log "✓ $name"
  else failed=$((failed + 1)); log "✗ $name"; cat "$TEST_OUTPUT/$name.log"; fi
}

stack_database
stack_start_fakes "$TEST_OUTPUT"
node_modules/.bin/tsx --conditions=react-server db/seed/index.ts

check lint node_modules/.bin/eslint .
check typecheck node_modules/.bin/tsc --noEmit

stack_start_app "$TEST_OUTPUT" || { echo "$passed passed, $((failed + 1)) failed"; exit 1; }

set +e
node_modules/.bin/vitest run --reporter=default --reporter=json --outputFile="$TEST_OUTPUT/vitest.json" "$@"
vitest_rc=$?
set -e

read -r vp vf < <(node -e '
  try { const r = require(process.argv[1]); console.log(r.numPassedTests, r.numFailedTests); }
  catch { console.log(0, 1); }' "$TEST_OUTPUT/vitest.json")
passed=$((passed + vp)); failed=$((failed + vf))
# A file that fails before any test runs (an import error) fails no test: count it once.
if [ "$vitest_rc" -ne 0 ] && [ "$vf" -eq 0 ]; then failed=$((failed + 1)); fi

echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
